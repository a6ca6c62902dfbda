/* SPDX-License-Identifier: MIT */
/* route_pka.h: request parsing shared by the /v1/pka handlers (query, JSON, NDJSON). */
#ifndef PKAD_ROUTE_PKA_H
#define PKAD_ROUTE_PKA_H

#include "routes.h"

/* Parses a pH value ("7.4"); returns 0 and *out, or -1 when it is not a number in -2..16. */
int srv_parse_ph(const char *s, double *out);
/* Parses a boolean query value: "1", "true", "0", "false", "" (true); -1 when invalid. */
int srv_parse_flag(const char *s, int *out);

/* The pH of a request's "ph" query parameter (default 7.4); 400 into out when invalid. */
int srv_query_ph_or_reply(srv_response *out, const srv_request *req, double *ph);

#endif
