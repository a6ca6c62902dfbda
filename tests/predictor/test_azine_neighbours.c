/* SPDX-License-Identifier: MIT */
/* test_azine_neighbours.c: anilines twisted by an ortho group, picolylamines, halogenated
 * 8-hydroxyquinolines and flanked 4-alkylaminopyridines (aniline_nn_ortho_acceptor,
 * aniline_nn_ortho_carboxyl_hbond, aniline_nn_ortho_steric_bulky, amine_azinylmethyl,
 * quinolinol_8_halogen and pyridine_para_nr_flanked of fragments/corrections.tsv) against
 * reference rows. */
#include <math.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* Ethyl 2-dimethylaminobenzoate 5.48 (Perrin 1965 via IUPAC dataset, perrin0528 of
 * data/iupac-pka.csv): the NMe2 group turned by the ortho ester no longer conjugates with
 * it. The para ester keeps its resonance (no term); tolerance 0.6. */
static void test_azine_neighbours__ortho_acceptor_twisted_nme2(void)
{
	const char *ortho = "CCOC(=O)c1ccccc1N(C)C";
	double v = site_pka(ortho, "aniline", PRED_BASE);
	CHECK(!isnan(v));
	CHECK_NEAR(v, 5.48, 0.6);
	CHECK(corr_value(ortho, "aniline", "aniline_nn_ortho_acceptor") > 0.5);
	CHECK(corr_value("CCOC(=O)c1ccc(cc1)N(C)C", "aniline", "aniline_nn_ortho_acceptor") == 0);
	CHECK(corr_value("CN(C)c1ccccc1C", "aniline", "aniline_nn_ortho_acceptor") == 0);
	CHECK(corr_value(ortho, "aniline", "aniline_nn_ortho_carboxyl_hbond") == 0);
}

/* N,N-dimethylanthranilic acid 8.51 (Serjeant & Dempsey 1979 via IUPAC dataset, serjeant4778
 * of data/iupac-pka.csv): the ammonium step of the zwitterion, its N-H+ hydrogen-bonded to the
 * carboxylate, takes both ortho rows. Tolerance 0.8 (about the class uncertainty of the
 * aminocarboxylates). */
static void test_azine_neighbours__twisted_anthranilate(void)
{
	const char *acid = "OC(=O)c1ccccc1N(C)C";
	CHECK(corr_value(acid, "aniline", "aniline_nn_ortho_acceptor") > 0.5);
	CHECK(corr_value(acid, "aniline", "aniline_nn_ortho_carboxyl_hbond") > 0.5);
	CHECK_NEAR(last_macro(acid), 8.51, 0.8);
}

/* N,N-diethyl-2-, 3- and 4-picolylamine 8.74, 8.55, 8.18 and bis(3-pyridylmethyl)amine 7.15
 * (Perrin Supplement 1972 via IUPAC dataset, perrin_supp5183-5185 and perrin_supp5289): one
 * term per pyridylmethyl arm; N,N-diethylbenzylamine takes none. Tolerance 0.6. */
static void test_azine_neighbours__picolylamines(void)
{
	const char *bis = "c1ccc(cn1)CNCc1cccnc1";
	double p2 = site_pka("CCN(Cc1ccccn1)CC", "tertiary_amine", PRED_BASE);
	double p3 = site_pka("CCN(Cc1cccnc1)CC", "tertiary_amine", PRED_BASE);
	double p4 = site_pka("CCN(Cc1ccncc1)CC", "tertiary_amine", PRED_BASE);
	double b = site_pka(bis, "secondary_amine", PRED_BASE);
	CHECK(!isnan(p2) && !isnan(p3) && !isnan(p4) && !isnan(b));
	CHECK_NEAR(p2, 8.74, 0.6);
	CHECK_NEAR(p3, 8.55, 0.6);
	CHECK_NEAR(p4, 8.18, 0.6);
	CHECK_NEAR(b, 7.15, 0.6);
	double one = corr_value("CCN(Cc1ccccn1)CC", "tertiary_amine", "amine_azinylmethyl");
	CHECK(one > 0);
	CHECK_NEAR(corr_value(bis, "secondary_amine", "amine_azinylmethyl"), 2 * one, 1e-6);
	CHECK(corr_value("CCN(Cc1ccccc1)CC", "tertiary_amine", "amine_azinylmethyl") == 0);
}

/* N-(2-methylphenyl)iminodiacetic acid 5.65, its ammonium step (Serjeant & Dempsey 1979 via
 * IUPAC dataset, serjeant5455 of data/iupac-pka.csv), against N,N,2-trimethylaniline 5.98
 * (Perrin 1965 via IUPAC dataset, perrin0624) and N,N-diethyl-2-methylaniline 7.18 (Perrin
 * 1965, from memory): an NR2 group with two arms larger than methyl stands partly out of the
 * ring already, so the 2-methyl group twists it less (aniline_nn_ortho_steric_bulky) than it
 * twists NMe2 (aniline_nn_ortho_steric). Tolerance 0.6. */
