/* SPDX-License-Identifier: MIT */
/* validate.h: reference CSV reading, per-class statistics and the parity plot of
 * `pkad validate` and `pkad fit` (server side: no chemistry here). */
#ifndef PKAD_VALIDATE_H
#define PKAD_VALIDATE_H

#include <stddef.h>
#include <stdio.h>

#include "predictor.h"

/* ---- CSV (RFC 4180: quoted fields, doubled quotes, CRLF or LF) ------------------------- */

typedef struct srv_csv srv_csv;

/** Parse CSV text; name is used in messages ("name:line:column: ..."). The first record is
 *  the header; every record must have as many fields. Free with srv_csv_free. */
int srv_csv_parse(srv_csv **out, const char *name, const char *text, size_t len,
		  pred_error *err);
/** Read and parse a file. */
int srv_csv_load(srv_csv **out, const char *path, pred_error *err);
void srv_csv_free(srv_csv *c);

size_t srv_csv_rows(const srv_csv *c);
size_t srv_csv_cols(const srv_csv *c);
/** Index of the header column with this name, or -1. */
int srv_csv_column(const srv_csv *c, const char *name);
/** Cell of data row `row` (0-based, header excluded); "" for col < 0; borrowed. */
const char *srv_csv_cell(const srv_csv *c, size_t row, int col);
/** 1-based line and column where a cell starts, for messages. */
size_t srv_csv_line(const srv_csv *c, size_t row);
size_t srv_csv_colno(const srv_csv *c, size_t row, int col);
const char *srv_csv_name(const srv_csv *c);

/* ---- reference rows -------------------------------------------------------------------- */

/** One experimental value. Strings are borrowed from the srv_csv. */
typedef struct srv_ref {
	const char *smiles;
	const char *name;       /* name column, else iupac_name, else entry, else "" */
	const char *site_class; /* site_class column or NULL */
	const char *split;      /* split column or "" */
	const char *tier;       /* tier column or "" */
	pred_kind kind;
	int pka_index;          /* 1-based; 1 when the column is absent */
	int n_steps;            /* highest pka_index of the file's rows of this molecule and kind */
	const pred_listed_steps *listed; /* those rows' distinct indices and values (same block) */
	double pka;
	size_t line;
} srv_ref;

/** Convert the rows of a reference CSV (columns smiles, pka, kind; optional pka_index,
 *  site_class, split, tier, name). A bad number or kind is an error naming file:line:column.
 *  *out is malloc'd (free()), *n its length. */
int srv_ref_read(srv_ref **out, size_t *n, const srv_csv *c, pred_error *err);

/** Match modes: SRV_MATCH_AUTO uses steps for files without a site_class column
 *  (compilation rows: kind is the book, pka_index numbers the molecule's measured steps)
 *  and kind for files with one (kind is the site's kind). */
enum { SRV_MATCH_AUTO = 0, SRV_MATCH_KIND = 1, SRV_MATCH_STEPS = 2 };
/** Mode of "auto", "kind" or "steps"; -1 for anything else. */
int srv_match_mode(const char *name);
/** Whether rows of this file are matched with pred_result_match_steps under `mode`. */
int srv_match_steps(int mode, const srv_csv *c);

/* ---- statistics ------------------------------------------------------------------------ */

/** Running figures of one set of rows. */
typedef struct srv_stat {
	size_t n_rows;   /* rows offered */
	size_t n_found;  /* rows with a matching site */
	size_t n_within; /* |residual| <= 1 */
	size_t n_calib;  /* |residual| <= reported uncertainty */
	double sse, sae, sum;
} srv_stat;

void srv_stat_add(srv_stat *s, double predicted, double reference, double uncertainty);
void srv_stat_add_missing(srv_stat *s);
double srv_stat_rmse(const srv_stat *s);
double srv_stat_mae(const srv_stat *s);
double srv_stat_bias(const srv_stat *s);       /* mean of predicted - reference */
double srv_stat_within1(const srv_stat *s);    /* share of found rows */
double srv_stat_coverage(const srv_stat *s);   /* found / offered */
double srv_stat_calibration(const srv_stat *s); /* share of found rows */

/** Statistics per class name, in order of first appearance. */
typedef struct srv_class_stats {
	size_t n;
	char **names;
	srv_stat *stats;
} srv_class_stats;

/** The entry for `name`, added when new; NULL on allocation failure. */
srv_stat *srv_class_stat(srv_class_stats *cs, const char *name);
void srv_class_stats_clear(srv_class_stats *cs);

/* ---- parity plot ----------------------------------------------------------------------- */

typedef struct srv_point {
	double reference, predicted;
	size_t cls; /* index into the class names */
} srv_point;

/** Writes an SVG parity plot: axes with ticks and labels, the 1:1 line, the +-1 band,
 *  points coloured by class and a legend. Returns 0 or -1 on a write error. */
int srv_plot_svg(FILE *f, const srv_point *pts, size_t n, char *const *class_names,
		 size_t n_classes, const char *title);


/* ---- a validation run ------------------------------------------------------------------ */

typedef enum srv_eval_status { SRV_EVAL_OK = 0, SRV_EVAL_NO_SITE, SRV_EVAL_UNREADABLE } srv_eval_status;

/** The outcome of one reference row. */
typedef struct srv_eval {
	const srv_ref *ref;
	const char *file;
	srv_eval_status status;
	double predicted, uncertainty;
	char cls[64];   /* class the row is scored under */
	char group[48]; /* group of the matched site, "" when none */
	char diag[160]; /* short diagnosis of the error (see validate_run.c) */
	char msg[300];  /* why the SMILES could not be read */
} srv_eval;

/** Every evaluated row plus the overall and per-class figures. */
typedef struct srv_validation {
	srv_stat all;
	srv_class_stats classes;
	srv_eval *evals;
	size_t n_evals, cap_evals;
	size_t n_unreadable;
} srv_validation;

/** Predicts the rows (all of them; filter before) and scores them; match_steps selects
 *  pred_result_match_steps over pred_result_match. Returns 0 or PRED_ENOMEM; unreadable
 *  SMILES are recorded, not errors. */
int srv_validation_add(srv_validation *v, pred_worker *w, const srv_ref *rows, size_t n,
		       const char *file, int match_steps);
void srv_validation_clear(srv_validation *v);
/** Indices of the scored rows sorted by |residual|, largest first; malloc'd (*n of them). */
size_t *srv_validation_worst(const srv_validation *v, size_t *n);

/** Reports: a text summary or a Markdown section (tables, worst rows, unreadable rows). */
void srv_validation_print_text(FILE *f, const srv_validation *v, size_t worst);
void srv_validation_print_markdown(FILE *f, const srv_validation *v, size_t worst,
				   const char *title);
/** Parity plot of the scored rows. */
int srv_validation_plot(const srv_validation *v, const char *path, const char *title);

#endif
