/* SPDX-License-Identifier: MIT */
/* record_reader.c: bounded, streaming reader of SMILES lines and SD records. */
#include "record_reader.h"

#include <errno.h>
#include <stdarg.h>
#include <stdlib.h>
#include <string.h>

#include "json_result.h"

/* Lines looked at to tell an SD file from SMILES lines (header block plus counts line). */
#define PEEK_LINES 5
/* Bytes of an unreadable record echoed back in its error. */
#define ECHO_PREFIX 80

typedef struct line_buf {
	char *s;     /* NUL-terminated, at most SRV_MAX_LINE bytes kept */
	size_t len;  /* bytes kept */
	size_t full; /* length of the whole line */
	size_t cap;
} line_buf;

struct srv_reader {
	FILE *f;
	srv_input_format fmt;
	size_t next_number;
	int eof;
	line_buf peek[PEEK_LINES];
	size_t n_peek, peek_pos;
	line_buf cur;
	size_t io_len, io_pos;
	char io[64 * 1024];
};

/* checked like printf by gcc and clang (-Wformat=2 includes -Wformat-nonliteral) */
static void set_err(pred_error *err, int code, const char *fmt, ...) __attribute__((format(printf, 3, 4)));

static void set_err(pred_error *err, int code, const char *fmt, ...)
{
	va_list ap;
	if (!err)
		return;
	err->code = code;
	va_start(ap, fmt);
	vsnprintf(err->msg, sizeof err->msg, fmt, ap);
	va_end(ap);
}

/* errno still holds the cause of a failed fread when this runs. */
static void io_error(pred_error *err, int st)
{
	if (st == PRED_ENOMEM)
		set_err(err, st, "out of memory");
	else
		set_err(err, st, "read error: %s", strerror(errno));
}

static int line_append(line_buf *lb, const char *p, size_t n)
{
	lb->full += n;
	if (lb->len + n > SRV_MAX_LINE)
		n = SRV_MAX_LINE - lb->len;
	if (lb->len + n + 1 > lb->cap) {
		size_t cap = (lb->len + n + 1) * 2;
		char *s = realloc(lb->s, cap);
		if (!s)
			return PRED_ENOMEM;
		lb->s = s, lb->cap = cap;
	}
	memcpy(lb->s + lb->len, p, n);
	lb->len += n;
	lb->s[lb->len] = '\0';
	return 0;
}

static int io_fill(srv_reader *rd)
{
	if (rd->io_pos < rd->io_len)
		return 1;
	if (rd->eof)
		return 0;
	rd->io_pos = 0;
	rd->io_len = fread(rd->io, 1, sizeof rd->io, rd->f);
	if (rd->io_len)
		return 1;
	rd->eof = 1;
	return ferror(rd->f) ? PRED_EINTERNAL : 0;
}

/* Reads one line without its "\n" (and "\r"): 1, 0 at end of input, or a PRED_E*. */
static int read_line(srv_reader *rd, line_buf *lb)
{
	int any = 0;
	lb->len = lb->full = 0;
	if (line_append(lb, "", 0) < 0)
		return PRED_ENOMEM;
	for (;;) {
		int st = io_fill(rd);
		if (st <= 0)
			return st < 0 ? st : any;
		char *start = rd->io + rd->io_pos;
		size_t avail = rd->io_len - rd->io_pos;
		char *nl = memchr(start, '\n', avail);
		size_t n = nl ? (size_t)(nl - start) : avail;
		if (line_append(lb, start, n) < 0)
			return PRED_ENOMEM;
		rd->io_pos += n + (nl ? 1 : 0);
		any = 1;
		if (nl)
			break;
	}
	if (lb->len && lb->s[lb->len - 1] == '\r')
		lb->s[--lb->len] = '\0', lb->full--;
	return 1;
}

static int next_line(srv_reader *rd, line_buf **out)
{
	if (rd->peek_pos < rd->n_peek) {
		*out = &rd->peek[rd->peek_pos++];
		return 1;
	}
	*out = &rd->cur;
	return read_line(rd, &rd->cur);
}

