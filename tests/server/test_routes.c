/* SPDX-License-Identifier: MIT */
/* test_routes.c: the daemon's handlers, cache, metrics and API description, without sockets. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include <cjson/cJSON.h>

#include "cache.h"
#include "harness.h"
#include "http_errors.h"
#include "json_result.h"
#include "metrics.h"
#include "openapi_embedded.h"
#include "routes.h"
#include "worker_pool.h"

static srv_config cfg;
static srv_service svc;
static pred_model *model;

/* The embedded tables when the repository has them, else the unit-test fixture. */
static const char *model_dir(void)
{
	static char path[4096];
	const char *src = getenv("PKAD_SOURCE_DIR");

	snprintf(path, sizeof path, "%s/fragments/sites.tsv", src ? src : ".");
	if (access(path, R_OK) == 0)
		return NULL;
	snprintf(path, sizeof path, "%s/tests/predictor/fixture", src ? src : ".");
	return path;
}

static int setup(void)
{
	pred_error err = {0, ""};

	cfg = (srv_config){.bind = "127.0.0.1", .threads = 2, .max_body = 4096, .max_batch = 5,
			   .max_atoms = 30, .timeout = 10, .max_connections = 8, .queue = 64,
			   .cache_size = 16, .grace = 1};
	svc.cfg = &cfg;
	pthread_mutex_init(&svc.parse_mu, NULL);
	if (pred_global_init(&err) < 0 || pred_model_load(&model, model_dir(), &err) < 0 ||
	    srv_pool_new(&svc.pool, model, 2, 64, &err) < 0) {
		fprintf(stderr, "setup: %s\n", err.msg);
		return -1;
	}
	svc.model = model;
	svc.cache = srv_cache_new(16);
	svc.metrics = srv_metrics_new(srv_route_count);
	return svc.cache && svc.metrics ? 0 : -1;
}

static void teardown(void)
{
	srv_pool_free(svc.pool);
	srv_cache_free(svc.cache);
	srv_metrics_free(svc.metrics);
	pred_model_free(model);
	pthread_mutex_destroy(&svc.parse_mu);
}

/* Runs one request through the route table; the caller frees out->body. */
static int call(srv_response *out, const char *method, const char *path, const srv_param *q,
		size_t nq, const char *ctype, const char *body)
{
	srv_request req = {method, path, ctype, NULL, q, nq, body, body ? strlen(body) : 0};

	memset(out, 0, sizeof *out);
	srv_route_dispatch(out, &req, &svc);
	return out->status;
}

static const char *error_code(const srv_response *r)
{
	static char buf[64];
	cJSON *o = cJSON_Parse(r->body ? r->body : "");
	const char *c = cJSON_GetStringValue(cJSON_GetObjectItem(cJSON_GetObjectItem(o, "error"), "code"));

	snprintf(buf, sizeof buf, "%s", c ? c : "");
	cJSON_Delete(o);
	return buf;
}

static void test_routes__unknown_path_returns_404(void)
{
	srv_response r;

	CHECK_INT_EQ(call(&r, "GET", "/v1/nothing", NULL, 0, NULL, NULL), 404);
	CHECK_STR_EQ(error_code(&r), "not_found");
	free(r.body);
}

static void test_routes__wrong_method_returns_405_with_allow(void)
{
	srv_response r;

	CHECK_INT_EQ(call(&r, "PUT", "/v1/pka", NULL, 0, NULL, NULL), 405);
	CHECK_STR_EQ(r.allow, "GET, POST");
	CHECK_STR_EQ(error_code(&r), "method_not_allowed");
	free(r.body);
	CHECK_INT_EQ(call(&r, "DELETE", "/metrics", NULL, 0, NULL, NULL), 405);
	CHECK_STR_EQ(r.allow, "GET");
	free(r.body);
	CHECK_INT_EQ(call(&r, "HEAD", "/healthz", NULL, 0, NULL, NULL), 200);
	free(r.body);
}

