/* SPDX-License-Identifier: MIT */
/* test_amine_arms.c: the beta arms of aliphatic ammonium ions (corrections.tsv
 * amine_beta_hydroxyl, amine_beta_cyano, amine_dipeptide_n_terminus, amine_amino_diacid,
 * acid_peptide_acylamino, amine_alpha_tertiary_amide, amine_cage_quaternary_beta,
 * amine_beta_thiol, amine_beta_carboxyl; substituents.tsv O_P_ester) against reference rows.
 * Values are Perrin 1965 and its supplement, and Serjeant & Dempsey 1979, via the IUPAC dataset
 * (entry named, data/iupac-pka.csv and data/handbook-bases.csv). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* Triethanolamine 7.762 (perrin0121) and 1-bis(2-hydroxypropyl)amino-2-propanol 7.86
 * (perrin0192): three hydroxyethyl arms do not pull three times as much as one; the row
 * counts once per arm. */
static void test_amine_arms__beta_hydroxyl(void)
{
	const char *tea = "OCCN(CCO)CCO";
	double one = corr_value("OCCN(C)C", "tertiary_amine", "amine_beta_hydroxyl");
	CHECK(one > 0.1);
	CHECK_NEAR(corr_value(tea, "tertiary_amine", "amine_beta_hydroxyl"), 3 * one, 1e-6);
	CHECK_NEAR(site_pka(tea, "tertiary_amine", PRED_BASE), 7.762, 0.5);
	CHECK_NEAR(site_pka("CC(CN(CC(O)C)CC(O)C)O", "tertiary_amine", PRED_BASE), 7.86, 0.6);
	/* a gamma hydroxyl is not a beta arm */
	CHECK(corr_value("OCCCN(C)C", "tertiary_amine", "amine_beta_hydroxyl") == 0);
}

/* Bis(2-cyanoethyl)amine 5.26 (perrin0098), 3-methylaminopropionitrile 8.1
 * (perrin_supp4034): each 2-cyanoethyl arm lowers the ammonium more than the CH2CN sigma* says;
 * cyanomethyl and 4-cyanobutyl arms are no beta arms. */
static void test_amine_arms__beta_cyano(void)
{
	const char *bis = "N#CCCNCCC#N";
	double v = corr_value(bis, "secondary_amine", "amine_beta_cyano");
	CHECK(v < -0.5);
	CHECK_NEAR(v, 2 * corr_value("CNCCC#N", "secondary_amine", "amine_beta_cyano"), 1e-6);
	CHECK_NEAR(site_pka(bis, "secondary_amine", PRED_BASE), 5.26, 0.6);
	CHECK_NEAR(site_pka("CNCCC#N", "secondary_amine", PRED_BASE), 8.1, 0.5);
	CHECK(corr_value("N#CCN1CCCCC1", "tertiary_amine", "amine_beta_cyano") == 0);
	CHECK(corr_value("N#CCCCN(CC)CC", "tertiary_amine", "amine_beta_cyano") == 0);
}

/* Alanylglycine 8.195 (perrin3142), glycylvaline 8.20 (perrin3318): the C-terminal
 * carboxylate across the peptide bond raises the N-terminal ammonium less than a flexible
 * chain of six bonds would; a tripeptide and an amide without the carboxyl take no term. */
static void test_amine_arms__dipeptide(void)
{
	const char *ala_gly = "C[C@@H](C(=O)NCC(=O)O)N";
	CHECK(corr_value(ala_gly, "primary_amine", "amine_dipeptide_n_terminus") < -0.1);
	CHECK_NEAR(site_pka(ala_gly, "primary_amine", PRED_BASE), 8.195, 0.4);
	CHECK_NEAR(site_pka("NCC(=O)N[C@H](C(=O)O)C(C)C", "primary_amine", PRED_BASE), 8.20, 0.4);
	CHECK(corr_value("NCC(=O)NCC(=O)NCC(=O)O", "primary_amine",
			 "amine_dipeptide_n_terminus") == 0);
	CHECK(corr_value("NCC(=O)NCC(=O)OC", "primary_amine", "amine_dipeptide_n_terminus") == 0);
}