static int is_space(char c)
{
	return c == ' ' || c == '\t' || c == '\r' || c == '\v' || c == '\f';
}

static int has_suffix(const char *s, const char *suffix)
{
	size_t n = strlen(s), k = strlen(suffix);
	return n >= k && !strcmp(s + n - k, suffix);
}

static srv_input_format format_from_name(const char *name)
{
	static const char *const sdf[] = {".sdf", ".sd", ".mol", ".SDF", ".SD", ".MOL"};
	static const char *const smi[] = {".smi", ".smiles", ".can", ".ism", ".SMI"};
	for (size_t i = 0; name && i < sizeof sdf / sizeof sdf[0]; i++)
		if (has_suffix(name, sdf[i]))
			return SRV_IN_SDF;
	for (size_t i = 0; name && i < sizeof smi / sizeof smi[0]; i++)
		if (has_suffix(name, smi[i]))
			return SRV_IN_SMILES;
	return SRV_IN_AUTO;
}

/* Content check over the first lines: an SD separator, an "M  END" line, or a V2000/V3000
 * counts line where a mol block has it (the fourth line). */
static srv_input_format format_from_content(srv_reader *rd)
{
	for (size_t i = 0; i < rd->n_peek; i++) {
		const char *s = rd->peek[i].s;
		if (!strncmp(s, "$$$$", 4) || !strncmp(s, "M  END", 6))
			return SRV_IN_SDF;
		if (i == 3 && (strstr(s, "V2000") || strstr(s, "V3000")))
			return SRV_IN_SDF;
	}
	return SRV_IN_SMILES;
}

static int peek_lines(srv_reader *rd)
{
	while (rd->n_peek < PEEK_LINES) {
		int st = read_line(rd, &rd->peek[rd->n_peek]);
		if (st <= 0)
			return st;
		rd->n_peek++;
	}
	return 0;
}

int srv_reader_new(srv_reader **out, FILE *f, const char *name, srv_input_format fmt,
		   size_t first_number, pred_error *err)
{
	srv_reader *rd = calloc(1, sizeof *rd);
	int st;
	*out = NULL;
	if (!rd) {
		set_err(err, PRED_ENOMEM, "out of memory");
		return PRED_ENOMEM;
	}
	rd->f = f;
	rd->next_number = first_number;
	rd->fmt = fmt == SRV_IN_AUTO ? format_from_name(name) : fmt;
	if (rd->fmt == SRV_IN_AUTO) {
		st = peek_lines(rd);
		if (st < 0) {
			set_err(err, st, "cannot read %s: %s", name ? name : "input", strerror(errno));
			srv_reader_free(rd);
			return st;
		}
		rd->fmt = format_from_content(rd);
	}
	*out = rd;
	return 0;
}

void srv_reader_free(srv_reader *rd)
{
	if (!rd)
		return;
	for (size_t i = 0; i < PEEK_LINES; i++)
		free(rd->peek[i].s);
	free(rd->cur.s);
	free(rd);
}

srv_input_format srv_reader_format(const srv_reader *rd)
{
	return rd->fmt;
}

size_t srv_reader_next_number(const srv_reader *rd)
{
	return rd->next_number;
}

void srv_record_free(srv_record *rec)
{
	if (!rec)
		return;
	free(rec->text);
	free(rec->id);
	free(rec->raw);
	free(rec);
}

static char *copy_n(const char *s, size_t n)
{
	char *c = malloc(n + 1);
	if (c) {
		memcpy(c, s, n);
		c[n] = '\0';
	}
	return c;
}

/* Trimmed copy of s[0..n), or the record number when nothing is left. */
static char *id_or_number(const char *s, size_t n, size_t number)
{
	char buf[32];
	while (n && is_space(*s))
		s++, n--;
	while (n && is_space(s[n - 1]))
		n--;
	if (n && !memchr(s, '\0', n))
		return srv_utf8_clean(s, n);
	snprintf(buf, sizeof buf, "%zu", number);
	return copy_n(buf, strlen(buf));
}

