/* SPDX-License-Identifier: MIT */
/* test_purines.c: ring-N bases of purines and aryl azines whose substituents sit off the
 * Hammett ring: groups on the fused five-ring (fused5_ring_effects), groups on an aryl bonded
 * to the Hammett ring (biaryl_effects), and the N9-glycosyl of nucleosides. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* Acceptors on C8 of a purine reach the pyrimidine N through the fused imidazole:
 * 8-methylsulphonylpurine 0.42 (perrin_supp7323), 2-amino-8-trifluoromethylpurine 2.54
 * (perrin_supp7259), 2-amino-8-methylsulphonylpurine 2.08 (perrin_supp7254); Perrin 1972
 * supplement via IUPAC dataset, train split, each 0.7-1.2 above without the term. Tolerance
 * 0.6. A purin-8-one is no azole ring (fused_imidazolone holds it): 8-hydroxypurine takes no
 * five-ring term. */
static void test_purines__c8_acceptor_reaches_ring_n(void)
{
	CHECK_NEAR(site_max("CS(=O)(=O)c1nc2c([nH]1)cncn2", "pyrimidine", PRED_BASE), 0.42, 0.6);
	CHECK_NEAR(site_max("Nc1ncc2c(n1)nc([nH]2)C(F)(F)F", "pyrimidine", PRED_BASE), 2.54, 0.6);
	CHECK_NEAR(site_max("Nc1ncc2c(n1)nc([nH]2)S(=O)(=O)C", "pyrimidine", PRED_BASE), 2.08,
		   0.6);
	CHECK(site_detail_sum("Nc1ncc2c(n1)nc([nH]2)C(F)(F)F", "pyrimidine", PRED_BASE,
			 "fused five-ring") < -0.4);
	CHECK(site_detail_sum("Oc1nc2c([nH]1)cncn2", "pyrimidine", PRED_BASE, "fused five-ring") == 0);
}

/* The same on the pyridine N of an imidazo[4,5-c]pyridine: 2,6-dichloro-1H-imidazo[4,5-c]-
 * pyridine 1.35 (perrin_supp6937, Perrin 1972 supplement via IUPAC dataset, train split; 2.21
 * without the term); tolerance 0.6. The 2-methylthio group, sigma_p 0.00, changes nothing:
 * 1-methyl-2-methylthioimidazo[4,5-c]pyridine 6.48 (perrin_supp6943, same source). */
static void test_purines__imidazopyridine_c2_group(void)
{
	CHECK_NEAR(site_max("Clc1ncc2c(c1)[nH]c(n2)Cl", "pyridine", PRED_BASE), 1.35, 0.6);
	CHECK(fabs(site_detail_sum("CSc1nc2c(n1C)ccnc2", "pyridine", PRED_BASE, "fused five-ring")) <
	      0.05);
}

/* Para groups of a 5-aryl pass to the ring N of 1-methyl-2(1H)-pyrimidinimines: 5-(4-nitro-
 * phenyl)- 10.05, 5-(4-methoxyphenyl)- 10.88, 5-(4-methylphenyl)- 10.82 (perrin_supp6216,
 * 6214, 6218), and to 2-amino-5-(4-nitrophenyl)pyrimidine 2.70 (perrin_supp5959); Perrin 1972
 * supplement via IUPAC dataset, train split; all read alike without the term (10.68 for the
 * imines). Tolerance 0.5; the nitro analogue at least 0.4 below the methoxy one (0.83
 * measured). */
static void test_purines__biaryl_para_group(void)
{
	double no2 = site_pka("[O-][N+](=O)c1ccc(cc1)c1cnc(=N)n(c1)C", "amidine", PRED_BASE);
	double ome = site_pka("COc1ccc(cc1)c1cnc(=N)n(c1)C", "amidine", PRED_BASE);
	CHECK_NEAR(no2, 10.05, 0.5);
	CHECK_NEAR(ome, 10.88, 0.5);
	CHECK_NEAR(site_pka("Cc1ccc(cc1)c1cnc(=N)n(c1)C", "amidine", PRED_BASE), 10.82, 0.5);
	CHECK(ome - no2 > 0.4);
	CHECK_NEAR(site_max("Nc1ncc(cn1)c1ccc(cc1)[N+](=O)[O-]", "pyrimidine", PRED_BASE), 2.70,
		   0.5);
	CHECK(site_detail_sum("Nc1ncc(cn1)c1ccc(cc1)[N+](=O)[O-]", "pyrimidine", PRED_BASE,
			 "on the 3-aryl") < -0.3);
}

/* The N9-glycosyl of a nucleoside lowers the pyrimidine N: adenosine 3.50 (perrin3338, Perrin
 * 1965 via IUPAC dataset), N6,N6-dimethyladenosine 4.50 (serjeant5672, Serjeant via IUPAC
 * dataset), train split; tolerance 0.4. 9-Methyl-6-methylaminopurine 4.07 (perrin_supp7318,
 * train split) takes no term. */
