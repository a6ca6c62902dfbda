/* SPDX-License-Identifier: MIT */
/* fit.c: `pkad fit`: refits the model's free parameters on training rows (ridge towards the
 * published priors), with an outer search of the fall-off factor and k-fold class rmse. */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "fit.h"
#include "model.h"
#include "predictor.h"

void pred_fit_options_init(pred_fit_options *opt)
{
	opt->folds = 5;
	opt->resid_sd = 0;
	opt->huber = 1.0;
	opt->trim = 3.0;
	opt->unc_quantile = 0.68;
	opt->search_falloff = 1;
	opt->falloff_lo = 0.30;
	opt->falloff_hi = 0.60;
	opt->falloff_sd = 0.1;
}

static int set_err(pred_error *err, int code, const char *msg)
{
	if (err) {
		err->code = code;
		snprintf(err->msg, sizeof err->msg, "%s", msg);
	}
	return code;
}

/* Folds follow the molecule (FNV-1a of the SMILES) so that the steps of one molecule are
 * held out together. */
static unsigned fold_of(const char *smiles, int folds)
{
	uint32_t h = 2166136261u;
	for (const unsigned char *p = (const unsigned char *)smiles; *p && *p != ' '; p++)
		h = (h ^ *p) * 16777619u;
	return folds > 1 ? h % (unsigned)folds : 0;
}

/* realloc in place or return PRED_ENOMEM (the old block stays valid and owned). */
#define GROW_OR_FAIL(ptr, count)                                                           \
	do {                                                                               \
		void *t_ = realloc((ptr), (count) * sizeof *(ptr));                        \
		if (!t_)                                                                   \
			return PRED_ENOMEM;                                                \
		(ptr) = t_;                                                                \
	} while (0)

/* Makes room for `rows` rows and `nnz` design entries (capacities double). */
static int grow(fit_data *d, size_t rows, size_t nnz)
{
	if (rows + 1 > d->cap) {
		size_t cap = d->cap ? d->cap * 2 : 256;
		GROW_OR_FAIL(d->y, cap);
		GROW_OR_FAIL(d->w, cap);
		GROW_OR_FAIL(d->c, cap);
		GROW_OR_FAIL(d->ufac, cap);
		GROW_OR_FAIL(d->fold, cap);
		GROW_OR_FAIL(d->off, cap + 1);
		d->cap = cap;
	}
	if (nnz + 1 > d->cap_nnz) {
		size_t cap = d->cap_nnz ? d->cap_nnz * 2 : 1024;
		while (cap < nnz + 1)
			cap *= 2;
		GROW_OR_FAIL(d->param, cap);
		GROW_OR_FAIL(d->feat, cap);
		d->cap_nnz = cap;
	}
	return 0;
}

/* Appends the design of the matched site of one row; 1 when the row has no such site. */
static int add_row(fit_data *d, const pred_result *r, const pred_fit_row *row, int folds)
{
	long s = !row->match_steps ? pred_result_match(r, row->kind, row->pka_index)
		 : row->listed ? pred_result_match_listed(r, row->kind, row->pka_index, row->listed)
			       : pred_result_match_steps(r, row->kind, row->pka_index, row->n_steps);
	pred_design des;
	size_t base = d->n ? d->off[d->n] : 0;
	if (s < 0)
		return 1;
	pred_result_design(r, (size_t)s, &des);
	if (grow(d, d->n + 1, base + des.n))
		return PRED_ENOMEM;
	if (d->n == 0)
		d->off[0] = 0;
	for (size_t k = 0; k < des.n; k++) {
		d->param[base + k] = des.param[k];
		d->feat[base + k] = des.feature[k];
	}
	d->y[d->n] = row->pka;
	d->w[d->n] = row->weight > 0 ? row->weight : 1.0;
	d->c[d->n] = des.constant;
	d->ufac[d->n] = des.unc_factor > 0 ? des.unc_factor : 1.0;
	d->fold[d->n] = fold_of(row->smiles, folds);
	d->off[++d->n] = base + des.n;
	return 0;
}

