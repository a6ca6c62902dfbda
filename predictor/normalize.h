/* SPDX-License-Identifier: MIT */
/* normalize.h: input clean-up before site perception: counter-ions, drawn charges (private). */
#ifndef PKAD_NORMALIZE_H
#define PKAD_NORMALIZE_H

#include <stddef.h>

#include "obwrap.h"
#include "predictor.h"

/* Human-readable warnings of the clean-up steps, in the order they were made. Fixed size:
 * a step that has more to say than fits ends the list with "... more changes". */
enum { NORM_WARN_MAX = 8, NORM_WARN_LEN = 256 };
typedef struct norm_report {
	size_t n;
	char warn[NORM_WARN_MAX][NORM_WARN_LEN];
} norm_report;

/** Clears the report. */
void norm_report_init(norm_report *rep);

/** Keeps the largest fragment (carbon-containing preferred, then most heavy atoms, then the
 *  first) and neutralises charges that are only another protonation state of a site:
 *  O-/S-/N- not bonded to a positive atom gain an H; N+/O+/S+/P+ carrying an H and not
 *  bonded to a negative atom lose one. Permanent charges (quaternary N+, nitro, N-oxide,
 *  sulfonium) stay. Kept atoms keep their orig_index; c writes the removed fragments'
 *  SMILES for the warning. Returns 0 or a PRED_E* code with err set. Thread-safe with one
 *  ctx per thread. */
int norm_molecule(obw_mol *m, obw_ctx *c, norm_report *rep, pred_error *err);

/** Appends a printf-style warning to rep (internal to normalize.c and tautomer.c). */
void norm_warn(norm_report *rep, const char *fmt, ...);

#endif
