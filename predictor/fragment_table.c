/* SPDX-License-Identifier: MIT */
/* fragment_table.c: loads the model (the fragments tables) from the embedded copy or a directory. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "fragment_table.h"
#include "fragments_embedded.h"
#include "model.h"
#include "obwrap.h"
#include "tsv.h"

/* Reads one table; *out is NULL (and 0 returned) when optional and absent. */
static int table_text(char **out, const char *dir, const char *name, int required,
		      pred_error *err)
{
	*out = NULL;
	if (!dir) {
		for (const frag_embedded *e = frag_embedded_files; e->name; e++)
			if (!strcmp(e->name, name))
				return (*out = strdup(e->content)) ? 0 : PRED_ENOMEM;
		goto absent;
	}
	char path[1024];
	snprintf(path, sizeof path, "%s/%s", dir, name);
	FILE *f = fopen(path, "rb");
	if (!f)
		goto absent;
	fseek(f, 0, SEEK_END);
	long n = ftell(f);
	fseek(f, 0, SEEK_SET);
	char *buf = n >= 0 ? malloc((size_t)n + 1) : NULL;
	if (buf && fread(buf, 1, (size_t)n, f) == (size_t)n) {
		buf[n] = '\0';
		*out = buf;
	} else {
		free(buf);
	}
	fclose(f);
	return *out ? 0 : PRED_ENOMEM;
absent:
	if (!required)
		return 0;
	if (err) {
		err->code = PRED_EDATA;
		snprintf(err->msg, sizeof err->msg, "fragments/%s: table not found%s%s", name,
			 dir ? " in " : "", dir ? dir : "");
	}
	return PRED_EDATA;
}

static int check_smarts(const tsv_table *t, const tsv_row *row, const char *smarts,
			pred_error *err)
{
	char msg[200] = "";
	obw_pattern *p = obw_pattern_parse(smarts, msg, sizeof msg);
	if (!p)
		return tsv_fail(err, PRED_EDATA, t, row->line, "invalid SMARTS '%s': %s", smarts,
				msg);
	obw_pattern_free(p);
	return 0;
}

static int dup_field(char **out, const tsv_table *t, const tsv_row *row, int col,
		     pred_error *err)
{
	*out = strdup(row->fields[col]);
	return *out ? 0 : tsv_fail(err, PRED_ENOMEM, t, row->line, "out of memory");
}

static int copy_id(char *dst, size_t cap, const tsv_table *t, const tsv_row *row, int col,
		   pred_error *err)
{
	const char *s = row->fields[col];
	if (!*s || strlen(s) >= cap)
		return tsv_fail(err, PRED_EDATA, t, row->line, "id '%s' is empty or too long", s);
	memcpy(dst, s, strlen(s) + 1);
	return 0;
}

/* Resolve named columns into idx[]; NULL-terminated names. */
static int columns(int *idx, const tsv_table *t, const char *const *names, pred_error *err)
{
	for (size_t i = 0; names[i]; i++)
		if ((idx[i] = tsv_column(t, names[i], err)) < 0)
			return PRED_EDATA;
	return 0;
}

static int parse_with(pred_model *m, const char *dir, const char *name, int required,
		      int (*fn)(pred_model *, const tsv_table *, pred_error *), pred_error *err)
{
	char *text = NULL;
	int rc = table_text(&text, dir, name, required, err);
	if (rc || !text)
		return rc;
	tsv_table t;
	char file[80];
	snprintf(file, sizeof file, "fragments/%s", name);
	rc = tsv_parse(&t, text, file, err);
	free(text);
	if (rc)
		return rc;
	rc = fn(m, &t, err);
	tsv_free(&t);
	return rc;
}

/* ---- sites.tsv ---------------------------------------------------------------------- */

static int site_param(pred_model *m, const frag_site *s, const char *suffix, double v,
		      double sd)
{
	char id[128];
	snprintf(id, sizeof id, "%s.%s", s->id, suffix);
	return model_param_add(m, id, v, sd);
}

/* A parent written "=other_id" shares the parent parameter of an earlier row (a second
 * drawing of the same molecule, e.g. the enol of a 1,3-diketone): *shared gets its index. */
