/* SPDX-License-Identifier: MIT */
/* smarts_screen.h: a conservative SMARTS screen over the engine's own graph (three-valued:
 * a primitive it cannot decide exactly counts as "maybe"), so the toolkit's matcher runs only
 * on molecules where a pattern can match. Shared by smarts_screen_parse.c and smarts_screen.c. */
#ifndef PKAD_SMARTS_SCREEN_H
#define PKAD_SMARTS_SCREEN_H

#include <stddef.h>
#include <stdint.h>

#include "obwrap.h"

enum { SX_MAX_PATS = 64, SX_MAX_ATOMS = 256 }; /* larger patterns are not screened */

enum { SX_F = 0, SX_U = 1, SX_T = 2 }; /* false, unknown, true */

enum {
	SX_AND, SX_OR, SX_NOT, SX_PRIM
};

enum {
	/* atom primitives */
	SXP_TRUE, SXP_UNKNOWN, SXP_ELEM, SXP_AROM_ELEM, SXP_ALIPH_ELEM, SXP_AROMATIC,
	SXP_ALIPHATIC, SXP_HCOUNT, SXP_CONNECT, SXP_DEGREE, SXP_CHARGE, SXP_IN_RING,
	SXP_RING_COUNT, SXP_RING_SIZE, SXP_RECURSIVE,
	/* bond primitives */
	SXB_SINGLE, SXB_DOUBLE, SXB_TRIPLE, SXB_AROMATIC, SXB_ANY, SXB_RING, SXB_DEFAULT
};

typedef struct sx_node {
	int op;    /* SX_AND, SX_OR, SX_NOT (a), SX_PRIM (prim, value) */
	int prim;
	int value; /* element, count, charge, size, or the sub-pattern of SXP_RECURSIVE */
	int a, b;  /* operand nodes */
} sx_node;

typedef struct sx_patom {
	uint32_t kinds; /* atom kinds (sx_kind) the expression may accept */
	int expr;   /* atom expression node */
	int parent; /* earlier pattern atom bonded to this one, -1 for the first */
	int bond;   /* expression of that bond */
	int text_at, text_len; /* the atom's token in the screen's SMARTS text */
	int shared; /* slot of the expression's values in the molecule's shared values, -1 */
} sx_patom;

typedef struct sx_closure {
	int a, b, bond; /* ring-closure bond between pattern atoms a < b */
} sx_closure;

typedef struct sx_pat {
	int n_atoms, n_closures;
	sx_patom *atoms;
	sx_closure *closures;
	char *text;  /* a recursive part's SMARTS (inside "$(...)"), NULL for the pattern */
	int shared;  /* a recursive part's slot in the molecule's shared values, -1 none */
} sx_pat;

typedef struct smarts_screen {
	sx_node *nodes;
	int n_nodes;
	sx_pat *pats; /* pats[0] is the pattern, the rest its recursive parts */
	int n_pats;
	int *smarts_order;  /* atom k of pats[0] is atom smarts_order[k] of the SMARTS text */
	int *smarts_parent; /* per atom in SMARTS order: the atom its bond grows from, -1 first */
	char *smarts;       /* the text compiled */
	int map_base[SX_MAX_PATS]; /* where each pattern's atoms start in the search's map */
	int own_memo;       /* some recursive part keeps its values in the search (not shared) */
} smarts_screen;

/* The molecule as the screen sees it (borrowed arrays; built once per molecule). */
/* Kind of an atom for the fast pre-test: bit 2 * i + aromatic for element i of
 * sx_kind_elements, bit 31 for any other element. */
uint32_t sx_kind(int element, int aromatic);

typedef struct sx_mol {
	const obw_atom *atoms;
	const obw_bond *bonds;
	size_t nat;
	const int *adj_start, *adj, *adj_bond; /* CSR: neighbour and bond index */
	const int *ob_bonds; /* per atom (from adj_start), its bonds in Open Babel's order */
	const uint32_t *ring_sizes; /* bit k: the atom is in an SSSR ring of size k (k < 32) */
	const uint32_t *kind;       /* sx_kind of each atom */
	const int *kind_start;      /* atoms of kind bit k: kind_atoms[kind_start[k]..[k + 1]) */
	const int *kind_atoms;
	uint32_t kinds;             /* union of kind[] */
	int own_matches; /* the screen may list matches (no H atom in the graph, ob_bonds set) */
	unsigned char *scratch;     /* smarts_screen_scratch(nat) bytes, owned by the caller */
	unsigned char *shared;      /* NULL, or shared slots x nat values (0 = not yet known) of
				       the shared parts; a slot's row is cleared on first use */
	unsigned char *shared_ready; /* per shared slot: its row is cleared; the caller zeroes
					these (not the rows) per molecule */
} sx_mol;

/* Distinct recursive parts and atom tokens of a set of screens: each is valued once per
 * molecule and atom and the value shared by every screen that holds it. */
typedef struct sx_shared {
	char **texts;
	int n, cap;
	int *slots; /* open hash of the texts: index + 1, 0 empty; 2 * cap entries */
} sx_shared;

/* Gives the recursive parts and atoms of s their slots in reg (the same text, the same
 * slot).
 * Returns 0, or -1 when out of memory (s then keeps its own values). */
int smarts_screen_share(smarts_screen *s, sx_shared *reg);
void sx_shared_clear(sx_shared *reg);

/* Fills kind_start (33 ints) and kind_atoms (nat ints): the atoms of each kind bit in
 * index order, for sx_mol. */
void sx_kind_lists(int *kind_start, int *kind_atoms, const uint32_t *kind, size_t nat);

/* Bytes of scratch the screen needs for a molecule of nat atoms, and what must be zero in
 * it before the first search (the rest the screen clears as it goes). */
size_t smarts_screen_scratch(size_t nat);
void smarts_screen_scratch_init(unsigned char *scratch, size_t nat);

/* Compiles smarts; NULL when it uses anything the screen does not read (never screened). */
smarts_screen *smarts_screen_new(const char *smarts);
void smarts_screen_free(smarts_screen *s);

/* Zero only when the pattern surely has no match in the molecule; nonzero when it may.
 * A NULL screen always may, and so does any failure (out of memory). */
int smarts_screen_may_match(const smarts_screen *s, const sx_mol *m);

/* The pattern's matches when the screen decides every embedding exactly (no "maybe"
 * anywhere): the count, with *out holding n ints per match (n = atoms of the pattern, in
 * SMARTS order), in the order and uniqueness of obw_pattern_match (Open Babel's matcher
 * order: first atom by index, each further atom by its place among its parent's
 * neighbours; one match per first atom and atom set). -1 when undecided, unscreened or out
 * of memory: ask Open Babel. The caller frees *out (NULL when the count is 0 or -1).
 * taken: NULL, or per atom a value >= 0 for atoms the caller has no use for: the matches
 * that hold one are left out (the rest keep their order; uniqueness is by atom set).
 * first_taken: the same for the pattern's first SMARTS atom only. */
int smarts_screen_matches(int **out, const smarts_screen *s, const sx_mol *m, const int *taken,
			  const int *first_taken);

#endif
