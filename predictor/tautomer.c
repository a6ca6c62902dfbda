/* SPDX-License-Identifier: MIT */
/* tautomer.c: moves the H of drawn lactims, iminols and simple enols to the tautomer that
 * dominates in water (DESIGN.md "Tautomers and input forms"); H and bond orders only. */
#include "tautomer.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* The shifts, in the order they are tried for each OH / SH. */
typedef enum { SHIFT_NONE = 0, SHIFT_IMINOL, SHIFT_AZINE, SHIFT_ENOL } shift_kind;

enum { PATH_MAX_ATOMS = 11 };

typedef struct shift {
	shift_kind kind;
	int path[PATH_MAX_ATOMS]; /* donor O/S, then the atoms to the acceptor; bonds 1,2,1,2.. */
	int len;                  /* atoms in path */
} shift;

typedef struct graph {
	const obw_atom *a;
	size_t na;
	const obw_bond *b;
	size_t nb;
	obw_rings rings;
	int *start; /* bonds of atom x: bond indices adj[start[x] .. start[x+1]) */
	int *adj;
} graph;

static void graph_free(graph *g)
{
	free(g->start);
	free(g->adj);
	g->start = g->adj = NULL;
}

/* Loads the cached arrays of m and builds the atom-to-bond index. 0 or PRED_ENOMEM. */
static int graph_load(graph *g, const obw_mol *m)
{
	graph_free(g);
	g->na = obw_mol_atoms(m, &g->a);
	g->nb = obw_mol_bonds(m, &g->b);
	obw_mol_rings(m, &g->rings);
	g->start = calloc(g->na + 2, sizeof *g->start);
	g->adj = malloc((2 * g->nb + 1) * sizeof *g->adj);
	if (!g->start || !g->adj)
		return PRED_ENOMEM;
	for (size_t k = 0; k < g->nb; k++) {
		g->start[g->b[k].a + 2]++;
		g->start[g->b[k].b + 2]++;
	}
	for (size_t x = 0; x < g->na; x++)
		g->start[x + 2] += g->start[x + 1];
	/* start[x + 1] now counts the slots filled for x; it ends as start of x + 1 */
	for (size_t k = 0; k < g->nb; k++) {
		g->adj[g->start[g->b[k].a + 1]++] = (int)k;
		g->adj[g->start[g->b[k].b + 1]++] = (int)k;
	}
	return 0;
}

/* The atom across bond k from x. */
static int other(const graph *g, int k, int x)
{
	return g->b[k].a == x ? g->b[k].b : g->b[k].a;
}

/* Order of the bond x-y, 0 when there is none. */
static int order(const graph *g, int x, int y)
{
	for (int i = g->start[x]; i < g->start[x + 1]; i++)
		if (other(g, g->adj[i], x) == y)
			return g->b[g->adj[i]].order;
	return 0;
}

/* The k-th neighbour of x joined by a bond of order ord (k counts from 0), or -1. */
static int nbr(const graph *g, int x, int ord, int k)
{
	for (int i = g->start[x]; i < g->start[x + 1]; i++)
		if (g->b[g->adj[i]].order == ord && k-- == 0)
			return other(g, g->adj[i], x);
	return -1;
}

/* Whether all n atoms lie in one ring of the SSSR. */
static int in_one_ring(const graph *g, const int *atoms, int n)
{
	for (size_t r = 0; r < g->rings.n_rings; r++) {
		const int *ra = g->rings.atoms + g->rings.offsets[r];
		int found = 0;
		for (int i = 0; i < n; i++)
			for (int j = 0; j < g->rings.sizes[r]; j++)
				found += ra[j] == atoms[i];
		if (found == n)
			return 1;
	}
	return 0;
}

static int neutral(const graph *g, int x, int element)
{
	return x >= 0 && g->a[x].element == element && g->a[x].charge == 0;
}

/* An OH or SH (no charge, one heavy neighbour, no explicit H atom) on a neutral carbon by
 * a single bond: returns that carbon, or -1. */
static int donor_carbon(const graph *g, int o)
{
	const obw_atom *x = &g->a[o];
	if ((x->element != 8 && x->element != 16) || x->charge || x->hcount < 1 ||
	    x->degree != 1 || nbr(g, o, 1, 1) >= 0)
		return -1;
	int c1 = nbr(g, o, 1, 0);
	return neutral(g, c1, 6) ? c1 : -1;
}

/* HO-C=N (iminol, lactim next to the ring N): 1,3 shift to the N. */
static int find_iminol(const graph *g, int o, int c1, shift *s)
{
	for (int k = 0, n; (n = nbr(g, c1, 2, k)) >= 0; k++) {
		if (!neutral(g, n, 7))
			continue;
		*s = (shift){SHIFT_IMINOL, {o, c1, n, 0, 0}, 3};
		return 1;
	}
	return 0;
}

