/* SPDX-License-Identifier: MIT */
/* test_records.c: the record reader and the JSON helpers of server/, without the predictor. */
#include <cjson/cJSON.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "json_result.h"
#include "record_reader.h"

/* Reads every record of text; returns the count, records in recs (caller frees). */
static size_t read_all(const char *text, size_t len, const char *name, srv_input_format fmt,
		       srv_record **recs, size_t max, srv_input_format *seen)
{
	FILE *f = fmemopen((void *)text, len, "rb");
	srv_reader *rd = NULL;
	pred_error e = {0};
	size_t n = 0;
	CHECK(f != NULL);
	CHECK(srv_reader_new(&rd, f, name, fmt, 1, &e) == 0);
	if (rd && seen)
		*seen = srv_reader_format(rd);
	while (rd && n < max && srv_reader_next(&recs[n], rd, &e) > 0)
		n++;
	srv_reader_free(rd);
	if (f)
		fclose(f);
	return n;
}

static void free_all(srv_record **recs, size_t n)
{
	for (size_t i = 0; i < n; i++)
		srv_record_free(recs[i]);
}

static void test_records__smiles_lines_skip_blanks_and_comments(void)
{
	static const char in[] = "CCO ethanol\r\n\n# note\n \t\nc1ccccc1\n  CC(=O)O  acetic acid \nC";
	srv_record *r[8];
	srv_input_format seen;
	size_t n = read_all(in, sizeof in - 1, NULL, SRV_IN_AUTO, r, 8, &seen);
	CHECK_INT_EQ(seen, SRV_IN_SMILES);
	CHECK_INT_EQ(n, 4);
	if (n == 4) {
		CHECK_STR_EQ(r[0]->text, "CCO");
		CHECK_STR_EQ(r[0]->id, "ethanol");
		CHECK_STR_EQ(r[1]->id, "2");
		CHECK_STR_EQ(r[2]->text, "CC(=O)O");
		CHECK_STR_EQ(r[2]->id, "acetic acid");
		CHECK_STR_EQ(r[3]->text, "C");
		CHECK_INT_EQ(r[3]->number, 4);
		CHECK(r[0]->raw == NULL && r[0]->err.code == 0);
	}
	free_all(r, n);
}

static const char two_sd[] = "first\n  prog\n\n  1  0  0  0  0  0  0  0  0  0999 V2000\n"
			     "    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
			     "M  END\n> <NAME>\nmethane\n\n$$$$\n"
			     "\n  prog\n\n  1  0  0  0  0  0  0  0  0  0999 V2000\n"
			     "    0.0000    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
			     "M  END\n";

/* Detected by content; the second record has a blank title (its number is the id) and no
 * closing "$$$$"; the data fields stay in raw but not in the mol block. */
static void test_records__sd_records_by_content(void)
{
	srv_record *r[4];
	srv_input_format seen;
	size_t n = read_all(two_sd, sizeof two_sd - 1, NULL, SRV_IN_AUTO, r, 4, &seen);
	CHECK_INT_EQ(seen, SRV_IN_SDF);
	CHECK_INT_EQ(n, 2);
	if (n == 2) {
		CHECK_STR_EQ(r[0]->id, "first");
		CHECK_INT_EQ(r[0]->fmt, PRED_FMT_MOLBLOCK);
		CHECK(strstr(r[0]->text, "M  END\n") && !strstr(r[0]->text, "NAME"));
		CHECK(r[0]->raw && strstr(r[0]->raw, "> <NAME>\nmethane\n"));
		CHECK_STR_EQ(r[1]->id, "2");
		CHECK(r[1]->err.code == 0);
	}
	free_all(r, n);
}

