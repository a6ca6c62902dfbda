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

static int same_molecule(const srv_ref *a, const srv_ref *b)
{
	return !by_molecule(&a, &b);
}

/* Sets n_steps and listed of every row: the highest pka_index among the rows of its molecule
 * and kind (a compilation's numbering of the steps it lists) and the distinct indices with
 * their values (the mean where rows share an index). The lists live in the block of the rows,
 * after them, so that one free() releases both; returns the new block or NULL. */
static srv_ref *count_steps(srv_ref *rows, size_t n)
{
	srv_ref **ord = n ? malloc(n * sizeof *ord) : NULL, *b;
	size_t *pos = n ? malloc(n * sizeof *pos) : NULL, groups = 0, at = 0, g = 0;
	pred_listed_steps *lists;
	double *vals;
	int *idx;
	if (!n)
		return rows;
	if (!ord || !pos) {
		free(ord);
		free(pos);
		return NULL;
	}
	for (size_t i = 0; i < n; i++)
		ord[i] = &rows[i];
	qsort(ord, n, sizeof *ord, by_molecule);
	for (size_t i = 0; i < n; i++) {
		groups += i == 0 || by_molecule(&ord[i - 1], &ord[i]);
		pos[i] = (size_t)(ord[i] - rows); /* rows move with the realloc below */
	}
	free(ord);
	b = realloc(rows, n * sizeof *rows + groups * sizeof *lists + n * sizeof *vals +
				  n * sizeof *idx);
	if (!b) {
		free(pos);
		return NULL;
	}
	lists = (pred_listed_steps *)(void *)(b + n);
	vals = (double *)(void *)(lists + groups);
	idx = (int *)(void *)(vals + n);
	for (size_t i = 0, j; i < n; i = j, g++) {
		size_t start = at;
		for (j = i + 1; j < n && same_molecule(&b[pos[i]], &b[pos[j]]); j++)
			;
		/* Distinct indices ascending, by insertion (a molecule has few rows). */
		for (size_t k = i; k < j; k++) {
			int v = b[pos[k]].pka_index;
			size_t q = start;
			while (q < at && idx[q] < v)
				q++;
			if (q < at && idx[q] == v)
				continue;
			for (size_t t = at; t > q; t--)
				idx[t] = idx[t - 1];
			idx[q] = v;
			at++;
		}
		for (size_t q = start; q < at; q++) {
			double sum = 0.0;
			int cnt = 0;
			for (size_t k = i; k < j; k++)
				if (b[pos[k]].pka_index == idx[q])
					sum += b[pos[k]].pka, cnt++;
			vals[q] = sum / cnt;
		}
		lists[g] = (pred_listed_steps){at - start, idx + start, vals + start};
		for (size_t k = i; k < j; k++) {
			b[pos[k]].n_steps = idx[at - 1];
			b[pos[k]].listed = &lists[g];
		}
	}
	free(pos);
	return b;
}

int srv_ref_read(srv_ref **out, size_t *n, const srv_csv *c, pred_error *err)
{
	ref_cols k;
	srv_ref *rows = NULL, *out_rows;
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
	if (!(out_rows = count_steps(rows, nr))) {
		free(rows);
		if (err) {
			err->code = PRED_ENOMEM;
			snprintf(err->msg, sizeof err->msg, "out of memory");
		}
		return PRED_ENOMEM;
	}
	*out = out_rows;
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
