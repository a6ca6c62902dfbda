/* SPDX-License-Identifier: MIT */
/* json_deprotonation.h: the one place where a base-matching result becomes JSON. */
#ifndef PKAD_JSON_DEPROTONATION_H
#define PKAD_JSON_DEPROTONATION_H

#include <cjson/cJSON.h>

#include "predictor.h"

/** {"id", "input", "substrate", "base": {"name", "conjugate_acid", "pka", "scale",
 *  "predicted"}, "equivalents", "byproduct", "sites": [{"atom", "element", "group", "pka",
 *  "uncertainty", "delta_pka", "log_k", "fraction", "verdict"}], "warnings", "cautions"}.
 *  id and input may be NULL (keys left out). NULL only when out of memory; caller frees
 *  with cJSON_Delete. Thread-safe. */
cJSON *srv_deprotonation_json(const pred_deprotonation *d, const char *id, const char *input);

/** {"bases": [{"name", "aliases": [...], "conjugate_acid", "conjugate_acid_smiles", "pka",
 *  "scale", "pka_dmso", "organometallic", "byproduct", "hazards": [...], "source"}]}.
 *  NULL only when out of memory. Thread-safe. */
cJSON *srv_bases_json(const pred_model *m);

#endif