static int shared_parent(const pred_model *m, const tsv_table *t, const tsv_row *r, int col,
			 int *shared, pred_error *err)
{
	const char *f = r->fields[col];
	*shared = -1;
	if (f[0] != '=')
		return 0;
	for (size_t j = 0; j < m->n_sites; j++)
		if (!strcmp(m->sites[j].id, f + 1)) {
			*shared = m->sites[j].p_parent;
			return 0;
		}
	return tsv_fail(err, PRED_EDATA, t, r->line, "parent '%s' names no earlier site row", f);
}

static int parse_site_row(pred_model *m, frag_site *s, const tsv_table *t, const tsv_row *r,
			  const int *c, pred_error *err)
{
	double parent = 0, rho, rho_star, centre, rho_para = 0, charge_scale = 1;
	int rc, shared;
	if ((rc = copy_id(s->id, sizeof s->id, t, r, c[0], err)) ||
	    (rc = copy_id(s->group, sizeof s->group, t, r, c[2], err)) ||
	    (rc = tsv_number(&centre, t, r, c[4], 0, 0, err)) ||
	    (rc = shared_parent(m, t, r, c[5], &shared, err)) ||
	    (shared < 0 && (rc = tsv_number(&parent, t, r, c[5], 0, 0, err))) ||
	    (rc = tsv_number(&rho, t, r, c[6], 1, 0, err)) ||
	    (rc = tsv_number(&rho_star, t, r, c[8], 1, 0, err)) ||
	    (rc = tsv_number(&s->unc, t, r, c[9], 0, 0, err)) ||
	    (c[11] >= 0 && (rc = tsv_number(&rho_para, t, r, c[11], 1, 0, err))) ||
	    (c[12] >= 0 && (rc = tsv_number(&charge_scale, t, r, c[12], 1, 1, err))))
		return rc;
	if (rho_para != 0 && rho == 0)
		return tsv_fail(err, PRED_EDATA, t, r->line, "rho_para without rho");
	if (!(charge_scale >= 0 && charge_scale <= 1))
		return tsv_fail(err, PRED_EDATA, t, r->line, "charge_scale %g is not in [0, 1]",
				charge_scale);
	s->charge_scale = charge_scale;
	const char *kind = r->fields[c[1]], *sig = r->fields[c[7]];
	if (strcmp(kind, "acid") && strcmp(kind, "base"))
		return tsv_fail(err, PRED_EDATA, t, r->line, "kind '%s' is not acid or base", kind);
	s->kind = !strcmp(kind, "acid") ? PRED_ACID : PRED_BASE;
	if (!strcmp(sig, "sigma") || !*sig)
		s->sigma_para = SIGMA_PLAIN;
	else if (!strcmp(sig, "sigma_minus"))
		s->sigma_para = SIGMA_MINUS;
	else if (!strcmp(sig, "sigma_plus"))
		s->sigma_para = SIGMA_PLUS;
	else
		return tsv_fail(err, PRED_EDATA, t, r->line, "unknown sigma_para '%s'", sig);
	s->centre = (int)centre;
	if ((rc = dup_field(&s->smarts, t, r, c[3], err)) ||
	    (rc = dup_field(&s->source, t, r, c[10], err)) ||
	    (rc = check_smarts(t, r, s->smarts, err)))
		return rc;
	s->p_parent = shared >= 0 ? shared : site_param(m, s, "parent", parent, 1.0);
	s->p_rho = site_param(m, s, "rho", rho, rho != 0 ? 0.2 * (rho < 0 ? -rho : rho) : 0);
	s->p_rho_star = site_param(m, s, "rho_star", rho_star,
				   rho_star != 0 ? 0.3 * (rho_star < 0 ? -rho_star : rho_star) : 0);
	/* Ortho substituents: sigma_p plus a series-specific proximity term (attenuation.md
	 * section 3: ortho constants do not transfer between series), fitted per class. */
	s->p_ortho = rho != 0 ? site_param(m, s, "ortho", 0.0, 0.5) : -1;
	/* Para substituents: an own slope where the row gives one (blank: the rho above). */
	s->p_rho_para = rho_para != 0 ? site_param(m, s, "rho_para", rho_para,
						   0.2 * (rho_para < 0 ? -rho_para : rho_para))
				      : s->p_rho;
	if (s->p_parent < 0 || s->p_rho < 0 || s->p_rho_star < 0 || (rho != 0 && s->p_ortho < 0) ||
	    s->p_rho_para < 0)
		return tsv_fail(err, PRED_ENOMEM, t, r->line, "out of memory");
	return 0;
}

