/* SPDX-License-Identifier: MIT */
/* test_http.c: a live `pkad serve` on a free loopback port: every route and status code. */
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "harness.h"
#include "http_checks.h"

hc_daemon http_main = {-1, -1};
static hc_daemon auth_daemon = {-1, -1};

/* Whatever happens, no daemon outlives the test. */
static void stop_all(void)
{
	hc_daemon_stop(&http_main, 5);
	hc_daemon_stop(&auth_daemon, 5);
}

static void on_alarm(int sig)
{
	(void)sig;
	if (http_main.pid > 0)
		kill(http_main.pid, SIGKILL);
	if (auth_daemon.pid > 0)
		kill(auth_daemon.pid, SIGKILL);
	_exit(1);
}

static void test_http__info_routes_answer_200(void)
{
	hc_response r;
	cJSON *o;

	CHECK_INT_EQ(http_get(&r, "/"), 200);
	CHECK(r.body && strstr(r.body, "/openapi.json"));
	hc_response_free(&r);
	CHECK_INT_EQ(http_get(&r, "/healthz"), 200);
	hc_response_free(&r);
	CHECK_INT_EQ(http_get(&r, "/readyz"), 200);
	hc_response_free(&r);
	CHECK_INT_EQ(http_get(&r, "/v1/version"), 200);
	o = cJSON_Parse(r.body ? r.body : "");
	CHECK(cJSON_IsString(cJSON_GetObjectItem(o, "pkad")));
	CHECK(cJSON_IsString(cJSON_GetObjectItem(o, "params")));
	CHECK(cJSON_IsString(cJSON_GetObjectItem(o, "data")));
	cJSON_Delete(o);
	hc_response_free(&r);
	CHECK_INT_EQ(http_get(&r, "/openapi.json"), 200);
	o = cJSON_Parse(r.body ? r.body : "");
	CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(o, "openapi")), "3.1.0");
	cJSON_Delete(o);
	hc_response_free(&r);
}

/* The daemon's answer equals `pkad predict`'s for the same molecule (ids aside). */
static void test_http__get_pka_matches_cli(void)
{
	hc_response r;
	cJSON *cli = http_cli_answer("Oc1ccccc1"), *got;
	char *a = NULL, *b = NULL;

	CHECK_INT_EQ(http_get(&r, "/v1/pka?smiles=Oc1ccccc1&ph=7.4"), 200);
	got = cJSON_Parse(r.body ? r.body : "");
	CHECK(cli && got);
	if (cli && got) {
		a = http_without_id(got);
		b = http_without_id(cli);
		CHECK_STR_EQ(a, b);
	}
	CHECK(cJSON_GetArraySize(cJSON_GetObjectItem(got, "sites")) > 0);
	cJSON_free(a);
	cJSON_free(b);
	cJSON_Delete(got);
	cJSON_Delete(cli);
	hc_response_free(&r);
}

static void expect_error(const char *method, const char *path, const char *ctype,
			 const char *body, int status, const char *code, const char *mentions)
{
	hc_response r;

	if (!strcmp(method, "GET"))
		http_get(&r, path);
	else
		http_post(&r, path, ctype, body);
	CHECK_INT_EQ(r.status, status);
	CHECK_STR_EQ(http_error_code(&r), code);
	if (mentions && !strstr(http_error_message(&r), mentions))
		fprintf(stderr, "message '%s' does not mention '%s'\n", http_error_message(&r), mentions);
	CHECK(!mentions || strstr(http_error_message(&r), mentions));
	hc_response_free(&r);
}

static void test_http__bad_queries_are_400_naming_the_problem(void)
{
	expect_error("GET", "/v1/pka", NULL, NULL, 400, "bad_request", "smiles");
	expect_error("GET", "/v1/pka?smiles=CCO&colour=red", NULL, NULL, 400, "bad_request", "colour");
	expect_error("GET", "/v1/pka?smiles=CCO&ph=seven", NULL, NULL, 400, "bad_request", "ph");
	expect_error("GET", "/v1/pka?smiles=CCO&ph=20", NULL, NULL, 400, "bad_request", "ph");
	expect_error("GET", "/v1/pka?smiles=CCO&curves=maybe", NULL, NULL, 400, "bad_request", "curves");
}

static void test_http__molecule_errors_are_422(void)
{
	char path[256];

	expect_error("GET", "/v1/pka?smiles=C1CC%28", NULL, NULL, 422, "invalid_smiles", NULL);
	/* 40 carbons against --max-atoms 30 */
	snprintf(path, sizeof path, "/v1/pka?smiles=%.40s", "CCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCC");
	expect_error("GET", path, NULL, NULL, 422, "too_many_atoms", NULL);
	expect_error("POST", "/v1/pka", "application/json", "{\"smiles\":\"C1CC(\"}", 422,
		     "invalid_smiles", NULL);
}

