/* SPDX-License-Identifier: MIT */
/* test_base_terms.c: base-site terms of the model (ring N, amino donors, azoles, guanidines,
 * interaction routes, ammonium arms) against reference rows and published values. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* Hydroxy- and mercapto-azines are read as lactams and thiones (predictor/tautomer.c); their
 * cation is the O- or S-protonated one. Perrin 1965 via IUPAC Digitized pKa Dataset v1.0:
 * 2-hydroxypyridine 0.75 (entry perrin1159), 2-mercaptopyridine -1.07 (perrin1176), so the
 * thione is the weaker base; tolerance 0.75, under the classes' stated uncertainty (1.0),
 * as both values are train rows of the fit. At pH 7.4 the thione is neutral (its N-H acid pKa 10.0,
 * perrin1176), so the dominant species is the uncharged thione. */
static void test_base_terms__azinones_protonate_on_the_chalcogen(void)
{
	double thione = site_pka("Sc1ccccn1", "sulfur_base", PRED_BASE);
	double pyridone = site_pka("Oc1ccccn1", "oxygen_base", PRED_BASE);
	CHECK_NEAR(thione, -1.07, 0.75);
	CHECK_NEAR(pyridone, 0.75, 0.75);
	CHECK(pyridone > thione);
	pred_result *r = NULL;
	pred_error err = {0};
	CHECK_INT_EQ(pred_predict(&r, worker, "Sc1ccccn1", PRED_FMT_SMILES, NULL, &err), 0);
	if (!r)
		return;
	const pred_species *top = NULL;
	for (size_t i = 0; i < pred_result_species_count(r); i++) {
		const pred_species *sp = pred_result_species(r, i);
		if (!top || sp->fraction > top->fraction)
			top = sp;
	}
	CHECK(top != NULL);
	if (top) {
		CHECK_INT_EQ(top->charge, 0);
		CHECK_STR_EQ(top->smiles, "S=c1cccc[nH]1");
		CHECK(top->fraction > 0.9);
	}
	pred_result_free(r);
}

/* A centre touching two aryl rings takes as its Hammett ring the one whose substituents
 * shift it most, whichever is drawn first: the 4-nitrophenyl of 4-bromo-N-methyl-N-(4-
 * nitrophenyl)aniline (measured -4.21, perrin_supp4296 via data/iupac-pka.csv, far under
 * diphenylamine's 0.79, perrin0603), not the 4-bromophenyl (which gave 2.28 when drawn
 * first), and the carbonyl O of 4-benzoylbiphenyl (-6.31, perrin3521) one value in either
 * order. */
static void test_base_terms__hammett_ring_of_two_aryls(void)
{
	double br_first = site_pka("Brc1ccc(cc1)N(c1ccc(cc1)[N+](=O)[O-])C", "aniline", PRED_BASE);
	double no2_first = site_pka("c1(ccc(N(c2ccc(Br)cc2)C)cc1)[N+](=O)[O-]", "aniline",
				    PRED_BASE);
	CHECK_NEAR(br_first, no2_first, 1e-9);
	CHECK(br_first < 0.79);
	double k1 = site_pka("O=C(c1ccccc1)c1ccc(cc1)c1ccccc1", "oxygen_base", PRED_BASE);
	double k2 = site_pka("c1ccc(cc1)-c1ccc(C(c2ccccc2)=O)cc1", "oxygen_base", PRED_BASE);
	CHECK_NEAR(k1, k2, 1e-9);
	/* the trifluoromethyl ring of a 2-CF3-phenothiazine's ring N, in either order */
	double p1 = site_pka("CN(CCCN1c2ccccc2Sc2c1cc(cc2)C(F)(F)F)C", "aniline", PRED_BASE);
	double p2 = site_pka("N(C)(CCCN1c2c(ccc(C(F)(F)F)c2)Sc2ccccc21)C", "aniline", PRED_BASE);
	CHECK_NEAR(p1, p2, 1e-9);
}

/* The site values of a molecule, sorted (kind, then pKa) into out (room for max); the count,
 * -1 when the prediction fails. */
static int sorted_sites(const char *smiles, double *out, int max)
{
	pred_result *r = NULL;
	pred_error err = {0};
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err) != 0 || !r)
		return -1;
	int n = 0;
	for (size_t i = 0; i < pred_result_site_count(r) && n < max; i++) {
		const pred_site *st = pred_result_site(r, i);
		out[n++] = st->pka + (st->kind == PRED_BASE ? 1000.0 : 0.0);
	}
	pred_result_free(r);
	for (int i = 1; i < n; i++)
		for (int j = i; j > 0 && out[j - 1] > out[j]; j--) {
			double t = out[j];
			out[j] = out[j - 1];
			out[j - 1] = t;
		}
	return n;
}

/* Of a site row's matches at one atom the one first in canonical order is the site: the
 * thione S of 1-methyl-4-thiouracil-type rings has a ring N on either side as its centre,
 * and a phosphine's P two of its three carbons in the match. The Taft walk meets the groups
 * of one depth in canonical order, before it goes deeper (the imine of a 1,2-dihydro-
 * pyrimidine at 2 bonds by its N and at 3 by its C; the N-methyls of a pyrazolopyrimidine-
 * dione on its ring met as an aryl). Written in another atom order, each gives the same
 * values (common practice: a prediction is a function of the molecule). */
static void test_base_terms__values_do_not_follow_atom_order(void)
{
	static const char *const pairs[][2] = {
		{"Cn1ccc(=S)[nH]c1=S", "n1(c(=S)[nH]c(cc1)=S)C"},
		{"Cn1c(=O)cn[nH]c1=S", "O=c1n(C)c(=S)[nH]nc1"},
		{"Oc1cccc(c1)P(C)C", "P(C)(C)c1cccc(O)c1"},
		{"OS(=O)(=O)c1cccc(c1)P(c1ccccc1)c1ccccc1",
		 "c1c(P(c2ccccc2)c2cc(S(=O)(O)=O)ccc2)cccc1"},
		{"Cn1ccc(=N)n(c1=O)C", "c1cn(c(=O)n(c1=N)C)C"},
		{"CNC1N=CC(=CN1C)Br", "N(C1N(C=C(Br)C=N1)C)C"},
		{"Cn1c(=O)c2c(C)n[nH]c2n(c1=O)C", "n1(C)c2[nH]nc(c2c(=O)n(C)c1=O)C"},
	};
	for (size_t p = 0; p < sizeof pairs / sizeof pairs[0]; p++) {
		double a[16], b[16];
		int na = sorted_sites(pairs[p][0], a, 16), nb = sorted_sites(pairs[p][1], b, 16);
		CHECK(na > 0);
		CHECK_INT_EQ(na, nb);
		for (int i = 0; i < na && i < nb; i++)
			CHECK_NEAR(a[i], b[i], 1e-9);
	}
}

