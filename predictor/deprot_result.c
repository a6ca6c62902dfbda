/* SPDX-License-Identifier: MIT */
/* deprot_result.c: lifetime, messages and accessors of pred_deprotonation. */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "deprotonate.h"

static int append(pred_deprotonation *d, char ***list, size_t *n, const char *fmt, va_list ap)
{
	char buf[512];
	vsnprintf(buf, sizeof buf, fmt, ap);
	char **grown = res_alloc(d->sub, (*n + 1) * sizeof *grown);
	if (!grown)
		return PRED_ENOMEM;
	if (*n)
		memcpy(grown, *list, *n * sizeof *grown);
	if (!(grown[*n] = res_strdup(d->sub, buf)))
		return PRED_ENOMEM;
	*list = grown;
	(*n)++;
	return 0;
}

int deprot_caution(pred_deprotonation *d, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	int rc = append(d, &d->cautions, &d->n_cautions, fmt, ap);
	va_end(ap);
	return rc;
}

int deprot_warn(pred_deprotonation *d, const char *fmt, ...)
{
	va_list ap;
	va_start(ap, fmt);
	int rc = append(d, &d->warnings, &d->n_warnings, fmt, ap);
	va_end(ap);
	return rc;
}

void pred_deprotonation_free(pred_deprotonation *d)
{
	if (!d)
		return;
	pred_result_free(d->sub);
	free(d);
}

size_t pred_base_count(const pred_model *m)
{
	return m->n_bases;
}

void pred_base(pred_base_info *out, const pred_model *m, size_t i)
{
	const frag_base *b = &m->bases[i];
	*out = (pred_base_info){b->name,      b->aliases, b->conjugate_acid, b->conj_smiles,
	                        b->pka,       b->scale,   b->pka_dmso,       b->organometallic,
	                        b->byproduct, b->hazards, b->source};
}

const char *pred_deprotonation_substrate(const pred_deprotonation *d)
{
	return d->sub->smiles;
}

const char *pred_deprotonation_base(const pred_deprotonation *d)
{
	return d->base;
}

const char *pred_deprotonation_conjugate_acid(const pred_deprotonation *d)
{
	return d->conj_acid;
}

double pred_deprotonation_base_pka(const pred_deprotonation *d)
{
	return d->base_pka;
}

const char *pred_deprotonation_scale(const pred_deprotonation *d)
{
	return d->scale;
}

int pred_deprotonation_base_is_predicted(const pred_deprotonation *d)
{
	return d->predicted;
}

double pred_deprotonation_equivalents(const pred_deprotonation *d)
{
	return d->equiv;
}

const char *pred_deprotonation_byproduct(const pred_deprotonation *d)
{
	return d->byproduct;
}

size_t pred_deprotonation_site_count(const pred_deprotonation *d)
{
	return d->n_sites;
}

const pred_deprot_site *pred_deprotonation_site(const pred_deprotonation *d, size_t i)
{
	return i < d->n_sites ? &d->sites[i] : NULL;
}

size_t pred_deprotonation_caution_count(const pred_deprotonation *d)
{
	return d->n_cautions;
}

const char *pred_deprotonation_caution(const pred_deprotonation *d, size_t i)
{
	return i < d->n_cautions ? d->cautions[i] : NULL;
}

size_t pred_deprotonation_warning_count(const pred_deprotonation *d)
{
	return d->n_warnings;
}

const char *pred_deprotonation_warning(const pred_deprotonation *d, size_t i)
{
	return i < d->n_warnings ? d->warnings[i] : NULL;
}
