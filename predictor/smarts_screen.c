/* SPDX-License-Identifier: MIT */
/* smarts_screen.c: does a compiled screen (smarts_screen_parse.c) possibly match a molecule?
 * Backtracking over the pattern atoms in SMARTS order with three-valued primitives; only a
 * primitive read exactly from the toolkit's own perception (element, aromaticity, H count,
 * connections, charge, SSSR rings, bond order) can say no, so a "no" is never wrong. */
#include <stdlib.h>
#include <string.h>

#include "smarts_screen.h"

typedef struct search {
	const smarts_screen *s;
	const sx_mol *m;
	unsigned char *memo;     /* n_pats x nat recursive values, 0 = not yet, else value + 1 */
	unsigned char *used;     /* n_pats x nat: atoms taken by the embedding of each pattern */
	unsigned char *feasible; /* per pattern: 0 not yet, 1 no, 2 yes */
	int *map;                /* pattern atom -> molecule atom, all patterns side by side */
	const int *map_base;     /* s->map_base */
	const int *taken;        /* atoms no atom of the main pattern may take (own matches) */
	const int *first_taken;  /* atoms the first SMARTS atom may not take (own matches) */
	int first_k;             /* the main pattern's atom that is the first SMARTS atom */
} search;

static int tv_and(int a, int b)
{
	return a < b ? a : b;
}

static int tv_or(int a, int b)
{
	return a > b ? a : b;
}

static int tv(int cond)
{
	return cond ? SX_T : SX_F;
}

static int recursive_value(search *x, int pat, int atom);

static int ring_size_value(const sx_mol *m, int atom, int size)
{
	if (!m->atoms[atom].in_ring)
		return SX_F;
	if (size < 32 && (m->ring_sizes[atom] >> size) & 1)
		return SX_T;
	return SX_U;
}

static int atom_prim(search *x, const sx_node *n, int atom)
{
	const obw_atom *a = &x->m->atoms[atom];
	switch (n->prim) {
	case SXP_TRUE: return SX_T;
	case SXP_ELEM: return tv(a->element == n->value);
	case SXP_AROM_ELEM: return tv(a->element == n->value && a->aromatic);
	case SXP_ALIPH_ELEM: return tv(a->element == n->value && !a->aromatic);
	case SXP_AROMATIC: return tv(a->aromatic);
	case SXP_ALIPHATIC: return tv(!a->aromatic);
	case SXP_HCOUNT: return tv(a->hcount == n->value);
	case SXP_CONNECT: return tv(a->degree + a->hcount == n->value);
	case SXP_DEGREE:
		return tv(x->m->adj_start[atom + 1] - x->m->adj_start[atom] == n->value);
	case SXP_CHARGE: return tv(a->charge == n->value);
	case SXP_IN_RING: return tv(a->in_ring == n->value);
	case SXP_RING_COUNT: return a->in_ring ? SX_U : SX_F;
	case SXP_RING_SIZE: return ring_size_value(x->m, atom, n->value);
	case SXP_RECURSIVE: return recursive_value(x, n->value, atom);
	default: return SX_U;
	}
}

static int bond_prim(const sx_node *n, const obw_bond *b)
{
	switch (n->prim) {
	case SXB_SINGLE: return b->aromatic ? SX_U : tv(b->order == 1);
	case SXB_DOUBLE: return b->aromatic ? SX_U : tv(b->order == 2);
	case SXB_TRIPLE: return b->aromatic ? SX_U : tv(b->order == 3);
	case SXB_AROMATIC: return tv(b->aromatic);
	case SXB_ANY: return SX_T;
	case SXB_RING: return tv(b->in_ring);
	case SXB_DEFAULT: return tv(b->aromatic || b->order == 1);
	default: return SX_U;
	}
}

