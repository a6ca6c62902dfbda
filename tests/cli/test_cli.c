/* SPDX-License-Identifier: MIT */
/* test_cli.c: `pkad predict` end to end: options, exit codes, JSON lines, hostile input. */
#include <cjson/cJSON.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cli/cli_run.h"
#include "harness.h"

/* Runs `pkad predict args...` on text; returns the parsed JSON lines (n of them). */
static cJSON **predict_json(const char *const *args, const char *text, size_t len,
			    size_t *n, int *status)
{
	cli_out o;
	char **lines;
	cJSON **objs;
	*n = 0;
	*status = -1;
	if (cli_run(&o, args, text, len) < 0)
		return NULL;
	*status = o.status;
	lines = cli_lines(o.out, n);
	objs = calloc(*n ? *n : 1, sizeof *objs);
	for (size_t i = 0; objs && lines && i < *n; i++) {
		objs[i] = cJSON_Parse(lines[i]);
		if (!objs[i])
			fprintf(stderr, "line %zu is not JSON: %.200s\n", i + 1, lines[i]);
	}
	free(lines);
	cli_out_free(&o);
	return objs;
}

static void free_objs(cJSON **objs, size_t n)
{
	for (size_t i = 0; objs && i < n; i++)
		cJSON_Delete(objs[i]);
	free(objs);
}

static const char *str_of(const cJSON *o, const char *key)
{
	const cJSON *v = cJSON_GetObjectItemCaseSensitive(o, key);
	return cJSON_IsString(v) ? v->valuestring : NULL;
}

static const char *error_code(const cJSON *o)
{
	return str_of(cJSON_GetObjectItemCaseSensitive(o, "error"), "code");
}

static const char *const predict[] = {"predict", NULL};

static void test_cli__help_goes_to_stdout_and_exits_0(void)
{
	const char *const args[] = {"predict", "--help", NULL};
	cli_out o;
	CHECK(cli_run(&o, args, "", 0) == 0);
	CHECK_INT_EQ(o.status, 0);
	CHECK(o.out && strstr(o.out, "usage: pkad predict"));
	CHECK(o.out && strstr(o.out, "--ph"));
	cli_out_free(&o);
}

static void check_usage_error(const char *opt, const char *value)
{
	const char *const args[] = {"predict", opt, value, NULL};
	cli_out o;
	CHECK(cli_run(&o, args, "CCO\n", 4) == 0);
	if (o.status != 2)
		fprintf(stderr, "option %s %s: status %d\n", opt, value ? value : "", o.status);
	CHECK_INT_EQ(o.status, 2);
	CHECK(o.len == 0);
	CHECK(o.err && strstr(o.err, "usage: pkad predict"));
	cli_out_free(&o);
}

static void test_cli__bad_options_exit_2_with_usage_on_stderr(void)
{
	check_usage_error("--bad-option", NULL);
	check_usage_error("--ph", "17");
	check_usage_error("--ph", "-2.5");
	check_usage_error("--ph", "7.4x");
	check_usage_error("--ph", "nan");
	check_usage_error("--format", "xml");
	check_usage_error("--threads", "-1");
	check_usage_error("--threads", "1.5");
	check_usage_error("--max-atoms", "0");
	check_usage_error("--timeout", "0");
	check_usage_error("--format-in", "pdb");
}

static void test_cli__version_matches_top_level(void)
{
	const char *const a1[] = {"predict", "--version", NULL}, *const a2[] = {"--version", NULL};
	cli_out o1, o2;
	CHECK(cli_run(&o1, a1, "", 0) == 0 && cli_run(&o2, a2, "", 0) == 0);
	CHECK_INT_EQ(o1.status, 0);
	CHECK(o1.out && !strncmp(o1.out, "pkad ", 5));
	CHECK_STR_EQ(o1.out, o2.out);
	cli_out_free(&o1);
	cli_out_free(&o2);
}

