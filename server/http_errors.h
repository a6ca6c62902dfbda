/* SPDX-License-Identifier: MIT */
/* http_errors.h: the one table from error codes to HTTP status, and the one error body. */
#ifndef PKAD_HTTP_ERRORS_H
#define PKAD_HTTP_ERRORS_H

#include "routes.h"

/* HTTP status of an error code name: a pred_status_name() ("invalid_smiles" -> 422) or a
 * request error ("bad_request" -> 400, "overloaded" -> 429, ...); unknown names give 500. */
int srv_error_status(const char *code);

/* The error code name of a PRED_E* value answered for a whole request. */
const char *srv_error_code(int pred_code);

/* Fills out with status and body {"error":{"code":code,"message":...}}; replaces any body
 * already there. Returns the status. This is the only place an error body is built. */
int srv_reply_error(srv_response *out, const char *code, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));

/* Fills out with a 200 (or status) answer of malloc'd body text, taking ownership. */
int srv_reply_body(srv_response *out, int status, const char *content_type, char *body);

#endif