/* Value of expression node k on an atom (bond == NULL) or on a bond. */
static int eval(search *x, int k, int atom, const obw_bond *bond)
{
	const sx_node *n = &x->s->nodes[k];
	switch (n->op) {
	case SX_AND: {
		int a = eval(x, n->a, atom, bond);
		return a == SX_F ? SX_F : tv_and(a, eval(x, n->b, atom, bond));
	}
	case SX_OR: {
		int a = eval(x, n->a, atom, bond);
		return a == SX_T ? SX_T : tv_or(a, eval(x, n->b, atom, bond));
	}
	case SX_NOT: return SX_T - eval(x, n->a, atom, bond);
	default: return bond ? bond_prim(n, bond) : atom_prim(x, n, atom);
	}
}

/* The molecule's shared values of slot k, cleared on their first use in the molecule. */
static unsigned char *shared_row(const sx_mol *m, int k)
{
	unsigned char *row = m->shared + (size_t)k * m->nat;
	if (!m->shared_ready[k]) {
		memset(row, 0, m->nat);
		m->shared_ready[k] = 1;
	}
	return row;
}

/* Value of pattern atom pa's expression on atom, shared across screens when it can be. */
static int atom_value(search *x, const sx_patom *pa, int atom)
{
	if (pa->shared < 0 || !x->m->shared)
		return eval(x, pa->expr, atom, NULL);
	unsigned char *slot = shared_row(x->m, pa->shared) + atom;
	if (!*slot)
		*slot = (unsigned char)(1 + eval(x, pa->expr, atom, NULL));
	return *slot - 1;
}

/* The molecule bond between atoms a and b, NULL when none. */
static const obw_bond *bond_between(const sx_mol *m, int a, int b)
{
	for (int j = m->adj_start[a]; j < m->adj_start[a + 1]; j++)
		if (m->adj[j] == b)
			return &m->bonds[m->adj_bond[j]];
	return NULL;
}

/* Lowest value of the ring-closure bonds that end at pattern atom k placed on atom. */
static int closures_value(search *x, const sx_pat *pt, const int *map, int k, int atom)
{
	int v = SX_T;
	for (int c = 0; c < pt->n_closures && v != SX_F; c++) {
		const sx_closure *cl = &pt->closures[c];
		if (cl->b != k)
			continue;
		const obw_bond *b = bond_between(x->m, map[cl->a], atom);
		v = b ? tv_and(v, eval(x, cl->bond, -1, b)) : SX_F;
	}
	return v;
}

/* Best value (the lowest value along an embedding, maximised over embeddings) of the
 * embeddings of pattern pat that extend atoms 0..k-1 of value cur; stops at target. */
static int extend(search *x, int pat, int k, int cur, int target)
{
	const sx_pat *pt = &x->s->pats[pat];
	int *map = x->map + x->map_base[pat];
	unsigned char *used = x->used + (size_t)pat * x->m->nat;
	if (k == pt->n_atoms)
		return cur;
	const sx_patom *pa = &pt->atoms[k];
	const sx_mol *m = x->m;
	int from = map[pa->parent], best = SX_F;
	for (int j = m->adj_start[from]; j < m->adj_start[from + 1] && best < target; j++) {
		int atom = m->adj[j];
		if (used[atom] || !(m->kind[atom] & pa->kinds))
			continue;
		int v = tv_and(cur, eval(x, pa->bond, -1, &m->bonds[m->adj_bond[j]]));
		if (v > best)
			v = tv_and(v, atom_value(x, pa, atom));
		if (v > best)
			v = tv_and(v, closures_value(x, pt, map, k, atom));
		if (v <= best)
			continue;
		map[k] = atom;
		used[atom] = 1;
		v = extend(x, pat, k + 1, v, target);
		used[atom] = 0;
		if (v > best)
			best = v;
	}
	return best;
}

