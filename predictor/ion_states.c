/* SPDX-License-Identifier: MIT */
/* ion_states.c: microstate enumeration, partition function and mean-field extra sites. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "ion_states.h"

/* ln 10: 10^x as exp(x ln 10), cheaper than pow() in the innermost loop */
static const double LN10 = 2.302585092994045684;

/* log10(10^a + 10^b) without overflow. */
static double lse10(double a, double b)
{
	if (a == -INFINITY)
		return b;
	if (b == -INFINITY)
		return a;
	double hi = a > b ? a : b, lo = a > b ? b : a;
	return hi + log10(1.0 + pow(10.0, lo - hi));
}

static int site_atom(const ion_input *in, size_t i)
{
	return in && in->site_mol_atom ? in->site_mol_atom[i] : -1;
}

/* The shorter of the two sites' rows: a row counts from its site's charge, which for an
 * azinium is spread over the ring (charge_dist.c), so the two counts may differ. */
static int site_bonds(const ion_input *in, size_t i, size_t j)
{
	int a = site_atom(in, i), b = site_atom(in, j);
	if (!in || !in->dist || a < 0 || b < 0 || (size_t)a >= in->nat || (size_t)b >= in->nat)
		return -1;
	int dij = in->dist[i * in->nat + (size_t)b], dji = in->dist[j * in->nat + (size_t)a];
	return dij < dji ? dij : dji;
}

/* The cluster is the ION_EXACT_MAX sites whose pKa lies nearest the requested pH (they
 * decide the species there); ties keep input order. Both lists end up in site order. */
static void choose_cluster(ion_work *w, double ph)
{
	const double *pk = w->pka;
	int *order = w->ex; /* borrowed as scratch before it is filled */
	for (size_t i = 0; i < w->n; i++)
		order[i] = (int)i;
	for (size_t i = 1; i < w->n; i++)
		for (size_t j = i; j > 0 && fabs(pk[order[j]] - ph) < fabs(pk[order[j - 1]] - ph);
		     j--) {
			int t = order[j];
			order[j] = order[j - 1];
			order[j - 1] = t;
		}
	unsigned char *in_cl = (unsigned char *)w->frac; /* scratch, n <= ns * sizeof(double) */
	memset(in_cl, 0, w->n);
	for (size_t i = 0; i < w->nc; i++)
		in_cl[order[i]] = 1;
	size_t c = 0, x = 0;
	for (size_t i = 0; i < w->n; i++) {
		if (in_cl[i])
			w->cl[c++] = (int)i;
		else
			w->ex[x++] = (int)i;
	}
}

/* State s is state t = s without its highest site c, plus c: its weight adds c's own term
 * and c's interactions with the sites of t, in the order a site-by-site sum over s would
 * add them (so the values are the same to the last bit). */
static void enumerate(ion_work *w)
{
	const pred_site *st = w->r->sites;
	int nrem0 = 0;
	for (size_t c = 0; c < w->nc; c++)
		nrem0 += st[w->cl[c]].kind != PRED_ACID;
	w->logw0[0] = 0;
	w->nrem[0] = nrem0;
	w->charge[0] = w->fixed;
	for (size_t c = 0; c < w->nc; c++) {
		size_t top = (size_t)1 << c;
		int sc = w->cl[c], acid = st[sc].kind == PRED_ACID;
		for (size_t t = 0; t < top; t++) {
			double lw = w->logw0[t];
			if (acid)
				lw -= w->pka[sc];
			else
				lw += w->pka[sc];
			for (size_t d = 0; d < c; d++)
				if ((t >> d) & 1u)
					lw -= w->q_on[sc] * w->q_on[w->cl[d]] *
					      w->W[(size_t)sc * w->n + (size_t)w->cl[d]];
			w->logw0[top | t] = lw;
			w->nrem[top | t] = w->nrem[t] + (acid ? 1 : -1);
			w->charge[top | t] = w->charge[t] + w->q_on[sc];
		}
	}
}

static int alloc_all(ion_work *w, pred_result *r)
{
	size_t n = w->n, ns = w->ns;
	w->W = res_alloc(r, n * n * sizeof *w->W + 1);
	w->q_on = res_alloc(r, n * sizeof *w->q_on + 1);
	w->cl = res_alloc(r, n * sizeof *w->cl + 1);
	w->ex = res_alloc(r, n * sizeof *w->ex + 1);
	w->logw0 = res_alloc(r, ns * sizeof *w->logw0);
	w->nrem = res_alloc(r, ns * sizeof *w->nrem);
	w->charge = res_alloc(r, ns * sizeof *w->charge);
	/* frac doubles as byte scratch of n entries in choose_cluster */
	w->frac = res_alloc(r, (ns > n ? ns : n) * sizeof *w->frac);
	w->qbar = res_alloc(r, n * sizeof *w->qbar + 1);
	w->xp = res_alloc(r, n * sizeof *w->xp + 1);
	if (!w->W || !w->q_on || !w->cl || !w->ex || !w->logw0 || !w->nrem || !w->charge ||
	    !w->frac || !w->qbar || !w->xp)
		return PRED_ENOMEM;
	return 0;
}

static int fixed_charge(const ion_input *in)
{
	const obw_atom *at;
	int q = 0;
	if (!in || !in->mol)
		return 0;
	size_t nat = obw_mol_atoms(in->mol, &at);
	for (size_t i = 0; i < nat; i++)
		q += at[i].charge;
	return q;
}

