/* SPDX-License-Identifier: MIT */
/* predict_job.c: runs molecules of a request through the result cache and the workers. */
#include "predict_job.h"

#include <stdlib.h>
#include <string.h>

#include "cache.h"
#include "json_result.h"

static char *dup_text(const char *s)
{
	size_t n = strlen(s) + 1;
	char *d = malloc(n);
	if (d)
		memcpy(d, s, n);
	return d;
}

/* A fixed answer when even encoding ran out of memory. */
static char *oom_json(void)
{
	return dup_text("{\"error\":{\"code\":\"out_of_memory\",\"message\":\"out of memory\"}}");
}

void srv_job_run(srv_job *j, pred_worker *w)
{
	pred_result *r = NULL;
	pred_error err = {0, ""};
	char *line;

	j->code = pred_predict(&r, w, j->input, PRED_FMT_SMILES, j->opt, &err);
	if (j->code < 0)
		err.code = j->code;
	if (j->code == 0) {
		j->json = srv_result_text(r, NULL, j->input);
	} else {
		line = srv_json_line(srv_error_json(NULL, j->input, &err));
		j->json = line ? dup_text(line) : NULL;
		cJSON_free(line);
	}
	if (!j->json)
		j->json = oom_json();
	pred_result_free(r);
}

void srv_run_init(srv_run *run, srv_service *svc, double ph, int curves)
{
	memset(run, 0, sizeof *run);
	run->svc = svc;
	srv_service_options(&run->opt, svc, ph, curves);
	run->window = svc->pool ? 2 * (size_t)srv_pool_threads(svc->pool) : 1;
	srv_batch_init(&run->batch);
}

void srv_run_destroy(srv_run *run)
{
	srv_batch_destroy(&run->batch);
}

/* Every option that changes the answer is part of the key (see cache.h). */
static char *cache_key(const char *input, const pred_options *o)
{
	srv_buf b = {0};
	srv_buf_printf(&b, "%.6g|%d|%.6g|%d|%.6g|", o->ph, o->curves, o->curve_step,
		       o->max_heavy_atoms, o->max_seconds);
	srv_buf_puts(&b, input);
	return srv_buf_take(&b);
}

/* Timeouts and internal failures may not repeat: only stable answers are kept. */
static int is_cacheable(int code)
{
	return code == 0 || code == PRED_EPARSE || code == PRED_ELIMIT ||
	       code == PRED_EUNSUPPORTED;
}

/* A cache value is the status code, one space, then the JSON text. */
static int cache_lookup(srv_cache *c, srv_job *j)
{
	char *v = srv_cache_get(c, j->key), *json;

	if (!v)
		return 0;
	j->code = (int)strtol(v, &json, 10);
	j->json = dup_text(json + 1);
	free(v);
	return j->json != NULL;
}

static void cache_store(srv_cache *c, const srv_job *j)
{
	srv_buf b = {0};
	char *v;

	srv_buf_printf(&b, "%d ", j->code);
	srv_buf_puts(&b, j->json);
	v = srv_buf_take(&b);
	if (v)
		srv_cache_put(c, j->key, v);
	free(v);
}

int srv_run_start(srv_run *run, srv_job *j)
{
	srv_service *svc = run->svc;

	j->opt = &run->opt;
	j->batch = &run->batch;
	j->key = cache_key(j->input, &run->opt);
	if (j->key && svc->cache && cache_lookup(svc->cache, j)) {
		j->cached = 1;
		j->done = 1;
		return 0;
	}
	if (srv_pool_submit(svc->pool, j, run->admitted) < 0) {
		j->done = 1;
		return -1;
	}
	run->admitted = 1;
	return 0;
}

void srv_run_finish(srv_run *run, srv_job *j)
{
	srv_job_wait(j);
	if (!j->json)
		return; /* refused by a full queue */
	if (!j->cached && j->key && run->svc->cache && is_cacheable(j->code))
		cache_store(run->svc->cache, j);
}

void srv_job_clear(srv_job *j)
{
	free(j->key);
	free(j->json);
	j->key = j->json = NULL;
}

void srv_job_append(srv_buf *b, const srv_job *j, const char *id)
{
	char *clean, *esc = NULL;

	if (!j->json) {
		b->oom = 1;
		return;
	}
	if (!id || j->json[0] != '{') {
		srv_buf_puts(b, j->json);
		return;
	}
	clean = srv_utf8_clean(id, strlen(id));
	if (clean) {
		cJSON *s = cJSON_CreateString(clean);
		esc = s ? cJSON_PrintUnformatted(s) : NULL;
		cJSON_Delete(s);
	}
	free(clean);
	if (!esc) {
		b->oom = 1;
		return;
	}
	srv_buf_printf(b, "{\"id\":%s%s", esc, j->json[1] == '}' ? "" : ",");
	srv_buf_puts(b, j->json + 1);
	cJSON_free(esc);
}
