/* SPDX-License-Identifier: MIT */
/* site_match.h: ranking of sites by acidity or basicity (private, unit-tested). */
#ifndef PKAD_SITE_MATCH_H
#define PKAD_SITE_MATCH_H

#include <stddef.h>

#include "predictor.h"

/* Index into sites[] of the index-th (1-based) most acidic acid site (ascending pKa) or
 * most basic base site (descending pKa); ties go by array order; -1 when there is none. */
long pred_site_rank(const pred_site *sites, size_t n, pred_kind kind, int index);
/* The steps a measurement in water reports: the row kind's sites with pKa 0..14 and the
 * other kind's with pKa 1..13 ranked together first, then the row kind's other sites.
 * n_steps is the number of rows of this kind the molecule has (0: unknown); when the row
 * kind has at least that many sites in 0..14, the other kind's sites are left out. */
long pred_site_rank_steps(const pred_site *sites, size_t n, pred_kind kind, int index,
			  int n_steps);

/* Lists into order[] (at most cap) the sites that count as steps for a row of this kind, in
 * the order of pred_site_rank_steps without the own-kind rule: the window sites of both kinds
 * first (*n_window of them), then the row kind's sites outside the window. Returns the count. */
size_t pred_site_steps_order(const pred_site *sites, size_t n, pred_kind kind, long *order,
			     size_t cap, size_t *n_window);
/* pred_result_match_listed on a bare site array (unit tests). */
long pred_site_rank_listed(const pred_site *sites, size_t n, pred_kind kind, int index,
			   const pred_listed_steps *listed);

#endif