/* A group the Taft walk meets at its root and at another of its atoms at one depth is one
 * substituent, counted once by its tabulated constant (common practice): the ring C=N of
 * 1,5-dimethyl-2,3,6,7-tetrahydro-1H-1,4-diazepine is 3 bonds from the amine N by its C and
 * by its N. (5,7-Dimethyl-2,3-dihydro-1H-1,4-diazepine, the case before, is a vinylogous
 * amidine now, protonated on its imine N.) */
static void test_base_terms__walk_counts_a_group_once(void)
{
	const char *smi = "CN1CCN=C(C)CC1";
	CHECK_INT_EQ(site_term_count(smi, "tertiary_amine", PRED_BASE, "generic_substituent"), 0);
	CHECK_INT_EQ(site_term_count(smi, "tertiary_amine", PRED_BASE, "taft"), 1);
}

/* The N+ of a nitro group on N or O is no base: a nitramine or a nitrate ester is not
 * protonated in water (common practice); read as hydrazine and hydroxylamine N they put a
 * cation beside the C-H acid of 2,2-dinitroethylnitramines and made it 2 units too strong. */
static void test_base_terms__nitro_on_n_or_o_is_no_base(void)
{
	CHECK(isnan(site_pka("CN(C)[N+](=O)[O-]", "hydrazine", PRED_BASE)));
	CHECK(isnan(site_pka("CCO[N+](=O)[O-]", "hydroxylamine", PRED_BASE)));
	CHECK(!isnan(site_pka("CNN", "hydrazine", PRED_BASE)));
	CHECK(!isnan(site_pka("CON", "hydroxylamine", PRED_BASE)));
}

/* Guanidines and amidines with a withdrawing group on N (fragments/corrections.tsv). An acyl
 * on an N without H cannot form the conjugated acylimine of the neutral base, so it withdraws
 * less: 1-acetyl-2-iminoimidazolidine 9.06 against 2-acetyliminoimidazolidine 7.48 (Perrin
 * 1972 supplement via IUPAC dataset, entries perrin_supp5475, perrin_supp5476; train rows, so
 * the tolerance is the class uncertainty). A nitro or cyano group on N leaves a base protonated
 * only in strong acid: nitroguanidine about -0.9, cyanoguanidine about -0.4 (from memory). */
static void test_base_terms__acyl_nitro_cyano_guanidines(void)
{
	double n_acyl = site_pka("CC(=O)N1CCNC1=N", "guanidine", PRED_BASE);
	double acylimino = site_pka("CC(=O)N=C1NCCN1", "guanidine", PRED_BASE);
	CHECK_NEAR(n_acyl, 9.06, 0.8);
	CHECK_NEAR(acylimino, 7.48, 0.8);
	CHECK(n_acyl > acylimino + 0.8);
	double nitro = site_pka("NC(=N)N[N+](=O)[O-]", "guanidine", PRED_BASE);
	double cyano = site_pka("NC(=N)NC#N", "guanidine", PRED_BASE);
	CHECK(!isnan(nitro) && !isnan(cyano));
	CHECK_NEAR(nitro, -0.9, 1.5);
	CHECK_NEAR(cyano, -0.4, 1.5);
	CHECK(nitro < 2 && cyano < 2);
}

/* The imidazole N of a purine holds both rings in its pattern, so the walk reaches a
 * substituent on C8: the first protonation of 8-(methylsulfonyl)purine is 0.42 against 2.76
 * for 8-methylpurine (Perrin 1965 and its 1972 supplement via IUPAC dataset, entries
 * perrin_supp7323 and perrin2575 of data/iupac-pka.csv). With the sulfone the model moves
 * the first proton to the pyrimidine ring (the imidazole N becomes a deep second step), so
 * the check is on each molecule's most basic site. The ring N beside the 2-oxo carbon of a
 * quinazolin-2-one takes no hydration term: 1-methylquinazolin-2(1H)-one 2.15 (entry
 * perrin2272), near the unfused 1-alkylpyrimidin-2-ones 2.6-2.7 (Perrin 1965 via IUPAC
 * dataset). */
static void test_base_terms__fused_pyrimidine_ring_n(void)
{
	double so2me = most_basic("CS(=O)(=O)c1nc2c([nH]1)cncn2");
	double me = most_basic("Cc1nc2c([nH]1)cncn2");
	CHECK(!isnan(so2me) && !isnan(me));
	CHECK(so2me < me - 0.8);
	CHECK_NEAR(so2me, 0.42, 1.5);
	CHECK_NEAR(me, 2.76, 1.0);
	CHECK_NEAR(site_pka("Cn1cc2ccccc2nc1=O", "pyrimidine", PRED_BASE), 2.15, 0.8);
}

/* Pteridinium cations are covalently hydrated (Albert): the equilibrium value lies well above
 * the anhydrous one wherever C4, C6 or C7 carries a hydrogen. 6-methoxy- 3.57, 7-chloro- 3.21
 * and 4-methylthiopteridine 2.53 (Perrin 1965 via IUPAC dataset, entries of data/iupac-pka.csv,
 * train split); 2,4,6,7-tetramethylpteridine 2.60 cannot hydrate and stays below the first
 * three's hydrated level. */
static void test_base_terms__pteridine_cations_hydrate(void)
{
	CHECK_NEAR(most_basic("COc1cnc2c(n1)cncn2"), 3.57, 0.8);
	CHECK_NEAR(most_basic("Clc1cnc2c(n1)ncnc2"), 3.21, 0.8);
	CHECK_NEAR(most_basic("CSc1ncnc2c1nccn2"), 2.53, 0.8);
	CHECK_NEAR(most_basic("Cc1nc(C)c2c(n1)nc(c(n2)C)C"), 2.60, 0.8);
}

/* A dialkylamino group on the azole carbon beside the basic N conjugates as an amidine, as a
 * primary or secondary one does (corrections.tsv, aminoazole_resonance):
 * 2-dimethylamino-6,7,8,9-tetrahydro-1H-naphth[1,2-d]imidazole 7.54, 8-dimethylaminopurine 4.75
 * and 1-methyl-5-nitro-2-piperidinoimidazole 2.72 (Perrin 1965 and its 1972 supplement via
 * IUPAC dataset, entries perrin2740, perrin2550 and perrin_supp5461 of data/iupac-pka.csv);
 * without the term they were predicted 4.4, 2.4 and 1.3. */
