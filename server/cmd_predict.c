/* SPDX-License-Identifier: MIT */
/* cmd_predict.c: `pkad predict`, a filter from SMILES lines or SD records to predictions. */
#include <errno.h>
#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "commands.h"
#include "output_formats.h"
#include "predict_options.h"
#include "progress.h"
#include "predict_pool.h"
#include "predictor.h"
#include "record_reader.h"

/* Records in flight per thread: enough to hide the slow ones, small enough that memory
 * stays flat for any input length. */
#define WINDOW_PER_THREAD 16
#define MAX_THREADS 256

typedef struct run_ctx {
	const srv_predict_opts *o;
	pred_model *model;
	pred_worker **workers;
	size_t n_workers;
	/* input: the named files in turn, or stdin */
	int next_file;
	FILE *f;
	srv_reader *rd;
	const char *name;
	size_t next_number;
	int header_done;
	srv_progress progress;
} run_ctx;

static int open_next(run_ctx *c)
{
	const char *name;
	pred_error e = {0};
	if (c->next_file >= c->o->n_files && (c->o->n_files || c->next_file))
		return 0;
	name = c->o->n_files ? c->o->files[c->next_file] : "-";
	c->next_file++;
	c->f = strcmp(name, "-") ? fopen(name, "rb") : stdin;
	if (!c->f) {
		fprintf(stderr, "pkad predict: cannot open '%s': %s\n", name, strerror(errno));
		return PRED_EINVAL;
	}
	c->name = strcmp(name, "-") ? name : NULL;
	if (srv_reader_new(&c->rd, c->f, c->name, c->o->in, c->next_number, &e) < 0) {
		fprintf(stderr, "pkad predict: %s\n", e.msg);
		return e.code;
	}
	return 1;
}

static void close_current(run_ctx *c)
{
	if (c->rd)
		c->next_number = srv_reader_next_number(c->rd);
	srv_reader_free(c->rd);
	c->rd = NULL;
	if (c->f && c->f != stdin)
		fclose(c->f);
	c->f = NULL;
}

static int read_record(void *arg, srv_record **out)
{
	run_ctx *c = arg;
	for (;;) {
		pred_error e = {0};
		int st;
		if (!c->rd && (st = open_next(c)) <= 0)
			return st;
		st = srv_reader_next(out, c->rd, &e);
		if (st > 0)
			return st;
		if (st < 0) {
			fprintf(stderr, "pkad predict: %s: %s\n", c->name ? c->name : "stdin", e.msg);
			return st;
		}
		close_current(c);
	}
}

static char *process_record(void *arg, pred_worker *w, const srv_record *rec, int *failed)
{
	const run_ctx *c = arg;
	pred_result *r = NULL;
	pred_error e = {0};
	int rc = rec->err.code;
	char *text;
	if (rc)
		e = rec->err;
	else
		rc = pred_predict(&r, w, rec->text, rec->fmt, &c->o->pred, &e);
	if (rc && !e.code)
		e.code = rc;
	*failed = rc != 0;
	text = srv_output_render(c->o->out, rec, rc ? NULL : r, &e, c->o->pred.ph);
	pred_result_free(r);
	return text;
}

static int emit_record(void *arg, const srv_record *rec, const char *text, int failed)
{
	run_ctx *c = arg;
	char *fallback = NULL;
	if (!text) {
		/* the worker ran out of memory rendering: answer the record rather than drop it */
		pred_error e = {PRED_ENOMEM, "out of memory"};
		text = fallback = srv_output_render(c->o->out, rec, NULL, &e, c->o->pred.ph);
		if (!text) {
			fprintf(stderr, "pkad predict: out of memory at record %zu\n", rec->number);
			return PRED_ENOMEM;
		}
	}
	if (!c->header_done) {
		fputs(srv_output_header(c->o->out), stdout);
		c->header_done = 1;
	}
	fputs(text, stdout);
	free(fallback);
	srv_progress_tick(&c->progress, failed);
	if (ferror(stdout)) {
		fprintf(stderr, "pkad predict: write error: %s\n", strerror(errno));
		return PRED_EINTERNAL;
	}
	return 0;
}

static int setup(run_ctx *c)
{
	pred_error e = {0};
	if (pred_global_init(&e) < 0 || pred_model_load(&c->model, c->o->fragments, &e) < 0)
		goto fail;
	c->workers = calloc(c->o->threads, sizeof *c->workers);
	if (!c->workers) {
		snprintf(e.msg, sizeof e.msg, "out of memory");
		goto fail;
	}
	for (; c->n_workers < c->o->threads; c->n_workers++)
		if (pred_worker_new(&c->workers[c->n_workers], c->model, &e) < 0)
			goto fail;
	return 0;
fail:
	fprintf(stderr, "pkad predict: %s\n", e.msg);
	return -1;
}

static void teardown(run_ctx *c)
{
	close_current(c);
	for (size_t i = 0; i < c->n_workers; i++)
		pred_worker_free(c->workers[i]);
	free(c->workers);
	pred_model_free(c->model);
}

static int run(const srv_predict_opts *o)
{
	run_ctx c = {0};
	srv_pool_ops ops = {read_record, process_record, emit_record, &c};
	pred_error e = {0};
	int rc;
	c.o = o;
	c.next_number = 1;
	srv_progress_init(&c.progress, o->progress);
	if (setup(&c) < 0) {
		teardown(&c);
		return 1;
	}
	rc = srv_pool_run(&ops, c.workers, c.n_workers, WINDOW_PER_THREAD * c.n_workers, &e);
	if (!c.header_done)
		fputs(srv_output_header(o->out), stdout);
	if (fflush(stdout) != 0 && !rc) {
		fprintf(stderr, "pkad predict: write error: %s\n", strerror(errno));
		rc = PRED_EINTERNAL;
	}
	srv_progress_end(&c.progress);
	teardown(&c);
	return rc < 0 || c.progress.failed ? 1 : 0;
}

int cmd_predict(int argc, char **argv)
{
	srv_predict_opts o;
	int st = srv_predict_opts_parse(&o, argc, argv);
	if (st >= 0)
		return st;
	if (o.threads == 0) {
		long n = sysconf(_SC_NPROCESSORS_ONLN);
		o.threads = n < 1 ? 1 : n > MAX_THREADS ? MAX_THREADS : (size_t)n;
	}
	return run(&o);
}
