/* SPDX-License-Identifier: MIT */
/* json_result.c: encodes pred_result and pred_error as the JSON shared by CLI and daemon. */
#include "json_result.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* Decimal places of each kind of number (DESIGN.md: pKa 2, fractions 4). */
enum { DP_PKA = 2, DP_FRACTION = 4, DP_CHARGE = 3, DP_PH = 2 };

static double round_to(double x, int decimals)
{
	double scale = pow(10.0, decimals);
	double r = round(x * scale) / scale;
	/* -0 would print as "-0", which reads oddly in a charge column. */
	return r == 0.0 ? 0.0 : r;
}

/* A finite number written once with the given decimals, trailing zeros dropped: cJSON's
 * own printing (%1.15g, then a read-back check) is a sizeable share of a prediction. */
static cJSON *fixed_number(double x, int decimals)
{
	char buf[64];
	int n = snprintf(buf, sizeof buf, "%.*f", decimals, round_to(x, decimals));
	if (n <= 0 || (size_t)n >= sizeof buf)
		return cJSON_CreateNumber(x);
	if (strchr(buf, '.')) {
		while (n > 0 && buf[n - 1] == '0')
			buf[--n] = '\0';
		if (n > 0 && buf[n - 1] == '.')
			buf[--n] = '\0';
	}
	if (!strcmp(buf, "-0"))
		strcpy(buf, "0");
	return cJSON_CreateRaw(buf);
}

cJSON *srv_json_add_number(cJSON *obj, const char *name, double x, int decimals,
			   cJSON *warnings)
{
	if (isfinite(x)) {
		cJSON *v = fixed_number(x, decimals);
		if (v && cJSON_AddItemToObject(obj, name, v))
			return v;
		cJSON_Delete(v);
		return NULL;
	}
	if (warnings) {
		char msg[160];
		snprintf(msg, sizeof msg, "non-finite value of '%s' encoded as null", name);
		cJSON_AddItemToArray(warnings, cJSON_CreateString(msg));
	}
	return cJSON_AddNullToObject(obj, name);
}

/* Number for an array element (arrays have no key to name in a warning). */
static cJSON *array_number(double x, int decimals, int *bad)
{
	if (isfinite(x))
		return fixed_number(x, decimals);
	*bad = 1;
	return cJSON_CreateNull();
}

/* Length of the valid UTF-8 sequence at s (at most n bytes), or 0 when invalid. */
static size_t utf8_seq_len(const unsigned char *s, size_t n)
{
	size_t len;
	unsigned cp;
	if (s[0] < 0x80)
		return 1;
	if (s[0] >= 0xc2 && s[0] <= 0xdf)
		len = 2, cp = s[0] & 0x1f;
	else if (s[0] >= 0xe0 && s[0] <= 0xef)
		len = 3, cp = s[0] & 0x0f;
	else if (s[0] >= 0xf0 && s[0] <= 0xf4)
		len = 4, cp = s[0] & 0x07;
	else
		return 0;
	if (len > n)
		return 0;
	for (size_t i = 1; i < len; i++) {
		if ((s[i] & 0xc0) != 0x80)
			return 0;
		cp = (cp << 6) | (s[i] & 0x3f);
	}
	/* Overlong forms, surrogates and values past U+10FFFF are not valid UTF-8. */
	if ((len == 3 && cp < 0x800) || (len == 4 && cp < 0x10000) || cp > 0x10ffff ||
	    (cp >= 0xd800 && cp <= 0xdfff))
		return 0;
	return len;
}

char *srv_utf8_clean(const char *s, size_t n)
{
	/* Worst case: every byte becomes a three-byte replacement character. */
	char *out = malloc(3 * n + 1);
	const unsigned char *u = (const unsigned char *)s;
	size_t o = 0;
	if (!out)
		return NULL;
	for (size_t i = 0; i < n;) {
		size_t len = u[i] ? utf8_seq_len(u + i, n - i) : 0;
		if (len) {
			memcpy(out + o, u + i, len);
			o += len, i += len;
			continue;
		}
		/* U+2400 (symbol for NUL) for a NUL byte, U+FFFD for any other bad byte */
		memcpy(out + o, u[i] ? "\xef\xbf\xbd" : "\xe2\x90\x80", 3);
		o += 3, i++;
	}
	out[o] = '\0';
	return out;
}

