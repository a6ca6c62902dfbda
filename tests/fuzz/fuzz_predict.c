/* SPDX-License-Identifier: MIT */
/* fuzz_predict.c: libFuzzer target over the record reader, pred_predict and every output
 * format. The first byte picks the path: 0 one SMILES, 1 one mol block, else the bytes are
 * an input file read record by record (format detected as for `pkad predict`).
 * Build and run (see tests/fuzz/README.md):
 *   CC=clang CXX=clang++ cmake -S . -B build-fuzz -DFUZZ=ON -DSANITIZE=ON
 *   cmake --build build-fuzz --target fuzz_predict
 *   build-fuzz/tests/fuzz/fuzz_predict -max_total_time=120 -max_len=4096 -timeout=20 \
 *     -dict=tests/fuzz/smiles.dict tests/fuzz/corpus */
#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "output_formats.h"
#include "predictor.h"
#include "record_reader.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

/* The model and one worker live for the whole fuzzing process (loaded on first call). */
static pred_worker *fuzz_worker(void)
{
	static pred_model *m;
	static pred_worker *w;
	pred_error e = {0};
	if (w)
		return w;
	if (pred_global_init(&e) < 0 || pred_model_load(&m, NULL, &e) < 0 ||
	    pred_worker_new(&w, m, &e) < 0) {
		fprintf(stderr, "fuzz_predict: %s\n", e.msg);
		abort();
	}
	return w;
}

/* Predicts one record and renders it in every format, as the CLI would. */
static void predict_record(pred_worker *w, const srv_record *rec)
{
	pred_options opt;
	pred_result *r = NULL;
	pred_error e = rec->err;
	pred_options_init(&opt);
	opt.max_seconds = 2;
	if (!rec->err.code && pred_predict(&r, w, rec->text, rec->fmt, &opt, &e) < 0)
		r = NULL;
	for (int f = SRV_OUT_JSONL; f <= SRV_OUT_SDF; f++)
		free(srv_output_render((srv_output_format)f, rec, r, &e, opt.ph));
	pred_result_free(r);
}

static void read_all(pred_worker *w, const uint8_t *data, size_t size)
{
	FILE *f = fmemopen((void *)data, size, "rb");
	srv_reader *rd = NULL;
	srv_record *rec = NULL;
	pred_error e = {0};
	if (!f)
		return;
	if (srv_reader_new(&rd, f, NULL, SRV_IN_AUTO, 1, &e) == 0)
		while (srv_reader_next(&rec, rd, &e) > 0) {
			predict_record(w, rec);
			srv_record_free(rec);
		}
	srv_reader_free(rd);
	fclose(f);
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
	pred_worker *w = fuzz_worker();
	char *text;
	if (size < 2)
		return 0;
	if (data[0] > 1) {
		read_all(w, data + 1, size - 1);
		return 0;
	}
	/* one molecule, given straight to the library as a C string */
	text = malloc(size);
	memcpy(text, data + 1, size - 1);
	text[size - 1] = '\0';
	srv_record rec = {1, data[0] ? PRED_FMT_MOLBLOCK : PRED_FMT_SMILES, text, (char *)"f",
			  NULL, {0, ""}};
	predict_record(w, &rec);
	free(text);
	return 0;
}
