/* SPDX-License-Identifier: MIT */
/* output_formats.c: renders one record's prediction as a JSON line, CSV rows or SD record. */
#include "output_formats.h"

#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "json_result.h"

/* Growable text; oom is sticky so callers check once at the end. */
typedef struct sbuf {
	char *s;
	size_t len, cap;
	int oom;
} sbuf;

static void sb_add(sbuf *b, const char *s, size_t n)
{
	if (b->oom)
		return;
	if (b->len + n + 1 > b->cap) {
		size_t cap = (b->len + n + 1) * 2;
		char *t = realloc(b->s, cap);
		if (!t) {
			b->oom = 1;
			return;
		}
		b->s = t, b->cap = cap;
	}
	memcpy(b->s + b->len, s, n);
	b->len += n;
	b->s[b->len] = '\0';
}

static void sb_puts(sbuf *b, const char *s)
{
	sb_add(b, s, strlen(s));
}

/* checked like printf by gcc and clang (-Wformat=2 includes -Wformat-nonliteral) */
static void sb_printf(sbuf *b, const char *fmt, ...) __attribute__((format(printf, 2, 3)));

static void sb_printf(sbuf *b, const char *fmt, ...)
{
	char tmp[512];
	va_list ap;
	int n;
	va_start(ap, fmt);
	n = vsnprintf(tmp, sizeof tmp, fmt, ap);
	va_end(ap);
	if (n > 0)
		sb_add(b, tmp, (size_t)n < sizeof tmp ? (size_t)n : sizeof tmp - 1);
}

static char *sb_finish(sbuf *b)
{
	sb_add(b, "", 0);
	if (b->oom) {
		free(b->s);
		return NULL;
	}
	return b->s;
}

/* "9.95", or "" for a non-finite number (CSV and SD have no null). Rounded first, so that
 * a small negative value does not print as "-0.00". */
static void sb_number(sbuf *b, double x, int decimals)
{
	double scale = pow(10.0, decimals), r = srv_round_scaled(x, scale) / scale;
	if (isfinite(x))
		sb_printf(b, "%.*f", decimals, r == 0.0 ? 0.0 : r);
}

int srv_output_format_parse(srv_output_format *out, const char *s)
{
	static const struct {
		const char *name;
		srv_output_format fmt;
	} names[] = {{"jsonl", SRV_OUT_JSONL}, {"json", SRV_OUT_JSONL}, {"csv", SRV_OUT_CSV},
		     {"sdf", SRV_OUT_SDF},     {"sd", SRV_OUT_SDF}};
	for (size_t i = 0; i < sizeof names / sizeof names[0]; i++)
		if (!strcmp(s, names[i].name)) {
			*out = names[i].fmt;
			return 0;
		}
	return PRED_EINVAL;
}

/* ---- JSON lines ------------------------------------------------------------------------ */

static char *render_jsonl(const srv_record *rec, const pred_result *r, const pred_error *e)
{
	sbuf b = {0};
	if (r) {
		char *line = srv_result_text(r, rec->id, rec->text);
		if (!line)
			return NULL;
		sb_puts(&b, line);
		free(line);
	} else {
		char *line = srv_json_line(srv_error_json(rec->id, rec->text, e));
		if (!line)
			return NULL;
		sb_puts(&b, line);
		cJSON_free(line);
	}
	sb_puts(&b, "\n");
	return sb_finish(&b);
}

/* ---- CSV (RFC 4180 quoting) ---------------------------------------------------------------- */

static const char csv_header[] = "id,input,smiles,atom,element,group,kind,pka,uncertainty,"
				 "confidence,explanation,charge_at_ph,error_code,error_message\n";

