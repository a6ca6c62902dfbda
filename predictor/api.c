/* SPDX-License-Identifier: MIT */
/* api.c: status names, version, global initialisation, options and workers. */
#include <locale.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"

const char *pred_status_name(int code)
{
	switch (code) {
	case PRED_OK: return "ok";
	case PRED_EINVAL: return "invalid_argument";
	case PRED_EPARSE: return "invalid_smiles";
	case PRED_EDATA: return "bad_data";
	case PRED_ENOMEM: return "out_of_memory";
	case PRED_ELIMIT: return "too_many_atoms";
	case PRED_ETIMEOUT: return "timeout";
	case PRED_EUNSUPPORTED: return "unsupported_structure";
	default: return "internal_error";
	}
}

const char *pred_version(void)
{
	return PKAD_VERSION;
}

int pred_global_init(pred_error *err)
{
	setlocale(LC_NUMERIC, "C");
	char msg[200] = "";
	int rc = obw_global_init(msg, sizeof msg);
	if (rc && err) {
		err->code = rc;
		snprintf(err->msg, sizeof err->msg, "%s", msg);
	}
	return rc;
}

void pred_options_init(pred_options *opt)
{
	opt->ph = 7.4;
	opt->max_heavy_atoms = 200;
	opt->max_seconds = 10.0;
	opt->curves = 0;
	opt->curve_step = 0.25;
}

/* Slots for Open Babel's compiled patterns, filled on first use (perceive.c): the loader
 * has checked that every pattern compiles. */
static int pattern_slots(obw_pattern ***out, size_t n)
{
	*out = calloc(n + 1, sizeof **out);
	return *out ? 0 : PRED_ENOMEM;
}

static const char *site_smarts(const pred_model *m, size_t i)
{
	return m->sites[i].smarts;
}

static const char *subst_smarts(const pred_model *m, size_t i)
{
	return m->substs[i].smarts;
}

static const char *corr_smarts(const pred_model *m, size_t i)
{
	return m->corrs[i].smarts;
}

/* Nonzero when correction c applies to sites of this row (its id or group is listed). */
static int corr_applies(const frag_corr *c, const frag_site *row)
{
	if (!strcmp(c->sites, "*"))
		return 1;
	size_t li = strlen(row->id), lg = strlen(row->group);
	for (const char *p = c->sites; *p;) {
		size_t len = strcspn(p, ",");
		if ((len == li && !strncmp(p, row->id, li)) ||
		    (len == lg && !strncmp(p, row->group, lg)))
			return 1;
		p += len;
		if (*p == ',')
			p++;
	}
	return 0;
}

static int corr_table(pred_worker *w)
{
	const pred_model *m = w->m;
	w->corr_ok = calloc(m->n_corrs * m->n_sites + 1, 1);
	if (!w->corr_ok)
		return PRED_ENOMEM;
	size_t n = 0;
	for (size_t k = 0; k < m->n_corrs; k++)
		for (size_t r = 0; r < m->n_sites; r++) {
			w->corr_ok[k * m->n_sites + r] =
			    (unsigned char)corr_applies(&m->corrs[k], &m->sites[r]);
			n += w->corr_ok[k * m->n_sites + r];
		}
	/* the same table by site row, as lists of corrections in table order */
	w->row_corr_start = calloc(m->n_sites + 1, sizeof *w->row_corr_start);
	w->row_corrs = malloc((n + 1) * sizeof *w->row_corrs);
	if (!w->row_corr_start || !w->row_corrs)
		return PRED_ENOMEM;
	n = 0;
	for (size_t r = 0; r < m->n_sites; r++) {
		for (size_t k = 0; k < m->n_corrs; k++)
			if (w->corr_ok[k * m->n_sites + r])
				w->row_corrs[n++] = (int)k;
		w->row_corr_start[r + 1] = (int)n;
	}
	w->pair_corrs = malloc((m->n_corrs + 1) * sizeof *w->pair_corrs);
	if (!w->pair_corrs)
		return PRED_ENOMEM;
	w->n_pair_corrs = eng_pair_rows(w->pair_corrs, m);
	return 0;
}

