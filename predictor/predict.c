/* SPDX-License-Identifier: MIT */
/* predict.c: one prediction: parse, normalise, perceive, model terms, ionization. */
#include <ctype.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "engine.h"
#include "ionization.h"
#include "smiles_write.h"

enum { MAX_INPUT_BYTES = 100000 };

static int fail(pred_error *err, int code, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));

static int fail(pred_error *err, int code, const char *fmt, ...)
{
	if (err) {
		err->code = code;
		va_list ap;
		va_start(ap, fmt);
		vsnprintf(err->msg, sizeof err->msg, fmt, ap);
		va_end(ap);
	}
	return code;
}

static double now_seconds(void)
{
	struct timespec ts;
	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + ts.tv_nsec * 1e-9;
}

/* Upper bound on the heavy atoms of a SMILES, counted before parsing so that a huge input
 * never reaches the toolkit: every bracket atom and every organic-subset letter. */
static long smiles_atom_estimate(const char *s)
{
	long n = 0;
	for (; *s && !isspace((unsigned char)*s); s++) {
		if (*s == '[') {
			const char *close = strchr(s, ']');
			if (!close)
				break;
			n++;
			s = close;
		} else if (strchr("BCNOPSFIbcnops", *s)) {
			n++;
		}
	}
	return n;
}

static int check_input(const char *input, pred_format fmt, const pred_options *opt,
		       pred_error *err)
{
	if (!(opt->ph >= -2 && opt->ph <= 16))
		return fail(err, PRED_EINVAL, "ph %.2f is outside -2..16", opt->ph);
	if (opt->max_heavy_atoms < 1)
		return fail(err, PRED_EINVAL, "heavy-atom limit %d must be positive", opt->max_heavy_atoms);
	if (!input)
		return fail(err, PRED_EPARSE, "no input");
	while (fmt == PRED_FMT_SMILES && isspace((unsigned char)*input))
		input++;
	if (!*input)
		return fail(err, PRED_EPARSE, "empty %s", fmt ? "mol block" : "smiles");
	size_t len = strnlen(input, MAX_INPUT_BYTES + 1);
	if (len > MAX_INPUT_BYTES)
		return fail(err, PRED_ELIMIT, "input longer than %d bytes", MAX_INPUT_BYTES);
	long est = fmt == PRED_FMT_SMILES ? smiles_atom_estimate(input) : 0;
	if (est > 4L * opt->max_heavy_atoms)
		return fail(err, PRED_ELIMIT, "about %ld heavy atoms, over the limit of %d", est,
			    opt->max_heavy_atoms);
	return 0;
}

/* Elements the model has constants for; anything else is refused, not guessed. */
static const char *element_symbol(int z)
{
	static const struct {
		int z;
		const char *sym;
	} table[] = {{1, "H"},   {5, "B"},   {6, "C"},   {7, "N"},  {8, "O"},
		     {9, "F"},   {14, "Si"}, {15, "P"},  {16, "S"}, {17, "Cl"},
		     {34, "Se"}, {35, "Br"}, {53, "I"}};
	for (size_t i = 0; i < sizeof table / sizeof table[0]; i++)
		if (table[i].z == z)
			return table[i].sym;
	return NULL;
}

static int check_atoms(obw_mol *mol, const pred_options *opt, pred_error *err)
{
	const obw_atom *atoms;
	size_t n = obw_mol_atoms(mol, &atoms), heavy = 0;
	for (size_t i = 0; i < n; i++) {
		if (!element_symbol(atoms[i].element)) {
			return fail(err, PRED_EUNSUPPORTED,
				    "unsupported element (atomic number %d) at atom %d",
				    atoms[i].element, atoms[i].orig_index);
		}
		heavy += atoms[i].element != 1;
	}
	if (heavy == 0)
		return fail(err, PRED_EPARSE, "no heavy atoms");
	if (heavy > (size_t)opt->max_heavy_atoms)
		return fail(err, PRED_ELIMIT, "%zu heavy atoms, over the limit of %d", heavy,
			    opt->max_heavy_atoms);
	return 0;
}

static const char *confidence_word(double u)
{
	return u <= 0.5 ? "high" : u <= 1.0 ? "medium" : "low";
}

/* The molecule's widening of every site uncertainty: residuals grow with the size of the
 * molecule (more groups near a site than the model's terms see) and with the number of
 * sites (step assignment, interactions). 1 for a small one-site molecule; the two slopes
 * are params.tsv rows. */