/* Predicts every row with the model's current values and collects the designs. */
static int collect(fit_data *d, pred_model *m, const pred_fit_row *rows, size_t n,
		   const pred_fit_options *opt, pred_error *err)
{
	pred_worker *w = NULL;
	pred_options po;
	int rc;
	memset(d, 0, sizeof *d);
	if ((rc = pred_worker_new(&w, m, err)))
		return rc;
	pred_options_init(&po);
	for (size_t i = 0; i < n && rc >= 0; i++) {
		pred_result *r = NULL;
		pred_error e;
		if (pred_predict(&r, w, rows[i].smiles, PRED_FMT_SMILES, &po, &e)) {
			d->n_unreadable++;
			continue;
		}
		rc = add_row(d, r, &rows[i], opt->folds);
		d->n_unmatched += rc == 1;
		rc = rc == 1 ? 0 : rc;
		pred_result_free(r);
	}
	pred_worker_free(w);
	if (rc < 0) {
		fit_data_clear(d);
		return set_err(err, rc, "out of memory");
	}
	return 0;
}

/* One fit at fall-off f: collect the designs, choose the columns and solve. *obj is the
 * penalised objective (Huber loss of the residuals in units of resid_sd plus the priors). */
typedef struct fit_state {
	fit_data d;
	fit_cols cols;
	double *theta;
	double obj, falloff;
	double loss_now; /* penalised loss of the model's values as they stood at collection */
	size_t n_trimmed;
} fit_state;

static double value_now(const pred_model *m, const fit_data *d, size_t i)
{
	double v = d->c[i];
	for (size_t k = d->off[i]; k < d->off[i + 1]; k++)
		v += d->feat[k] * (d->param[k] >= 0 ? m->params[d->param[k]].value : 0);
	return v;
}

/* Rows far off under the starting values get weight 0: no parameter of the model can
 * explain a missing site class, a mis-drawn tautomer or a data error, and such rows would
 * drag the class they happen to match. Returns how many. */
static size_t trim_rows(fit_data *d, const pred_model *m, double trim)
{
	size_t n = 0;
	for (size_t i = 0; trim > 0 && i < d->n; i++)
		if (fabs(value_now(m, d, i) - d->y[i]) > trim) {
			d->w[i] = 0;
			n++;
		}
	return n;
}

static void state_clear(fit_state *s)
{
	fit_data_clear(&s->d);
	fit_cols_clear(&s->cols);
	free(s->theta);
	memset(s, 0, sizeof *s);
}

static double objective(const pred_model *m, const fit_state *s, const pred_fit_options *opt)
{
	double J = 0, sd2 = opt->resid_sd * opt->resid_sd;
	for (size_t i = 0; i < s->d.n; i++) {
		double r = fit_row_value(m, &s->d, &s->cols, s->theta, i) - s->d.y[i];
		J += s->d.w[i] * fit_huber(r, opt->huber) / sd2;
	}
	for (size_t j = 0; j < s->cols.n; j++) {
		const pred_param *p = &m->params[s->cols.param_of[j]];
		double z = (s->theta[j] - p->prior) / p->prior_sd;
		J += 0.5 * z * z;
	}
	if (m->p_falloff >= 0 && opt->search_falloff) {
		const pred_param *p = &m->params[m->p_falloff];
		double sd = p->prior_sd > 0 ? p->prior_sd : opt->falloff_sd;
		double z = (s->falloff - p->prior) / sd;
		J += 0.5 * z * z;
	}
	return J;
}

/* The penalised loss of the model's values as they stand, from a fresh collection: the
 * designs are exact there, so this also sees what the linear step cannot (a site order
 * that flips and changes a stepwise term). All rows count; Huber bounds the outliers. */
static double loss_now(const pred_model *m, const fit_data *d, double falloff,
		       const pred_fit_options *opt)
{
	double J = 0, sd2 = opt->resid_sd * opt->resid_sd;
	for (size_t i = 0; i < d->n; i++)
		J += d->w[i] * fit_huber(value_now(m, d, i) - d->y[i], opt->huber) / sd2;
	for (size_t p = 0; p < m->n_params; p++) {
		const pred_param *q = &m->params[p];
		if ((int)p != m->p_falloff && q->prior_sd > 0)
			J += 0.5 * ((q->value - q->prior) / q->prior_sd) * ((q->value - q->prior) / q->prior_sd);
	}
	if (m->p_falloff >= 0 && opt->search_falloff) {
		const pred_param *q = &m->params[m->p_falloff];
		double sd = q->prior_sd > 0 ? q->prior_sd : opt->falloff_sd;
		J += 0.5 * ((falloff - q->prior) / sd) * ((falloff - q->prior) / sd);
	}
	return J;
}

