/* SPDX-License-Identifier: MIT */
/* tsv.c: a strict reader for the tab-separated tables of fragments/. */
#include <errno.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "tsv.h"

int tsv_fail(pred_error *err, int code, const tsv_table *t, int line, const char *fmt, ...)
{
	if (!err)
		return code;
	char detail[200];
	va_list ap;
	va_start(ap, fmt);
	vsnprintf(detail, sizeof detail, fmt, ap);
	va_end(ap);
	err->code = code;
	if (line > 0)
		snprintf(err->msg, sizeof err->msg, "%s:%d: %s", t->file, line, detail);
	else
		snprintf(err->msg, sizeof err->msg, "%s: %s", t->file, detail);
	return code;
}

static size_t split_fields(char *line, char **fields, size_t max)
{
	size_t n = 0;
	char *p = line;
	for (;;) {
		char *tab = strchr(p, '\t');
		if (n < max)
			fields[n] = p;
		n++;
		if (!tab)
			break;
		*tab = '\0';
		p = tab + 1;
	}
	return n;
}

static int is_blank(const char *s)
{
	for (; *s; s++)
		if (*s != ' ' && *s != '\r')
			return 0;
	return 1;
}

static int add_row(tsv_table *t, char *line, int lineno, pred_error *err)
{
	char **fields = calloc(t->n_cols, sizeof *fields);
	tsv_row *rows = realloc(t->rows, (t->n_rows + 1) * sizeof *rows);
	if (!fields || !rows) {
		free(fields);
		if (rows)
			t->rows = rows;
		return tsv_fail(err, PRED_ENOMEM, t, lineno, "out of memory");
	}
	t->rows = rows;
	size_t n = split_fields(line, fields, t->n_cols);
	if (n != t->n_cols) {
		free(fields);
		return tsv_fail(err, PRED_EDATA, t, lineno, "expected %zu columns, got %zu",
				t->n_cols, n);
	}
	t->rows[t->n_rows].line = lineno;
	t->rows[t->n_rows].fields = fields;
	t->n_rows++;
	return 0;
}

static int set_header(tsv_table *t, char *line, int lineno, pred_error *err)
{
	size_t n = 1;
	for (const char *p = line; *p; p++)
		n += *p == '\t';
	t->header = calloc(n, sizeof *t->header);
	if (!t->header)
		return tsv_fail(err, PRED_ENOMEM, t, lineno, "out of memory");
	t->n_cols = split_fields(line, t->header, n);
	return 0;
}

int tsv_parse(tsv_table *out, const char *text, const char *file, pred_error *err)
{
	memset(out, 0, sizeof *out);
	out->file = file;
	out->text = strdup(text);
	if (!out->text)
		return tsv_fail(err, PRED_ENOMEM, out, 0, "out of memory");
	int lineno = 0, rc = 0;
	char *save = NULL;
	for (char *p = out->text; p && !rc; p = save) {
		char *nl = strchr(p, '\n');
		save = nl ? nl + 1 : NULL;
		if (nl)
			*nl = '\0';
		lineno++;
		size_t len = strlen(p);
		if (len && p[len - 1] == '\r')
			p[len - 1] = '\0';
		if (p[0] == '#' || is_blank(p))
			continue;
		rc = out->header ? add_row(out, p, lineno, err) : set_header(out, p, lineno, err);
	}
	if (!rc && !out->header)
		rc = tsv_fail(err, PRED_EDATA, out, 0, "no header row");
	if (rc)
		tsv_free(out);
	return rc;
}

void tsv_free(tsv_table *t)
{
	for (size_t i = 0; i < t->n_rows; i++)
		free(t->rows[i].fields);
	free(t->rows);
	free(t->header);
	free(t->text);
	memset(t, 0, sizeof *t);
}

int tsv_column(const tsv_table *t, const char *name, pred_error *err)
{
	for (size_t i = 0; i < t->n_cols; i++)
		if (!strcmp(t->header[i], name))
			return (int)i;
	tsv_fail(err, PRED_EDATA, t, 0, "missing column '%s'", name);
	return -1;
}

int tsv_number(double *out, const tsv_table *t, const tsv_row *row, int col, int allow_empty,
	       double dflt, pred_error *err)
{
	const char *s = row->fields[col];
	if (!*s) {
		if (allow_empty) {
			*out = dflt;
			return 0;
		}
		return tsv_fail(err, PRED_EDATA, t, row->line, "empty '%s'", t->header[col]);
	}
	char *end;
	errno = 0;
	double v = strtod(s, &end);
	if (errno || *end)
		return tsv_fail(err, PRED_EDATA, t, row->line, "'%s' is not a number in column '%s'",
				s, t->header[col]);
	*out = v;
	return 0;
}