static void test_records__extension_and_option_choose_the_format(void)
{
	static const char in[] = "CCO\nCCN\n";
	srv_record *r[4];
	srv_input_format seen;
	size_t n = read_all(two_sd, sizeof two_sd - 1, "set.smi", SRV_IN_AUTO, r, 4, &seen);
	CHECK_INT_EQ(seen, SRV_IN_SMILES);
	free_all(r, n);
	n = read_all(in, sizeof in - 1, "in.sdf", SRV_IN_AUTO, r, 4, &seen);
	CHECK_INT_EQ(seen, SRV_IN_SDF);
	CHECK_INT_EQ(n, 1);
	CHECK(n == 1 && r[0]->err.code == PRED_EPARSE); /* no "M  END" */
	free_all(r, n);
	n = read_all(in, sizeof in - 1, "in.sdf", SRV_IN_SMILES, r, 4, &seen);
	CHECK_INT_EQ(n, 2);
	free_all(r, n);
}

static void test_records__over_long_line_is_one_error_record(void)
{
	size_t big = SRV_MAX_LINE + 10;
	char *in = malloc(big + 16);
	srv_record *r[4];
	memset(in, 'C', big);
	memcpy(in + big, "\nCCO next\n", 10);
	size_t n = read_all(in, big + 10, NULL, SRV_IN_SMILES, r, 4, NULL);
	CHECK_INT_EQ(n, 2);
	if (n == 2) {
		CHECK_INT_EQ(r[0]->err.code, PRED_ELIMIT);
		CHECK(strlen(r[0]->text) < 200);
		CHECK_STR_EQ(r[1]->id, "next");
		CHECK_INT_EQ(r[1]->number, 2);
	}
	free_all(r, n);
	free(in);
}

static void test_records__utf8_clean_replaces_bad_bytes(void)
{
	static const char in[] = "a\xc3\xa9\xc0\xaf\xed\xa0\x80z\0y";
	char *s = srv_utf8_clean(in, sizeof in - 1);
	/* é kept; overlong C0 AF and surrogate ED A0 80 replaced byte by byte; NUL -> U+2400 */
	CHECK_STR_EQ(s, "a\xc3\xa9\xef\xbf\xbd\xef\xbf\xbd\xef\xbf\xbd\xef\xbf\xbd\xef\xbf\xbd"
			"z\xe2\x90\x80y");
	free(s);
}

static void test_records__non_finite_numbers_become_null_with_a_warning(void)
{
	cJSON *o = cJSON_CreateObject(), *w = cJSON_CreateArray();
	char *line;
	srv_json_add_number(o, "pka", NAN, 2, w);
	srv_json_add_number(o, "charge", INFINITY, 3, w);
	srv_json_add_number(o, "fraction", 0.123456, 4, w);
	srv_json_add_number(o, "zero", -0.0001, 2, w);
	cJSON_AddItemToObject(o, "warnings", w);
	line = srv_json_line(o);
	CHECK_STR_EQ(line, "{\"pka\":null,\"charge\":null,\"fraction\":0.1235,\"zero\":0,"
			   "\"warnings\":[\"non-finite value of 'pka' encoded as null\","
			   "\"non-finite value of 'charge' encoded as null\"]}");
	cJSON_free(line);
}

static void test_records__error_body_without_id_is_the_daemon_form(void)
{
	pred_error e = {PRED_EPARSE, "unexpected character ',' at position 3"};
	char *line = srv_json_line(srv_error_json(NULL, NULL, &e));
	CHECK_STR_EQ(line, "{\"error\":{\"code\":\"invalid_smiles\",\"message\":"
			   "\"unexpected character ',' at position 3\"}}");
	cJSON_free(line);
}

int main(void)
{
	RUN(test_records__smiles_lines_skip_blanks_and_comments);
	RUN(test_records__sd_records_by_content);
	RUN(test_records__extension_and_option_choose_the_format);
	RUN(test_records__over_long_line_is_one_error_record);
	RUN(test_records__utf8_clean_replaces_bad_bytes);
	RUN(test_records__non_finite_numbers_become_null_with_a_warning);
	RUN(test_records__error_body_without_id_is_the_daemon_form);
	return harness_done();
}