/* Every atom of pattern pat has a kind the molecule holds. */
static int feasible(search *x, int pat)
{
	if (!x->feasible[pat]) {
		const sx_pat *pt = &x->s->pats[pat];
		int yes = 1;
		for (int i = 0; i < pt->n_atoms && yes; i++)
			yes = (pt->atoms[i].kinds & x->m->kinds) != 0;
		x->feasible[pat] = (unsigned char)(yes ? 2 : 1);
	}
	return x->feasible[pat] == 2;
}

/* Best value of the embeddings of pattern pat with its first atom on atom. */
static int rooted(search *x, int pat, int atom, int target)
{
	const sx_pat *pt = &x->s->pats[pat];
	if (!(x->m->kind[atom] & pt->atoms[0].kinds))
		return SX_F;
	int v = atom_value(x, &pt->atoms[0], atom);
	if (v == SX_F)
		return SX_F;
	unsigned char *used = x->used + (size_t)pat * x->m->nat;
	x->map[x->map_base[pat]] = atom;
	used[atom] = 1;
	v = extend(x, pat, 1, v, target);
	used[atom] = 0;
	return v;
}

/* A recursive pattern is matched on its own (its atoms may repeat the outer match's). */
static int recursive_value(search *x, int pat, int atom)
{
	int shared = x->s->pats[pat].shared;
	unsigned char *slot = shared >= 0 && x->m->shared
				      ? shared_row(x->m, shared) + atom
				      : &x->memo[(size_t)pat * x->m->nat + (size_t)atom];
	if (!*slot)
		*slot = (unsigned char)(1 + (feasible(x, pat) ? rooted(x, pat, atom, SX_T) : SX_F));
	return *slot - 1;
}

size_t smarts_screen_scratch(size_t nat)
{
	return 2 * (size_t)SX_MAX_PATS * nat + SX_MAX_PATS + SX_MAX_ATOMS * sizeof(int) + 16;
}

void smarts_screen_scratch_init(unsigned char *scratch, size_t nat)
{
	/* the per-pattern used marks (see init_search's layout) start clear and are left clear
	 * by every search */
	memset(scratch + SX_MAX_ATOMS * sizeof(int) + (size_t)SX_MAX_PATS * nat, 0,
	       (size_t)SX_MAX_PATS * nat);
}

/* Lays the search state over the molecule's scratch memory and clears it. */
static void init_search(search *x, const smarts_screen *s, const sx_mol *m)
{
	x->s = s;
	x->m = m;
	x->map_base = s->map_base;
	x->taken = NULL;
	x->first_taken = NULL;
	x->first_k = -1;
	/* layout: map (ints, aligned first), memo, used, feasible */
	x->map = (int *)(void *)m->scratch;
	x->memo = m->scratch + SX_MAX_ATOMS * sizeof(int);
	x->used = x->memo + (size_t)SX_MAX_PATS * m->nat;
	x->feasible = x->used + (size_t)SX_MAX_PATS * m->nat;
	if (s->own_memo)
		memset(x->memo, 0, (size_t)s->n_pats * m->nat);
	memset(x->feasible, 0, (size_t)s->n_pats);
}

int smarts_screen_may_match(const smarts_screen *s, const sx_mol *m)
{
	if (!s || !m->nat || !m->scratch)
		return 1;
	search x;
	init_search(&x, s, m);
	if (!feasible(&x, 0))
		return 0;
	for (size_t a = 0; a < m->nat; a++)
		if (rooted(&x, 0, (int)a, SX_U) != SX_F)
			return 1;
	return 0;
}

/* ---- matches of our own --------------------------------------------------------------- */

enum { SX_MAX_FOUND = 4096 }; /* more embeddings than this: let Open Babel list them */

typedef struct found {
	int *maps; /* n ints per embedding, in the screen's atom order */
	size_t n, cap;
	int undecided;
	int local[512]; /* the first embeddings, before maps moves to the heap */
} found;

