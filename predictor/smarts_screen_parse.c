/* SPDX-License-Identifier: MIT */
/* smarts_screen_parse.c: compiles the SMARTS subset the screen reads (Daylight SMARTS
 * grammar: '!' binds tightest, then '&' and adjacency, then ',', then ';'); anything else
 * makes the pattern unscreened rather than guessed. */
#include <ctype.h>
#include <stdlib.h>
#include <string.h>

#include "smarts_screen.h"

typedef struct parser {
	smarts_screen *s;
	const char *p, *end;
	int bad;
	const char *base; /* start of the whole SMARTS */
} parser;

static int node(parser *ps, int op, int prim, int value, int a, int b)
{
	smarts_screen *s = ps->s;
	sx_node *grown = realloc(s->nodes, (size_t)(s->n_nodes + 1) * sizeof *grown);
	if (!grown) {
		ps->bad = 1;
		return 0;
	}
	s->nodes = grown;
	s->nodes[s->n_nodes] = (sx_node){op, prim, value, a, b};
	return s->n_nodes++;
}

static int prim(parser *ps, int kind, int value)
{
	return node(ps, SX_PRIM, kind, value, -1, -1);
}

static int number(parser *ps, int dflt)
{
	if (ps->p >= ps->end || !isdigit((unsigned char)*ps->p))
		return dflt;
	int v = 0;
	while (ps->p < ps->end && isdigit((unsigned char)*ps->p))
		v = 10 * v + (*ps->p++ - '0');
	return v;
}

static const struct {
	const char *sym;
	int z;
} two_letter[] = {{"Cl", 17}, {"Br", 35}, {"Si", 14}, {"Se", 34}, {"Na", 11},
		  {"Li", 3},  {"Mg", 12}, {"Al", 13}, {"As", 33}, {"Te", 52}};

/* Element symbol at ps->p; outside brackets only Cl and Br take two letters. */
static int element(parser *ps, int in_bracket)
{
	static const char one[] = "BCNOFPSIK", one_z[] = {5, 6, 7, 8, 9, 15, 16, 53, 19};
	const char *q = ps->p;
	if (q + 1 < ps->end && islower((unsigned char)q[1]))
		for (size_t i = 0; i < (in_bracket ? sizeof two_letter / sizeof two_letter[0] : 2);
		     i++)
			if (!strncmp(q, two_letter[i].sym, 2)) {
				ps->p += 2;
				return prim(ps, SXP_ALIPH_ELEM, two_letter[i].z);
			}
	if (in_bracket && q + 1 < ps->end && islower((unsigned char)q[1])) {
		ps->bad = 1; /* an element symbol this table does not know */
		return 0;
	}
	const char *c = strchr(one, *q);
	if (!*q || !c) {
		ps->bad = 1;
		return 0;
	}
	ps->p++;
	return prim(ps, SXP_ALIPH_ELEM, one_z[c - one]);
}

static int aromatic_element(parser *ps)
{
	static const char one[] = "cnospb";
	static const int one_z[] = {6, 7, 8, 16, 15, 5};
	if (ps->p + 1 < ps->end && !strncmp(ps->p, "se", 2)) {
		ps->p += 2;
		return prim(ps, SXP_AROM_ELEM, 34);
	}
	const char *c = strchr(one, *ps->p);
	ps->p++;
	return prim(ps, SXP_AROM_ELEM, one_z[c - one]);
}

static int parse_pattern(parser *ps, const char *start, const char *end);

/* "$(...)": the sub-pattern becomes a pattern of its own. */
static int recursive(parser *ps)
{
	const char *q = ps->p + 2;
	int depth = 1;
	for (; q < ps->end && depth; q++)
		depth += (*q == '(') - (*q == ')');
	if (depth) {
		ps->bad = 1;
		return 0;
	}
	int sub = parse_pattern(ps, ps->p + 2, q - 1);
	size_t len = (size_t)(q - 1 - (ps->p + 2));
	char *text = ps->bad ? NULL : malloc(len + 1);
	if (text) {
		memcpy(text, ps->p + 2, len);
		text[len] = '\0';
		ps->s->pats[sub].text = text;
	}
	ps->bad |= !text;
	ps->p = q;
	return prim(ps, SXP_RECURSIVE, sub);
}

