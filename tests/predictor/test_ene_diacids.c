/* SPDX-License-Identifier: MIT */
/* test_ene_diacids.c: 1,2-dicarboxylic acids on a C=C. The monoanion of the cis (Z) isomer
 * is held by a hydrogen bond to the cis COOH (corrections.tsv, diacid_ene_z, term
 * hbond_pair_z), which the trans isomer, an undrawn configuration and an aromatic ring do
 * not take. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"

static pred_worker *worker;

/* The two lowest carboxylic acid steps into v[0] <= v[1] and the number of hydrogen-bond
 * pair terms (hbond, hbond_pair_z) over all sites into *pair; 0 when there are not two. */
static int two_steps(const char *smiles, const char *group, double v[2], int *pair)
{
	pred_result *r = NULL;
	pred_error err = {0};
	int n = 0;
	*pair = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err)) {
		fprintf(stderr, "%s: %s\n", smiles, err.msg);
		return 0;
	}
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		for (size_t k = 0; k < s->n_terms; k++)
			*pair += !strcmp(s->terms[k].term, "hbond") ||
				 !strcmp(s->terms[k].term, "hbond_pair_z");
		if (s->kind != PRED_ACID || strcmp(s->group, group) || n == 2)
			continue;
		v[n++] = s->pka;
	}
	pred_result_free(r);
	if (n == 2 && v[0] > v[1]) {
		double t = v[0];
		v[0] = v[1];
		v[1] = t;
	}
	return n == 2;
}

/* Maleic acid 1.93 / 6.58 (aqion table of organic acids, row of data/handbook-acids.csv;
 * 1.92 / 6.23 in the CRC Handbook, from memory) against fumaric acid 3.095 / 4.602 (Serjeant
 * & Dempsey 1979 via IUPAC dataset, entry 2306b of data/handbook-acids.csv): the cis
 * isomer's steps lie 4.65 apart, the trans isomer's 1.51. Without the row both were
 * predicted 3.59 / 5.30. Tolerance 0.8 (the dicarboxylic class error is about 0.5). */
static void test_ene_diacids__maleic_monoanion_is_hydrogen_bonded(void)
{
	double z[2], e[2];
	int pz, pe;
	CHECK(two_steps("OC(=O)/C=C\\C(=O)O", "carboxylic_acid", z, &pz));
	CHECK(two_steps("OC(=O)/C=C/C(=O)O", "carboxylic_acid", e, &pe));
	CHECK(pz > 0);
	CHECK_INT_EQ(pe, 0);
	CHECK(z[1] - z[0] > e[1] - e[0] + 2.0); /* measured 3.14 wider */
	CHECK(z[0] < e[0] - 0.8);               /* measured 1.17 lower */
	CHECK(z[1] > e[1] + 1.2);               /* measured 1.98 higher */
	CHECK_NEAR(z[0], 1.93, 0.8);
	CHECK_NEAR(z[1], 6.58, 0.8);
	CHECK(e[1] - e[0] < 2.5);
	/* the hydrogens drawn, and the cis isomer written the other way round */
	double h[2], w[2];
	int ph, pw;
	CHECK(two_steps("[H]/C(C(=O)O)=C(\\[H])C(=O)O", "carboxylic_acid", h, &ph));
	CHECK(two_steps("OC(=O)\\C=C/C(=O)O", "carboxylic_acid", w, &pw));
	CHECK_NEAR(h[0], z[0], 0.01);
	CHECK_NEAR(h[1], z[1], 0.01);
	CHECK_NEAR(w[0], z[0], 0.01);
	CHECK_NEAR(w[1], z[1], 0.01);
}

/* A C=C drawn without its configuration is not taken as cis: butenedioic acid unmarked is
 * predicted as the trans isomer (the more stable one; the row needs the input's word). */
