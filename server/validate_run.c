/* SPDX-License-Identifier: MIT */
/* validate_run.c: predicts each reference row, matches the site, scores and diagnoses it. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "validate.h"

static int has_term(const pred_site *s, const char *name)
{
	for (size_t k = 0; k < s->n_terms; k++)
		if (!strcmp(s->terms[k].term, name))
			return 1;
	return 0;
}

static int has_warning(const pred_result *r, const char *word)
{
	for (size_t i = 0; i < pred_result_warning_count(r); i++)
		if (strstr(pred_result_warning(r, i), word))
			return 1;
	return 0;
}

/* Another site predicted within 1 unit of the experimental value: the value probably
 * belongs to that site (step numbering of the compilation, or the model's site order). */
static const pred_site *near_other(const pred_result *r, const pred_site *s, double exp)
{
	const pred_site *best = NULL;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *o = pred_result_site(r, i);
		if (o != s && fabs(o->pka - exp) < 1.0 &&
		    (!best || fabs(o->pka - exp) < fabs(best->pka - exp)))
			best = o;
	}
	return best;
}

static size_t add_flag(srv_eval *e, size_t n, const char *text)
{
	if (n < sizeof e->diag)
		n += (size_t)snprintf(e->diag + n, sizeof e->diag - n, "%s; ", text);
	return n;
}

/* A first reading of why a prediction is off, from what the model itself reports: the
 * input tautomer was changed, a substituent had no table entry, the site class differs from
 * the reference's, another site would fit the value; else a missing correction or a data
 * error. Only rows off by more than 1 unit get a diagnosis. */
static void diagnose(srv_eval *e, const pred_result *r, const pred_site *s)
{
	const char *cls = e->ref->site_class;
	const pred_site *o;
	char buf[96];
	size_t n = 0;
	e->diag[0] = '\0';
	if (!s) {
		snprintf(e->diag, sizeof e->diag, "missing site class: no %s site found",
			 e->ref->kind == PRED_ACID ? "acid" : "base");
		return;
	}
	if (fabs(s->pka - e->ref->pka) <= 1.0)
		return;
	if (has_warning(r, "tautomer"))
		n = add_flag(e, n, "tautomer changed");
	if (has_term(s, "generic_substituent"))
		n = add_flag(e, n, "missing substituent (generic estimate)");
	if (cls && *cls && strcmp(cls, s->group)) {
		snprintf(buf, sizeof buf, "matched a %s site", s->group);
		n = add_flag(e, n, buf);
	}
	if ((o = near_other(r, s, e->ref->pka))) {
		snprintf(buf, sizeof buf, "a %s site is predicted at %.2f (numbering or site order)",
			 o->group, o->pka);
		n = add_flag(e, n, buf);
	}
	if (n == 0)
		n = add_flag(e, n, "no flag raised: missing correction or data error");
	if (n >= 2 && n - 2 < sizeof e->diag)
		e->diag[n - 2] = '\0';
}

static srv_eval *next_eval(srv_validation *v)
{
	if (v->n_evals == v->cap_evals) {
		size_t cap = v->cap_evals ? v->cap_evals * 2 : 256;
		srv_eval *ne = realloc(v->evals, cap * sizeof *ne);
		if (!ne)
			return NULL;
		v->evals = ne;
		v->cap_evals = cap;
	}
	memset(&v->evals[v->n_evals], 0, sizeof *v->evals);
	return &v->evals[v->n_evals++];
}

static void class_name(srv_eval *e, const pred_site *s)
{
	const char *c = e->ref->site_class && *e->ref->site_class ? e->ref->site_class
			: s ? s->group : "(no site)";
	snprintf(e->cls, sizeof e->cls, "%s", c);
}

static int score_row(srv_validation *v, srv_eval *e, pred_worker *w, pred_options *po,
		     int steps)
{
	pred_result *r = NULL;
	pred_error err = {0, ""};
	const pred_site *s = NULL;
	srv_stat *cs;
	long k;
	if (pred_predict(&r, w, e->ref->smiles, PRED_FMT_SMILES, po, &err)) {
		e->status = SRV_EVAL_UNREADABLE;
		snprintf(e->msg, sizeof e->msg, "%s: %s", pred_status_name(err.code), err.msg);
		snprintf(e->cls, sizeof e->cls, "%s", e->ref->site_class && *e->ref->site_class
							      ? e->ref->site_class : "(unreadable)");
		v->n_unreadable++;
		srv_stat_add_missing(&v->all);
		return (cs = srv_class_stat(&v->classes, e->cls)) ? (srv_stat_add_missing(cs), 0)
								  : PRED_ENOMEM;
	}
	k = steps ? pred_result_match_listed(r, e->ref->kind, e->ref->pka_index, e->ref->listed)
		  : pred_result_match(r, e->ref->kind, e->ref->pka_index);
	s = k >= 0 ? pred_result_site(r, (size_t)k) : NULL;
	class_name(e, s);
	diagnose(e, r, s);
	if (!(cs = srv_class_stat(&v->classes, e->cls))) {
		pred_result_free(r);
		return PRED_ENOMEM;
	}
	if (s) {
		e->predicted = s->pka;
		e->uncertainty = s->uncertainty;
		snprintf(e->group, sizeof e->group, "%s", s->group);
		srv_stat_add(&v->all, s->pka, e->ref->pka, s->uncertainty);
		srv_stat_add(cs, s->pka, e->ref->pka, s->uncertainty);
	} else {
		e->status = SRV_EVAL_NO_SITE;
		srv_stat_add_missing(&v->all);
		srv_stat_add_missing(cs);
	}
	pred_result_free(r);
	return 0;
}

int srv_validation_add(srv_validation *v, pred_worker *w, const srv_ref *rows, size_t n,
		       const char *file, int match_steps)
{
	pred_options po;
	pred_options_init(&po);
	for (size_t i = 0; i < n; i++) {
		srv_eval *e = next_eval(v);
		int rc;
		if (!e)
			return PRED_ENOMEM;
		e->ref = &rows[i];
		e->file = file;
		if ((rc = score_row(v, e, w, &po, match_steps)))
			return rc;
	}
	return 0;
}

void srv_validation_clear(srv_validation *v)
{
	srv_class_stats_clear(&v->classes);
	free(v->evals);
	memset(v, 0, sizeof *v);
}

typedef struct ranked {
	double abs_res;
	size_t index;
} ranked;

static int by_residual(const void *a, const void *b)
{
	const ranked *x = a, *y = b;
	if (x->abs_res != y->abs_res)
		return x->abs_res < y->abs_res ? 1 : -1;
	return x->index < y->index ? -1 : x->index > y->index;
}

size_t *srv_validation_worst(const srv_validation *v, size_t *n)
{
	ranked *rk = malloc((v->n_evals + 1) * sizeof *rk);
	size_t *out = malloc((v->n_evals + 1) * sizeof *out), m = 0;
	*n = 0;
	if (!rk || !out) {
		free(rk);
		free(out);
		return NULL;
	}
	for (size_t i = 0; i < v->n_evals; i++)
		if (v->evals[i].status == SRV_EVAL_OK)
			rk[m++] = (ranked){fabs(v->evals[i].predicted - v->evals[i].ref->pka), i};
	qsort(rk, m, sizeof *rk, by_residual);
	for (size_t i = 0; i < m; i++)
		out[i] = rk[i].index;
	free(rk);
	*n = m;
	return out;
}