/* resid_sd <= 0: the residual sd of the untrimmed rows at the start (at least 0.2), so that the
 * ridge weighs the priors against the data as the data's own scatter says. */
static void estimate_resid_sd(pred_fit_options *opt, const pred_model *m, const fit_data *d)
{
	double sw = 0, s = 0;
	for (size_t i = 0; i < d->n; i++) {
		double r = value_now(m, d, i) - d->y[i];
		if (opt->trim > 0 && fabs(r) > opt->trim)
			continue;
		s += d->w[i] * r * r;
		sw += d->w[i];
	}
	opt->resid_sd = sw > 0 && sqrt(s / sw) > 0.2 ? sqrt(s / sw) : 0.2;
}

static int evaluate(fit_state *s, pred_model *m, double falloff, const pred_fit_row *rows,
		    size_t n, pred_fit_options *opt, pred_error *err)
{
	int rc;
	state_clear(s);
	s->falloff = falloff;
	if (m->p_falloff >= 0)
		m->params[m->p_falloff].value = falloff;
	if ((rc = collect(&s->d, m, rows, n, opt, err)))
		return rc;
	if (opt->resid_sd <= 0)
		estimate_resid_sd(opt, m, &s->d);
	s->loss_now = loss_now(m, &s->d, falloff, opt);
	s->n_trimmed = trim_rows(&s->d, m, opt->trim);
	if (s->d.n == 0)
		return set_err(err, PRED_EINVAL, "no training row has a matching site");
	if ((rc = fit_cols_build(&s->cols, m, &s->d, m->p_falloff)))
		return set_err(err, rc, "out of memory");
	if (!(s->theta = calloc(s->cols.n + 1, sizeof *s->theta)))
		return set_err(err, PRED_ENOMEM, "out of memory");
	if (s->cols.n && (rc = fit_solve(s->theta, m, &s->d, &s->cols, NULL, opt, err)))
		return rc;
	s->obj = objective(m, s, opt);
	return 0;
}

/* Golden-section search of the fall-off over [lo, hi]; leaves the best state in *best. */
static int search_falloff(fit_state *best, pred_model *m, const pred_fit_row *rows, size_t n,
			  pred_fit_options *opt, pred_error *err)
{
	const double g = 0.6180339887498949;
	double a = opt->falloff_lo, b = opt->falloff_hi, x1, x2, f1, f2;
	fit_state s = {0};
	int rc;
	x1 = b - g * (b - a);
	x2 = a + g * (b - a);
	if ((rc = evaluate(&s, m, x1, rows, n, opt, err)))
		goto done;
	f1 = s.obj;
	if ((rc = evaluate(&s, m, x2, rows, n, opt, err)))
		goto done;
	f2 = s.obj;
	for (int it = 0; it < 7; it++) {
		if (f1 < f2) {
			b = x2, x2 = x1, f2 = f1, x1 = b - g * (b - a);
			if ((rc = evaluate(&s, m, x1, rows, n, opt, err)))
				goto done;
			f1 = s.obj;
		} else {
			a = x1, x1 = x2, f1 = f2, x2 = a + g * (b - a);
			if ((rc = evaluate(&s, m, x2, rows, n, opt, err)))
				goto done;
			f2 = s.obj;
		}
	}
	rc = evaluate(best, m, f1 < f2 ? x1 : x2, rows, n, opt, err);
done:
	state_clear(&s);
	return rc;
}

/* k-fold cross-validation: each row's residual when its fold was left out. */
static int cross_validate(double *cv, const pred_model *m, const fit_state *s,
			  const pred_fit_options *opt, pred_error *err)
{
	unsigned char *use = malloc(s->d.n + 1);
	double *th = malloc((s->cols.n + 1) * sizeof *th);
	int rc = 0;
	if (!use || !th) {
		rc = set_err(err, PRED_ENOMEM, "out of memory");
		goto done;
	}
	for (int f = 0; f < (opt->folds > 1 ? opt->folds : 1) && !rc; f++) {
		for (size_t i = 0; i < s->d.n; i++)
			use[i] = opt->folds > 1 && s->d.fold[i] != (unsigned)f;
		if (s->cols.n && (rc = fit_solve(th, m, &s->d, &s->cols, use, opt, err)))
			break;
		for (size_t i = 0; i < s->d.n; i++)
			if (!use[i])
				cv[i] = fit_row_value(m, &s->d, &s->cols, th, i) - s->d.y[i];
	}
done:
	free(use);
	free(th);
	return rc;
}

