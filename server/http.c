/* SPDX-License-Identifier: MIT */
/* http.c: libmicrohttpd glue: turns connections into srv_request / srv_response. */
#include "http.h"

#include <arpa/inet.h>
#include <netinet/in.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/socket.h>
#include <time.h>

#include <cjson/cJSON.h>
#include <microhttpd.h>

#include "http_errors.h"
#include "metrics.h"
#include "routes.h"
#include "strbuf.h"

#define MAX_QUERY 32

struct srv_http {
	struct MHD_Daemon *d;
	srv_service *svc;
};

/* Everything one request holds; made on the first callback, freed when it completes. */
typedef struct conn_state {
	srv_service *svc;
	srv_request req;
	srv_response resp;
	srv_param query[MAX_QUERY];
	const srv_route *route; /* NULL once answered */
	srv_buf body;
	int too_large;
	int query_overflow;
	const srv_stream_ops *ops;
	srv_stream *stream;
	char method[16], path[256]; /* copies: MHD's strings may not outlive the request */
	double t0;
} conn_state;

static double now_seconds(void)
{
	struct timespec ts;
	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

static enum MHD_Result add_query(void *cls, enum MHD_ValueKind kind, const char *key,
				 const char *value)
{
	conn_state *st = cls;

	(void)kind;
	if (st->req.n_query == MAX_QUERY) {
		st->query_overflow = 1;
		return MHD_NO;
	}
	st->query[st->req.n_query].key = key;
	st->query[st->req.n_query].value = value;
	st->req.n_query++;
	return MHD_YES;
}

static conn_state *state_new(struct MHD_Connection *c, srv_service *svc, const char *method,
			     const char *url)
{
	conn_state *st = calloc(1, sizeof *st);

	if (!st)
		return NULL;
	st->svc = svc;
	st->t0 = now_seconds();
	snprintf(st->method, sizeof st->method, "%s", method);
	snprintf(st->path, sizeof st->path, "%s", url);
	st->req.method = st->method;
	st->req.path = st->path;
	st->req.query = st->query;
	st->req.content_type = MHD_lookup_connection_value(c, MHD_HEADER_KIND, "Content-Type");
	st->req.authorization = MHD_lookup_connection_value(c, MHD_HEADER_KIND, "Authorization");
	MHD_get_connection_values(c, MHD_GET_ARGUMENT_KIND, add_query, st);
	atomic_fetch_add(&svc->in_flight, 1);
	return st;
}

static ssize_t stream_reader(void *cls, uint64_t pos, char *buf, size_t max)
{
	conn_state *st = cls;
	size_t n = st->ops->read(st->stream, buf, max);

	(void)pos;
	return n ? (ssize_t)n : MHD_CONTENT_READER_END_OF_STREAM;
}

static void add_headers(struct MHD_Response *r, const srv_response *resp)
{
	char num[16];

	MHD_add_response_header(r, MHD_HTTP_HEADER_CONTENT_TYPE,
				resp->content_type ? resp->content_type : "application/json");
	if (resp->status == 405 && resp->allow[0])
		MHD_add_response_header(r, MHD_HTTP_HEADER_ALLOW, resp->allow);
	if (resp->retry_after) {
		snprintf(num, sizeof num, "%d", resp->retry_after);
		MHD_add_response_header(r, MHD_HTTP_HEADER_RETRY_AFTER, num);
	}
	if (resp->status == 401)
		MHD_add_response_header(r, MHD_HTTP_HEADER_WWW_AUTHENTICATE, "Bearer");
	MHD_add_response_header(r, "X-Content-Type-Options", "nosniff");
}

/* Hands the answer in st->resp to MHD; the body or stream then belongs to the response. */
static enum MHD_Result send_answer(struct MHD_Connection *c, conn_state *st)
{
	srv_response *resp = &st->resp;
	struct MHD_Response *r;
	enum MHD_Result ret;

	st->route = NULL;
	if (resp->stream) {
		r = MHD_create_response_from_callback(MHD_SIZE_UNKNOWN, 64 * 1024, stream_reader,
						      st, NULL);
	} else {
		if (!resp->status)
			srv_reply_error(resp, "internal_error", "the handler gave no answer");
		r = MHD_create_response_from_buffer_with_free_callback(resp->body_len, resp->body,
								       free);
		if (r)
			resp->body = NULL;
	}
	if (!r)
		return MHD_NO;
	add_headers(r, resp);
	ret = MHD_queue_response(c, (unsigned)resp->status, r);
	MHD_destroy_response(r);
	return ret;
}

/* Decides on the headers alone: an early error, a stream, or a body to read. Returns 1
 * when st->resp holds an answer to send now. */
static int on_headers(struct MHD_Connection *c, conn_state *st)
{
	srv_service *svc = st->svc;
	const char *len = MHD_lookup_connection_value(c, MHD_HEADER_KIND, "Content-Length");
	const srv_stream_ops *ops;

	st->route = srv_route_admit_or_reply(&st->resp, &st->req, svc);
	if (!st->route)
		return 1;
	if (st->query_overflow) {
		srv_reply_error(&st->resp, "bad_request", "more than %d query parameters", MAX_QUERY);
		return 1;
	}
	if (atomic_load(&svc->in_flight) > svc->cfg->max_connections) {
		st->resp.retry_after = 1;
		srv_reply_error(&st->resp, "overloaded", "more than %d requests at once",
				svc->cfg->max_connections);
		return 1;
	}
	ops = st->route->stream;
	if (ops && srv_media_type_is(st->req.content_type, ops->content_type)) {
		st->ops = ops;
		st->stream = ops->begin(&st->resp, &st->req, svc);
		return st->stream == NULL;
	}
	if (len && strtoull(len, NULL, 10) > svc->cfg->max_body) {
		srv_reply_error(&st->resp, "payload_too_large", "body of %s bytes; the limit is %zu",
				len, svc->cfg->max_body);
		return 1;
	}
	return 0;
}

static void on_upload(conn_state *st, const char *data, size_t size)
{
	if (st->stream) {
		st->ops->feed(st->stream, data, size);
		return;
	}
	if (st->too_large || st->body.len + size > st->svc->cfg->max_body) {
		st->too_large = 1; /* read and drop the rest, then answer 413 */
		srv_buf_free(&st->body);
		return;
	}
	srv_buf_append(&st->body, data, size);
}

static void on_complete_body(conn_state *st)
{
	if (st->stream) {
		st->ops->finish(st->stream, &st->resp);
		return;
	}
	if (st->too_large) {
		srv_reply_error(&st->resp, "payload_too_large", "body over the limit of %zu bytes",
				st->svc->cfg->max_body);
		return;
	}
	if (st->body.oom) {
		srv_reply_error(&st->resp, "out_of_memory", "out of memory");
		return;
	}
	st->req.body = st->body.p ? st->body.p : "";
	st->req.body_len = st->body.len;
	st->route->handler(&st->resp, &st->req, st->svc);
}

static enum MHD_Result on_request(void *cls, struct MHD_Connection *c, const char *url,
				  const char *method, const char *version,
				  const char *upload_data, size_t *upload_data_size,
				  void **con_cls)
{
	conn_state *st = *con_cls;

	(void)version;
	if (!st) {
		st = *con_cls = state_new(c, cls, method, url);
		if (!st)
			return MHD_NO;
		return on_headers(c, st) ? send_answer(c, st) : MHD_YES;
	}
	if (!st->route) {
		*upload_data_size = 0; /* answered already: drop what still arrives */
		return MHD_YES;
	}
	if (*upload_data_size) {
		on_upload(st, upload_data, *upload_data_size);
		*upload_data_size = 0;
		return MHD_YES;
	}
	on_complete_body(st);
	return send_answer(c, st);
}

/* One structured line per request on stderr; SMILES only with --log-smiles. */
static void access_log(const conn_state *st, const char *route, double ms)
{
	cJSON *o = cJSON_CreateObject();
	char stamp[32], *line;
	struct timespec ts;
	struct tm tm;

	clock_gettime(CLOCK_REALTIME, &ts);
	gmtime_r(&ts.tv_sec, &tm);
	strftime(stamp, sizeof stamp, "%Y-%m-%dT%H:%M:%SZ", &tm);
	cJSON_AddStringToObject(o, "time", stamp);
	cJSON_AddStringToObject(o, "method", st->req.method);
	cJSON_AddStringToObject(o, "route", route);
	cJSON_AddNumberToObject(o, "status", st->resp.status);
	cJSON_AddNumberToObject(o, "molecules", st->resp.molecules);
	cJSON_AddNumberToObject(o, "item_errors", st->resp.item_errors);
	cJSON_AddNumberToObject(o, "ms", (double)(long)(ms * 1000) / 1000);
	if (st->svc->cfg->log_smiles && st->resp.log_smiles[0])
		cJSON_AddStringToObject(o, "smiles", st->resp.log_smiles);
	line = cJSON_PrintUnformatted(o);
	if (line)
		fprintf(stderr, "%s\n", line);
	cJSON_free(line);
	cJSON_Delete(o);
}

static void on_completed(void *cls, struct MHD_Connection *c, void **con_cls,
			 enum MHD_RequestTerminationCode toe)
{
	conn_state *st = *con_cls;
	srv_service *svc = cls;
	char allow[48];
	const srv_route *r;
	size_t idx;
	double secs;

	(void)c;
	(void)toe;
	if (!st)
		return;
	r = srv_route_find(st->req.method, st->req.path, allow, sizeof allow);
	idx = r ? (size_t)(r - srv_routes) : srv_route_count;
	secs = now_seconds() - st->t0;
	srv_metrics_request(svc->metrics, idx, st->resp.status, secs, st->resp.molecules,
			    st->resp.item_errors);
	access_log(st, r ? r->label : "unmatched", secs * 1000);
	if (st->stream)
		st->ops->free(st->stream);
	free(st->resp.body);
	srv_buf_free(&st->body);
	atomic_fetch_sub(&svc->in_flight, 1);
	free(st);
	*con_cls = NULL;
}

/* The listen address; IPv6 when it has a colon. Returns the sockaddr length or 0. */
static socklen_t bind_address(struct sockaddr_storage *ss, const char *host, int port)
{
	struct sockaddr_in *v4 = (struct sockaddr_in *)ss;
	struct sockaddr_in6 *v6 = (struct sockaddr_in6 *)ss;

	memset(ss, 0, sizeof *ss);
	if (inet_pton(AF_INET, host, &v4->sin_addr) == 1) {
		v4->sin_family = AF_INET;
		v4->sin_port = htons((uint16_t)port);
		return sizeof *v4;
	}
	if (inet_pton(AF_INET6, host, &v6->sin6_addr) == 1) {
		v6->sin6_family = AF_INET6;
		v6->sin6_port = htons((uint16_t)port);
		return sizeof *v6;
	}
	return 0;
}

int srv_http_start(srv_http **out, srv_service *svc, int *port, char *msg, size_t msgn)
{
	struct sockaddr_storage ss;
	unsigned flags = MHD_USE_INTERNAL_POLLING_THREAD | MHD_USE_THREAD_PER_CONNECTION |
			 MHD_USE_POLL;
	const union MHD_DaemonInfo *info;
	srv_http *h;

	*out = NULL;
	if (!bind_address(&ss, svc->cfg->bind, svc->cfg->port)) {
		snprintf(msg, msgn, "--bind '%s' is not an IPv4 or IPv6 address", svc->cfg->bind);
		return -1;
	}
	if (ss.ss_family == AF_INET6)
		flags |= MHD_USE_IPv6;
	if (!(h = calloc(1, sizeof *h)))
		return snprintf(msg, msgn, "out of memory"), -1;
	h->svc = svc;
	/* Sockets beyond --max-connections are still accepted so that they get a 429. */
	h->d = MHD_start_daemon(flags, 0, NULL, NULL, on_request, svc,
				MHD_OPTION_SOCK_ADDR, (struct sockaddr *)&ss,
				MHD_OPTION_CONNECTION_LIMIT, (unsigned)svc->cfg->max_connections + 16,
				MHD_OPTION_CONNECTION_TIMEOUT, 120u,
				MHD_OPTION_NOTIFY_COMPLETED, on_completed, svc, MHD_OPTION_END);
	if (!h->d) {
		snprintf(msg, msgn, "cannot listen on %s port %d", svc->cfg->bind, svc->cfg->port);
		free(h);
		return -1;
	}
	info = MHD_get_daemon_info(h->d, MHD_DAEMON_INFO_BIND_PORT);
	*port = info ? info->port : svc->cfg->port;
	*out = h;
	return 0;
}

void srv_http_stop(srv_http *h)
{
	if (!h)
		return;
	MHD_stop_daemon(h->d);
	free(h);
}
