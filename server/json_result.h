/* SPDX-License-Identifier: MIT */
/* json_result.h: the one place where a prediction or an error becomes JSON (CLI and daemon). */
#ifndef PKAD_JSON_RESULT_H
#define PKAD_JSON_RESULT_H

#include <cjson/cJSON.h>
#include <math.h>

#include "predictor.h"
#include "strbuf.h"

/** x scaled by 10^decimals and rounded to an integer, after a first rounding to 10^-6 of a
 *  last-place unit: a value summed from its terms in another order (another atom order of
 *  the same molecule) differs in its last bits, and where it lies on a half-unit boundary
 *  (0.035) a plain round() would print 0.03 for one order and 0.04 for the other. */
static inline double srv_round_scaled(double x, double scale)
{
	return round(round(x * scale * 1e6) / 1e6);
}

/** The result object of one molecule as one line of JSON text (no newline): {"id",
 *  "input", "smiles", "sites", "macro_pka", "at_ph", ["isoelectric_point"], ["curves"],
 *  "warnings", "notes"}. id and input may be NULL (then the key is left out); every string
 *  is made valid UTF-8. pKa values are rounded to 2 decimals, fractions to 4; a non-finite
 *  number becomes null with a warning. Written directly, in cJSON's unformatted layout.
 *  Returns NULL only when out of memory. Caller frees with free(). Thread-safe. */
char *srv_result_text(const pred_result *r, const char *id, const char *input);

/** The error object {"id", "input", "error": {"code", "message"}}; code is
 *  pred_status_name(e->code). With id and input NULL this is the daemon's error body.
 *  Returns NULL only when out of memory. Caller frees with cJSON_Delete. Thread-safe. */
cJSON *srv_error_json(const char *id, const char *input, const pred_error *e);

/** Serialises obj on one line (no newline) and deletes obj. Returns a string to free with
 *  cJSON_free, or NULL when out of memory (obj is deleted either way; NULL obj gives NULL). */
char *srv_json_line(cJSON *obj);

/** Adds name: x rounded to `decimals` places; a non-finite x is added as null and, when
 *  warnings is not NULL, a warning naming `name` is appended to it. Returns the item. */
cJSON *srv_json_add_number(cJSON *obj, const char *name, double x, int decimals,
			   cJSON *warnings);

/** A copy of s (length n) that is valid UTF-8: each invalid byte becomes U+FFFD and a NUL
 *  byte becomes U+2400. malloc'd; NULL when out of memory. */
char *srv_utf8_clean(const char *s, size_t n);

#endif
