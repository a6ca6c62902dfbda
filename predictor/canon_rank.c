/* SPDX-License-Identifier: MIT */
/* canon_rank.c: canonical atom ranks for the SMILES writer and symmetry classes, by
 * iterative refinement of atom invariants with tie breaking (Weininger, Weininger and
 * Weininger, J. Chem. Inf. Comput. Sci. 29 (1989) 97, the CANON scheme). */
#include "canon_rank.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "predictor.h"

typedef struct canon {
	size_t n;
	const obw_atom *at;
	int *start;  /* CSR: neighbours of a at nbr[start[a] .. start[a+1]) */
	int *nbr;
	int *lab;    /* bond label of each nbr entry: 4 aromatic, else the bond order */
	int *key;    /* per nbr entry: class of the neighbour * 8 + label, sorted per atom */
	int *cls;    /* current class of each atom, dense from 0, ordered by invariant */
	int *par;    /* stereo parity of a tetrahedral centre under cls: 0 undefined, 1, 2 */
	int *tet;    /* tetrahedral record of each atom, -1 none */
	int *idx;    /* atoms in class order */
	int *tmp;    /* merge buffer */
	const obw_tetra *tetra;
} canon;

typedef int (*canon_cmp)(const canon *c, int a, int b);

/* Stable merge sort of idx[0..n) by cmp. */
static void sort_atoms(const canon *c, int *idx, int *tmp, size_t n, canon_cmp cmp)
{
	if (n < 2)
		return;
	size_t h = n / 2, i = 0, j = h, k = 0;
	sort_atoms(c, idx, tmp, h, cmp);
	sort_atoms(c, idx + h, tmp, n - h, cmp);
	while (i < h && j < n)
		tmp[k++] = cmp(c, idx[j], idx[i]) < 0 ? idx[j++] : idx[i++];
	while (i < h)
		tmp[k++] = idx[i++];
	while (j < n)
		tmp[k++] = idx[j++];
	memcpy(idx, tmp, n * sizeof *idx);
}

#define CMP_FIELD(x, y)                                                                    \
	do {                                                                               \
		if ((x) != (y))                                                            \
			return (x) < (y) ? -1 : 1;                                         \
	} while (0)

/* An atom a SMILES writer surely writes without brackets: uncharged, no isotope, not
 * aromatic, hydrogens filling the element's lowest usual valence (common practice: the
 * OpenSMILES organic subset). */
static int bare(const obw_atom *x)
{
	static const int valence[] = {[5] = 3, [6] = 4, [7] = 3, [8] = 2, [9] = 1, [15] = 3,
				      [16] = 2, [17] = 1, [35] = 1, [53] = 1};
	if (x->charge || x->isotope || x->aromatic || x->radical || x->element < 0 ||
	    x->element >= (int)(sizeof valence / sizeof *valence))
		return 0;
	return valence[x->element] && x->valence + x->hcount == valence[x->element];
}

/* Starting invariants. Tetrahedral centres come last, then atoms that need brackets, and
 * low degrees first, so that a SMILES written from the lowest rank starts at a plain
 * terminal atom (CC(=O)O rather than C(C)(=O)O). Open Babel's classes also start from the
 * graph-theoretical distance; the refinement reaches the same classes without it
 * (tests/predictor/test_canon_rank.c). */
static int cmp_invariant(const canon *c, int a, int b)
{
	const obw_atom *x = &c->at[a], *y = &c->at[b];
	CMP_FIELD(c->tet[a] >= 0, c->tet[b] >= 0);
	CMP_FIELD(!bare(x), !bare(y));
	CMP_FIELD(x->degree, y->degree);
	CMP_FIELD(x->element, y->element);
	CMP_FIELD(x->isotope, y->isotope);
	CMP_FIELD(x->charge, y->charge);
	CMP_FIELD(x->hcount, y->hcount);
	CMP_FIELD(x->aromatic, y->aromatic);
	CMP_FIELD(x->in_ring, y->in_ring);
	CMP_FIELD(x->radical, y->radical);
	return 0;
}

/* Refinement order: the class so far, the stereo parity, then the neighbours' classes. */
static int cmp_refined(const canon *c, int a, int b)
{
	CMP_FIELD(c->cls[a], c->cls[b]);
	CMP_FIELD(c->par[a], c->par[b]);
	int na = c->start[a + 1] - c->start[a], nb = c->start[b + 1] - c->start[b];
	CMP_FIELD(na, nb);
	for (int k = 0; k < na; k++)
		CMP_FIELD(c->key[c->start[a] + k], c->key[c->start[b] + k]);
	return 0;
}

/* Dense classes from the sorted idx: a new class wherever cmp tells neighbours apart.
 * Returns the class count. */
static size_t assign_classes(canon *c, canon_cmp cmp, int *out)
{
	size_t count = 0;
	for (size_t i = 0; i < c->n; i++) {
		if (i > 0 && cmp(c, c->idx[i - 1], c->idx[i]) != 0)
			count++;
		out[c->idx[i]] = (int)count;
	}
	return c->n ? count + 1 : 0;
}

/* Parity of a centre's neighbours ordered by class (-1 for its hydrogen): 1 or 2 when all
 * four differ, 0 when two are tied. Drawings of one configuration differ by even
 * permutations of the listing, so this depends on the configuration only. */
static int tetra_parity(const canon *c, const obw_tetra *t)
{
	int r[4], odd = 0;
	for (int k = 0; k < 4; k++)
		r[k] = t->nbr[k] < 0 ? -1 : c->cls[t->nbr[k]];
	for (int k = 0; k < 4; k++)
		for (int l = k + 1; l < 4; l++) {
			if (r[k] == r[l])
				return 0;
			odd ^= r[k] > r[l];
		}
	return 1 + odd;
}

