/* SPDX-License-Identifier: MIT */
/* test_aromatic_acids.c: phenols beside ionised ring groups (eng_ionised_pairs in effects.c)
 * and beside the ring N of a fused azine, twisted salicylic acids, ortho dicarboxylic and
 * 1-naphthoic acids (phenol_fused_aza, benzoic_ortho_hydroxy_twisted, benzoic_ortho_carboxyl,
 * diacid_aryl6_vicinal, benzoic_peri of fragments/corrections.tsv), aryloxyacetic and
 * thioacyl-oxy/-thio acetic acids, against reference rows of data/iupac-pka.csv (Serjeant &
 * Dempsey 1979 or Perrin 1965 via the IUPAC dataset, entry named). */
#include <math.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* How a term is picked: by its name or the start of its detail (phenol rows), the start of
 * its detail as a whole word (benzoic rows), or anywhere in its detail (walk terms). */
typedef enum { PICK_NAME_OR_PREFIX, PICK_WORD_PREFIX, PICK_SUBSTRING } pick;

static int picked(const pred_term *t, const char *key, pick how)
{
	size_t len = strlen(key);
	const char *d = t->detail;
	switch (how) {
	case PICK_NAME_OR_PREFIX:
		return (t->term && !strcmp(t->term, key)) || (d && !strncmp(d, key, len));
	case PICK_WORD_PREFIX:
		return d && !strncmp(d, key, len) && (!d[len] || d[len] == ' ');
	default:
		return d && strstr(d, key);
	}
}

/* Sum of the picked terms of the first acid site of this group; NAN when it has none. */
static double acid_term(const char *smiles, const char *group, const char *key, pick how)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = NAN;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return v;
	for (size_t i = 0; i < pred_result_site_count(r) && isnan(v); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != PRED_ACID || strcmp(s->group, group))
			continue;
		v = 0;
		for (size_t k = 0; k < s->n_terms; k++)
			if (picked(&s->terms[k], key, how))
				v += s->terms[k].value;
	}
	pred_result_free(r);
	return v;
}

/* Sum of the terms of the phenol site whose term name or detail starts with key; NAN when
 * the molecule has no phenol site. */
static double phenol_term(const char *smiles, const char *key)
{
	return acid_term(smiles, "phenol", key, PICK_NAME_OR_PREFIX);
}

/* The carboxyl of 4- and 3-hydroxybenzoic acid ionises first: the phenol step sees the
 * carboxylate's constants (HLT1991, from memory: COO- sigma_p- 0.31, sigma_m -0.10, against
 * COOH 0.77 and 0.37), rho x the difference standing for the charge interaction. 9.345
 * (serjeant3399) and 9.855 (serjeant3398); 9.84 and 10.13 with the neutral COOH sigma and the
 * distance interaction. Tolerance 0.35 (class uncertainty 0.3). A benzoic acid site (plain
 * sigma) keeps the distance interaction: isophthalic acid's second step 4.60 (serjeant3966),
 * tolerance 0.4. */
static void test_aromatic_acids__ionised_ring_carboxyl(void)
{
	const char *p4 = "Oc1ccc(cc1)C(=O)O", *p3 = "Oc1cccc(c1)C(=O)O";
	double v4 = site_max(p4, "phenol", PRED_ACID), v3 = site_max(p3, "phenol", PRED_ACID);
	CHECK(!isnan(v4) && !isnan(v3));
	CHECK_NEAR(v4, 9.345, 0.35);
	CHECK_NEAR(v3, 9.855, 0.35);
	/* the pair shift is rho x (0.77 - 0.31) and rho x (0.37 + 0.10), about 1.0 each */
	double i4 = phenol_term(p4, "interaction"), i3 = phenol_term(p3, "interaction");
	CHECK(i4 > 0.85 && i4 < 1.2);
	CHECK(i3 > 0.85 && i3 < 1.2);
	CHECK_NEAR(site_max("OC(=O)c1cccc(c1)C(=O)O", "benzoic_acid", PRED_ACID), 4.60, 0.4);
}

/* A pyridine-type N in the ring fused to the phenol's benzo ring draws on the phenoxide:
 * 7-hydroxyquinoline 8.87 (perrin2010), 7-hydroxyisoquinoline 8.90 (perrin1904),
 * 5-hydroxyquinoline 8.56 (perrin2008), against 2-naphthol 9.51 (from memory). Not peri
 * to the OH: 8-hydroxyquinoline 9.81 (perrin2011) holds its OH in an H-bond to the N.
 * Tolerance 0.35. */
