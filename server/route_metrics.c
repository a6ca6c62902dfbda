/* SPDX-License-Identifier: MIT */
/* route_metrics.c: GET /metrics in the Prometheus text exposition format. */
#include "http_errors.h"
#include "metrics.h"
#include "routes.h"

int srv_route_metrics(srv_response *out, const srv_request *req, srv_service *svc)
{
	char *text;

	if (srv_no_query_or_reply(out, req) < 0)
		return out->status;
	text = srv_metrics_render(svc->metrics, svc);
	if (!text)
		return srv_reply_error(out, "out_of_memory", "out of memory");
	return srv_reply_body(out, 200, "text/plain; version=0.0.4; charset=utf-8", text);
}
