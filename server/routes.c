/* SPDX-License-Identifier: MIT */
/* routes.c: the route table and what every route shares (shutdown, auth, 404, 405). */
#include "routes.h"

#include <stdio.h>
#include <string.h>
#include <strings.h>

#include "http_errors.h"

/* Adding an endpoint is one row here plus its route_<name>.c; keep openapi.json in step
 * (tests/server/test_routes.c checks that every row is documented). */
const srv_route srv_routes[] = {
	{"GET", "/", srv_route_index, NULL, 1, "/"},
	{"GET", "/healthz", srv_route_healthz, NULL, 1, "/healthz"},
	{"GET", "/readyz", srv_route_readyz, NULL, 0, "/readyz"},
	{"GET", "/metrics", srv_route_metrics, NULL, 0, "/metrics"},
	{"GET", "/openapi.json", srv_route_openapi, NULL, 0, "/openapi.json"},
	{"GET", "/v1/version", srv_route_version, NULL, 0, "/v1/version"},
	{"GET", "/v1/pka", srv_route_pka_get, NULL, 0, "/v1/pka"},
	{"POST", "/v1/pka", srv_route_pka_post, &srv_pka_stream_ops, 0, "/v1/pka"},
	{"POST", "/v1/deprotonation", srv_route_deprotonation, NULL, 0, "/v1/deprotonation"},
	{"GET", "/v1/bases", srv_route_bases, NULL, 0, "/v1/bases"},
};
const size_t srv_route_count = sizeof srv_routes / sizeof srv_routes[0];

const srv_route *srv_route_find(const char *method, const char *path, char *allow, size_t n)
{
	size_t len = 0;

	/* HEAD is answered as GET; libmicrohttpd leaves the body out. */
	if (!strcmp(method, "HEAD"))
		method = "GET";
	allow[0] = '\0';
	for (size_t i = 0; i < srv_route_count; i++) {
		if (strcmp(srv_routes[i].path, path))
			continue;
		if (!strcmp(srv_routes[i].method, method))
			return &srv_routes[i];
		len += (size_t)snprintf(allow + len, n - len, "%s%s", len ? ", " : "",
					srv_routes[i].method);
		if (len >= n)
			len = n - 1;
	}
	return NULL;
}

/* Bearer token check; the comparison time does not depend on where the texts differ. */
static int token_matches(const srv_service *svc, const char *authorization)
{
	const char *prefix = "Bearer ";
	size_t n, plen = strlen(prefix);
	unsigned char diff = 0;

	if (!authorization || strncmp(authorization, prefix, plen))
		return 0;
	authorization += plen;
	n = strlen(authorization);
	for (size_t i = 0; i < svc->token_len; i++)
		diff |= (unsigned char)(svc->token[i] ^ (i < n ? authorization[i] : 0));
	return diff == 0 && n == svc->token_len;
}

const srv_route *srv_route_admit_or_reply(srv_response *out, const srv_request *req,
					  srv_service *svc)
{
	const srv_route *r = srv_route_find(req->method, req->path, out->allow, sizeof out->allow);

	if (atomic_load(&svc->draining)) {
		out->retry_after = 1;
		srv_reply_error(out, "shutting_down", "the server is shutting down");
		return NULL;
	}
	if (!r && out->allow[0]) {
		srv_reply_error(out, "method_not_allowed", "method %s not allowed on %s; allowed: %s",
				req->method, req->path, out->allow);
		return NULL;
	}
	if (!r) {
		srv_reply_error(out, "not_found", "no route %s", req->path);
		return NULL;
	}
	if (svc->token && !r->open && !token_matches(svc, req->authorization)) {
		srv_reply_error(out, "unauthorized", "missing or wrong bearer token");
		return NULL;
	}
	return r;
}

void srv_route_dispatch(srv_response *out, const srv_request *req, srv_service *svc)
{
	const srv_route *r = srv_route_admit_or_reply(out, req, svc);
	if (r)
		r->handler(out, req, svc);
}

const char *srv_request_param(const srv_request *req, const char *key)
{
	for (size_t i = 0; i < req->n_query; i++)
		if (!strcmp(req->query[i].key, key))
			return req->query[i].value ? req->query[i].value : "";
	return NULL;
}

int srv_media_type_is(const char *content_type, const char *type)
{
	size_t n = strlen(type);
	return content_type && !strncasecmp(content_type, type, n) &&
	       (content_type[n] == '\0' || content_type[n] == ';' || content_type[n] == ' ');
}

int srv_no_query_or_reply(srv_response *out, const srv_request *req)
{
	if (!req->n_query)
		return 0;
	srv_reply_error(out, "bad_request", "unknown query parameter '%.60s'", req->query[0].key);
	return -1;
}
