/* SPDX-License-Identifier: MIT */
/* test_phosphorus_acids.c: the steps of P(=O)(OH)n acids. Two OH on one phosphorus repel
 * more than the bond-count interaction gives (corrections.tsv, oxyacid_p_geminal, term
 * charge_pair), and equivalent groups of several sites take the statistical factors of
 * their states (stepwise.c): two P(OH)2 groups -log 4, 0, 0, +log 4. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_worker *worker;

enum { STEPS_MAX = 8 };

typedef struct step {
	double pka, stat, pair; /* site value, its statistical and charge_pair terms */
} step;

/* The acid sites of this group, in increasing pKa, into v; returns the count. */
static int steps(const char *smiles, const char *group, step *v)
{
	pred_result *r = NULL;
	pred_error err = {0};
	int n = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err)) {
		fprintf(stderr, "%s: %s\n", smiles, err.msg);
		return 0;
	}
	for (size_t i = 0; i < pred_result_site_count(r) && n < STEPS_MAX; i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != PRED_ACID || strcmp(s->group, group))
			continue;
		step t = {s->pka, 0, 0};
		for (size_t k = 0; k < s->n_terms; k++) {
			if (!strcmp(s->terms[k].term, "statistical"))
				t.stat += s->terms[k].value;
			if (!strcmp(s->terms[k].term, "charge_pair"))
				t.pair += s->terms[k].value;
		}
		int q = n++;
		for (; q > 0 && v[q - 1].pka > t.pka; q--)
			v[q] = v[q - 1];
		v[q] = t;
	}
	pred_result_free(r);
	return n;
}

/* Phosphoric acid 2.15 / 7.20 / 12.35 (CRC Handbook, common practice): the second OH takes
 * one geminal charge_pair term, the third two (the row counts per ionised partner).
 * Before the row the steps read 2.15 / 6.55 / 11.0 at the same parent; tolerance 0.5 (the
 * class error on the train rows). */
static void test_phosphorus_acids__phosphoric_acid_steps(void)
{
	step v[STEPS_MAX];
	CHECK_INT_EQ(steps("OP(=O)(O)O", "phosphoric_acid", v), 3);
	CHECK_NEAR(v[0].pka, 2.15, 0.5);
	CHECK_NEAR(v[1].pka, 7.20, 0.5);
	CHECK_NEAR(v[2].pka, 12.35, 0.5);
	CHECK(v[0].pair == 0);
	CHECK(v[1].pair > 0);
	CHECK_NEAR(v[2].pair, 2 * v[1].pair, 1e-9);
	/* three equivalent OH on one centre: -log 3, 0, +log 3 */
	CHECK_NEAR(v[0].stat, -log10(3.0), 0.01);
	CHECK_NEAR(v[1].stat, 0, 0.01);
	CHECK_NEAR(v[2].stat, log10(3.0), 0.01);
}

/* Phosphonic acids and phosphate monoesters: phenoxymethylphosphonic acid 1.37 / 6.83 and
 * methyl dihydrogen phosphate 1.54 / 6.31 (Serjeant & Dempsey 1979 via IUPAC dataset, train
 * rows of data/iupac-pka.csv): the steps lie 5.5 and 4.8 apart; without the row the model
 * put 4.5 between both. Tolerance 0.5. A diester (one OH) takes no pair term. */
static void test_phosphorus_acids__geminal_oh_pair(void)
{
	step v[STEPS_MAX];
	CHECK_INT_EQ(steps("OP(=O)(COc1ccccc1)O", "phosphonic_acid", v), 2);
	CHECK_NEAR(v[0].pka, 1.37, 0.5);
	CHECK_NEAR(v[1].pka, 6.83, 0.5);
	CHECK(v[0].pair == 0 && v[1].pair > 0);
	CHECK_INT_EQ(steps("COP(=O)(O)O", "phosphate_ester", v), 2);
	CHECK_NEAR(v[0].pka, 1.54, 0.5);
	CHECK_NEAR(v[1].pka, 6.31, 0.5);
	CHECK(v[1].pair > 0);
	CHECK_INT_EQ(steps("COP(=O)(OC)O", "phosphate_ester", v), 1);
	CHECK(v[0].pair == 0);
}

/* Statistical factors from the states (common practice: a symmetric diacid's steps lie
 * log 4 apart): methylenediphosphonic acid ionises one OH of each P first, so its four
 * steps take -log 4, 0, 0, +log 4, not the four-free-site -0.60 / -0.18 / +0.18 / +0.60;
 * succinic acid keeps -log 2 / +log 2 and trimesic acid -log 3 / 0 / +log 3. The last
 * step of methylenediphosphonic acid, 10.48 (Serjeant & Dempsey 1979 via IUPAC dataset,
 * train row), within 0.8 (the step pairs of bisphosphonates read up to 1.3 high). */
static void test_phosphorus_acids__statistics_of_equivalent_groups(void)
{
	step v[STEPS_MAX];
	CHECK_INT_EQ(steps("OP(=O)(CP(=O)(O)O)O", "phosphonic_acid", v), 4);
	CHECK_NEAR(v[0].stat, -log10(4.0), 0.01);
	CHECK_NEAR(v[1].stat, 0, 0.01);
	CHECK_NEAR(v[2].stat, 0, 0.01);
	CHECK_NEAR(v[3].stat, log10(4.0), 0.01);
	CHECK_NEAR(v[3].pka, 10.48, 0.8);
	CHECK_INT_EQ(steps("OC(=O)CCC(=O)O", "carboxylic_acid", v), 2);
	CHECK_NEAR(v[0].stat, -log10(2.0), 0.01);
	CHECK_NEAR(v[1].stat, log10(2.0), 0.01);
	CHECK_INT_EQ(steps("OC(=O)c1cc(C(=O)O)cc(C(=O)O)c1", "benzoic_acid", v), 3);
	CHECK_NEAR(v[0].stat, -log10(3.0), 0.01);
	CHECK_NEAR(v[1].stat, 0, 0.01);
	CHECK_NEAR(v[2].stat, log10(3.0), 0.01);
}

int main(void)
{
	pred_model *model = NULL;
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_phosphorus_acids__phosphoric_acid_steps);
	RUN(test_phosphorus_acids__geminal_oh_pair);
	RUN(test_phosphorus_acids__statistics_of_equivalent_groups);
	probe_teardown(model, worker);
	return harness_done();
}
