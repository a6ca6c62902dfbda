/* SPDX-License-Identifier: MIT */
/* test_cli_robust.c: thousands of mutated NCI SMILES through `pkad predict`: one JSON line
 * per record, in order, every line parses, no crash. */
#include <cjson/cJSON.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "cli/cli_run.h"
#include "harness.h"

#define NCI_SET "/usr/share/RDKit/Data/NCI/first_5K.smi"
#define N_RECORDS 3000
#define SEED 20261201u

/* xorshift32: a fixed, portable sequence so a failure can be replayed */
static uint32_t rnd(uint32_t *s)
{
	*s ^= *s << 13;
	*s ^= *s >> 17;
	*s ^= *s << 5;
	return *s;
}

typedef struct strbuf {
	char *s;
	size_t len, cap;
} strbuf;

static void sb_put(strbuf *b, const char *s, size_t n)
{
	if (b->len + n + 1 > b->cap) {
		b->cap = (b->len + n + 1) * 2;
		b->s = realloc(b->s, b->cap);
	}
	memcpy(b->s + b->len, s, n);
	b->len += n;
	b->s[b->len] = '\0';
}

/* The SMILES column of the NCI set. */
static size_t load_smiles(char ***out)
{
	size_t len, n = 0;
	char *text = cli_slurp(NCI_SET, &len), **lines;
	*out = NULL;
	if (!text)
		return 0;
	lines = cli_lines(text, &n);
	for (size_t i = 0; i < n; i++)
		lines[i][strcspn(lines[i], " \t\r")] = '\0';
	*out = lines;
	return n;
}

static const char *const bracket_atoms[] = {"[Xx]", "[C+5]", "[2H]", "[nH]", "[O-2]", "[Na+]",
					    "[Fe+3]", "[C@@H]", "[N+]", "[B-]", "[Se]", "[*]",
					    "[Cl-", "[13C]", "[H+]", "[Uuo]"};
static const char noise[] = "()[]=#$@+-%0123456789/\\.:cnosCNOSPFIBrl*~!\x80\xc3\xff";

/* One mutation of s into b; the result is never empty, has no whitespace and does not
 * start with '#' (that would be a comment line, not a record). */
static void mutate(strbuf *b, const char *s, const char *other, uint32_t *st)
{
	size_t n = strlen(s), at = n ? rnd(st) % n : 0;
	char c = noise[rnd(st) % (sizeof noise - 1)];
	const char *atom;
	b->len = 0;
	switch (rnd(st) % 8) {
	case 0: /* delete */
		sb_put(b, s, at), sb_put(b, s + at + (n > 0), n - at - (n > 0));
		break;
	case 1: /* duplicate */
		sb_put(b, s, at + (n > 0)), sb_put(b, s + at, n - at);
		break;
	case 2: /* swap neighbours */
		sb_put(b, s, n);
		if (n > 1 && at + 1 < n)
			b->s[at] = s[at + 1], b->s[at + 1] = s[at];
		break;
	case 3: /* random bracket atom */
		atom = bracket_atoms[rnd(st) % (sizeof bracket_atoms / sizeof bracket_atoms[0])];
		sb_put(b, s, at), sb_put(b, atom, strlen(atom)), sb_put(b, s + at, n - at);
		break;
	case 4: /* truncate */
		sb_put(b, s, at + 1 < n ? at + 1 : n);
		break;
	case 5: /* concatenate */
		sb_put(b, s, n), sb_put(b, other, strlen(other));
		break;
	case 6: /* noise byte */
		sb_put(b, s, at), sb_put(b, &c, 1), sb_put(b, s + at, n - at);
		break;
	default: /* untouched: the run must still answer the valid ones */
		sb_put(b, s, n);
	}
	if (!b->len || b->s[0] == '#')
		sb_put(b, "C", 1), memmove(b->s + 1, b->s, b->len - 1), b->s[0] = 'C';
	for (size_t i = 0; i < b->len; i++)
		if (strchr(" \t\r\n\v\f", b->s[i]) || !b->s[i])
			b->s[i] = 'C';
}

static char *build_input(char **smiles, size_t n_smiles, size_t *len)
{
	strbuf in = {0}, one = {0};
	uint32_t st = SEED;
	char id[32];
	for (size_t k = 0; k < N_RECORDS; k++) {
		const char *s = smiles[rnd(&st) % n_smiles];
		const char *other = smiles[rnd(&st) % n_smiles];
		mutate(&one, s, other, &st);
		if (rnd(&st) % 3 == 0) { /* a second mutation now and then */
			char *first = strcpy(malloc(one.len + 1), one.s);
			mutate(&one, first, other, &st);
			free(first);
		}
		snprintf(id, sizeof id, " r%zu\n", k + 1);
		sb_put(&in, one.s, one.len);
		sb_put(&in, id, strlen(id));
	}
	free(one.s);
	*len = in.len;
	return in.s;
}

static void check_output(const cli_out *o)
{
	size_t n = 0, errors = 0;
	char **lines = cli_lines(o->out, &n);
	char want[32];
	CHECK_INT_EQ(n, N_RECORDS);
	for (size_t i = 0; lines && i < n; i++) {
		cJSON *j = cJSON_Parse(lines[i]);
		const cJSON *err = cJSON_GetObjectItem(j, "error");
		CHECK(j != NULL);
		snprintf(want, sizeof want, "r%zu", i + 1);
		CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(j, "id")), want);
		if (err) {
			CHECK(cJSON_GetStringValue(cJSON_GetObjectItem(err, "code")) != NULL);
			errors++;
		} else {
			CHECK(cJSON_IsArray(cJSON_GetObjectItem(j, "sites")));
		}
		cJSON_Delete(j);
	}
	printf("%zu records, %zu answered with an error\n", n, errors);
	free(lines);
}

static void test_robust__mutated_smiles_get_one_answer_each(void)
{
	char **smiles;
	size_t n_smiles = load_smiles(&smiles), len;
	const char *const args[] = {"predict", "--threads", "2", "--timeout", "5", NULL};
	cli_out o;
	if (!n_smiles) {
		printf("skip: %s not found (Debian package rdkit-data)\n", NCI_SET);
		return;
	}
	char *in = build_input(smiles, n_smiles, &len);
	CHECK(cli_run(&o, args, in, len) == 0);
	CHECK(o.status == 0 || o.status == 1);
	if (o.status > 1)
		fprintf(stderr, "pkad exited with %d: %.500s\n", o.status, o.err ? o.err : "");
	if (o.out)
		check_output(&o);
	cli_out_free(&o);
	free(in);
	free(smiles[0]);
	free(smiles);
}

int main(void)
{
	RUN(test_robust__mutated_smiles_get_one_answer_each);
	return harness_done();
}