/* 1-diisopropoxyphosphinyloxy-2-dimethylaminoethane 8.06 (perrin_supp4045) and
 * 1-diethoxyphosphinylthio-2-dimethylaminoethane 7.73 (perrin_supp4041): the ester O or S of
 * a phosphate triester is its own group (O_P_ester), no generic ether-like O. */
static void test_amine_arms__phosphate_ester(void)
{
	const char *o_ester = "CN(CCOP(=O)(OC(C)C)OC(C)C)C";
	const char *s_ester = "CCOP(=O)(SCCN(C)C)OCC";
	CHECK(corr_value(o_ester, "tertiary_amine", "O_P_ester") < -1.0);
	CHECK(corr_value(s_ester, "tertiary_amine", "O_P_ester") < -1.0);
	CHECK_NEAR(site_pka(o_ester, "tertiary_amine", PRED_BASE), 8.06, 0.5);
	CHECK_NEAR(site_pka(s_ester, "tertiary_amine", PRED_BASE), 7.73, 0.5);
	/* the O of a phosphate monoester acid is no triester O */
	CHECK(corr_value("NCCOP(=O)(O)O", "primary_amine", "O_P_ester") == 0);
}

/* L-glutamic acid 9.70 (perrin3126) and aspartic acid 9.88 (perrin3090): the ammonium step
 * after both carboxylates; the side-chain anion raises it less than its full interaction
 * (amine_amino_diacid). Alanine takes no term. */
static void test_amine_arms__amino_diacid(void)
{
	const char *glu = "OC(=O)CC[C@@H](C(=O)O)N";
	const char *asp = "OC(=O)C[C@@H](C(=O)O)N";
	CHECK(corr_value(glu, "primary_amine", "amine_amino_diacid") < -0.1);
	CHECK(corr_value(asp, "primary_amine", "amine_amino_diacid") < -0.1);
	CHECK_NEAR(site_max(glu, "primary_amine", PRED_BASE), 9.70, 0.4);
	CHECK_NEAR(site_max(asp, "primary_amine", PRED_BASE), 9.88, 0.4);
	CHECK(corr_value("C[C@@H](C(=O)O)N", "primary_amine", "amine_amino_diacid") == 0);
}

/* Carboxyl of glycylglycylglycylglycine 3.25 (perrin_supp7644) and leucylglycylglycine 3.28
 * (perrin3169): the second peptide bond, which the walk does not reach, lowers it
 * (acid_peptide_acylamino); a dipeptide's carboxyl takes no term. */
static double acid_corr(const char *smiles, const char *id)
{
	pred_result *r = NULL;
	pred_error err = {0};
	double v = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err))
		return NAN;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != PRED_ACID || strcmp(s->group, "carboxylic_acid"))
			continue;
		for (size_t k = 0; k < s->n_terms; k++)
			if (s->terms[k].detail && !strcmp(s->terms[k].detail, id))
				v += s->terms[k].value;
		break;
	}
	pred_result_free(r);
	return v;
}

static void test_amine_arms__peptide_acid(void)
{
	const char *g4 = "NCC(=O)NCC(=O)NCC(=O)NCC(=O)O";
	const char *lgg = "CC(C[C@@H](C(=O)NCC(=O)NCC(=O)O)N)C";
	CHECK(acid_corr(g4, "acid_peptide_acylamino") < -0.1);
	CHECK(acid_corr("NCC(=O)N[C@H](C(=O)O)C(C)C", "acid_peptide_acylamino") == 0);
	CHECK_NEAR(site_pka(g4, "carboxylic_acid", PRED_ACID), 3.25, 0.4);
	CHECK_NEAR(site_pka(lgg, "carboxylic_acid", PRED_ACID), 3.28, 0.4);
}

/* Sarcosine dimethylamide 8.82 (perrin0020) and glycylproline 8.575 (perrin3289) against
 * sarcosinamide 8.31 (perrin0012): the ammonium beside a tertiary amide
 * carbonyl lies about 0.5 higher than beside CONH2 or CONHR (amine_alpha_tertiary_amide);
 * the primary amide and glycylglycine take no term. */