static void test_routes__draining_returns_503_with_retry_after(void)
{
	srv_response r;

	atomic_store(&svc.draining, 1);
	CHECK_INT_EQ(call(&r, "GET", "/healthz", NULL, 0, NULL, NULL), 503);
	CHECK_STR_EQ(error_code(&r), "shutting_down");
	CHECK(r.retry_after > 0);
	free(r.body);
	atomic_store(&svc.draining, 0);
}

static int call_with_token(const char *path, const char *authorization)
{
	srv_request req = {"GET", path, NULL, authorization, NULL, 0, NULL, 0};
	srv_response r = {0};

	srv_route_dispatch(&r, &req, &svc);
	free(r.body);
	return r.status;
}

static void test_routes__bearer_token_checked_except_healthz(void)
{
	svc.token = "s3cret";
	svc.token_len = 6;
	CHECK_INT_EQ(call_with_token("/v1/version", NULL), 401);
	CHECK_INT_EQ(call_with_token("/v1/version", "Bearer s3cre"), 401);
	CHECK_INT_EQ(call_with_token("/v1/version", "Bearer s3cretX"), 401);
	CHECK_INT_EQ(call_with_token("/v1/version", "Basic s3cret"), 401);
	CHECK_INT_EQ(call_with_token("/v1/version", "Bearer s3cret"), 200);
	CHECK_INT_EQ(call_with_token("/healthz", NULL), 200);
	svc.token = NULL;
	svc.token_len = 0;
	CHECK_INT_EQ(call_with_token("/v1/version", NULL), 200);
}

/* Status codes of DESIGN.md (Interfaces: pkad serve). */
static void test_errors__status_table_follows_design(void)
{
	CHECK_INT_EQ(srv_error_status("bad_request"), 400);
	CHECK_INT_EQ(srv_error_status("not_found"), 404);
	CHECK_INT_EQ(srv_error_status("method_not_allowed"), 405);
	CHECK_INT_EQ(srv_error_status("payload_too_large"), 413);
	CHECK_INT_EQ(srv_error_status("too_many_molecules"), 413);
	CHECK_INT_EQ(srv_error_status("unsupported_media_type"), 415);
	CHECK_INT_EQ(srv_error_status(pred_status_name(PRED_EPARSE)), 422);
	CHECK_INT_EQ(srv_error_status(pred_status_name(PRED_ELIMIT)), 422);
	CHECK_INT_EQ(srv_error_status("overloaded"), 429);
	CHECK_INT_EQ(srv_error_status("shutting_down"), 503);
	CHECK_INT_EQ(srv_error_status(pred_status_name(PRED_EINTERNAL)), 500);
	CHECK_INT_EQ(srv_error_status("no_such_code"), 500);
}

static void test_cache__evicts_least_recently_used(void)
{
	srv_cache *c = srv_cache_new(2);
	srv_cache_stats st;
	char *v;

	srv_cache_put(c, "a", "1");
	srv_cache_put(c, "b", "2");
	free(srv_cache_get(c, "a")); /* a is now the most recent */
	srv_cache_put(c, "c", "3");  /* evicts b */
	v = srv_cache_get(c, "b");
	CHECK(v == NULL);
	v = srv_cache_get(c, "a");
	CHECK_STR_EQ(v, "1");
	free(v);
	v = srv_cache_get(c, "c");
	CHECK_STR_EQ(v, "3");
	free(v);
	srv_cache_stats_get(c, &st);
	CHECK_INT_EQ(st.hits, 3);
	CHECK_INT_EQ(st.misses, 1);
	CHECK_INT_EQ(st.evictions, 1);
	CHECK_INT_EQ(st.entries, 2);
	srv_cache_free(c);
	c = srv_cache_new(0);
	srv_cache_put(c, "a", "1");
	CHECK(srv_cache_get(c, "a") == NULL);
	srv_cache_free(c);
}

/* Every row of the route table is in openapi.json, and every documented operation is
 * a row of the table. */