static int parse_sites(pred_model *m, const tsv_table *t, pred_error *err)
{
	static const char *const names[] = {"id", "kind", "group", "smarts", "centre", "parent",
					    "rho", "sigma_para", "rho_star", "unc", "source",
					    NULL};
	int c[13];
	if (columns(c, t, names, err))
		return PRED_EDATA;
	/* rho_para and charge_scale are optional: without rho_para every site has one slope,
	 * without charge_scale every site's charge counts in full. */
	c[11] = c[12] = -1;
	for (size_t j = 0; j < t->n_cols; j++) {
		if (!strcmp(t->header[j], "rho_para"))
			c[11] = (int)j;
		if (!strcmp(t->header[j], "charge_scale"))
			c[12] = (int)j;
	}
	size_t want = 11u + (c[11] >= 0) + (c[12] >= 0);
	if (t->n_cols != want)
		return tsv_fail(err, PRED_EDATA, t, 0, "expected %zu columns, got %zu", want,
				t->n_cols);
	m->sites = calloc(t->n_rows ? t->n_rows : 1, sizeof *m->sites);
	if (!m->sites)
		return PRED_ENOMEM;
	for (size_t i = 0; i < t->n_rows; i++) {
		for (size_t j = 0; j < i; j++)
			if (!strcmp(t->rows[i].fields[c[0]], m->sites[j].id))
				return tsv_fail(err, PRED_EDATA, t, t->rows[i].line,
						"duplicate id '%s'", m->sites[j].id);
		int rc = parse_site_row(m, &m->sites[i], t, &t->rows[i], c, err);
		m->n_sites = i + 1;
		if (rc)
			return rc;
	}
	return 0;
}

/* ---- substituents.tsv --------------------------------------------------------------- */

static int parse_subst_row(frag_subst *s, const tsv_table *t, const tsv_row *r, const int *c,
			   pred_error *err)
{
	int rc;
	double tr;
	if ((rc = copy_id(s->id, sizeof s->id, t, r, c[0], err)) ||
	    (rc = tsv_number(&s->sigma_m, t, r, c[2], 1, 0, err)) ||
	    (rc = tsv_number(&s->sigma_p, t, r, c[3], 1, 0, err)) ||
	    (rc = tsv_number(&s->sigma_i, t, r, c[7], 1, 0, err)) ||
	    (rc = tsv_number(&s->sigma_p_minus, t, r, c[4], 1, s->sigma_p, err)) ||
	    (rc = tsv_number(&s->sigma_p_plus, t, r, c[5], 1, s->sigma_p, err)) ||
	    (rc = tsv_number(&s->sigma_star, t, r, c[6], 1, 6.5 * s->sigma_i, err)) ||
	    (rc = tsv_number(&tr, t, r, c[8], 1, 0, err)))
		return rc;
	s->transparent = tr != 0;
	if ((rc = dup_field(&s->smarts, t, r, c[1], err)) ||
	    (rc = dup_field(&s->source, t, r, c[9], err)))
		return rc;
	return check_smarts(t, r, s->smarts, err);
}

