/* SPDX-License-Identifier: MIT */
/* test_smarts_req.c: neither the element prefilter nor the graph screen (smarts_screen.c)
 * ever skips a pattern that Open Babel matches. Every SMARTS of the real tables is tried on
 * every handbook molecule (data/handbook-*.csv) and on hand-picked patterns with nested
 * recursion; the screen must also reject some of the molecules the prefilter lets through. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"
#include "harness.h"
#include "model.h"

/* The molecule as the engine hands it to the screen (perceive.c builds the same view). */
typedef struct screen_mol {
	sx_mol m;
	int *adj_start, *adj, *adj_bond;
	uint32_t *rings, *kind;
	int *kind_lists;
	unsigned char *scratch;
} screen_mol;

static void screen_mol_init(screen_mol *s, obw_mol *mol)
{
	const obw_atom *atoms;
	const obw_bond *bonds;
	obw_rings r;
	size_t na = obw_mol_atoms(mol, &atoms), nb = obw_mol_bonds(mol, &bonds);
	obw_mol_rings(mol, &r);
	s->adj_start = calloc(na + 2, sizeof(int));
	s->adj = malloc((2 * nb + 1) * sizeof(int));
	s->adj_bond = malloc((2 * nb + 1) * sizeof(int));
	s->rings = calloc(na + 1, sizeof(uint32_t));
	s->kind = calloc(na + 1, sizeof(uint32_t));
	/* dirty scratch, made ready the way the engine does it */
	s->scratch = malloc(smarts_screen_scratch(na));
	memset(s->scratch, 0x5a, smarts_screen_scratch(na));
	smarts_screen_scratch_init(s->scratch, na);
	int *fill = calloc(na + 1, sizeof(int));
	uint32_t kinds = 0;
	int has_h = 0;
	for (size_t i = 0; i < nb; i++) {
		s->adj_start[bonds[i].a + 1]++;
		s->adj_start[bonds[i].b + 1]++;
	}
	for (size_t a = 0; a < na; a++) {
		s->adj_start[a + 1] += s->adj_start[a];
		kinds |= s->kind[a] = sx_kind(atoms[a].element, atoms[a].aromatic);
		has_h |= atoms[a].element == 1;
	}
	for (size_t i = 0; i < nb; i++) {
		int a = bonds[i].a, b = bonds[i].b;
		s->adj_bond[s->adj_start[a] + fill[a]] = (int)i;
		s->adj[s->adj_start[a] + fill[a]++] = b;
		s->adj_bond[s->adj_start[b] + fill[b]] = (int)i;
		s->adj[s->adj_start[b] + fill[b]++] = a;
	}
	for (size_t k = 0; k < r.n_rings; k++)
		for (int i = 0; i < r.sizes[k] && r.sizes[k] < 32; i++)
			s->rings[r.atoms[r.offsets[k] + i]] |= (uint32_t)1 << r.sizes[k];
	free(fill);
	s->kind_lists = malloc((33 + na) * sizeof(int));
	sx_kind_lists(s->kind_lists, s->kind_lists + 33, s->kind, na);
	const int *ob_bonds = NULL;
	int own = !has_h && obw_mol_atom_bonds(mol, &ob_bonds) == 2 * nb;
	s->m = (sx_mol){atoms,	   bonds,	      na,    s->adj_start, s->adj, s->adj_bond,
			ob_bonds,  s->rings,	      s->kind, s->kind_lists, s->kind_lists + 33,
			kinds,	   own,		      s->scratch, NULL, NULL};
}

static void screen_mol_free(screen_mol *s)
{
	free(s->adj_start);
	free(s->adj);
	free(s->adj_bond);
	free(s->rings);
	free(s->kind);
	free(s->kind_lists);
	free(s->scratch);
	free(s->m.shared);
	free(s->m.shared_ready);
}

static screen_mol screens[2000];
static size_t screen_rejects, own_lists;