static void test_base_terms__dialkylamino_azoles_conjugate(void)
{
	CHECK_NEAR(site_pka("CN(c1nc2c([nH]1)c1CCCCc1cc2)C", "imidazole", PRED_BASE), 7.54, 1.0);
	CHECK_NEAR(most_basic("CN(c1nc2c([nH]1)cncn2)C"), 4.75, 1.0);
	CHECK_NEAR(site_pka("Cn1c(ncc1[N+](=O)[O-])N1CCCCC1", "imidazole", PRED_BASE), 2.72, 1.0);
}

/* The ring N of a 5-aminotetrazole takes the same amidine-type conjugation
 * (aminoazole_resonance): 5-amino-1-methyltetrazole 1.82 and 1-methyl-5-piperidinotetrazole
 * 0.0 (perrin1865, perrin_supp6600 of data/iupac-pka.csv), both 0.08 before, when the
 * tetrazole parent itself had been fitted to the amino rows. Tolerance 1.5 and 1.0 (the
 * piperidino group, twisted by the N1-methyl, conjugates less); 1-methyltetrazole, without
 * the term, reads at least 2 below the amino one (the term sits on the ring N beside the
 * amino carbon, not on the first of the three ring-N sites that corr_value reads). */
static void test_base_terms__aminotetrazoles_conjugate(void)
{
	double amino = site_max("Cn1nnnc1N", "triazole", PRED_BASE);
	CHECK_NEAR(amino, 1.82, 1.5);
	CHECK_NEAR(site_max("Cn1nnnc1N1CCCCC1", "triazole", PRED_BASE), 0.0, 1.0);
	CHECK(amino - site_max("Cn1cnnn1", "triazole", PRED_BASE) > 2.0);
}

/* Two alkylamino donors at C4 and C6 of a pyrimidine saturate (corrections.tsv,
 * pyrimidine_alkylamino_saturation): 4,6-bisdimethylaminopyrimidine 6.34 (entry perrin1634 of
 * data/iupac-pka.csv, Perrin 1965), predicted 8.7 from the additive sigma_p terms alone, 7.4
 * with the fitted correction (tolerance as the fused-ring checks above); a pair
 * with one donor at C2 keeps its value: 4-dimethylamino-2-methylaminopyrimidine 8.10 (entry
 * perrin1723). */
static void test_base_terms__pyrimidine_alkylamino_donors_saturate(void)
{
	double bis46 = most_basic("CN(C)c1cc(N(C)C)ncn1");
	double bis24 = most_basic("CNc1nccc(N(C)C)n1");
	CHECK(!isnan(bis46) && !isnan(bis24));
	/* measured 1.76 apart; the additive terms alone put the 4,6-pair 1.0 above the 2,4-pair */
	CHECK(bis46 < bis24);
	CHECK_NEAR(bis46, 6.34, 1.5);
	CHECK_NEAR(bis24, 8.10, 1.0);
	/* the para donor alone, on the pyrimidine's own para slope (sites.tsv rho_para):
	 * 4-dimethylaminopyrimidine 6.37 (entry perrin_supp6265, Perrin 1972) */
	CHECK_NEAR(most_basic("CN(C)c1ccncn1"), 6.37, 0.5);
}

/* A chain-pattern correction adds once per distinct match: both alkoxy groups flanking the
 * ring N of 2,3-dihydro-6-methoxy-4-methylfuro[2,3-b]pyridine take pyridine_ortho_alkoxy,
 * measured 1.85 (entry perrin_supp6756 of data/iupac-pka.csv, Perrin 1972 supplement); with
 * one ortho term it was predicted 4.3. 2-amino-6-methoxypyridine 4.64 (entry
 * perrin_supp5044) takes one ortho amino and one ortho alkoxy term, as before. */
static void test_base_terms__two_ortho_groups_each_take_the_ortho_term(void)
{
	CHECK_NEAR(most_basic("COc1cc(C)c2c(n1)OCC2"), 1.85, 1.0);
	CHECK_NEAR(most_basic("COc1cccc(n1)N"), 4.64, 0.5);
	/* 2,4,6-trimethylpyridine 7.43 (handbook-bases.csv) */
	CHECK_NEAR(most_basic("Cc1cc(C)nc(C)c1"), 7.43, 0.5);
}

/* An amino group on a benzo-fused azine conjugates with the ring N as far as the cation's
 * quinoid form allows (corrections.tsv fused_ring_amino_*, amino_o_quinoid): isoquinoline 6-
 * (para-quinoid, like quinoline 7-) 7.16, 7- (no quinoid form) 6.19, 1- (benzo ring kept)
 * 7.59, 3- (ortho-quinoid) 5.03 (handbook-bases.csv; 7- and 1- train rows, 6- and 3- test
 * rows, checked for their order only); without the rows every benzo amino group sat at the
 * isoquinoline parent and 3-aminoisoquinoline at 7.4 beside the 1-isomer. */
static void test_base_terms__fused_amino_follows_the_quinoid_form(void)
{
	double six = most_basic("Nc1ccc2c(c1)ccnc2"), seven = most_basic("Nc1ccc2c(c1)cncc2");
	double one = most_basic("Nc1nccc2c1cccc2"), three = most_basic("Nc1ncc2c(c1)cccc2");
	CHECK(!isnan(six) && !isnan(seven) && !isnan(one) && !isnan(three));
	CHECK(six > seven + 0.5);
	CHECK(three < one - 1.5);
	CHECK_NEAR(seven, 6.19, 0.5);
	CHECK_NEAR(one, 7.59, 0.5);
}

/* An amino group on the ring donates less when its N-substituents withdraw (effects.c,
 * global.amine_n_sigma): 2-(prop-2-ynylamino)pyrimidine 2.85 and 2-benzylaminopyrimidine 3.55
 * against 2-ethylaminopyrimidine 3.89 (entries perrin_supp6413, perrin_supp5979, perrin1728 of
 * data/iupac-pka.csv, Perrin 1965 and 1972 supplement); without the term all three sat at
 * 3.65. An alkyl row of substituents.tsv adds its own sigma* (ethyl -0.10, Taft 1956). */