/* Blank and comment lines are not records; ids come from the ID column, else the number. */
static void test_cli__one_line_per_record_in_order_with_ids(void)
{
	static const char in[] = "c1ccccc1O phenol\n\n# a comment\n   \nCC(=O)O\n"
				 "C1CC broken ring\r\nCCN\tethylamine, free base\n";
	static const char *const ids[] = {"phenol", "2", "broken ring", "ethylamine, free base"};
	static const char *const inputs[] = {"c1ccccc1O", "CC(=O)O", "C1CC", "CCN"};
	size_t n;
	int status;
	cJSON **objs = predict_json(predict, in, sizeof in - 1, &n, &status);
	CHECK_INT_EQ(n, 4);
	CHECK_INT_EQ(status, 1);
	for (size_t i = 0; objs && i < n && i < 4; i++) {
		CHECK(objs[i] != NULL);
		CHECK_STR_EQ(str_of(objs[i], "id"), ids[i]);
		CHECK_STR_EQ(str_of(objs[i], "input"), inputs[i]);
	}
	if (objs && n == 4) {
		CHECK_STR_EQ(error_code(objs[2]), "invalid_smiles");
		CHECK(str_of(cJSON_GetObjectItem(objs[2], "error"), "message") != NULL);
		CHECK(cJSON_GetObjectItem(objs[2], "sites") == NULL);
		CHECK(error_code(objs[0]) == NULL && error_code(objs[3]) == NULL);
	}
	free_objs(objs, n);
}

static void test_cli__all_good_records_exit_0(void)
{
	static const char in[] = "c1ccccc1O\nCC(=O)O\nCCN\nC\n";
	size_t n;
	int status;
	cJSON **objs = predict_json(predict, in, sizeof in - 1, &n, &status);
	CHECK_INT_EQ(n, 4);
	CHECK_INT_EQ(status, 0);
	free_objs(objs, n);
}

/* The terms are the explanation: they must add up to the site's pKa (each is rounded to
 * 2 decimals, so allow 0.005 per term plus the pKa's own rounding). */
static void check_site(const cJSON *s)
{
	const cJSON *terms = cJSON_GetObjectItem(s, "terms"), *t;
	const char *kind = str_of(s, "kind"), *conf = str_of(s, "confidence");
	double sum = 0, pka = cJSON_GetNumberValue(cJSON_GetObjectItem(s, "pka"));
	int n_terms = 0;
	CHECK(cJSON_IsNumber(cJSON_GetObjectItem(s, "atom")));
	CHECK(str_of(s, "element") && str_of(s, "group"));
	CHECK(kind && (!strcmp(kind, "acid") || !strcmp(kind, "base")));
	CHECK(conf && (!strcmp(conf, "high") || !strcmp(conf, "medium") || !strcmp(conf, "low")));
	CHECK(isfinite(pka));
	CHECK(cJSON_GetNumberValue(cJSON_GetObjectItem(s, "uncertainty")) > 0);
	CHECK(cJSON_IsArray(terms) && cJSON_GetArraySize(terms) > 0);
	cJSON_ArrayForEach(t, terms)
	{
		CHECK(str_of(t, "term") && str_of(t, "detail"));
		sum += cJSON_GetNumberValue(cJSON_GetObjectItem(t, "value"));
		n_terms++;
	}
	CHECK_NEAR(sum, pka, 0.005 * (n_terms + 1) + 1e-9);
}

static void check_result_shape(const cJSON *o)
{
	const cJSON *sites = cJSON_GetObjectItem(o, "sites"), *s;
	const cJSON *at = cJSON_GetObjectItem(o, "at_ph");
	CHECK(str_of(o, "smiles") != NULL);
	CHECK(cJSON_IsArray(sites));
	CHECK(cJSON_IsArray(cJSON_GetObjectItem(o, "macro_pka")));
	CHECK(cJSON_IsArray(cJSON_GetObjectItem(o, "warnings")));
	CHECK(cJSON_IsArray(cJSON_GetObjectItem(o, "notes")));
	CHECK(cJSON_IsObject(at) && cJSON_IsNumber(cJSON_GetObjectItem(at, "charge")));
	CHECK(cJSON_IsArray(cJSON_GetObjectItem(at, "species")));
	cJSON_ArrayForEach(s, sites) check_site(s);
}

/* Phenol written O-last: the site is the O, atom 6 in input order (DESIGN.md: "atom" is
 * the 0-based index in the input SMILES). */