/* With every third atom taken (first_only: for the first SMARTS atom only), the own list is
 * Open Babel's without the matches that put a pattern atom on a taken atom. */
static void check_taken(const char *smarts, const smarts_screen *scr, int k, const int *hits,
			int na, size_t i, int first_only)
{
	int taken[SX_MAX_ATOMS * 4], *own = NULL, kept = 0, same = 1;
	size_t nat = screens[i].m.nat;
	if (nat > sizeof taken / sizeof taken[0])
		return;
	for (size_t a = 0; a < nat; a++)
		taken[a] = a % 3 == 0 ? 0 : -1;
	int n = smarts_screen_matches(&own, scr, &screens[i].m, first_only ? NULL : taken,
				      first_only ? taken : NULL);
	for (int h = 0; h < k && n >= 0; h++) {
		int hit = 0;
		for (int j = 0; j < (first_only ? 1 : na); j++)
			hit |= taken[hits[h * na + j]] >= 0;
		for (int j = 0; !hit && j < na && same; j++)
			same = kept < n && own[kept * na + j] == hits[h * na + j];
		kept += !hit;
	}
	if (n >= 0 && (!same || kept != n)) {
		fprintf(stderr, "own matches of '%s' with taken atoms (%s) on molecule %zu differ\n",
			smarts, first_only ? "first" : "all", i);
		CHECK(0);
	}
	free(own);
}

/* Where the screen lists the matches itself, the list is Open Babel's, order included. */
static void check_own_matches(const char *smarts, const smarts_screen *scr, int k,
			      const int *hits, const obw_pattern *p, size_t i)
{
	int *own = NULL;
	int n = smarts_screen_matches(&own, scr, &screens[i].m, NULL, NULL);
	int na = obw_pattern_atom_count(p);
	check_taken(smarts, scr, k, hits, na, i, 0);
	check_taken(smarts, scr, k, hits, na, i, 1);
	if (n >= 0) {
		own_lists++;
		int same = n == (k > 0 ? k : 0);
		for (int j = 0; same && j < n * na; j++)
			same = own[j] == hits[j];
		if (!same) {
			fprintf(stderr, "own matches of '%s' on molecule %zu differ (%d, open babel %d)\n",
				smarts, i, n, k);
			CHECK(0);
		}
	}
	free(own);
}

/* scr: the pattern's screen, its recursive parts' values shared with every other pattern's
 * (smarts_screen_share) across the whole run over the molecules */
