/* SPDX-License-Identifier: MIT */
/* obwrap.h: the plain C face of the Open Babel wrapper; the only door to the toolkit. */
#ifndef PKAD_OBWRAP_H
#define PKAD_OBWRAP_H

#include <stddef.h>

#ifdef __cplusplus
extern "C" {
#endif

/* Every function that can fail returns 0 or a negative code (the PRED_E* values of
 * predictor.h: -1 inval, -2 parse, -4 nomem, -5 internal, -8 unsupported) and writes a
 * one-line message into msg (size msgn; msg may be NULL). No exception crosses this header. */

typedef struct obw_ctx obw_ctx;         /* per-thread converter state */
typedef struct obw_mol obw_mol;         /* one molecule, hydrogens implicit */
typedef struct obw_pattern obw_pattern; /* a parsed SMARTS pattern, read-only, shareable */

/** Once, in the main thread, before any other thread: silence the global error log, look up
 *  the formats, run one full parse/match/write so lazy global tables initialise, set the
 *  "C" numeric locale. Idempotent. */
int obw_global_init(char *msg, size_t msgn);

obw_ctx *obw_ctx_new(void);
void obw_ctx_free(obw_ctx *c);

enum { OBW_SMILES = 0, OBW_MOLBLOCK = 1 };

/** Parse one SMILES (text up to the first whitespace) or one mol block. Explicit ordinary
 *  hydrogens are folded into their heavy atom; every remaining atom keeps the index it had
 *  in the input (obw_atom.orig_index). Aromaticity and rings are perceived here.
 *  Thread-safe with one ctx per thread; mol-block reads take an internal lock because Open
 *  Babel's MDL reader switches the global locale. */
int obw_mol_parse(obw_mol **out, obw_ctx *c, const char *text, int format, char *msg,
		  size_t msgn);
void obw_mol_free(obw_mol *m);
/** Deep copy (for building species). */
int obw_mol_clone(obw_mol **out, const obw_mol *m);

typedef struct obw_atom {
	int element;    /* atomic number */
	int charge;     /* formal charge */
	int hcount;     /* total attached hydrogens (implicit + folded explicit) */
	int isotope;    /* 0 when unspecified */
	int aromatic;   /* 0/1 */
	int in_ring;    /* 0/1 */
	int ring_size;  /* smallest ring containing the atom, 0 if none */
	int degree;     /* heavy-atom neighbours */
	int valence;    /* sum of bond orders to heavy atoms (aromatic counted as 1.5 rounded
			   the way Open Babel's kekulé form gives) */
	int hyb;        /* 1 sp, 2 sp2, 3 sp3, 0 unknown; from the bonds (amide N reads 3) */
	int radical;    /* spin multiplicity, 0 none */
	int orig_index; /* 0-based index in the input's atom order */
} obw_atom;

typedef struct obw_bond {
	int a, b;     /* atom indices (obw_mol order) */
	int order;    /* kekulé order 1, 2 or 3 */
	int aromatic; /* 0/1 */
	int in_ring;  /* 0/1 */
} obw_bond;

/** Borrowed arrays, valid until the molecule is changed or freed. Return the count. */
size_t obw_mol_atoms(const obw_mol *m, const obw_atom **out);
size_t obw_mol_bonds(const obw_mol *m, const obw_bond **out);
/** Each atom's bonds (indices into obw_mol_bonds) in Open Babel's own neighbour order (the
 *  order its SMARTS matcher walks), atom after atom; borrowed like obw_mol_atoms. Returns
 *  the count, twice the bonds. */
size_t obw_mol_atom_bonds(const obw_mol *m, const int **out);

/** Smallest set of smallest rings: *n_rings rings; ring k has sizes[k] atoms listed in
 *  ring order in atoms[offsets[k] .. offsets[k]+sizes[k]). Borrowed, like obw_mol_atoms. */
typedef struct obw_rings {
	size_t n_rings;
	const int *sizes;
	const int *offsets;
	const int *atoms;
} obw_rings;
void obw_mol_rings(const obw_mol *m, obw_rings *out);

/** A tetrahedral stereo centre as drawn: looking from nbr[0], nbr[1..3] run clockwise;
 *  -1 stands for the centre's implicit hydrogen. */
typedef struct obw_tetra {
	int centre;
	int nbr[4];
} obw_tetra;
/** Specified tetrahedral centres; borrowed like obw_mol_atoms. Returns the count. */
size_t obw_mol_tetra(const obw_mol *m, const obw_tetra **out);
/** Number of double bonds with a specified cis/trans configuration. */
size_t obw_mol_cistrans_count(const obw_mol *m);
/** 1 when atom a (a neighbour of b) and atom d (a neighbour of c) lie cis about the double
 *  bond b=c, as the input specified it (Open Babel's cis/trans stereo: '/' '\\' marks, or
 *  coordinates of a mol block); 0 when they are trans, when the configuration is unknown
 *  (an unmarked bond, also a ring double bond drawn without marks: cis by the ring, but the
 *  input does not say so), when b=c is no double bond, or a or d is not bonded to it. Unknown is read as not cis: a caller must
 *  never assume a geometry that the input did not give. Reads the molecule only. */
int obw_mol_bond_cis(const obw_mol *m, int a, int b, int c, int d);
/** Element symbol of atomic number z ("C", "Cl"; "" when unknown). Static storage. */
const char *obw_element_symbol(int z);

/** Symmetry class of each atom (equal numbers = topologically equivalent), n = atom count.
 *  Writes into caller's array cls[n]. */
int obw_mol_symmetry(obw_mol *m, int *cls, size_t n, char *msg, size_t msgn);

/** Canonical SMILES (no stereo loss), malloc'd; NULL on failure with msg set. */
char *obw_mol_canonical(obw_mol *m, obw_ctx *c, char *msg, size_t msgn);

/** SMILES of m with atom[k] changed by dq[k] in both formal charge and hydrogen count
 *  (k < n), canonical or in input order; m itself is left as it was. For microspecies:
 *  no copy, no re-perception. malloc'd; NULL on failure with msg set. */
char *obw_mol_smiles_edited(obw_mol *m, obw_ctx *c, const int *atom, const int *dq, size_t n,
			    int canonical, char *msg, size_t msgn);

/* ---- editing (normalisation, microspecies) --------------------------------------------- */

/** Connected components: writes comp[i] for each atom, returns the component count. */
size_t obw_mol_components(const obw_mol *m, int *comp, size_t n);
/** Keep only the atoms whose keep[i] is nonzero (indices change; orig_index kept). */
int obw_mol_keep_atoms(obw_mol *m, const unsigned char *keep, size_t n, char *msg,
		       size_t msgn);
/** Set formal charge and total hydrogen count of one atom. */
int obw_mol_set_atom(obw_mol *m, int atom, int charge, int hcount);
/** Set the kekulé order of the bond between atoms a and b. */
int obw_mol_set_bond_order(obw_mol *m, int a, int b, int order);
/** Re-perceive aromaticity, rings and the cached arrays after edits. */
int obw_mol_refresh(obw_mol *m, char *msg, size_t msgn);

/* ---- SMARTS ---------------------------------------------------------------------------- */

/** Parse a SMARTS pattern; NULL with msg set when invalid. A pattern belongs to one thread
 *  (the predictor compiles one pattern set per worker). */
obw_pattern *obw_pattern_parse(const char *smarts, char *msg, size_t msgn);
void obw_pattern_free(obw_pattern *p);
/** Number of atoms in the pattern. */
int obw_pattern_atom_count(const obw_pattern *p);
/** Unique matches (atom sets counted once) of p in m: returns the number of matches and sets
 *  *out to a malloc'd array of n_matches * obw_pattern_atom_count(p) atom indices, in
 *  pattern atom order (caller frees with free()). Returns a negative code on failure. */
int obw_pattern_match(int **out, const obw_pattern *p, obw_mol *m);

#ifdef __cplusplus
}
#endif

#endif