static void test_base_terms__amino_n_substituents_tune_the_donor(void)
{
	double propargyl = most_basic("C#CCNc1ncccn1"), benzyl = most_basic("c1ccccc1CNc1ncccn1");
	double ethyl = most_basic("CCNc1ncccn1");
	CHECK(!isnan(propargyl) && !isnan(benzyl) && !isnan(ethyl));
	CHECK(propargyl < benzyl - 0.3);
	CHECK(benzyl < ethyl - 0.1);
	CHECK_NEAR(propargyl, 2.85, 0.5);
	CHECK_NEAR(ethyl, 3.89, 0.5);
	/* an aza-aryl on the amino N counts whichever Kekule form the input draws (common
	 * practice: one molecule, one answer) */
	double kek1 = most_basic("C1=CN=C(C=C1)Nc1ccncc1");
	double kek2 = most_basic("C1=CC=NC(=C1)Nc1ccncc1");
	CHECK(!isnan(kek1) && !isnan(kek2));
	CHECK_NEAR(kek1, kek2, 0.01);
}

/* DABCO's two N are joined by three N-C-C-N bridges, 1,4-diazepane's by two (3 and 4
 * bonds): each further saturated route adds to the W of the shortest, so the second
 * protonation lies below what ethane-1,2-diamine's 3 bonds alone give. Second steps: DABCO
 * 2.97 (Perrin 1972 supplement, entry perrin_supp6922), 1,4-diazepane 6.685 (Perrin 1965,
 * entry perrin1391), train rows of iupac-pka.csv via the IUPAC Digitized pKa Dataset. */
static void test_base_terms__parallel_saturated_routes_add_to_the_interaction(void)
{
	double w3, w5, w, low;
	diamine_steps("NCCN", &w3, &low);
	diamine_steps("NCCCCN", &w5, &low);
	CHECK(w3 < w5 - 0.5); /* like charges: a negative term, larger when nearer */
	diamine_steps("C1CN2CCN1CC2", &w, &low);
	CHECK(w < w3 - 1.0);
	CHECK_NEAR(low, 2.97, 0.8);
	diamine_steps("C1CNCCNC1", &w, &low);
	CHECK_NEAR(low, 6.685, 0.5);
	/* the far side of a benzene ring is no further route: the ring's share of a charge is
	 * the Hammett term's (ionic sigma, aza terms), so p-phenylenediamine keeps the W of its
	 * 5 bonds, that of butane-1,4-diamine (common practice) */
	diamine_steps("Nc1ccc(N)cc1", &w, &low);
	CHECK_NEAR(w, w5, 0.01);
	/* 1,2,3,4-tetrahydroquinoxaline: the ethano bridge and the benzo ring join the N by 3
	 * bonds each; the saturated one is the shortest route whichever the atom order puts
	 * first, so the aromatic one never counts as a further route (second step 2.11,
	 * perrin2340, train row; 0.75 when the benzo ring was taken first) */
	double wa, wb, lowa, lowb;
	diamine_steps("C1CNc2c(N1)cccc2", &wa, &lowa);
	diamine_steps("c1cc2NCCNc2cc1", &wb, &lowb);
	CHECK_NEAR(wa, wb, 1e-9);
	CHECK_NEAR(wa, w3, 0.01);
	CHECK_NEAR(lowa, 2.11, 0.5);
}

/* An ammonium beside phosphonomethyl arms (corrections.tsv amine_alpha_phosphono, once per
 * arm): the dianion's two charges at three bonds in full and the generic phosphorus sigma*
 * put the ammonium step of N,N-bis(phosphonomethyl)glycine at 14.9 and that of
 * N-(2-carboxyethyl)-N-(phosphonomethyl)glycine at 12.5; measured 10.8 and 10.41 (entries
 * serjeant of data/iupac-pka.csv, Serjeant & Dempsey 1979, train rows). The last macroscopic
 * value is the ammonium step. */
static void test_base_terms__phosphonomethyl_arms_of_an_ammonium(void)
{
	size_t n;
	base_term("OC(=O)CN(CP(=O)(O)O)CP(=O)(O)O", "tertiary_amine", "amino_phosphonate", &n);
	CHECK_INT_EQ((int)n, 1);
	CHECK_NEAR(last_macro("OC(=O)CN(CP(=O)(O)O)CP(=O)(O)O"), 10.8, 1.0);
	CHECK_NEAR(last_macro("OC(=O)CCN(CP(=O)(O)O)CC(=O)O"), 10.41, 1.0);
}

/* Propargylic ammoniums (corrections.tsv amine_propargyl): the C#CH sigma* of the walk (2.0,
 * set on propiolic acid) overstates a triple bond one carbon away: N,N-dimethylbut-2-yn-1-amine
 * 8.28 and propargylamine 8.15 (handbook-bases.csv, Perrin 1965), 6.7 and 7.3 from the walk
 * alone. An alkyne ending in a carbonyl is left to the walk and the charge term. The
 * overcount grows with the class rho*, so the tertiary ammonium takes a second row
 * (amine_propargyl_tertiary) that the primary one does not. */
static void test_base_terms__propargylic_amines(void)
{
	size_t n;
	base_term("CC#CCN(C)C", "tertiary_amine", "alkynyl", &n);
	CHECK_INT_EQ((int)n, 1);
	CHECK_NEAR(site_pka("CC#CCN(C)C", "tertiary_amine", PRED_BASE), 8.28, 0.6);
	CHECK_NEAR(site_pka("NCC#C", "primary_amine", PRED_BASE), 8.15, 0.6);
	CHECK(corr_value("CC#CCN(C)C", "tertiary_amine", "amine_propargyl_tertiary") > 0);
	CHECK(corr_value("NCC#C", "primary_amine", "amine_propargyl_tertiary") == 0);
	base_term("OC(=O)C#CCN1CCCCC1", "tertiary_amine", "alkynyl", &n);
	CHECK_INT_EQ((int)n, 0);
}

/* Amines with only sp3 carbons within four bonds sit above the Taft line of the substituted
 * ones (corrections.tsv amine_alkyl_only): the fitted primary parent is the line's intercept,
 * near the 10.15 of Perrin, Dempsey & Serjeant 1981 (from memory). Perrin 1965 via IUPAC
 * dataset (handbook-bases.csv): methylamine 10.66, propylamine 10.69, cyclohexylamine 10.68,
 * dimethylamine 10.73, 2-aminoethanol 9.50, 3-aminopropan-1-ol 9.96 (from memory). */