static void check_pattern(const char *smarts, smarts_screen *scr, obw_mol *const *mols,
			  size_t n)
{
	char msg[200];
	obw_pattern *p = obw_pattern_parse(smarts, msg, sizeof msg);
	CHECK(p != NULL);
	if (!p)
		return;
	smarts_req req;
	smarts_requirements(&req, smarts);
	CHECK(scr != NULL); /* every pattern of the tables is screened */
	if (!scr) {
		obw_pattern_free(p);
		return;
	}
	/* the engine takes the screen's atom count for the lists the screen makes */
	CHECK_INT_EQ(scr->pats[0].n_atoms, obw_pattern_atom_count(p));
	for (size_t i = 0; i < n; i++) {
		int *hits = NULL;
		int k = obw_pattern_match(&hits, p, mols[i]);
		check_own_matches(smarts, scr, k, hits, p, i);
		free(hits);
		int may = smarts_screen_may_match(scr, &screens[i].m);
		if (k > 0 && !may) {
			fprintf(stderr, "screen skips '%s' that matches molecule %zu\n", smarts, i);
			CHECK(0);
		}
		screen_rejects += !may;
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

static const char *table_smarts(const pred_model *m, size_t i)
{
	if (i < m->n_sites)
		return m->sites[i].smarts;
	i -= m->n_sites;
	return i < m->n_substs ? m->substs[i].smarts : m->corrs[i - m->n_substs].smarts;
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
	size_t n_pats = m->n_sites + m->n_substs + m->n_corrs;
	smarts_screen **scr = calloc(n_pats, sizeof *scr);
	sx_shared reg = {NULL, 0, 0, NULL};
	for (size_t k = 0; k < n_pats; k++) {
		scr[k] = smarts_screen_new(table_smarts(m, k));
		CHECK(smarts_screen_share(scr[k], &reg) == 0);
	}
	CHECK(reg.n > 10); /* the tables share recursive parts */
	for (size_t i = 0; i < n; i++) {
		screen_mol_init(&screens[i], mols[i]);
		/* rows left dirty: the screen must clear a row before its first use */
		screens[i].m.shared = malloc((size_t)reg.n * screens[i].m.nat + 1);
		memset(screens[i].m.shared, 0x5a, (size_t)reg.n * screens[i].m.nat + 1);
		screens[i].m.shared_ready = calloc((size_t)reg.n + 1, 1);
	}
	for (size_t k = 0; k < n_pats; k++)
		check_pattern(table_smarts(m, k), scr[k], mols, n);
	for (size_t k = 0; k < n_pats; k++)
		smarts_screen_free(scr[k]);
	free(scr);
	sx_shared_clear(&reg);
	/* the screen earns its place: most pattern and molecule pairs cannot match */
	CHECK(screen_rejects > n * (m->n_sites + m->n_substs + m->n_corrs) / 2);
	/* and lists the matches itself for most pairs (Open Babel is then not asked) */
	CHECK(own_lists > n * (m->n_sites + m->n_substs + m->n_corrs) / 2);
	/* a carboxylic acid pattern on ethanol passes the element prefilter, not the screen;
	 * it matches acetic acid (common practice) */
	smarts_screen *acid = smarts_screen_new("[OX2H1][CX3]=O");
	obw_mol *ethanol = NULL, *acetic = NULL;
	CHECK(!obw_mol_parse(&ethanol, ctx, "CCO", OBW_SMILES, NULL, 0));
	CHECK(!obw_mol_parse(&acetic, ctx, "CC(=O)O", OBW_SMILES, NULL, 0));
	screen_mol se, sa;
	screen_mol_init(&se, ethanol);
	screen_mol_init(&sa, acetic);
	CHECK(!smarts_screen_may_match(acid, &se.m));
	CHECK(smarts_screen_may_match(acid, &sa.m));
	/* a six-ring recursion: benzene's carbons are in one, cyclohexane has no aromatic atom */
	smarts_screen *aryl = smarts_screen_new("[c;$(c1aaaaa1)]");
	obw_mol *benzene = NULL, *cyclohexane = NULL;
	CHECK(!obw_mol_parse(&benzene, ctx, "c1ccccc1", OBW_SMILES, NULL, 0));
	CHECK(!obw_mol_parse(&cyclohexane, ctx, "C1CCCCC1", OBW_SMILES, NULL, 0));
	screen_mol sb, sc;
	screen_mol_init(&sb, benzene);
	screen_mol_init(&sc, cyclohexane);
	CHECK(smarts_screen_may_match(aryl, &sb.m));
	CHECK(!smarts_screen_may_match(aryl, &sc.m));
	screen_mol_free(&sb);
	screen_mol_free(&sc);
	obw_mol_free(benzene);
	obw_mol_free(cyclohexane);
	screen_mol_free(&se);
	screen_mol_free(&sa);
	smarts_screen_free(acid);
	smarts_screen_free(aryl);
	obw_mol_free(ethanol);
	obw_mol_free(acetic);
	/* what the screen cannot read leaves the pattern unscreened */
	smarts_screen *hyb = smarts_screen_new("[C;^2]");
	CHECK(hyb != NULL && smarts_screen_may_match(hyb, &screens[0].m));
	smarts_screen_free(hyb);
	CHECK(smarts_screen_new("C.C") == NULL);
	CHECK(smarts_screen_new("[Zn]") == NULL);
	for (size_t i = 0; i < n; i++)
		screen_mol_free(&screens[i]);
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