/* Weighted rms residual of the kept rows with the model's values as they stand. */
static double rmse_current(const pred_model *m, const fit_data *d)
{
	double sw = 0, s = 0;
	for (size_t i = 0; i < d->n; i++) {
		double r = value_now(m, d, i) - d->y[i];
		s += d->w[i] * r * r;
		sw += d->w[i];
	}
	return sw > 0 ? sqrt(s / sw) : NAN;
}

typedef struct wres {
	double abs_res, w;
} wres;

static int by_abs_res(const void *a, const void *b)
{
	double x = ((const wres *)a)->abs_res, y = ((const wres *)b)->abs_res;
	return x < y ? -1 : x > y;
}

/* The class error of parameter p from the cv residuals of the kept rows that use it: the
 * weighted q-quantile of |residual| / (the row's widening factor) (q = 0.68: about one sd,
 * robust to the long tail of the broad set; weights as in the fit), or their weighted rms
 * when q is 0. Returns the rows. */
static int class_error(double *out, wres *buf, const fit_state *s, const double *cv,
		       size_t p, double q)
{
	double sse = 0, sw = 0, acc = 0;
	int n = 0;
	for (size_t i = 0; i < s->d.n; i++) {
		if (s->d.w[i] <= 0)
			continue;
		for (size_t k = s->d.off[i]; k < s->d.off[i + 1]; k++)
			if (s->d.param[k] == (int)p && s->d.feat[k] != 0) {
				double z = cv[i] / s->d.ufac[i];
				buf[n++] = (wres){fabs(z), s->d.w[i]};
				sse += s->d.w[i] * z * z;
				sw += s->d.w[i];
				break;
			}
	}
	if (n == 0)
		return 0;
	*out = sqrt(sse / sw);
	if (q <= 0)
		return n;
	qsort(buf, (size_t)n, sizeof *buf, by_abs_res);
	for (int i = 0; i < n; i++) {
		*out = buf[i].abs_res;
		if ((acc += buf[i].w) >= q * sw)
			break;
	}
	return n;
}

/* Marks the fitted columns, then stores per parameter the rows that used it and their
 * cross-validated class error (for a site class's parent: the class's uncertainty). */
static int store(pred_model *m, pred_fit_report *rep, const fit_state *s, const double *cv,
		 double q)
{
	wres *buf = malloc((s->d.n + 1) * sizeof *buf);
	if (!buf)
		return PRED_ENOMEM;
	for (size_t j = 0; j < s->cols.n; j++)
		rep->fitted[s->cols.param_of[j]] = 1;
	for (size_t p = 0; p < m->n_params; p++) {
		double e = 0;
		int n = class_error(&e, buf, s, cv, p, q);
		if (n == 0)
			continue;
		m->params[p].rmse_cv = e;
		if (rep->fitted[p])
			m->params[p].n = n;
		else
			rep->fitted[p] = 2; /* written for its class error only */
	}
	free(buf);
	return 0;
}

/* rms of the cross-validated residuals of the rows kept (weight > 0). */
static double rms_kept(const double *v, const fit_data *d)
{
	double s = 0;
	size_t n = 0;
	for (size_t i = 0; i < d->n; i++)
		if (d->w[i] > 0) {
			s += v[i] * v[i];
			n++;
		}
	return n ? sqrt(s / (double)n) : NAN;
}

static double *save_values(const pred_model *m)
{
	double *v = malloc((m->n_params + 1) * sizeof *v);
	for (size_t p = 0; v && p < m->n_params; p++)
		v[p] = m->params[p].value;
	return v;
}

static void load_values(pred_model *m, const double *v)
{
	for (size_t p = 0; p < m->n_params; p++)
		m->params[p].value = v[p];
}

/* Relinearise: put the solved values in force, collect again (exact designs, stepwise terms
 * recomputed) and keep them only while the penalised loss falls; then solve again from
 * there. Leaves the best values in m and their collection in *s. */
