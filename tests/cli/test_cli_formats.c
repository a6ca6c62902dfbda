/* SPDX-License-Identifier: MIT */
/* test_cli_formats.c: CSV and SD outputs parse back; SD in and out; threads keep the order. */
#include <cjson/cJSON.h>
#include <stdlib.h>
#include <string.h>

#include "cli/cli_run.h"
#include "harness.h"

/* ---- a small RFC 4180 reader ------------------------------------------------------------ */

typedef struct csv_row {
	char **f;
	size_t n;
} csv_row;

/* Parses one field starting at *p; advances *p past its separator. Returns the field. */
static char *csv_next_field(const char **p, int *end_of_row)
{
	const char *s = *p;
	size_t cap = strlen(s) + 1, n = 0;
	char *out = malloc(cap);
	if (*s == '"') {
		for (s++; *s; s++) {
			if (*s == '"' && s[1] == '"')
				out[n++] = '"', s++;
			else if (*s == '"')
				break;
			else
				out[n++] = *s;
		}
		if (*s == '"')
			s++;
	} else {
		while (*s && *s != ',' && *s != '\n')
			out[n++] = *s++;
	}
	out[n] = '\0';
	*end_of_row = *s != ',';
	*p = *s ? s + 1 : s;
	return out;
}

static size_t csv_parse(const char *text, csv_row **rows)
{
	size_t n = 0, cap = 16;
	*rows = calloc(cap, sizeof **rows);
	for (const char *p = text; *p;) {
		csv_row r = {NULL, 0};
		int end = 0;
		while (!end) {
			r.f = realloc(r.f, (r.n + 1) * sizeof *r.f);
			r.f[r.n++] = csv_next_field(&p, &end);
		}
		if (n == cap)
			*rows = realloc(*rows, (cap *= 2) * sizeof **rows);
		(*rows)[n++] = r;
	}
	return n;
}

static void csv_free(csv_row *rows, size_t n)
{
	for (size_t i = 0; i < n; i++) {
		for (size_t j = 0; j < rows[i].n; j++)
			free(rows[i].f[j]);
		free(rows[i].f);
	}
	free(rows);
}

static size_t count_of(const char *hay, const char *needle)
{
	size_t n = 0;
	for (const char *p = hay; p && (p = strstr(p, needle)); p += strlen(needle))
		n++;
	return n;
}

/* ---- tests ------------------------------------------------------------------------------ */

static const char mixed[] = "c1ccccc1O phenol\nC1CC broken\nCC,\"x quoted, id\nC methane\n"
			    "CC(=O)O\n";

static void test_formats__csv_has_a_row_for_every_record(void)
{
	const char *const args[] = {"predict", "--format", "csv", NULL};
	static const char *const ids[] = {"phenol", "broken", "quoted, id", "methane", "5"};
	cli_out o;
	csv_row *rows = NULL;
	size_t n, next = 0;
	CHECK(cli_run(&o, args, mixed, sizeof mixed - 1) == 0);
	CHECK_INT_EQ(o.status, 1);
	n = o.out ? csv_parse(o.out, &rows) : 0;
	CHECK(n >= 6);
	CHECK(n && rows[0].n == 14 && !strcmp(rows[0].f[0], "id"));
	for (size_t i = 1; i < n; i++) {
		CHECK_INT_EQ(rows[i].n, 14);
		if (rows[i].n != 14)
			continue;
		/* consecutive rows of one record share the id; records appear in input order */
		if (next == 0 || strcmp(rows[i].f[0], ids[next - 1]))
			CHECK(next < 5 && !strcmp(rows[i].f[0], ids[next++]));
		if (!strcmp(rows[i].f[0], "broken") || !strcmp(rows[i].f[0], "quoted, id"))
			CHECK_STR_EQ(rows[i].f[12], "invalid_smiles");
		if (!strcmp(rows[i].f[0], "quoted, id"))
			CHECK_STR_EQ(rows[i].f[1], "CC,\"x");
		if (!strcmp(rows[i].f[0], "phenol") && rows[i].f[3][0])
			CHECK(rows[i].f[10][0] != '\0'); /* explanation */
	}
	CHECK_INT_EQ(next, 5);
	csv_free(rows, n);
	cli_out_free(&o);
}

