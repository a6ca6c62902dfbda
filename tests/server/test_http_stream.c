/* SPDX-License-Identifier: MIT */
/* test_http_stream.c: NDJSON streaming, overload (429) and SIGTERM (503, exit 0). */
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "harness.h"
#include "http_checks.h"

#define N_RECORDS 10000

/* Molecules of our own choosing; the ones marked bad are not valid SMILES. */
static const struct {
	const char *smiles;
	int bad;
} pool[] = {
	{"CC(=O)O", 0}, {"Oc1ccccc1", 0}, {"NCCc1ccccc1", 0}, {"c1ccncc1", 0}, {"C1CC(", 1},
	{"OC(=O)c1ccccc1", 0}, {"CCN(CC)CC", 0}, {"Oc1ccc(cc1)[N+](=O)[O-]", 0}, {"CCO", 0},
	{"Xx", 1}, {"NC(Cc1ccccc1)C(=O)O", 0}, {"c1cc[nH]c1", 0}, {"CC", 0},
};
#define N_POOL (sizeof pool / sizeof pool[0])

static void msleep(long ms)
{
	struct timespec ts = {ms / 1000, (ms % 1000) * 1000000L};
	nanosleep(&ts, NULL);
}

/* Record i: a plain "SMILES ID" line or a JSON object, alternately. */
static char *ndjson_body(void)
{
	size_t cap = (size_t)N_RECORDS * 64, n = 0;
	char *b = malloc(cap);

	for (int i = 0; b && i < N_RECORDS; i++) {
		const char *smi = pool[(size_t)i % N_POOL].smiles;
		if (i % 2)
			n += (size_t)snprintf(b + n, cap - n, "{\"id\":\"r%d\",\"smiles\":\"%s\"}\n", i, smi);
		else
			n += (size_t)snprintf(b + n, cap - n, "%s r%d\n", smi, i);
	}
	return b;
}

static const char *field(const cJSON *o, const char *name)
{
	const char *v = cJSON_GetStringValue(cJSON_GetObjectItem(o, name));
	return v ? v : "";
}

/* Every record is answered, in order, with its id, input and error flag. */
static void check_ndjson_answer(const char *body)
{
	const char *p = body;
	int i = 0, wrong = 0;
	char want[32];

	for (; p && *p && i < N_RECORDS + 1; i++) {
		const char *nl = strchr(p, '\n');
		cJSON *o = cJSON_ParseWithLength(p, nl ? (size_t)(nl - p) : strlen(p));
		snprintf(want, sizeof want, "r%d", i);
		if (!o || strcmp(field(o, "id"), want) ||
		    strcmp(field(o, "input"), pool[(size_t)i % N_POOL].smiles) ||
		    cJSON_HasObjectItem(o, "error") != pool[(size_t)i % N_POOL].bad)
			wrong++;
		cJSON_Delete(o);
		p = nl ? nl + 1 : NULL;
	}
	CHECK_INT_EQ(i, N_RECORDS);
	CHECK_INT_EQ(wrong, 0);
}

/* 10,000 records sent in 1000-byte chunks that cut records anywhere. */
static void test_stream__ten_thousand_records_in_order(void)
{
	char *body = ndjson_body(), chunk[1001], ctype[64];
	size_t len = strlen(body);
	int fd = http_stream_open(http_main.port, "");
	hc_response r;

	for (size_t off = 0; fd >= 0 && off < len; off += 1000) {
		size_t n = len - off < 1000 ? len - off : 1000;
		memcpy(chunk, body + off, n);
		chunk[n] = '\0';
		http_stream_chunk(fd, chunk);
	}
	CHECK_INT_EQ(http_stream_close(&r, fd), 0);
	CHECK_INT_EQ(r.status, 200);
	CHECK_STR_EQ(hc_header(&r, "content-type", ctype, sizeof ctype), "application/x-ndjson");
	if (r.body)
		check_ndjson_answer(r.body);
	hc_response_free(&r);
	free(body);
}

