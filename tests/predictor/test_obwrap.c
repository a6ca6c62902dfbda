/* SPDX-License-Identifier: MIT */
/* test_obwrap.c: the Open Babel wrapper: parsing, perception, SMARTS, canonical SMILES, edits. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "obwrap.h"

#define NCI_SET "/usr/share/RDKit/Data/NCI/first_5K.smi"

static obw_ctx *ctx;

static obw_mol *parse(const char *smi)
{
	obw_mol *m = NULL;
	char msg[256] = "";
	int rc = obw_mol_parse(&m, ctx, smi, OBW_SMILES, msg, sizeof msg);
	if (rc)
		fprintf(stderr, "parse '%s': %d %s\n", smi, rc, msg);
	return m;
}

static char *canon(const char *smi)
{
	obw_mol *m = parse(smi);
	char *s = m ? obw_mol_canonical(m, ctx, NULL, 0) : NULL;
	obw_mol_free(m);
	return s;
}

static int count_matches(const char *smarts, const char *smi)
{
	obw_pattern *p = obw_pattern_parse(smarts, NULL, 0);
	obw_mol *m = parse(smi);
	int *hits = NULL;
	int n = (p && m) ? obw_pattern_match(&hits, p, m) : -99;
	free(hits);
	obw_mol_free(m);
	obw_pattern_free(p);
	return n;
}

/* Atom facts of acetic acid drawn with an explicit H: common practice (CH3COOH). */
static void test_obwrap__explicit_h_folds_and_keeps_input_index(void)
{
	obw_mol *m = parse("[H]OC(=O)C");
	const obw_atom *a;
	CHECK(m != NULL);
	if (!m)
		return;
	CHECK_INT_EQ(obw_mol_atoms(m, &a), 4);
	CHECK_INT_EQ(a[0].element, 8);
	CHECK_INT_EQ(a[0].orig_index, 1);
	CHECK_INT_EQ(a[0].hcount, 1);
	CHECK_INT_EQ(a[0].degree, 1);
	CHECK_INT_EQ(a[1].element, 6);
	CHECK_INT_EQ(a[1].orig_index, 2);
	CHECK_INT_EQ(a[1].valence, 4);
	CHECK_INT_EQ(a[1].hyb, 2);
	CHECK_INT_EQ(a[2].orig_index, 3);
	CHECK_INT_EQ(a[3].orig_index, 4);
	CHECK_INT_EQ(a[3].hcount, 3);
	CHECK_INT_EQ(a[3].hyb, 3);
	obw_mol_free(m);
	m = parse("CC#N"); /* acetonitrile: sp carbon and nitrogen */
	obw_mol_atoms(m, &a);
	CHECK(m && a[1].hyb == 1 && a[2].hyb == 1 && a[0].hyb == 3);
	obw_mol_free(m);
	m = parse("CS(=O)(=O)O"); /* methanesulfonic acid: tetrahedral S */
	obw_mol_atoms(m, &a);
	CHECK(m && a[1].hyb == 3 && a[2].hyb == 2);
	obw_mol_free(m);
}

/* Deuterium stays an atom; H2 and the proton stay what they are (common practice). */
static void test_obwrap__isotopic_and_bare_hydrogens_are_kept(void)
{
	const obw_atom *a;
	obw_mol *m = parse("[2H]OC");
	CHECK(m && obw_mol_atoms(m, &a) == 3);
	CHECK(m && a[0].element == 1 && a[0].isotope == 2 && a[1].hcount == 1);
	obw_mol_free(m);
	m = parse("[H][H]");
	CHECK(m && obw_mol_atoms(m, &a) == 2);
	obw_mol_free(m);
	m = parse("[H+]");
	CHECK(m && obw_mol_atoms(m, &a) == 1 && a[0].charge == 1);
	obw_mol_free(m);
}

/* Pyridinium and acetate charges, H counts: common practice. */
static void test_obwrap__charges_and_hydrogen_counts(void)
{
	const obw_atom *a;
	obw_mol *m = parse("c1cc[nH+]cc1.CC(=O)[O-]");
	CHECK(m && obw_mol_atoms(m, &a) == 10);
	if (!m)
		return;
	CHECK_INT_EQ(a[3].charge, 1);
	CHECK_INT_EQ(a[3].hcount, 1);
	CHECK_INT_EQ(a[3].aromatic, 1);
	CHECK_INT_EQ(a[9].charge, -1);
	CHECK_INT_EQ(a[9].hcount, 0);
	CHECK_INT_EQ(a[0].hcount, 1);
	obw_mol_free(m);
}