static void test_cli__sites_carry_input_atom_index_and_terms(void)
{
	static const char in[] = "c1ccccc1O\n";
	size_t n;
	int status;
	cJSON **objs = predict_json(predict, in, sizeof in - 1, &n, &status);
	const cJSON *site = NULL, *s;
	CHECK_INT_EQ(n, 1);
	if (!objs || n != 1 || !objs[0])
		goto done;
	check_result_shape(objs[0]);
	cJSON_ArrayForEach(s, cJSON_GetObjectItem(objs[0], "sites")) if (
		!strcmp(str_of(s, "group") ? str_of(s, "group") : "", "phenol")) site = s;
	CHECK(site != NULL);
	if (site) {
		CHECK_INT_EQ(cJSON_GetObjectItem(site, "atom")->valueint, 6);
		CHECK_STR_EQ(str_of(site, "element"), "O");
		CHECK_STR_EQ(str_of(site, "kind"), "acid");
	}
done:
	free_objs(objs, n);
}

/* The at_ph block follows --ph; species are ordered, at least the dominant one. */
static void test_cli__ph_option_sets_the_species_block(void)
{
	const char *const args[] = {"predict", "--ph", "3", NULL};
	static const char in[] = "CC(=O)O acetic\n";
	size_t n;
	int status;
	cJSON **objs = predict_json(args, in, sizeof in - 1, &n, &status);
	const cJSON *at = objs && n == 1 ? cJSON_GetObjectItem(objs[0], "at_ph") : NULL;
	const cJSON *sp = cJSON_GetObjectItem(at, "species"), *s;
	double prev = 2.0;
	CHECK(at != NULL);
	CHECK_NEAR(cJSON_GetNumberValue(cJSON_GetObjectItem(at, "ph")), 3.0, 1e-9);
	CHECK(cJSON_GetArraySize(sp) >= 1);
	cJSON_ArrayForEach(s, sp)
	{
		double f = cJSON_GetNumberValue(cJSON_GetObjectItem(s, "fraction"));
		CHECK(str_of(s, "smiles") != NULL);
		CHECK(f > 0 && f <= 1 && f <= prev);
		prev = f;
	}
	free_objs(objs, n);
}

static void test_cli__curves_have_matching_lengths(void)
{
	const char *const args[] = {"predict", "--curves", NULL};
	static const char in[] = "NCC(=O)O glycine\n";
	size_t n;
	int status;
	cJSON **objs = predict_json(args, in, sizeof in - 1, &n, &status);
	const cJSON *c = objs && n == 1 ? cJSON_GetObjectItem(objs[0], "curves") : NULL, *f;
	int np = cJSON_GetArraySize(cJSON_GetObjectItem(c, "ph"));
	CHECK(c != NULL);
	CHECK(np > 10);
	CHECK_INT_EQ(cJSON_GetArraySize(cJSON_GetObjectItem(c, "charge")), np);
	CHECK(cJSON_GetArraySize(cJSON_GetObjectItem(c, "fractions")) >= 1);
	cJSON_ArrayForEach(f, cJSON_GetObjectItem(c, "fractions"))
	{
		CHECK(cJSON_IsNumber(cJSON_GetObjectItem(f, "charge")));
		CHECK_INT_EQ(cJSON_GetArraySize(cJSON_GetObjectItem(f, "fraction")), np);
	}
	free_objs(objs, n);
}

/* Each hostile line is answered by an error object; the records around it are unharmed. */
static void test_cli__hostile_lines_get_errors_and_the_run_goes_on(void)
{
	size_t big = 300 * 1024, huge_smiles = 100 * 1000, cap = big + huge_smiles + 256;
	char *in = malloc(cap);
	size_t len = 0, n;
	int status;
	if (!in)
		return;
	len += (size_t)sprintf(in + len, "CCO first\n");
	memset(in + len, 'C', big), len += big, in[len++] = '\n';           /* over-long line */
	memcpy(in + len, "CC\0O nul\n", 9), len += 9;                       /* NUL byte */
	memcpy(in + len, "\xff\xfe\x01\x80garbage \xc3\n", 14), len += 14; /* binary */
	memset(in + len, 'C', huge_smiles), len += huge_smiles, in[len++] = '\n';
	len += (size_t)sprintf(in + len, "CCO last\n");
	cJSON **objs = predict_json(predict, in, len, &n, &status);
	CHECK_INT_EQ(n, 6);
	CHECK_INT_EQ(status, 1);
	if (objs && n == 6) {
		for (size_t i = 0; i < n; i++)
			CHECK(objs[i] != NULL);
		CHECK_STR_EQ(str_of(objs[0], "id"), "first");
		CHECK_STR_EQ(error_code(objs[1]), "too_many_atoms");
		CHECK(error_code(objs[2]) != NULL);
		CHECK(error_code(objs[3]) != NULL);
		CHECK_STR_EQ(error_code(objs[4]), "too_many_atoms");
		CHECK_STR_EQ(str_of(objs[5], "id"), "last");
		CHECK(error_code(objs[5]) == NULL);
	}
	free_objs(objs, n);
	free(in);
}

