/* SPDX-License-Identifier: MIT */
/* http_errors.c: maps error codes to HTTP status and builds every JSON error body. */
#include "http_errors.h"

#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

typedef struct status_row {
	const char *code;
	int status;
} status_row;

/* DESIGN.md: 400 malformed request, 404, 405, 413, 415, 422 molecule unreadable or over a
 * limit, 429 overloaded, 503 shutting down; anything unexpected is 500. */
static const status_row status_table[] = {
	{"bad_request", 400},
	{"invalid_argument", 400},
	{"unauthorized", 401},
	{"not_found", 404},
	{"method_not_allowed", 405},
	{"payload_too_large", 413},
	{"too_many_molecules", 413},
	{"unsupported_media_type", 415},
	{"invalid_smiles", 422},
	{"too_many_atoms", 422},
	{"timeout", 422},
	{"unsupported_structure", 422},
	{"overloaded", 429},
	{"shutting_down", 503},
	{"bad_data", 500},
	{"out_of_memory", 500},
	{"internal_error", 500},
};

int srv_error_status(const char *code)
{
	for (size_t i = 0; i < sizeof status_table / sizeof status_table[0]; i++)
		if (!strcmp(status_table[i].code, code))
			return status_table[i].status;
	return 500;
}

const char *srv_error_code(int pred_code)
{
	return pred_status_name(pred_code);
}

/* A fixed body for when even the error cannot be encoded. */
static char *fallback_body(void)
{
	const char *s = "{\"error\":{\"code\":\"out_of_memory\",\"message\":\"out of memory\"}}";
	char *b = malloc(strlen(s) + 1);
	if (b)
		strcpy(b, s);
	return b;
}

static char *error_body(const char *code, const char *message)
{
	cJSON *root = cJSON_CreateObject();
	cJSON *err = cJSON_AddObjectToObject(root, "error");
	char *text = NULL, *body = NULL;

	if (!err || !cJSON_AddStringToObject(err, "code", code) ||
	    !cJSON_AddStringToObject(err, "message", message))
		goto done;
	text = cJSON_PrintUnformatted(root);
	if (text) {
		body = malloc(strlen(text) + 1);
		if (body)
			strcpy(body, text);
	}
done:
	cJSON_free(text);
	cJSON_Delete(root);
	return body ? body : fallback_body();
}

int srv_reply_error(srv_response *out, const char *code, const char *fmt, ...)
{
	char msg[512];
	va_list ap;

	va_start(ap, fmt);
	vsnprintf(msg, sizeof msg, fmt, ap);
	va_end(ap);
	return srv_reply_body(out, srv_error_status(code), "application/json",
			      error_body(code, msg));
}

int srv_reply_body(srv_response *out, int status, const char *content_type, char *body)
{
	free(out->body);
	out->status = body ? status : 500;
	out->content_type = content_type;
	out->body = body;
	out->body_len = body ? strlen(body) : 0;
	return out->status;
}
