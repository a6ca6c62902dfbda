/* SPDX-License-Identifier: MIT */
/* validate_print.c: text and Markdown reports of a validation run, and its parity plot. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "validate.h"

enum { FIG_PLAIN, FIG_SIGNED, FIG_PERCENT };

/* A figure as text, "-" when the set is empty (NAN). */
static void fig(char *buf, size_t n, int style, double v)
{
	if (isnan(v))
		snprintf(buf, n, "-");
	else if (style == FIG_PERCENT)
		snprintf(buf, n, "%.0f%%", 100 * v);
	else if (style == FIG_SIGNED)
		snprintf(buf, n, "%+.2f", v);
	else
		snprintf(buf, n, "%.2f", v);
}

static void stat_row(FILE *f, const char *name, const srv_stat *s, int md)
{
	char a[6][24];
	fig(a[0], 24, FIG_PLAIN, srv_stat_rmse(s));
	fig(a[1], 24, FIG_PLAIN, srv_stat_mae(s));
	fig(a[2], 24, FIG_PERCENT, srv_stat_within1(s));
	fig(a[3], 24, FIG_SIGNED, srv_stat_bias(s));
	fig(a[4], 24, FIG_PERCENT, srv_stat_coverage(s));
	fig(a[5], 24, FIG_PERCENT, srv_stat_calibration(s));
	if (md)
		fprintf(f, "| %s | %zu | %zu | %s | %s | %s | %s | %s | %s |\n", name, s->n_rows,
			s->n_found, a[0], a[1], a[2], a[3], a[4], a[5]);
	else
		fprintf(f, "%-26s %5zu %5zu %6s %6s %6s %6s %6s %6s\n", name, s->n_rows,
			s->n_found, a[0], a[1], a[2], a[3], a[4], a[5]);
}

static const char *short_name(const srv_eval *e)
{
	return e->ref->name && *e->ref->name ? e->ref->name : "-";
}

/* Class rows sorted by name so that reports diff cleanly. */
static size_t *class_order(const srv_class_stats *cs)
{
	size_t *o = malloc((cs->n + 1) * sizeof *o);
	if (!o)
		return NULL;
	for (size_t i = 0; i < cs->n; i++)
		o[i] = i;
	for (size_t i = 1; i < cs->n; i++)
		for (size_t j = i; j > 0 && strcmp(cs->names[o[j - 1]], cs->names[o[j]]) > 0; j--) {
			size_t t = o[j];
			o[j] = o[j - 1];
			o[j - 1] = t;
		}
	return o;
}

void srv_validation_print_text(FILE *f, const srv_validation *v, size_t worst)
{
	size_t nw = 0, *w = srv_validation_worst(v, &nw), *o = class_order(&v->classes);
	fprintf(f, "%-26s %5s %5s %6s %6s %6s %6s %6s %6s\n", "class", "rows", "found", "rmse",
		"mae", "<=1", "bias", "cover", "calib");
	stat_row(f, "all", &v->all, 0);
	for (size_t i = 0; o && i < v->classes.n; i++)
		stat_row(f, v->classes.names[o[i]], &v->classes.stats[o[i]], 0);
	fprintf(f, "\nworst rows (experimental, predicted, residual):\n");
	for (size_t i = 0; w && i < nw && i < worst; i++) {
		const srv_eval *e = &v->evals[w[i]];
		fprintf(f, "  %s:%zu %s %s %s%d %.2f %.2f %+.2f [%s] %s\n", e->file, e->ref->line,
			short_name(e), e->ref->smiles, e->ref->kind == PRED_ACID ? "acid" : "base",
			e->ref->pka_index, e->ref->pka, e->predicted, e->predicted - e->ref->pka,
			e->cls, e->diag);
	}
	fprintf(f, "\nrows without a matching site or unreadable:\n");
	for (size_t i = 0; i < v->n_evals; i++) {
		const srv_eval *e = &v->evals[i];
		if (e->status != SRV_EVAL_OK)
			fprintf(f, "  %s:%zu %s %s: %s\n", e->file, e->ref->line, e->ref->smiles,
				e->status == SRV_EVAL_UNREADABLE ? "unreadable" : "no site",
				e->status == SRV_EVAL_UNREADABLE ? e->msg : e->diag);
	}
	free(w);
	free(o);
}

static void worst_md(FILE *f, const srv_validation *v, size_t worst)
{
	size_t nw = 0, *w = srv_validation_worst(v, &nw);
	fprintf(f, "\n| # | molecule | SMILES | step | exp. | pred. | residual | class | "
		   "diagnosis |\n|---|---|---|---|---|---|---|---|---|\n");
	for (size_t i = 0; w && i < nw && i < worst; i++) {
		const srv_eval *e = &v->evals[w[i]];
		fprintf(f, "| %zu | %s | `%s` | %s %d | %.2f | %.2f | %+.2f | %s | %s |\n", i + 1,
			short_name(e), e->ref->smiles, e->ref->kind == PRED_ACID ? "acid" : "base",
			e->ref->pka_index, e->ref->pka, e->predicted, e->predicted - e->ref->pka,
			e->cls, e->diag);
	}
	free(w);
}

void srv_validation_print_markdown(FILE *f, const srv_validation *v, size_t worst,
				   const char *title)
{
	size_t *o = class_order(&v->classes), n_nosite = 0;
	fprintf(f, "## %s\n\n| class | rows | found | RMSE | MAE | within 1 | bias | coverage | "
		   "calibration |\n|---|---|---|---|---|---|---|---|---|\n", title);
	stat_row(f, "**all**", &v->all, 1);
	for (size_t i = 0; o && i < v->classes.n; i++)
		stat_row(f, v->classes.names[o[i]], &v->classes.stats[o[i]], 1);
	for (size_t i = 0; i < v->n_evals; i++)
		n_nosite += v->evals[i].status == SRV_EVAL_NO_SITE;
	fprintf(f, "\nRows without a site of the right kind: %zu; unreadable SMILES: %zu.\n",
		n_nosite, v->n_unreadable);
	if (worst)
		worst_md(f, v, worst);
	fputc('\n', f);
	free(o);
}

int srv_validation_plot(const srv_validation *v, const char *path, const char *title)
{
	srv_point *pts = malloc((v->n_evals + 1) * sizeof *pts);
	size_t n = 0;
	FILE *f;
	int rc;
	if (!pts)
		return -1;
	for (size_t i = 0; i < v->n_evals; i++) {
		const srv_eval *e = &v->evals[i];
		size_t c = 0;
		if (e->status != SRV_EVAL_OK)
			continue;
		while (c < v->classes.n && strcmp(v->classes.names[c], e->cls))
			c++;
		pts[n++] = (srv_point){e->ref->pka, e->predicted, c};
	}
	if (!(f = fopen(path, "w"))) {
		free(pts);
		return -1;
	}
	rc = srv_plot_svg(f, pts, n, v->classes.names, v->classes.n, title);
	if (fclose(f))
		rc = -1;
	free(pts);
	return rc;
}