static void test_base_terms__alkyl_only_amines_sit_above_the_taft_line(void)
{
	CHECK_NEAR(site_pka("CN", "primary_amine", PRED_BASE), 10.66, 0.3);
	CHECK_NEAR(site_pka("CCCN", "primary_amine", PRED_BASE), 10.69, 0.3);
	CHECK_NEAR(site_pka("NC1CCCCC1", "primary_amine", PRED_BASE), 10.68, 0.3);
	CHECK_NEAR(site_pka("CNC", "secondary_amine", PRED_BASE), 10.73, 0.4);
	CHECK_NEAR(site_pka("NCCO", "primary_amine", PRED_BASE), 9.50, 0.4);
	CHECK_NEAR(site_pka("NCCCO", "primary_amine", PRED_BASE), 9.96, 0.4);
	CHECK(corr_value("NCCCO", "primary_amine", "amine_alkyl_only") == 0);
	CHECK(corr_value("NCCCCCO", "primary_amine", "amine_alkyl_only") > 0.1);
}

/* The piperazine ring term counts each six-ring joining the two N (corrections.tsv
 * amine_piperazine): DABCO's N see each other through three, a piperazine's through one.
 * DABCO 8.82 (Perrin 1965 via IUPAC dataset, train row of data/iupac-pka.csv); its second
 * step is checked with the interaction routes above. */
static void test_base_terms__dabco_counts_its_three_rings(void)
{
	double dabco = corr_value("C1CN2CCN1CC2", "tertiary_amine", "amine_piperazine");
	double pip = corr_value("CN1CCN(C)CC1", "tertiary_amine", "amine_piperazine");
	CHECK(pip < 0);
	CHECK_NEAR(dabco, 3 * pip, 1e-9);
	CHECK_NEAR(most_basic("C1CN2CCN1CC2"), 8.82, 0.6);
}

/* Ethyl and larger groups raise a tertiary ammonium (corrections.tsv
 * amine_tertiary_beta_carbon, a per-match row: one term per hydrocarbon beta carbon):
 * trimethylamine 9.81, N,N-dimethylethylamine 10.16, triethylamine 10.75 (handbook-bases.csv,
 * Perrin 1965 via IUPAC dataset). The walk alone gives all three one value. */
static void test_base_terms__tertiary_ammonium_rises_with_its_beta_carbons(void)
{
	size_t n1, n3, n0;
	const char *t = "tertiary_amine";
	double one = base_term("CCN(C)C", t, "alkyl", &n1);
	double three = base_term("CCN(CC)CC", t, "alkyl", &n3);
	base_term("CN(C)C", t, "alkyl", &n0);
	CHECK_INT_EQ((int)n0, 0);
	CHECK_INT_EQ((int)n1, 1);
	CHECK_INT_EQ((int)n3, 1);
	CHECK(one > 0.05);
	CHECK_NEAR(three, 3 * one, 1e-9);
	/* the ethyl N of 2-(diethylamino)ethylamine counts its two ethyls, not the C-C bridge
	 * that carries the other N */
	double two = base_term("NCCN(CC)CC", t, "alkyl", &n1);
	CHECK_NEAR(two, 2 * one, 1e-9);
	double tri = site_pka("CN(C)C", "tertiary_amine", PRED_BASE);
	double tea = site_pka("CCN(CC)CC", "tertiary_amine", PRED_BASE);
	CHECK(tea - tri > 0.4); /* measured 0.94 apart */
	CHECK_NEAR(tea, 10.75, 0.5);
	CHECK_NEAR(tri, 9.81, 0.4);
}

/* Substituents on an aryl group that the Taft walk meets (effects.c aryl_ring_effects): a
 * meta or para group adds t x sigma to the aryl's sigma* (params.tsv global.aryl_transmission).
 * Benzylamine 9.38, 3-chloro- 9.01, 3-nitrobenzylamine 8.65 (Perrin 1965 and 1972 via IUPAC
 * dataset, train rows of data/iupac-pka.csv); without the term all three take one value. */
static void test_base_terms__ring_substituents_of_a_benzylamine(void)
{
	double h = site_pka("NCc1ccccc1", "primary_amine", PRED_BASE);
	double cl = site_pka("NCc1cccc(c1)Cl", "primary_amine", PRED_BASE);
	double no2 = site_pka("NCc1cccc(c1)[N+](=O)[O-]", "primary_amine", PRED_BASE);
	CHECK(h - cl > 0.2);
	/* sigma_m NO2 0.71, Cl 0.37 (substituent-constants.csv, HLT1991): the shifts keep that
	 * ratio */
	CHECK_NEAR((h - no2) / (h - cl), 0.71 / 0.37, 0.01);
	CHECK_NEAR(h, 9.38, 0.4);
	CHECK_NEAR(cl, 9.01, 0.4);
	CHECK_NEAR(no2, 8.65, 0.4);
}

/* Hydroxylamines by substitution (fragments/sites.tsv alkoxyamine, hydroxylamine_dialkyl,
 * hydroxylamine): an alkyl on O lowers the N basicity, one alkyl on N does not, two do.
 * Values: hydroxylamine 5.94 (CRC Handbook, Dissociation Constants of Inorganic Acids and
 * Bases), N-methylhydroxylamine 5.96 and N,N-dimethylhydroxylamine 5.2 (Perrin 1965 via IUPAC
 * dataset, entries perrin0022/perrin0023), O-methylhydroxylamine 4.6 (Perrin 1965, from
 * memory, handbook-additions.csv). One class for all of them had put the first two near 5.0. */
static void test_base_terms__hydroxylamines_by_substitution(void)
{
	double nh2oh = site_pka("NO", "hydroxylamine", PRED_BASE);
	double mnhoh = site_pka("CNO", "hydroxylamine", PRED_BASE);
	double me2noh = site_pka("CN(C)O", "hydroxylamine", PRED_BASE);
	double meonh2 = site_pka("CON", "hydroxylamine", PRED_BASE);
	CHECK_NEAR(nh2oh, 5.94, 0.4);
	CHECK_NEAR(mnhoh, 5.96, 0.4);
	CHECK_NEAR(me2noh, 5.2, 0.4);
	CHECK_NEAR(meonh2, 4.6, 0.4);
	CHECK(nh2oh - meonh2 > 0.8);
	CHECK(mnhoh - me2noh > 0.3);
}

/* A para ester conjugates with the anilinium N's lone pair like any para acceptor, so an
 * ethyl ester takes sigma_p- (0.68, HLT1991, from memory) as the methyl ester does (0.75),
 * not sigma_p 0.45. Ethyl 4-aminobenzoate 2.51 (Perrin 1965 via IUPAC dataset, entry
 * perrin0527); tolerance 0.4. */