static srv_record *record_new(srv_reader *rd, pred_format fmt)
{
	srv_record *rec = calloc(1, sizeof *rec);
	if (rec) {
		rec->number = rd->next_number++;
		rec->fmt = fmt;
	}
	return rec;
}

/* An unreadable record: keep a short, clean prefix to echo and say why. */
static int record_fail(srv_record *rec, const char *s, size_t n, int code, const char *why)
{
	char *echo = srv_utf8_clean(s, n < ECHO_PREFIX ? n : ECHO_PREFIX);
	if (!echo)
		return PRED_ENOMEM;
	free(rec->text);
	rec->text = echo;
	set_err(&rec->err, code, "%s", why);
	return 0;
}

static int smiles_from_line(srv_record *rec, const line_buf *lb)
{
	char why[128];
	const char *s = lb->s, *end = lb->s + lb->len;
	const char *tok, *nul = memchr(lb->s, '\0', lb->len);
	if (lb->full > SRV_MAX_LINE) {
		snprintf(why, sizeof why, "line of %zu bytes is over the %u-byte limit", lb->full,
			 SRV_MAX_LINE);
		rec->id = id_or_number("", 0, rec->number);
		return rec->id ? record_fail(rec, s, lb->len, PRED_ELIMIT, why) : PRED_ENOMEM;
	}
	while (s < end && is_space(*s))
		s++;
	tok = s;
	while (s < end && *s && !is_space(*s))
		s++;
	rec->text = copy_n(tok, (size_t)(s - tok));
	rec->id = id_or_number(s, (size_t)(end - s), rec->number);
	if (!rec->text || !rec->id)
		return PRED_ENOMEM;
	if (nul) {
		snprintf(why, sizeof why, "NUL byte at column %zu", (size_t)(nul - lb->s) + 1);
		return record_fail(rec, lb->s, lb->len, PRED_EPARSE, why);
	}
	return 0;
}

/* Index of the first non-blank byte of the line, or its length when it is blank. */
static size_t first_nonblank(const line_buf *lb)
{
	size_t i = 0;
	while (i < lb->len && is_space(lb->s[i]))
		i++;
	return i;
}

static int is_blank_or_comment(const line_buf *lb)
{
	size_t i = first_nonblank(lb);
	if (lb->full > lb->len)
		return 0;
	return i == lb->len || lb->s[i] == '#';
}

static int next_smiles(srv_record **out, srv_reader *rd, pred_error *err)
{
	line_buf *lb;
	srv_record *rec;
	int st;
	do {
		st = next_line(rd, &lb);
		if (st <= 0)
			goto io_done;
	} while (is_blank_or_comment(lb));
	rec = record_new(rd, PRED_FMT_SMILES);
	if (!rec || smiles_from_line(rec, lb) < 0) {
		srv_record_free(rec);
		st = PRED_ENOMEM;
		goto io_done;
	}
	*out = rec;
	return 1;
io_done:
	if (st < 0)
		io_error(err, st);
	return st;
}

/* ---- SD records ------------------------------------------------------------------------ */

typedef struct sd_acc {
	line_buf text; /* the record so far (lines joined with "\n"), capped */
	size_t full;   /* bytes of the whole record */
	int bad_line;  /* a line over SRV_MAX_LINE */
	int all_blank;
} sd_acc;

static int sd_append(sd_acc *a, const line_buf *lb)
{
	a->full += lb->full + 1;
	a->bad_line |= lb->full > lb->len;
	if (first_nonblank(lb) < lb->len || lb->full > lb->len)
		a->all_blank = 0;
	if (a->full > SRV_MAX_SD_RECORD)
		return 0;
	/* line_append caps at SRV_MAX_LINE, so the SD text is built with its own cap check */
	if (a->text.len + lb->len + 2 > a->text.cap) {
		size_t cap = (a->text.len + lb->len + 2) * 2;
		char *s = realloc(a->text.s, cap);
		if (!s)
			return PRED_ENOMEM;
		a->text.s = s, a->text.cap = cap;
	}
	memcpy(a->text.s + a->text.len, lb->s, lb->len);
	a->text.len += lb->len;
	a->text.s[a->text.len++] = '\n';
	a->text.s[a->text.len] = '\0';
	return 0;
}

