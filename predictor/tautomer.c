/* SPDX-License-Identifier: MIT */
/* tautomer.c: moves the H of drawn lactims, iminols and simple enols to the tautomer that
 * dominates in water (DESIGN.md "Tautomers and input forms"); H and bond orders only. */
#include "tautomer.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "canon_rank.h"

/* The kinds of shift: a lactim or iminol to its lactam or amide (the H goes to an N beside
 * C-OH), a 4-hydroxy-azine to its azinone (the N para to C-OH), an enol to its ketone, the
 * ring N-H of a 4(1H)-azinone to the free ring N beside its C=O (4(1H)- to 4(3H)-
 * pyrimidinone). */
typedef enum { SHIFT_NONE = 0, SHIFT_IMINOL, SHIFT_AZINE, SHIFT_ENOL, SHIFT_AZINONE_NH } shift_kind;

enum { PATH_MAX_ATOMS = 15 };

typedef struct shift {
	shift_kind kind;
	int path[PATH_MAX_ATOMS]; /* donor O/S, then the atoms to the acceptor; bonds 1,2,1,2.. */
	int len;                  /* atoms in path */
	int key;                  /* preference, lower first (shift_key) */
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

/* The k-th neighbour of x by any bond, or -1. */
static int any_nbr(const graph *g, int x, int k)
{
	return g->start[x] + k < g->start[x + 1] ? other(g, g->adj[g->start[x] + k], x) : -1;
}

/* Whether all n atoms lie in one ring of the SSSR (of size ring_size; 0: any size). */
static int in_ring_of(const graph *g, const int *atoms, int n, int ring_size)
{
	for (size_t r = 0; r < g->rings.n_rings; r++) {
		const int *ra = g->rings.atoms + g->rings.offsets[r];
		int found = 0;
		if (ring_size && g->rings.sizes[r] != ring_size)
			continue;
		for (int i = 0; i < n; i++)
			for (int j = 0; j < g->rings.sizes[r]; j++)
				found += ra[j] == atoms[i];
		if (found == n)
			return 1;
	}
	return 0;
}

static int in_one_ring(const graph *g, const int *atoms, int n)
{
	return in_ring_of(g, atoms, n, 0);
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

enum { MATCH_BUDGET = 20000 };

/* Whether the atoms with need[] set pair up over aromatic bonds (a Kekule form exists for
 * them); need[] is as it was on return. Exhaustive within *budget calls, so the answer is
 * the molecule's, not its atom order's. */
static int pairs_up(const graph *g, unsigned char *need, int *budget)
{
	int x = -1;
	for (size_t i = 0; i < g->na && x < 0; i++)
		if (need[i])
			x = (int)i;
	if (x < 0)
		return 1;
	if (--*budget < 0)
		return 0;
	int ok = 0;
	need[x] = 0;
	for (int i = g->start[x]; i < g->start[x + 1] && !ok; i++) {
		int y = other(g, g->adj[i], x);
		if (!g->b[g->adj[i]].aromatic || !need[y])
			continue;
		need[y] = 0;
		ok = pairs_up(g, need, budget);
		need[y] = 1;
	}
	need[x] = 1;
	return ok;
}

/* Six-rings that keep a benzenoid sextet in the tautomer s makes: rings of atoms that
 * still need a double bond whose other such atoms still pair up without them. Quinazolin-
 * 2-ol to the 1H-one keeps its benzo ring (N3=C4 pair off), to the 3H-one it would not
 * (N1 and C4 are left apart): the more aromatic form is the one found in water (common
 * practice). -1 when out of memory. */
static int sextets_kept(const graph *g, const shift *s)
{
	unsigned char *need = calloc(g->na + 1, 1);
	if (!need)
		return -1;
	for (size_t k = 0; k < g->nb; k++)
		if (g->b[k].aromatic && g->b[k].order == 2)
			need[g->b[k].a] = need[g->b[k].b] = 1;
	need[s->path[1]] = need[s->path[s->len - 1]] = 0;
	int count = 0;
	for (size_t r = 0; r < g->rings.n_rings; r++) {
		const int *ra = g->rings.atoms + g->rings.offsets[r];
		int all = g->rings.sizes[r] == 6, budget = MATCH_BUDGET;
		for (int j = 0; j < 6 && all; j++)
			all = need[ra[j]] && order(g, ra[j], ra[(j + 1) % 6]) &&
			      g->a[ra[j]].aromatic;
		if (!all)
			continue;
		for (int j = 0; j < 6; j++)
			need[ra[j]] = 0;
		count += pairs_up(g, need, &budget);
		for (int j = 0; j < 6; j++)
			need[ra[j]] = 1;
	}
	free(need);
	return count;
}

/* Preference of a shift, lower first (an azinone N-H shift after all others): a thiol
 * before a hydroxyl (thioamide tautomers are the more favoured, common practice), then the
 * lactam whose N-H is beside the C=O (2-pyridone type; 4(3H)-pyrimidinones, hypoxanthine
 * N1-H, guanine N1-H) before the vinylogous
 * azinone (4-pyridone type), before an enol's ketone; then the form that keeps more
 * benzenoid rings (sextets_kept); among ring N beside C-OH, the one not beside a ring
 * carbon bearing an amino group (cytosine is the 1H amino-oxo tautomer, the amidine N
 * beside the amino carbon stays free; common practice). Ties go to the canonical ranks of
 * donor and acceptor, so the choice never depends on the atom order or the Kekule form of
 * the input. */
static int shift_key(const graph *g, const shift *s)
{
	int o = s->path[0], c1 = s->path[1], n = s->path[s->len - 1];
	if (s->kind == SHIFT_AZINONE_NH)
		return 2000;
	int cls = s->kind == SHIFT_IMINOL ? 0 : s->kind == SHIFT_AZINE ? 1 : 2;
	int ring = g->a[c1].aromatic, amino = s->kind == SHIFT_IMINOL && ring &&
						 beside_amino_carbon(g, n, c1);
	int kept = ring ? sextets_kept(g, s) : 0;
	if (kept < 0)
		return -1;
	kept = kept > 9 ? 9 : kept;
	return (g->a[o].element == 16 ? 0 : 1000) + 100 * cls + 10 * (9 - kept) + amino;
}

/* Extends the path p (len atoms so far; bond k has order 1 for even k, 2 for odd k) through
 * neutral aromatic C or N until it has want atoms and ends at target. */
static int alternating_path(const graph *g, int *p, int len, int want, int target)
{
	int ord = (len - 1) % 2 == 0 ? 1 : 2;
	for (int k = 0, y; (y = nbr(g, p[len - 1], ord, k)) >= 0; k++) {
		int seen = 0;
		for (int i = 0; i < len; i++)
			seen |= p[i] == y;
		if (seen || !g->a[y].aromatic || (!neutral(g, y, 6) && !neutral(g, y, 7)))
			continue;
		p[len] = y;
		if (len + 1 == want) {
			if (y == target)
				return 1;
		} else if (y != target && alternating_path(g, p, len + 1, want, target)) {
			return 1;
		}
	}
	return 0;
}

/* The shortest alternating path O-C1=..=N from donor o over aromatic c1 to ring N n: one
 * exists in the drawn Kekule form whenever the tautomer with N-H and C=O has a Kekule form
 * at all (the path is the difference of the two), so every drawing of one molecule finds
 * the same acceptors (2-hydroxypyridine drawn C2=N1 or C2=C3, 4-hydroxypyrimidine drawn
 * with C4=N3 or C4=C5, isoquinolin-3-ol through the benzo ring). */
static int ring_shift(const graph *g, int o, int c1, int n, shift_kind kind, shift *s)
{
	for (int want = 3; want <= PATH_MAX_ATOMS; want += 2) {
		int p[PATH_MAX_ATOMS] = {o, c1};
		if (alternating_path(g, p, 2, want, n)) {
			*s = (shift){kind, {0}, want, 0};
			memcpy(s->path, p, (size_t)want * sizeof *p);
			s->key = shift_key(g, s);
			return 1;
		}
	}
	return 0;
}

/* Whether neighbour x of c1 can stand between C-OH and a para ring N (a neutral C or N). */
static int ring_link(const graph *g, int x, int element_c_only)
{
	return neutral(g, x, 6) || (!element_c_only && neutral(g, x, 7));
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

/* Offers s to *best when it is preferred: by key, then by the canonical ranks of donor and
 * acceptor (computed on first need; *rc gets PRED_ENOMEM on failure). */
static void offer(const graph *g, const obw_mol *m, int **rank, int *rc, const shift *s,
		  shift *best)
{
	if (s->key < 0) {
		*rc = PRED_ENOMEM;
		return;
	}
	if (best->kind != SHIFT_NONE && s->key > best->key)
		return;
	if (best->kind != SHIFT_NONE && s->key == best->key) {
		if (!*rank) {
			*rank = malloc((g->na + 1) * sizeof **rank);
			if (!*rank || canon_rank(NULL, NULL, *rank, m, NULL)) {
				*rc = PRED_ENOMEM;
				return;
			}
		}
		const int *r = *rank;
		int so = r[s->path[0]], bo = r[best->path[0]];
		int sn = r[s->path[s->len - 1]], bn = r[best->path[best->len - 1]];
		if (so > bo || (so == bo && sn >= bn))
			return;
	}
	*best = *s;
}

/* The shifts of donor o on carbon c1, each offered to *best. On an aromatic carbon: to a
 * neutral ring N beside c1 (lactim) or para to it in one ring (hydroxy-azine), by whichever
 * path the drawn Kekule form allows. On a non-aromatic carbon: HO-C=N (iminol), or HO-C=C
 * with neither carbon aromatic and no conjugation (enol). */
static void donor_shifts(const graph *g, const obw_mol *m, int o, int c1, int **rank, int *rc,
			 shift *best)
{
	shift s;
	if (g->a[c1].aromatic) {
		for (int i = 0, a2; (a2 = any_nbr(g, c1, i)) >= 0; i++) {
			if (a2 == o || !g->a[a2].aromatic)
				continue;
			int pair[2] = {c1, a2};
			if (neutral(g, a2, 7) && g->a[a2].hcount == 0 && in_one_ring(g, pair, 2) &&
			    ring_shift(g, o, c1, a2, SHIFT_IMINOL, &s))
				offer(g, m, rank, rc, &s, best);
			if (!ring_link(g, a2, 0))
				continue;
			for (int j = 0, a3; (a3 = any_nbr(g, a2, j)) >= 0; j++) {
				if (a3 == c1 || !ring_link(g, a3, 1))
					continue;
				for (int l = 0, n; (n = any_nbr(g, a3, l)) >= 0; l++) {
					int ring[4] = {c1, a2, a3, n};
					if (n == a2 || !neutral(g, n, 7) || g->a[n].hcount ||
					    !g->a[n].aromatic || order(g, c1, n) ||
					    !in_one_ring(g, ring, 4))
						continue;
					if (ring_shift(g, o, c1, n, SHIFT_AZINE, &s))
						offer(g, m, rank, rc, &s, best);
				}
			}
		}
		return;
	}
	for (int k = 0, x; (x = nbr(g, c1, 2, k)) >= 0; k++) {
		if (neutral(g, x, 7)) {
			s = (shift){SHIFT_IMINOL, {o, c1, x}, 3, 0};
		} else if (g->a[o].element == 8 && neutral(g, x, 6) && !g->a[x].aromatic &&
			   !conjugated(g, o, c1, x)) {
			s = (shift){SHIFT_ENOL, {o, c1, x}, 3, 0};
		} else {
			continue;
		}
		s.key = shift_key(g, &s);
		offer(g, m, rank, rc, &s, best);
	}
}

/* Whether carbon c carries an exocyclic C=O or C=S. */
static int oxo_carbon(const graph *g, int c)
{
	if (!neutral(g, c, 6))
		return 0;
	for (int k = 0, y; (y = nbr(g, c, 2, k)) >= 0; k++)
		if ((neutral(g, y, 8) || neutral(g, y, 16)) && g->a[y].degree == 1)
			return 1;
	return 0;
}

/* The shift of the H of aromatic ring N-H n1 of a 4(1H)-pyrimidinone (n1 para to the C=O
 * or C=S carbon c4 in one six-ring) over n1-C2=N3 to the free ring N3 beside c4: the lactam
 * whose N-H is beside the C=O is the main tautomer in water, as shift_key prefers it for
 * drawn hydroxy-azines (4(3H)-pyrimidinone, quinazolin-4(3H)-one, hypoxanthine N1-H; common
 * practice), so that every drawing of one molecule is one input. Only where both ring
 * neighbours of n1 are carbons with no C=O, C=S, OH or SH of their own: the 1,2,4-triazin-
 * 5(2H)-ones (N-H beside N) are named in their drawn form by the compilations, and a 6-
 * mercapto group beside the N-H has a tautomer question of its own. After every O/S shift
 * (shift_key). */
static void azinone_nh_shifts(const graph *g, const obw_mol *m, int n1, int **rank, int *rc,
			      shift *best)
{
	const obw_atom *x = &g->a[n1];
	if (!neutral(g, n1, 7) || !x->aromatic || x->hcount != 1 || x->degree != 2)
		return;
	for (int i = 0, c; (c = any_nbr(g, n1, i)) >= 0; i++) {
		if (!neutral(g, c, 6) || oxo_carbon(g, c))
			return;
		for (int k = 0, y; (y = nbr(g, c, 1, k)) >= 0; k++)
			if (y != n1 && donor_carbon(g, y) == c)
				return;
	}
	for (int i = 0, c2; (c2 = nbr(g, n1, 1, i)) >= 0; i++) {
		if (!neutral(g, c2, 6) || !g->a[c2].aromatic)
			continue;
		for (int j = 0, n3; (n3 = nbr(g, c2, 2, j)) >= 0; j++) {
			if (!neutral(g, n3, 7) || !g->a[n3].aromatic || g->a[n3].hcount ||
			    g->a[n3].degree != 2)
				continue;
			for (int k = 0, c4; (c4 = nbr(g, n3, 1, k)) >= 0; k++) {
				int ring[4] = {n1, c2, n3, c4};
				if (c4 == c2 || !oxo_carbon(g, c4) || !in_ring_of(g, ring, 4, 6))
					continue;
				shift s = {SHIFT_AZINONE_NH, {n1, c2, n3}, 3, 0};
				s.key = shift_key(g, &s);
				offer(g, m, rank, rc, &s, best);
			}
		}
	}
}

/* The preferred shift over all donors (shift_key, then canonical ranks). 1 when there is
 * one, 0 when none, a PRED_E* code (negative) on failure. */
static int find_shift(const graph *g, const obw_mol *m, int **rank, shift *best)
{
	int rc = 0;
	best->kind = SHIFT_NONE;
	for (size_t o = 0; o < g->na && !rc; o++) {
		int c1 = donor_carbon(g, (int)o);
		if (c1 >= 0)
			donor_shifts(g, m, (int)o, c1, rank, &rc, best);
		else
			azinone_nh_shifts(g, m, (int)o, rank, &rc, best);
	}
	return rc ? rc : best->kind != SHIFT_NONE;
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
	case SHIFT_AZINONE_NH:
		return "4(1H)-azinone to the N-H beside the C=O";
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
	int *rank = NULL, found = 0;
	int rc = graph_load(&g, m);
	/* each shift takes the H off one O/S for good, so the loop ends; the bound is a guard */
	for (size_t it = 0, limit = g.na + 1;
	     !rc && it < limit && (found = find_shift(&g, m, &rank, &s)) > 0; it++) {
		rc = apply(m, &g, &s);
		norm_warn(rep, "input tautomer changed: %s at atom %d (H moved to atom %d)",
			  shift_name(&g, &s), g.a[s.path[0]].orig_index,
			  g.a[s.path[s.len - 1]].orig_index);
		if (!rc)
			rc = obw_mol_refresh(m, msg, sizeof msg);
		if (!rc)
			rc = graph_load(&g, m);
	}
	if (!rc && found < 0)
		rc = found;
	graph_free(&g);
	free(rank);
	if (rc == PRED_ENOMEM)
		return fail(err, rc, "out of memory");
	if (rc)
		return fail(err, rc, msg[0] ? msg : "cannot move the tautomeric hydrogen");
	return 0;
}