/* Sorted neighbour keys of atom a under the current classes. */
static void neighbour_keys(canon *c, int a)
{
	int *k = c->key + c->start[a], n = c->start[a + 1] - c->start[a];
	for (int i = 0; i < n; i++) {
		int v = c->cls[c->nbr[c->start[a] + i]] * 8 + c->lab[c->start[a] + i], j = i;
		for (; j > 0 && k[j - 1] > v; j--)
			k[j] = k[j - 1];
		k[j] = v;
	}
}

/* Refines c->cls until the class count stops growing; returns the count. With stereo,
 * tetrahedral parities split classes too (not for symmetry classes: the two halves of
 * meso-tartaric acid are mirror images, equivalent sites all the same). */
static size_t refine(canon *c, size_t count, int *next, int stereo)
{
	for (;;) {
		/* c->idx is in class order: only a shared class can split, so only its atoms
		 * need keys and a sort (the same order as sorting all atoms) */
		for (size_t i = 0, j; i < c->n; i = j) {
			for (j = i + 1; j < c->n && c->cls[c->idx[j]] == c->cls[c->idx[i]]; j++)
				;
			for (size_t k = i; j - i > 1 && k < j; k++) {
				int a = c->idx[k];
				neighbour_keys(c, a);
				c->par[a] = stereo && c->tet[a] >= 0
						    ? tetra_parity(c, &c->tetra[c->tet[a]])
						    : 0;
			}
			if (j - i > 1)
				sort_atoms(c, c->idx + i, c->tmp, j - i, cmp_refined);
		}
		size_t now = assign_classes(c, cmp_refined, next);
		memcpy(c->cls, next, c->n * sizeof *next);
		if (now == count)
			return count;
		count = now;
	}
}

/* Breaks the lowest tie: one atom of the lowest shared class keeps it, the rest move one
 * up (as every higher class does). For classes that are true symmetry orbits any choice
 * gives the same SMILES. */
static void break_tie(canon *c)
{
	size_t i = 0;
	while (i + 1 < c->n && c->cls[c->idx[i]] != c->cls[c->idx[i + 1]])
		i++;
	int pick = c->idx[i], tied = c->cls[pick];
	for (size_t a = 0; a < c->n; a++)
		if (c->cls[a] > tied || (c->cls[a] == tied && (int)a != pick))
			c->cls[a]++;
}

/* CSR adjacency with bond labels from m's bonds. */
static void build_graph(canon *c, const obw_bond *b, size_t nb)
{
	for (size_t i = 0; i < nb; i++) {
		c->start[b[i].a + 1]++;
		c->start[b[i].b + 1]++;
	}
	for (size_t a = 0; a < c->n; a++)
		c->start[a + 1] += c->start[a];
	int *fill = c->par; /* free until refinement */
	memcpy(fill, c->start, c->n * sizeof *fill);
	for (size_t i = 0; i < nb; i++) {
		int lab = b[i].aromatic ? 4 : b[i].order;
		c->lab[fill[b[i].a]] = lab;
		c->nbr[fill[b[i].a]++] = b[i].b;
		c->lab[fill[b[i].b]] = lab;
		c->nbr[fill[b[i].b]++] = b[i].a;
	}
}

/* Points c's arrays into one block of ints; returns the block (NULL when out of memory). */
static int *canon_alloc(canon *c, size_t nb)
{
	size_t n = c->n;
	int *blk = calloc(6 * n + 6 * nb + 2, sizeof *blk);
	if (!blk)
		return NULL;
	c->start = blk;
	c->nbr = c->start + n + 1;
	c->lab = c->nbr + 2 * nb;
	c->key = c->lab + 2 * nb;
	c->cls = c->key + 2 * nb;
	c->par = c->cls + n;
	c->tet = c->par + n;
	c->idx = c->tet + n;
	c->tmp = c->idx + n;
	return blk;
}

int canon_rank(int *cls, int *scls, int *rank, const obw_mol *m, const obw_atom *atoms)
{
	const obw_atom *own;
	const obw_bond *bonds;
	canon c = {0};
	c.n = obw_mol_atoms(m, &own);
	size_t nb = obw_mol_bonds(m, &bonds), nt = obw_mol_tetra(m, &c.tetra);
	c.at = atoms ? atoms : own;
	int *blk = canon_alloc(&c, nb), *next = malloc((c.n + 1) * sizeof *next);
	if (!blk || !next) {
		free(blk);
		free(next);
		return PRED_ENOMEM;
	}
	build_graph(&c, bonds, nb);
	for (size_t a = 0; a < c.n; a++) {
		c.tet[a] = -1;
		c.idx[a] = (int)a;
	}
	for (size_t t = 0; t < nt; t++)
		c.tet[c.tetra[t].centre] = (int)t;
	sort_atoms(&c, c.idx, c.tmp, c.n, cmp_invariant);
	size_t count = refine(&c, assign_classes(&c, cmp_invariant, c.cls), next, 0);
	if (cls)
		memcpy(cls, c.cls, c.n * sizeof *cls);
	if ((scls || rank) && nt)
		count = refine(&c, count, next, 1);
	if (scls)
		memcpy(scls, c.cls, c.n * sizeof *scls);
	while (rank && count < c.n) {
		break_tie(&c);
		count = refine(&c, count + 1, next, 1);
	}
	if (rank)
		memcpy(rank, c.cls, c.n * sizeof *rank);
	free(blk);
	free(next);
	return 0;
}