static void test_openapi__documents_every_route(void)
{
	cJSON *doc = cJSON_Parse(srv_openapi_json);
	const cJSON *paths = cJSON_GetObjectItem(doc, "paths");
	const cJSON *p;
	char lower[16], allow[48];
	size_t documented = 0;

	CHECK(doc != NULL);
	CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(doc, "openapi")), "3.1.0");
	for (size_t i = 0; i < srv_route_count; i++) {
		size_t k = 0;
		for (; srv_routes[i].method[k] && k + 1 < sizeof lower; k++)
			lower[k] = (char)(srv_routes[i].method[k] | 0x20);
		lower[k] = '\0';
		p = cJSON_GetObjectItem(cJSON_GetObjectItem(paths, srv_routes[i].path), lower);
		if (!p)
			fprintf(stderr, "undocumented route %s %s\n", srv_routes[i].method, srv_routes[i].path);
		CHECK(p != NULL);
	}
	cJSON_ArrayForEach(p, paths) {
		const cJSON *op;
		cJSON_ArrayForEach(op, p) {
			char upper[16];
			size_t k = 0;
			for (; op->string[k] && k + 1 < sizeof upper; k++)
				upper[k] = (char)(op->string[k] & ~0x20);
			upper[k] = '\0';
			CHECK(srv_route_find(upper, p->string, allow, sizeof allow) != NULL);
			documented++;
		}
	}
	CHECK_INT_EQ(documented, srv_route_count);
	cJSON_Delete(doc);
}

static void test_metrics__render_counts_requests_by_route_and_status(void)
{
	srv_metrics *m = srv_metrics_new(srv_route_count);
	char *text;

	srv_metrics_request(m, 0, 200, 0.003, 0, 0);
	srv_metrics_request(m, 0, 200, 0.2, 0, 0);
	srv_metrics_request(m, srv_route_count, 404, 0.0001, 0, 0);
	srv_metrics_request(m, 0, 299, 0.0001, 3, 1);
	text = srv_metrics_render(m, &svc);
	CHECK(strstr(text, "pkad_http_requests_total{method=\"GET\",route=\"/\",status=\"200\"} 2\n") != NULL);
	CHECK(strstr(text, "route=\"unmatched\",status=\"404\"} 1\n") != NULL);
	CHECK(strstr(text, "status=\"other\"} 1\n") != NULL);
	CHECK(strstr(text, "pkad_http_request_duration_seconds_bucket{le=\"0.005\"} 3\n") != NULL);
	CHECK(strstr(text, "pkad_http_request_duration_seconds_bucket{le=\"+Inf\"} 4\n") != NULL);
	CHECK(strstr(text, "pkad_molecules_predicted_total 2\n") != NULL);
	CHECK(strstr(text, "pkad_molecule_errors_total 1\n") != NULL);
	free(text);
	srv_metrics_free(m);
}

static void test_pka__query_errors_name_the_parameter(void)
{
	srv_param missing[] = {{"ph", "7"}};
	srv_param unknown[] = {{"smiles", "CCO"}, {"format", "csv"}};
	srv_response r;

	CHECK_INT_EQ(call(&r, "GET", "/v1/pka", missing, 1, NULL, NULL), 400);
	CHECK(r.body && strstr(r.body, "'smiles'"));
	free(r.body);
	CHECK_INT_EQ(call(&r, "GET", "/v1/pka", unknown, 2, NULL, NULL), 400);
	CHECK(r.body && strstr(r.body, "'format'"));
	free(r.body);
	CHECK_INT_EQ(call(&r, "GET", "/metrics", unknown, 2, NULL, NULL), 400);
	CHECK(r.body && strstr(r.body, "'smiles'"));
	free(r.body);
}