static int charge(parser *ps)
{
	char sign = *ps->p++;
	int n = 1;
	if (ps->p < ps->end && isdigit((unsigned char)*ps->p))
		n = number(ps, 1);
	else
		while (ps->p < ps->end && *ps->p == sign) {
			n++;
			ps->p++;
		}
	return prim(ps, SXP_CHARGE, sign == '+' ? n : -n);
}

static int ring_prim(parser *ps, int size_form)
{
	ps->p++;
	int n = number(ps, -1);
	if (n < 0)
		return prim(ps, SXP_IN_RING, 1);
	if (n == 0)
		return prim(ps, SXP_IN_RING, 0);
	return prim(ps, size_form ? SXP_RING_SIZE : SXP_RING_COUNT, n);
}

static int atom_prim(parser *ps, int first, int in_bracket)
{
	char c = *ps->p;
	if (c == '$' && ps->p + 1 < ps->end && ps->p[1] == '(')
		return recursive(ps);
	if (c == '#') {
		ps->p++;
		return prim(ps, SXP_ELEM, number(ps, -1));
	}
	if (c == '*' || c == 'a' || c == 'A') {
		ps->p++;
		return prim(ps, c == '*' ? SXP_TRUE : c == 'a' ? SXP_AROMATIC : SXP_ALIPHATIC, 0);
	}
	if (c == 'H' && !first) {
		ps->p++;
		return prim(ps, SXP_HCOUNT, number(ps, 1));
	}
	if (c == 'X' || c == 'D') {
		ps->p++;
		return prim(ps, c == 'X' ? SXP_CONNECT : SXP_DEGREE, number(ps, 1));
	}
	if (c == 'R' || c == 'r')
		return ring_prim(ps, c == 'r');
	if (c == '+' || c == '-')
		return charge(ps);
	if (c == 'x' || c == 'v' || c == '^' || c == '@' || isdigit((unsigned char)c)) {
		/* ring connectivity, valence, hybridisation, chirality, isotope: not decided */
		ps->p++;
		while (ps->p < ps->end && (isdigit((unsigned char)*ps->p) || *ps->p == '@'))
			ps->p++;
		return prim(ps, SXP_UNKNOWN, 0);
	}
	if (strchr("cnospb", c) && c)
		return aromatic_element(ps);
	if (isupper((unsigned char)c) && c != 'H')
		return element(ps, in_bracket);
	ps->bad = 1;
	return 0;
}

static int atom_not(parser *ps, int first)
{
	if (ps->p < ps->end && *ps->p == '!') {
		ps->p++;
		return node(ps, SX_NOT, 0, 0, atom_not(ps, 0), -1);
	}
	return atom_prim(ps, first, 1);
}

static int atom_and_hi(parser *ps, int first)
{
	int a = atom_not(ps, first);
	while (!ps->bad && ps->p < ps->end && !strchr("],;", *ps->p)) {
		if (*ps->p == '&')
			ps->p++;
		a = node(ps, SX_AND, 0, 0, a, atom_not(ps, 0));
	}
	return a;
}

static int atom_or(parser *ps, int first)
{
	int a = atom_and_hi(ps, first);
	while (!ps->bad && ps->p < ps->end && *ps->p == ',') {
		ps->p++;
		a = node(ps, SX_OR, 0, 0, a, atom_and_hi(ps, 0));
	}
	return a;
}

/* Bracket atom at ps->p ('[' already passed) up to its ']'. */
static int bracket_atom(parser *ps)
{
	int a = atom_or(ps, 1);
	while (!ps->bad && ps->p < ps->end && *ps->p == ';') {
		ps->p++;
		a = node(ps, SX_AND, 0, 0, a, atom_or(ps, 0));
	}
	if (ps->p >= ps->end || *ps->p != ']')
		ps->bad = 1;
	else
		ps->p++;
	return a;
}