static double site_unc_factor(const eng_mol *e, size_t n_sites, const pred_model *m)
{
	size_t heavy = 0;
	for (size_t a = 0; a < e->nat; a++)
		heavy += e->atoms[a].element != 1;
	double big = heavy > 8 ? (double)(heavy - 8) / 10.0 : 0.0;
	double more = n_sites > 1 ? (double)(n_sites - 1) : 0.0;
	return 1.0 + m->params[m->p_unc_size].value * big + m->params[m->p_unc_sites].value * more;
}

/* Uncertainty: the class's cross-validated error (or table value before fitting), widened
 * for estimated substituents, for corrections, for large extrapolated shifts and by the
 * molecule's factor (the fit derives the class error from residuals divided by it); never
 * below the floor, the repeatability of independent measurements of one value (a class
 * fitted on a few rows can show a class error far under it). */
static double site_uncertainty(const term_list *tl, const pred_model *m, const frag_site *row,
			       double factor)
{
	double base = m->params[row->p_parent].rmse_cv > 0 ? m->params[row->p_parent].rmse_cv
							  : row->unc;
	double shift = 0;
	for (size_t i = 1; i < tl->n; i++)
		shift += fabs(tl->t[i].value);
	double var = base * base + tl->extra_var + (0.08 * shift) * (0.08 * shift);
	double u = m->params[m->p_unc_scale].value * factor * sqrt(var);
	return fmax(u, m->params[m->p_unc_floor].value);
}

static int copy_site(pred_result *r, size_t i, const term_list *tl, const eng_mol *e,
		     const pred_model *m, double micro, double factor)
{
	const eng_site *s = &e->sites[i];
	const frag_site *row = &m->sites[s->row];
	pred_site *out = &r->sites[i];
	site_design *d = &r->design[i];
	pred_term *terms = res_alloc(r, (tl->n + 1) * sizeof *terms);
	d->param = res_alloc(r, (tl->n + 1) * sizeof *d->param);
	d->feature = res_alloc(r, (tl->n + 1) * sizeof *d->feature);
	if (!terms || !d->param || !d->feature)
		return PRED_ENOMEM;
	for (size_t k = 0; k < tl->n; k++) {
		terms[k].term = tl->t[k].term;
		terms[k].value = tl->t[k].value;
		if (!(terms[k].detail = res_strdup(r, tl->detail[k])))
			return PRED_ENOMEM;
		if (tl->param[k] >= 0) {
			d->param[d->n] = tl->param[k];
			d->feature[d->n++] = tl->feature[k];
		} else {
			d->constant += tl->t[k].value;
		}
	}
	out->atom = e->atoms[s->atom].orig_index;
	out->element = element_symbol(e->atoms[s->atom].element);
	out->group = row->group;
	out->kind = row->kind;
	out->pka = terms_sum(tl);
	out->uncertainty = site_uncertainty(tl, m, row, factor);
	d->unc_factor = factor;
	out->confidence = confidence_word(out->uncertainty);
	out->n_terms = tl->n;
	out->terms = terms;
	r->micro[i] = micro;
	return 0;
}

/* Oxygen and sulfur bases below pKa 0 (carbonyl, ether, hydroxyl oxygen, thione sulfur)
 * are listed only when the molecule has no stronger base: next to a real base their
 * protonation would be a second step far below pH 0 that no user asks for. Returns the
 * number of sites dropped. */
static size_t drop_minor_chalcogen_bases(eng_mol *e, term_list *tls, const pred_model *m)
{
	int strong = 0;
	for (size_t i = 0; i < e->n_sites; i++)
		strong |= m->sites[e->sites[i].row].kind == PRED_BASE && terms_sum(&tls[i]) >= 0;
	if (!strong)
		return 0;
	size_t kept = 0, dropped = 0;
	for (size_t i = 0; i < e->n_sites; i++) {
		const eng_site *s = &e->sites[i];
		int chalcogen = e->atoms[s->atom].element == 8 || e->atoms[s->atom].element == 16;
		if (m->sites[s->row].kind == PRED_BASE && chalcogen && terms_sum(&tls[i]) < 0) {
			free(s->match);
			dropped++;
			continue;
		}
		e->sites[kept] = e->sites[i];
		memmove(e->dist + kept * e->nat, e->dist + i * e->nat, e->nat * sizeof *e->dist);
		memmove(e->qdist + kept * e->nat, e->qdist + i * e->nat, e->nat * sizeof *e->qdist);
		tls[kept++] = tls[i];
	}
	e->n_sites = kept;
	return dropped;
}

static int rows_shared(const eng_mol *e)
{
	for (size_t i = 0; i < e->n_sites; i++)
		for (size_t j = 0; j < i; j++)
			if (e->sites[i].row == e->sites[j].row)
				return 1;
	return 0;
}

