/* SPDX-License-Identifier: MIT */
/* site_match.c: which predicted site an experimental (kind, index) value refers to. */
#include <stdlib.h>

#include "predictor.h"
#include "result.h"
#include "site_match.h"

long pred_site_rank(const pred_site *sites, size_t n, pred_kind kind, int index)
{
	long best = -1;
	int rank;
	if (index < 1)
		return -1;
	/* Selection by repeated minimum keeps this allocation-free; site counts are small. */
	for (rank = 1; rank <= index; rank++) {
		long pick = -1;
		for (size_t i = 0; i < n; i++) {
			double v, pv;
			if (sites[i].kind != kind)
				continue;
			v = kind == PRED_ACID ? sites[i].pka : -sites[i].pka;
			if (best >= 0) {
				double bv = kind == PRED_ACID ? sites[best].pka : -sites[best].pka;
				/* strictly after the previous pick in (value, index) order */
				if (v < bv || (v == bv && (long)i <= best))
					continue;
			}
			pv = pick < 0 ? 0 : (kind == PRED_ACID ? sites[pick].pka : -sites[pick].pka);
			if (pick < 0 || v < pv)
				pick = (long)i;
		}
		if (pick < 0)
			return -1;
		best = pick;
	}
	return best;
}

long pred_result_match(const pred_result *r, pred_kind kind, int index)
{
	return pred_site_rank(r->sites, r->n_sites, kind, index);
}