static int bond_prim(parser *ps)
{
	static const char sym[] = "-=#:~@";
	static const int kind[] = {SXB_SINGLE, SXB_DOUBLE, SXB_TRIPLE, SXB_AROMATIC, SXB_ANY,
				   SXB_RING};
	char c = *ps->p;
	if (c == '!') {
		ps->p++;
		return node(ps, SX_NOT, 0, 0, bond_prim(ps), -1);
	}
	const char *k = c ? strchr(sym, c) : NULL;
	ps->p++;
	if (!k) {
		ps->bad = 1; /* '/', '\\' and anything else */
		return 0;
	}
	return prim(ps, kind[k - sym], 0);
}

static int is_bond_char(char c)
{
	return c && strchr("-=#:~@!&,;", c);
}

/* Bond expression: '&' and adjacency, then ',', then ';'. */
static int bond_expr(parser *ps)
{
	int lo = -1;
	while (!ps->bad && ps->p < ps->end && is_bond_char(*ps->p)) {
		int or = -1;
		while (!ps->bad && ps->p < ps->end && is_bond_char(*ps->p) && *ps->p != ';') {
			int and = bond_prim(ps);
			while (!ps->bad && ps->p < ps->end && is_bond_char(*ps->p) &&
			       !strchr(",;", *ps->p)) {
				if (*ps->p == '&')
					ps->p++;
				and = node(ps, SX_AND, 0, 0, and, bond_prim(ps));
			}
			or = or < 0 ? and : node(ps, SX_OR, 0, 0, or, and);
			if (ps->p < ps->end && *ps->p == ',')
				ps->p++;
		}
		lo = lo < 0 ? or : node(ps, SX_AND, 0, 0, lo, or);
		if (ps->p < ps->end && *ps->p == ';')
			ps->p++;
	}
	return lo;
}

static int add_atom(parser *ps, sx_pat *pt, int expr, int parent, int bond, const char *tok)
{
	sx_patom *grown = realloc(pt->atoms, (size_t)(pt->n_atoms + 1) * sizeof *grown);
	if (!grown) {
		ps->bad = 1;
		return -1;
	}
	pt->atoms = grown;
	pt->atoms[pt->n_atoms] =
	    (sx_patom){0, expr, parent, bond, (int)(tok - ps->base), (int)(ps->p - tok), -1};
	return pt->n_atoms++;
}

static void add_closure(parser *ps, sx_pat *pt, int a, int b, int bond)
{
	sx_closure *grown = realloc(pt->closures, (size_t)(pt->n_closures + 1) * sizeof *grown);
	if (!grown) {
		ps->bad = 1;
		return;
	}
	pt->closures = grown;
	pt->closures[pt->n_closures++] = (sx_closure){a, b, bond};
}

static int new_pat(parser *ps)
{
	smarts_screen *s = ps->s;
	sx_pat *grown = realloc(s->pats, (size_t)(s->n_pats + 1) * sizeof *grown);
	if (!grown) {
		ps->bad = 1;
		return 0;
	}
	s->pats = grown;
	memset(&s->pats[s->n_pats], 0, sizeof s->pats[0]);
	s->pats[s->n_pats].shared = -1;
	return s->n_pats++;
}

enum { SX_MAX_BRANCH = 64, SX_MAX_RING = 100 };

typedef struct chain {
	int prev, bond, depth;
	int stack[SX_MAX_BRANCH];
	int ring_atom[SX_MAX_RING], ring_bond[SX_MAX_RING];
} chain;

static void ring_digit(parser *ps, int pi, chain *ch)
{
	int d;
	if (*ps->p == '%') {
		ps->p++;
		d = number(ps, -1);
	} else {
		d = *ps->p++ - '0';
	}
	if (d < 0 || d >= SX_MAX_RING || ch->prev < 0) {
		ps->bad = 1;
		return;
	}
	if (ch->ring_atom[d] < 0) {
		ch->ring_atom[d] = ch->prev;
		ch->ring_bond[d] = ch->bond;
	} else {
		int bond = ch->bond >= 0 ? ch->bond : ch->ring_bond[d];
		if (bond < 0)
			bond = prim(ps, SXB_DEFAULT, 0);
		add_closure(ps, &ps->s->pats[pi], ch->ring_atom[d], ch->prev, bond);
		ch->ring_atom[d] = -1;
	}
	ch->bond = -1;
}

