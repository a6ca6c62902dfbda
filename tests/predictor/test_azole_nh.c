/* SPDX-License-Identifier: MIT */
/* test_azole_nh.c: N-H acidity of five-membered heteroaromatics (oxo and thioxo azoles, oxo-
 * fused triazoles, ring acceptors on pyrrole-type N-H, benzimidazolones) against reference
 * rows, and the basic ring N of the parent azoles beside them. Values of data/iupac-pka.csv
 * are Serjeant & Dempsey 1979 or Perrin 1965 via the IUPAC dataset (entry named); tolerance
 * 1.0, about the class uncertainty. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* A ring N-H beside an exocyclic C=O or C=S is an amide- or thioamide-like N-H whose anion the
 * ring heteroatom stabilises, not a pyrrole N-H (about 17): 4,5-dimethylisoxazol-3(2H)-one
 * 6.10 (serjeant2643), benzothiazol-2(3H)-one 6.93 (serjeant3593), 4-methyl-5-phenyl-1,2,4-
 * triazole-3-thione 7.66 (serjeant4725). Without their classes the first two fall to the
 * pyrrole fallback, the third to the plain triazole N-H (10.3). */
static void test_azole_nh__oxo_and_thioxo_azoles_are_strong_nh_acids(void)
{
	double pyrrole = site_pka("c1cc[nH]c1", "pyrrole_nh", PRED_ACID);
	double isoxazolone = site_pka("Cc1c(C)o[nH]c1=O", "azole_nh", PRED_ACID);
	double thiazolone = site_pka("O=c1sc2c([nH]1)cccc2", "azole_nh", PRED_ACID);
	double thione = site_pka("Cn1c(=S)[nH]nc1c1ccccc1", "thioamide_nh", PRED_ACID);
	CHECK(!isnan(pyrrole) && !isnan(isoxazolone) && !isnan(thiazolone) && !isnan(thione));
	CHECK_NEAR(isoxazolone, 6.10, 1.0);
	CHECK_NEAR(thiazolone, 6.93, 1.0);
	CHECK_NEAR(thione, 7.66, 1.0);
	CHECK(thione < site_pka("Cc1nc(c2ccccc2)n[nH]1", "triazole_nh", PRED_ACID) - 1.5);
	CHECK(isoxazolone < pyrrole - 6.0 && thiazolone < pyrrole - 6.0);
}

/* 2-Pyrazolin-5-ones are C-H acids at C4 (their C-H, N-H and O-H tautomers share one aromatic
 * anion): 1-phenyl-2-pyrazolin-5-one 6.56 (serjeant4684); a 4-benzoyl group lowers it,
 * 4-benzoyl-3-methyl-1-phenyl-2-pyrazolin-5-one 4.11 (serjeant6249, step 2). Without the class
 * the first has no acid site and the second is read as a keto amide (10.6). */
static void test_azole_nh__pyrazolone_is_a_carbon_acid(void)
{
	double plain = site_pka("O=C1CC=NN1c1ccccc1", "c_h_acid", PRED_ACID);
	double benzoyl = site_pka("CC1=NN(C(=O)C1C(=O)c1ccccc1)c1ccccc1", "c_h_acid", PRED_ACID);
	CHECK(!isnan(plain) && !isnan(benzoyl));
	CHECK_NEAR(plain, 6.56, 1.0);
	CHECK(benzoyl < plain - 1.0); /* measured 2.45 apart */
}

/* 4-Arylhydrazono-2-pyrazolin-5-ones and -isoxazol-5-ones (azo dyes drawn as the hydrazone)
 * lose the hydrazone N-H; the isoxazolone ring O takes up more of the charge: 3-methyl-1-
 * phenyl-4-phenylhydrazono-2-pyrazolin-5-one 8.9 (serjeant6142), 4-(4-chlorophenyl)hydrazono-
 * 3-methylisoxazol-5-one 6.6 (serjeant5274). Without the class the first has no acid site. */
static void test_azole_nh__hydrazono_azolone_nh(void)
{
	double pyrazolone = site_pka("CC1=NN(C(=O)C1=NNc1ccccc1)c1ccccc1", "hydrazone_nh", PRED_ACID);
	double isoxazolone = site_pka("Clc1ccc(cc1)NN=C1C(=NOC1=O)C", "hydrazone_nh", PRED_ACID);
	CHECK(!isnan(pyrazolone) && !isnan(isoxazolone));
	CHECK_NEAR(pyrazolone, 8.9, 1.0);
	CHECK_NEAR(isoxazolone, 6.6, 1.0);
	CHECK(pyrazolone - isoxazolone > 1.0); /* measured 2.3 apart */
}

/* A third N in the five ring of an oxo-fused azole N-H (a 1,2,4-triazole instead of a
 * pyrazole) makes it about three units more acidic: 5-methyl-[1,2,4]triazolo[1,5-a]pyrimidin-
 * 7-one 6.22 (serjeant3037, its C=O beside the fusion atom that bears the N-H) against
 * 5,7-dimethyl-1H-pyrazolo[3,4-d]pyrimidine-4,6(5H,7H)-dione 9.26 (serjeant3731). */