/* Room for one more embedding of n atoms; zero when out of memory or at SX_MAX_FOUND. */
static int found_room(found *f, int n)
{
	if (f->n < f->cap)
		return 1;
	size_t cap = 2 * f->cap + 4;
	if (cap > SX_MAX_FOUND)
		return 0;
	int *grown = malloc(cap * (size_t)n * sizeof *grown);
	if (!grown)
		return 0;
	memcpy(grown, f->maps, f->n * (size_t)n * sizeof *grown);
	if (f->maps != f->local)
		free(f->maps);
	f->maps = grown;
	f->cap = cap;
	return 1;
}

/* Every embedding of atoms k.. of the main pattern that extends the current map: the true
 * ones are kept; a "maybe" one makes the whole answer undecided. */
static void collect(search *x, found *f, int k, int cur)
{
	const sx_pat *pt = &x->s->pats[0];
	const sx_mol *m = x->m;
	if (k == pt->n_atoms) {
		if (cur != SX_T || !found_room(f, k)) {
			f->undecided = 1; /* a "maybe", or the store is full */
			return;
		}
		memcpy(f->maps + f->n++ * (size_t)k, x->map, (size_t)k * sizeof *f->maps);
		return;
	}
	const sx_patom *pa = &pt->atoms[k];
	int from = x->map[pa->parent];
	for (int j = m->adj_start[from]; j < m->adj_start[from + 1] && !f->undecided; j++) {
		int atom = m->adj[j];
		if (x->used[atom] || !(m->kind[atom] & pa->kinds) ||
		    (x->taken && x->taken[atom] >= 0) ||
		    (k == x->first_k && x->first_taken[atom] >= 0))
			continue;
		int v = tv_and(cur, eval(x, pa->bond, -1, &m->bonds[m->adj_bond[j]]));
		if (v != SX_F)
			v = tv_and(v, atom_value(x, pa, atom));
		if (v != SX_F)
			v = tv_and(v, closures_value(x, pt, x->map, k, atom));
		if (v == SX_F)
			continue;
		x->map[k] = atom;
		x->used[atom] = 1;
		collect(x, f, k + 1, v);
		x->used[atom] = 0;
	}
}

/* Open Babel's enumeration key of a match in SMARTS order: the first atom's index, then
 * each atom's place among the neighbours of its parent's atom. */
static void match_key(int *key, const int *mt, const smarts_screen *s, const sx_mol *m, int n)
{
	key[0] = mt[0];
	for (int i = 1; i < n; i++) {
		const obw_bond *b = bond_between(m, mt[s->smarts_parent[i]], mt[i]);
		int from = mt[s->smarts_parent[i]], j = m->adj_start[from], bi = (int)(b - m->bonds);
		while (j < m->adj_start[from + 1] && m->ob_bonds[j] != bi)
			j++;
		key[i] = j - m->adj_start[from];
	}
}

static int cmp_keys(const int *a, const int *b, int n)
{
	for (int i = 0; i < n; i++)
		if (a[i] != b[i])
			return a[i] < b[i] ? -1 : 1;
	return 0;
}

/* The first atom and the sorted rest: two matches with one key are one match. */
static void set_key(int *key, const int *mt, int n)
{
	memcpy(key, mt, (size_t)n * sizeof *key);
	for (int i = 2; i < n; i++)
		for (int j = i; j > 1 && key[j - 1] > key[j]; j--) {
			int t = key[j];
			key[j] = key[j - 1];
			key[j - 1] = t;
		}
}

/* Matches of f (screen order) into out in SMARTS order, sorted by Open Babel's key
 * (insertion: the lists are short), duplicates by atom set dropped; returns the count. */
