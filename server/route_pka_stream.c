/* SPDX-License-Identifier: MIT */
/* route_pka_stream.c: POST /v1/pka with an NDJSON body, answered one line per record. */
#include <ctype.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "http_errors.h"
#include "json_result.h"
#include "predict_job.h"
#include "route_pka.h"

/* Answers are kept in memory up to this size, then in an unnamed temporary file, because
 * HTTP/1.1 through libmicrohttpd sends no answer before the upload is complete. */
#define SPOOL_MEMORY (1u << 20)

typedef struct slot {
	srv_job job;
	char *input, *id; /* owned copies of the record */
} slot;

struct srv_stream {
	srv_service *svc;
	srv_run run;
	slot *ring;         /* records with the workers, oldest at head */
	size_t head, count;
	srv_buf line;       /* the record read so far */
	int too_long;       /* the current record is over the limit: skip to its end */
	srv_buf mem;        /* answers, until they outgrow SPOOL_MEMORY */
	FILE *spool;        /* then here */
	size_t sent;        /* bytes of mem already read out */
	int records, errors;
	int taken;          /* records read so far */
	int failed;         /* the spool could not be written */
};

/* Appends one answered line to the memory buffer or the spool file. */
static void spool_write(srv_stream *s, const char *text, size_t n)
{
	if (!s->spool && s->mem.len + n > SPOOL_MEMORY) {
		s->spool = tmpfile();
		if (!s->spool || fwrite(s->mem.p, 1, s->mem.len, s->spool) != s->mem.len)
			s->failed = 1;
		srv_buf_free(&s->mem);
	}
	if (s->spool) {
		if (fwrite(text, 1, n, s->spool) != n)
			s->failed = 1;
	} else {
		srv_buf_append(&s->mem, text, n);
	}
}

/* Waits for the oldest record and writes its answer line. */
static void ring_pop(srv_stream *s)
{
	slot *sl = &s->ring[s->head];
	srv_buf b = {0};

	srv_run_finish(&s->run, &sl->job);
	srv_job_append(&b, &sl->job, sl->id);
	srv_buf_puts(&b, "\n");
	if (b.oom)
		s->failed = 1;
	else
		spool_write(s, b.p, b.len);
	srv_buf_free(&b);
	s->records++;
	s->errors += sl->job.code != 0;
	srv_job_clear(&sl->job);
	free(sl->input);
	free(sl->id);
	memset(sl, 0, sizeof *sl);
	s->head = (s->head + 1) % s->run.window;
	s->count--;
}

static char *dup_range(const char *p, size_t n)
{
	char *d = malloc(n + 1);
	if (d) {
		memcpy(d, p, n);
		d[n] = '\0';
	}
	return d;
}

/* A record answered without a worker (it could not be read as a request). */
static void slot_fail(srv_stream *s, slot *sl, const char *msg)
{
	pred_error e = {PRED_EINVAL, ""};
	char *line;

	snprintf(e.msg, sizeof e.msg, "%s", msg);
	line = srv_json_line(srv_error_json(NULL, sl->input, &e));
	sl->job.json = line ? dup_range(line, strlen(line)) : NULL;
	cJSON_free(line);
	if (!sl->job.json)
		s->failed = 1;
	sl->job.code = PRED_EINVAL;
	sl->job.done = 1;
	sl->job.cached = 1; /* never stored in the cache */
	sl->job.batch = &s->run.batch;
}

/* A JSON record {"smiles":..., "id":...}; fills sl or answers it with an error. */
static void record_json(srv_stream *s, slot *sl, const char *p, size_t n)
{
	size_t err_at = 0;
	cJSON *o = srv_json_parse(s->svc, p, n, &err_at);
	const cJSON *smiles = cJSON_GetObjectItemCaseSensitive(o, "smiles");
	const cJSON *id = cJSON_GetObjectItemCaseSensitive(o, "id");
	char msg[128] = "";

	for (const cJSON *c = o ? o->child : NULL; c && !msg[0]; c = c->next)
		if (strcmp(c->string, "smiles") && strcmp(c->string, "id"))
			snprintf(msg, sizeof msg, "unknown field '%.60s'", c->string);
	if (!cJSON_IsObject(o))
		snprintf(msg, sizeof msg, "malformed JSON record near byte %zu", err_at);
	else if (!cJSON_IsString(smiles) && !msg[0])
		snprintf(msg, sizeof msg, "missing string field 'smiles'");
	if (cJSON_IsString(id))
		sl->id = dup_range(id->valuestring, strlen(id->valuestring));
	else if (cJSON_IsNumber(id) && (sl->id = malloc(32)))
		snprintf(sl->id, 32, "%.15g", id->valuedouble);
	if (msg[0]) {
		sl->input = dup_range(p, n);
		slot_fail(s, sl, msg);
	} else {
		sl->input = dup_range(smiles->valuestring, strlen(smiles->valuestring));
	}
	cJSON_Delete(o);
}

/* A plain record: SMILES, then optional whitespace and an id. */
static void record_plain(slot *sl, const char *p, size_t n)
{
	size_t k = 0, id_at;

	while (k < n && !isspace((unsigned char)p[k]))
		k++;
	sl->input = dup_range(p, k);
	id_at = k;
	while (id_at < n && isspace((unsigned char)p[id_at]))
		id_at++;
	if (id_at < n)
		sl->id = dup_range(p + id_at, n - id_at);
}

