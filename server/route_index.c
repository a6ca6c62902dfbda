/* SPDX-License-Identifier: MIT */
/* route_index.c: GET /, a plain page pointing to the API until the web page exists. */
#include <stdlib.h>
#include <string.h>

#include "http_errors.h"
#include "routes.h"

static const char page[] =
	"<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">"
	"<title>pkad</title></head>\n<body>\n<h1>pkad</h1>\n"
	"<p>pKa of every acidic and basic site of a molecule, with the terms behind each value, "
	"its uncertainty, and the charge and species at a given pH.</p>\n<ul>\n"
	"<li><a href=\"/v1/pka?smiles=Oc1ccccc1\">GET /v1/pka?smiles=Oc1ccccc1&amp;ph=7.4</a>"
	" one molecule</li>\n"
	"<li>POST /v1/pka with <code>{\"smiles\":\"...\"}</code>, "
	"<code>{\"molecules\":[{\"id\":\"a\",\"smiles\":\"...\"}]}</code> or NDJSON</li>\n"
	"<li><a href=\"/openapi.json\">/openapi.json</a> the API description</li>\n"
	"<li><a href=\"/v1/version\">/v1/version</a>, <a href=\"/healthz\">/healthz</a>, "
	"<a href=\"/readyz\">/readyz</a>, <a href=\"/metrics\">/metrics</a></li>\n"
	"</ul>\n</body></html>\n";

int srv_route_index(srv_response *out, const srv_request *req, srv_service *svc)
{
	char *body;

	(void)svc;
	if (srv_no_query_or_reply(out, req) < 0)
		return out->status;
	body = malloc(sizeof page);
	if (!body)
		return srv_reply_error(out, "out_of_memory", "out of memory");
	memcpy(body, page, sizeof page);
	return srv_reply_body(out, 200, "text/html; charset=utf-8", body);
}
