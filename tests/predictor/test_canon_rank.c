/* SPDX-License-Identifier: MIT */
/* test_canon_rank.c: canonical ranks and symmetry classes of canon_rank.c. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "canon_rank.h"
#include "harness.h"
#include "obwrap.h"
#include "smiles_write.h"

static obw_ctx *ctx;

#define NCI_SET "/usr/share/RDKit/Data/NCI/first_5K.smi"

/* Whether two class arrays make the same partition of n atoms. */
static int same_partition(const int *a, const int *b, size_t n)
{
	for (size_t i = 0; i < n; i++)
		for (size_t j = i + 1; j < n; j++)
			if ((a[i] == a[j]) != (b[i] == b[j]))
				return 0;
	return 1;
}

/* Classes with stereo aside agree with Open Babel's OBGraphSym classes (the reference
 * toolkit) on the first 1000 NCI structures, and the ranks are distinct. */
static void test_canon_rank__classes_agree_with_open_babel_on_nci(void)
{
	FILE *f = fopen(NCI_SET, "r");
	if (!f) {
		printf("skip: %s missing (install rdkit-data)\n", NCI_SET);
		return;
	}
	char line[4096];
	int n = 0, same = 0, distinct = 0, parsed = 0;
	while (n < 1000 && fgets(line, sizeof line, f)) {
		obw_mol *m = NULL;
		n++;
		if (obw_mol_parse(&m, ctx, line, OBW_SMILES, NULL, 0) != 0)
			continue;
		const obw_atom *at;
		size_t na = obw_mol_atoms(m, &at);
		int *ours = malloc((na + 1) * sizeof *ours), *ob = malloc((na + 1) * sizeof *ob);
		int *rank = malloc((na + 1) * sizeof *rank), *seen = calloc(na + 1, sizeof *seen);
		parsed++;
		if (ours && ob && rank && seen && canon_rank(ours, NULL, rank, m, NULL) == 0 &&
		    obw_mol_symmetry(m, ob, na, NULL, 0) == 0) {
			same += same_partition(ours, ob, na);
			int all = 1;
			for (size_t i = 0; i < na; i++)
				all = all && rank[i] >= 0 && (size_t)rank[i] < na && !seen[rank[i]]++;
			distinct += all;
		}
		free(ours);
		free(ob);
		free(rank);
		free(seen);
		obw_mol_free(m);
	}
	fclose(f);
	printf("nci: %d parsed, %d with Open Babel's classes, %d with distinct ranks\n", parsed,
	       same, distinct);
	CHECK(parsed >= 990);
	CHECK_INT_EQ(same, parsed);
	CHECK_INT_EQ(distinct, parsed);
}

/* Symmetric atoms share a class, others not: the two methyls of isobutane, the ortho
 * carbons of toluene, the two O of acetate (common practice). */
static void test_canon_rank__symmetric_atoms_share_a_class(void)
{
	static const struct {
		const char *smi;
		int a, b, same;
	} cases[] = {{"CC(C)C", 0, 2, 1}, {"CC(C)CO", 0, 3, 0}, {"Cc1ccccc1", 2, 6, 1},
		     {"Cc1ccccc1", 2, 3, 0}, {"CC(=O)[O-]", 2, 3, 0}, {"OC(=O)CC(=O)O", 0, 6, 1}};
	for (size_t i = 0; i < sizeof cases / sizeof *cases; i++) {
		obw_mol *m = NULL;
		int cls[16];
		CHECK_INT_EQ(obw_mol_parse(&m, ctx, cases[i].smi, OBW_SMILES, NULL, 0), 0);
		CHECK_INT_EQ(m ? canon_rank(cls, NULL, NULL, m, NULL) : -1, 0);
		if (m)
			CHECK_INT_EQ(cls[cases[i].a] == cls[cases[i].b], cases[i].same);
		obw_mol_free(m);
	}
}

/* Mirror-image halves (meso-tartaric acid) are one class for symmetry but are told apart
 * by stereo for the ranks, so the SMILES does not depend on the drawing; the (R,R) acid
 * gets another. Drawings: RDKit random SMILES of the (2R,3S) form, then (2R,3R). */
static void test_canon_rank__meso_written_once(void)
{
	static const char *const meso[] = {"C(=O)(O)[C@H]([C@@H](O)C(O)=O)O",
					   "[C@@H]([C@@H](C(=O)O)O)(C(O)=O)O",
					   "C(O)([C@@H]([C@@H](C(=O)O)O)O)=O",
					   "O[C@H](C(=O)O)[C@@H](O)C(=O)O"};
	static const char chiral[] = "OC(=O)[C@H](O)[C@@H](O)C(=O)O";
	char *first = NULL;
	for (size_t i = 0; i < sizeof meso / sizeof *meso; i++) {
		obw_mol *m = NULL;
		char *s = NULL;
		CHECK_INT_EQ(obw_mol_parse(&m, ctx, meso[i], OBW_SMILES, NULL, 0), 0);
		s = m ? smiles_canonical(NULL, NULL, m, ctx, NULL, 0) : NULL;
		CHECK(s != NULL);
		if (s && !first)
			first = s;
		else if (s) {
			CHECK_STR_EQ(s, first);
			free(s);
		}
		obw_mol_free(m);
	}
	obw_mol *m = NULL;
	char *s = NULL;
	CHECK_INT_EQ(obw_mol_parse(&m, ctx, chiral, OBW_SMILES, NULL, 0), 0);
	s = m ? smiles_canonical(NULL, NULL, m, ctx, NULL, 0) : NULL;
	CHECK(s && first && strcmp(s, first) != 0);
	free(s);
	obw_mol_free(m);
	free(first);
}

int main(void)
{
	char msg[256] = "";
	CHECK_INT_EQ(obw_global_init(msg, sizeof msg), 0);
	ctx = obw_ctx_new();
	CHECK(ctx != NULL);
	if (!ctx)
		return harness_done();
	RUN(test_canon_rank__symmetric_atoms_share_a_class);
	RUN(test_canon_rank__meso_written_once);
	RUN(test_canon_rank__classes_agree_with_open_babel_on_nci);
	obw_ctx_free(ctx);
	return harness_done();
}
