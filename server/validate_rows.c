/* SPDX-License-Identifier: MIT */
/* validate_rows.c: turns the rows of a reference CSV into typed experimental values. */
#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "validate.h"

/* Column indices of a reference CSV; -1 when absent. */
typedef struct ref_cols {
	int smiles, pka, kind, index, cls, split, tier, name;
} ref_cols;

static int fail(pred_error *err, const char *fmt, ...)
{
	if (err) {
		va_list ap;
		va_start(ap, fmt);
		err->code = PRED_EDATA;
		vsnprintf(err->msg, sizeof err->msg, fmt, ap);
		va_end(ap);
	}
	return PRED_EDATA;
}

static int name_column(const srv_csv *c)
{
	const char *names[] = {"name", "iupac_name", "entry", "id"};
	for (size_t i = 0; i < sizeof names / sizeof names[0]; i++) {
		int col = srv_csv_column(c, names[i]);
		if (col >= 0)
			return col;
	}
	return -1;
}

static int find_columns(ref_cols *k, const srv_csv *c, pred_error *err)
{
	const char *need[] = {"smiles", "pka", "kind"};
	int *dst[] = {&k->smiles, &k->pka, &k->kind};
	for (size_t i = 0; i < 3; i++)
		if ((*dst[i] = srv_csv_column(c, need[i])) < 0)
			return fail(err, "%s:1:1: missing column '%s'", srv_csv_name(c), need[i]);
	k->index = srv_csv_column(c, "pka_index");
	k->cls = srv_csv_column(c, "site_class");
	k->split = srv_csv_column(c, "split");
	k->tier = srv_csv_column(c, "tier");
	k->name = name_column(c);
	return 0;
}

static int bad_cell(const srv_csv *c, size_t row, int col, const char *what, pred_error *err)
{
	return fail(err, "%s:%zu:%zu: %s '%s'", srv_csv_name(c), srv_csv_line(c, row),
		    srv_csv_colno(c, row, col), what, srv_csv_cell(c, row, col));
}

static int parse_row(srv_ref *r, const srv_csv *c, size_t i, const ref_cols *k,
		     pred_error *err)
{
	const char *kind = srv_csv_cell(c, i, k->kind);
	char *end;
	r->smiles = srv_csv_cell(c, i, k->smiles);
	r->name = srv_csv_cell(c, i, k->name);
	r->site_class = k->cls >= 0 ? srv_csv_cell(c, i, k->cls) : NULL;
	r->split = srv_csv_cell(c, i, k->split);
	r->tier = srv_csv_cell(c, i, k->tier);
	r->line = srv_csv_line(c, i);
	errno = 0;
	r->pka = strtod(srv_csv_cell(c, i, k->pka), &end);
	if (end == srv_csv_cell(c, i, k->pka) || *end || errno || !isfinite(r->pka))
		return bad_cell(c, i, k->pka, "pka: not a number", err);
	if (!strcmp(kind, "acid"))
		r->kind = PRED_ACID;
	else if (!strcmp(kind, "base"))
		r->kind = PRED_BASE;
	else
		return bad_cell(c, i, k->kind, "kind: expected acid or base, got", err);
	r->pka_index = 1;
	if (k->index >= 0) {
		long v = strtol(srv_csv_cell(c, i, k->index), &end, 10);
		if (end == srv_csv_cell(c, i, k->index) || *end || v < 1 || v > 64)
			return bad_cell(c, i, k->index, "pka_index: expected 1..64, got", err);
		r->pka_index = (int)v;
	}
	return 0;
}

/* Order of rows by molecule and kind, for counting the steps of each. */
static int by_molecule(const void *a, const void *b)
{
	const srv_ref *x = *(const srv_ref *const *)a, *y = *(const srv_ref *const *)b;
	int c = strcmp(x->smiles, y->smiles);
	return c ? c : (int)x->kind - (int)y->kind;
}

/* Sets n_steps of every row: the highest pka_index among the rows of its molecule and kind
 * (a compilation's numbering of the steps it lists). */
static int count_steps(srv_ref *rows, size_t n)
{
	srv_ref **ord = n ? malloc(n * sizeof *ord) : NULL;
	if (n && !ord)
		return PRED_ENOMEM;
	for (size_t i = 0; i < n; i++)
		ord[i] = &rows[i];
	qsort(ord, n, sizeof *ord, by_molecule);
	for (size_t i = 0, j; i < n; i = j) {
		int top = 0;
		for (j = i; j < n && !by_molecule(&ord[i], &ord[j]); j++)
			top = ord[j]->pka_index > top ? ord[j]->pka_index : top;
		for (size_t k = i; k < j; k++)
			ord[k]->n_steps = top;
	}
	free(ord);
	return 0;
}

int srv_ref_read(srv_ref **out, size_t *n, const srv_csv *c, pred_error *err)
{
	ref_cols k;
	srv_ref *rows = NULL;
	size_t nr = srv_csv_rows(c);
	int rc;
	*out = NULL;
	*n = 0;
	if ((rc = find_columns(&k, c, err)))
		return rc;
	if (nr && !(rows = calloc(nr, sizeof *rows))) {
		if (err) {
			err->code = PRED_ENOMEM;
			snprintf(err->msg, sizeof err->msg, "out of memory");
		}
		return PRED_ENOMEM;
	}
	for (size_t i = 0; i < nr; i++) {
		if ((rc = parse_row(&rows[i], c, i, &k, err))) {
			free(rows);
			return rc;
		}
	}
	if (count_steps(rows, nr)) {
		free(rows);
		if (err) {
			err->code = PRED_ENOMEM;
			snprintf(err->msg, sizeof err->msg, "out of memory");
		}
		return PRED_ENOMEM;
	}
	*out = rows;
	*n = nr;
	return 0;
}

int srv_match_mode(const char *name)
{
	if (!strcmp(name, "auto"))
		return SRV_MATCH_AUTO;
	if (!strcmp(name, "kind"))
		return SRV_MATCH_KIND;
	return strcmp(name, "steps") ? -1 : SRV_MATCH_STEPS;
}

int srv_match_steps(int mode, const srv_csv *c)
{
	if (mode == SRV_MATCH_AUTO)
		return srv_csv_column(c, "site_class") < 0;
	return mode == SRV_MATCH_STEPS;
}