/* A batch item answers the same text as the single request for that molecule. */
static void test_pka__batch_item_equals_single_answer(void)
{
	srv_param q[] = {{"smiles", "Oc1ccccc1"}, {"id", "x"}};
	srv_response one, batch;
	cJSON *b, *item;
	char *item_text;

	CHECK_INT_EQ(call(&one, "GET", "/v1/pka", q, 2, NULL, NULL), 200);
	CHECK_INT_EQ(call(&batch, "POST", "/v1/pka", NULL, 0, "application/json; charset=utf-8",
			  "{\"molecules\":[{\"smiles\":\"C1CC(\",\"id\":\"bad\"},"
			  "{\"smiles\":\"Oc1ccccc1\",\"id\":\"x\"}]}"), 200);
	CHECK_INT_EQ(batch.molecules, 2);
	CHECK_INT_EQ(batch.item_errors, 1);
	b = cJSON_Parse(batch.body ? batch.body : "");
	item = cJSON_GetArrayItem(cJSON_GetObjectItem(b, "results"), 1);
	item_text = cJSON_PrintUnformatted(item);
	CHECK_STR_EQ(item_text, one.body);
	CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(cJSON_GetObjectItem(
			     cJSON_GetArrayItem(cJSON_GetObjectItem(b, "results"), 0), "error"), "code")),
		     "invalid_smiles");
	cJSON_free(item_text);
	cJSON_Delete(b);
	free(one.body);
	free(batch.body);
}

static void test_pka__limits_answer_413_and_422(void)
{
	srv_response r;

	CHECK_INT_EQ(call(&r, "POST", "/v1/pka", NULL, 0, "application/json",
			  "{\"molecules\":[{\"smiles\":\"C\"},{\"smiles\":\"C\"},{\"smiles\":\"C\"},"
			  "{\"smiles\":\"C\"},{\"smiles\":\"C\"},{\"smiles\":\"C\"}]}"), 413);
	CHECK_STR_EQ(error_code(&r), "too_many_molecules");
	free(r.body);
	CHECK_INT_EQ(call(&r, "POST", "/v1/pka", NULL, 0, "application/json",
			  "{\"smiles\":\"CCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCC\"}"), 422);
	CHECK(r.body && strstr(r.body, "too_many_atoms"));
	free(r.body);
	CHECK_INT_EQ(call(&r, "POST", "/v1/pka", NULL, 0, "text/csv", "smiles\nCCO\n"), 415);
	free(r.body);
}

/* With every queue slot taken, a new request is told to come back later. */
static void test_pka__full_queue_answers_429(void)
{
	srv_pool *busy = NULL, *saved = svc.pool;
	srv_batch b;
	srv_job filler = {0};
	srv_param q[] = {{"smiles", "CCCO"}};
	srv_request req = {"POST", "/v1/pka", "application/x-ndjson", NULL, NULL, 0, NULL, 0};
	srv_response r;
	pred_error err;

	srv_batch_init(&b);
	filler.batch = &b;
	CHECK_INT_EQ(srv_pool_new(&busy, model, 0, 1, &err), 0); /* no workers: nothing drains */
	CHECK_INT_EQ(srv_pool_submit(busy, &filler, 0), 0);
	svc.pool = busy;
	cfg.queue = 1;
	CHECK_INT_EQ(call(&r, "GET", "/v1/pka", q, 1, NULL, NULL), 429);
	CHECK_STR_EQ(error_code(&r), "overloaded");
	CHECK(r.retry_after > 0);
	free(r.body);
	memset(&r, 0, sizeof r);
	CHECK(srv_pka_stream_ops.begin(&r, &req, &svc) == NULL);
	CHECK_INT_EQ(r.status, 429);
	free(r.body);
	svc.pool = saved;
	cfg.queue = 64;
	srv_pool_free(busy);
	srv_batch_destroy(&b);
}

/* Reads a whole stream answer; the caller frees. */
static char *stream_answer(srv_stream *s)
{
	size_t cap = 1 << 16, n = 0, k;
	char *out = malloc(cap);

	while ((k = srv_pka_stream_ops.read(s, out + n, 100)) > 0) {
		n += k;
		if (n + 101 > cap)
			out = realloc(out, cap *= 2);
	}
	out[n] = '\0';
	return out;
}

static int count_lines(const char *s)
{
	int n = 0;
	for (; *s; s++)
		n += *s == '\n';
	return n;
}

/* Records split across feeds at every byte are answered in order; an over-long record is
 * an error line of its own. */