static void add_clean_string(cJSON *obj, const char *name, const char *s)
{
	char *clean;
	if (!s)
		return;
	clean = srv_utf8_clean(s, strlen(s));
	if (clean)
		cJSON_AddStringToObject(obj, name, clean);
	free(clean);
}

static cJSON *terms_json(const pred_site *s, cJSON *warnings)
{
	cJSON *arr = cJSON_CreateArray();
	for (size_t i = 0; arr && i < s->n_terms; i++) {
		const pred_term *t = &s->terms[i];
		cJSON *o = cJSON_CreateObject();
		cJSON_AddItemToArray(arr, o);
		add_clean_string(o, "term", t->term ? t->term : "");
		add_clean_string(o, "detail", t->detail ? t->detail : "");
		srv_json_add_number(o, "value", t->value, DP_PKA, warnings);
	}
	return arr;
}

static cJSON *site_json(const pred_site *s, cJSON *warnings)
{
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddNumberToObject(o, "atom", s->atom);
	add_clean_string(o, "element", s->element ? s->element : "");
	add_clean_string(o, "group", s->group ? s->group : "");
	cJSON_AddStringToObject(o, "kind", s->kind == PRED_BASE ? "base" : "acid");
	srv_json_add_number(o, "pka", s->pka, DP_PKA, warnings);
	srv_json_add_number(o, "uncertainty", s->uncertainty, DP_PKA, warnings);
	add_clean_string(o, "confidence", s->confidence ? s->confidence : "low");
	cJSON_AddItemToObject(o, "terms", terms_json(s, warnings));
	return o;
}

static cJSON *sites_json(const pred_result *r, cJSON *warnings)
{
	cJSON *arr = cJSON_CreateArray();
	size_t n = pred_result_site_count(r);
	for (size_t i = 0; arr && i < n; i++)
		cJSON_AddItemToArray(arr, site_json(pred_result_site(r, i), warnings));
	return arr;
}

static cJSON *macro_json(const pred_result *r, cJSON *warnings)
{
	cJSON *arr = cJSON_CreateArray();
	size_t n = pred_result_macro_count(r);
	int bad = 0;
	for (size_t i = 0; arr && i < n; i++)
		cJSON_AddItemToArray(arr, array_number(pred_result_macro_pka(r, i), DP_PKA, &bad));
	if (bad)
		cJSON_AddItemToArray(warnings,
				     cJSON_CreateString("non-finite macro_pka encoded as null"));
	return arr;
}

static cJSON *at_ph_json(const pred_result *r, cJSON *warnings)
{
	cJSON *o = cJSON_CreateObject();
	cJSON *species = cJSON_CreateArray();
	size_t n = pred_result_species_count(r);
	srv_json_add_number(o, "ph", pred_result_ph(r), DP_PH, warnings);
	srv_json_add_number(o, "charge", pred_result_charge(r), DP_CHARGE, warnings);
	if (pred_result_ionization_is_approximate(r))
		cJSON_AddTrueToObject(o, "approximate");
	for (size_t i = 0; species && i < n; i++) {
		const pred_species *sp = pred_result_species(r, i);
		cJSON *s = cJSON_CreateObject();
		cJSON_AddItemToArray(species, s);
		add_clean_string(s, "smiles", sp->smiles ? sp->smiles : "");
		srv_json_add_number(s, "fraction", sp->fraction, DP_FRACTION, warnings);
		cJSON_AddNumberToObject(s, "charge", sp->charge);
	}
	cJSON_AddItemToObject(o, "species", species);
	return o;
}

/* A JSON array of n doubles rounded to `decimals` places. */
static cJSON *number_array(const double *x, size_t n, int decimals, int *bad)
{
	cJSON *arr = cJSON_CreateArray();
	for (size_t i = 0; arr && i < n; i++)
		cJSON_AddItemToArray(arr, array_number(x[i], decimals, bad));
	return arr;
}