static size_t order_matches(int *out, int *keys, const found *f, const smarts_screen *s,
			    const sx_mol *m, int n)
{
	size_t cnt = 0;
	for (size_t i = 0; i < f->n; i++) {
		int *mt = out + cnt * (size_t)n, *key = keys + cnt * (size_t)n;
		for (int k = 0; k < n; k++)
			mt[s->smarts_order[k]] = f->maps[i * (size_t)n + (size_t)k];
		match_key(key, mt, s, m, n);
		size_t at = cnt++;
		for (; at > 0 && cmp_keys(keys + (at - 1) * (size_t)n, key, n) > 0; at--)
			;
		if (at == cnt - 1)
			continue;
		int tm[SX_MAX_ATOMS], tk[SX_MAX_ATOMS];
		memcpy(tm, mt, (size_t)n * sizeof *tm);
		memcpy(tk, key, (size_t)n * sizeof *tk);
		size_t tail = (cnt - 1 - at) * (size_t)n * sizeof *out;
		memmove(out + (at + 1) * (size_t)n, out + at * (size_t)n, tail);
		memmove(keys + (at + 1) * (size_t)n, keys + at * (size_t)n, tail);
		memcpy(out + at * (size_t)n, tm, (size_t)n * sizeof *tm);
		memcpy(keys + at * (size_t)n, tk, (size_t)n * sizeof *tk);
	}
	size_t kept = 0;
	for (size_t i = 0; i < cnt; i++) {
		int *key = keys + i * (size_t)n, seen = 0;
		set_key(key, out + i * (size_t)n, n);
		for (size_t k = 0; k < kept && !seen; k++)
			seen = !memcmp(keys + k * (size_t)n, key, (size_t)n * sizeof *key);
		if (seen)
			continue;
		memmove(keys + kept * (size_t)n, key, (size_t)n * sizeof *key);
		memmove(out + kept * (size_t)n, out + i * (size_t)n, (size_t)n * sizeof *out);
		kept++;
	}
	return kept;
}

int smarts_screen_matches(int **out, const smarts_screen *s, const sx_mol *m, const int *taken,
			  const int *first_taken)
{
	*out = NULL;
	if (!s || !m->nat || !m->scratch || !m->own_matches)
		return -1;
	search x;
	int n = s->pats[0].n_atoms;
	init_search(&x, s, m);
	if (!feasible(&x, 0))
		return 0;
	found f;
	f.maps = f.local;
	f.n = 0;
	f.cap = sizeof f.local / sizeof f.local[0] / (size_t)n;
	f.undecided = 0;
	for (int k = 0; first_taken && k < n; k++)
		if (s->smarts_order[k] == 0) {
			x.first_taken = first_taken;
			x.first_k = k;
		}
	/* a taken atom is never placed, as if used from the start (read, not copied into the
	 * main pattern's marks: most calls place few atoms) */
	x.taken = taken;
	/* roots kind by kind: the order found does not matter, the list is sorted after */
	const sx_patom *pa = &s->pats[0].atoms[0];
	for (uint32_t ks = pa->kinds & m->kinds; ks && !f.undecided; ks &= ks - 1) {
		int k = 0;
		while (!((ks >> k) & 1u))
			k++;
		for (int i = m->kind_start[k]; i < m->kind_start[k + 1] && !f.undecided; i++) {
			int a = m->kind_atoms[i];
			int v = (taken && taken[a] >= 0) || (x.first_k == 0 && first_taken[a] >= 0)
					? SX_F
					: atom_value(&x, pa, a);
			if (v == SX_F)
				continue;
			x.map[0] = a;
			x.used[a] = 1;
			collect(&x, &f, 1, v);
			x.used[a] = 0;
		}
	}
	int *res = f.undecided || !f.n ? NULL : malloc(2 * f.n * (size_t)n * sizeof *res);
	if (f.undecided || (f.n && !res)) {
		if (f.maps != f.local)
			free(f.maps);
		return -1;
	}
	size_t kept = f.n ? order_matches(res, res + f.n * (size_t)n, &f, s, m, n) : 0;
	if (f.maps != f.local)
		free(f.maps);
	*out = res;
	return (int)kept;
}