static void test_aromatic_acids__fused_aza_phenols(void)
{
	const char *q7 = "Oc1ccc2c(c1)nccc2", *i7 = "Oc1ccc2c(c1)cncc2";
	const char *q5 = "Oc1cccc2c1cccn2", *q8 = "Oc1cccc2c1nccc2";
	CHECK_NEAR(site_pka(q7, "phenol", PRED_ACID), 8.87, 0.35);
	CHECK_NEAR(site_pka(i7, "phenol", PRED_ACID), 8.90, 0.35);
	CHECK_NEAR(site_pka(q5, "phenol", PRED_ACID), 8.56, 0.35);
	CHECK(phenol_term(q7, "phenol_fused_aza") < -0.3);
	CHECK(phenol_term(q5, "phenol_fused_aza") < -0.3);
	CHECK(phenol_term(q8, "phenol_fused_aza") == 0);
	CHECK(phenol_term("Oc1ccc2ccccc2c1", "phenol_fused_aza") == 0);
	CHECK(phenol_term("Oc1cnc2ccccc2c1", "phenol_fused_aza") == 0);
}

/* Sum of the terms of the first benzoic acid site whose detail starts with key. */
static double benzoic_term(const char *smiles, const char *key)
{
	return acid_term(smiles, "benzoic_acid", key, PICK_WORD_PREFIX);
}

/* A salicylic acid with a second ortho group other than O: the twisted carboxylate takes a
 * weaker H-bond from the OH. 6-methylsalicylic acid 3.24 (serjeant3998) and
 * 6-chlorosalicylic acid 2.63 (serjeant3555), against salicylic acid 2.97 (from memory);
 * tolerance 0.35. 2,6-dihydroxybenzoic acid keeps its two H-bonds
 * (benzoic_ortho_second_hydroxy), 3-methylsalicylic acid has no second ortho group. */
static void test_aromatic_acids__twisted_salicylic_acids(void)
{
	const char *me6 = "OC(=O)c1c(C)cccc1O", *cl6 = "OC(=O)c1c(O)cccc1Cl";
	CHECK_NEAR(site_pka(me6, "benzoic_acid", PRED_ACID), 3.24, 0.35);
	CHECK_NEAR(site_pka(cl6, "benzoic_acid", PRED_ACID), 2.63, 0.35);
	CHECK(benzoic_term(me6, "benzoic_ortho_hydroxy_twisted") > 0.3);
	CHECK(benzoic_term("OC(=O)c1c(O)cccc1O", "benzoic_ortho_hydroxy_twisted") == 0);
	CHECK(benzoic_term("OC(=O)c1cccc(C)c1O", "benzoic_ortho_hydroxy_twisted") == 0);
}

/* Ortho dicarboxylic acids of six-membered aromatic rings (benzoic_ortho_carboxyl,
 * diacid_aryl6_vicinal): phthalic acid 2.70 / 4.83 (serjeant3965, two values averaged),
 * 4-methylphthalic acid 3.04 / 5.26 (serjeant4539); tolerance 0.35 on the first step, 0.45 on
 * the second (class uncertainty 0.3). Mellitic acid's carboxyls all have a carboxyl on each
 * side and take neither row. */
static void test_aromatic_acids__ortho_dicarboxylic(void)
{
	const char *ph = "OC(=O)c1ccccc1C(=O)O", *me4 = "Cc1ccc(c(c1)C(=O)O)C(=O)O";
	const char *mel = "OC(=O)c1c(C(=O)O)c(C(=O)O)c(c(c1C(=O)O)C(=O)O)C(=O)O";
	CHECK_NEAR(site_min(ph, "benzoic_acid", PRED_ACID), 2.70, 0.35);
	CHECK_NEAR(site_max(ph, "benzoic_acid", PRED_ACID), 4.83, 0.45);
	CHECK_NEAR(site_min(me4, "benzoic_acid", PRED_ACID), 3.04, 0.35);
	CHECK_NEAR(site_max(me4, "benzoic_acid", PRED_ACID), 5.26, 0.45);
	CHECK(benzoic_term(ph, "benzoic_ortho_carboxyl") < -0.2);
	CHECK(benzoic_term(ph, "diacid_aryl6_vicinal") < -0.1);
	CHECK(benzoic_term(mel, "benzoic_ortho_carboxyl") == 0);
	CHECK(benzoic_term(mel, "diacid_aryl6_vicinal") == 0);
	CHECK(benzoic_term("OC(=O)c1cccc(c1)C(=O)O", "benzoic_ortho_carboxyl") == 0);
}

