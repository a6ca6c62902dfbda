/* SPDX-License-Identifier: MIT */
/* site_match.c: which predicted site an experimental (kind, index) value refers to. */
#include <stdlib.h>

#include "predictor.h"
#include "result.h"
#include "site_match.h"

/* The window of sites that a measurement in water reports whatever its book (common
 * practice: the glass electrode covers about pH 0 to 14). */
#define STEP_LO 0.0
#define STEP_HI 14.0

static int candidate(const pred_site *s, pred_kind kind, int steps)
{
	return s->kind == kind || (steps && s->pka >= STEP_LO && s->pka <= STEP_HI);
}

/* Sort key: acid rows count from the lowest pKa up, base rows from the highest down. */
static double key(const pred_site *s, pred_kind kind)
{
	return kind == PRED_ACID ? s->pka : -s->pka;
}

static long rank_where(const pred_site *sites, size_t n, pred_kind kind, int index, int steps)
{
	long best = -1;
	if (index < 1)
		return -1;
	/* Selection by repeated minimum keeps this allocation-free; site counts are small. */
	for (int rank = 1; rank <= index; rank++) {
		long pick = -1;
		for (size_t i = 0; i < n; i++) {
			double v = key(&sites[i], kind);
			if (!candidate(&sites[i], kind, steps))
				continue;
			if (best >= 0) {
				double bv = key(&sites[best], kind);
				/* strictly after the previous pick in (value, index) order */
				if (v < bv || (v == bv && (long)i <= best))
					continue;
			}
			if (pick < 0 || v < key(&sites[pick], kind))
				pick = (long)i;
		}
		if (pick < 0)
			return -1;
		best = pick;
	}
	return best;
}

long pred_site_rank(const pred_site *sites, size_t n, pred_kind kind, int index)
{
	return rank_where(sites, n, kind, index, 0);
}

long pred_site_rank_steps(const pred_site *sites, size_t n, pred_kind kind, int index)
{
	return rank_where(sites, n, kind, index, 1);
}

long pred_result_match(const pred_result *r, pred_kind kind, int index)
{
	return pred_site_rank(r->sites, r->n_sites, kind, index);
}

long pred_result_match_steps(const pred_result *r, pred_kind kind, int index)
{
	return pred_site_rank_steps(r->sites, r->n_sites, kind, index);
}