static int build_sites(pred_result *r, eng_mol *e, pred_worker *w, pred_error *err)
{
	size_t n = e->n_sites;
	/* a term list is some 9 kB: set its counters, not every slot */
	term_list *tls = malloc((n + 1) * sizeof *tls);
	for (size_t i = 0; tls && i <= n; i++) {
		tls[i].n = 0;
		tls[i].extra_var = 0;
		tls[i].n_generic = 0;
	}
	double *micro = calloc(n + 1, sizeof *micro);
	int *sym = e->symclass;
	r->sites = res_alloc(r, (n + 1) * sizeof *r->sites);
	r->design = res_alloc(r, (n + 1) * sizeof *r->design);
	r->micro = res_alloc(r, (n + 1) * sizeof *r->micro);
	int rc = tls && micro && sym && r->sites && r->design && r->micro ? 0 : PRED_ENOMEM;
	/* only sites of one row can be equivalent: other molecules take no symmetry classes */
	e->shared_rows = rows_shared(e);
	for (size_t a = 0; a < e->nat && sym && !e->shared_rows; a++)
		sym[a] = (int)a;
	for (size_t i = 0; i < n && !rc; i++)
		eng_site_effects(&tls[i], e, w, &e->sites[i]);
	if (!rc && drop_minor_chalcogen_bases(e, tls, w->m))
		rc = res_note(r, "oxygen and sulfur bases below pKa 0 not listed: the molecule has a "
				 "stronger base");
	n = e->n_sites;
	if (!rc)
		rc = eng_pair_hbonds(e, w);
	if (!rc)
		rc = eng_charge_routes(e, w->m);
	for (size_t i = 0; i < n && !rc; i++)
		micro[i] = terms_sum(&tls[i]);
	if (!rc)
		rc = eng_ionised_pairs(e, w->m, micro);
	if (!rc)
		rc = eng_stepwise(tls, e, w->m, sym);
	double factor = site_unc_factor(e, n, w->m);
	for (size_t i = 0; i < n && !rc; i++)
		rc = copy_site(r, i, &tls[i], e, w->m, micro[i], factor);
	r->n_sites = rc ? 0 : n;
	free(tls);
	free(micro);
	if (rc)
		fail(err, rc, "could not build the sites");
	return rc;
}

static int parse_input(obw_mol **mol, pred_worker *w, const char *input, pred_format fmt,
		       pred_error *err)
{
	char msg[256] = "";
	int rc = obw_mol_parse(mol, w->ctx, input, fmt == PRED_FMT_MOLBLOCK ? OBW_MOLBLOCK
									    : OBW_SMILES,
			       msg, sizeof msg);
	if (rc)
		fail(err, rc, "%s", msg[0] ? msg : "unreadable molecule");
	return rc;
}

static int out_of_time(double start, const pred_options *opt, pred_error *err)
{
	double spent = now_seconds() - start;
	if (spent <= opt->max_seconds)
		return 0;
	return fail(err, PRED_ETIMEOUT, "took %.1f s, over the budget of %.1f s", spent,
		    opt->max_seconds);
}

/* The microstate model's share of the monoanion hydrogen bonds (the pair term that
 * eng_stepwise gives the second site, -2 v, pair_hbond.c) and of the interaction through
 * further routes and the charge scales of the two sites (charge_dist.c), as extra pair
 * shifts: the model adds W of the charge distance itself, so the extra is the stepwise
 * pair shift less that W. */
static double *pair_extra(const eng_mol *e, const pred_model *m)
{
	size_t n = e->n_sites;
	double *x = calloc(n * n + 1, sizeof *x);
	for (size_t k = 0; x && k < n * n; k++) {
		size_t i = k / n, j = k % n;
		int d = eng_charge_bonds(e->qdist, e->nat, i, e->sites[i].atom, j, e->sites[j].atom);
		if (e->pair_param && e->pair_param[k] >= 0)
			x[k] = (eng_pair_is_charge(m, e->pair_param[k]) ? 1.0 : -2.0) *
			       m->params[e->pair_param[k]].value;
		if (i != j && d > 0)
			x[k] += eng_pair_shift(e, m, i, j) - ionization_pair_shift(m, d);
	}
	return x;
}

/* r->smiles from the ranks build_sites computed (taken over from e), else from a fresh
 * ranking; *rank and *scls get the ranks used, NULL when Open Babel wrote the string. */
static int canonical_smiles(pred_result *r, eng_mol *e, pred_worker *w, int **rank, int **scls,
			    pred_error *err)
{
	char msg[256] = "";
	*rank = e->rank;
	*scls = e->scls;
	e->rank = e->scls = NULL;
	char *can = *rank ? smiles_write(e->mol, NULL, *rank, *scls) : NULL;
	if (!can) {
		free(*rank);
		free(*scls);
		can = smiles_canonical(rank, scls, e->mol, w->ctx, msg, sizeof msg);
	}
	r->smiles = can ? res_strdup(r, can) : NULL;
	free(can);
	return r->smiles ? 0 : fail(err, PRED_EINTERNAL, "canonical smiles: %s", msg);
}