/* HO-C=A-A=N inside one ring (4-hydroxypyridine type): 1,5 shift to the ring N. */
static int find_azine(const graph *g, int o, int c1, shift *s)
{
	for (int k = 0, a2; (a2 = nbr(g, c1, 2, k)) >= 0; k++) {
		if (!neutral(g, a2, 6) && !neutral(g, a2, 7))
			continue;
		for (int j = 0, a3; (a3 = nbr(g, a2, 1, j)) >= 0; j++) {
			if (a3 == c1 || !neutral(g, a3, 6))
				continue;
			for (int l = 0, n; (n = nbr(g, a3, 2, l)) >= 0; l++) {
				int ring[4] = {c1, a2, a3, n};
				if (!neutral(g, n, 7) || !in_one_ring(g, ring, 4))
					continue;
				*s = (shift){SHIFT_AZINE, {o, c1, a2, a3, n}, 5};
				return 1;
			}
		}
	}
	return 0;
}

/* Extends the alternating path p (len atoms so far; bond k has order 1 for even k, 2 for
 * odd k) through neutral aromatic C or N until it has want atoms and ends at the neutral
 * ring N bonded to C-OH (p[1]). */
static int extend_ring_path(const graph *g, int *p, int len, int want, shift *s)
{
	int ord = (len - 1) % 2 == 0 ? 1 : 2;
	for (int k = 0, y; (y = nbr(g, p[len - 1], ord, k)) >= 0; k++) {
		int seen = 0;
		for (int i = 0; i < len; i++)
			seen |= p[i] == y;
		if (seen || !g->a[y].aromatic || (!neutral(g, y, 6) && !neutral(g, y, 7)))
			continue;
		p[len] = y;
		if (len + 1 < want) {
			if (extend_ring_path(g, p, len + 1, want, s))
				return 1;
		} else if (neutral(g, y, 7) && order(g, p[1], y) == 1) {
			s->kind = SHIFT_IMINOL;
			memcpy(s->path, p, (size_t)want * sizeof *p);
			s->len = want;
			return 1;
		}
	}
	return 0;
}

/* A lactim whose ring N is beside C-OH but whose Kekule form puts the C=N elsewhere
 * (2-hydroxypyridines drawn with C2=C3, quinoxalin-2-ols, isoquinolin-3-ols drawn with
 * C3=C4): an alternating path from the O round the ring, or through a fused ring, reaches
 * that N (O-C2=C3-C4=C5-C6=N1), and shifting the H along it gives the same lactam as the
 * 1,3 shift of the other Kekule form. The shortest such path is taken. */
static int find_lactim_around(const graph *g, int o, int c1, shift *s)
{
	if (!g->a[c1].aromatic)
		return 0;
	for (int want = 7; want <= PATH_MAX_ATOMS; want += 2) {
		int p[PATH_MAX_ATOMS] = {o, c1};
		if (extend_ring_path(g, p, 2, want, s))
			return 1;
	}
	return 0;
}

/* Whether a neighbour of c1 or c2 (other than o, c1, c2) carries a non-aromatic double or
 * triple bond: a carbonyl, imine, nitrile, nitro, sulfonyl or C=C conjugated with the enol,
 * which keeps 1,3-dicarbonyl enols, hydroxyquinones and reductones (ascorbic acid) as
 * drawn (DESIGN.md: conjugation keeps the enol). */
static int conjugated(const graph *g, int o, int c1, int c2)
{
	int ends[2] = {c1, c2};
	for (int e = 0; e < 2; e++) {
		for (int i = g->start[ends[e]]; i < g->start[ends[e] + 1]; i++) {
			int x = other(g, g->adj[i], ends[e]);
			if (x == o || x == c1 || x == c2)
				continue;
			for (int j = g->start[x]; j < g->start[x + 1]; j++) {
				const obw_bond *bx = &g->b[g->adj[j]];
				int p = other(g, g->adj[j], x);
				if (p != c1 && p != c2 && bx->order >= 2 && !bx->aromatic)
					return 1;
			}
		}
	}
	return 0;
}

/* HO-C=C, neither carbon aromatic, not conjugated: 1,3 shift to the carbon. */
static int find_enol(const graph *g, int o, int c1, shift *s)
{
	if (g->a[o].element != 8 || g->a[c1].aromatic)
		return 0;
	for (int k = 0, c2; (c2 = nbr(g, c1, 2, k)) >= 0; k++) {
		if (!neutral(g, c2, 6) || g->a[c2].aromatic || conjugated(g, o, c1, c2))
			continue;
		*s = (shift){SHIFT_ENOL, {o, c1, c2, 0, 0}, 3};
		return 1;
	}
	return 0;
}