static int refine(fit_state *s, pred_model *m, double *best, double best_loss,
		  const pred_fit_row *rows, size_t n, pred_fit_options *opt, pred_error *err)
{
	double best_f = m->p_falloff >= 0 ? m->params[m->p_falloff].value : 0, f;
	int rc = 0;
	for (int round = 0; round < 4 && !rc; round++) {
		f = s->falloff;
		for (size_t j = 0; j < s->cols.n; j++)
			m->params[s->cols.param_of[j]].value = s->theta[j];
		if ((rc = evaluate(s, m, f, rows, n, opt, err)))
			break;
		if (!(s->loss_now < best_loss - 1e-6 * fabs(best_loss)))
			break;
		best_loss = s->loss_now;
		best_f = f;
		for (size_t p = 0; p < m->n_params; p++)
			best[p] = m->params[p].value;
	}
	if (rc)
		return rc;
	load_values(m, best);
	return evaluate(s, m, best_f, rows, n, opt, err);
}

static int fit_run(pred_fit_report *rep, pred_model *m, const pred_fit_row *rows, size_t n,
		   pred_fit_options *opt, pred_error *err)
{
	fit_state s = {0};
	double *cv = NULL, *start = save_values(m), *best = save_values(m), start_loss;
	int search = opt->search_falloff && m->p_falloff >= 0;
	int rc = start && best ? evaluate(&s, m, m->p_falloff >= 0 ? start[m->p_falloff] : 0,
					  rows, n, opt, err)
			       : set_err(err, PRED_ENOMEM, "out of memory");
	if (rc)
		goto done;
	rep->sum.rmse_before = rmse_current(m, &s.d);
	start_loss = s.loss_now;
	if ((search && (rc = search_falloff(&s, m, rows, n, opt, err))) ||
	    (rc = refine(&s, m, best, start_loss, rows, n, opt, err)))
		goto done;
	if (!(cv = calloc(s.d.n + 1, sizeof *cv))) {
		rc = set_err(err, PRED_ENOMEM, "out of memory");
		goto done;
	}
	if ((rc = cross_validate(cv, m, &s, opt, err)))
		goto done;
	if ((rc = store(m, rep, &s, cv, opt->unc_quantile))) {
		set_err(err, rc, "out of memory");
		goto done;
	}
	if (search) {
		m->params[m->p_falloff].n = (int)(s.d.n - s.n_trimmed);
		if (m->params[m->p_falloff].prior_sd <= 0)
			m->params[m->p_falloff].prior_sd = opt->falloff_sd;
		rep->fitted[m->p_falloff] = 1;
	}
	rep->sum = (pred_fit_summary){n, s.d.n - s.n_trimmed, s.d.n_unreadable, s.d.n_unmatched,
				      s.n_trimmed, s.cols.n + (size_t)search, rep->sum.rmse_before,
				      rmse_current(m, &s.d), rms_kept(cv, &s.d), s.falloff,
				      opt->resid_sd, opt->folds, opt->unc_quantile};
done:
	if (rc && start)
		load_values(m, start);
	free(start);
	free(best);
	free(cv);
	state_clear(&s);
	return rc;
}

int pred_fit(pred_fit_report **out, pred_model *m, const pred_fit_row *rows, size_t n_rows,
	     const pred_fit_options *opt, pred_error *err)
{
	pred_fit_options def, o;
	pred_fit_report *rep = calloc(1, sizeof *rep);
	int rc;
	*out = NULL;
	if (!opt) {
		pred_fit_options_init(&def);
		opt = &def;
	}
	if (!rep || !(rep->fitted = calloc(m->n_params + 1, 1))) {
		pred_fit_report_free(rep);
		return set_err(err, PRED_ENOMEM, "out of memory");
	}
	rep->n_params = m->n_params;
	o = *opt;
	if ((rc = fit_run(rep, m, rows, n_rows, &o, err))) {
		pred_fit_report_free(rep);
		return rc;
	}
	*out = rep;
	return 0;
}

void pred_fit_report_free(pred_fit_report *rep)
{
	if (!rep)
		return;
	free(rep->fitted);
	free(rep);
}

void pred_fit_report_summary(const pred_fit_report *rep, pred_fit_summary *out)
{
	*out = rep->sum;
}
