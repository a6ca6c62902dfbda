/* SPDX-License-Identifier: MIT */
/* route_health.c: GET /healthz (liveness) and GET /readyz (ready to predict). */
#include <stdlib.h>
#include <string.h>

#include "http_errors.h"
#include "routes.h"
#include "worker_pool.h"

static char *dup_text(const char *s)
{
	char *d = malloc(strlen(s) + 1);
	if (d)
		strcpy(d, s);
	return d;
}

/* Open without the token (see cmd_serve.c --help) so that probes need no secret. */
int srv_route_healthz(srv_response *out, const srv_request *req, srv_service *svc)
{
	(void)svc;
	if (srv_no_query_or_reply(out, req) < 0)
		return out->status;
	return srv_reply_body(out, 200, "application/json", dup_text("{\"status\":\"ok\"}"));
}

int srv_route_readyz(srv_response *out, const srv_request *req, srv_service *svc)
{
	if (srv_no_query_or_reply(out, req) < 0)
		return out->status;
	if (!svc->model || !svc->pool)
		return srv_reply_error(out, "shutting_down", "the model is not loaded");
	return srv_reply_body(out, 200, "application/json", dup_text("{\"status\":\"ready\"}"));
}
