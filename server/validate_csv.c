/* SPDX-License-Identifier: MIT */
/* validate_csv.c: a strict RFC 4180 CSV reader whose errors name file, line and column. */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "validate.h"

typedef struct cell {
	char *text;
	size_t line, col;
} cell;

struct srv_csv {
	char *name;
	size_t n_cols, n_rows, cap_rows;
	cell *header;
	cell *cells; /* n_rows * n_cols, row-major */
};

/* Parser state: position in the text plus the line/column of that position. */
typedef struct cursor {
	const char *p, *end;
	size_t line, col;
} cursor;

static int fail(pred_error *err, int code, const char *fmt, ...)
{
	if (err) {
		va_list ap;
		va_start(ap, fmt);
		err->code = code;
		vsnprintf(err->msg, sizeof err->msg, fmt, ap);
		va_end(ap);
	}
	return code;
}

static void advance(cursor *c)
{
	if (*c->p == '\n') {
		c->line++;
		c->col = 1;
	} else {
		c->col++;
	}
	c->p++;
}

/* True at the end of a record: LF, CRLF or end of text. */
static int at_eol(const cursor *c)
{
	return c->p >= c->end || *c->p == '\n' || (*c->p == '\r' && c->p + 1 < c->end &&
						   c->p[1] == '\n');
}

static int append(char **buf, size_t *len, size_t *cap, char ch)
{
	if (*len + 2 > *cap) {
		size_t ncap = *cap ? *cap * 2 : 32;
		char *nb = realloc(*buf, ncap);
		if (!nb)
			return -1;
		*buf = nb;
		*cap = ncap;
	}
	(*buf)[(*len)++] = ch;
	(*buf)[*len] = '\0';
	return 0;
}

/* Reads a quoted field body; the cursor is on the opening quote. */
static int read_quoted(cursor *c, char **buf, size_t *len, size_t *cap, const char *name,
		       pred_error *err)
{
	size_t line = c->line, col = c->col;
	advance(c);
	for (;;) {
		if (c->p >= c->end)
			return fail(err, PRED_EDATA, "%s:%zu:%zu: unterminated quoted field", name,
				    line, col);
		if (*c->p == '"') {
			if (c->p + 1 < c->end && c->p[1] == '"') {
				advance(c);
			} else {
				advance(c);
				break;
			}
		}
		if (append(buf, len, cap, *c->p))
			return fail(err, PRED_ENOMEM, "out of memory");
		advance(c);
	}
	if (!at_eol(c) && *c->p != ',')
		return fail(err, PRED_EDATA, "%s:%zu:%zu: unexpected character after closing quote",
			    name, c->line, c->col);
	return 0;
}

/* Reads one field into a fresh string; the cursor stops on ',' or at the end of record. */
static int read_field(cell *out, cursor *c, const char *name, pred_error *err)
{
	char *buf = NULL;
	size_t len = 0, cap = 0;
	int rc = 0;
	out->line = c->line;
	out->col = c->col;
	if (c->p < c->end && *c->p == '"') {
		rc = read_quoted(c, &buf, &len, &cap, name, err);
	} else {
		while (!rc && !at_eol(c) && *c->p != ',') {
			if (*c->p == '"')
				rc = fail(err, PRED_EDATA, "%s:%zu:%zu: quote inside an unquoted field",
					  name, c->line, c->col);
			else if (append(&buf, &len, &cap, *c->p))
				rc = fail(err, PRED_ENOMEM, "out of memory");
			else
				advance(c);
		}
	}
	if (!rc && !buf && !(buf = calloc(1, 1)))
		rc = fail(err, PRED_ENOMEM, "out of memory");
	if (rc) {
		free(buf);
		buf = NULL;
	}
	out->text = buf;
	return rc;
}

static void free_cells(cell *cs, size_t n)
{
	for (size_t i = 0; cs && i < n; i++)
		free(cs[i].text);
	free(cs);
}

/* Reads one record into *out (malloc'd array), *n fields. */
static int read_record(cell **out, size_t *n, cursor *c, const char *name, pred_error *err)
{
	cell *cs = NULL;
	size_t cnt = 0, cap = 0;
	int rc = 0;
	for (;;) {
		if (cnt == cap) {
			cell *ncs = realloc(cs, (cap = cap ? cap * 2 : 16) * sizeof *cs);
			if (!ncs) {
				rc = fail(err, PRED_ENOMEM, "out of memory");
				break;
			}
			cs = ncs;
		}
		if ((rc = read_field(&cs[cnt], c, name, err)))
			break;
		cnt++;
		if (at_eol(c))
			break;
		advance(c); /* the comma */
	}
	if (c->p < c->end && *c->p == '\r')
		advance(c);
	if (c->p < c->end)
		advance(c);
	if (rc) {
		free_cells(cs, cnt);
		cs = NULL;
		cnt = 0;
	}
	*out = cs;
	*n = cnt;
	return rc;
}

