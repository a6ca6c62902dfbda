/* SPDX-License-Identifier: MIT */
/* smiles_write.c: SMILES text of a molecule in canonical rank order (OpenSMILES syntax:
 * organic subset, bracket atoms, ring closures, tetrahedral @/@@), so that pkad's canonical
 * SMILES follow its own labelling (canon_rank.c) without Open Babel's writer. */
#include "smiles_write.h"

#include <ctype.h>
#include <stdlib.h>
#include <string.h>

#include "canon_rank.h"

enum { DIGITS = 100 };

typedef struct sw {
	size_t n;
	const obw_atom *at;
	const obw_bond *bd;
	const int *rank, *scls;
	const obw_tetra *tetra;
	int *tet;        /* tetrahedral record of each atom, -1 none */
	int *start;      /* CSR, each atom's neighbours in rank order */
	int *nbr, *nbond;
	int *up;         /* bond to the DFS parent, -1 for a root */
	int *opener;     /* ring-closure bond: the atom written first; -1 a tree bond */
	int *digit;      /* ring-closure bond: its digit while open */
	unsigned char *seen;
	unsigned char used[DIGITS];
	char *buf;
	size_t len, cap;
	int bad;         /* out of memory, or something this writer does not write */
} sw;

static void put(sw *w, const char *s)
{
	if (!*s)
		return; /* empty bond symbols and branch marks are most of the calls */
	size_t k = strlen(s);
	if (w->len + k + 1 > w->cap) {
		size_t cap = 2 * (w->len + k + 1) + 4 * w->n; /* most molecules: one allocation */
		char *p = realloc(w->buf, cap);
		if (!p) {
			w->bad = 1;
			return;
		}
		w->buf = p;
		w->cap = cap;
	}
	memcpy(w->buf + w->len, s, k + 1);
	w->len += k;
}

/* Hydrogens a reader infers for an unbracketed atom (OpenSMILES organic subset: the lowest
 * normal valence at or above the bonds; aromatic atoms other than carbon take none); -1
 * where the atom is written in brackets anyway (beyond every normal valence, as Cl[I]Cl). */
static int implied_h(const obw_atom *x)
{
	static const int val[][3] = {[5] = {3}, [6] = {4}, [7] = {3, 5}, [8] = {2}, [9] = {1},
				     [15] = {3, 5}, [16] = {2, 4, 6}, [17] = {1}, [35] = {1},
				     [53] = {1}};
	if (x->element <= 0 || x->element >= (int)(sizeof val / sizeof *val) || !val[x->element][0])
		return -1;
	if (x->aromatic && x->element != 6)
		return x->element == 7 || x->element == 8 || x->element == 16 || x->element == 5 ||
				       x->element == 15
			       ? 0
			       : -1;
	for (int k = 0; k < 3 && val[x->element][k]; k++)
		if (val[x->element][k] >= x->valence)
			return val[x->element][k] - x->valence;
	return -1;
}

/* Bond symbol between a and b: aromatic bonds and plain single bonds go unwritten, except a
 * single bond joining two aromatic atoms. */
static const char *bond_symbol(const sw *w, int bond)
{
	const obw_bond *b = &w->bd[bond];
	int both = w->at[b->a].aromatic && w->at[b->b].aromatic;
	if (b->aromatic && both)
		return "";
	return b->order == 2 ? "=" : b->order == 3 ? "#" : both ? "-" : "";
}

/* Neighbours of a in the order a reader sees them: the parent, the hydrogen (or lone pair,
 * -1), ring closures as written, then the branches. Returns the count (at most 8). */
static int written_order(const sw *w, int a, int *out, int with_h)
{
	int n = 0;
	if (w->up[a] >= 0)
		out[n++] = w->bd[w->up[a]].a == a ? w->bd[w->up[a]].b : w->bd[w->up[a]].a;
	if (with_h)
		out[n++] = -1;
	for (int pass = 0; pass < 2; pass++)
		for (int k = w->start[a]; k < w->start[a + 1] && n < 8; k++) {
			int b = w->nbr[k], bond = w->nbond[k];
			int closure = w->opener[bond] >= 0, child = !closure && w->up[b] == bond;
			if ((pass == 0 && closure) || (pass == 1 && child))
				out[n++] = b;
		}
	return n;
}