static int parse_substs(pred_model *m, const tsv_table *t, pred_error *err)
{
	static const char *const names[] = {"id", "smarts", "sigma_m", "sigma_p", "sigma_p_minus",
					    "sigma_p_plus", "sigma_star", "sigma_i", "transparent",
					    "source", NULL};
	int c[10];
	if (columns(c, t, names, err))
		return PRED_EDATA;
	if (t->n_cols != 10)
		return tsv_fail(err, PRED_EDATA, t, 0, "expected 10 columns, got %zu", t->n_cols);
	m->substs = calloc(t->n_rows ? t->n_rows : 1, sizeof *m->substs);
	if (!m->substs)
		return PRED_ENOMEM;
	for (size_t i = 0; i < t->n_rows; i++) {
		for (size_t j = 0; j < i; j++)
			if (!strcmp(t->rows[i].fields[c[0]], m->substs[j].id))
				return tsv_fail(err, PRED_EDATA, t, t->rows[i].line,
						"duplicate id '%s'", m->substs[j].id);
		int rc = parse_subst_row(&m->substs[i], t, &t->rows[i], c, err);
		m->n_substs = i + 1;
		if (rc)
			return rc;
		if (!strcmp(m->substs[i].id, "aza"))
			m->subst_aza = (int)i;
	}
	return 0;
}

/* ---- corrections.tsv ---------------------------------------------------------------- */

static int parse_corr_row(pred_model *m, frag_corr *k, const tsv_table *t, const tsv_row *r,
			  const int *c, pred_error *err)
{
	int rc;
	double value;
	if ((rc = copy_id(k->id, sizeof k->id, t, r, c[0], err)) ||
	    (rc = copy_id(k->term, sizeof k->term, t, r, c[1], err)) ||
	    (rc = tsv_number(&value, t, r, c[4], 0, 0, err)) ||
	    (rc = tsv_number(&k->unc, t, r, c[5], 1, 0, err)) ||
	    (rc = dup_field(&k->sites, t, r, c[2], err)) ||
	    (rc = dup_field(&k->smarts, t, r, c[3], err)) ||
	    (rc = dup_field(&k->source, t, r, c[6], err)) ||
	    (rc = check_smarts(t, r, k->smarts, err)))
		return rc;
	const char *count = c[7] >= 0 ? r->fields[c[7]] : "site";
	if (strcmp(count, "site") && strcmp(count, "match"))
		return tsv_fail(err, PRED_EDATA, t, r->line, "count '%s' is not site or match",
				count);
	k->per_match = !strcmp(count, "match");
	k->pair = !strcmp(k->term, "hbond_pair")     ? CORR_PAIR_ANY
		  : !strcmp(k->term, "hbond_pair_z") ? CORR_PAIR_Z
		  : !strcmp(k->term, "charge_pair")  ? CORR_PAIR_CHARGE
						     : CORR_PAIR_NONE;
	if (k->pair && k->per_match)
		return tsv_fail(err, PRED_EDATA, t, r->line,
				"a %s row counts once per site (count site)", k->term);
	char id[128];
	snprintf(id, sizeof id, "corr.%s", k->id);
	k->p_value = model_param_add(m, id, value, 0.5);
	if (k->p_value < 0)
		return tsv_fail(err, PRED_ENOMEM, t, r->line, "out of memory");
	m->params[k->p_value].pair = k->pair;
	return 0;
}

static int parse_corrs(pred_model *m, const tsv_table *t, pred_error *err)
{
	static const char *const names[] = {"id", "term", "sites", "smarts", "value", "unc",
					    "source", NULL};
	int c[8];
	if (columns(c, t, names, err))
		return PRED_EDATA;
	/* count is optional: a table without the column adds every row once per site. */
	c[7] = -1;
	for (size_t j = 0; j < t->n_cols; j++)
		if (!strcmp(t->header[j], "count"))
			c[7] = (int)j;
	if (t->n_cols != (c[7] >= 0 ? 8u : 7u))
		return tsv_fail(err, PRED_EDATA, t, 0, "expected %d columns, got %zu",
				c[7] >= 0 ? 8 : 7, t->n_cols);
	m->corrs = calloc(t->n_rows ? t->n_rows : 1, sizeof *m->corrs);
	if (!m->corrs)
		return PRED_ENOMEM;
	for (size_t i = 0; i < t->n_rows; i++) {
		for (size_t j = 0; j < i; j++)
			if (!strcmp(t->rows[i].fields[c[0]], m->corrs[j].id))
				return tsv_fail(err, PRED_EDATA, t, t->rows[i].line,
						"duplicate id '%s'", m->corrs[j].id);
		int rc = parse_corr_row(m, &m->corrs[i], t, &t->rows[i], c, err);
		m->n_corrs = i + 1;
		if (rc)
			return rc;
	}
	return 0;
}