/* One complete record (without its newline): queue it behind the earlier ones. */
static void record_take(srv_stream *s, const char *p, size_t n, int too_long)
{
	slot *sl;

	while (n && isspace((unsigned char)*p))
		p++, n--;
	while (n && isspace((unsigned char)p[n - 1]))
		n--;
	if (!n && !too_long)
		return; /* a blank line is no record */
	if (s->count == s->run.window)
		ring_pop(s);
	sl = &s->ring[(s->head + s->count) % s->run.window];
	s->count++;
	if (too_long) {
		char msg[96];
		sl->input = dup_range(p, n < 64 ? n : 64);
		snprintf(msg, sizeof msg, "record longer than %zu bytes", s->svc->cfg->max_body);
		slot_fail(s, sl, msg);
	} else if (*p == '{') {
		record_json(s, sl, p, n);
	} else {
		record_plain(sl, p, n);
	}
	s->taken++;
	if (!sl->id && (sl->id = malloc(24)))
		snprintf(sl->id, 24, "%d", s->taken); /* like `pkad predict`: the position */
	if (sl->job.done)
		return;
	if (!sl->input) {
		slot_fail(s, sl, "out of memory");
		return;
	}
	sl->job.input = sl->input;
	/* The stream was admitted in begin, so this waits for room; it fails only when the
	 * pool is closing. */
	if (srv_run_start(&s->run, &sl->job) < 0)
		slot_fail(s, sl, "the work queue is closed");
}

static void stream_feed(srv_stream *s, const char *data, size_t len)
{
	size_t limit = s->svc->cfg->max_body;

	while (len) {
		const char *nl = memchr(data, '\n', len);
		size_t seg = nl ? (size_t)(nl - data) : len;
		size_t room = limit > s->line.len ? limit - s->line.len : 0;

		if (seg > room)
			s->too_long = 1;
		srv_buf_append(&s->line, data, seg < room ? seg : room);
		if (nl) {
			record_take(s, s->line.p ? s->line.p : "", s->line.len, s->too_long);
			s->line.len = 0;
			s->too_long = 0;
			seg++;
		}
		data += seg;
		len -= seg;
	}
}

/* The query of a stream: ph, curves; 400 into out for anything else. */
static int stream_query_or_reply(srv_response *out, const srv_request *req, double *ph,
				 int *curves)
{
	const char *c = srv_request_param(req, "curves");

	for (size_t i = 0; i < req->n_query; i++)
		if (strcmp(req->query[i].key, "ph") && strcmp(req->query[i].key, "curves"))
			return srv_reply_error(out, "bad_request", "unknown query parameter '%.60s'",
					       req->query[i].key), -1;
	if (srv_query_ph_or_reply(out, req, ph) < 0)
		return -1;
	*curves = 0;
	if (c && srv_parse_flag(c, curves) < 0)
		return srv_reply_error(out, "bad_request", "curves '%.20s' is not true or false", c), -1;
	return 0;
}

static srv_stream *stream_begin(srv_response *out, const srv_request *req, srv_service *svc)
{
	srv_stream *s;
	double ph;
	int curves;

	if (stream_query_or_reply(out, req, &ph, &curves) < 0)
		return NULL;
	/* Admission happens once, here: afterwards records wait for room in the queue. */
	if (srv_pool_queued(svc->pool) >= (size_t)svc->cfg->queue) {
		out->retry_after = 1;
		srv_reply_error(out, "overloaded", "the work queue is full; retry later");
		return NULL;
	}
	s = calloc(1, sizeof *s);
	if (!s) {
		srv_reply_error(out, "out_of_memory", "out of memory");
		return NULL;
	}
	s->svc = svc;
	srv_run_init(&s->run, svc, ph, curves);
	s->ring = calloc(s->run.window, sizeof *s->ring);
	if (!s->ring) {
		srv_run_destroy(&s->run);
		free(s);
		srv_reply_error(out, "out_of_memory", "out of memory");
		return NULL;
	}
	s->run.admitted = 1;
	return s;
}

static void stream_finish(srv_stream *s, srv_response *out)
{
	if (s->line.len || s->too_long)
		record_take(s, s->line.p, s->line.len, s->too_long);
	while (s->count)
		ring_pop(s);
	out->molecules = s->records;
	out->item_errors = s->errors;
	if (s->spool && (fflush(s->spool) || fseek(s->spool, 0, SEEK_SET)))
		s->failed = 1;
	if (s->failed || s->mem.oom) {
		srv_reply_error(out, "internal_error", "could not keep the answers of the stream");
		return;
	}
	out->status = 200;
	out->content_type = "application/x-ndjson";
	out->stream = s;
}

static size_t stream_read(srv_stream *s, char *buf, size_t max)
{
	size_t n;

	if (s->spool)
		return fread(buf, 1, max, s->spool);
	n = s->mem.len - s->sent < max ? s->mem.len - s->sent : max;
	if (n)
		memcpy(buf, s->mem.p + s->sent, n);
	s->sent += n;
	return n;
}

static void stream_free(srv_stream *s)
{
	if (!s)
		return;
	while (s->count)
		ring_pop(s);
	srv_run_destroy(&s->run);
	if (s->spool)
		fclose(s->spool);
	srv_buf_free(&s->mem);
	srv_buf_free(&s->line);
	free(s->ring);
	free(s);
}

const srv_stream_ops srv_pka_stream_ops = {
	"application/x-ndjson", stream_begin, stream_feed, stream_finish, stream_read, stream_free,
};
