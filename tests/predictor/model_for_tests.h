/* SPDX-License-Identifier: MIT */
/* model_for_tests.h: loads the model of record for tests (fixture fallback, see below). */
#ifndef PKAD_MODEL_FOR_TESTS_H
#define PKAD_MODEL_FOR_TESTS_H

#include <stdio.h>
#include <stdlib.h>

#include "fragment_table.h"

static char *model_for_tests_read(const char *path)
{
	FILE *f = fopen(path, "rb");
	char *text = f ? calloc(1 << 20, 1) : NULL;
	if (text && fread(text, 1, (1 << 20) - 1, f) == 0) {
		free(text);
		text = NULL;
	}
	if (f)
		fclose(f);
	return text;
}

/* The repository's fragments/; while fragments/sites.tsv has not landed, the engine's
 * fixture tables (tests/predictor/fixture) plus the repository's bases.tsv. NULL with a
 * message on stderr when neither loads. Calls pred_global_init. */
static pred_model *model_for_tests(void)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	char path[4096];
	pred_model *m = NULL;
	pred_error err = {0};
	if (!src || pred_global_init(&err))
		return fprintf(stderr, "PKAD_SOURCE_DIR unset or init failed %s\n", err.msg), NULL;
	snprintf(path, sizeof path, "%s/fragments", src);
	if (pred_model_load(&m, path, &err)) {
		printf("note: %s; using tests/predictor/fixture with fragments/bases.tsv\n",
		       err.msg);
		snprintf(path, sizeof path, "%s/tests/predictor/fixture", src);
		if (pred_model_load(&m, path, &err))
			return fprintf(stderr, "fixture: %s\n", err.msg), NULL;
	}
	if (!m->n_bases) {
		snprintf(path, sizeof path, "%s/fragments/bases.tsv", src);
		char *text = model_for_tests_read(path);
		int rc = text ? base_table_parse(m, text, "fragments/bases.tsv", &err) : -1;
		free(text);
		if (rc) {
			fprintf(stderr, "bases.tsv: %s\n", err.msg);
			pred_model_free(m);
			return NULL;
		}
	}
	return m;
}

#endif