static void test_formats__sdf_has_one_record_per_input_with_fields(void)
{
	const char *const args[] = {"predict", "--format", "sdf", NULL};
	cli_out o;
	CHECK(cli_run(&o, args, mixed, sizeof mixed - 1) == 0);
	CHECK_INT_EQ(o.status, 1);
	CHECK_INT_EQ(count_of(o.out, "\n$$$$\n"), 5);
	CHECK_INT_EQ(count_of(o.out, "> <PKA_ERROR>\n"), 2);
	CHECK_INT_EQ(count_of(o.out, "> <PKA_SITES>\n"), 3);
	CHECK_INT_EQ(count_of(o.out, "> <PKA_MOST_ACIDIC>\n"), 3);
	CHECK_INT_EQ(count_of(o.out, "> <PKA_MOST_BASIC>\n"), 3);
	CHECK_INT_EQ(count_of(o.out, "> <CHARGE_PH7_4>\n"), 3);
	CHECK_INT_EQ(count_of(o.out, "M  END\n"), 5);
	cli_out_free(&o);
}

/* A zwitterion's mean charge at pH 7.4 is a hair below zero: it must read 0.00, not -0.00. */
static void test_formats__tiny_negative_numbers_print_as_zero(void)
{
	const char *const sdf[] = {"predict", "--format", "sdf", NULL};
	static const char in[] = "NCC(=O)O glycine\n";
	cli_out o;
	CHECK(cli_run(&o, sdf, in, sizeof in - 1) == 0);
	CHECK(o.out && strstr(o.out, "> <CHARGE_PH7_4>\n"));
	CHECK(o.out && !strstr(o.out, "\n-0.00\n"));
	cli_out_free(&o);
}

/* Phenol as a V2000 record (2D layout written by Open Babel 3.1.1) with a field of its own. */
static const char phenol_sd[] =
	"phenol\n OpenBabel12012619162D\n\n"
	"  7  7  0  0  0  0  0  0  0  0999 V2000\n"
	"   -0.8660   -0.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"   -1.7321   -0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"   -1.7321    1.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"   -0.8660    1.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"   -0.0000    1.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"    0.8660   -0.5000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"  1  6  2  0  0  0  0\n  1  2  1  0  0  0  0\n  2  3  2  0  0  0  0\n"
	"  3  4  1  0  0  0  0\n  4  5  2  0  0  0  0\n  5  6  1  0  0  0  0\n"
	"  6  7  1  0  0  0  0\nM  END\n> <REG_ID>\nX-0001\n\n$$$$\n";

/* SD in, SD out, and that output read again: same structure, same answer, own field kept. */
static void test_formats__sdf_output_loads_back(void)
{
	const char *const sdf[] = {"predict", "--format", "sdf", NULL};
	const char *const json[] = {"predict", "--format-in", "sdf", NULL};
	cli_out a, b, c;
	CHECK(cli_run(&a, sdf, phenol_sd, sizeof phenol_sd - 1) == 0);
	CHECK_INT_EQ(a.status, 0);
	CHECK(a.out && strstr(a.out, "> <REG_ID>\nX-0001\n"));
	CHECK(a.out && !strncmp(a.out, "phenol\n", 7));
	CHECK(cli_run(&b, json, phenol_sd, sizeof phenol_sd - 1) == 0);
	CHECK(a.out && cli_run(&c, json, a.out, a.len) == 0);
	CHECK_INT_EQ(c.status, 0);
	cJSON *jb = cJSON_Parse(b.out), *jc = cJSON_Parse(c.out);
	CHECK(jb && jc);
	CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(jb, "id")), "phenol");
	CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(jb, "smiles")),
		     cJSON_GetStringValue(cJSON_GetObjectItem(jc, "smiles")));
	CHECK(cJSON_Compare(cJSON_GetObjectItem(jb, "sites"), cJSON_GetObjectItem(jc, "sites"), 1));
	CHECK(cJSON_GetArraySize(cJSON_GetObjectItem(jb, "sites")) >= 1);
	cJSON_Delete(jb);
	cJSON_Delete(jc);
	cli_out_free(&a);
	cli_out_free(&b);
	cli_out_free(&c);
}

