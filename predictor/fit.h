/* SPDX-License-Identifier: MIT */
/* fit.h: private pieces of `pkad fit` shared by fit.c, fit_solve.c and fit_params.c. */
#ifndef PKAD_FIT_H
#define PKAD_FIT_H

#include <stddef.h>

#include "model.h"
#include "predictor.h"

/* The linear design of every usable training row at one fall-off value: the row's
 * predicted pKa is c[i] + sum over k in off[i]..off[i+1] of feat[k] * value[param[k]]. */
typedef struct fit_data {
	size_t n;          /* usable rows */
	double *y, *w, *c; /* experimental pKa, weight, constant */
	double *ufac;      /* the site's uncertainty widening factor (pred_design) */
	size_t *off;       /* n + 1 offsets into param/feat */
	int *param;
	double *feat;
	unsigned *fold;    /* cross-validation fold of each row (by molecule) */
	size_t n_unreadable, n_unmatched;
	size_t cap, cap_nnz; /* allocated rows and design entries */
} fit_data;

void fit_data_clear(fit_data *d);

/* The free parameters: col_of[param] is the column (or -1), param_of[col] the parameter. */
typedef struct fit_cols {
	size_t n;
	int *col_of;
	int *param_of;
} fit_cols;

/* Columns of the parameters with prior_sd > 0 that some row uses, except skip (-1: none). */
int fit_cols_build(fit_cols *out, const pred_model *m, const fit_data *d, int skip);
void fit_cols_clear(fit_cols *c);

/* Ridge-regularised, Huber-reweighted weighted least squares on the rows with
 * use[i] != 0 (use NULL: all). Writes the column values into theta[cols->n], starting
 * from the model's values. Returns 0 or a PRED_E*. */
int fit_solve(double *theta, const pred_model *m, const fit_data *d, const fit_cols *cols,
	      const unsigned char *use, const pred_fit_options *opt, pred_error *err);

/* Predicted pKa of row i with the model's values, overridden by theta for free columns. */
double fit_row_value(const pred_model *m, const fit_data *d, const fit_cols *cols,
		     const double *theta, size_t i);

/* Huber loss of residual r at threshold c. */
double fit_huber(double r, double c);

/* What pred_fit learned, kept for pred_fit_write_params. */
struct pred_fit_report {
	pred_fit_summary sum;
	size_t n_params;
	unsigned char *fitted; /* per parameter: 1 fitted, 2 rmse_cv only, 0 untouched */
};

#endif