/* "@", "@@" or "" for atom a: a mark only where the four neighbours differ in class. */
static const char *chirality(sw *w, int a)
{
	if (w->tet[a] < 0)
		return "";
	const obw_tetra *t = &w->tetra[w->tet[a]];
	int has_h = 0, cls[4], out[8];
	for (int k = 0; k < 4; k++) {
		has_h |= t->nbr[k] < 0;
		cls[k] = t->nbr[k] < 0 ? -1 : w->scls[t->nbr[k]];
		for (int l = 0; l < k; l++)
			if (cls[l] == cls[k])
				return "";
	}
	if (written_order(w, a, out, has_h) != 4) {
		w->bad = 1;
		return "";
	}
	/* parity of the permutation taking the drawn listing (clockwise from nbr[0]) to the
	 * written one: even keeps clockwise, '@@' */
	int pos[4], odd = 0;
	for (int k = 0; k < 4; k++) {
		pos[k] = -1;
		for (int l = 0; l < 4; l++)
			if (out[l] == t->nbr[k])
				pos[k] = l;
		if (pos[k] < 0) {
			w->bad = 1;
			return "";
		}
	}
	for (int k = 0; k < 4; k++)
		for (int l = k + 1; l < 4; l++)
			odd ^= pos[k] > pos[l];
	return odd ? "@" : "@@";
}

/* Decimal digits of v >= 0 after prefix (at most 12 bytes with the terminator). */
static void put_number(sw *w, const char *prefix, int v)
{
	char s[16], *p = s + sizeof s;
	*--p = 0;
	do {
		*--p = (char)('0' + v % 10);
		v /= 10;
	} while (v && p > s + 4);
	size_t k = strlen(prefix);
	p -= k;
	memcpy(p, prefix, k);
	put(w, p);
}

/* The lowercase symbols SMILES has for aromatic atoms (OpenSMILES). */
static int aromatic_symbol(const char *name)
{
	static const char *const ok[] = {"b", "c", "n", "o", "p", "s", "se", "as", "te"};
	for (size_t i = 0; i < sizeof ok / sizeof *ok; i++)
		if (!strcmp(name, ok[i]))
			return 1;
	return 0;
}

static void put_atom(sw *w, int a)
{
	const obw_atom *x = &w->at[a];
	const char *sym = obw_element_symbol(x->element), *chir = chirality(w, a);
	char name[4] = {0};
	size_t k = strlen(sym);
	if (!k || k > 3) {
		w->bad = 1;
		return;
	}
	memcpy(name, sym, k);
	if (x->aromatic)
		name[0] = (char)tolower((unsigned char)name[0]);
	if (x->aromatic && !aromatic_symbol(name)) {
		w->bad = 1;
		return;
	}
	if (!x->charge && !x->isotope && !*chir && implied_h(x) == x->hcount) {
		put(w, name);
		return;
	}
	if (x->isotope)
		put_number(w, "[", x->isotope);
	else
		put(w, "[");
	put(w, name);
	put(w, chir);
	if (x->hcount)
		x->hcount > 1 ? put_number(w, "H", x->hcount) : put(w, "H");
	if (x->charge) {
		int q = x->charge < 0 ? -x->charge : x->charge;
		q > 1 ? put_number(w, x->charge > 0 ? "+" : "-", q) : put(w, x->charge > 0 ? "+" : "-");
	}
	put(w, "]");
}

static void put_digit(sw *w, int d)
{
	put_number(w, d < 10 ? "" : "%", d);
}

/* Ring-closure digits at a: closing ones first (their digits freed after), then opening
 * ones with the lowest free digits, each with its bond symbol. */
static void put_closures(sw *w, int a)
{
	int freed[8], nf = 0;
	for (int k = w->start[a]; k < w->start[a + 1]; k++) {
		int bond = w->nbond[k];
		if (w->opener[bond] >= 0 && w->opener[bond] != a) {
			put_digit(w, w->digit[bond]);
			if (nf < 8)
				freed[nf++] = w->digit[bond];
		}
	}
	for (int k = w->start[a]; k < w->start[a + 1]; k++) {
		int bond = w->nbond[k], d = 1;
		if (w->opener[bond] != a)
			continue;
		while (d < DIGITS && w->used[d])
			d++;
		if (d == DIGITS) {
			w->bad = 1;
			return;
		}
		w->used[d] = 1;
		w->digit[bond] = d;
		put(w, bond_symbol(w, bond));
		put_digit(w, d);
	}
	for (int i = 0; i < nf; i++)
		w->used[freed[i]] = 0;
}

static void put_tree(sw *w, int a)
{
	put_atom(w, a);
	put_closures(w, a);
	int last = -1;
	for (int k = w->start[a]; k < w->start[a + 1]; k++)
		if (w->opener[w->nbond[k]] < 0 && w->up[w->nbr[k]] == w->nbond[k])
			last = k;
	for (int k = w->start[a]; k < w->start[a + 1] && !w->bad; k++) {
		int b = w->nbr[k], bond = w->nbond[k];
		if (w->opener[bond] >= 0 || w->up[b] != bond)
			continue;
		put(w, k == last ? "" : "(");
		put(w, bond_symbol(w, bond));
		put_tree(w, b);
		put(w, k == last ? "" : ")");
	}
}

/* Depth-first walk in rank order: tree bonds (up) and ring closures (opener: the ancestor,
 * written first; the walk meets each closure first from the descendant). */
