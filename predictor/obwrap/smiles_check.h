/* SPDX-License-Identifier: MIT */
/* smiles_check.h: text checks on a SMILES that Open Babel's parser lets through (private). */
#ifndef PKAD_SMILES_CHECK_H
#define PKAD_SMILES_CHECK_H

#include <stddef.h>

#ifdef __cplusplus
extern "C" {
#endif

/** Checks the token grammar of s[0..n): balanced branches, no dangling bond, branch or dot,
 *  closed brackets, only SMILES characters outside brackets. Returns 0, or -2 with the
 *  problem and its 1-based position written into why. */
int obw_smiles_check(const char *s, size_t n, char *why, size_t whyn);

/** Number of atoms written in lower case (aromatic) in s[0..n), inside or outside brackets. */
int obw_smiles_aromatic_count(const char *s, size_t n);

#ifdef __cplusplus
}
#endif

#endif
