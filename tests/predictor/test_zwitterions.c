/* SPDX-License-Identifier: MIT */
/* test_zwitterions.c: amino acids, aminopolycarboxylates and other ampholytes: the titration
 * order of the site values, the carboxyl arms of an ammonium by amine class, and the sites of
 * aminophenols, hydroxypyridines and aminobenzoic acids against reference rows. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* The k-th highest pKa (k = 0 the highest) among the sites of this group, any group when
 * group is NULL; NAN when there are fewer. */
static double nth_highest(const char *smiles, const char *group, size_t k)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v[64];
	size_t n = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return NAN;
	for (size_t i = 0; i < pred_result_site_count(r) && n < 64; i++) {
		const pred_site *s = pred_result_site(r, i);
		if (!strcmp(s->group, "oxygen_base") || (group && strcmp(s->group, group)))
			continue;
		v[n++] = s->pka;
	}
	pred_result_free(r);
	for (size_t i = 1; i < n; i++)
		for (size_t j = i; j > 0 && v[j] > v[j - 1]; j--) {
			double t = v[j];
			v[j] = v[j - 1];
			v[j - 1] = t;
		}
	return k < n ? v[k] : NAN;
}

/* The titration order goes through the most populated states (stepwise.c, best_order), not
 * the lowest next step: tetraethylenepentamine 9.68, 9.1, 8.08, 4.72, 2.98 (Perrin 1972, entry
 * perrin_supp4014 of data/iupac-pka.csv). The greedy order protonates the middle N before
 * the two N beside it and gave 6.88 and 6.01 for the third and fourth steps. */
static void test_zwitterions__polyamine_steps_follow_the_dominant_states(void)
{
	const char *tetren = "NCCNCCNCCNCCN";
	CHECK_NEAR(nth_highest(tetren, NULL, 2), 8.08, 0.6);
	CHECK_NEAR(nth_highest(tetren, NULL, 3), 4.72, 0.6);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_zwitterions__polyamine_steps_follow_the_dominant_states);
	probe_teardown(model, worker);
	return harness_done();
}
