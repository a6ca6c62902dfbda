/* SPDX-License-Identifier: MIT */
/* json_result.c: encodes pred_result and pred_error as the JSON shared by CLI and daemon. */
#include "json_result.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* Decimal places of each kind of number (DESIGN.md: pKa 2, fractions 4). */
enum { DP_PKA = 2, DP_FRACTION = 4, DP_CHARGE = 3, DP_PH = 2 };

/* 10^decimals; the table holds the decimals the encoder uses, each exact as pow gives it. */
static double ten_to(int decimals)
{
	static const double tens[] = {1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6};
	if (decimals >= 0 && decimals < (int)(sizeof tens / sizeof *tens))
		return tens[decimals];
	return pow(10.0, decimals);
}

static double round_to(double x, int decimals)
{
	double scale = ten_to(decimals);
	double r = srv_round_scaled(x, scale) / scale;
	/* -0 would print as "-0", which reads oddly in a charge column. */
	return r == 0.0 ? 0.0 : r;
}

/* A finite number with the given decimals, trailing zeros dropped, into buf (64 bytes):
 * cJSON's own printing (%1.15g, then a read-back check) and even snprintf are a sizeable
 * share of a prediction. The digits of round(x * 10^decimals) are what "%.*f" prints for
 * the rounded value; snprintf stays for magnitudes where a double holds no such integer. */
static void format_fixed(char *buf, double x, int decimals)
{
	double scaled = srv_round_scaled(x, ten_to(decimals));
	if (!(fabs(scaled) < 1e15)) {
		int n = snprintf(buf, 64, "%.*f", decimals, round_to(x, decimals));
		if (n > 0 && n < 64 && strchr(buf, '.')) {
			while (buf[n - 1] == '0')
				buf[--n] = '\0';
			if (buf[n - 1] == '.')
				buf[--n] = '\0';
		}
		if (!strcmp(buf, "-0"))
			strcpy(buf, "0");
		return;
	}
	long long k = (long long)scaled;
	unsigned long long u = k < 0 ? (unsigned long long)-k : (unsigned long long)k;
	char digits[32];
	int nd = 0, o = 0, frac = 0;
	do {
		digits[nd++] = (char)('0' + u % 10);
		u /= 10;
	} while (u || nd <= decimals);
	for (int i = 0; i < decimals; i++)
		if (digits[i] != '0') {
			frac = decimals - i; /* fraction digits kept */
			break;
		}
	if (k < 0)
		buf[o++] = '-';
	for (int i = nd - 1; i >= decimals; i--)
		buf[o++] = digits[i];
	if (frac)
		buf[o++] = '.';
	for (int i = decimals - 1; i >= decimals - frac; i--)
		buf[o++] = digits[i];
	buf[o] = '\0';
}

