/* SPDX-License-Identifier: MIT */
/* canon_rank.h: canonical atom ranks and symmetry classes by refinement of atom invariants. */
#ifndef PKAD_CANON_RANK_H
#define PKAD_CANON_RANK_H

#include <stddef.h>

#include "obwrap.h"

/* Symmetry classes (cls: equal numbers for atoms the refinement cannot tell apart, stereo
 * aside), the same refined by tetrahedral parity (scls) and canonical ranks (rank:
 * distinct, 0 .. atoms-1) of the atoms of m. atoms replaces m's atom array when not NULL (a
 * microspecies: the same graph, other charges and hydrogen counts). Any output may be
 * NULL. Returns 0 or PRED_ENOMEM. Thread-safe (m is only read). */
int canon_rank(int *cls, int *scls, int *rank, const obw_mol *m, const obw_atom *atoms);

#endif
