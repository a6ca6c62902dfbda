/* SPDX-License-Identifier: MIT */
/* test_cli_deprotonate.c: `pkad deprotonate` end to end: output forms, exit codes, messages. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/wait.h>

#include "harness.h"

static char frag_opt[4200]; /* "--fragments DIR " while fragments/sites.tsv has not landed */

static int copy_file(const char *from, const char *to)
{
	char buf[8192];
	size_t n;
	FILE *in = fopen(from, "rb"), *out = in ? fopen(to, "wb") : NULL;
	int ok = in && out;
	while (ok && (n = fread(buf, 1, sizeof buf, in)) > 0)
		ok = fwrite(buf, 1, n, out) == n;
	if (in)
		fclose(in);
	if (out)
		fclose(out);
	return ok ? 0 : -1;
}

/* With no sites table in fragments/ yet, run against the engine's fixture tables plus the
 * repository's bases.tsv, copied into a directory under the working (build) directory. */
static int setup_fragments(const char *src)
{
	char path[4096], to[4096];
	snprintf(path, sizeof path, "%s/fragments/sites.tsv", src);
	FILE *f = fopen(path, "r");
	if (f) {
		fclose(f);
		return 0;
	}
	printf("note: no fragments/sites.tsv yet; using tests/predictor/fixture + bases.tsv\n");
	if (system("mkdir -p deprot-fragments") != 0)
		return -1;
	const char *const files[] = {
	    "tests/predictor/fixture/sites.tsv", "tests/predictor/fixture/substituents.tsv",
	    "tests/predictor/fixture/corrections.tsv", "fragments/bases.tsv"};
	for (size_t i = 0; i < 4; i++) {
		snprintf(path, sizeof path, "%s/%s", src, files[i]);
		snprintf(to, sizeof to, "deprot-fragments/%s", strrchr(files[i], '/') + 1);
		if (copy_file(path, to))
			return -1;
	}
	snprintf(frag_opt, sizeof frag_opt, "--fragments deprot-fragments ");
	return 0;
}

typedef struct run_out {
	int status;
	char out[16384];
	char err[4096];
} run_out;

static void slurp(const char *file, char *buf, size_t n)
{
	FILE *f = fopen(file, "r");
	size_t got = f ? fread(buf, 1, n - 1, f) : 0;
	buf[got] = '\0';
	if (f)
		fclose(f);
}

/* Runs `pkad deprotonate ARGS` with stdin from the text `in` (NULL: /dev/null). */
static void run(run_out *r, const char *args, const char *in)
{
	char cmd[8192];
	FILE *f = fopen("deprot-in.txt", "w");
	if (f) {
		fputs(in ? in : "", f);
		fclose(f);
	}
	snprintf(cmd, sizeof cmd,
	         "\"%s\" deprotonate %s%s <deprot-in.txt >deprot-out.txt "
	         "2>deprot-err.txt",
	         getenv("PKAD_BIN"), frag_opt, args);
	int st = system(cmd);
	r->status = WIFEXITED(st) ? WEXITSTATUS(st) : -1;
	slurp("deprot-out.txt", r->out, sizeof r->out);
	slurp("deprot-err.txt", r->err, sizeof r->err);
}

static void test_cli_deprotonate__text_for_the_bench(void)
{
	run_out r;
	run(&r, "--base NaH CCO", NULL);
	CHECK_INT_EQ(r.status, 0);
	CHECK(strstr(r.out, "complete") != NULL);
	CHECK(strstr(r.out, "hydrogen gas (H2)") != NULL);
	CHECK(strstr(r.out, "reacts violently with water") != NULL);
	CHECK(strstr(r.out, "local rules and institutional safety practice govern") != NULL);
}

static void test_cli_deprotonate__json_lines_from_stdin_in_order(void)
{
	run_out r;
	run(&r, "--base NaHCO3 --format json", "CC(=O)O acetic\nC(\n  CCO\tethanol\n");
	CHECK_INT_EQ(r.status, 1); /* one record failed */
	char *first = strstr(r.out, "\"input\":\"CC(=O)O\""), *bad = strstr(r.out, "\"C(\"");
	char *third = strstr(r.out, "\"input\":\"CCO\"");
	CHECK(first && bad && third && first < bad && bad < third);
	CHECK(strstr(r.out, "\"code\":\"invalid_smiles\"") != NULL);
	CHECK(strstr(r.out, "{\"id\":\"acetic\"") && strstr(r.out, "{\"id\":\"ethanol\""));
	CHECK(strstr(r.out, "\"verdict\":\"complete\"") != NULL);   /* acetic acid */
	CHECK(strstr(r.out, "\"verdict\":\"negligible\"") != NULL); /* ethanol */
}

static void test_cli_deprotonate__list_bases(void)
{
	run_out r;
	run(&r, "--list-bases", NULL);
	CHECK_INT_EQ(r.status, 0);
	CHECK(strstr(r.out, "n-butyllithium") && strstr(r.out, "pyrophoric"));
	run(&r, "--list-bases --format json", NULL);
	CHECK(strstr(r.out, "{\"bases\":[") == r.out);
}

static void expect_error(const char *args, int status, const char *needle)
{
	run_out r;
	run(&r, args, NULL);
	CHECK_INT_EQ(r.status, status);
	if (!strstr(r.err, needle))
		fprintf(stderr, "stderr of '%s': %s", args, r.err);
	CHECK(strstr(r.err, needle) != NULL);
}

static void test_cli_deprotonate__bad_input_exits_nonzero_with_message(void)
{
	expect_error("--base unobtainium CCO", 1, "unknown base 'unobtainium'; known:");
	expect_error("--base NaH CCCC", 1, "no acid site");
	expect_error("--base NaH --equiv 0 CCO", 1, "equivalents must be a number greater than 0");
	expect_error("--base NaH --equiv abc CCO", 2, "--equiv 'abc' is not a number");
	expect_error("--base NaH --atom 0 CCO", 1, "atom 0 is not an acid site");
	expect_error("--base NaH --atom x CCO", 2, "--atom 'x'");
	expect_error("CCO", 2, "--base");
	expect_error("--base NaH --format xml CCO", 2, "--format 'xml'");
}

int main(void)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	if (!src || !getenv("PKAD_BIN") || setup_fragments(src)) {
		fprintf(stderr, "PKAD_SOURCE_DIR / PKAD_BIN not set or fixture copy failed\n");
		return 1;
	}
	RUN(test_cli_deprotonate__text_for_the_bench);
	RUN(test_cli_deprotonate__json_lines_from_stdin_in_order);
	RUN(test_cli_deprotonate__list_bases);
	RUN(test_cli_deprotonate__bad_input_exits_nonzero_with_message);
	return harness_done();
}
