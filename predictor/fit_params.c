/* SPDX-License-Identifier: MIT */
/* fit_params.c: writes fragments/params.tsv from a fit, keeping rows the fit did not touch. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "fit.h"

static int set_err(pred_error *err, int code, const char *what, const char *path)
{
	if (err) {
		err->code = code;
		/* a long path is cut, not overflowed */
		snprintf(err->msg, sizeof err->msg, "%.160s: %.80s", path, what);
	}
	return code;
}

/* True when the data line's id (first field) is a parameter this fit set. */
static int is_refit(const pred_model *m, const pred_fit_report *rep, const char *line)
{
	size_t len = strcspn(line, "\t\r\n");
	for (size_t p = 0; p < m->n_params && p < rep->n_params; p++)
		if (rep->fitted[p] && strlen(m->params[p].id) == len &&
		    !strncmp(m->params[p].id, line, len))
			return 1;
	return 0;
}

/* Comment lines that a previous `pkad fit` wrote (replaced, not kept). */
static int own_comment(const char *line)
{
	static const char *const mine[] = {"# params.tsv: fitted parameters, written by",
					   "# params_version:", "# data_version:", "# fitted on",
					   "# fit:", "# weighted train", "# rmse_cv:"};
	for (size_t i = 0; i < sizeof mine / sizeof mine[0]; i++)
		if (!strncmp(line, mine[i], strlen(mine[i])))
			return 1;
	return 0;
}

/* Copies from the old file either its foreign comment lines (comments != 0) or the data rows
 * that the fit left alone (other helpers' rows, e.g. global.interaction*). */
static void keep_old(FILE *out, const pred_model *m, const pred_fit_report *rep,
		     const char *text, int comments)
{
	const char *p = text;
	int header_seen = 0;
	while (p && *p) {
		const char *nl = strchr(p, '\n');
		size_t len = nl ? (size_t)(nl - p) + 1 : strlen(p);
		int keep = 0;
		if (*p == '#')
			keep = comments && !own_comment(p);
		else if (*p != '\n' && *p != '\r' && !header_seen++)
			keep = 0; /* the column header row */
		else if (*p != '\n' && *p != '\r')
			keep = !comments && !is_refit(m, rep, p);
		if (keep) {
			fwrite(p, 1, len, out);
			if (!nl)
				fputc('\n', out);
		}
		p = nl ? nl + 1 : NULL;
	}
}

static char *slurp(const char *path)
{
	FILE *f = fopen(path, "rb");
	char *buf = NULL;
	long n;
	if (!f)
		return NULL;
	if (fseek(f, 0, SEEK_END) == 0 && (n = ftell(f)) >= 0 && fseek(f, 0, SEEK_SET) == 0 &&
	    (buf = malloc((size_t)n + 1))) {
		size_t got = fread(buf, 1, (size_t)n, f);
		buf[got] = '\0';
	}
	fclose(f);
	return buf;
}

static void write_header(FILE *f, const pred_fit_report *rep, const char *data_version)
{
	char date[32];
	time_t now = time(NULL);
	struct tm tm;
	const pred_fit_summary *s = &rep->sum;
	gmtime_r(&now, &tm);
	strftime(date, sizeof date, "%Y-%m-%d", &tm);
	fprintf(f, "# params.tsv: fitted parameters, written by `pkad fit` on %s; do not edit the "
		   "fitted rows by hand (refit instead)\n", date);
	fprintf(f, "# params_version: fit-%s\n# data_version: %s\n", date, data_version);
	fprintf(f, "# fitted on the train split only; derived from the reference data under data/ "
		   "(sources and licences in data/README.md)\n");
	if (s->unc_quantile > 0)
		fprintf(f, "# rmse_cv: class error of the rows using the parameter from %d-fold "
			   "cross-validation: the weighted %.0f%% quantile of |residual|\n", s->folds,
			100 * s->unc_quantile);
	else
		fprintf(f, "# rmse_cv: rms cross-validated residual (%d-fold) of the rows using the "
			   "parameter\n", s->folds);
	fprintf(f, "# fit: %zu rows offered, %zu used, %zu unreadable, %zu without a matching "
		   "site, %zu trimmed (far off at the start); %zu parameters\n", s->n_rows,
		s->n_used, s->n_unreadable, s->n_unmatched, s->n_trimmed, s->n_params);
	fprintf(f, "# weighted train rmse %.3f before, %.3f after; k-fold cross-validated rmse "
		   "%.3f; fall-off %.3f; priors weighed against residual sd %.3f\n",
		s->rmse_before, s->rmse_after, s->rmse_cv, s->falloff, s->resid_sd);
}

int pred_fit_write_params(const pred_model *m, const pred_fit_report *rep, const char *path,
			  const char *data_version, pred_error *err)
{
	char *old = slurp(path), tmp[4096];
	FILE *f;
	int rc = 0;
	if (snprintf(tmp, sizeof tmp, "%s.tmp", path) >= (int)sizeof tmp) {
		free(old);
		return set_err(err, PRED_EINVAL, "path too long", path);
	}
	if (!(f = fopen(tmp, "w"))) {
		free(old);
		return set_err(err, PRED_EINVAL, "cannot write file", tmp);
	}
	write_header(f, rep, data_version ? data_version : "unknown");
	if (old)
		keep_old(f, m, rep, old, 1);
	fprintf(f, "id\tvalue\tprior\tprior_sd\tn\trmse_cv\tnote\n");
	for (size_t p = 0; p < m->n_params && p < rep->n_params; p++) {
		const pred_param *q = &m->params[p];
		if (rep->fitted[p])
			fprintf(f, "%s\t%.4f\t%.4f\t%.4f\t%d\t%.3f\t%s\n", q->id, q->value,
				q->prior, q->prior_sd, q->n, q->rmse_cv,
				rep->fitted[p] == 1 ? "fitted" : "not fitted; class rmse only");
	}
	if (old)
		keep_old(f, m, rep, old, 0);
	if (fclose(f) != 0 || rename(tmp, path) != 0)
		rc = set_err(err, PRED_EINVAL, "cannot write file", path);
	free(old);
	return rc;
}
