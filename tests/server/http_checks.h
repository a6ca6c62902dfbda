/* SPDX-License-Identifier: MIT */
/* http_checks.h: shared helpers of the live-daemon tests (tests/server/test_http*.c). */
#ifndef PKAD_TEST_HTTP_CHECKS_H
#define PKAD_TEST_HTTP_CHECKS_H

#include <cjson/cJSON.h>

#include "http_client.h"

/* The daemon every test of server_http talks to, started by main with small limits:
 * --max-batch 5 --max-body 4096 --max-atoms 30. */
extern hc_daemon http_main;

/* GET path; returns the status (0 on socket errors) and fills r. */
int http_get(hc_response *r, const char *path);
/* POST body with the given content type. */
int http_post(hc_response *r, const char *path, const char *ctype, const char *body);
/* error.code of a JSON error body, or "" when the body has none. Static buffer. */
const char *http_error_code(const hc_response *r);
/* error.message of a JSON error body ("" when none). Static buffer. */
const char *http_error_message(const hc_response *r);

/* A connection with a chunked NDJSON upload started (headers and first chunk sent). */
int http_stream_open(int port, const char *first_chunk);
int http_stream_chunk(int fd, const char *chunk);
/* Sends the last chunk and reads the answer. */
int http_stream_close(hc_response *r, int fd);

/* The answer of `pkad predict` for one SMILES line, as a JSON object without "id"
 * (NULL when the CLI could not be run). */
cJSON *http_cli_answer(const char *smiles);
/* Deletes "id" from obj and returns its unformatted text (caller frees). */
char *http_without_id(cJSON *obj);

/* The tests of test_http_stream.c (NDJSON, 429, SIGTERM); returns its failure count. The
 * SIGTERM test stops http_main. */
int test_http_stream_all(void);

#endif