static void test_amine_arms__tertiary_amide(void)
{
	const char *sar_nme2 = "CNCC(=O)N(C)C";
	const char *gly_pro = "NCC(=O)N1CCC[C@H]1C(=O)O";
	CHECK(corr_value(sar_nme2, "secondary_amine", "amine_alpha_tertiary_amide") > 0.2);
	CHECK(corr_value(gly_pro, "primary_amine", "amine_alpha_tertiary_amide") > 0.2);
	CHECK_NEAR(site_pka(sar_nme2, "secondary_amine", PRED_BASE), 8.82, 0.4);
	CHECK_NEAR(site_max(gly_pro, "primary_amine", PRED_BASE), 8.575, 0.4);
	CHECK(corr_value("CNCC(=O)N", "secondary_amine", "amine_alpha_tertiary_amide") == 0);
	CHECK(corr_value("NCC(=O)NCC(=O)O", "primary_amine", "amine_alpha_tertiary_amide") == 0);
}

/* Strychnine 8.26 (perrin2967) and brucine 8.28 (perrin2871): the ring ammonium beside the
 * quaternary spiro carbon of the cage is poorly solvated (amine_cage_quaternary_beta);
 * quinuclidine and 1-methylpiperidine take no term. */
static void test_amine_arms__cage_quaternary_beta(void)
{
	const char *strychnine =
	    "O=C1C[C@@H]2OCC=C3[C@H]4[C@@H]2[C@@H]2N1c1ccccc1[C@]12CCN([C@H]1C4)C3";
	const char *brucine = "COc1cc2c(cc1OC)N1[C@@H]3[C@@]42CCN2[C@H]4C[C@@H]4[C@H]3"
			      "[C@H](CC1=O)OCC=C4C2";
	CHECK(corr_value(strychnine, "tertiary_amine", "amine_cage_quaternary_beta") < -0.5);
	CHECK_NEAR(site_pka(strychnine, "tertiary_amine", PRED_BASE), 8.26, 0.6);
	CHECK_NEAR(site_pka(brucine, "tertiary_amine", PRED_BASE), 8.28, 0.6);
	CHECK(corr_value("C1CN2CCC1CC2", "tertiary_amine", "amine_cage_quaternary_beta") == 0);
	CHECK(corr_value("CN1CCCCC1", "tertiary_amine", "amine_cage_quaternary_beta") == 0);
}

/* Cysteamine 10.74 (serjeant2106; the ammonium step after the thiolate) and beta-alanine
 * 10.25, N,N-dimethyl-beta-alanine 9.85 (perrin3068, perrin3120): the anion three or four bonds
 * from the ammonium counts less than its full interaction (amine_beta_thiol,
 * amine_beta_carboxyl). Cysteine methyl ester and aspartic acid, whose alpha carbon bears the
 * carbonyl, take neither term. */
static void test_amine_arms__beta_anion(void)
{
	CHECK(corr_value("NCCS", "primary_amine", "amine_beta_thiol") < -0.2);
	CHECK(corr_value("NCCC(=O)O", "primary_amine", "amine_beta_carboxyl") < -0.2);
	CHECK_NEAR(site_pka("NCCS", "primary_amine", PRED_BASE), 10.74, 0.4);
	CHECK_NEAR(site_pka("NCCC(=O)O", "primary_amine", PRED_BASE), 10.25, 0.4);
	CHECK_NEAR(site_pka("CN(CCC(=O)O)C", "tertiary_amine", PRED_BASE), 9.85, 0.4);
	CHECK(corr_value("COC(=O)[C@H](CS)N", "primary_amine", "amine_beta_thiol") == 0);
	CHECK(corr_value("OC(=O)C[C@@H](C(=O)O)N", "primary_amine", "amine_beta_carboxyl") == 0);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_amine_arms__beta_hydroxyl);
	RUN(test_amine_arms__beta_cyano);
	RUN(test_amine_arms__dipeptide);
	RUN(test_amine_arms__phosphate_ester);
	RUN(test_amine_arms__amino_diacid);
	RUN(test_amine_arms__peptide_acid);
	RUN(test_amine_arms__tertiary_amide);
	RUN(test_amine_arms__cage_quaternary_beta);
	RUN(test_amine_arms__beta_anion);
	probe_teardown(model, worker);
	return harness_done();
}
