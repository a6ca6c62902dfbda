/* SPDX-License-Identifier: MIT */
/* test_charge_scale.c: the charge scale of a site class (sites.tsv charge_scale): a pair of
 * sites takes the product of their scales of the charge interaction W, in the stepwise terms
 * and in the microstate model; alkanethiolates count 0.8 of their charge. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* Largest interaction term (absolute value, sign kept) on a site of this group and kind;
 * 0 when none has one, NAN when the prediction fails. */
static double interaction_of(const char *smiles, const char *group, pred_kind kind)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double best = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return NAN;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != kind || strcmp(s->group, group))
			continue;
		for (size_t k = 0; k < s->n_terms; k++)
			if (!strcmp(s->terms[k].term, "interaction") &&
			    fabs(s->terms[k].value) > fabs(best))
				best = s->terms[k].value;
	}
	pred_result_free(r);
	return best;
}

/* The macroscopic step i (0 the lowest) among those within pKa -1..15; NAN when absent. */
static double macro_step(const char *smiles, size_t i)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = NAN;
	size_t k = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return NAN;
	for (size_t j = 0; j < pred_result_macro_count(r); j++) {
		double x = pred_result_macro_pka(r, j);
		if (x < -1 || x > 15)
			continue;
		if (k++ == i) {
			v = x;
			break;
		}
	}
	pred_result_free(r);
	return v;
}

/* Each end of a pair counts its own charge scale: both charges 3 bonds apart, the second
 * thiol of ethane-1,2-dithiol takes 0.8 x 0.8 of the W that the second ammonium of
 * ethane-1,2-diamine takes, and the thiol of 2-aminoethanethiol (ammonium beside it) 0.8.
 * A model fact, no measured value: W(3) is the same in all three. */
static void test_charge_scale__pair_takes_the_product(void)
{
	double w_nn = interaction_of("NCCN", "primary_amine", PRED_BASE);
	double w_ss = interaction_of("SCCS", "thiol", PRED_ACID);
	double w_ns = interaction_of("NCCS", "thiol", PRED_ACID);
	CHECK(w_nn < -1.0); /* the ammonium beside lowers the second protonation */
	CHECK_NEAR(w_ss / -w_nn, 0.64, 0.01);
	CHECK_NEAR(w_ns / w_nn, 0.8, 0.01);
}

/* Second steps of dithiols and the split of an aminothiol's steps, train rows of the IUPAC
 * dataset (Serjeant & Dempsey 1979): 2,3-disulfanylpropan-1-ol 8.62 and 10.57 (entry
 * serjeant2243), meso-2,3-disulfanylbutanedioic acid thiol steps 8.89 and 10.79 (entry
 * serjeant2403), 2-aminoethanethiol 8.19 and 10.74 (entry serjeant2106). With the full
 * charge the second thiol steps were 11.71 and 12.25 and the aminothiol steps 7.55 and 11.84
 * (the sum of the two steps does not depend on the interaction). Tolerance 0.5, about the
 * class error of the thiol rows; for the last step of the disulfanylbutanedioic acid, whose
 * thiolate also meets two carboxylates, 0.75: at least half of the error of 1.46 gone. */
static void test_charge_scale__thiolate_second_steps(void)
{
	const char *bal = "OCC(CS)S";
	CHECK_NEAR(site_max(bal, "thiol", PRED_ACID), 10.57, 0.5);
	CHECK_NEAR(macro_step(bal, 0), 8.62, 0.5);
	CHECK_NEAR(site_max("SC(C(C(=O)O)S)C(=O)O", "thiol", PRED_ACID), 10.79, 0.75);
	CHECK_NEAR(macro_step("NCCS", 0), 8.19, 0.5);
}

/* Pairs without a thiolate keep the full W: succinic acid 4.21 and 5.64, ethane-1,2-diamine
 * 9.93 and 6.85 (Perrin 1965 / Serjeant & Dempsey 1979, from memory); tolerance 0.4. */
static void test_charge_scale__other_pairs_keep_full_charge(void)
{
	CHECK_NEAR(macro_step("OC(=O)CCC(=O)O", 0), 4.21, 0.4);
	CHECK_NEAR(macro_step("OC(=O)CCC(=O)O", 1), 5.64, 0.4);
	CHECK_NEAR(macro_step("NCCN", 0), 6.85, 0.4);
	CHECK_NEAR(macro_step("NCCN", 1), 9.93, 0.4);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_charge_scale__pair_takes_the_product);
	RUN(test_charge_scale__thiolate_second_steps);
	RUN(test_charge_scale__other_pairs_keep_full_charge);
	probe_teardown(model, worker);
	return harness_done();
}
