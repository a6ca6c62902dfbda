/* SPDX-License-Identifier: MIT */
/* route_version.c: GET /v1/version: pkad, model parameters and data versions. */
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "http_errors.h"
#include "routes.h"

int srv_route_version(srv_response *out, const srv_request *req, srv_service *svc)
{
	cJSON *o;
	char *text = NULL, *body = NULL;

	if (srv_no_query_or_reply(out, req) < 0)
		return out->status;
	o = cJSON_CreateObject();
	cJSON_AddStringToObject(o, "pkad", pred_version());
	cJSON_AddStringToObject(o, "params", svc->model ? pred_model_params_version(svc->model) : "");
	cJSON_AddStringToObject(o, "data", svc->model ? pred_model_data_version(svc->model) : "");
	text = cJSON_PrintUnformatted(o);
	if (text && (body = malloc(strlen(text) + 1)))
		strcpy(body, text);
	cJSON_free(text);
	cJSON_Delete(o);
	if (!body)
		return srv_reply_error(out, "out_of_memory", "out of memory");
	return srv_reply_body(out, 200, "application/json", body);
}
