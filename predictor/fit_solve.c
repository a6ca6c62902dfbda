/* SPDX-License-Identifier: MIT */
/* fit_solve.c: the weighted ridge least-squares step of `pkad fit`, solved with LAPACK. */
#include <lapacke.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "fit.h"

void fit_data_clear(fit_data *d)
{
	free(d->y);
	free(d->ufac);
	free(d->w);
	free(d->c);
	free(d->off);
	free(d->param);
	free(d->feat);
	free(d->fold);
	memset(d, 0, sizeof *d);
}

void fit_cols_clear(fit_cols *c)
{
	free(c->col_of);
	free(c->param_of);
	memset(c, 0, sizeof *c);
}

int fit_cols_build(fit_cols *out, const pred_model *m, const fit_data *d, int skip)
{
	memset(out, 0, sizeof *out);
	out->col_of = malloc((m->n_params + 1) * sizeof *out->col_of);
	out->param_of = malloc((m->n_params + 1) * sizeof *out->param_of);
	if (!out->col_of || !out->param_of) {
		fit_cols_clear(out);
		return PRED_ENOMEM;
	}
	for (size_t j = 0; j < m->n_params; j++)
		out->col_of[j] = -1;
	for (size_t k = 0; k < d->off[d->n]; k++) {
		int p = d->param[k];
		if (p < 0 || (size_t)p >= m->n_params || p == skip || out->col_of[p] >= 0)
			continue;
		if (m->params[p].prior_sd <= 0 || d->feat[k] == 0)
			continue;
		out->col_of[p] = (int)out->n;
		out->param_of[out->n++] = p;
	}
	return 0;
}

double fit_row_value(const pred_model *m, const fit_data *d, const fit_cols *cols,
		     const double *theta, size_t i)
{
	double v = d->c[i];
	for (size_t k = d->off[i]; k < d->off[i + 1]; k++) {
		int p = d->param[k];
		int col = p >= 0 && (size_t)p < m->n_params ? cols->col_of[p] : -1;
		double val = col >= 0 ? theta[col] : (p >= 0 ? m->params[p].value : 0);
		v += d->feat[k] * val;
	}
	return v;
}

double fit_huber(double r, double c)
{
	double a = fabs(r);
	return a <= c ? 0.5 * r * r : c * a - 0.5 * c * c;
}

/* One weighted ridge solve: rows scaled by sqrt(w * hw), then one prior row per column
 * (resid_sd / prior_sd) * (theta - prior) = 0. A is column-major, M x N. */
static int ridge_step(double *theta, const pred_model *m, const fit_data *d,
		      const fit_cols *cols, const unsigned char *use, const double *hw,
		      const pred_fit_options *opt)
{
	size_t nr = 0, N = cols->n, M, r = 0;
	double *A, *b;
	lapack_int info;
	for (size_t i = 0; i < d->n; i++)
		nr += !use || use[i];
	M = nr + N;
	A = calloc(M * N, sizeof *A);
	b = calloc(M, sizeof *b);
	if (!A || !b) {
		free(A);
		free(b);
		return PRED_ENOMEM;
	}
	for (size_t i = 0; i < d->n; i++) {
		double s, rhs;
		if (use && !use[i])
			continue;
		s = sqrt(d->w[i] * hw[i]);
		rhs = d->y[i] - d->c[i];
		for (size_t k = d->off[i]; k < d->off[i + 1]; k++) {
			int p = d->param[k], col = p >= 0 ? cols->col_of[p] : -1;
			if (col >= 0)
				A[(size_t)col * M + r] += s * d->feat[k];
			else if (p >= 0)
				rhs -= d->feat[k] * m->params[p].value;
		}
		b[r++] = s * rhs;
	}
	for (size_t j = 0; j < N; j++) {
		const pred_param *pp = &m->params[cols->param_of[j]];
		double s = opt->resid_sd / pp->prior_sd;
		A[j * M + r] = s;
		b[r++] = s * pp->prior;
	}
	info = LAPACKE_dgels(LAPACK_COL_MAJOR, 'N', (lapack_int)M, (lapack_int)N, 1, A,
			     (lapack_int)M, b, (lapack_int)M);
	if (info == 0)
		memcpy(theta, b, N * sizeof *theta);
	free(A);
	free(b);
	return info == 0 ? 0 : PRED_EINTERNAL;
}

int fit_solve(double *theta, const pred_model *m, const fit_data *d, const fit_cols *cols,
	      const unsigned char *use, const pred_fit_options *opt, pred_error *err)
{
	double *hw = malloc((d->n + 1) * sizeof *hw);
	int rc = 0;
	if (!hw)
		return PRED_ENOMEM;
	for (size_t i = 0; i < d->n; i++)
		hw[i] = 1.0;
	for (size_t j = 0; j < cols->n; j++)
		theta[j] = m->params[cols->param_of[j]].value;
	/* Iteratively reweighted: rows far off (tautomers drawn wrongly, data errors) get
	 * Huber weights c/|r| so that they cannot drag a class's parameters. */
	for (int it = 0; it < 4 && !rc; it++) {
		if ((rc = ridge_step(theta, m, d, cols, use, hw, opt)))
			break;
		for (size_t i = 0; i < d->n; i++) {
			double res = fabs(fit_row_value(m, d, cols, theta, i) - d->y[i]);
			hw[i] = res <= opt->huber ? 1.0 : opt->huber / res;
		}
	}
	if (rc && err) {
		err->code = rc;
		strcpy(err->msg, rc == PRED_ENOMEM ? "out of memory"
						   : "least-squares solve failed (rank deficient)");
	}
	free(hw);
	return rc;
}