static void test_ene_diacids__undrawn_configuration_is_not_cis(void)
{
	double u[2], e[2];
	int pu, pe;
	CHECK(two_steps("OC(=O)C=CC(=O)O", "carboxylic_acid", u, &pu));
	CHECK(two_steps("OC(=O)/C=C/C(=O)O", "carboxylic_acid", e, &pe));
	CHECK_INT_EQ(pu, 0);
	CHECK_NEAR(u[0], e[0], 0.01);
	CHECK_NEAR(u[1], e[1], 0.01);
}

/* A methyl on the C=C does not hide the cis pair: citraconic (cis-methylbutenedioic) acid
 * 2.29 / 6.15 against mesaconic (trans) acid 3.09 / 4.75 (CRC Handbook table of organic
 * acids, from memory). */
static void test_ene_diacids__citraconic_acid_against_mesaconic(void)
{
	double z[2], e[2];
	int pz, pe;
	CHECK(two_steps("C/C(C(=O)O)=C/C(=O)O", "carboxylic_acid", z, &pz));
	CHECK(two_steps("C/C(C(=O)O)=C\\C(=O)O", "carboxylic_acid", e, &pe));
	CHECK(pz > 0);
	CHECK_INT_EQ(pe, 0);
	CHECK(z[1] - z[0] > e[1] - e[0] + 1.5); /* measured 2.2 wider */
	CHECK_NEAR(z[0], 2.29, 0.8);
	CHECK_NEAR(z[1], 6.15, 0.8);
}

/* Rings: the carboxyls of cyclohex-1-ene-1,2-dicarboxylic acid are cis by the ring, but the
 * six-ring acid shows no hydrogen-bonded monoanion, 3.525 for the first step (Serjeant &
 * Dempsey 1979 via IUPAC dataset, data/iupac-pka.csv, graded B); the Z row is for chain C=C
 * only, also when the ring bond is drawn with marks (four- and five-ring acids have their
 * own row, diacid_small_ring_ene). Phthalic acid, aromatic, takes no Z term but the pair row
 * of six-ring ortho dicarboxylic acids (diacid_aryl6_vicinal, term hbond_pair; its one
 * "hbond" term on the second step is the count below): 2.95 / 5.41 (Kaye & Laby, row of
 * data/handbook-acids.csv). Tolerance 0.8 as above. */
static void test_ene_diacids__ring_cases_keep_their_own_terms(void)
{
	double c[2], m[2], p[2];
	int pc, pm, pp;
	CHECK(two_steps("OC(=O)C1=C(CCCC1)C(=O)O", "carboxylic_acid", c, &pc));
	CHECK(two_steps("OC(=O)/C1=C(\\C(=O)O)CCCC1", "carboxylic_acid", m, &pm));
	CHECK_INT_EQ(pc, 0);
	CHECK_INT_EQ(pm, 0);
	CHECK_NEAR(c[0], 3.525, 0.8);
	CHECK_NEAR(m[0], c[0], 0.01);
	CHECK(two_steps("OC(=O)c1ccccc1C(=O)O", "benzoic_acid", p, &pp));
	CHECK_INT_EQ(pp, 1);
	CHECK_NEAR(p[0], 2.95, 0.8);
	CHECK_NEAR(p[1], 5.41, 0.8);
}

int main(void)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	char dir[1024];
	snprintf(dir, sizeof dir, "%s/fragments", src ? src : ".");
	pred_model *model = NULL;
	pred_error err = {0};
	if (pred_global_init(&err) || pred_model_load(&model, dir, &err) ||
	    pred_worker_new(&worker, model, &err)) {
		fprintf(stderr, "setup: %s\n", err.msg);
		return 1;
	}
	RUN(test_ene_diacids__maleic_monoanion_is_hydrogen_bonded);
	RUN(test_ene_diacids__undrawn_configuration_is_not_cis);
	RUN(test_ene_diacids__citraconic_acid_against_mesaconic);
	RUN(test_ene_diacids__ring_cases_keep_their_own_terms);
	pred_worker_free(worker);
	pred_model_free(model);
	return harness_done();
}
