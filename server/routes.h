/* SPDX-License-Identifier: MIT */
/* routes.h: the HTTP request and response seen by route handlers, and the route table. */
#ifndef PKAD_ROUTES_H
#define PKAD_ROUTES_H

#include <stddef.h>
#include <sys/types.h>

#include "service.h"

typedef struct srv_param {
	const char *key;
	const char *value;
} srv_param;

/* A request as the handlers see it: no MHD type, so handlers are tested without sockets.
 * Every pointer is borrowed for the duration of the call. */
typedef struct srv_request {
	const char *method;
	const char *path;
	const char *content_type; /* NULL when absent */
	const char *authorization;
	const srv_param *query;
	size_t n_query;
	const char *body;
	size_t body_len;
} srv_request;

typedef struct srv_stream srv_stream;

/* What a handler answers. body is malloc'd and freed by the HTTP layer; content_type and
 * is a static string. A streaming answer sets stream instead of body. */
typedef struct srv_response {
	int status;
	const char *content_type;
	char *body;
	size_t body_len;
	char allow[48];      /* Allow header of a 405, "" when none */
	int retry_after;     /* seconds, 429 and 503; 0 = no header */
	int molecules;       /* molecules answered, for the access log and metrics */
	int item_errors;     /* per-item errors inside a 200 batch */
	char log_smiles[128]; /* first input SMILES, logged only with --log-smiles */
	srv_stream *stream;
} srv_response;

typedef int (*srv_handler)(srv_response *out, const srv_request *req, srv_service *svc);

/* A request body that is consumed as it arrives (NDJSON): begin when the headers are in
 * (NULL with out filled when the request is refused),
 * feed every chunk (may block while workers catch up), finish at the end of the upload,
 * then read the answer piece by piece. read returns the bytes written into buf, 0 when the
 * answer is complete. */
typedef struct srv_stream_ops {
	const char *content_type; /* request content type that selects streaming */
	srv_stream *(*begin)(srv_response *out, const srv_request *req, srv_service *svc);
	void (*feed)(srv_stream *s, const char *data, size_t len);
	void (*finish)(srv_stream *s, srv_response *out);
	size_t (*read)(srv_stream *s, char *buf, size_t max);
	void (*free)(srv_stream *s);
} srv_stream_ops;

typedef struct srv_route {
	const char *method;
	const char *path;
	srv_handler handler;
	const srv_stream_ops *stream; /* NULL: the body is read whole first */
	int open;                     /* answered without the bearer token */
	const char *label;            /* metrics and access-log label */
} srv_route;

extern const srv_route srv_routes[];
extern const size_t srv_route_count;

/* The route of method and path, or NULL; when the path exists under other methods, allow
 * receives them ("GET, POST"), else "". */
const srv_route *srv_route_find(const char *method, const char *path, char *allow, size_t n);

/* Answers what every route shares before its handler runs: 503 while draining, 401 without
 * the token, 404, 405. Returns the route to run, or NULL with *out filled. */
const srv_route *srv_route_admit_or_reply(srv_response *out, const srv_request *req,
					  srv_service *svc);

/* Runs the whole request (admit, then the handler) for a body read whole. */
void srv_route_dispatch(srv_response *out, const srv_request *req, srv_service *svc);

/* Nonzero when the media type of a Content-Type value (before any ';') is type, in any
 * case. */
int srv_media_type_is(const char *content_type, const char *type);

/* 400 naming the first query parameter of a route that takes none; returns -1 then. */
int srv_no_query_or_reply(srv_response *out, const srv_request *req);

/* Query parameter value or NULL. */
const char *srv_request_param(const srv_request *req, const char *key);

/* Route handlers, one file each (route_<name>.c). */
int srv_route_index(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_healthz(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_readyz(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_metrics(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_openapi(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_version(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_pka_get(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_pka_post(srv_response *out, const srv_request *req, srv_service *svc);
extern const srv_stream_ops srv_pka_stream_ops;
int srv_route_deprotonation(srv_response *out, const srv_request *req, srv_service *svc);
int srv_route_bases(srv_response *out, const srv_request *req, srv_service *svc);

#endif
