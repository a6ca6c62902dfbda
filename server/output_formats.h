/* SPDX-License-Identifier: MIT */
/* output_formats.h: one prediction (or its error) as a JSON line, CSV rows or an SD record. */
#ifndef PKAD_OUTPUT_FORMATS_H
#define PKAD_OUTPUT_FORMATS_H

#include "predictor.h"
#include "record_reader.h"

typedef enum srv_output_format {
	SRV_OUT_JSONL = 0,
	SRV_OUT_CSV = 1,
	SRV_OUT_SDF = 2
} srv_output_format;

/** Parses "jsonl" (also "json"), "csv" or "sdf" (also "sd"). Returns 0 or PRED_EINVAL. */
int srv_output_format_parse(srv_output_format *out, const char *s);

/** Text written once before the first record: the CSV header row, else "". Static. */
const char *srv_output_header(srv_output_format f);

/** Renders one record: its result r, or (r NULL) the error e. JSON lines: one line; CSV:
 *  one row per site, one row with empty site columns for a molecule without sites, one row
 *  with the error columns for a failed record; SD: the input mol block (an empty one for
 *  SMILES input) with PKA_* data fields and "$$$$". ph names the charge field. Returns a
 *  malloc'd string ending in a newline (free with free()), NULL when out of memory.
 *  Thread-safe. */
char *srv_output_render(srv_output_format f, const srv_record *rec, const pred_result *r,
			const pred_error *e, double ph);

#endif