/* An SD file is recognised by content on stdin; a record without "M  END" is an error. */
static void test_formats__sd_detected_by_content_and_checked(void)
{
	static const char bad[] = "no end\n  x\n\n  0  0  0  0  0  0  0  0  0  0999 V2000\n$$$$\n";
	size_t n = sizeof phenol_sd - 1 + sizeof bad - 1;
	char *in = malloc(n + 1);
	cli_out o;
	const char *const args[] = {"predict", NULL};
	memcpy(in, phenol_sd, sizeof phenol_sd - 1);
	memcpy(in + sizeof phenol_sd - 1, bad, sizeof bad);
	CHECK(cli_run(&o, args, in, n) == 0);
	CHECK_INT_EQ(o.status, 1);
	CHECK_INT_EQ(count_of(o.out, "\n"), 2);
	CHECK(o.out && strstr(o.out, "\"id\":\"phenol\""));
	CHECK(o.out && strstr(o.out, "\"id\":\"no end\""));
	CHECK(o.out && strstr(o.out, "M  END"));
	cli_out_free(&o);
	free(in);
}

/* Molecules for the threads check: the NCI set when installed, else a small mix. */
static char *thread_input(size_t *len)
{
	static const char *const mix[] = {"c1ccccc1O", "CC(=O)O", "C1CC", "CCN", "c1ccncc1",
					  "OC(=O)c1ccc(Cl)cc1", "NCC(=O)O", "xyz", "Oc1ccc(cc1)[N+](=O)[O-]"};
	char *text = cli_slurp("/usr/share/RDKit/Data/NCI/first_5K.smi", len);
	if (text && *len > 0) {
		/* the first 400 molecules keep the four runs short */
		char *p = text;
		for (int k = 0; p && k < 400; k++)
			p = strchr(p, '\n'), p = p ? p + 1 : NULL;
		if (p)
			*len = (size_t)(p - text), text[*len] = '\0';
		return text;
	}
	free(text);
	printf("note: /usr/share/RDKit/Data/NCI/first_5K.smi missing (rdkit-data): using a mix\n");
	text = malloc(64 * 1024);
	*len = 0;
	for (size_t k = 0; text && k < 200; k++)
		*len += (size_t)sprintf(text + *len, "%s m%zu\n", mix[k % 9], k);
	return text;
}

static void test_formats__threads_give_the_same_output_as_one(void)
{
	const char *const one[] = {"predict", "--threads", "1", NULL};
	const char *const two[] = {"predict", "--threads", "2", NULL};
	const char *const csv2[] = {"predict", "--threads", "3", "--format", "csv", NULL};
	const char *const csv1[] = {"predict", "--format", "csv", NULL};
	size_t len;
	char *in = thread_input(&len);
	cli_out a, b, c, d;
	CHECK(in && cli_run(&a, one, in, len) == 0 && cli_run(&b, two, in, len) == 0);
	CHECK_INT_EQ(a.status, b.status);
	CHECK(a.len > 0 && a.len == b.len && !memcmp(a.out, b.out, a.len));
	CHECK(cli_run(&c, csv1, in, len) == 0 && cli_run(&d, csv2, in, len) == 0);
	CHECK(c.len > 0 && c.len == d.len && !memcmp(c.out, d.out, c.len));
	cli_out_free(&a);
	cli_out_free(&b);
	cli_out_free(&c);
	cli_out_free(&d);
	free(in);
}

int main(void)
{
	RUN(test_formats__csv_has_a_row_for_every_record);
	RUN(test_formats__sdf_has_one_record_per_input_with_fields);
	RUN(test_formats__tiny_negative_numbers_print_as_zero);
	RUN(test_formats__sdf_output_loads_back);
	RUN(test_formats__sd_detected_by_content_and_checked);
	RUN(test_formats__threads_give_the_same_output_as_one);
	return harness_done();
}