/* Whether ring N n (bonded to c1) is also bonded to a carbon that carries an exocyclic
 * N by a single bond (an amino or acylamino group). */
static int beside_amino_carbon(const graph *g, int n, int c1)
{
	for (int i = g->start[n]; i < g->start[n + 1]; i++) {
		int x = other(g, g->adj[i], n);
		if (x == c1 || g->a[x].element != 6)
			continue;
		for (int j = 0, y; (y = nbr(g, x, 1, j)) >= 0; j++)
			if (y != n && neutral(g, y, 7) && !g->a[y].in_ring)
				return 1;
	}
	return 0;
}

/* A lactim between two ring N (2-hydroxypyrimidines) becomes the lactam whose N-H is away
 * from a ring carbon bearing an amino group, whichever N the Kekule form bonds to C-OH by
 * the double bond: cytosine is the 1H (amino-oxo) tautomer, and the amidine N beside the
 * amino carbon stays free (common practice). */
static void prefer_away_from_amino(const graph *g, int o, int c1, shift *s)
{
	shift alt;
	if (!g->a[c1].aromatic || !beside_amino_carbon(g, s->path[s->len - 1], c1) ||
	    !find_lactim_around(g, o, c1, &alt))
		return;
	if (!beside_amino_carbon(g, alt.path[alt.len - 1], c1))
		*s = alt;
}

static int find_shift(const graph *g, shift *s)
{
	for (size_t o = 0; o < g->na; o++) {
		int c1 = donor_carbon(g, (int)o);
		if (c1 < 0)
			continue;
		if (find_iminol(g, (int)o, c1, s)) {
			prefer_away_from_amino(g, (int)o, c1, s);
			return 1;
		}
		if (find_azine(g, (int)o, c1, s) || find_lactim_around(g, (int)o, c1, s) ||
		    find_enol(g, (int)o, c1, s))
			return 1;
	}
	return 0;
}

/* Flips the bond orders along the path and moves one H from its first to its last atom. */
static int apply(obw_mol *m, const graph *g, const shift *s)
{
	int o = s->path[0], end = s->path[s->len - 1], flip[PATH_MAX_ATOMS - 1];
	int h_o = g->a[o].hcount, h_end = g->a[end].hcount;
	for (int k = 0; k + 1 < s->len; k++)
		flip[k] = 3 - order(g, s->path[k], s->path[k + 1]);
	int rc = obw_mol_set_atom(m, o, 0, h_o - 1);
	for (int k = 0; !rc && k + 1 < s->len; k++)
		rc = obw_mol_set_bond_order(m, s->path[k], s->path[k + 1], flip[k]);
	if (!rc)
		rc = obw_mol_set_atom(m, end, 0, h_end + 1);
	return rc;
}

static const char *shift_name(const graph *g, const shift *s)
{
	int sulfur = g->a[s->path[0]].element == 16;
	int ring = g->a[s->path[1]].in_ring && g->a[s->path[s->len - 1]].in_ring;
	switch (s->kind) {
	case SHIFT_IMINOL:
		if (ring)
			return sulfur ? "thiolactim to thiolactam" : "lactim to lactam";
		return sulfur ? "thioiminol to thioamide" : "iminol to amide";
	case SHIFT_AZINE:
		return sulfur ? "mercapto-azine to azinethione" : "hydroxy-azine to azinone";
	case SHIFT_ENOL:
		return "enol to ketone";
	default:
		return "none";
	}
}

static int fail(pred_error *err, int code, const char *msg)
{
	if (err) {
		err->code = code;
		snprintf(err->msg, sizeof err->msg, "%s", msg);
	}
	return code;
}

int taut_standardise(obw_mol *m, norm_report *rep, pred_error *err)
{
	graph g = {0};
	shift s;
	char msg[200] = "";
	int rc = graph_load(&g, m);
	/* each shift takes the H off one O/S for good, so the loop ends; the bound is a guard */
	for (size_t it = 0, limit = g.na + 1; !rc && it < limit && find_shift(&g, &s); it++) {
		rc = apply(m, &g, &s);
		norm_warn(rep, "input tautomer changed: %s at atom %d (H moved to atom %d)",
			  shift_name(&g, &s), g.a[s.path[0]].orig_index,
			  g.a[s.path[s.len - 1]].orig_index);
		if (!rc)
			rc = obw_mol_refresh(m, msg, sizeof msg);
		if (!rc)
			rc = graph_load(&g, m);
	}
	graph_free(&g);
	if (rc == PRED_ENOMEM)
		return fail(err, rc, "out of memory");
	if (rc)
		return fail(err, rc, msg[0] ? msg : "cannot move the tautomeric hydrogen");
	return 0;
}
