/* SPDX-License-Identifier: MIT */
/* tsv.h: reading the tab-separated fragment tables with file:line error messages. */
#ifndef PKAD_TSV_H
#define PKAD_TSV_H

#include <stddef.h>

#include "predictor.h"

typedef struct tsv_row {
	int line;      /* 1-based line number in the file */
	char **fields; /* n_cols fields, pointing into the table's copy of the text */
} tsv_row;

typedef struct tsv_table {
	char *text; /* owned copy, cut into fields in place */
	const char *file;
	char **header;
	size_t n_cols;
	tsv_row *rows;
	size_t n_rows;
} tsv_table;

/* Parse text (copied). Comment lines (#) and blank lines are skipped; the first other line is
 * the header; every row must have as many fields as the header. file names the table in
 * messages. Returns 0 or PRED_EDATA / PRED_ENOMEM with err set. */
int tsv_parse(tsv_table *out, const char *text, const char *file, pred_error *err);
void tsv_free(tsv_table *t);

/* Column index of name, or -1 with err set ("file: missing column 'x'"). */
int tsv_column(const tsv_table *t, const char *name, pred_error *err);

/* Parse a number field: empty gives dflt (when allow_empty) else an error naming file:line. */
int tsv_number(double *out, const tsv_table *t, const tsv_row *row, int col, int allow_empty,
	       double dflt, pred_error *err);

/* Set err to "file:line: message". Returns code. */
int tsv_fail(pred_error *err, int code, const tsv_table *t, int line, const char *fmt, ...);

#endif
