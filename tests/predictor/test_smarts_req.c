/* SPDX-License-Identifier: MIT */
/* test_smarts_req.c: the element prefilter never skips a pattern that matches. Every SMARTS
 * of the real tables is tried on every handbook molecule (data/handbook-*.csv) and on
 * hand-picked patterns with nested recursion. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"
#include "harness.h"
#include "model.h"

static void check_pattern(const char *smarts, obw_mol *const *mols, size_t n)
{
	char msg[200];
	obw_pattern *p = obw_pattern_parse(smarts, msg, sizeof msg);
	CHECK(p != NULL);
	if (!p)
		return;
	smarts_req req;
	smarts_requirements(&req, smarts);
	for (size_t i = 0; i < n; i++) {
		int *hits = NULL;
		int k = obw_pattern_match(&hits, p, mols[i]);
		free(hits);
		if (k <= 0)
			continue;
		const obw_atom *atoms;
		size_t na = obw_mol_atoms(mols[i], &atoms);
		smarts_req mol;
		smarts_mol_mask(&mol, atoms, na);
		if (!smarts_may_match(&req, &mol)) {
			fprintf(stderr, "prefilter skips '%s' that matches molecule %zu\n", smarts, i);
			CHECK(0);
		}
	}
	obw_pattern_free(p);
}

static size_t read_smiles(obw_mol **mols, size_t cap, obw_ctx *ctx, const char *path)
{
	FILE *f = fopen(path, "r");
	size_t n = 0;
	char line[4096];
	if (!f)
		return 0;
	while (n < cap && fgets(line, sizeof line, f)) {
		char *comma = strchr(line, ',');
		if (!comma)
			continue;
		char *smi = comma + 1, *end = strchr(smi, ',');
		if (!end)
			continue;
		*end = '\0';
		if (!obw_mol_parse(&mols[n], ctx, smi, OBW_SMILES, NULL, 0))
			n++;
	}
	fclose(f);
	return n;
}

int main(void)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	char path[1024];
	pred_model *m = NULL;
	pred_error err = {0};
	if (pred_global_init(&err) || pred_model_load(&m, NULL, &err)) {
		fprintf(stderr, "setup: %s\n", err.msg);
		return 1;
	}
	obw_ctx *ctx = obw_ctx_new();
	static obw_mol *mols[2000];
	size_t n = 0;
	const char *files[] = {"handbook-acids.csv", "handbook-bases.csv"};
	for (size_t i = 0; i < 2; i++) {
		snprintf(path, sizeof path, "%s/data/%s", src ? src : ".", files[i]);
		n += read_smiles(mols + n, 2000 - n, ctx, path);
	}
	CHECK(n > 500);
	for (size_t i = 0; i < m->n_sites; i++)
		check_pattern(m->sites[i].smarts, mols, n);
	for (size_t i = 0; i < m->n_substs; i++)
		check_pattern(m->substs[i].smarts, mols, n);
	for (size_t i = 0; i < m->n_corrs; i++)
		check_pattern(m->corrs[i].smarts, mols, n);
	/* nested brackets inside recursion add no requirement of their own */
	smarts_req r;
	smarts_requirements(&r, "[NX2;!$(N~[#8])]=[CX3]([#6,#1;!$([#6]=O)])[NX3]");
	CHECK(!(r.aliph & ((uint64_t)1 << 8)));
	CHECK(r.aliph & ((uint64_t)1 << 6));
	smarts_requirements(&r, "[nX2]1ccccc1Cl");
	CHECK(r.arom & ((uint64_t)1 << 7));
	CHECK(r.aliph & ((uint64_t)1 << 17));
	for (size_t i = 0; i < n; i++)
		obw_mol_free(mols[i]);
	obw_ctx_free(ctx);
	pred_model_free(m);
	return harness_done();
}