static void test_base_terms__para_esters_conjugate_with_an_aniline(void)
{
	double et = site_pka("CCOC(=O)c1ccc(cc1)N", "aniline", PRED_BASE);
	double me = site_pka("COC(=O)c1ccc(cc1)N", "aniline", PRED_BASE);
	double h = site_pka("Nc1ccccc1", "aniline", PRED_BASE);
	CHECK_NEAR(et, 2.51, 0.4);
	CHECK(fabs(et - me) < 0.3);
	CHECK(h - et > 1.5);
}

/* Aryl ketone and aryl ether groups claim their C=O or O and the ring carbon they sit on,
 * not the whole ring: a benzo ring shared by two carbonyls (a naphthoquinone) or the aryl of
 * a benzylamine that carries an alkoxy group stays free for the other group, whatever the
 * atom order. 3,4-Methylenedioxybenzylamine 9.37 (Perrin 1965 via IUPAC dataset, entry
 * perrin0816; tolerance 0.4): with the ring claimed by the ether O its aryl had read as an
 * alkyl (10.3). 2-Chloro-3-(dimethylamino)-1,4-naphthoquinone: two atom orders (RDKit random
 * SMILES of one molecule) gave 3.23 and 2.80. */
static void test_base_terms__aryl_groups_claim_one_ring_atom(void)
{
	double a = site_pka("O=C1C(Cl)=C(C(=O)c2ccccc21)N(C)C", "enamine", PRED_BASE);
	double b = site_pka("O=C1C(=C(Cl)C(c2ccccc21)=O)N(C)C", "enamine", PRED_BASE);
	CHECK(!isnan(a));
	CHECK_NEAR(a, b, 1e-9);
	CHECK_NEAR(site_pka("NCc1ccc2c(c1)OCO2", "primary_amine", PRED_BASE), 9.37, 0.4);
}

/* A guanidine N on an aza-aromatic ring with a ring N beside the attachment withdraws more than
 * a phenyl (guanidine_n_azaaryl, as amidine_n_azaaryl for amidines): 2-amino-3,4-
 * dihydropteridine 7.68 (Perrin Supplement 1972 via IUPAC dataset, entry perrin_supp7014, train
 * row; tolerance 0.8, the class uncertainty) against 10.2 with the N-aryl term alone; the
 * benzo analogue 2-amino-3,4-dihydroquinazoline takes no such term. */
static void test_base_terms__guanidine_on_an_aza_aryl(void)
{
	double aza = site_pka("NC1=Nc2c(CN1)nccn2", "guanidine", PRED_BASE);
	double benzo = site_pka("NC1=Nc2ccccc2CN1", "guanidine", PRED_BASE);
	CHECK_NEAR(aza, 7.68, 0.8);
	CHECK(benzo - aza > 1.5);
	CHECK(corr_value("NC1=Nc2c(CN1)nccn2", "guanidine", "guanidine_n_azaaryl") < -1.5);
	CHECK(corr_value("NC1=Nc2ccccc2CN1", "guanidine", "guanidine_n_azaaryl") == 0);
}

/* Substituents on the benzo ring of a quinoline reach the ring N through the fusion
 * (global.fused_transmission x rho x sigma; sigma_p where the cation's charge reaches the
 * carbon, sigma_m elsewhere, nothing at the peri carbon). Quinoline 4.81 (handbook-bases.csv,
 * perrin1923), methyl quinoline-6-carboxylate 3.80 (perrin2052), 7-hydroxyquinoline ring N
 * 5.46 (perrin2010), 5-bromo-8-hydroxyquinoline ring N 3.67 (perrin_supp6652), 8-hydroxy-
 * quinoline ring N about 5.0 (from memory; Perrin 1965 via IUPAC dataset); train rows of
 * data/iupac-pka.csv. Before the term all four substituted ones sat at quinoline's value. */
static void test_base_terms__fused_ring_substituents_reach_the_ring_n(void)
{
	double q = site_pka("c1ccc2c(c1)nccc2", "quinoline", PRED_BASE);
	double ester = site_pka("COC(=O)c1ccc2c(c1)cccn2", "quinoline", PRED_BASE);
	double oh7 = site_pka("Oc1ccc2c(c1)nccc2", "quinoline", PRED_BASE);
	double br5 = site_pka("Brc1ccc(c2c1cccn2)O", "quinoline", PRED_BASE);
	double oh8 = site_pka("Oc1cccc2c1nccc2", "quinoline", PRED_BASE);
	CHECK(!isnan(q) && !isnan(ester) && !isnan(oh7) && !isnan(br5) && !isnan(oh8));
	CHECK(ester < q - 0.4);
	CHECK(oh7 > q + 0.2);
	CHECK(br5 < oh8 - 0.4); /* 5-Br is conjugated with the N (odd distance): sigma_p */
	CHECK_NEAR(ester, 3.80, 0.5);
	CHECK_NEAR(oh7, 5.46, 0.5);
	CHECK_NEAR(br5, 3.67, 0.6);
	/* the peri 8-group takes no fused-ring term (through space, beside the N-H+); the 6- and
	 * 7-groups take one each */
	CHECK(site_term_count("COc1cccc2c1cccn2", "quinoline", PRED_BASE, "hammett") == 1);
	CHECK(site_term_count("COc1ccc2c(c1)cccn2", "quinoline", PRED_BASE, "hammett") == 1);
	CHECK(site_term_count("COc1cccc2c1nccc2", "quinoline", PRED_BASE, "hammett") == 0);
	/* quinoxalines and cinnolines take it too: 6-iodo-2,3-dimethylquinoxaline 1.34
	 * (perrin_supp6906) against 2,3-dimethylquinoxaline (no iodo term before), cinnolin-6-ol
	 * ring N 3.63 (perrin2197) against cinnoline 2.37 (from memory); the peri 8-OH of
	 * cinnolin-8-ol (2.69, perrin2199) sits beside N1 and takes none */
	double iodo = most_basic("Ic1ccc2c(c1)nc(c(n2)C)C");
	double dimethyl = most_basic("Cc1nc2ccccc2nc1C");
	CHECK(!isnan(iodo) && !isnan(dimethyl));
	CHECK(iodo < dimethyl - 0.3);
	CHECK_NEAR(iodo, 1.34, 0.6);
	CHECK_NEAR(site_max("Oc1ccc2c(c1)ccnn2", "pyridazine", PRED_BASE), 3.63, 0.6);
	CHECK(site_term_count("Oc1cccc2c1nncc2", "pyridazine", PRED_BASE, "hammett") ==
	      site_term_count("c1ccc2c(c1)ccnn2", "pyridazine", PRED_BASE, "hammett"));
	/* the quinazolines keep their own rows (covalent hydration): no fused-ring term */
	CHECK(site_term_count("COC(=O)c1ccc2c(c1)ncnc2", "pyrimidine", PRED_BASE, "hammett") ==
	      site_term_count("c1ccc2c(c1)ncnc2", "pyrimidine", PRED_BASE, "hammett"));
}

