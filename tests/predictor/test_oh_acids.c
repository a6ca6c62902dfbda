/* SPDX-License-Identifier: MIT */
/* test_oh_acids.c: carboxylic acid and phenol corrections of fragments/corrections.tsv
 * (ortho groups, hydration, heteroaryl rings, H-bonded diacid monoanions, sulfonates) against
 * reference rows. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "predictor.h"

static pred_worker *worker;

/* Acid pKa values of the sites of this group, lowest first, up to max; returns the count. */
static size_t acid_steps(const char *smiles, const char *group, double *out, size_t max)
{
	pred_result *r = NULL;
	pred_error err = {0};
	size_t n = 0;
	if (pred_predict(&r, worker, smiles, PRED_FMT_SMILES, NULL, &err)) {
		fprintf(stderr, "%s: %s\n", smiles, err.msg);
		return 0;
	}
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != PRED_ACID || strcmp(s->group, group) || n == max)
			continue;
		size_t k = n++;
		for (; k > 0 && out[k - 1] > s->pka; k--)
			out[k] = out[k - 1];
		out[k] = s->pka;
	}
	pred_result_free(r);
	return n;
}

/* Lowest acid pKa of this group; NAN when the molecule has none. */
static double acid_pka(const char *smiles, const char *group)
{
	double v[8];
	return acid_steps(smiles, group, v, 8) ? v[0] : NAN;
}

/* An ortho tert-butyl group hinders the solvation of the phenoxide O (phenol_ortho_tert_alkyl):
 * 2-tert-butylphenol 11.16, 2,4-di-tert-butylphenol 11.56, 2,6-di-tert-butyl-4-nitrophenol
 * 6.65 (Serjeant & Dempsey 1979 via IUPAC dataset, entries serjeant5036, serjeant5945 and
 * serjeant6007 of data/iupac-pka.csv); 2-methylphenol 10.32 (handbook-acids.csv). Without
 * the term the tert-butyl phenol is predicted below the methyl phenol (10.06 against 10.15);
 * with a para nitro group the charge sits on the nitro and the term stays out. */
static void test_oh_acids__ortho_tert_butyl_phenol_is_weaker(void)
{
	double tbu = acid_pka("Oc1ccccc1C(C)(C)C", "phenol");
	double me = acid_pka("Cc1ccccc1O", "phenol");
	CHECK(!isnan(tbu) && !isnan(me));
	CHECK(tbu > me + 0.5); /* measured 0.84 apart */
	CHECK_NEAR(tbu, 11.16, 0.5);
	CHECK_NEAR(acid_pka("Oc1ccc(cc1C(C)(C)C)C(C)(C)C", "phenol"), 11.56, 0.5);
	CHECK_NEAR(acid_pka("[O-][N+](=O)c1cc(c(c(c1)C(C)(C)C)O)C(C)(C)C", "phenol"), 6.65, 1.0);
}

/* A ketone carbonyl beside a phenol OH takes a stronger H-bond than a formyl one
 * (phenol_ortho_carbonyl, phenol_ortho_formyl): 2'-hydroxyacetophenone 10.26
 * (handbook-acids.csv, Serjeant & Dempsey 1979 entry 3977) and
 * 2-hydroxy-3-methoxy-5-nitrobenzaldehyde 4.77 (entry serjeant4216 of data/iupac-pka.csv).
 * With one term for both the ketone was predicted 1.4 too low and the aldehydes too high. */
static void test_oh_acids__ketone_holds_the_phenol_proton_more_than_aldehyde(void)
{
	double ketone = acid_pka("CC(=O)c1ccccc1O", "phenol");
	double aldehyde = acid_pka("COc1cc(cc(c1O)C=O)[N+](=O)[O-]", "phenol");
	CHECK(!isnan(ketone) && !isnan(aldehyde));
	CHECK_NEAR(ketone, 10.26, 0.8);
	CHECK_NEAR(aldehyde, 4.77, 0.8);
}

/* The carbonyl of a fused five-membered ring points away from the OH: no H-bond, and the
 * ring acyl withdraws (phenol_ortho_ring5_acyl). 7-hydroxy-4-nitroindan-1-one 5.27 against
 * 8-hydroxy-5-nitro-3,4-dihydronaphthalen-1(2H)-one 8.50 (Serjeant & Dempsey 1979 via IUPAC
 * dataset, entries serjeant4676 and serjeant5138 of data/iupac-pka.csv); both were
 * predicted 7.96 before the row. */
static void test_oh_acids__indanone_oh_has_no_hydrogen_bond(void)
{
	double indanone = acid_pka("[O-][N+](=O)c1ccc(c2c1CCC2=O)O", "phenol");
	double tetralone = acid_pka("[O-][N+](=O)c1ccc(c2c1CCCC2=O)O", "phenol");
	CHECK(!isnan(indanone) && !isnan(tetralone));
	CHECK(tetralone - indanone > 1.5); /* measured 3.2 apart */
	CHECK_NEAR(indanone, 5.27, 0.8);
}

/* Glyoxylic acid ionises as its gem-diol (acid_alpha_formyl_hydrate): 2.98 (Serjeant &
 * Dempsey 1979 via IUPAC dataset, entry serjeant2040 of data/iupac-pka.csv), above pyruvic
 * acid 2.39 (from memory, CRC table of organic acids), whose keto form dominates more; the
 * formyl form alone gives 1.4. */
static void test_oh_acids__glyoxylic_acid_ionises_as_its_hydrate(void)
{
	double glyoxylic = acid_pka("O=CC(=O)O", "carboxylic_acid");
	double pyruvic = acid_pka("CC(=O)C(=O)O", "carboxylic_acid");
	CHECK(!isnan(glyoxylic) && !isnan(pyruvic));
	CHECK(glyoxylic > pyruvic);
	CHECK_NEAR(glyoxylic, 2.98, 0.6);
}

