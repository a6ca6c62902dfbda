/* SPDX-License-Identifier: MIT */
/* tautomer.h: brings drawn lactims, iminols and simple enols to the water-dominant tautomer. */
#ifndef PKAD_TAUTOMER_H
#define PKAD_TAUTOMER_H

#include "normalize.h"

/** Moves H and bond orders only (no atom added or removed, so atom indices and orig_index
 *  stay): hydroxy-azines (2-/4-hydroxypyridine type, hydroxypyrimidines, 2-/4-quinolinols)
 *  and iminols HO-C=N become lactams and amides (the same for SH: thiones); simple enols
 *  HO-C=C become the keto form unless the C=C is conjugated with a non-aromatic pi bond
 *  (1,3-dicarbonyl enols, hydroxyquinones, reductones such as ascorbic acid) or aromatic
 *  (phenols). Where several shifts compete for one ring system the choice depends on the
 *  molecule alone, not on its atom order or Kekule form (tautomer.c, shift_key). Each change
 *  is reported as "input tautomer changed: ...". Returns 0 or a
 *  PRED_E* code with err set. */
int taut_standardise(obw_mol *m, norm_report *rep, pred_error *err);

#endif