static void test_purines__nucleoside_glycosyl(void)
{
	const char *ado = "OC[C@H]1O[C@H]([C@@H]([C@@H]1O)O)n1cnc2c1ncnc2N";
	CHECK_NEAR(site_max(ado, "pyrimidine", PRED_BASE), 3.50, 0.4);
	CHECK_NEAR(site_max("OC[C@H]1O[C@H]([C@@H]([C@@H]1O)O)n1cnc2c1ncnc2N(C)C", "pyrimidine",
			    PRED_BASE),
		   4.50, 0.4);
	CHECK(corr_value(ado, "pyrimidine", "purine_n_glycosyl") < -0.2);
	CHECK(corr_value("CNc1ncnc2c1ncn2C", "pyrimidine", "purine_n_glycosyl") == 0);
	CHECK_NEAR(site_max("CNc1ncnc2c1ncn2C", "pyrimidine", PRED_BASE), 4.07, 0.4);
}

/* The 2-amino group of a guanine raises its N7 (purine_n7_guanine_amino): 2-amino-6-hydroxy-
 * 8,9-dimethylpurine 4.11 (perrin_supp7242, Perrin 1972 supplement via IUPAC dataset, train
 * split; 3.25 at the pyrimidine N without it), guanine 3.3 against hypoxanthine 1.9 (from
 * memory, Albert / Perrin). Tolerance 0.6. 9-Methylhypoxanthine 1.83 (perrin2562, Perrin 1965)
 * has no 2-amino group and takes no term; an acylamino group (N2-acetylguanines) neither. */
static void test_purines__guanine_n7(void)
{
	const char *g = "Nc1nc(O)c2c(n1)n(C)c(n2)C";
	CHECK_NEAR(site_max(g, "imidazole", PRED_BASE), 4.11, 0.6);
	CHECK(corr_value(g, "imidazole", "purine_n7_guanine_amino") > 0.7);
	CHECK_NEAR(site_max("Oc1ncnc2c1ncn2C", "imidazole", PRED_BASE), 1.83, 0.6);
	CHECK(corr_value("Oc1ncnc2c1ncn2C", "imidazole", "purine_n7_guanine_amino") == 0);
	CHECK(corr_value("CC(=O)Nc1nc2nc([nH]c2c(=O)n1C)C", "imidazole", "purine_n7_guanine_amino") ==
	      0);
}

/* The amino N-H beside an aromatic N-oxide ionises as the N-hydroxy-imine tautomer
 * (amino_azine_n_oxide_nh): adenosine 1-oxide 12.86 (perrin3340, Perrin 1965 via IUPAC
 * dataset, train split); tolerance 0.6. Adenosine, without the oxide, has no such site. */
static void test_purines__amino_n_oxide_acid(void)
{
	CHECK_NEAR(site_pka("OC[C@H]1O[C@H]([C@@H]([C@@H]1O)O)n1cnc2c1nc[n+](c2N)[O-]", "oxime",
			    PRED_ACID),
		   12.86, 0.6);
	CHECK(isnan(site_pka("OC[C@H]1O[C@H]([C@@H]([C@@H]1O)O)n1cnc2c1ncnc2N", "oxime", PRED_ACID)));
}

/* Aza relatives of benzimidazole-2-thione keep the thione class and take the ring-N terms of
 * the benzimidazole N-H (benzimidazolethione_nh with azabenzimidazole_nh and purine_nh):
 * 1H-imidazo[4,5-c]pyridine-2(3H)-thione 8.63 (perrin_supp6939) and 9-benzylpurine-8(7H)-
 * thione 7.16 (perrin_supp7261), Perrin 1972 supplement via IUPAC dataset, train split; read
 * 9.31 and 7.70 before as benzimidazole N-H. Tolerance 0.5. */
static void test_purines__aza_benzimidazolethiones(void)
{
	const char *bzp = "Sc1nc2c(n1Cc1ccccc1)ncnc2";
	CHECK_NEAR(site_pka("Sc1nc2c([nH]1)ccnc2", "thioamide_nh", PRED_ACID), 8.63, 0.5);
	CHECK_NEAR(site_pka(bzp, "thioamide_nh", PRED_ACID), 7.16, 0.5);
	CHECK(site_detail_sum(bzp, "thioamide_nh", PRED_ACID, "purine_nh") < -2.0);
	CHECK(isnan(site_pka(bzp, "imidazole_nh", PRED_ACID)));
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_purines__c8_acceptor_reaches_ring_n);
	RUN(test_purines__imidazopyridine_c2_group);
	RUN(test_purines__biaryl_para_group);
	RUN(test_purines__nucleoside_glycosyl);
	RUN(test_purines__guanine_n7);
	RUN(test_purines__amino_n_oxide_acid);
	RUN(test_purines__aza_benzimidazolethiones);
	probe_teardown(model, worker);
	return harness_done();
}