/* A peri C-H turns the carboxyl of a 1-naphthoic acid out of the ring plane (benzoic_peri):
 * 3-hydroxy-1-naphthoic acid 3.69 (serjeant5332), 3-methyl-1-naphthoic acid 3.72
 * (serjeant5552, graded B); tolerance 0.35 (class uncertainty 0.3). 2-Methyl-1-naphthoic
 * acid (3.03, serjeant5551) takes the row too but still reads about 0.4 high: its carboxyl
 * is crowded from both sides. 2-Naphthoic acid (4.17, from memory) has no peri C-H. */
static void test_aromatic_acids__peri_naphthoic(void)
{
	const char *oh3 = "Oc1cc2ccccc2c(c1)C(=O)O", *me3 = "Cc1cc2ccccc2c(c1)C(=O)O";
	CHECK_NEAR(site_pka(oh3, "benzoic_acid", PRED_ACID), 3.69, 0.35);
	CHECK_NEAR(site_pka(me3, "benzoic_acid", PRED_ACID), 3.72, 0.35);
	CHECK(benzoic_term(oh3, "benzoic_peri") < -0.2);
	CHECK(benzoic_term("OC(=O)c1c(C)ccc2c1cccc2", "benzoic_peri") < -0.2);
	CHECK(benzoic_term("OC(=O)c1ccc2ccccc2c1", "benzoic_peri") == 0);
	CHECK_NEAR(site_pka("OC(=O)c1ccc2ccccc2c1", "benzoic_acid", PRED_ACID), 4.17, 0.35);
}

/* Sum of the terms of the first carboxylic acid site whose detail contains key. */
static double carboxyl_term(const char *smiles, const char *key)
{
	return acid_term(smiles, "carboxylic_acid", key, PICK_SUBSTRING);
}

/* The meta and para groups of an aryloxyacetic acid's ring reach the carboxyl through the O
 * (the OC6H5 group holds the ring's first atom): 2-(4-nitrophenoxy)acetic acid 2.81
 * (serjeant4215) and 2-(4-cyanophenoxy)acetic acid 2.87 (serjeant4672), against phenoxyacetic
 * acid 3.18 (handbook-acids.csv); tolerance 0.35. */
static void test_aromatic_acids__aryloxyacetic_ring_groups(void)
{
	const char *no2 = "OC(=O)COc1ccc(cc1)[N+](=O)[O-]", *cn = "N#Cc1ccc(cc1)OCC(=O)O";
	CHECK_NEAR(site_pka(no2, "carboxylic_acid", PRED_ACID), 2.81, 0.35);
	CHECK_NEAR(site_pka(cn, "carboxylic_acid", PRED_ACID), 2.87, 0.35);
	CHECK(carboxyl_term(no2, "4-NO2 on an aryl") < -0.05);
	CHECK(carboxyl_term("OC(=O)COc1ccccc1", "on an aryl") == 0);
	CHECK(site_pka(no2, "carboxylic_acid", PRED_ACID) <
	      site_pka("OC(=O)COc1ccccc1", "carboxylic_acid", PRED_ACID) - 0.05);
}

/* An O or S bearing a thiocarbonyl withdraws like an acyloxy group (S_thioacyl, O_thioacyl of
 * fragments/substituents.tsv): ethoxythiocarbonylthioacetic acid 3.08 (serjeant2675) and
 * dimethylthiocarbamoyloxyacetic acid 2.87 (serjeant2789), tolerance 0.35; a plain
 * thioether keeps SR ((methylthio)acetic acid 3.66, from memory). */
static void test_aromatic_acids__thioacyl_oxy_thio_acids(void)
{
	const char *xa = "CCOC(=S)SCC(=O)O", *tc = "CN(C(=S)OCC(=O)O)C";
	CHECK_NEAR(site_pka(xa, "carboxylic_acid", PRED_ACID), 3.08, 0.35);
	CHECK_NEAR(site_pka(tc, "carboxylic_acid", PRED_ACID), 2.87, 0.35);
	CHECK(carboxyl_term(xa, "S_thioacyl at 2 bonds") < -1.2);
	CHECK(carboxyl_term(tc, "O_thioacyl at 2 bonds") < -1.2);
	CHECK(carboxyl_term("CSCC(=O)O", "thioacyl") == 0);
	CHECK_NEAR(site_pka("CSCC(=O)O", "carboxylic_acid", PRED_ACID), 3.66, 0.35);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_aromatic_acids__ionised_ring_carboxyl);
	RUN(test_aromatic_acids__fused_aza_phenols);
	RUN(test_aromatic_acids__twisted_salicylic_acids);
	RUN(test_aromatic_acids__ortho_dicarboxylic);
	RUN(test_aromatic_acids__peri_naphthoic);
	RUN(test_aromatic_acids__aryloxyacetic_ring_groups);
	RUN(test_aromatic_acids__thioacyl_oxy_thio_acids);
	probe_teardown(model, worker);
	return harness_done();
}