/* Naphthalene: 2 six-membered SSSR rings, 10 aromatic atoms, kekulé orders; indole: a 5 and a
 * 6 ring. Common practice. */
static void test_obwrap__rings_and_aromaticity(void)
{
	const obw_atom *a;
	const obw_bond *b;
	obw_rings r;
	obw_mol *m = parse("C1=CC=C2C=CC=CC2=C1");
	CHECK(m != NULL);
	if (!m)
		return;
	size_t na = obw_mol_atoms(m, &a), nb = obw_mol_bonds(m, &b);
	obw_mol_rings(m, &r);
	CHECK_INT_EQ(r.n_rings, 2);
	CHECK(r.n_rings == 2 && r.sizes[0] == 6 && r.sizes[1] == 6);
	int arom = 0, doubles = 0;
	for (size_t i = 0; i < na; i++)
		arom += a[i].aromatic && a[i].ring_size == 6 && a[i].in_ring;
	for (size_t i = 0; i < nb; i++)
		doubles += b[i].order == 2 && b[i].aromatic;
	CHECK_INT_EQ(arom, 10);
	CHECK_INT_EQ(doubles, 5);
	/* ring atoms listed in ring order: consecutive entries are bonded */
	for (int k = 0; k < 6 && r.n_rings; k++) {
		int x = r.atoms[k], y = r.atoms[(k + 1) % 6], bonded = 0;
		for (size_t i = 0; i < nb; i++)
			bonded |= (b[i].a == x && b[i].b == y) || (b[i].a == y && b[i].b == x);
		CHECK(bonded);
	}
	obw_mol_free(m);
	m = parse("c1ccc2[nH]ccc2c1");
	obw_mol_rings(m, &r);
	obw_mol_atoms(m, &a);
	CHECK_INT_EQ(r.n_rings, 2);
	CHECK_INT_EQ(a[4].ring_size, 5);
	CHECK_INT_EQ(a[4].aromatic, 1);
	obw_mol_free(m);
}

static void test_obwrap__smarts_unique_matches(void)
{
	CHECK_INT_EQ(count_matches("[CX3](=O)[OX2H1]", "OC(=O)CCC(=O)O"), 2); /* succinic acid */
	CHECK_INT_EQ(count_matches("[OX2H]c", "Oc1ccccc1"), 1);               /* phenol */
	CHECK_INT_EQ(count_matches("c", "c1ccccc1"), 6);
	CHECK_INT_EQ(count_matches("[NX3;H2]", "CCO"), 0);
	CHECK(obw_pattern_parse("[C", NULL, 0) == NULL);
	obw_pattern *p = obw_pattern_parse("[CX3](=O)[OX2H1]", NULL, 0);
	CHECK(p && obw_pattern_atom_count(p) == 3);
	obw_mol *m = parse("[H]OC(=O)C");
	int *hits = NULL;
	CHECK_INT_EQ(obw_pattern_match(&hits, p, m), 1);
	CHECK(hits && hits[0] == 1 && hits[1] == 2 && hits[2] == 0); /* C, =O, OH */
	free(hits);
	obw_mol_free(m);
	obw_pattern_free(p);
}

/* Different drawings of one molecule give one canonical SMILES. */
static void test_obwrap__canonical_round_trip(void)
{
	char *a = canon("OC(=O)C"), *b = canon("CC(O)=O"), *c = canon("C(C(=O)O)");
	CHECK(a && b && c);
	CHECK_STR_EQ(a, b);
	CHECK_STR_EQ(a, c);
	char *d = canon(a), *k1 = canon("C1=CC=CC=C1O"), *k2 = canon("Oc1ccccc1");
	CHECK_STR_EQ(d, a);
	CHECK_STR_EQ(k1, k2);
	CHECK(a && !strchr(a, '\t') && !strchr(a, '\n'));
	free(a), free(b), free(c), free(d), free(k1), free(k2);
}

/* Propanoic acid's two O differ; the two methyls of isobutane are equivalent. */
static void test_obwrap__symmetry_classes(void)
{
	obw_mol *m = parse("CC(C)C");
	int cls[4];
	CHECK_INT_EQ(obw_mol_symmetry(m, cls, 4, NULL, 0), 0);
	CHECK(cls[0] == cls[2] && cls[2] == cls[3] && cls[0] != cls[1]);
	obw_mol_free(m);
	m = parse("OC(=O)CC(=O)O"); /* malonic acid: both OH alike */
	int c2[7];
	CHECK_INT_EQ(obw_mol_symmetry(m, c2, 7, NULL, 0), 0);
	CHECK(c2[0] == c2[6] && c2[2] == c2[5] && c2[0] != c2[2]);
	CHECK(obw_mol_symmetry(m, c2, 3, NULL, 0) < 0);
	obw_mol_free(m);
}