static void csv_field(sbuf *b, const char *s, int last)
{
	size_t n = s ? strlen(s) : 0;
	int quote = n && (strpbrk(s, ",\"\r\n") || s[0] == ' ' || s[n - 1] == ' ');
	if (!quote) {
		sb_add(b, s ? s : "", n);
	} else {
		sb_puts(b, "\"");
		for (const char *p = s; *p; p++) {
			if (*p == '"')
				sb_add(b, "\"", 1);
			sb_add(b, p, 1);
		}
		sb_puts(b, "\"");
	}
	sb_puts(b, last ? "\n" : ",");
}

/* Field of a formatted number: written into a small buffer, then quoted like any other. */
static void csv_number(sbuf *b, double x, int decimals)
{
	sbuf t = {0};
	sb_number(&t, x, decimals);
	csv_field(b, t.s ? t.s : "", 0);
	free(t.s);
}

/* "parent 9.95; hammett -2.83 (4-NO2, sigma_p- 1.27, rho 2.23)" */
static void explanation(sbuf *b, const pred_site *s)
{
	for (size_t i = 0; i < s->n_terms; i++) {
		const pred_term *t = &s->terms[i];
		sb_printf(b, "%s%s ", i ? "; " : "", t->term ? t->term : "");
		sb_number(b, t->value, 2);
		if (t->detail && t->detail[0])
			sb_printf(b, " (%s)", t->detail);
	}
}

static void csv_site(sbuf *b, const pred_site *s)
{
	sbuf ex = {0};
	char atom[32];
	snprintf(atom, sizeof atom, "%d", s->atom);
	csv_field(b, atom, 0);
	csv_field(b, s->element, 0);
	csv_field(b, s->group, 0);
	csv_field(b, s->kind == PRED_BASE ? "base" : "acid", 0);
	csv_number(b, s->pka, 2);
	csv_number(b, s->uncertainty, 2);
	csv_field(b, s->confidence, 0);
	explanation(&ex, s);
	csv_field(b, ex.s ? ex.s : "", 0);
	b->oom |= ex.oom;
	free(ex.s);
}

static char *render_csv(const srv_record *rec, const pred_result *r, const pred_error *e)
{
	sbuf b = {0};
	size_t n = r ? pred_result_site_count(r) : 0;
	for (size_t i = 0; i < (n ? n : 1); i++) {
		csv_field(&b, rec->id, 0);
		csv_field(&b, rec->text, 0);
		csv_field(&b, r ? pred_result_smiles(r) : "", 0);
		if (n)
			csv_site(&b, pred_result_site(r, i));
		else
			sb_puts(&b, ",,,,,,,,");
		if (r)
			csv_number(&b, pred_result_charge(r), 3);
		else
			sb_puts(&b, ",");
		csv_field(&b, r ? "" : pred_status_name(e->code), 0);
		csv_field(&b, r ? "" : e->msg, 1);
	}
	return sb_finish(&b);
}

/* ---- SD ---------------------------------------------------------------------------------- */

/* One line of an SD value or title: never blank (a blank line ends a value) and never
 * starting with "$$$$" or ">" (a separator or a field header). */
static void sd_line(sbuf *b, const char *s, size_t n)
{
	if (!n || (n >= 4 && !strncmp(s, "$$$$", 4)) || s[0] == '>')
		sb_puts(b, " ");
	sb_add(b, s, n);
	sb_puts(b, "\n");
}

static void sd_field(sbuf *b, const char *name, const char *value)
{
	sb_printf(b, "> <%s>\n", name);
	for (const char *p = value; p && *p;) {
		const char *nl = strchr(p, '\n');
		size_t n = nl ? (size_t)(nl - p) : strlen(p);
		if (n)
			sd_line(b, p, n);
		p += n + (nl ? 1 : 0);
	}
	sb_puts(b, "\n");
}

/* The input's record, or for SMILES input an empty connection table titled with the id
 * (the library offers no SMILES-to-mol-block writer) plus the SMILES as a field. */