static cJSON *fixed_number(double x, int decimals)
{
	char buf[64];
	format_fixed(buf, x, decimals);
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

/* ---- the result, written straight to text ------------------------------------------------
 * Byte for byte what cJSON_PrintUnformatted gives for the same object (string escapes, "%d"
 * integers), without building the tree: that was a tenth of a prediction. */

typedef struct jw {
	srv_buf b;
	srv_buf warn;  /* the encoder's own warnings, as JSON strings with leading commas */
	int first;     /* no member written yet in the innermost object or array */
} jw;

static void put(jw *w, const char *s)
{
	srv_buf_puts(&w->b, s);
}

/* s made valid UTF-8 as srv_utf8_clean does, with cJSON's escapes: quote, backslash,
 * \b \f \n \r \t, other control bytes as \u00xx. No copy of a string that is valid. */
static void put_string(srv_buf *b, const char *s)
{
	static const char hex[] = "0123456789abcdef";
	const unsigned char *p = (const unsigned char *)s, *run = p;
	srv_buf_append(b, "\"", 1);
	for (;; p++) {
		unsigned char ch = *p;
		size_t len = ch >= 0x80 ? utf8_seq_len(p, strnlen((const char *)p, 4)) : 1;
		if (ch >= 0x80 && len) {
			p += len - 1;
			continue;
		}
		if (ch >= 32 && ch != '"' && ch != '\\' && ch < 0x80)
			continue;
		srv_buf_append(b, (const char *)run, (size_t)(p - run));
		run = p + 1;
		if (!ch)
			break;
		if (ch >= 0x80) {
			srv_buf_append(b, "\xef\xbf\xbd", 3); /* U+FFFD for a bad byte */
			continue;
		}
		const char *esc = ch == '"' ? "\\\"" : ch == '\\' ? "\\\\" : ch == '\b' ? "\\b"
			: ch == '\f' ? "\\f" : ch == '\n' ? "\\n" : ch == '\r' ? "\\r"
			: ch == '\t' ? "\\t" : NULL;
		char u[7] = {'\\', 'u', '0', '0', hex[ch >> 4], hex[ch & 15], 0};
		srv_buf_puts(b, esc ? esc : u);
	}
	srv_buf_append(b, "\"", 1);
}

/* The separator before a member or element, then its key (NULL inside an array). */
static void put_key(jw *w, const char *key)
{
	if (!w->first)
		put(w, ",");
	w->first = 0;
	if (key) {
		put_string(&w->b, key);
		put(w, ":");
	}
}

static void open_with(jw *w, const char *key, const char *bracket)
{
	put_key(w, key);
	put(w, bracket);
	w->first = 1;
}

static void close_with(jw *w, const char *bracket)
{
	put(w, bracket);
	w->first = 0;
}

static void put_str_member(jw *w, const char *key, const char *s)
{
	put_key(w, key);
	put_string(&w->b, s ? s : "");
}

static void put_int_member(jw *w, const char *key, int v)
{
	char s[64];
	format_fixed(s, v, 0); /* an int is exact in a double: the digits of "%d" */
	put_key(w, key);
	put(w, s);
}

/* An encoder warning, in order of discovery; they follow the result's own. */
static void warn(jw *w, const char *msg)
{
	srv_buf_append(&w->warn, ",", 1);
	put_string(&w->warn, msg);
}

static void put_fixed(jw *w, double x, int decimals)
{
	char buf[64];
	format_fixed(buf, x, decimals);
	put(w, buf);
}

/* A keyed number; non-finite: null and a warning naming the key. */
static void put_number(jw *w, const char *key, double x, int decimals)
{
	put_key(w, key);
	if (isfinite(x)) {
		put_fixed(w, x, decimals);
		return;
	}
	char msg[160];
	snprintf(msg, sizeof msg, "non-finite value of '%s' encoded as null", key);
	put(w, "null");
	warn(w, msg);
}

/* An array of numbers; returns whether one was non-finite (null). */
static int put_numbers(jw *w, const char *key, const double *x, size_t n, int decimals)
{
	int bad = 0;
	open_with(w, key, "[");
	for (size_t i = 0; i < n; i++) {
		put_key(w, NULL);
		if (isfinite(x[i]))
			put_fixed(w, x[i], decimals);
		else
			put(w, "null"), bad = 1;
	}
	close_with(w, "]");
	return bad;
}

static void put_site(jw *w, const pred_site *s)
{
	open_with(w, NULL, "{");
	put_int_member(w, "atom", s->atom);
	put_str_member(w, "element", s->element ? s->element : "");
	put_str_member(w, "group", s->group ? s->group : "");
	put_str_member(w, "kind", s->kind == PRED_BASE ? "base" : "acid");
	put_number(w, "pka", s->pka, DP_PKA);
	put_number(w, "uncertainty", s->uncertainty, DP_PKA);
	put_str_member(w, "confidence", s->confidence ? s->confidence : "low");
	open_with(w, "terms", "[");
	for (size_t i = 0; i < s->n_terms; i++) {
		const pred_term *t = &s->terms[i];
		open_with(w, NULL, "{");
		put_str_member(w, "term", t->term ? t->term : "");
		put_str_member(w, "detail", t->detail ? t->detail : "");
		put_number(w, "value", t->value, DP_PKA);
		close_with(w, "}");
	}
	close_with(w, "]");
	close_with(w, "}");
}

static void put_macro(jw *w, const pred_result *r)
{
	size_t n = pred_result_macro_count(r);
	double *v = malloc((n + 1) * sizeof *v);
	if (!v) {
		w->b.oom = 1;
		return;
	}
	for (size_t i = 0; i < n; i++)
		v[i] = pred_result_macro_pka(r, i);
	if (put_numbers(w, "macro_pka", v, n, DP_PKA))
		warn(w, "non-finite macro_pka encoded as null");
	free(v);
}

static void put_at_ph(jw *w, const pred_result *r)
{
	open_with(w, "at_ph", "{");
	put_number(w, "ph", pred_result_ph(r), DP_PH);
	put_number(w, "charge", pred_result_charge(r), DP_CHARGE);
	if (pred_result_ionization_is_approximate(r)) {
		put_key(w, "approximate");
		put(w, "true");
	}
	open_with(w, "species", "[");
	for (size_t i = 0; i < pred_result_species_count(r); i++) {
		const pred_species *sp = pred_result_species(r, i);
		open_with(w, NULL, "{");
		put_str_member(w, "smiles", sp->smiles ? sp->smiles : "");
		put_number(w, "fraction", sp->fraction, DP_FRACTION);
		put_int_member(w, "charge", sp->charge);
		close_with(w, "}");
	}
	close_with(w, "]");
	close_with(w, "}");
}

static void put_curves(jw *w, const pred_curves *c)
{
	int bad = 0;
	open_with(w, "curves", "{");
	bad |= put_numbers(w, "ph", c->ph, c->n_points, DP_PH);
	bad |= put_numbers(w, "charge", c->charge, c->n_points, DP_CHARGE);
	open_with(w, "fractions", "[");
	for (size_t s = 0; s < c->n_series; s++) {
		open_with(w, NULL, "{");
		put_int_member(w, "charge", c->series_charge[s]);
		bad |= put_numbers(w, "fraction", c->fraction + s * c->n_points, c->n_points,
				   DP_FRACTION);
		close_with(w, "}");
	}
	close_with(w, "]");
	close_with(w, "}");
	if (bad)
		warn(w, "non-finite curve value encoded as null");
}

/* The result's warnings or notes, then (warnings only) the encoder's. */
static void put_strings(jw *w, const char *key, const pred_result *r,
			size_t (*count)(const pred_result *),
			const char *(*get)(const pred_result *, size_t), const srv_buf *extra)
{
	open_with(w, key, "[");
	for (size_t i = 0; i < count(r); i++) {
		put_key(w, NULL);
		put_string(&w->b, get(r, i) ? get(r, i) : "");
	}
	if (extra && extra->len)
		srv_buf_append(&w->b, extra->p + (w->first ? 1 : 0), extra->len - (w->first ? 1 : 0));
	close_with(w, "]");
}

char *srv_result_text(const pred_result *r, const char *id, const char *input)
{
	jw w = {{0}, {0}, 1};
	double pi;
	const pred_curves *curves = pred_result_curves(r);
	put(&w, "{");
	if (id)
		put_str_member(&w, "id", id);
	if (input)
		put_str_member(&w, "input", input);
	put_str_member(&w, "smiles", pred_result_smiles(r) ? pred_result_smiles(r) : "");
	open_with(&w, "sites", "[");
	for (size_t i = 0; i < pred_result_site_count(r); i++)
		put_site(&w, pred_result_site(r, i));
	close_with(&w, "]");
	put_macro(&w, r);
	put_at_ph(&w, r);
	if (pred_result_isoelectric(r, &pi) == 0)
		put_number(&w, "isoelectric_point", pi, DP_PKA);
	if (curves)
		put_curves(&w, curves);
	put_strings(&w, "warnings", r, pred_result_warning_count, pred_result_warning, &w.warn);
	put_strings(&w, "notes", r, pred_result_note_count, pred_result_note, NULL);
	put(&w, "}");
	if (w.warn.oom)
		w.b.oom = 1;
	srv_buf_free(&w.warn);
	return srv_buf_take(&w.b);
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
