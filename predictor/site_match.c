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

/* How sites are ranked: by kind only, by steps (both kinds in the water window), or by
 * steps of the row's kind only (the book lists no more steps than that kind has). */
enum { RANK_KIND = 0, RANK_STEPS = 1, RANK_STEPS_OWN = 2 };

/* Tier of a site for a row of this kind: 0 ranks first, 1 after, 2 never. With steps, the
 * sites of either kind in the water window come first (they are the steps a measurement
 * reports), then the sites of the row's kind outside it (a weak base measured by an acidity
 * function, a strong acid), so an unmeasurable sulfonic acid does not take an acid1. */
static int tier(const pred_site *s, pred_kind kind, int mode)
{
	if (mode == RANK_KIND)
		return s->kind == kind ? 0 : 2;
	if (s->kind != kind && mode == RANK_STEPS_OWN)
		return 2;
	if (in_window(s, kind))
		return 0;
	return s->kind == kind ? 1 : 2;
}

/* Sites of the row's kind clearly ionised within the titration (the other kind's window:
 * a polyaza ring's second ring N near 0 is not a step the book lists). */
static size_t own_in_window(const pred_site *sites, size_t n, pred_kind kind)
{
	size_t k = 0;
	for (size_t i = 0; i < n; i++)
		k += sites[i].kind == kind && sites[i].pka >= OTHER_LO && sites[i].pka <= OTHER_HI;
	return k;
}

/* Sort key: tier first; acid rows then count from the lowest pKa up, base rows from the
 * highest down; ties go by site order. */
static int before(const pred_site *sites, size_t a, size_t b, pred_kind kind, int mode)
{
	int ta = tier(&sites[a], kind, mode), tb = tier(&sites[b], kind, mode);
	double va = kind == PRED_ACID ? sites[a].pka : -sites[a].pka;
	double vb = kind == PRED_ACID ? sites[b].pka : -sites[b].pka;
	if (ta != tb)
		return ta < tb;
	if (va != vb)
		return va < vb;
	return a < b;
}

static long rank_where(const pred_site *sites, size_t n, pred_kind kind, int index, int mode)
{
	long best = -1;
	if (index < 1)
		return -1;
	/* Selection by repeated minimum keeps this allocation-free; site counts are small. */
	for (int rank = 1; rank <= index; rank++) {
		long pick = -1;
		for (size_t i = 0; i < n; i++) {
			if (tier(&sites[i], kind, mode) == 2)
				continue;
			if (best >= 0 && !before(sites, (size_t)best, i, kind, mode))
				continue; /* not strictly after the previous pick */
			if (pick < 0 || before(sites, i, (size_t)pick, kind, mode))
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
	return rank_where(sites, n, kind, index, RANK_KIND);
}

/* A book lists the steps it measured: when a molecule has no more rows of this kind than
 * sites of this kind in the water window, those sites are its steps, and a site of the
 * other kind (the NH of a benzimidazole whose only Perrin row is the ring N cation, the OH
 * of an aminonaphthol) is not one of them. Perrin's glycine (two rows, one amine) and
 * 3-hydroxypyridine (two rows, one ring N) still take the other kind's site. */
long pred_site_rank_steps(const pred_site *sites, size_t n, pred_kind kind, int index,
			  int n_steps)
{
	int own = n_steps > 0 && (size_t)n_steps <= own_in_window(sites, n, kind);
	return rank_where(sites, n, kind, index, own ? RANK_STEPS_OWN : RANK_STEPS);
}

size_t pred_site_steps_order(const pred_site *sites, size_t n, pred_kind kind, long *order,
			     size_t cap, size_t *n_window)
{
	size_t m = 0;
	*n_window = 0;
	/* Insertion by the steps key; site counts are small. */
	for (size_t i = 0; i < n && m < cap; i++) {
		size_t at;
		if (tier(&sites[i], kind, RANK_STEPS) == 2)
			continue;
		*n_window += tier(&sites[i], kind, RANK_STEPS) == 0;
		for (at = m; at > 0 && before(sites, i, (size_t)order[at - 1], kind, RANK_STEPS); at--)
			order[at] = order[at - 1];
		order[at] = (long)i;
		m++;
	}
	return m;
}

long pred_result_match(const pred_result *r, pred_kind kind, int index)
{
	return pred_site_rank(r->sites, r->n_sites, kind, index);
}

long pred_result_match_steps(const pred_result *r, pred_kind kind, int index, int n_steps)
{
	return pred_site_rank_steps(r->sites, r->n_sites, kind, index, n_steps);
}