/* tok: where the atom's token began (it ends at ps->p) */
static void chain_atom(parser *ps, int pi, chain *ch, int expr, const char *tok)
{
	int bond = ch->bond;
	if (ch->prev >= 0 && bond < 0)
		bond = prim(ps, SXB_DEFAULT, 0);
	if (ps->bad)
		return;
	ch->prev =
	    add_atom(ps, &ps->s->pats[pi], expr, ch->prev, ch->prev >= 0 ? bond : -1, tok);
	ch->bond = -1;
}

static void chain_step(parser *ps, int pi, chain *ch)
{
	char c = *ps->p;
	const char *tok = ps->p;
	if (c == '[') {
		ps->p++;
		chain_atom(ps, pi, ch, bracket_atom(ps), tok);
	} else if (c == '(') {
		if (ch->depth >= SX_MAX_BRANCH || ch->prev < 0)
			ps->bad = 1;
		else
			ch->stack[ch->depth++] = ch->prev;
		ps->p++;
	} else if (c == ')') {
		if (ch->depth <= 0)
			ps->bad = 1;
		else
			ch->prev = ch->stack[--ch->depth];
		ps->p++;
	} else if (isdigit((unsigned char)c) || c == '%') {
		ring_digit(ps, pi, ch);
	} else if (is_bond_char(c)) {
		ch->bond = bond_expr(ps);
	} else if (c == '*' || c == 'a' || c == 'A' || (c && strchr("cnospb", c)) ||
		   (isupper((unsigned char)c) && c != 'H')) {
		chain_atom(ps, pi, ch, atom_prim(ps, 0, 0), tok);
	} else {
		ps->bad = 1; /* '.', '/', '\\', ... */
	}
}

static int parse_pattern(parser *ps, const char *start, const char *end)
{
	const char *save_p = ps->p, *save_end = ps->end;
	int pi = new_pat(ps);
	chain ch;
	ch.prev = ch.bond = -1;
	ch.depth = 0;
	for (int i = 0; i < SX_MAX_RING; i++)
		ch.ring_atom[i] = -1;
	ps->p = start;
	ps->end = end;
	while (!ps->bad && ps->p < ps->end)
		chain_step(ps, pi, &ch);
	for (int i = 0; i < SX_MAX_RING; i++)
		ps->bad |= ch.ring_atom[i] >= 0;
	ps->bad |= ps->s->pats[pi].n_atoms == 0 || ch.depth != 0;
	ps->p = save_p;
	ps->end = save_end;
	return pi;
}

void smarts_screen_free(smarts_screen *s)
{
	if (!s)
		return;
	for (int i = 0; i < s->n_pats; i++) {
		free(s->pats[i].atoms);
		free(s->pats[i].closures);
		free(s->pats[i].text);
	}
	free(s->pats);
	free(s->nodes);
	free(s->smarts_order);
	free(s->smarts_parent);
	free(s->smarts);
	free(s);
}

static const int kind_elements[] = {1, 5, 6, 7, 8, 9, 14, 15, 16, 17, 34, 35, 53};
enum { N_KIND_ELEMENTS = sizeof kind_elements / sizeof kind_elements[0] };

/* The bit of an atom's kind (sx_kind sets one). */
static int kind_bit(uint32_t kind)
{
	int k = 0;
	while (k < 31 && !((kind >> k) & 1u))
		k++;
	return k;
}