/* Acetate is acetic acid less the O-H proton (common practice). */
static void test_obwrap__deprotonate_acetic_acid(void)
{
	obw_mol *m = parse("[H]OC(=O)C");
	char *s = NULL;
	CHECK(m != NULL);
	if (!m)
		return;
	CHECK_INT_EQ(obw_mol_set_atom(m, 0, -1, 0), 0);
	CHECK_INT_EQ(obw_mol_refresh(m, NULL, 0), 0);
	s = obw_mol_canonical(m, ctx, NULL, 0);
	char *want = canon("CC(=O)[O-]");
	CHECK_STR_EQ(s, want);
	const obw_atom *a;
	obw_mol_atoms(m, &a);
	CHECK(a[0].charge == -1 && a[0].hcount == 0 && a[0].orig_index == 1);
	CHECK(obw_mol_set_atom(m, 99, 0, 0) < 0);
	free(s);
	free(want);
	obw_mol_free(m);
}

/* 2-hydroxypyridine -> 2-pyridone by moving one H and two bond orders (common practice). */
static void test_obwrap__bond_order_edit_and_clone(void)
{
	obw_mol *m = parse("Oc1ccccn1"), *c = NULL;
	CHECK(m && obw_mol_clone(&c, m) == 0);
	if (!m || !c)
		return;
	/* atoms: O0 C1 C2 C3 C4 C5 N6 */
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 0, 1, 2), 0);
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 1, 6, 1), 0);
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 1, 2, 1), 0);
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 2, 3, 2), 0);
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 3, 4, 1), 0);
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 4, 5, 2), 0);
	CHECK_INT_EQ(obw_mol_set_bond_order(m, 5, 6, 1), 0);
	CHECK_INT_EQ(obw_mol_set_atom(m, 0, 0, 0), 0);
	CHECK_INT_EQ(obw_mol_set_atom(m, 6, 0, 1), 0);
	CHECK_INT_EQ(obw_mol_refresh(m, NULL, 0), 0);
	char *got = obw_mol_canonical(m, ctx, NULL, 0), *want = canon("O=C1C=CC=CN1");
	char *orig = obw_mol_canonical(c, ctx, NULL, 0), *owant = canon("Oc1ccccn1");
	CHECK_STR_EQ(got, want);
	CHECK_STR_EQ(orig, owant);
	CHECK(obw_mol_set_bond_order(m, 0, 3, 1) < 0); /* no such bond */
	free(got), free(want), free(orig), free(owant);
	obw_mol_free(c);
	obw_mol_free(m);
}

static void test_obwrap__components_and_keep_atoms(void)
{
	obw_mol *m = parse("[Na+].[O-]C(=O)c1ccccc1");
	int comp[10];
	unsigned char keep[10];
	CHECK(m != NULL);
	if (!m)
		return;
	CHECK_INT_EQ(obw_mol_components(m, comp, 10), 2);
	for (int i = 0; i < 10; i++)
		keep[i] = comp[i] != comp[0];
	CHECK_INT_EQ(obw_mol_keep_atoms(m, keep, 10, NULL, 0), 0);
	const obw_atom *a;
	CHECK_INT_EQ(obw_mol_atoms(m, &a), 9);
	CHECK_INT_EQ(a[0].orig_index, 1);
	CHECK_INT_EQ(a[0].charge, -1);
	CHECK_INT_EQ(a[8].orig_index, 9);
	CHECK_INT_EQ(a[8].aromatic, 1);
	char *s = obw_mol_canonical(m, ctx, NULL, 0), *w = canon("[O-]C(=O)c1ccccc1");
	CHECK_STR_EQ(s, w);
	free(s), free(w);
	obw_mol_free(m);
}

/* A mol block of methanol written by hand (V2000, explicit H on O): common practice. */
static const char methanol_mol[] =
	"methanol\n  handmade\n\n"
	"  3  2  0  0  0  0  0  0  0  0999 V2000\n"
	"    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"    1.4000    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"    1.8000    0.9000    0.0000 H   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"  1  2  1  0  0  0  0\n"
	"  2  3  1  0  0  0  0\n"
	"M  END\n$$$$\n";

