/* SPDX-License-Identifier: MIT */
/* ionization.c: the ionization block of a result (macro pKa, charge, species, pI, curves). */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "ion_states.h"

/* Used when the model has no global.interaction / global.interaction_decay rows: the fit of
 * tests/tools/fit_interaction.py on 69 symmetric diacids and diamines of the shared
 * reference data (handbook tables, IUPAC digitized dataset), see fragments/params.tsv. */
#define ION_INTERACTION_DEFAULT 5.96
#define ION_DECAY_DEFAULT 0.42

#define ION_PH_MIN (-2.0)
#define ION_PH_MAX 16.0
#define ION_CURVE_MAX 14.0

static double param_value(const pred_model *m, int idx, const char *id, double fallback)
{
	if (!m)
		return fallback;
	if (idx < 0 || (size_t)idx >= m->n_params || strcmp(m->params[idx].id, id))
		idx = model_param_find(m, id);
	return idx >= 0 ? m->params[idx].value : fallback;
}

double ionization_pair_shift(const pred_model *m, int bonds)
{
	if (bonds < 1)
		return 0; /* same atom or not connected (separate fragments) */
	double a = param_value(m, m ? m->p_interaction : -1, "global.interaction",
	                       ION_INTERACTION_DEFAULT);
	double decay = param_value(m, m ? m->p_interaction_decay : -1, "global.interaction_decay",
	                           ION_DECAY_DEFAULT);
	/* W(d) = A exp(-k (d - 1)), the form fragment_table.c documents for these parameters */
	return a * exp(-decay * (bonds - 1));
}

double ionization_route_weight(const pred_model *m)
{
	return param_value(m, m ? m->p_interaction_route : -1, "global.interaction_route", 0.0);
}

static int set_err(pred_error *err, int code, const char *msg)
{
	if (err) {
		err->code = code;
		snprintf(err->msg, sizeof err->msg, "%s", msg);
	}
	return code;
}

/* An ampholyte has an acid and a base site that ionise in water (micro pKa within 0..14):
 * a diacid's carbonyl oxygens (pKa below -5) or an alcohol OH (about 16) do not make one. */
static int is_ampholyte(const ion_work *w)
{
	int acid = 0, base = 0;
	for (size_t i = 0; i < w->n; i++) {
		if (w->pka[i] < 0 || w->pka[i] > ION_CURVE_MAX)
			continue;
		acid |= w->q_on[i] < 0;
		base |= w->q_on[i] > 0;
	}
	return acid && base;
}

/* Isoelectric point: the root of net charge = 0 within pH 0..14, by bisection (the charge
 * falls monotonically with pH) to 1e-9 pH units (34 halvings; the value is given to 0.01).
 * Only for ampholytes. */
static void fill_isoelectric(pred_result *r, ion_work *w)
{
	double lo = 0, hi = ION_CURVE_MAX;
	if (!is_ampholyte(w) || ion_work_eval(w, lo) <= 0 || ion_work_eval(w, hi) >= 0)
		return;
	while (hi - lo > 1e-9) {
		double mid = 0.5 * (lo + hi);
		if (ion_work_eval(w, mid) > 0)
			lo = mid;
		else
			hi = mid;
	}
	r->has_pi = 1;
	r->pi = 0.5 * (lo + hi);
}

static int alloc_curves(pred_result *r, size_t np, size_t nq)
{
	pred_curves *c = res_alloc(r, sizeof *c);
	double *ph = res_alloc(r, np * sizeof *ph), *charge = res_alloc(r, np * sizeof *charge);
	double *frac = res_alloc(r, np * nq * sizeof *frac);
	int *series = res_alloc(r, nq * sizeof *series);
	if (!c || !ph || !charge || !frac || !series)
		return PRED_ENOMEM;
	*c = (pred_curves){np, ph, charge, nq, series, frac};
	r->curves = c;
	return 0;
}

/* Charge and fraction by net charge state over pH 0..14; one series per possible charge,
 * from the most negative (every acid ionised) to the most positive. */