void sx_kind_lists(int *kind_start, int *kind_atoms, const uint32_t *kind, size_t nat)
{
	memset(kind_start, 0, 33 * sizeof *kind_start);
	for (size_t a = 0; a < nat; a++)
		kind_start[kind_bit(kind[a]) + 1]++;
	for (int k = 0; k < 32; k++)
		kind_start[k + 1] += kind_start[k];
	int fill[32];
	memcpy(fill, kind_start, sizeof fill);
	for (size_t a = 0; a < nat; a++)
		kind_atoms[fill[kind_bit(kind[a])]++] = (int)a;
}

uint32_t sx_kind(int element, int aromatic)
{
	for (int i = 0; i < N_KIND_ELEMENTS; i++)
		if (kind_elements[i] == element)
			return (uint32_t)1 << (2 * i + (aromatic ? 1 : 0));
	return (uint32_t)1 << 31;
}

/* Value of an atom expression on an atom known only by element and aromaticity. */
static int kind_value(const smarts_screen *s, int k, int element, int aromatic)
{
	const sx_node *n = &s->nodes[k];
	int a, b;
	switch (n->op) {
	case SX_AND:
		a = kind_value(s, n->a, element, aromatic);
		b = kind_value(s, n->b, element, aromatic);
		return a < b ? a : b;
	case SX_OR:
		a = kind_value(s, n->a, element, aromatic);
		b = kind_value(s, n->b, element, aromatic);
		return a > b ? a : b;
	case SX_NOT: return SX_T - kind_value(s, n->a, element, aromatic);
	default: break;
	}
	switch (n->prim) {
	case SXP_TRUE: return SX_T;
	case SXP_ELEM: return element == n->value ? SX_T : SX_F;
	case SXP_AROM_ELEM: return element == n->value && aromatic ? SX_T : SX_F;
	case SXP_ALIPH_ELEM: return element == n->value && !aromatic ? SX_T : SX_F;
	case SXP_AROMATIC: return aromatic ? SX_T : SX_F;
	case SXP_ALIPHATIC: return aromatic ? SX_F : SX_T;
	default: return SX_U;
	}
}

static void atom_kinds(smarts_screen *s)
{
	for (int p = 0; p < s->n_pats; p++)
		for (int i = 0; i < s->pats[p].n_atoms; i++) {
			sx_patom *pa = &s->pats[p].atoms[i];
			pa->kinds = (uint32_t)1 << 31;
			for (int e = 0; e < N_KIND_ELEMENTS; e++)
				for (int ar = 0; ar < 2; ar++)
					if (kind_value(s, pa->expr, kind_elements[e], ar) != SX_F)
						pa->kinds |= sx_kind(kind_elements[e], ar);
		}
}

/* Cost of starting the search at a pattern atom: the kinds of atom it may take, a carbon
 * counting as many (most atoms of a molecule are carbons, and every one of them would be
 * tried as a start). */
static int root_cost(const sx_patom *pa)
{
	int bits = 0;
	for (uint32_t k = pa->kinds; k; k &= k - 1)
		bits++;
	return bits + (pa->kinds & (sx_kind(6, 0) | sx_kind(6, 1)) ? 16 : 0);
}

/* Renumbers the main pattern breadth-first from its cheapest start atom: tree bonds from
 * the walk, every other bond a ring closure. Whether a pattern may match does not depend on
 * the atom it is searched from; a recursive part keeps its first atom, which is the atom it
 * is about. Returns nonzero when out of memory (the pattern is then left as it was). */