/* --max-atoms bounds the heavy atoms: benzoic acid has 9, methane 1. */
static void test_cli__max_atoms_rejects_larger_molecules(void)
{
	const char *const args[] = {"predict", "--max-atoms", "5", NULL};
	static const char in[] = "OC(=O)c1ccccc1 benzoic\nC methane\n";
	size_t n;
	int status;
	cJSON **objs = predict_json(args, in, sizeof in - 1, &n, &status);
	CHECK_INT_EQ(n, 2);
	CHECK_INT_EQ(status, 1);
	if (objs && n == 2) {
		CHECK_STR_EQ(error_code(objs[0]), "too_many_atoms");
		CHECK(error_code(objs[1]) == NULL);
	}
	free_objs(objs, n);
}

/* Files are read in turn ("-" is stdin) and the record numbers run on across them. */
static void test_cli__several_files_number_records_across_files(void)
{
	static const char a[] = "CCO\nCCN named\n", b[] = "# only a comment\nCC(=O)O\n";
	char *pa = cli_temp_file(a, sizeof a - 1);
	const char *const args[] = {"predict", pa ? pa : "missing", "-", NULL};
	static const char *const ids[] = {"1", "named", "3"};
	size_t n = 0;
	int status;
	cJSON **objs = pa ? predict_json(args, b, sizeof b - 1, &n, &status) : NULL;
	CHECK_INT_EQ(n, 3);
	for (size_t i = 0; objs && i < n && i < 3; i++)
		CHECK_STR_EQ(str_of(objs[i], "id"), ids[i]);
	free_objs(objs, n);
	if (pa)
		unlink(pa);
	free(pa);
}

static void test_cli__missing_fragments_dir_fails_cleanly(void)
{
	const char *const args[] = {"predict", "--fragments", "no-such-dir-of-tables", NULL};
	cli_out o;
	CHECK(cli_run(&o, args, "CCO\n", 4) == 0);
	CHECK_INT_EQ(o.status, 1);
	CHECK(o.err && strstr(o.err, "pkad predict: "));
	cli_out_free(&o);
}

/* --fragments with the repository's own tables gives the same answers as the embedded copy. */
static void test_cli__fragments_dir_of_the_repository_matches_embedded(void)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	char dir[4096];
	cli_out a, b;
	if (!src) {
		printf("skip: PKAD_SOURCE_DIR not set\n");
		return;
	}
	snprintf(dir, sizeof dir, "%s/fragments", src);
	const char *const args[] = {"predict", "--fragments", dir, NULL};
	static const char in[] = "c1ccccc1O\nCC(=O)O\nCCN\nc1ccncc1\n";
	CHECK(cli_run(&a, predict, in, sizeof in - 1) == 0);
	CHECK(cli_run(&b, args, in, sizeof in - 1) == 0);
	CHECK_INT_EQ(b.status, a.status);
	CHECK(a.out && b.out && a.len == b.len && !memcmp(a.out, b.out, a.len));
	cli_out_free(&a);
	cli_out_free(&b);
}

int main(void)
{
	RUN(test_cli__help_goes_to_stdout_and_exits_0);
	RUN(test_cli__bad_options_exit_2_with_usage_on_stderr);
	RUN(test_cli__version_matches_top_level);
	RUN(test_cli__one_line_per_record_in_order_with_ids);
	RUN(test_cli__all_good_records_exit_0);
	RUN(test_cli__sites_carry_input_atom_index_and_terms);
	RUN(test_cli__ph_option_sets_the_species_block);
	RUN(test_cli__curves_have_matching_lengths);
	RUN(test_cli__hostile_lines_get_errors_and_the_run_goes_on);
	RUN(test_cli__max_atoms_rejects_larger_molecules);
	RUN(test_cli__several_files_number_records_across_files);
	RUN(test_cli__missing_fragments_dir_fails_cleanly);
	RUN(test_cli__fragments_dir_of_the_repository_matches_embedded);
	return harness_done();
}
