/* SPDX-License-Identifier: MIT */
/* validate_stats.c: accuracy figures (RMSE, MAE, bias, coverage, calibration) per class. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "validate.h"

void srv_stat_add(srv_stat *s, double predicted, double reference, double uncertainty)
{
	double r = predicted - reference;
	s->n_rows++;
	s->n_found++;
	s->sse += r * r;
	s->sae += fabs(r);
	s->sum += r;
	if (fabs(r) <= 1.0)
		s->n_within++;
	if (fabs(r) <= uncertainty)
		s->n_calib++;
}

void srv_stat_add_missing(srv_stat *s)
{
	s->n_rows++;
}

/* Figures of an empty set are NAN so that nothing reads them as perfect. */
double srv_stat_rmse(const srv_stat *s)
{
	return s->n_found ? sqrt(s->sse / (double)s->n_found) : NAN;
}

double srv_stat_mae(const srv_stat *s)
{
	return s->n_found ? s->sae / (double)s->n_found : NAN;
}

double srv_stat_bias(const srv_stat *s)
{
	return s->n_found ? s->sum / (double)s->n_found : NAN;
}

double srv_stat_within1(const srv_stat *s)
{
	return s->n_found ? (double)s->n_within / (double)s->n_found : NAN;
}

double srv_stat_coverage(const srv_stat *s)
{
	return s->n_rows ? (double)s->n_found / (double)s->n_rows : NAN;
}

double srv_stat_calibration(const srv_stat *s)
{
	return s->n_found ? (double)s->n_calib / (double)s->n_found : NAN;
}

srv_stat *srv_class_stat(srv_class_stats *cs, const char *name)
{
	char **nn;
	srv_stat *ns;
	for (size_t i = 0; i < cs->n; i++)
		if (!strcmp(cs->names[i], name))
			return &cs->stats[i];
	nn = realloc(cs->names, (cs->n + 1) * sizeof *nn);
	if (!nn)
		return NULL;
	cs->names = nn;
	ns = realloc(cs->stats, (cs->n + 1) * sizeof *ns);
	if (!ns)
		return NULL;
	cs->stats = ns;
	if (!(cs->names[cs->n] = strdup(name)))
		return NULL;
	memset(&cs->stats[cs->n], 0, sizeof *ns);
	return &cs->stats[cs->n++];
}

void srv_class_stats_clear(srv_class_stats *cs)
{
	for (size_t i = 0; i < cs->n; i++)
		free(cs->names[i]);
	free(cs->names);
	free(cs->stats);
	memset(cs, 0, sizeof *cs);
}