/* The NH of a pyrrole ring donates into its carboxyl (acid_pyrrole_ring): pyrrole-2- and
 * furan-2-carboxylic acid 4.45 and 3.16 (from memory, CRC table of organic acids);
 * 5-methylpyrrole-2-carboxylic acid 4.88 (Serjeant & Dempsey 1979 via IUPAC dataset, entry
 * serjeant3111 of data/iupac-pka.csv). Without the row all three had one parent, 3.85. */
static void test_oh_acids__pyrrole_carboxylic_acid_is_weaker_than_furoic(void)
{
	double pyrrole = acid_pka("OC(=O)c1ccc[nH]1", "carboxylic_acid");
	double furan = acid_pka("OC(=O)c1ccco1", "carboxylic_acid");
	CHECK(!isnan(pyrrole) && !isnan(furan));
	CHECK(pyrrole > furan + 0.4); /* 1.3 apart, from memory */
	CHECK_NEAR(acid_pka("Cc1ccc([nH]1)C(=O)O", "carboxylic_acid"), 4.88, 0.8);
}

/* Vicinal carboxyls on the carbons of a furan ring hold the monoanion by an H-bond
 * (diacid_heteroaryl5_vicinal): furan-3,4-dicarboxylic acid 1.44 / 7.84 (Serjeant & Dempsey
 * 1979 via IUPAC dataset, entry serjeant2818 of data/iupac-pka.csv); 3.55 / 5.26 without the
 * row. */
static void test_oh_acids__furan_3_4_diacid_monoanion_is_hydrogen_bonded(void)
{
	double v[2];
	CHECK_INT_EQ(acid_steps("OC(=O)c1cocc1C(=O)O", "carboxylic_acid", v, 2), 2);
	CHECK(v[1] - v[0] > 4.0); /* measured 6.4 apart */
	CHECK_NEAR(v[0], 1.44, 0.8);
	CHECK_NEAR(v[1], 7.84, 0.8);
}

/* Two carbon groups on one carbon of a succinic acid hold the carboxyls gauche and the
 * monoanion H-bonded (diacid_succinic_gem_disubstituted): 2-benzyl-2-methylsuccinic acid
 * 4.14 / 6.49 (Serjeant & Dempsey 1979 via IUPAC dataset, entry serjeant5567 of
 * data/iupac-pka.csv); 4.06 / 5.27 without the row. */
static void test_oh_acids__gem_disubstituted_succinic_monoanion_is_hydrogen_bonded(void)
{
	double v[2];
	CHECK_INT_EQ(acid_steps("OC(=O)C(Cc1ccccc1)(CC(=O)O)C", "carboxylic_acid", v, 2), 2);
	CHECK(v[1] - v[0] > 1.8); /* measured 2.35 apart */
	CHECK_NEAR(v[1], 6.49, 0.8);
}

/* The Hammett constants of SO3- already hold the field of its charge, so a phenol does not
 * take the stepwise interaction with it as well (sulfonic_acid charge_scale 0): across the ring
 * fusion a sulfonate acidifies a naphthol, 5-hydroxynaphthalene-1-sulfonic acid 9.11 against
 * 1-naphthol 9.39 (Serjeant & Dempsey 1979 via IUPAC dataset, entries serjeant5104 and
 * serjeant4956 of data/iupac-pka.csv); 9.72 with the interaction. Tolerance 1.5 x the phenol
 * class uncertainty (0.3). */
static void test_oh_acids__sulfonate_charge_is_counted_once(void)
{
	CHECK_NEAR(acid_pka("Oc1cccc2c1cccc2S(=O)(=O)O", "phenol"), 9.11, 0.45);
}

/* An OH beside the ring fusion of an indazole gives part of its charge to the pyrazole N
 * (phenol_indazole_alpha): 7-hydroxy-1H-indazole-4-sulfonic acid 7.60 and
 * 4,6-dinitro-1H-indazol-7-ol 2.50 (Serjeant & Dempsey 1979 via IUPAC dataset, entries
 * serjeant3882 and serjeant3513 of data/iupac-pka.csv); 8.94 and 3.23 without the rows. */
static void test_oh_acids__indazol_7_ol_is_more_acidic(void)
{
	CHECK_NEAR(acid_pka("Oc1ccc(c2c1[nH]nc2)S(=O)(=O)O", "phenol"), 7.60, 0.6);
	CHECK_NEAR(acid_pka("[O-][N+](=O)c1cc([N+](=O)[O-])c2c(c1O)[nH]nc2", "phenol"), 2.50, 0.6);
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
	RUN(test_oh_acids__ortho_tert_butyl_phenol_is_weaker);
	RUN(test_oh_acids__ketone_holds_the_phenol_proton_more_than_aldehyde);
	RUN(test_oh_acids__indanone_oh_has_no_hydrogen_bond);
	RUN(test_oh_acids__glyoxylic_acid_ionises_as_its_hydrate);
	RUN(test_oh_acids__pyrrole_carboxylic_acid_is_weaker_than_furoic);
	RUN(test_oh_acids__furan_3_4_diacid_monoanion_is_hydrogen_bonded);
	RUN(test_oh_acids__gem_disubstituted_succinic_monoanion_is_hydrogen_bonded);
	RUN(test_oh_acids__sulfonate_charge_is_counted_once);
	RUN(test_oh_acids__indazol_7_ol_is_more_acidic);
	pred_worker_free(worker);
	pred_model_free(model);
	return harness_done();
}