static int fill_curves(pred_result *r, ion_work *w, double step)
{
	int na = 0, nb = 0;
	for (size_t i = 0; i < w->n; i++)
		*(w->q_on[i] < 0 ? &na : &nb) += 1;
	size_t np = (size_t)floor(ION_CURVE_MAX / step + 1e-9) + 1, nq = (size_t)(na + nb + 1);
	int lo = w->fixed - na;
	double *dist = res_alloc(r, nq * sizeof *dist);
	if (!dist || alloc_curves(r, np, nq))
		return PRED_ENOMEM;
	double *ph = (double *)r->curves->ph, *charge = (double *)r->curves->charge;
	double *frac = (double *)r->curves->fraction;
	for (size_t q = 0; q < nq; q++)
		((int *)r->curves->series_charge)[q] = lo + (int)q;
	for (size_t k = 0; k < np; k++) {
		ph[k] = k * step;
		charge[k] = ion_work_eval(w, ph[k]);
		ion_work_charge_dist(w, lo, nq, dist);
		for (size_t q = 0; q < nq; q++)
			frac[q * np + k] = dist[q];
	}
	return 0;
}

static int check_options(const pred_options *opt, pred_error *err)
{
	char msg[128];
	if (!(opt->ph >= ION_PH_MIN && opt->ph <= ION_PH_MAX)) {
		snprintf(msg, sizeof msg, "ph %g is outside %g..%g", opt->ph, ION_PH_MIN,
		         ION_PH_MAX);
		return set_err(err, PRED_EINVAL, msg);
	}
	if (opt->curves && !(opt->curve_step >= 0.01 && opt->curve_step <= 14)) {
		snprintf(msg, sizeof msg, "curve step %g is outside 0.01..14", opt->curve_step);
		return set_err(err, PRED_EINVAL, msg);
	}
	return 0;
}

static int warn_approximate(pred_result *r, const ion_work *w, double ph)
{
	r->approximate = 1;
	return res_warn(
	    r,
	    "ionization approximate: %zu sites exceed the exact limit of %d; the %d "
	    "with pKa nearest pH %.2f are enumerated exactly, the other %zu are treated "
	    "as independent sites in the mean charge field of the rest",
	    w->n, ION_EXACT_MAX, ION_EXACT_MAX, ph, w->nx);
}

/* Sites left out of the exact cluster whose micro pKa lies far outside the pH range of
 * interest (carbonyl oxygen bases, alkane-like acids) keep one state over -2..16: the
 * mean-field treatment of them is exact to within 1e-4 of a charge, so it is no
 * approximation worth a warning. */
static int has_active_extra(const ion_work *w)
{
	for (size_t x = 0; x < w->nx; x++) {
		double pka = w->pka[w->ex[x]];
		if (pka > -6 && pka < 20)
			return 1;
	}
	return 0;
}

int ionization_fill(pred_result *r, const pred_model *m, const ion_input *in,
                    const pred_options *opt, pred_error *err)
{
	ion_work w;
	int rc = check_options(opt, err);
	if (rc)
		return rc;
	if (ion_work_init(&w, r, m, in, opt->ph))
		return set_err(err, PRED_ENOMEM, "out of memory in the ionization model");
	if (w.nx && has_active_extra(&w) && warn_approximate(r, &w, opt->ph))
		return set_err(err, PRED_ENOMEM, "out of memory in the ionization model");
	r->macro = res_alloc(r, (w.n + 1) * sizeof *r->macro);
	if (!r->macro)
		return set_err(err, PRED_ENOMEM, "out of memory in the ionization model");
	ion_work_macro(&w, opt->ph, r->macro);
	r->n_macro = w.n;
	r->ph = opt->ph;
	r->charge = ion_work_eval(&w, opt->ph);
	if ((rc = ion_species_fill(r, &w, in, err)))
		return rc == PRED_ENOMEM ? set_err(err, rc, "out of memory in the ionization model")
		                         : rc;
	fill_isoelectric(r, &w);
	if (opt->curves && fill_curves(r, &w, opt->curve_step))
		return set_err(err, PRED_ENOMEM, "out of memory in the ionization model");
	return 0;
}
