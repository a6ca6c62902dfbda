/* SPDX-License-Identifier: MIT */
/* test_cli_golden.c: the golden cases of tests/golden.tsv through `pkad predict` (JSON lines). */
#include <cjson/cJSON.h>
#include <stdlib.h>
#include <string.h>

#include "cli/cli_run.h"
#include "golden_table.h"
#include "harness.h"

static void check_line(const golden_case *c, const char *line)
{
	cJSON *j = cJSON_Parse(line), *s;
	golden_site sites[64];
	size_t n = 0;
	if (!j || cJSON_GetObjectItem(j, "error")) {
		harness_checks++, harness_failures++;
		fprintf(stderr, "golden.tsv:%d %s: %.300s\n", c->line, c->name, line);
		cJSON_Delete(j);
		return;
	}
	cJSON_ArrayForEach(s, cJSON_GetObjectItem(j, "sites"))
	{
		if (n == 64)
			break;
		sites[n++] = (golden_site){
			cJSON_GetObjectItem(s, "atom") ? cJSON_GetObjectItem(s, "atom")->valueint : -1,
			cJSON_GetStringValue(cJSON_GetObjectItem(s, "kind")),
			cJSON_GetStringValue(cJSON_GetObjectItem(s, "group")),
			cJSON_GetNumberValue(cJSON_GetObjectItem(s, "pka"))};
	}
	golden_check(c, sites, n);
	cJSON_Delete(j);
}

static void test_golden__cli_meets_the_handbook_cases(void)
{
	golden_case *cases;
	size_t n = golden_load(&cases), len = 0, n_lines = 0;
	char *in = malloc(n * 300 + 1), **lines = NULL;
	const char *const args[] = {"predict", NULL};
	cli_out o = {0};
	CHECK(n >= 20);
	for (size_t i = 0; in && i < n; i++)
		len += (size_t)sprintf(in + len, "%s case%zu\n", cases[i].smiles, i);
	CHECK(in && cli_run(&o, args, in, len) == 0);
	if (o.out)
		lines = cli_lines(o.out, &n_lines);
	CHECK_INT_EQ(n_lines, n);
	for (size_t i = 0; lines && i < n && i < n_lines; i++)
		check_line(&cases[i], lines[i]);
	free(lines);
	cli_out_free(&o);
	free(in);
	free(cases);
}

int main(void)
{
	RUN(test_golden__cli_meets_the_handbook_cases);
	return harness_done();
}
