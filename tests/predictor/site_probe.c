/* SPDX-License-Identifier: MIT */
/* site_probe.c: what the tests read off one prediction (a site's pKa, a term, a macro step),
 * through the public API with the worker set by probe_use. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "site_probe.h"

static pred_worker *worker;

void probe_use(pred_worker *w)
{
	worker = w;
}

int probe_setup(pred_model **model, pred_worker **w)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	char dir[1024];
	snprintf(dir, sizeof dir, "%s/fragments", src ? src : ".");
	pred_error err = {0};
	if (pred_global_init(&err) || pred_model_load(model, dir, &err) ||
	    pred_worker_new(w, *model, &err)) {
		fprintf(stderr, "setup: %s\n", err.msg);
		return 1;
	}
	probe_use(*w);
	return 0;
}

void probe_teardown(pred_model *model, pred_worker *w)
{
	pred_worker_free(w);
	pred_model_free(model);
	worker = NULL;
}

/* pKa (and uncertainty, when unc is not NULL) of the first site of this group and kind;
 * NAN when the molecule has none. */
double site_value(const char *smiles, const char *group, pred_kind kind, double *unc)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = NAN;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err)) {
		fprintf(stderr, "%s: %s\n", smiles, err.msg);
		return v;
	}
	for (size_t i = 0; i < pred_result_site_count(r) && isnan(v); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind == kind && !strcmp(s->group, group)) {
			v = s->pka;
			if (unc)
				*unc = s->uncertainty;
		}
	}
	pred_result_free(r);
	return v;
}

double site_pka(const char *smiles, const char *group, pred_kind kind)
{
	return site_value(smiles, group, kind, NULL);
}

/* pKa of the most basic site of a molecule, NAN when it has none. */
double most_basic(const char *smiles)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = NAN;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return v;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind == PRED_BASE && (isnan(v) || s->pka > v))
			v = s->pka;
	}
	pred_result_free(r);
	return v;
}

/* Terms named `term` on the first site of this group and kind; -1 when there is none. */
int site_term_count(const char *smiles, const char *group, pred_kind kind,
			   const char *term)
{
	pred_result *r = NULL;
	pred_error err = {0};
	int count = -1;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return -1;
	for (size_t i = 0; i < pred_result_site_count(r) && count < 0; i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != kind || strcmp(s->group, group))
			continue;
		count = 0;
		for (size_t k = 0; k < s->n_terms; k++)
			count += s->terms[k].term && !strcmp(s->terms[k].term, term);
	}
	pred_result_free(r);
	return count;
}

/* Highest pKa among the sites of this group and kind (the last step of a polyprotic group);
 * NAN when the molecule has none. */
/* Highest (sign 1) or lowest (sign -1) pKa among the sites of this group and kind. */
static double site_extreme(const char *smiles, const char *group, pred_kind kind, int sign)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = NAN;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return v;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind == kind && !strcmp(s->group, group) &&
		    (isnan(v) || sign * (s->pka - v) > 0))
			v = s->pka;
	}
	pred_result_free(r);
	return v;
}

double site_max(const char *smiles, const char *group, pred_kind kind)
{
	return site_extreme(smiles, group, kind, 1);
}

double site_min(const char *smiles, const char *group, pred_kind kind)
{
	return site_extreme(smiles, group, kind, -1);
}

/* Interaction term of the site that ionises with another's charge present (the lower step
 * of a diamine), 0 when none; and the lowest site pKa (NAN: no site). */
void diamine_steps(const char *smiles, double *inter, double *low)
{
	pred_result *r = NULL;
	pred_error err = {0};
	*inter = 0;
	*low = NAN;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (isnan(*low) || s->pka < *low)
			*low = s->pka;
		for (size_t k = 0; k < s->n_terms; k++)
			if (!strcmp(s->terms[k].term, "interaction"))
				*inter = s->terms[k].value;
	}
	pred_result_free(r);
}

/* Sum of the terms of the first site of this group and kind whose name is term (when term
 * is not NULL) and whose detail holds needle (when needle is not NULL); *n counts them. */
static double first_site_terms(const char *smiles, const char *group, pred_kind kind,
			       const char *term, const char *needle, size_t *n)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = 0;
	*n = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return NAN;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != kind || strcmp(s->group, group))
			continue;
		for (size_t k = 0; k < s->n_terms; k++) {
			const pred_term *t = &s->terms[k];
			if ((term && strcmp(t->term, term)) ||
			    (needle && (!t->detail || !strstr(t->detail, needle))))
				continue;
			v += t->value;
			++*n;
		}
		break;
	}
	pred_result_free(r);
	return v;
}

double site_detail_sum(const char *smiles, const char *group, pred_kind kind,
		       const char *needle)
{
	size_t n;
	return first_site_terms(smiles, group, kind, NULL, needle, &n);
}

double base_term(const char *smiles, const char *group, const char *term, size_t *n)
{
	return first_site_terms(smiles, group, PRED_BASE, term, NULL, n);
}

/* The highest macroscopic pKa of a molecule (its last step), NAN when it has none. */
double last_macro(const char *smiles)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = NAN;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return v;
	size_t n = pred_result_macro_count(r);
	if (n)
		v = pred_result_macro_pka(r, n - 1);
	pred_result_free(r);
	return v;
}

/* Value of the correction row id on the first base site of this group (its detail is the id,
 * or "id x N" for a row counted N times); 0 when absent. */
double corr_value(const char *smiles, const char *group, const char *id)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = 0;
	size_t len = strlen(id);
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return NAN;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != PRED_BASE || strcmp(s->group, group))
			continue;
		for (size_t k = 0; k < s->n_terms; k++)
			if (s->terms[k].detail && !strncmp(s->terms[k].detail, id, len) &&
			    (!s->terms[k].detail[len] || s->terms[k].detail[len] == ' '))
				v += s->terms[k].value;
		break;
	}
	pred_result_free(r);
	return v;
}
