/* SPDX-License-Identifier: MIT */
/* route_openapi.c: GET /openapi.json, the API description embedded at build time. */
#include <stdlib.h>
#include <string.h>

#include "http_errors.h"
#include "openapi_embedded.h"
#include "routes.h"

int srv_route_openapi(srv_response *out, const srv_request *req, srv_service *svc)
{
	char *body;

	(void)svc;
	if (srv_no_query_or_reply(out, req) < 0)
		return out->status;
	body = malloc(strlen(srv_openapi_json) + 1);
	if (!body)
		return srv_reply_error(out, "out_of_memory", "out of memory");
	strcpy(body, srv_openapi_json);
	return srv_reply_body(out, 200, "application/json", body);
}
