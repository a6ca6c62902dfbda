/* SPDX-License-Identifier: MIT */
/* step_align.c: which predicted step a compilation row names when the book lists only some
 * of a molecule's steps. */
#include <stdlib.h>

#include "predictor.h"
#include "result.h"
#include "site_match.h"

/* Steps and listed rows beyond these are matched by number alone. */
#define ALIGN_MAX_STEPS 64

/* Position of index in the listed steps, or -1. */
static long listed_position(const pred_listed_steps *l, int index)
{
	for (size_t i = 0; i < l->n; i++)
		if (l->index[i] == index)
			return (long)i;
	return -1;
}

/* Order-preserving assignment of the k listed values to k of the m step values (k <= m) of
 * least summed squared difference (dynamic programming over prefixes); returns the step
 * assigned to listed position p, or -1 when out of memory. cost[i][j]: best cost of the first
 * i listed values within the first j steps; used[i][j]: whether step j takes value i there. */
static long assign(const double *step, size_t m, const double *val, size_t k, size_t p)
{
	size_t w = m + 1;
	double *cost = malloc((k + 1) * w * sizeof *cost);
	unsigned char *used = calloc((k + 1) * w, 1);
	long out = -1;
	if (!cost || !used) {
		free(cost);
		free(used);
		return -1;
	}
	for (size_t j = 0; j <= m; j++)
		cost[j] = 0.0;
	for (size_t i = 1; i <= k; i++) {
		for (size_t j = 0; j < i; j++)
			cost[i * w + j] = -1.0; /* fewer steps than values: impossible */
		for (size_t j = i; j <= m; j++) {
			double d = step[j - 1] - val[i - 1];
			double take = cost[(i - 1) * w + j - 1] + d * d;
			double skip = cost[i * w + j - 1];
			int can_skip = skip >= 0.0;
			used[i * w + j] = !can_skip || take < skip;
			cost[i * w + j] = used[i * w + j] ? take : skip;
		}
	}
	for (size_t i = k, j = m; i > 0 && j > 0; j--) {
		if (!used[i * w + j])
			continue;
		if (i - 1 == p) {
			out = (long)(j - 1);
			break;
		}
		i--;
	}
	free(cost);
	free(used);
	return out;
}

long pred_site_rank_listed(const pred_site *sites, size_t n, pred_kind kind, int index,
			   const pred_listed_steps *listed)
{
	long order[ALIGN_MAX_STEPS], pos, a;
	double step[ALIGN_MAX_STEPS];
	size_t m, in_window;
	int top;
	if (!listed || !listed->n)
		return pred_site_rank_steps(sites, n, kind, index, 0);
	top = listed->index[listed->n - 1];
	m = pred_site_steps_order(sites, n, kind, order, ALIGN_MAX_STEPS, &in_window);
	pos = listed_position(listed, index);
	/* The numbering names the step when the book lists up to the molecule's last step in
	 * the window, or when it lists more values than there are steps to pair them with. */
	if (pos < 0 || in_window <= (size_t)top || listed->n > m || listed->n > ALIGN_MAX_STEPS)
		return pred_site_rank_steps(sites, n, kind, index, top);
	for (size_t j = 0; j < m; j++)
		step[j] = sites[order[j]].pka;
	a = assign(step, m, listed->pka, listed->n, (size_t)pos);
	return a < 0 ? pred_site_rank_steps(sites, n, kind, index, top) : order[a];
}

long pred_result_match_listed(const pred_result *r, pred_kind kind, int index,
			      const pred_listed_steps *listed)
{
	return pred_site_rank_listed(r->sites, r->n_sites, kind, index, listed);
}
