/* SPDX-License-Identifier: MIT */
/* route_pka.c: GET /v1/pka (query) and POST /v1/pka (one molecule or a JSON batch). */
#include "route_pka.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "http_errors.h"
#include "predict_job.h"

int srv_parse_ph(const char *s, double *out)
{
	char *end;
	double v = strtod(s, &end);

	if (end == s || *end || !isfinite(v) || v < -2 || v > 16)
		return -1;
	*out = v;
	return 0;
}

int srv_parse_flag(const char *s, int *out)
{
	if (!*s || !strcmp(s, "1") || !strcmp(s, "true"))
		*out = 1;
	else if (!strcmp(s, "0") || !strcmp(s, "false"))
		*out = 0;
	else
		return -1;
	return 0;
}

int srv_query_ph_or_reply(srv_response *out, const srv_request *req, double *ph)
{
	const char *v = srv_request_param(req, "ph");

	*ph = 7.4;
	if (v && srv_parse_ph(v, ph) < 0) {
		srv_reply_error(out, "bad_request", "ph '%.40s' is not a number in -2..16", v);
		return -1;
	}
	return 0;
}

/* Names the first query parameter outside allowed (NULL-terminated); 400 into out. */
static int unknown_param_or_reply(srv_response *out, const srv_request *req,
				  const char *const *allowed)
{
	for (size_t i = 0; i < req->n_query; i++) {
		size_t k = 0;
		while (allowed[k] && strcmp(allowed[k], req->query[i].key))
			k++;
		if (!allowed[k]) {
			srv_reply_error(out, "bad_request", "unknown query parameter '%.60s'",
					req->query[i].key);
			return -1;
		}
	}
	return 0;
}

/* One molecule: 200 with the result, or the molecule's error with its own status. */
static int answer_single(srv_response *out, srv_service *svc, const char *smiles,
			 const char *id, double ph, int curves)
{
	srv_run run;
	srv_job job = {0};
	srv_buf b = {0};

	snprintf(out->log_smiles, sizeof out->log_smiles, "%s", smiles);
	srv_run_init(&run, svc, ph, curves);
	job.input = smiles;
	if (srv_run_start(&run, &job) < 0) {
		srv_run_destroy(&run);
		srv_job_clear(&job);
		out->retry_after = 1;
		return srv_reply_error(out, "overloaded", "the work queue is full; retry later");
	}
	srv_run_finish(&run, &job);
	srv_run_destroy(&run);
	srv_job_append(&b, &job, id);
	out->molecules = 1;
	out->item_errors = job.code != 0;
	srv_reply_body(out, job.code ? srv_error_status(pred_status_name(job.code)) : 200,
		       "application/json", srv_buf_take(&b));
	srv_job_clear(&job);
	return out->status;
}

int srv_route_pka_get(srv_response *out, const srv_request *req, srv_service *svc)
{
	static const char *const allowed[] = {"smiles", "ph", "curves", "id", NULL};
	const char *smiles = srv_request_param(req, "smiles");
	const char *curves_s = srv_request_param(req, "curves");
	double ph;
	int curves = 0;

	if (unknown_param_or_reply(out, req, allowed) < 0 ||
	    srv_query_ph_or_reply(out, req, &ph) < 0)
		return out->status;
	if (!smiles)
		return srv_reply_error(out, "bad_request", "missing query parameter 'smiles'");
	if (curves_s && srv_parse_flag(curves_s, &curves) < 0)
		return srv_reply_error(out, "bad_request", "curves '%.20s' is not true or false",
				       curves_s);
	return answer_single(out, svc, smiles, srv_request_param(req, "id"), ph, curves);
}