static void walk(sw *w, int a)
{
	w->seen[a] = 1;
	for (int k = w->start[a]; k < w->start[a + 1]; k++) {
		int b = w->nbr[k], bond = w->nbond[k];
		if (bond == w->up[a] || w->up[b] == bond || w->opener[bond] >= 0)
			continue;
		if (!w->seen[b]) {
			w->up[b] = bond;
			walk(w, b);
		} else {
			w->opener[bond] = b;
		}
	}
}

/* CSR adjacency with every atom's neighbours in rank order. */
static void build_graph(sw *w, size_t nb)
{
	for (size_t i = 0; i < nb; i++) {
		w->start[w->bd[i].a + 1]++;
		w->start[w->bd[i].b + 1]++;
	}
	for (size_t a = 0; a < w->n; a++)
		w->start[a + 1] += w->start[a];
	int *fill = w->digit; /* free until the writing */
	memcpy(fill, w->start, w->n * sizeof *fill);
	for (size_t i = 0; i < nb; i++) {
		int ends[2] = {w->bd[i].a, w->bd[i].b};
		for (int e = 0; e < 2; e++) {
			int a = ends[e], b = ends[1 - e], k = fill[a]++;
			for (; k > w->start[a] && w->rank[w->nbr[k - 1]] > w->rank[b]; k--) {
				w->nbr[k] = w->nbr[k - 1];
				w->nbond[k] = w->nbond[k - 1];
			}
			w->nbr[k] = b;
			w->nbond[k] = (int)i;
		}
	}
}

static int *sw_alloc(sw *w, size_t nb)
{
	size_t n = w->n;
	int *blk = calloc(4 * n + 6 * nb + 2, sizeof *blk);
	w->seen = calloc(n + 1, 1);
	if (!blk || !w->seen) {
		free(blk);
		free(w->seen);
		return NULL;
	}
	w->start = blk;
	w->nbr = w->start + n + 1;
	w->nbond = w->nbr + 2 * nb;
	w->opener = w->nbond + 2 * nb;
	w->digit = w->opener + nb;
	w->up = w->digit + n + nb; /* digit doubles as fill (n) before it holds digits (nb) */
	w->tet = w->up + n;
	for (size_t a = 0; a < n; a++)
		w->up[a] = w->tet[a] = -1;
	for (size_t i = 0; i < nb; i++)
		w->opener[i] = -1;
	return blk;
}

/* Roots in rank order: each fragment from its lowest-ranked atom, '.' between. */
static void put_fragments(sw *w)
{
	int *by_rank = malloc((w->n + 1) * sizeof *by_rank);
	if (!by_rank) {
		w->bad = 1;
		return;
	}
	for (size_t a = 0; a < w->n; a++)
		by_rank[w->rank[a]] = (int)a;
	for (size_t r = 0; r < w->n && !w->bad; r++) {
		int a = by_rank[r];
		if (w->seen[a])
			continue;
		walk(w, a);
		put(w, w->len ? "." : "");
		put_tree(w, a);
	}
	free(by_rank);
}

char *smiles_write(const obw_mol *m, const obw_atom *atoms, const int *rank, const int *scls)
{
	const obw_atom *own;
	sw w = {0};
	w.n = obw_mol_atoms(m, &own);
	size_t nb = obw_mol_bonds(m, &w.bd), nt = obw_mol_tetra(m, &w.tetra);
	w.at = atoms ? atoms : own;
	w.rank = rank;
	w.scls = scls;
	for (size_t a = 0; a < w.n; a++)
		if (w.at[a].element == 1 || rank[a] < 0 || (size_t)rank[a] >= w.n)
			return NULL;
	if (obw_mol_cistrans_count(m) || !w.n)
		return NULL;
	int *blk = sw_alloc(&w, nb);
	if (!blk)
		return NULL;
	for (size_t t = 0; t < nt; t++)
		w.tet[w.tetra[t].centre] = (int)t;
	build_graph(&w, nb);
	put_fragments(&w);
	free(blk);
	free(w.seen);
	if (w.bad) {
		free(w.buf);
		return NULL;
	}
	return w.buf;
}

char *smiles_canonical(int **rank, int **scls, obw_mol *m, obw_ctx *c, char *msg, size_t msgn)
{
	const obw_atom *at;
	size_t n = obw_mol_atoms(m, &at);
	int *r = malloc((n + 1) * sizeof *r), *s = malloc((n + 1) * sizeof *s);
	char *out = NULL;
	if (r && s && canon_rank(NULL, s, r, m, NULL) == 0)
		out = smiles_write(m, NULL, r, s);
	if (!out) {
		free(r);
		free(s);
		r = s = NULL;
		out = obw_mol_canonical(m, c, msg, msgn);
	}
	if (rank)
		*rank = r;
	else
		free(r);
	if (scls)
		*scls = s;
	else
		free(s);
	return out;
}
