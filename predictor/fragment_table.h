/* SPDX-License-Identifier: MIT */
/* fragment_table.h: reading the fragment tables (embedded or from a directory). */
#ifndef PKAD_FRAGMENT_TABLE_H
#define PKAD_FRAGMENT_TABLE_H

#include "model.h"

/* Text of fragments/<name> from dir (NULL: the embedded copy); *out is NULL when the table
 * is absent. Caller frees. Returns 0 or a PRED_E*. */
int frag_table_read(char **out, const char *dir, const char *name, pred_error *err);

/* Loads fragments/bases.tsv (reagent bases) into m->bases when present. */
int frag_load_bases(pred_model *m, const char *dir, pred_error *err);

/* Parses the text of bases.tsv into m->bases (base_table.c). */
int base_table_parse(pred_model *m, const char *text, const char *file, pred_error *err);

#endif