static void test_obwrap__molblock_parse(void)
{
	obw_mol *m = NULL;
	char msg[256] = "";
	CHECK_INT_EQ(obw_mol_parse(&m, ctx, methanol_mol, OBW_MOLBLOCK, msg, sizeof msg), 0);
	if (!m)
		return;
	const obw_atom *a;
	CHECK_INT_EQ(obw_mol_atoms(m, &a), 2);
	CHECK_INT_EQ(a[0].hcount, 3);
	CHECK_INT_EQ(a[1].hcount, 1);
	char *s = obw_mol_canonical(m, ctx, NULL, 0);
	CHECK_STR_EQ(s, "CO");
	free(s);
	obw_mol_free(m);
	CHECK_INT_EQ(obw_mol_parse(&m, ctx, "not a mol block\n", OBW_MOLBLOCK, msg, sizeof msg),
		     -2);
	CHECK(m == NULL);
}

/* Cis or not of two substituents about the C=C of a butenedioic acid: maleic acid is the
 * cis (Z) and fumaric acid the trans (E) isomer, citraconic acid the cis methylmaleic acid
 * (common practice). Atoms of "OC(=O)C=CC(=O)O": carboxyl C 1 on alkene C 3, carboxyl C 5
 * on alkene C 4; -1 when the SMILES does not parse. */
static int butenedioic_cis(const char *smi, int a, int b, int c, int d)
{
	obw_mol *m = parse(smi);
	int cis = m ? obw_mol_bond_cis(m, a, b, c, d) : -1;
	obw_mol_free(m);
	return cis;
}

/* Maleic acid drawn in 2D ("either" bond: the same with stereo field 3 on the C=C). */
static const char *maleic_mol(int either)
{
	static char buf[2][1024];
	snprintf(buf[either], sizeof buf[either],
		 "maleic acid\n  handmade\n\n"
		 "  8  7  0  0  0  0  0  0  0  0999 V2000\n"
		 "   -1.7321    2.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "   -2.5981    1.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "   -3.4641    2.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "   -2.5981    0.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "   -1.7321    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "   -0.8660    0.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "   -0.8660    1.5000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "    0.0000    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
		 "  1  2  1  0  0  0  0\n  2  3  2  0  0  0  0\n  2  4  1  0  0  0  0\n"
		 "  4  5  2  %d  0  0  0\n  5  6  1  0  0  0  0\n  6  7  2  0  0  0  0\n"
		 "  6  8  1  0  0  0  0\nM  END\n$$$$\n",
		 either ? 3 : 0);
	return buf[either];
}

static void test_obwrap__bond_cis_reads_the_drawn_configuration(void)
{
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C=C\\C(=O)O", 1, 3, 4, 5), 1); /* maleic */
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C=C\\C(=O)O", 5, 4, 3, 1), 1); /* either way round */
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C=C/C(=O)O", 1, 3, 4, 5), 0);  /* fumaric */
	CHECK_INT_EQ(butenedioic_cis("OC(=O)C=CC(=O)O", 1, 3, 4, 5), 0);    /* not given */
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C=C/C(=O)O", 1, 3, 4, 2), 0);  /* not bonded to c */
	/* citraconic acid: the methyl (C 0 on C 1) is trans, the carboxyl C 2 cis to C 6 */
	CHECK_INT_EQ(butenedioic_cis("C/C(C(=O)O)=C/C(=O)O", 2, 1, 5, 6), 1);
	CHECK_INT_EQ(butenedioic_cis("C/C(C(=O)O)=C/C(=O)O", 0, 1, 5, 6), 0);
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C=C\\C(=O)O", 0, 1, 3, 4), 0); /* single bond */
	/* hydrogens drawn and folded: the H's cis, so the carboxyls (C 1 on C 0, C 5 on C 4) */
	CHECK_INT_EQ(butenedioic_cis("[H]/C(C(=O)O)=C(\\[H])C(=O)O", 1, 0, 4, 5), 1);
	CHECK_INT_EQ(butenedioic_cis("[H]/C(C(=O)O)=C(/[H])C(=O)O", 1, 0, 4, 5), 0);
	/* an unmarked ring C=C carries no configuration: cis by the ring, but read as not given
	 * (cyclohex-1-ene-1,2-dicarboxylic acid, carboxyl C 1 on C 3, C 9 on C 4); drawn with
	 * marks it keeps them (carboxyl C 5 on C 4) */
	CHECK_INT_EQ(butenedioic_cis("OC(=O)C1=C(CCCC1)C(=O)O", 1, 3, 4, 9), 0);
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C1=C(\\C(=O)O)CCCC1", 1, 3, 4, 5), 1);
	/* a mol block gives it by its coordinates; the "either" stereo field leaves it open */
	for (int either = 0; either < 2; either++) {
		obw_mol *m = NULL;
		char msg[256] = "";
		CHECK_INT_EQ(obw_mol_parse(&m, ctx, maleic_mol(either), OBW_MOLBLOCK, msg,
					   sizeof msg), 0);
		CHECK_INT_EQ(m ? obw_mol_bond_cis(m, 1, 3, 4, 5) : -1, either ? 0 : 1);
		obw_mol_free(m);
	}
	CHECK_INT_EQ(butenedioic_cis("OC(=O)/C=C\\C(=O)O", 1, 3, 4, 99), 0); /* out of range */
}