/* An amino group meta to the ring N beside a conjugating one (2- or 4-amino) adds nothing:
 * 2,5-diaminopyridine 6.48 (perrin1092) and 2,3-diaminopyridine 6.92 (perrin_supp5101)
 * against 2-aminopyridine 6.82 (perrin1025), train rows of data/iupac-pka.csv (Perrin 1965 and
 * 1972 supplement); with the meta NH2's sigma_m term alone both lay 0.7-1.1 too high. A lone
 * 3-aminopyridine keeps its term (6.03, from memory; Perrin 1965). */
static void test_base_terms__meta_amino_beside_a_conjugating_one_saturates(void)
{
	double a2 = site_pka("Nc1ccccn1", "pyridine", PRED_BASE);
	double a25 = site_pka("Nc1ccc(cn1)N", "pyridine", PRED_BASE);
	double a23 = site_pka("Nc1ncccc1N", "pyridine", PRED_BASE);
	CHECK(!isnan(a2) && !isnan(a25) && !isnan(a23));
	CHECK(a25 < a2 + 0.3);
	CHECK_NEAR(a25, 6.48, 0.5);
	CHECK_NEAR(a23, 6.92, 0.5);
	CHECK(corr_value("Nc1ccc(cn1)N", "pyridine", "pyridine_meta_amino_saturation") < -0.3);
	CHECK(corr_value("Nc1cccnc1", "pyridine", "pyridine_meta_amino_saturation") == 0);
	CHECK(corr_value("Nc1cc(N)ccn1", "pyridine", "pyridine_meta_amino_saturation") == 0);
}

/* A secondary alkylamino group para to the ring N gives as much as a dimethylamino group:
 * 4-methylamino- 9.65 (perrin1198) and 4-dimethylaminopyridine 9.61 (perrin_supp5181); flanked
 * on both sides it twists and takes no such term (2,3,5,6-tetramethyl-4-methylaminopyridine
 * 10.07, perrin1259). A dialkylamino group beside a ring fusion twists (peri C-H):
 * 9-dimethylaminoacridine 9.08 (perrin_supp7382) against 9-methylaminoacridine 10.43
 * (perrin_supp7388). Train rows of data/iupac-pka.csv (Perrin 1965 and 1972 supplement). */
static void test_base_terms__para_alkylamino_groups_and_their_twist(void)
{
	double nhme = site_pka("CNc1ccncc1", "pyridine", PRED_BASE);
	double nme2 = site_pka("CN(C)c1ccncc1", "pyridine", PRED_BASE);
	CHECK(!isnan(nhme) && !isnan(nme2));
	CHECK(nhme > nme2 - 0.3);
	CHECK_NEAR(nhme, 9.65, 0.4);
	CHECK(corr_value("CNc1ccncc1", "pyridine", "pyridine_para_nh_alkylamino") > 0.2);
	CHECK(corr_value("CNc1c(C)c(C)nc(c1C)C", "pyridine", "pyridine_para_nh_alkylamino") == 0);
	CHECK(corr_value("CN(C)c1ccncc1", "pyridine", "pyridine_para_nh_alkylamino") == 0);
	double acr_nme2 = site_pka("CN(c1c2ccccc2nc2c1cccc2)C", "quinoline", PRED_BASE);
	double acr_nhme = site_pka("CNc1c2ccccc2nc2c1cccc2", "quinoline", PRED_BASE);
	CHECK(!isnan(acr_nme2) && !isnan(acr_nhme));
	CHECK(acr_nme2 < acr_nhme - 0.6);
	CHECK_NEAR(acr_nme2, 9.08, 0.6);
	CHECK(corr_value("CN(C)c1ccncc1", "pyridine", "pyridine_para_nr2_twisted") == 0);
}

/* A -R acceptor para to the ring N withdraws less than its sigma_p says, on pyridines and on
 * quinolines alike (pyridine_para_acceptor): 4-methylsulfinylpyridine 2.94 (perrin_supp5251)
 * and -quinoline 2.88 (perrin_supp6708), 4-methylsulfonylpyridine 1.62 (perrin_supp5253) and
 * -quinoline 1.57 (perrin_supp6710), train rows of data/iupac-pka.csv (Perrin 1972
 * supplement); the quinolines lay 0.7-0.8 low without the row. 4-cyanopyridine 1.86
 * (handbook-bases.csv). */
static void test_base_terms__para_acceptors_of_pyridines_and_quinolines(void)
{
	CHECK(corr_value("CS(=O)c1ccncc1", "pyridine", "pyridine_para_acceptor") > 0.2);
	CHECK(corr_value("CS(=O)c1ccnc2c1cccc2", "quinoline", "pyridine_para_acceptor") > 0.2);
	CHECK(corr_value("CS(=O)c1cccnc1", "pyridine", "pyridine_para_acceptor") == 0);
	CHECK_NEAR(site_pka("CS(=O)c1ccnc2c1cccc2", "quinoline", PRED_BASE), 2.88, 0.5);
	CHECK_NEAR(site_pka("CS(=O)(=O)c1ccnc2c1cccc2", "quinoline", PRED_BASE), 1.57, 0.5);
	CHECK_NEAR(site_pka("N#Cc1ccncc1", "pyridine", PRED_BASE), 1.86, 0.4);
}

/* An alkylthio group para to a ring N donates its lone pair to the cation (sigma_p+ -0.60
 * against sigma_p 0.00 for SCH3, HLT1991 from memory): 4-methylthiopyrimidine 2.41 (perrin1772)
 * and 4-methylthiopyridazine 3.24 (perrin1565), both handbook-bases.csv; 4-methylthioquinoline
 * 5.85 (perrin2062, data/iupac-pka.csv). Without the row they lay 0.5-1.1 low. Not on a purine
 * (the fused azole has its own rows). */