/* ---- params.tsv: fitted values override the tables ---------------------------------- */

static void header_versions(pred_model *m, const char *text)
{
	const char *p = strstr(text, "# params_version:");
	if (p)
		sscanf(p + 17, " %127[^\n]", m->params_version);
	p = strstr(text, "# data_version:");
	if (p)
		sscanf(p + 15, " %511[^\n]", m->data_version);
}

static int parse_params(pred_model *m, const tsv_table *t, pred_error *err)
{
	static const char *const names[] = {"id", "value", "prior", "prior_sd", "n", "rmse_cv",
					    "note", NULL};
	int c[7];
	if (columns(c, t, names, err))
		return PRED_EDATA;
	for (size_t i = 0; i < t->n_rows; i++) {
		const tsv_row *r = &t->rows[i];
		int k = model_param_find(m, r->fields[c[0]]);
		if (k < 0)
			return tsv_fail(err, PRED_EDATA, t, r->line, "unknown parameter '%s'",
					r->fields[c[0]]);
		pred_param *p = &m->params[k];
		double n;
		int rc;
		if ((rc = tsv_number(&p->value, t, r, c[1], 0, 0, err)) ||
		    (rc = tsv_number(&p->prior_sd, t, r, c[3], 1, p->prior_sd, err)) ||
		    (rc = tsv_number(&n, t, r, c[4], 1, 0, err)) ||
		    (rc = tsv_number(&p->rmse_cv, t, r, c[5], 1, 0, err)))
			return rc;
		p->n = (int)n;
	}
	return 0;
}

static int load_params(pred_model *m, const char *dir, pred_error *err)
{
	char *text = NULL;
	int rc = table_text(&text, dir, "params.tsv", 0, err);
	if (rc || !text)
		return rc;
	header_versions(m, text);
	free(text);
	return parse_with(m, dir, "params.tsv", 0, parse_params, err);
}