static void test_http__unknown_path_404_wrong_method_405(void)
{
	hc_response r;
	char allow[64];

	expect_error("GET", "/v2/nothing", NULL, NULL, 404, "not_found", NULL);
	hc_request(&r, http_main.port, "DELETE", "/v1/pka", "", NULL, 0);
	CHECK_INT_EQ(r.status, 405);
	CHECK_STR_EQ(hc_header(&r, "allow", allow, sizeof allow), "GET, POST");
	CHECK_STR_EQ(http_error_code(&r), "method_not_allowed");
	hc_response_free(&r);
	hc_request(&r, http_main.port, "POST", "/healthz", "Content-Type: application/json\r\n", "{}", 2);
	CHECK_INT_EQ(r.status, 405);
	CHECK_STR_EQ(hc_header(&r, "allow", allow, sizeof allow), "GET");
	hc_response_free(&r);
}

static void test_http__bad_bodies(void)
{
	const char *json = "application/json";

	expect_error("POST", "/v1/pka", json, "{\"smiles\":", 400, "bad_request", "malformed");
	expect_error("POST", "/v1/pka", json, "[1,2]", 400, "bad_request", "object");
	expect_error("POST", "/v1/pka", json, "{\"ph\":7}", 400, "bad_request", "smiles");
	expect_error("POST", "/v1/pka", json, "{\"smiles\":\"CCO\",\"temp\":25}", 400, "bad_request", "temp");
	expect_error("POST", "/v1/pka", json, "{\"molecules\":[{\"smiles\":\"CCO\",\"name\":\"x\"}]}",
		     400, "bad_request", "molecules[0]");
	expect_error("POST", "/v1/pka", json, "{\"smiles\":\"CCO\",\"ph\":\"7\"}", 400, "bad_request", "ph");
	expect_error("POST", "/v1/pka", "text/plain", "CCO", 415, "unsupported_media_type", "text/plain");
	expect_error("POST", "/v1/pka",
		     json, "{\"molecules\":[{\"smiles\":\"C\"},{\"smiles\":\"C\"},{\"smiles\":\"C\"},"
		     "{\"smiles\":\"C\"},{\"smiles\":\"C\"},{\"smiles\":\"C\"}]}",
		     413, "too_many_molecules", "limit is 5");
}

static void test_http__body_over_limit_is_413(void)
{
	const char *head = "POST /v1/pka HTTP/1.1\r\nHost: x\r\nConnection: close\r\n"
			   "Content-Type: application/json\r\nTransfer-Encoding: chunked\r\n\r\n";
	size_t n = 6000; /* --max-body 4096 */
	char *big = malloc(n + 1);
	hc_response r;
	int fd;

	memset(big, ' ', n);
	memcpy(big, "{\"smiles\":\"CCO\"", 15);
	big[n - 1] = '}';
	big[n] = '\0';
	expect_error("POST", "/v1/pka", "application/json", big, 413, "payload_too_large", "4096");
	/* Without Content-Length (chunked), the limit is found while reading. */
	fd = hc_connect(http_main.port);
	hc_send_all(fd, head, strlen(head));
	http_stream_chunk(fd, big);
	http_stream_close(&r, fd);
	CHECK_INT_EQ(r.status, 413);
	CHECK_STR_EQ(http_error_code(&r), "payload_too_large");
	hc_response_free(&r);
	free(big);
}

/* One result per input, in order, ids kept; bad items carry their own error. */
static void test_http__batch_keeps_order_and_ids(void)
{
	const char *body = "{\"molecules\":[{\"id\":\"a\",\"smiles\":\"CC(=O)O\"},"
			   "{\"id\":\"b\",\"smiles\":\"C1CC(\"},{\"id\":7,\"smiles\":\"Oc1ccccc1\"},"
			   "{\"smiles\":\"NCC\"}],\"ph\":3.0}";
	const char *ids[] = {"a", "b", "7", "4"};
	const char *inputs[] = {"CC(=O)O", "C1CC(", "Oc1ccccc1", "NCC"};
	hc_response r;
	cJSON *o, *results;

	CHECK_INT_EQ(http_post(&r, "/v1/pka", "application/json", body), 200);
	o = cJSON_Parse(r.body ? r.body : "");
	results = cJSON_GetObjectItem(o, "results");
	CHECK_INT_EQ(cJSON_GetArraySize(results), 4);
	for (int i = 0; i < 4 && i < cJSON_GetArraySize(results); i++) {
		cJSON *it = cJSON_GetArrayItem(results, i);
		CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(it, "id")), ids[i]);
		CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(it, "input")), inputs[i]);
		CHECK_INT_EQ(cJSON_HasObjectItem(it, "error"), i == 1);
		if (i != 1)
			CHECK_NEAR(cJSON_GetObjectItem(cJSON_GetObjectItem(it, "at_ph"), "ph")->valuedouble, 3.0, 1e-9);
	}
	CHECK_STR_EQ(cJSON_GetStringValue(cJSON_GetObjectItem(
			     cJSON_GetObjectItem(cJSON_GetArrayItem(results, 1), "error"), "code")),
		     "invalid_smiles");
	cJSON_Delete(o);
	hc_response_free(&r);
}

