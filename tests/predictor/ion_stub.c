/* SPDX-License-Identifier: MIT */
/* ion_stub.c: minimal result arena and model lookup so the microstate model is tested on
 * hand-built results, without the engine or the toolkit (molecule pointers stay NULL). */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "model.h"
#include "obwrap.h"
#include "result.h"

struct res_chunk {
	res_chunk *next;
};

void *res_alloc(pred_result *r, size_t size)
{
	res_chunk *c = calloc(1, sizeof *c + size + 16);
	if (!c)
		return NULL;
	c->next = r->arena;
	r->arena = c;
	return (char *)c + sizeof *c + (16 - sizeof *c % 16) % 16;
}

char *res_strdup(pred_result *r, const char *s)
{
	char *d = res_alloc(r, strlen(s) + 1);
	return d ? strcpy(d, s) : NULL;
}

int res_warn(pred_result *r, const char *fmt, ...)
{
	char buf[512];
	va_list ap;
	va_start(ap, fmt);
	vsnprintf(buf, sizeof buf, fmt, ap);
	va_end(ap);
	char **w = res_alloc(r, (r->n_warnings + 1) * sizeof *w);
	if (!w)
		return PRED_ENOMEM;
	if (r->n_warnings)
		memcpy(w, r->warnings, r->n_warnings * sizeof *w);
	if (!(w[r->n_warnings] = res_strdup(r, buf)))
		return PRED_ENOMEM;
	r->warnings = w;
	r->n_warnings++;
	return 0;
}

void pred_result_free(pred_result *r)
{
	if (!r)
		return;
	for (res_chunk *c = r->arena, *n; c; c = n) {
		n = c->next;
		free(c);
	}
	free(r);
}

int model_param_find(const pred_model *m, const char *id)
{
	for (size_t i = 0; m && i < m->n_params; i++)
		if (!strcmp(m->params[i].id, id))
			return (int)i;
	return -1;
}

/* The toolkit is never reached with a NULL molecule; these fail loudly if it is. */
size_t obw_mol_atoms(const obw_mol *m, const obw_atom **out)
{
	(void)m;
	*out = NULL;
	abort();
}

int obw_mol_clone(obw_mol **out, const obw_mol *m)
{
	(void)out, (void)m;
	abort();
}

int obw_mol_set_atom(obw_mol *m, int atom, int charge, int hcount)
{
	(void)m, (void)atom, (void)charge, (void)hcount;
	abort();
}

int obw_mol_refresh(obw_mol *m, char *msg, size_t msgn)
{
	(void)m, (void)msg, (void)msgn;
	abort();
}

char *obw_mol_canonical(obw_mol *m, obw_ctx *c, char *msg, size_t msgn)
{
	(void)m, (void)c, (void)msg, (void)msgn;
	abort();
}

void obw_mol_free(obw_mol *m)
{
	(void)m;
}
