/* SPDX-License-Identifier: MIT */
/* site_match.c: which predicted site an experimental (kind, index) value refers to. */
#include <stdlib.h>

#include "predictor.h"
#include "result.h"
#include "site_match.h"

/* The steps a measurement in water reports (common practice: the glass electrode covers
 * about pH 0 to 14); a site of the other kind than the book's counts only when clearly
 * ionised within the titration, pKa 1 to 13 (of four windows tried on the train split,
 * 0-14, 1-13, 1-12 and 2-12, this one fitted the compilations' numbering best). */
#define STEP_LO 0.0
#define STEP_HI 14.0
#define OTHER_LO 1.0
#define OTHER_HI 13.0

static int in_window(const pred_site *s, pred_kind kind)
{
	if (s->kind == kind)
		return s->pka >= STEP_LO && s->pka <= STEP_HI;
	return s->pka >= OTHER_LO && s->pka <= OTHER_HI;
}

/* Tier of a site for a row of this kind: 0 ranks first, 1 after, 2 never. With steps, the
 * sites of either kind in the water window come first (they are the steps a measurement
 * reports), then the sites of the row's kind outside it (a weak base measured by an acidity
 * function, a strong acid), so an unmeasurable sulfonic acid does not take an acid1. */
static int tier(const pred_site *s, pred_kind kind, int steps)
{
	if (!steps)
		return s->kind == kind ? 0 : 2;
	if (in_window(s, kind))
		return 0;
	return s->kind == kind ? 1 : 2;
}

/* Sort key: tier first; acid rows then count from the lowest pKa up, base rows from the
 * highest down; ties go by site order. */
static int before(const pred_site *sites, size_t a, size_t b, pred_kind kind, int steps)
{
	int ta = tier(&sites[a], kind, steps), tb = tier(&sites[b], kind, steps);
	double va = kind == PRED_ACID ? sites[a].pka : -sites[a].pka;
	double vb = kind == PRED_ACID ? sites[b].pka : -sites[b].pka;
	if (ta != tb)
		return ta < tb;
	if (va != vb)
		return va < vb;
	return a < b;
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
			if (tier(&sites[i], kind, steps) == 2)
				continue;
			if (best >= 0 && !before(sites, (size_t)best, i, kind, steps))
				continue; /* not strictly after the previous pick */
			if (pick < 0 || before(sites, i, (size_t)pick, kind, steps))
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
