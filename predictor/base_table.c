/* SPDX-License-Identifier: MIT */
/* base_table.c: parses fragments/bases.tsv (reagent bases) and finds a base by name. */
#include <ctype.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "base_table.h"
#include "fragment_table.h"
#include "tsv.h"

static const char *const columns[] = {
    "name",      "aliases", "conjugate_acid", "conjugate_acid_smiles",
    "pka",       "scale",   "pka_dmso",       "organometallic",
    "byproduct", "escapes", "hazards",        "source"};
enum {
	C_NAME,
	C_ALIASES,
	C_ACID,
	C_ACID_SMILES,
	C_PKA,
	C_SCALE,
	C_DMSO,
	C_ORGMET,
	C_BYPRODUCT,
	C_ESCAPES,
	C_HAZARDS,
	C_SOURCE,
	N_COLUMNS
};

static const char *const scales[] = {"water", "dmso", "thf", "estimate"};

/* Next character of a name that takes part in matching, lower-cased; 0 at the end. */
static int name_char(const char **p)
{
	while (**p == ' ' || **p == '-' || **p == '_')
		(*p)++;
	return **p ? tolower((unsigned char)*(*p)++) : 0;
}

static int name_equal(const char *a, const char *b)
{
	for (;;) {
		int ca = name_char(&a), cb = name_char(&b);
		if (ca != cb)
			return 0;
		if (!ca)
			return 1;
	}
}

/* Calls fn on each comma-separated alias of list (copied to a buffer); stops at the first
 * nonzero return and passes it on. */
static int each_alias(const char *list, int (*fn)(const char *alias, const void *ctx),
                      const void *ctx)
{
	char alias[128];
	for (const char *p = list ? list : ""; *p;) {
		const char *comma = strchr(p, ',');
		size_t len = comma ? (size_t)(comma - p) : strlen(p);
		snprintf(alias, sizeof alias, "%.*s", (int)len, p);
		int rc = len ? fn(alias, ctx) : 0;
		if (rc)
			return rc;
		p += len + (comma ? 1 : 0);
	}
	return 0;
}

static int alias_is(const char *alias, const void *name)
{
	return name_equal(alias, name);
}

static int matches(const frag_base *b, const char *name)
{
	return name_equal(name, b->name) || each_alias(b->aliases, alias_is, name);
}

int base_table_find(const pred_model *m, const char *name)
{
	for (size_t i = 0; name && i < m->n_bases; i++)
		if (matches(&m->bases[i], name))
			return (int)i;
	return -1;
}

static int check_header(const tsv_table *t, pred_error *err)
{
	if (t->n_cols != N_COLUMNS)
		return tsv_fail(err, PRED_EDATA, t, 0, "expected %d columns, got %zu", N_COLUMNS,
		                t->n_cols);
	for (size_t i = 0; i < N_COLUMNS; i++)
		if (strcmp(t->header[i], columns[i]))
			return tsv_fail(err, PRED_EDATA, t, 0, "column %zu is '%s', expected '%s'",
			                i + 1, t->header[i], columns[i]);
	return 0;
}

static int check_scale(const tsv_table *t, const tsv_row *row, pred_error *err)
{
	for (size_t i = 0; i < sizeof scales / sizeof scales[0]; i++)
		if (!strcmp(row->fields[C_SCALE], scales[i]))
			return 0;
	return tsv_fail(err, PRED_EDATA, t, row->line,
	                "scale '%s' is not water, dmso, thf or estimate", row->fields[C_SCALE]);
}