static void test_http__metrics_count_requests_and_cache(void)
{
	hc_response r;

	http_get(&r, "/v1/pka?smiles=CCN");
	hc_response_free(&r);
	http_get(&r, "/v1/pka?smiles=CCN");
	hc_response_free(&r);
	CHECK_INT_EQ(http_get(&r, "/metrics"), 200);
	CHECK(r.body && strstr(r.body, "pkad_http_requests_total{method=\"GET\",route=\"/v1/pka\",status=\"422\"}"));
	CHECK(r.body && strstr(r.body, "pkad_http_request_duration_seconds_bucket{le=\"+Inf\"}"));
	CHECK(r.body && !strstr(r.body, "pkad_cache_hits_total 0\n"));
	CHECK(r.body && !strstr(r.body, "pkad_molecules_predicted_total 0\n"));
	CHECK(r.body && !strstr(r.body, "pkad_molecule_errors_total 0\n"));
	CHECK(r.body && strstr(r.body, "pkad_http_requests_in_flight 1\n")); /* this request */
	hc_response_free(&r);
}

static void test_http__token_required_when_configured(void)
{
	char tokfile[] = "/tmp/pkad-test-token-XXXXXX";
	int fd = mkstemp(tokfile);
	const char *args[] = {"--token-file", tokfile, NULL};
	hc_response r;

	CHECK(fd >= 0 && write(fd, "s3cret-token\n", 13) == 13);
	close(fd);
	CHECK_INT_EQ(hc_daemon_start(&auth_daemon, args), 0);
	unlink(tokfile);
	hc_request(&r, auth_daemon.port, "GET", "/v1/pka?smiles=CCO", "", NULL, 0);
	CHECK_INT_EQ(r.status, 401);
	CHECK_STR_EQ(http_error_code(&r), "unauthorized");
	hc_response_free(&r);
	hc_request(&r, auth_daemon.port, "GET", "/v1/pka?smiles=CCO", "Authorization: Bearer s3cret-tokem\r\n", NULL, 0);
	CHECK_INT_EQ(r.status, 401);
	hc_response_free(&r);
	hc_request(&r, auth_daemon.port, "GET", "/v1/pka?smiles=CCO", "Authorization: Bearer s3cret-token\r\n", NULL, 0);
	CHECK_INT_EQ(r.status, 200);
	hc_response_free(&r);
	hc_request(&r, auth_daemon.port, "GET", "/healthz", "", NULL, 0);
	CHECK_INT_EQ(r.status, 200);
	hc_response_free(&r);
	CHECK_INT_EQ(hc_daemon_stop(&auth_daemon, 10), 0);
	/* and off: the main daemon has no token */
	CHECK_INT_EQ(http_get(&r, "/v1/pka?smiles=CCO"), 200);
	hc_response_free(&r);
}

int main(void)
{
	const char *args[] = {"--max-batch", "5", "--max-body", "4096", "--max-atoms", "30",
			      "--threads", "2", NULL};

	signal(SIGALRM, on_alarm);
	alarm(240);
	atexit(stop_all);
	if (hc_daemon_start(&http_main, args) < 0) {
		fprintf(stderr, "cannot start '%s serve'\n", getenv("PKAD_BIN"));
		return 1;
	}
	RUN(test_http__info_routes_answer_200);
	RUN(test_http__get_pka_matches_cli);
	RUN(test_http__bad_queries_are_400_naming_the_problem);
	RUN(test_http__molecule_errors_are_422);
	RUN(test_http__unknown_path_404_wrong_method_405);
	RUN(test_http__bad_bodies);
	RUN(test_http__body_over_limit_is_413);
	RUN(test_http__batch_keeps_order_and_ids);
	RUN(test_http__metrics_count_requests_and_cache);
	RUN(test_http__token_required_when_configured);
	/* The other file keeps its own harness counters: add its failures. */
	if (test_http_stream_all() != 0)
		harness_failures++;
	return harness_done();
}
