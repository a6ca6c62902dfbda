/* SPDX-License-Identifier: MIT */
/* test_golden.c: the golden cases of tests/golden.tsv through the library (pred_predict). */
#include <stdlib.h>

#include "golden_table.h"
#include "harness.h"
#include "predictor.h"

static void run_case(pred_worker *w, const pred_options *opt, const golden_case *c)
{
	pred_result *r = NULL;
	pred_error e = {0};
	golden_site sites[64];
	size_t n = 0;
	if (pred_predict(&r, w, c->smiles, PRED_FMT_SMILES, opt, &e) < 0) {
		harness_checks++, harness_failures++;
		fprintf(stderr, "golden.tsv:%d %s: %s\n", c->line, c->name, e.msg);
		return;
	}
	for (size_t i = 0; i < pred_result_site_count(r) && n < 64; i++, n++) {
		const pred_site *s = pred_result_site(r, i);
		sites[n] = (golden_site){s->atom, s->kind == PRED_BASE ? "base" : "acid", s->group,
					 s->pka};
	}
	golden_check(c, sites, n);
	pred_result_free(r);
}

static void test_golden__library_meets_the_handbook_cases(void)
{
	golden_case *cases;
	size_t n = golden_load(&cases);
	pred_model *m = NULL;
	pred_worker *w = NULL;
	pred_error e = {0};
	pred_options opt;
	CHECK(n >= 20);
	pred_options_init(&opt);
	if (pred_global_init(&e) < 0 || pred_model_load(&m, NULL, &e) < 0 ||
	    pred_worker_new(&w, m, &e) < 0) {
		fprintf(stderr, "setup: %s\n", e.msg);
		harness_failures++;
		goto done;
	}
	for (size_t i = 0; i < n; i++)
		run_case(w, &opt, &cases[i]);
done:
	pred_worker_free(w);
	pred_model_free(m);
	free(cases);
}

int main(void)
{
	RUN(test_golden__library_meets_the_handbook_cases);
	return harness_done();
}