/* Blank lines are no record; a bad JSON record is an error line, not a failed stream. */
static void test_stream__bad_records_get_error_lines(void)
{
	hc_response r;

	http_post(&r, "/v1/pka?ph=2", "application/x-ndjson", "CCO\n\n{\"smiles\":1}\n{oops\nCC(=O)O\n");
	CHECK_INT_EQ(r.status, 200);
	CHECK(r.body && strstr(r.body, "\"id\":\"1\",\"input\":\"CCO\""));
	CHECK(r.body && strstr(r.body, "\"id\":\"2\",\"input\":\"{\\\"smiles\\\":1}\",\"error\""));
	CHECK(r.body && strstr(r.body, "\"id\":\"3\",\"input\":\"{oops\",\"error\""));
	CHECK(r.body && strstr(r.body, "\"id\":\"4\",\"input\":\"CC(=O)O\""));
	CHECK(r.body && strstr(r.body, "\"ph\":2"));
	hc_response_free(&r);
	http_post(&r, "/v1/pka?temperature=25", "application/x-ndjson", "CCO\n");
	CHECK_INT_EQ(r.status, 400);
	CHECK(strstr(http_error_message(&r), "temperature") != NULL);
	hc_response_free(&r);
}

/* --max-connections 1: a second request while one is in flight gets 429 + Retry-After. */
static void test_stream__second_request_over_connection_limit_is_429(void)
{
	const char *args[] = {"--max-connections", "1", "--threads", "1", NULL};
	hc_daemon d;
	hc_response r;
	char retry[16];
	int fd;

	CHECK_INT_EQ(hc_daemon_start(&d, args), 0);
	fd = http_stream_open(d.port, "CCO a\n");
	msleep(200);
	hc_request(&r, d.port, "GET", "/v1/pka?smiles=CCN", "", NULL, 0);
	CHECK_INT_EQ(r.status, 429);
	CHECK_STR_EQ(http_error_code(&r), "overloaded");
	CHECK(hc_header(&r, "retry-after", retry, sizeof retry) != NULL);
	hc_response_free(&r);
	http_stream_close(&r, fd);
	CHECK_INT_EQ(r.status, 200);
	CHECK(r.body && strstr(r.body, "\"id\":\"a\""));
	hc_response_free(&r);
	CHECK_INT_EQ(hc_daemon_stop(&d, 10), 0);
}

/* SIGTERM: new requests get 503, the request in flight is finished, exit status 0. */
static void test_stream__sigterm_drains_then_exits_0(void)
{
	hc_response r = {0};
	char retry[16];
	int fd = http_stream_open(http_main.port, "CCO a\n"), status = 0;

	msleep(100);
	kill(http_main.pid, SIGTERM);
	for (int i = 0; i < 100 && status != 503; i++) {
		hc_response_free(&r);
		status = http_get(&r, "/healthz");
		msleep(status == 503 ? 0 : 50);
	}
	CHECK_INT_EQ(status, 503);
	CHECK_STR_EQ(http_error_code(&r), "shutting_down");
	CHECK(hc_header(&r, "retry-after", retry, sizeof retry) != NULL);
	hc_response_free(&r);
	http_stream_chunk(fd, "CCN b\n");
	http_stream_close(&r, fd);
	CHECK_INT_EQ(r.status, 200);
	CHECK(r.body && strstr(r.body, "\"id\":\"a\"") && strstr(r.body, "\"id\":\"b\""));
	hc_response_free(&r);
	CHECK_INT_EQ(hc_daemon_stop(&http_main, 20), 0);
}

int test_http_stream_all(void)
{
	RUN(test_stream__ten_thousand_records_in_order);
	RUN(test_stream__bad_records_get_error_lines);
	RUN(test_stream__second_request_over_connection_limit_is_429);
	RUN(test_stream__sigterm_drains_then_exits_0);
	printf("stream tests: %d passed, %d failed\n", harness_checks - harness_failures,
	       harness_failures);
	return harness_failures;
}