int ion_work_init(ion_work *w, pred_result *r, const pred_model *m, const ion_input *in, double ph)
{
	memset(w, 0, sizeof *w);
	w->r = r;
	w->n = r->n_sites;
	w->nc = w->n > ION_EXACT_MAX ? ION_EXACT_MAX : w->n;
	w->nx = w->n - w->nc;
	w->ns = (size_t)1 << w->nc;
	if (alloc_all(w, r))
		return PRED_ENOMEM;
	if (r->micro) {
		w->pka = r->micro;
	} else {
		double *pk = res_alloc(r, w->n * sizeof *pk + 1);
		if (!pk)
			return PRED_ENOMEM;
		for (size_t i = 0; i < w->n; i++)
			pk[i] = r->sites[i].pka;
		w->pka = pk;
	}
	for (size_t i = 0; i < w->n; i++) {
		w->q_on[i] = r->sites[i].kind == PRED_ACID ? -1 : 1;
		for (size_t j = 0; j < w->n; j++)
			w->W[i * w->n + j] =
			    i == j ? 0
				   : ionization_pair_shift(m, site_bonds(in, i, j)) +
					 (in && in->pair_extra ? in->pair_extra[i * w->n + j] : 0);
	}
	w->fixed = fixed_charge(in);
	choose_cluster(w, ph);
	enumerate(w);
	return 0;
}

/* Sum over the other sites of pair shift times mean charge: the mean field on site i. */
static double field_on(const ion_work *w, int i)
{
	double f = 0;
	for (size_t j = 0; j < w->n; j++)
		f += w->W[(size_t)i * w->n + j] * w->qbar[j];
	return f;
}

static void eval_extras(ion_work *w, double ph)
{
	/* a few fixed-point sweeps settle the extras' mutual field (pair shifts are < 6 units
	 * and decay with distance, so the iteration contracts quickly) */
	for (int sweep = 0; sweep < 8; sweep++)
		for (size_t x = 0; x < w->nx; x++) {
			int i = w->ex[x];
			double eff = w->pka[i] - field_on(w, i);
			double lg = w->q_on[i] < 0 ? ph - eff : eff - ph;
			w->xp[x] = 1.0 / (1.0 + pow(10.0, -lg));
			w->qbar[i] = w->q_on[i] * w->xp[x];
		}
}

double ion_work_eval(ion_work *w, double ph)
{
	double mx = -INFINITY, sum = 0, charge = w->fixed;
	for (size_t s = 0; s < w->ns; s++) {
		w->frac[s] = w->logw0[s] + w->nrem[s] * ph;
		mx = w->frac[s] > mx ? w->frac[s] : mx;
	}
	/* exp() of an argument below -745.2 is exactly 0: such states are set to 0 without the
	 * call (the same bits) */
	for (size_t s = 0; s < w->ns; s++) {
		double d = w->frac[s] - mx;
		w->frac[s] = d < -330 ? 0 : exp(LN10 * d);
		sum += w->frac[s];
	}
	memset(w->qbar, 0, w->n * sizeof *w->qbar);
	for (size_t s = 0; s < w->ns; s++)
		w->frac[s] /= sum;
	/* site by site over the runs of states that hold it, in state order (the same sums) */
	for (size_t c = 0; c < w->nc; c++) {
		size_t step = (size_t)1 << c;
		int q = w->q_on[w->cl[c]];
		double acc = 0;
		for (size_t run = step; run < w->ns; run += 2 * step)
			for (size_t s = run; s < run + step; s++)
				acc += q * w->frac[s];
		w->qbar[w->cl[c]] = acc;
	}
	eval_extras(w, ph);
	for (size_t i = 0; i < w->n; i++)
		charge += w->qbar[i];
	return charge;
}

void ion_work_charge_dist(const ion_work *w, int lo, size_t nq, double *out)
{
	memset(out, 0, nq * sizeof *out);
	for (size_t s = 0; s < w->ns; s++) {
		long k = (long)w->charge[s] - lo;
		if (k >= 0 && (size_t)k < nq)
			out[k] += w->frac[s];
	}
	/* convolve with each independent extra site, in place */
	for (size_t x = 0; x < w->nx; x++) {
		double p = w->xp[x];
		if (w->q_on[w->ex[x]] > 0)
			for (size_t k = nq; k-- > 0;)
				out[k] = out[k] * (1 - p) + (k > 0 ? out[k - 1] * p : 0);
		else
			for (size_t k = 0; k < nq; k++)
				out[k] = out[k] * (1 - p) + (k + 1 < nq ? out[k + 1] * p : 0);
	}
}

static int cmp_double(const void *a, const void *b)
{
	double x = *(const double *)a, y = *(const double *)b;
	return (x > y) - (x < y);
}

void ion_work_macro(ion_work *w, double ph, double *out)
{
	/* Adair-type stepwise constants: with P_k the summed weight of the states that have
	 * lost k protons, pKa_k = log10(P_{k-1} / P_k) */
	double P[ION_EXACT_MAX + 1];
	for (size_t k = 0; k <= w->nc; k++)
		P[k] = -INFINITY;
	for (size_t s = 0; s < w->ns; s++)
		P[w->nrem[s]] = lse10(P[w->nrem[s]], w->logw0[s]);
	for (size_t k = 1; k <= w->nc; k++)
		out[k - 1] = P[k - 1] - P[k];
	ion_work_eval(w, ph);
	for (size_t x = 0; x < w->nx; x++)
		out[w->nc + x] = w->pka[w->ex[x]] - field_on(w, w->ex[x]);
	qsort(out, w->n, sizeof *out, cmp_double);
}