static void sd_block(sbuf *b, const srv_record *rec)
{
	size_t n;
	if (rec->raw) {
		n = strlen(rec->raw);
		sb_puts(b, rec->raw);
		if (n && rec->raw[n - 1] != '\n')
			sb_puts(b, "\n");
		return;
	}
	n = strlen(rec->id);
	sd_line(b, rec->id, n > 80 ? 80 : n);
	sb_puts(b, "  pkad\n\n  0  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n");
	if (rec->fmt == PRED_FMT_SMILES)
		sd_field(b, "SMILES", rec->text);
}

static void sd_extreme(sbuf *b, const pred_result *r, const char *name, pred_kind kind)
{
	sbuf v = {0};
	double best = NAN;
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		if (s->kind != kind || !isfinite(s->pka))
			continue;
		if (isnan(best) || (kind == PRED_ACID ? s->pka < best : s->pka > best))
			best = s->pka;
	}
	sb_number(&v, best, 2);
	sd_field(b, name, v.s ? v.s : "");
	b->oom |= v.oom;
	free(v.s);
}

static void sd_sites(sbuf *b, const pred_result *r)
{
	sbuf v = {0};
	for (size_t i = 0; i < pred_result_site_count(r); i++) {
		const pred_site *s = pred_result_site(r, i);
		sb_printf(&v, "atom %d %s %s %s pKa ", s->atom, s->element, s->group,
			  s->kind == PRED_BASE ? "base" : "acid");
		sb_number(&v, s->pka, 2);
		sb_puts(&v, " +- ");
		sb_number(&v, s->uncertainty, 2);
		sb_printf(&v, " %s\n", s->confidence);
	}
	sd_field(b, "PKA_SITES", v.s ? v.s : "");
	b->oom |= v.oom;
	free(v.s);
}

static void sd_result_fields(sbuf *b, const pred_result *r, double ph)
{
	sbuf v = {0};
	char name[48];
	sd_field(b, "PKA_SMILES", pred_result_smiles(r));
	sd_sites(b, r);
	sd_extreme(b, r, "PKA_MOST_ACIDIC", PRED_ACID);
	sd_extreme(b, r, "PKA_MOST_BASIC", PRED_BASE);
	/* CHARGE_PH7_4 at the default pH; another --ph gives e.g. CHARGE_PH5_0 */
	snprintf(name, sizeof name, "CHARGE_PH%.1f", ph);
	for (char *p = name; *p; p++)
		*p = *p == '.' ? '_' : *p == '-' ? 'M' : *p;
	sb_number(&v, pred_result_charge(r), 2);
	sd_field(b, name, v.s ? v.s : "");
	b->oom |= v.oom;
	free(v.s);
	if (pred_result_species_count(r))
		sd_field(b, "PKA_MAJOR_SPECIES", pred_result_species(r, 0)->smiles);
}

static char *render_sdf(const srv_record *rec, const pred_result *r, const pred_error *e,
			double ph)
{
	sbuf b = {0};
	sd_block(&b, rec);
	if (r) {
		sd_result_fields(&b, r, ph);
	} else {
		sbuf v = {0};
		sb_printf(&v, "%s: %s", pred_status_name(e->code), e->msg);
		sd_field(&b, "PKA_ERROR", v.s ? v.s : "");
		b.oom |= v.oom;
		free(v.s);
	}
	sb_puts(&b, "$$$$\n");
	return sb_finish(&b);
}

const char *srv_output_header(srv_output_format f)
{
	return f == SRV_OUT_CSV ? csv_header : "";
}

char *srv_output_render(srv_output_format f, const srv_record *rec, const pred_result *r,
			const pred_error *e, double ph)
{
	static const pred_error unknown = {PRED_EINTERNAL, "no result and no error"};
	if (!r && !e)
		e = &unknown;
	switch (f) {
	case SRV_OUT_CSV:
		return render_csv(rec, r, e);
	case SRV_OUT_SDF:
		return render_sdf(rec, r, e, ph);
	default:
		return render_jsonl(rec, r, e);
	}
}
