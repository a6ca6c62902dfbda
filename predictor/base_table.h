/* SPDX-License-Identifier: MIT */
/* base_table.h: lookup in the reagent-base table (fragments/bases.tsv) of the model. */
#ifndef PKAD_BASE_TABLE_H
#define PKAD_BASE_TABLE_H

#include "model.h"

/* Index of the base whose name or one of whose aliases equals name, compared without
 * case and ignoring spaces, '-' and '_' ("NaH", "sodium-hydride"); -1 when none. */
int base_table_find(const pred_model *m, const char *name);

#endif