static cJSON *curves_json(const pred_curves *c, cJSON *warnings)
{
	cJSON *o = cJSON_CreateObject();
	cJSON *series = cJSON_CreateArray();
	int bad = 0;
	cJSON_AddItemToObject(o, "ph", number_array(c->ph, c->n_points, DP_PH, &bad));
	cJSON_AddItemToObject(o, "charge", number_array(c->charge, c->n_points, DP_CHARGE, &bad));
	for (size_t s = 0; series && s < c->n_series; s++) {
		cJSON *f = cJSON_CreateObject();
		cJSON_AddItemToArray(series, f);
		cJSON_AddNumberToObject(f, "charge", c->series_charge[s]);
		cJSON_AddItemToObject(f, "fraction",
				      number_array(c->fraction + s * c->n_points, c->n_points,
						   DP_FRACTION, &bad));
	}
	cJSON_AddItemToObject(o, "fractions", series);
	if (bad)
		cJSON_AddItemToArray(warnings,
				     cJSON_CreateString("non-finite curve value encoded as null"));
	return o;
}

/* Copies the result's warnings or notes into a JSON array of strings. */
static cJSON *strings_json(const pred_result *r, size_t (*count)(const pred_result *),
			   const char *(*get)(const pred_result *, size_t))
{
	cJSON *arr = cJSON_CreateArray();
	size_t n = count(r);
	for (size_t i = 0; arr && i < n; i++) {
		const char *s = get(r, i);
		char *clean = srv_utf8_clean(s ? s : "", s ? strlen(s) : 0);
		cJSON_AddItemToArray(arr, cJSON_CreateString(clean ? clean : ""));
		free(clean);
	}
	return arr;
}

/* The encoder's own warnings (non-finite numbers) join the result's; the array is attached
 * last so that "warnings" and "notes" close the object. */
cJSON *srv_result_json(const pred_result *r, const char *id, const char *input)
{
	cJSON *o = cJSON_CreateObject();
	cJSON *warnings = strings_json(r, pred_result_warning_count, pred_result_warning);
	const pred_curves *curves = pred_result_curves(r);
	double pi;
	if (!o || !warnings) {
		cJSON_Delete(o);
		cJSON_Delete(warnings);
		return NULL;
	}
	add_clean_string(o, "id", id);
	add_clean_string(o, "input", input);
	add_clean_string(o, "smiles", pred_result_smiles(r) ? pred_result_smiles(r) : "");
	cJSON_AddItemToObject(o, "sites", sites_json(r, warnings));
	cJSON_AddItemToObject(o, "macro_pka", macro_json(r, warnings));
	cJSON_AddItemToObject(o, "at_ph", at_ph_json(r, warnings));
	if (pred_result_isoelectric(r, &pi) == 0)
		srv_json_add_number(o, "isoelectric_point", pi, DP_PKA, warnings);
	if (curves)
		cJSON_AddItemToObject(o, "curves", curves_json(curves, warnings));
	cJSON_AddItemToObject(o, "warnings", warnings);
	cJSON_AddItemToObject(o, "notes", strings_json(r, pred_result_note_count, pred_result_note));
	return o;
}

cJSON *srv_error_json(const char *id, const char *input, const pred_error *e)
{
	cJSON *o = cJSON_CreateObject();
	cJSON *err = cJSON_CreateObject();
	int code = e ? e->code : PRED_EINTERNAL;
	const char *msg = e && e->msg[0] ? e->msg : pred_status_name(code);
	if (!o || !err) {
		cJSON_Delete(o);
		cJSON_Delete(err);
		return NULL;
	}
	add_clean_string(o, "id", id);
	add_clean_string(o, "input", input);
	cJSON_AddStringToObject(err, "code", pred_status_name(code));
	add_clean_string(err, "message", msg);
	cJSON_AddItemToObject(o, "error", err);
	return o;
}

char *srv_json_line(cJSON *obj)
{
	char *s;
	if (!obj)
		return NULL;
	s = cJSON_PrintUnformatted(obj);
	cJSON_Delete(obj);
	return s;
}
