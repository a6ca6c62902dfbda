/* SPDX-License-Identifier: MIT */
/* result.c: lifetime and accessors of pred_result; every part lives in one arena. */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "model.h"
#include "result.h"

struct res_chunk {
	res_chunk *next;
	size_t used, cap;
	max_align_t data[];
};

enum { CHUNK_MIN = 4096 };

void *res_alloc(pred_result *r, size_t size)
{
	size = (size + sizeof(max_align_t) - 1) / sizeof(max_align_t) * sizeof(max_align_t);
	res_chunk *c = r->arena;
	if (!c || c->cap - c->used < size) {
		size_t cap = size > CHUNK_MIN ? size : CHUNK_MIN;
		c = malloc(sizeof *c + cap);
		if (!c)
			return NULL;
		c->next = r->arena;
		c->used = 0;
		c->cap = cap;
		r->arena = c;
	}
	void *p = (char *)c->data + c->used;
	c->used += size;
	memset(p, 0, size);
	return p;
}

char *res_strdup(pred_result *r, const char *s)
{
	size_t n = strlen(s) + 1;
	char *p = res_alloc(r, n);
	if (p)
		memcpy(p, s, n);
	return p;
}

static char *res_vprintf(pred_result *r, const char *fmt, va_list ap)
{
	char buf[512];
	vsnprintf(buf, sizeof buf, fmt, ap);
	return res_strdup(r, buf);
}

char *res_printf(pred_result *r, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	char *s = res_vprintf(r, fmt, ap);
	va_end(ap);
	return s;
}

static int push_line(pred_result *r, char ***list, size_t *n, char *s)
{
	if (!s)
		return PRED_ENOMEM;
	char **grown = res_alloc(r, (*n + 1) * sizeof *grown);
	if (!grown)
		return PRED_ENOMEM;
	if (*n)
		memcpy(grown, *list, *n * sizeof *grown);
	grown[(*n)++] = s;
	*list = grown;
	return 0;
}

int res_warn(pred_result *r, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	char *s = res_vprintf(r, fmt, ap);
	va_end(ap);
	return push_line(r, &r->warnings, &r->n_warnings, s);
}

int res_note(pred_result *r, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	char *s = res_vprintf(r, fmt, ap);
	va_end(ap);
	return push_line(r, &r->notes, &r->n_notes, s);
}

void pred_result_free(pred_result *r)
{
	if (!r)
		return;
	res_chunk *c = r->arena;
	while (c) {
		res_chunk *next = c->next;
		free(c);
		c = next;
	}
	free(r);
}

const char *pred_result_smiles(const pred_result *r)
{
	return r->smiles ? r->smiles : "";
}

size_t pred_result_site_count(const pred_result *r)
{
	return r->n_sites;
}

const pred_site *pred_result_site(const pred_result *r, size_t i)
{
	return i < r->n_sites ? &r->sites[i] : NULL;
}

size_t pred_result_warning_count(const pred_result *r)
{
	return r->n_warnings;
}

const char *pred_result_warning(const pred_result *r, size_t i)
{
	return i < r->n_warnings ? r->warnings[i] : NULL;
}

size_t pred_result_note_count(const pred_result *r)
{
	return r->n_notes;
}

const char *pred_result_note(const pred_result *r, size_t i)
{
	return i < r->n_notes ? r->notes[i] : NULL;
}

size_t pred_result_macro_count(const pred_result *r)
{
	return r->n_macro;
}

double pred_result_macro_pka(const pred_result *r, size_t i)
{
	return i < r->n_macro ? r->macro[i] : 0.0;
}

double pred_result_ph(const pred_result *r)
{
	return r->ph;
}

double pred_result_charge(const pred_result *r)
{
	return r->charge;
}

size_t pred_result_species_count(const pred_result *r)
{
	return r->n_species;
}

const pred_species *pred_result_species(const pred_result *r, size_t i)
{
	return i < r->n_species ? &r->species[i] : NULL;
}

int pred_result_isoelectric(const pred_result *r, double *out)
{
	if (!r->has_pi)
		return -1;
	*out = r->pi;
	return 0;
}

int pred_result_ionization_is_approximate(const pred_result *r)
{
	return r->approximate;
}

const pred_curves *pred_result_curves(const pred_result *r)
{
	return r->curves;
}

void pred_result_design(const pred_result *r, size_t i, pred_design *out)
{
	const site_design *d = &r->design[i];
	out->n = d->n;
	out->param = d->param;
	out->feature = d->feature;
	out->constant = d->constant;
	out->unc_factor = d->unc_factor;
}