static int check_row(const tsv_table *t, const tsv_row *row, pred_error *err)
{
	const char *const required[] = {"name",      "conjugate_acid", "conjugate_acid_smiles",
	                                "byproduct", "hazards",        "source"};
	const int cols[] = {C_NAME, C_ACID, C_ACID_SMILES, C_BYPRODUCT, C_HAZARDS, C_SOURCE};
	for (size_t i = 0; i < sizeof cols / sizeof cols[0]; i++)
		if (!row->fields[cols[i]][0])
			return tsv_fail(err, PRED_EDATA, t, row->line, "empty %s", required[i]);
	const int flags[] = {C_ORGMET, C_ESCAPES};
	for (size_t i = 0; i < 2; i++) {
		const char *v = row->fields[flags[i]];
		if (strcmp(v, "0") && strcmp(v, "1"))
			return tsv_fail(err, PRED_EDATA, t, row->line, "%s '%s' is not 0 or 1",
			                columns[flags[i]], v);
	}
	return check_scale(t, row, err);
}

typedef struct unique_ctx {
	const pred_model *m;
	const tsv_table *t;
	const tsv_row *row;
	pred_error *err;
} unique_ctx;

static int alias_free(const char *alias, const void *ctx)
{
	const unique_ctx *u = ctx;
	if (base_table_find(u->m, alias) < 0 && !name_equal(alias, u->row->fields[C_NAME]))
		return 0;
	return tsv_fail(u->err, PRED_EDATA, u->t, u->row->line, "alias '%s' is taken", alias);
}

/* A name or alias already taken by an earlier row is an error (lookups must be unique). */
static int check_unique(const pred_model *m, const tsv_table *t, const tsv_row *row,
                        pred_error *err)
{
	unique_ctx u = {m, t, row, err};
	if (base_table_find(m, row->fields[C_NAME]) >= 0)
		return tsv_fail(err, PRED_EDATA, t, row->line, "duplicate base '%s'",
		                row->fields[C_NAME]);
	return each_alias(row->fields[C_ALIASES], alias_free, &u);
}

static int add_base(pred_model *m, const tsv_table *t, const tsv_row *row, double pka, double dmso,
                    pred_error *err)
{
	frag_base *grown = realloc(m->bases, (m->n_bases + 1) * sizeof *grown);
	if (!grown)
		return tsv_fail(err, PRED_ENOMEM, t, row->line, "out of memory");
	m->bases = grown;
	frag_base *b = &m->bases[m->n_bases++];
	char **const dst[] = {&b->name,  &b->aliases,   &b->conjugate_acid, &b->conj_smiles,
	                      &b->scale, &b->byproduct, &b->hazards,        &b->source};
	const int src[] = {C_NAME,  C_ALIASES,   C_ACID,    C_ACID_SMILES,
	                   C_SCALE, C_BYPRODUCT, C_HAZARDS, C_SOURCE};
	memset(b, 0, sizeof *b);
	b->pka = pka;
	b->pka_dmso = dmso;
	b->organometallic = row->fields[C_ORGMET][0] == '1';
	b->escapes = row->fields[C_ESCAPES][0] == '1';
	for (size_t i = 0; i < sizeof src / sizeof src[0]; i++)
		if (!(*dst[i] = strdup(row->fields[src[i]])))
			return tsv_fail(err, PRED_ENOMEM, t, row->line, "out of memory");
	return 0;
}

static int parse_row(pred_model *m, const tsv_table *t, const tsv_row *row, pred_error *err)
{
	double pka, dmso;
	int rc = check_row(t, row, err);
	if (!rc)
		rc = check_unique(m, t, row, err);
	if (!rc)
		rc = tsv_number(&pka, t, row, C_PKA, 0, 0, err);
	if (!rc)
		rc = tsv_number(&dmso, t, row, C_DMSO, 1, NAN, err);
	return rc ? rc : add_base(m, t, row, pka, dmso, err);
}

int base_table_parse(pred_model *m, const char *text, const char *file, pred_error *err)
{
	tsv_table t;
	int rc = tsv_parse(&t, text, file, err);
	if (rc)
		return rc;
	rc = check_header(&t, err);
	for (size_t i = 0; !rc && i < t.n_rows; i++)
		rc = parse_row(m, &t, &t.rows[i], err);
	if (!rc && !t.n_rows)
		rc = tsv_fail(err, PRED_EDATA, &t, 0, "no base rows");
	tsv_free(&t);
	return rc;
}