static int add_globals(pred_model *m)
{
	/* 0.4 per bond: attenuation.md section 1 (chlorobutanoic acids, Perrin's rule). */
	m->p_falloff = model_param_add(m, "global.falloff", 0.4, 0);
	/* Charge interaction W(d) = A exp(-k (d - 1)) between two unit charges d bonds apart:
	 * starting values from the gaps between the two pKa values less the statistical log 4
	 * of ethylenediamine (3 bonds, about 2.4) and succinic acid (5 bonds, about 0.8),
	 * handbook values in shared data/handbook-*.csv; refit by pkad fit. */
	m->p_interaction = model_param_add(m, "global.interaction", 7.0, 1.0);
	m->p_interaction_decay = model_param_add(m, "global.interaction_decay", 0.53, 0.1);
	/* 0: only the shortest route between two charges; the value is a params.tsv row */
	m->p_interaction_route = model_param_add(m, "global.interaction_route", 0.0, 0);
	/* 0: ring substituents of an aryl met by the Taft walk count nothing; params.tsv row */
	m->p_aryl_transmission = model_param_add(m, "global.aryl_transmission", 0.0, 0);
	/* One factor on every site uncertainty, chosen on the train split so that the share of
	 * residuals within one uncertainty is near 68% (not fitted by least squares). */
	m->p_unc_scale = model_param_add(m, "global.unc_scale", 1.0, 0);
	/* Widening of the uncertainty with molecule size and site count (0: none); chosen on
	 * the train split by tests/tools/fit_unc_widening.py, rows in params.tsv. */
	m->p_unc_size = model_param_add(m, "global.unc_size", 0.0, 0);
	m->p_unc_sites = model_param_add(m, "global.unc_sites", 0.0, 0);
	m->p_unc_floor = model_param_add(m, "global.unc_floor", 0.0, 0);
	/* Rise of an amino group's sigma per unit sigma* of its N-substituents (effects.c):
	 * HLT1991 Table I (from memory) NHC6H5 sigma_p -0.56 / sigma_m -0.02 against NHCH3
	 * -0.70 / -0.21, over sigma*(C6H5) 0.60: 0.23 / 0.32 (own arithmetic); fitted. */
	m->p_amine_n = model_param_add(m, "global.amine_n_sigma", 0.25, 0.1);
	/* Share of rho x sigma that a substituent on a fused aromatic ring passes to a ring-N
	 * base (effects.c fused_ring_effects): estimate (own) 0.4 from train rows of Perrin 1965
	 * via IUPAC dataset (quinoline 4.90; 5-hydroxy- 5.18, 7-hydroxy- 5.46, methyl
	 * quinoline-6-carboxylate 3.80: 0.2-0.5 of the pyridine-ring term); fitted. */
	m->p_fused_transmission = model_param_add(m, "global.fused_transmission", 0.4, 0.15);
	/* The same share for a substituent on a carbon of a fused aromatic five-ring (purine 8-,
	 * imidazo[4,5-b/c]pyridine 2-): estimate (own) 0.4 as the benzo ring, from train rows of
	 * Perrin 1965 and its supplement via IUPAC dataset (8-trifluoromethyl- and 8-methyl-
	 * sulphonylpurines 0.6-1.4 below the unsubstituted ring N); fitted. */
	m->p_fused5_transmission = model_param_add(m, "global.fused5_transmission", 0.4, 0.15);
	/* Share of rho x sigma that a meta or para group on an aryl bonded to the Hammett ring
	 * passes to the site (effects.c biaryl_effects): HLT1991 Table I (from memory) sigma_p of
	 * 4-nitrophenyl about 0.26 against phenyl -0.01, 0.35 of sigma_p(NO2) 0.78 (own
	 * arithmetic); prior 0.3, fitted. */
	m->p_biaryl_transmission = model_param_add(m, "global.biaryl_transmission", 0.3, 0.1);
	/* Rise of a ring alkyl carbon's sigma per unit sigma* of its own groups (effects.c
	 * alkyl_c_effects): 0.17 x 0.4 from HLT1991 Table I sigma_m of CH3, CH2OH, CH2OCH3,
	 * CH2Cl, CH2CN against Taft sigma* (substituent-constants.csv, own arithmetic); fitted. */
	m->p_alkyl_inductive = model_param_add(m, "global.alkyl_inductive", 0.068, 0.03);
	return m->p_falloff < 0 || m->p_interaction < 0 || m->p_interaction_decay < 0 ||
		       m->p_interaction_route < 0 || m->p_aryl_transmission < 0 ||
		       m->p_unc_scale < 0 || m->p_unc_size < 0 || m->p_unc_sites < 0 ||
		       m->p_unc_floor < 0 || m->p_amine_n < 0 || m->p_fused_transmission < 0 ||
		       m->p_fused5_transmission < 0 || m->p_biaryl_transmission < 0 ||
		       m->p_alkyl_inductive < 0
		       ? PRED_ENOMEM
		       : 0;
}

int pred_model_load(pred_model **out, const char *dir, pred_error *err)
{
	*out = NULL;
	pred_model *m = calloc(1, sizeof *m);
	if (!m)
		return PRED_ENOMEM;
	if (!dir)
		dir = getenv("PKAD_FRAGMENTS");
	if (dir && !*dir)
		dir = NULL;
	m->subst_aza = -1;
	snprintf(m->params_version, sizeof m->params_version, "unfitted");
	snprintf(m->data_version, sizeof m->data_version, "none");
	int rc = add_globals(m);
	if (!rc)
		rc = parse_with(m, dir, "sites.tsv", 1, parse_sites, err);
	if (!rc)
		rc = parse_with(m, dir, "substituents.tsv", 1, parse_substs, err);
	if (!rc)
		rc = parse_with(m, dir, "corrections.tsv", 0, parse_corrs, err);
	if (!rc)
		rc = frag_load_bases(m, dir, err);
	if (!rc)
		rc = load_params(m, dir, err);
	if (rc) {
		pred_model_free(m);
		return rc;
	}
	*out = m;
	return 0;
}

int frag_table_read(char **out, const char *dir, const char *name, pred_error *err)
{
	return table_text(out, dir, name, 0, err);
}