static void test_stream__records_fed_byte_by_byte_answer_in_order(void)
{
	srv_param q[] = {{"ph", "3"}};
	srv_request req = {"POST", "/v1/pka", "application/x-ndjson", NULL, q, 1, NULL, 0};
	const char *head = "CCO a\r\n\n{\"smiles\":\"CC(=O)O\"}\nC1CC(\n";
	srv_response r = {0};
	srv_stream *s = srv_pka_stream_ops.begin(&r, &req, &svc);
	char *big = calloc(5000, 1), *text;

	CHECK(s != NULL);
	if (!s)
		return;
	for (const char *p = head; *p; p++)
		srv_pka_stream_ops.feed(s, p, 1);
	memset(big, 'C', 4999);
	srv_pka_stream_ops.feed(s, big, 4999);
	srv_pka_stream_ops.feed(s, "\nCCN", 4);
	srv_pka_stream_ops.finish(s, &r);
	CHECK_INT_EQ(r.status, 200);
	CHECK_INT_EQ(r.molecules, 5);
	CHECK_INT_EQ(r.item_errors, 2);
	text = stream_answer(s);
	CHECK_INT_EQ(count_lines(text), 5);
	CHECK(!strncmp(text, "{\"id\":\"a\",\"input\":\"CCO\"", 23));
	CHECK(strstr(text, "\n{\"id\":\"2\",\"input\":\"CC(=O)O\"") != NULL);
	CHECK(strstr(text, "\n{\"id\":\"3\",\"input\":\"C1CC(\",\"error\"") != NULL);
	CHECK(strstr(text, "\n{\"id\":\"4\",") && strstr(text, "record longer than 4096 bytes"));
	CHECK(strstr(text, "\n{\"id\":\"5\",\"input\":\"CCN\"") != NULL);
	CHECK(strstr(text, "\"ph\":3") != NULL);
	free(text);
	free(big);
	srv_pka_stream_ops.free(s);
}

/* The result text is written without cJSON but must be what cJSON prints for the same
 * object: parsed and printed again by cJSON it is byte for byte the same, escapes of
 * quotes, backslashes and control bytes and the curves included. */
static void test_json__result_text_is_cjson_layout(void)
{
	static const char *const inputs[] = {"NCC(=O)O", "Oc1ccccc1", "C", "OC(=O)CCC(=O)O"};
	pred_worker *w = NULL;
	pred_error err = {0, ""};
	pred_options opt;
	pred_options_init(&opt);
	opt.curves = 1;
	CHECK_INT_EQ(pred_worker_new(&w, model, &err), 0);
	for (size_t i = 0; w && i < sizeof inputs / sizeof *inputs; i++) {
		pred_result *r = NULL;
		CHECK_INT_EQ(pred_predict(&r, w, inputs[i], PRED_FMT_SMILES, &opt, &err), 0);
		char *text = r ? srv_result_text(r, "id \"q\" \\ \t\x01\x7f\xc3\xa9\xff", inputs[i])
			       : NULL;
		cJSON *o = text ? cJSON_Parse(text) : NULL;
		char *again = o ? cJSON_PrintUnformatted(o) : NULL;
		CHECK(again != NULL);
		CHECK_STR_EQ(text, again);
		cJSON_free(again);
		cJSON_Delete(o);
		free(text);
		pred_result_free(r);
	}
	pred_worker_free(w);
}

int main(void)
{
	if (setup() < 0)
		return 1;
	RUN(test_routes__unknown_path_returns_404);
	RUN(test_json__result_text_is_cjson_layout);
	RUN(test_routes__wrong_method_returns_405_with_allow);
	RUN(test_routes__draining_returns_503_with_retry_after);
	RUN(test_routes__bearer_token_checked_except_healthz);
	RUN(test_errors__status_table_follows_design);
	RUN(test_cache__evicts_least_recently_used);
	RUN(test_openapi__documents_every_route);
	RUN(test_metrics__render_counts_requests_by_route_and_status);
	RUN(test_pka__query_errors_name_the_parameter);
	RUN(test_pka__batch_item_equals_single_answer);
	RUN(test_pka__limits_answer_413_and_422);
	RUN(test_pka__full_queue_answers_429);
	RUN(test_stream__records_fed_byte_by_byte_answer_in_order);
	teardown();
	return harness_done();
}