static int finish(pred_result *r, eng_mol *e, pred_worker *w, const pred_options *opt,
		  pred_error *err)
{
	int *rank = NULL, *scls = NULL;
	int rc = canonical_smiles(r, e, w, &rank, &scls, err);
	size_t n = e->n_sites;
	int *site_atoms = rc ? NULL : calloc(n + 1, sizeof *site_atoms);
	double *extra = site_atoms ? pair_extra(e, w->m) : NULL;
	if (!site_atoms || !extra) {
		free(site_atoms);
		free(extra);
		free(rank);
		free(scls);
		return rc ? rc : PRED_ENOMEM;
	}
	for (size_t i = 0; i < n; i++)
		site_atoms[i] = e->sites[i].atom;
	ion_input in = {e->mol, w->ctx, site_atoms, e->qdist, e->nat,
			e->shared_rows ? e->symclass : NULL, extra, rank, scls};
	rc = ionization_fill(r, w->m, &in, opt, err);
	free(site_atoms);
	free(extra);
	free(rank);
	free(scls);
	if (!rc && r->n_sites == 0)
		rc = res_note(r, "no ionizable site found");
	return rc;
}

/* Sites in input atom order (acid before base on the same atom). */
static void sort_sites(pred_result *r)
{
	for (size_t i = 1; i < r->n_sites; i++)
		for (size_t j = i; j > 0; j--) {
			pred_site *a = &r->sites[j - 1], *b = &r->sites[j];
			if (a->atom < b->atom || (a->atom == b->atom && a->kind <= b->kind))
				break;
			pred_site ts = *a;
			*a = *b;
			*b = ts;
			site_design td = r->design[j - 1];
			r->design[j - 1] = r->design[j];
			r->design[j] = td;
			double tm = r->micro[j - 1];
			r->micro[j - 1] = r->micro[j];
			r->micro[j] = tm;
		}
}

/* A base whose stepwise value lies below pKa -1 while another base of the molecule is above
 * 1 is a second protonation of a polybase (a diazine dication, say) far below the aqueous
 * range: it stays in the microstate model but is not listed as a site. */
static void drop_deep_second_protonations(pred_result *r)
{
	int strong = 0;
	for (size_t i = 0; i < r->n_sites; i++)
		strong |= r->sites[i].kind == PRED_BASE && r->sites[i].pka >= 1;
	if (!strong)
		return;
	size_t kept = 0;
	for (size_t i = 0; i < r->n_sites; i++) {
		if (r->sites[i].kind == PRED_BASE && r->sites[i].pka < -1)
			continue;
		r->sites[kept] = r->sites[i];
		r->design[kept] = r->design[i];
		r->micro[kept++] = r->micro[i];
	}
	if (kept < r->n_sites)
		res_note(r, "%zu second protonation%s below pKa -1 not listed as sites",
			 r->n_sites - kept, r->n_sites - kept > 1 ? "s" : "");
	r->n_sites = kept;
}

int pred_predict(pred_result **out, pred_worker *w, const char *input, pred_format fmt,
		 const pred_options *opt, pred_error *err)
{
	*out = NULL;
	pred_options dflt;
	if (!opt) {
		pred_options_init(&dflt);
		opt = &dflt;
	}
	int rc = check_input(input, fmt, opt, err);
	if (rc)
		return rc;
	double start = now_seconds();
	obw_mol *mol = NULL;
	eng_mol e = {0};
	pred_result *r = calloc(1, sizeof *r);
	if (!r)
		return fail(err, PRED_ENOMEM, "out of memory");
	r->ph = opt->ph;
	rc = parse_input(&mol, w, input, fmt, err);
	if (!rc)
		rc = eng_normalise(r, mol, w->ctx, err);
	if (!rc)
		rc = check_atoms(mol, opt, err);
	if (!rc)
		rc = eng_perceive(&e, w, mol, err);
	if (!rc)
		rc = out_of_time(start, opt, err);
	if (!rc)
		rc = build_sites(r, &e, w, err);
	if (!rc)
		rc = finish(r, &e, w, opt, err);
	if (!rc)
		rc = out_of_time(start, opt, err);
	eng_free(&e);
	obw_mol_free(mol);
	if (rc) {
		pred_result_free(r);
		return rc;
	}
	drop_deep_second_protonations(r);
	sort_sites(r);
	*out = r;
	return 0;
}
