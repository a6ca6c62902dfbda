/* SPDX-License-Identifier: MIT */
/* test_route_deprotonation.c: POST /v1/deprotonation and GET /v1/bases, handlers called directly.
 */
#include <pthread.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "model_for_tests.h"
#include "routes.h"

static srv_config cfg = {.max_atoms = 200, .timeout = 10, .max_body = 1 << 20};
static srv_service svc = {.cfg = &cfg};

static srv_response post(const char *body, const char *type)
{
	srv_request req = {.method = "POST",
	                   .path = "/v1/deprotonation",
	                   .content_type = type,
	                   .body = body,
	                   .body_len = strlen(body)};
	srv_response out = {0};
	srv_route_dispatch(&out, &req, &svc);
	return out;
}

static void expect(const char *body, int status, const char *needle)
{
	srv_response out = post(body, "application/json");
	CHECK_INT_EQ(out.status, status);
	CHECK(out.body && strstr(out.body, needle));
	if (!out.body || !strstr(out.body, needle))
		fprintf(stderr, "%s -> %s\n", body, out.body ? out.body : "(null)");
	free(out.body);
}

static void test_route_deprotonation__answers_verdict_and_cautions(void)
{
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\"}", 200, "\"verdict\":\"complete\"");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\",\"id\":\"x1\"}", 200, "\"id\":\"x1\"");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaHCO3\",\"equivalents\":2}", 200, "negligible");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\"}", 200, "institutional safety practice");
}

static void test_route_deprotonation__bad_requests_get_json_errors(void)
{
	expect("{\"smiles\":\"CCO\",\"base\":\"xx\"}", 400, "unknown base 'xx'; known:");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\",\"equivalents\":0}", 400, "equivalents");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\",\"equivalents\":\"2\"}", 400, "not a number");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\",\"atom\":0}", 400, "not an acid site");
	expect("{\"smiles\":\"CCCC\",\"base\":\"NaH\"}", 400, "no acid site");
	expect("{\"smiles\":\"C(\",\"base\":\"NaH\"}", 422, "invalid_smiles");
	expect("{\"smiles\":\"CCO\"}", 400, "required");
	expect("{\"smiles\":\"CCO\",\"base\":\"NaH\",\"ph\":7}", 400, "unknown field 'ph'");
	expect("{\"smiles\":", 400, "malformed JSON");
	srv_response out = post("{}", "text/plain");
	CHECK_INT_EQ(out.status, 415);
	free(out.body);
}

static void test_route_bases__lists_the_table(void)
{
	srv_request req = {.method = "GET", .path = "/v1/bases"};
	srv_response out = {0};
	srv_route_dispatch(&out, &req, &svc);
	CHECK_INT_EQ(out.status, 200);
	CHECK(out.body && strstr(out.body, "\"name\":\"n-butyllithium\""));
	free(out.body);
}

int main(void)
{
	pred_model *m = model_for_tests();
	if (!m) {
		fprintf(stderr, "cannot load the model (PKAD_SOURCE_DIR)\n");
		return 1;
	}
	svc.model = m;
	pthread_mutex_init(&svc.parse_mu, NULL);
	RUN(test_route_deprotonation__answers_verdict_and_cautions);
	RUN(test_route_deprotonation__bad_requests_get_json_errors);
	RUN(test_route_bases__lists_the_table);
	pthread_mutex_destroy(&svc.parse_mu);
	pred_model_free(m);
	return harness_done();
}