static int add_row(srv_csv *csv, cell *rec, size_t nf, pred_error *err)
{
	if (nf != csv->n_cols) {
		size_t line = rec[nf - 1].line, col = rec[nf - 1].col;
		free_cells(rec, nf);
		return fail(err, PRED_EDATA, "%s:%zu:%zu: expected %zu fields, got %zu", csv->name,
			    line, col, csv->n_cols, nf);
	}
	if (csv->n_rows == csv->cap_rows) {
		size_t ncap = csv->cap_rows ? csv->cap_rows * 2 : 64;
		cell *nc = realloc(csv->cells, ncap * csv->n_cols * sizeof *nc);
		if (!nc) {
			free_cells(rec, nf);
			return fail(err, PRED_ENOMEM, "out of memory");
		}
		csv->cells = nc;
		csv->cap_rows = ncap;
	}
	memcpy(csv->cells + csv->n_rows * csv->n_cols, rec, nf * sizeof *rec);
	free(rec);
	csv->n_rows++;
	return 0;
}

int srv_csv_parse(srv_csv **out, const char *name, const char *text, size_t len,
		  pred_error *err)
{
	srv_csv *csv = calloc(1, sizeof *csv);
	cursor c = {text, text + len, 1, 1};
	int rc = 0;
	*out = NULL;
	if (!csv || !(csv->name = strdup(name))) {
		rc = fail(err, PRED_ENOMEM, "out of memory");
		goto done;
	}
	if (len == 0) {
		rc = fail(err, PRED_EDATA, "%s:1:1: empty file, expected a header row", name);
		goto done;
	}
	if ((rc = read_record(&csv->header, &csv->n_cols, &c, name, err)))
		goto done;
	while (!rc && c.p < c.end) {
		cell *rec;
		size_t nf;
		if (*c.p == '\n' || *c.p == '\r') { /* blank line */
			read_record(&rec, &nf, &c, name, err);
			free_cells(rec, nf);
			continue;
		}
		if (!(rc = read_record(&rec, &nf, &c, name, err)))
			rc = add_row(csv, rec, nf, err);
	}
done:
	if (rc) {
		srv_csv_free(csv);
		csv = NULL;
	}
	*out = csv;
	return rc;
}

int srv_csv_load(srv_csv **out, const char *path, pred_error *err)
{
	FILE *f = fopen(path, "rb");
	char *buf = NULL;
	size_t len = 0, cap = 0, got;
	int rc = 0;
	*out = NULL;
	if (!f)
		return fail(err, PRED_EINVAL, "%s: cannot open file", path);
	do {
		if (len + 65536 > cap) {
			char *nb = realloc(buf, cap = cap * 2 + 65536);
			if (!nb) {
				rc = fail(err, PRED_ENOMEM, "out of memory");
				goto done;
			}
			buf = nb;
		}
		got = fread(buf + len, 1, cap - len, f);
		len += got;
	} while (got > 0);
	if (ferror(f)) {
		rc = fail(err, PRED_EINVAL, "%s: read error", path);
		goto done;
	}
	rc = srv_csv_parse(out, path, buf ? buf : "", len, err);
done:
	free(buf);
	fclose(f);
	return rc;
}

void srv_csv_free(srv_csv *c)
{
	if (!c)
		return;
	free_cells(c->header, c->n_cols);
	free_cells(c->cells, c->n_rows * c->n_cols);
	free(c->name);
	free(c);
}

size_t srv_csv_rows(const srv_csv *c) { return c->n_rows; }
size_t srv_csv_cols(const srv_csv *c) { return c->n_cols; }
const char *srv_csv_name(const srv_csv *c) { return c->name; }

int srv_csv_column(const srv_csv *c, const char *name)
{
	for (size_t i = 0; i < c->n_cols; i++)
		if (!strcmp(c->header[i].text, name))
			return (int)i;
	return -1;
}

const char *srv_csv_cell(const srv_csv *c, size_t row, int col)
{
	if (col < 0 || row >= c->n_rows)
		return "";
	return c->cells[row * c->n_cols + (size_t)col].text;
}

size_t srv_csv_line(const srv_csv *c, size_t row)
{
	return row < c->n_rows ? c->cells[row * c->n_cols].line : 0;
}

size_t srv_csv_colno(const srv_csv *c, size_t row, int col)
{
	if (col < 0 || row >= c->n_rows)
		return 0;
	return c->cells[row * c->n_cols + (size_t)col].col;
}