static int reroot(sx_pat *pt, int *smarts_order)
{
	int n = pt->n_atoms, ne = n - 1 + pt->n_closures, best = 0, cnt = 1, nc = 0;
	for (int i = 0; i < n; i++)
		smarts_order[i] = i;
	for (int i = 1; i < n; i++)
		best = root_cost(&pt->atoms[i]) < root_cost(&pt->atoms[best]) ? i : best;
	if (best == 0)
		return 0;
	int *ea = malloc((size_t)(3 * ne + 3 * n + 1) * sizeof *ea);
	sx_patom *atoms = malloc((size_t)n * sizeof *atoms);
	sx_closure *cl = malloc((size_t)(ne + 1) * sizeof *cl);
	if (!ea || !atoms || !cl) {
		free(ea);
		free(atoms);
		free(cl);
		return 1;
	}
	int *eb = ea + ne, *tree = eb + ne, *pos = tree + ne, *order = pos + n, *from = order + n;
	for (int i = 1; i < n; i++)
		ea[i - 1] = i, eb[i - 1] = pt->atoms[i].parent;
	for (int c = 0; c < pt->n_closures; c++)
		ea[n - 1 + c] = pt->closures[c].a, eb[n - 1 + c] = pt->closures[c].b;
	for (int i = 0; i < n; i++)
		pos[i] = -1;
	memset(tree, 0, (size_t)ne * sizeof *tree);
	pos[best] = 0;
	order[0] = best;
	for (int head = 0; head < cnt; head++)
		for (int e = 0; e < ne; e++) {
			int u = order[head], v = ea[e] == u ? eb[e] : eb[e] == u ? ea[e] : -1;
			if (v < 0 || tree[e] || pos[v] >= 0)
				continue;
			tree[e] = 1;
			pos[v] = cnt;
			order[cnt++] = v;
			from[v] = e;
		}
	for (int k = 0; k < n && cnt == n; k++) {
		int old = order[k], e = k ? from[old] : -1;
		int bond = e < 0 ? -1 : e < n - 1 ? pt->atoms[ea[e]].bond : pt->closures[e - n + 1].bond;
		atoms[k] = pt->atoms[old];
		atoms[k].parent = e < 0 ? -1 : pos[ea[e] == old ? eb[e] : ea[e]];
		atoms[k].bond = bond;
	}
	for (int e = 0; e < ne && cnt == n; e++) {
		int a = pos[ea[e]], b = pos[eb[e]];
		int bond = e < n - 1 ? pt->atoms[ea[e]].bond : pt->closures[e - n + 1].bond;
		if (!tree[e])
			cl[nc++] = (sx_closure){a < b ? a : b, a < b ? b : a, bond};
	}
	if (cnt == n) {
		memcpy(smarts_order, order, (size_t)n * sizeof *order);
		free(pt->atoms);
		free(pt->closures);
		pt->atoms = atoms;
		pt->closures = cl;
		pt->n_closures = nc;
		atoms = NULL;
		cl = NULL;
	}
	free(ea);
	free(atoms);
	free(cl);
	return 0;
}

/* Reroots the main pattern, keeping its SMARTS atom order and parents (the order Open
 * Babel lists matches in). Nonzero when out of memory. */
static int reroot_main(smarts_screen *s)
{
	int n = s->pats[0].n_atoms;
	s->smarts_order = malloc((size_t)n * sizeof *s->smarts_order);
	s->smarts_parent = malloc((size_t)n * sizeof *s->smarts_parent);
	if (!s->smarts_order || !s->smarts_parent)
		return 1;
	for (int i = 0; i < n; i++)
		s->smarts_parent[i] = s->pats[0].atoms[i].parent;
	return reroot(&s->pats[0], s->smarts_order);
}

smarts_screen *smarts_screen_new(const char *smarts)
{
	smarts_screen *s = calloc(1, sizeof *s);
	if (!s || !smarts)
		return s ? (free(s), NULL) : NULL;
	size_t len = strlen(smarts);
	parser ps = {s, smarts, smarts + len, 0, smarts};
	if ((s->smarts = malloc(len + 1)))
		memcpy(s->smarts, smarts, len + 1);
	ps.bad = !s->smarts;
	if (!ps.bad)
		parse_pattern(&ps, ps.p, ps.end);
	if (!ps.bad) {
		atom_kinds(s);
		ps.bad = reroot_main(s);
	}
	int atoms = 0;
	for (int p = 0; p < s->n_pats && p < SX_MAX_PATS; p++) {
		s->map_base[p] = atoms;
		atoms += s->pats[p].n_atoms;
	}
	s->own_memo = s->n_pats > 1;
	if (ps.bad || s->n_pats > SX_MAX_PATS || atoms > SX_MAX_ATOMS) {
		smarts_screen_free(s);
		return NULL;
	}
	return s;
}