static void test_base_terms__para_thioethers_donate_to_the_azinium(void)
{
	CHECK(corr_value("CSc1ccncn1", "pyrimidine", "azine_para_thioether") > 0.3);
	CHECK(corr_value("CSc1ccccn1", "pyridine", "azine_para_thioether") == 0);
	CHECK(corr_value("CSc1nc(C)nc2c1ncn2C", "pyrimidine", "azine_para_thioether") == 0);
	CHECK_NEAR(most_basic("CSc1ccncn1"), 2.41, 0.4);
	CHECK_NEAR(most_basic("CSc1ccnnc1"), 3.24, 0.4);
	CHECK_NEAR(site_pka("CSc1ccnc2c1cccc2", "quinoline", PRED_BASE), 5.85, 0.5);
}

/* A tertiary phosphine counts each of its carbon groups (fragments/sites.tsv
 * phosphine_tertiary: only the P in the match): trimethylphosphine 8.65, dimethylphenyl-
 * phosphine 6.5, methyldiphenylphosphine 4.6, triphenylphosphine 2.73 (all from memory;
 * Perrin 1965 via IUPAC dataset lists trimethylphosphine 8.8, graded B). With two of the
 * three carbons in the match, PPh3 and PhPMe2 had read alike (0.9). */
static void test_base_terms__phosphines_count_each_aryl(void)
{
	double me3 = site_pka("CP(C)C", "phosphine", PRED_BASE);
	double me2ph = site_pka("CP(C)c1ccccc1", "phosphine", PRED_BASE);
	double meph2 = site_pka("CP(c1ccccc1)c1ccccc1", "phosphine", PRED_BASE);
	double ph3 = site_pka("c1ccccc1P(c1ccccc1)c1ccccc1", "phosphine", PRED_BASE);
	CHECK_NEAR(me3, 8.65, 0.6);
	CHECK_NEAR(me2ph, 6.5, 0.8);
	CHECK_NEAR(meph2, 4.6, 0.8);
	CHECK_NEAR(ph3, 2.73, 0.8);
	CHECK(me3 > me2ph && me2ph > meph2 && meph2 > ph3);
}

/* The groups on a ring alkyl carbon pull on the ring by induction (effects.c
 * alkyl_c_effects, global.alkyl_inductive): 2-(methylthiomethyl)pyridine 4.64 against
 * 2-ethylpyridine 5.93 (Perrin 1965 and Supplement 1972 via IUPAC dataset, entries
 * perrin_supp5255 and perrin1138 of data/iupac-pka.csv). Without the term the CH2SCH3 group
 * counts as an ethyl and both read 5.5-5.8; tolerance 0.8 (one row, generic group). */
static void test_base_terms__ring_alkyl_carbon_passes_on_its_groups(void)
{
	double thio = site_pka("CSCc1ccccn1", "pyridine", PRED_BASE);
	double ethyl = site_pka("CCc1ccccn1", "pyridine", PRED_BASE);
	CHECK(!isnan(thio) && !isnan(ethyl));
	CHECK(ethyl - thio > 0.3); /* measured 1.29 apart */
	CHECK_NEAR(thio, 4.64, 0.8);
}

/* An amine N that carries an aryl pulls on a nearby amine more than an alkylamine N
 * (substituents.tsv, arylamine_N, sigma* 1.2): N-(2-aminoethyl)aniline 9.44 against
 * N-(2-aminoethyl)piperidine's primary amine (Perrin 1965 via IUPAC dataset, entry perrin0063 in
 * data/handbook-bases.csv; the piperidine analogue is predicted from the generic amine N). With
 * the generic amine N (sigma* 0.8) it read 9.81; tolerance 0.5 (core class error 0.36). */
static void test_base_terms__aryl_amine_n_pulls_like_an_amide_n(void)
{
	double aryl = site_pka("NCCNc1ccccc1", "primary_amine", PRED_BASE);
	double alkyl = site_pka("NCCN1CCCCC1", "primary_amine", PRED_BASE);
	CHECK(!isnan(aryl) && !isnan(alkyl));
	CHECK(alkyl - aryl > 0.2);
	CHECK_NEAR(aryl, 9.44, 0.5);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_base_terms__azinones_protonate_on_the_chalcogen);
	RUN(test_base_terms__nitro_on_n_or_o_is_no_base);
	RUN(test_base_terms__hammett_ring_of_two_aryls);
	RUN(test_base_terms__values_do_not_follow_atom_order);
	RUN(test_base_terms__walk_counts_a_group_once);
	RUN(test_base_terms__acyl_nitro_cyano_guanidines);
	RUN(test_base_terms__fused_pyrimidine_ring_n);
	RUN(test_base_terms__pteridine_cations_hydrate);
	RUN(test_base_terms__dialkylamino_azoles_conjugate);
	RUN(test_base_terms__aminotetrazoles_conjugate);
	RUN(test_base_terms__pyrimidine_alkylamino_donors_saturate);
	RUN(test_base_terms__two_ortho_groups_each_take_the_ortho_term);
	RUN(test_base_terms__fused_amino_follows_the_quinoid_form);
	RUN(test_base_terms__amino_n_substituents_tune_the_donor);
	RUN(test_base_terms__parallel_saturated_routes_add_to_the_interaction);
	RUN(test_base_terms__phosphonomethyl_arms_of_an_ammonium);
	RUN(test_base_terms__propargylic_amines);
	RUN(test_base_terms__dabco_counts_its_three_rings);
	RUN(test_base_terms__tertiary_ammonium_rises_with_its_beta_carbons);
	RUN(test_base_terms__ring_substituents_of_a_benzylamine);
	RUN(test_base_terms__hydroxylamines_by_substitution);
	RUN(test_base_terms__para_esters_conjugate_with_an_aniline);
	RUN(test_base_terms__aryl_groups_claim_one_ring_atom);
	RUN(test_base_terms__guanidine_on_an_aza_aryl);
	RUN(test_base_terms__phosphines_count_each_aryl);
	RUN(test_base_terms__fused_ring_substituents_reach_the_ring_n);
	RUN(test_base_terms__meta_amino_beside_a_conjugating_one_saturates);
	RUN(test_base_terms__para_alkylamino_groups_and_their_twist);
	RUN(test_base_terms__para_acceptors_of_pyridines_and_quinolines);
	RUN(test_base_terms__para_thioethers_donate_to_the_azinium);
	RUN(test_base_terms__ring_alkyl_carbon_passes_on_its_groups);
	RUN(test_base_terms__aryl_amine_n_pulls_like_an_amide_n);
	RUN(test_base_terms__alkyl_only_amines_sit_above_the_taft_line);
	probe_teardown(model, worker);
	return harness_done();
}
