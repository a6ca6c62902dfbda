/* SPDX-License-Identifier: MIT */
/* smiles_write.h: SMILES text of a molecule written in canonical rank order. */
#ifndef PKAD_SMILES_WRITE_H
#define PKAD_SMILES_WRITE_H

#include <stddef.h>

#include "obwrap.h"

/* SMILES of m in the order of rank (each fragment from its lowest-ranked atom, branches and
 * ring closures in rank order), charges and hydrogen counts from atoms (m's own when NULL);
 * a tetrahedral mark is written where scls (canon_rank's classes with stereo) tells the
 * centre's four neighbours apart. malloc'd; NULL when out of memory or when m holds what
 * this writer leaves to Open Babel's (hydrogen atoms, cis/trans marks). Thread-safe. */
char *smiles_write(const obw_mol *m, const obw_atom *atoms, const int *rank, const int *scls);

/* Canonical SMILES of m: canon_rank's order through smiles_write, or Open Babel's canonical
 * SMILES where smiles_write declines. *rank and *scls (may be NULL) receive the ranks and
 * stereo classes used (malloc'd, caller frees), NULL when Open Babel wrote the string.
 * malloc'd; NULL on failure with msg set. */
char *smiles_canonical(int **rank, int **scls, obw_mol *m, obw_ctx *c, char *msg, size_t msgn);

#endif