/* Reads lines up to "$$$$" or the end: 1 with a record in a, 0 when only blank lines were
 * left, or a PRED_E*. */
static int sd_collect(srv_reader *rd, sd_acc *a)
{
	line_buf *lb;
	int st;
	a->all_blank = 1;
	for (;;) {
		st = next_line(rd, &lb);
		if (st < 0)
			return st;
		if (st == 0)
			return a->all_blank ? 0 : 1;
		if (!strncmp(lb->s, "$$$$", 4))
			return 1;
		if (sd_append(a, lb) < 0)
			return PRED_ENOMEM;
	}
}

/* End of the mol block: just past the line that starts with "M  END", or NULL. */
static const char *molblock_end(const char *s)
{
	for (const char *p = s; p && *p; p = strchr(p, '\n'), p = p ? p + 1 : NULL) {
		if (!strncmp(p, "M  END", 6)) {
			const char *nl = strchr(p, '\n');
			return nl ? nl + 1 : p + strlen(p);
		}
	}
	return NULL;
}

static int sd_fill(srv_record *rec, const sd_acc *a)
{
	char why[128];
	const char *s = a->text.s ? a->text.s : "";
	const char *end = molblock_end(s);
	const char *nl = strchr(s, '\n');
	rec->id = id_or_number(s, nl ? (size_t)(nl - s) : strlen(s), rec->number);
	if (!rec->id)
		return PRED_ENOMEM;
	if (a->full > SRV_MAX_SD_RECORD || a->bad_line) {
		snprintf(why, sizeof why, "SD record of %zu bytes is over the limit (%u per "
			 "record, %u per line)", a->full, SRV_MAX_SD_RECORD, SRV_MAX_LINE);
		return record_fail(rec, s, a->text.len, PRED_ELIMIT, why);
	}
	if (memchr(s, '\0', a->text.len))
		return record_fail(rec, s, a->text.len, PRED_EPARSE, "NUL byte in SD record");
	if (!end)
		return record_fail(rec, s, a->text.len, PRED_EPARSE,
				   "SD record has no 'M  END' line");
	rec->text = copy_n(s, (size_t)(end - s));
	rec->raw = copy_n(s, a->text.len);
	return rec->text && rec->raw ? 0 : PRED_ENOMEM;
}

static int next_sd(srv_record **out, srv_reader *rd, pred_error *err)
{
	sd_acc a = {0};
	srv_record *rec = NULL;
	int st = sd_collect(rd, &a);
	if (st <= 0)
		goto done;
	rec = record_new(rd, PRED_FMT_MOLBLOCK);
	if (!rec || sd_fill(rec, &a) < 0) {
		srv_record_free(rec);
		st = PRED_ENOMEM;
		goto done;
	}
	*out = rec;
	st = 1;
done:
	free(a.text.s);
	if (st < 0)
		io_error(err, st);
	return st;
}

int srv_reader_next(srv_record **out, srv_reader *rd, pred_error *err)
{
	*out = NULL;
	return rd->fmt == SRV_IN_SDF ? next_sd(out, rd, err) : next_smiles(out, rd, err);
}

int srv_input_format_parse(srv_input_format *out, const char *s)
{
	static const struct {
		const char *name;
		srv_input_format fmt;
	} names[] = {{"auto", SRV_IN_AUTO}, {"smiles", SRV_IN_SMILES}, {"smi", SRV_IN_SMILES},
		     {"sdf", SRV_IN_SDF},   {"sd", SRV_IN_SDF},         {"mol", SRV_IN_SDF}};
	*out = SRV_IN_AUTO;
	if (!s)
		return 0;
	for (size_t i = 0; i < sizeof names / sizeof names[0]; i++)
		if (!strcmp(s, names[i].name)) {
			*out = names[i].fmt;
			return 0;
		}
	return PRED_EINVAL;
}