static void test_obwrap__bad_smiles_rejected(void)
{
	static const char *bad[] = {"", "   ", "C1CC", "C(C", "CC)", "[Xx]", "c1cccc1", "Cl-",
				    "garbage", "C%1", "C==C", "[CH3", "C(=)C", "(C)C", "C.."};
	for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
		obw_mol *m = (obw_mol *)1;
		char msg[256] = "";
		int rc = obw_mol_parse(&m, ctx, bad[i], OBW_SMILES, msg, sizeof msg);
		if (rc != -2)
			fprintf(stderr, "accepted bad smiles '%s'\n", bad[i]);
		CHECK_INT_EQ(rc, -2);
		CHECK(m == NULL);
		CHECK(msg[0] != '\0');
	}
	/* text after whitespace is the record id, not SMILES */
	obw_mol *m = parse("CCO ethanol");
	const obw_atom *a;
	CHECK(m && obw_mol_atoms(m, &a) == 3);
	obw_mol_free(m);
	char msg[256];
	obw_mol_parse(&m, ctx, "C1CC", OBW_SMILES, msg, sizeof msg);
	CHECK(strstr(msg, "C1CC") != NULL);
}

/* The first 1000 NCI structures (RDKit's copy) parse and write without a crash. */
static void test_obwrap__nci_first_1000_parse(void)
{
	FILE *f = fopen(NCI_SET, "r");
	if (!f) {
		printf("skip: %s missing (install rdkit-data)\n", NCI_SET);
		return;
	}
	char line[4096];
	int n = 0, ok = 0;
	while (n < 1000 && fgets(line, sizeof line, f)) {
		obw_mol *m = NULL;
		char msg[256];
		n++;
		if (obw_mol_parse(&m, ctx, line, OBW_SMILES, msg, sizeof msg) == 0) {
			char *s = obw_mol_canonical(m, ctx, msg, sizeof msg);
			ok += s != NULL;
			free(s);
		} else {
			fprintf(stderr, "nci line %d rejected: %s\n", n, msg);
		}
		obw_mol_free(m);
	}
	fclose(f);
	printf("nci: %d of %d parsed and written\n", ok, n);
	CHECK_INT_EQ(n, 1000);
	CHECK(ok >= 990);
}

int main(void)
{
	char msg[256] = "";
	CHECK_INT_EQ(obw_global_init(msg, sizeof msg), 0);
	CHECK_INT_EQ(obw_global_init(msg, sizeof msg), 0);
	ctx = obw_ctx_new();
	CHECK(ctx != NULL);
	if (!ctx)
		return harness_done();
	RUN(test_obwrap__explicit_h_folds_and_keeps_input_index);
	RUN(test_obwrap__isotopic_and_bare_hydrogens_are_kept);
	RUN(test_obwrap__charges_and_hydrogen_counts);
	RUN(test_obwrap__rings_and_aromaticity);
	RUN(test_obwrap__smarts_unique_matches);
	RUN(test_obwrap__canonical_round_trip);
	RUN(test_obwrap__symmetry_classes);
	RUN(test_obwrap__deprotonate_acetic_acid);
	RUN(test_obwrap__bond_order_edit_and_clone);
	RUN(test_obwrap__components_and_keep_atoms);
	RUN(test_obwrap__molblock_parse);
	RUN(test_obwrap__bond_cis_reads_the_drawn_configuration);
	RUN(test_obwrap__bad_smiles_rejected);
	RUN(test_obwrap__nci_first_1000_parse);
	obw_ctx_free(ctx);
	return harness_done();
}