static int requirements(smarts_req **out, size_t n,
			const char *(*smarts)(const pred_model *, size_t), const pred_model *m)
{
	*out = calloc(n + 1, sizeof **out);
	if (!*out)
		return PRED_ENOMEM;
	for (size_t i = 0; i < n; i++)
		smarts_requirements(&(*out)[i], smarts(m, i));
	return 0;
}

static int screens(smarts_screen ***out, size_t n,
		   const char *(*smarts)(const pred_model *, size_t), const pred_model *m)
{
	*out = calloc(n + 1, sizeof **out);
	if (!*out)
		return PRED_ENOMEM;
	for (size_t i = 0; i < n; i++)
		(*out)[i] = smarts_screen_new(smarts(m, i));
	return 0;
}

static void free_screens(smarts_screen **s, size_t n)
{
	if (!s)
		return;
	for (size_t i = 0; i < n; i++)
		smarts_screen_free(s[i]);
	free(s);
}

/* One value per molecule and atom for each distinct recursive part of all the screens. */
static int share_recursion(pred_worker *w)
{
	const pred_model *m = w->m;
	sx_shared reg = {NULL, 0, 0, NULL};
	int rc = 0;
	for (size_t i = 0; i < m->n_sites && !rc; i++)
		rc = smarts_screen_share(w->site_scr[i], &reg);
	for (size_t i = 0; i < m->n_substs && !rc; i++)
		rc = smarts_screen_share(w->subst_scr[i], &reg);
	for (size_t i = 0; i < m->n_corrs && !rc; i++)
		rc = smarts_screen_share(w->corr_scr[i], &reg);
	w->n_shared = reg.n;
	sx_shared_clear(&reg);
	return rc ? PRED_ENOMEM : 0;
}

int pred_worker_new(pred_worker **out, const pred_model *m, pred_error *err)
{
	*out = NULL;
	pred_worker *w = calloc(1, sizeof *w);
	if (!w)
		return PRED_ENOMEM;
	w->m = m;
	w->ctx = obw_ctx_new();
	int rc = w->ctx ? 0 : PRED_ENOMEM;
	if (!rc)
		rc = pattern_slots(&w->site_pat, m->n_sites);
	if (!rc)
		rc = pattern_slots(&w->subst_pat, m->n_substs);
	if (!rc)
		rc = pattern_slots(&w->corr_pat, m->n_corrs);
	if (!rc)
		rc = requirements(&w->site_req, m->n_sites, site_smarts, m);
	if (!rc)
		rc = requirements(&w->subst_req, m->n_substs, subst_smarts, m);
	if (!rc)
		rc = requirements(&w->corr_req, m->n_corrs, corr_smarts, m);
	if (!rc)
		rc = screens(&w->site_scr, m->n_sites, site_smarts, m);
	if (!rc)
		rc = screens(&w->subst_scr, m->n_substs, subst_smarts, m);
	if (!rc)
		rc = screens(&w->corr_scr, m->n_corrs, corr_smarts, m);
	if (!rc)
		rc = share_recursion(w);
	if (!rc)
		rc = corr_table(w);
	if (rc) {
		if (err) {
			err->code = rc;
			snprintf(err->msg, sizeof err->msg, "out of memory preparing a worker");
		}
		pred_worker_free(w);
		return rc;
	}
	*out = w;
	return 0;
}

static void free_patterns(obw_pattern **p, size_t n)
{
	if (!p)
		return;
	for (size_t i = 0; i < n; i++)
		obw_pattern_free(p[i]);
	free(p);
}

void pred_worker_free(pred_worker *w)
{
	if (!w)
		return;
	free_patterns(w->site_pat, w->m->n_sites);
	free_patterns(w->subst_pat, w->m->n_substs);
	free_patterns(w->corr_pat, w->m->n_corrs);
	obw_ctx_free(w->ctx);
	free(w->site_req);
	free(w->subst_req);
	free(w->corr_req);
	free(w->corr_ok);
	free(w->row_corr_start);
	free(w->row_corrs);
	free(w->pair_corrs);
	free_screens(w->site_scr, w->m->n_sites);
	free_screens(w->subst_scr, w->m->n_substs);
	free_screens(w->corr_scr, w->m->n_corrs);
	free(w);
}