static void test_azine_neighbours__ortho_steric_bulky_arms(void)
{
	const char *ida = "OC(=O)CN(c1ccccc1C)CC(=O)O";
	const char *nme2 = "CN(c1ccccc1C)C";
	const char *net2 = "CCN(CC)c1ccccc1C";
	CHECK_NEAR(last_macro(ida), 5.65, 0.6);
	CHECK_NEAR(site_pka(nme2, "aniline", PRED_BASE), 5.98, 0.6);
	CHECK_NEAR(site_pka(net2, "aniline", PRED_BASE), 7.18, 0.6);
	double bulky = corr_value(ida, "aniline", "aniline_nn_ortho_steric_bulky");
	double plain = corr_value(nme2, "aniline", "aniline_nn_ortho_steric");
	CHECK(bulky > 0 && plain > bulky);
	CHECK(corr_value(ida, "aniline", "aniline_nn_ortho_steric") == 0);
	CHECK_NEAR(corr_value(net2, "aniline", "aniline_nn_ortho_steric_bulky"), bulky, 1e-6);
	CHECK(corr_value(nme2, "aniline", "aniline_nn_ortho_steric_bulky") == 0);
	CHECK(corr_value("CCN(CC)c1ccccc1", "aniline", "aniline_nn_ortho_steric_bulky") == 0);
}

/* 5-chloro- and 5-iodo-8-hydroxyquinoline 3.56 and 3.48 (Perrin Supplement 1972 via IUPAC
 * dataset, perrin_supp6658, perrin_supp6683) against 8-hydroxyquinoline 4.91 (Perrin 1965
 * via IUPAC dataset), which takes no term. Tolerance 0.5. */
static void test_azine_neighbours__halogenated_8_hydroxyquinolines(void)
{
	const char *cl = "Clc1ccc(c2c1cccn2)O";
	double vcl = site_pka(cl, "quinoline", PRED_BASE);
	double vi = site_pka("Ic1ccc(c2c1cccn2)O", "quinoline", PRED_BASE);
	double v0 = site_pka("Oc1cccc2c1nccc2", "quinoline", PRED_BASE);
	CHECK(!isnan(vcl) && !isnan(vi) && !isnan(v0));
	CHECK_NEAR(vcl, 3.56, 0.5);
	CHECK_NEAR(vi, 3.48, 0.5);
	CHECK_NEAR(v0, 4.91, 0.5);
	CHECK(corr_value(cl, "quinoline", "quinolinol_8_halogen") < 0);
	CHECK(corr_value("Oc1cccc2c1nccc2", "quinoline", "quinolinol_8_halogen") == 0);
}

/* 2,3,5,6-tetramethyl-4-methylaminopyridine 10.07 (Perrin 1965 via IUPAC dataset, perrin1259
 * of data/iupac-pka.csv): the methylamino group between two methyls turns out of the ring;
 * 4-amino-2,3,5,6-tetramethylpyridine 10.57 (same source) keeps its NH2 resonance and takes
 * no term, nor does 4-methylaminopyridine (one side free). Tolerance 0.5. */
static void test_azine_neighbours__flanked_para_alkylamino(void)
{
	const char *nhme = "CNc1c(C)c(C)nc(c1C)C";
	const char *nh2 = "Cc1nc(C)c(c(c1C)N)C";
	double v = site_pka(nhme, "pyridine", PRED_BASE);
	double w = site_pka(nh2, "pyridine", PRED_BASE);
	CHECK(!isnan(v) && !isnan(w));
	CHECK_NEAR(v, 10.07, 0.5);
	CHECK_NEAR(w, 10.57, 0.5);
	CHECK(corr_value(nhme, "pyridine", "pyridine_para_nr_flanked") < 0);
	CHECK(corr_value(nh2, "pyridine", "pyridine_para_nr_flanked") == 0);
	CHECK(corr_value("CNc1ccncc1", "pyridine", "pyridine_para_nr_flanked") == 0);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_azine_neighbours__ortho_acceptor_twisted_nme2);
	RUN(test_azine_neighbours__twisted_anthranilate);
	RUN(test_azine_neighbours__ortho_steric_bulky_arms);
	RUN(test_azine_neighbours__picolylamines);
	RUN(test_azine_neighbours__halogenated_8_hydroxyquinolines);
	RUN(test_azine_neighbours__flanked_para_alkylamino);
	probe_teardown(model, worker);
	return harness_done();
}