static void test_azole_nh__oxo_fused_triazole_is_the_stronger_acid(void)
{
	double triazole = site_pka("Cc1cc(=O)n2c(n1)nc[nH]2", "azole_nh", PRED_ACID);
	double pyrazole = site_pka("Cn1c(=O)n(C)c2c(c1=O)cn[nH]2", "azole_nh", PRED_ACID);
	CHECK(!isnan(triazole) && !isnan(pyrazole));
	CHECK_NEAR(triazole, 6.22, 1.0);
	CHECK_NEAR(pyrazole, 9.26, 1.0);
	CHECK(pyrazole - triazole > 2.0); /* measured 3.04 apart */
}

/* The 1,2,3-triazole N-H site holds its ring, so the walk reaches ring substituents and a ring N
 * in a fused pyridine counts (as for imidazoles): 5-amino-1,2,3-triazole-4-carbonitrile 6.15
 * (serjeant2132), 5-amino-6-cyano-1H-1,2,3-triazolo[4,5-b]pyridine 6.53 (serjeant2822,
 * step 2), against 1,2,3-triazole 9.3 and benzotriazole about 8.4 (from memory). Without the
 * walk every one of them read 6.9, the parent the fit was dragged to by such rows. */
static void test_azole_nh__triazole_nh_counts_its_ring(void)
{
	double triazole = site_pka("c1c[nH]nn1", "triazole_nh", PRED_ACID);
	double benzo = site_pka("c1ccc2[nH]nnc2c1", "triazole_nh", PRED_ACID);
	double cyano = site_pka("N#Cc1[nH]nnc1N", "triazole_nh", PRED_ACID);
	double pyrido = site_pka("N#Cc1cc2[nH]nnc2nc1N", "triazole_nh", PRED_ACID);
	CHECK(!isnan(triazole) && !isnan(benzo) && !isnan(cyano) && !isnan(pyrido));
	CHECK_NEAR(triazole, 9.3, 1.0);
	CHECK_NEAR(benzo, 8.4, 1.0);
	CHECK_NEAR(cyano, 6.15, 1.0);
	CHECK_NEAR(pyrido, 6.53, 1.0);
	CHECK(cyano < triazole - 2.0 && pyrido < benzo - 1.0);
}

/* Acceptors on the pyrrole ring of an indole lower its N-H, the stronger acceptor the more
 * (the ring is part of the site, so the walk reaches them, and pyrrole_nh_ring_acceptor adds
 * the share of the charge the ring carbons carry): 3-nitroindole 10.12 (serjeant4115),
 * indole-3-carbaldehyde 12.36 (serjeant4656); indole about 17 (from memory). Before, both were
 * predicted at 14.4. */
static void test_azole_nh__pyrrole_ring_acceptors_follow_their_strength(void)
{
	double nitro = site_pka("[O-][N+](=O)c1c[nH]c2c1cccc2", "pyrrole_nh", PRED_ACID);
	double formyl = site_pka("O=Cc1c[nH]c2c1cccc2", "pyrrole_nh", PRED_ACID);
	double indole = site_pka("c1ccc2c(c1)cc[nH]2", "pyrrole_nh", PRED_ACID);
	CHECK(!isnan(nitro) && !isnan(formyl) && !isnan(indole));
	CHECK_NEAR(nitro, 10.12, 1.0);
	CHECK_NEAR(formyl, 12.36, 1.0);
	CHECK(nitro < formyl && formyl < indole - 2.0); /* measured 2.24 and about 4.5 apart */
}

/* Benzimidazol-2-ones are cyclic ureas: the ring C=O is part of the site (no generic "ether-
 * like O" substituent), and a fused azine lowers the N-H as in purines: 1H-naphth[2,3-d]-
 * imidazol-2(3H)-one 11.62 (serjeant5395) against 6,9-dimethyl-2-methylthiopurin-8(7H)-one
 * 9.41 (serjeant4471, step 2). The basic ring N of the parent azoles stays where it was:
 * imidazole 6.953, benzimidazole 5.532, purine 2.3 (handbook-bases.csv, Perrin 1965). */
static void test_azole_nh__benzimidazolone_nh_and_azole_bases(void)
{
	double naphth = site_pka("O=c1[nH]c2c([nH]1)cc1c(c2)cccc1", "imidazole_nh", PRED_ACID);
	double purinone = site_pka("Cc1nc(SC)nc2c1[nH]c(=O)n2C", "imidazole_nh", PRED_ACID);
	CHECK(!isnan(naphth) && !isnan(purinone));
	CHECK_NEAR(naphth, 11.62, 1.0);
	CHECK_NEAR(purinone, 9.41, 1.0);
	CHECK(site_term_count("O=c1[nH]c2c([nH]1)cc1c(c2)cccc1", "imidazole_nh", PRED_ACID,
			      "generic_substituent") == 0);
	CHECK_NEAR(most_basic("c1ncc[nH]1"), 6.953, 0.5);
	CHECK_NEAR(most_basic("c1ccc2c(c1)[nH]cn2"), 5.532, 0.5);
	CHECK_NEAR(most_basic("c1ncc2c(n1)nc[nH]2"), 2.3, 0.6);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_azole_nh__oxo_and_thioxo_azoles_are_strong_nh_acids);
	RUN(test_azole_nh__pyrazolone_is_a_carbon_acid);
	RUN(test_azole_nh__hydrazono_azolone_nh);
	RUN(test_azole_nh__oxo_fused_triazole_is_the_stronger_acid);
	RUN(test_azole_nh__triazole_nh_counts_its_ring);
	RUN(test_azole_nh__pyrrole_ring_acceptors_follow_their_strength);
	RUN(test_azole_nh__benzimidazolone_nh_and_azole_bases);
	probe_teardown(model, worker);
	return harness_done();
}
