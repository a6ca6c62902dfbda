/* SPDX-License-Identifier: MIT */
/* http_client.h: a minimal HTTP/1.1 client over plain sockets, and a daemon launcher. */
#ifndef PKAD_TEST_HTTP_CLIENT_H
#define PKAD_TEST_HTTP_CLIENT_H

#include <stddef.h>
#include <sys/types.h>

typedef struct hc_response {
	int status;     /* 0 when the request failed at the socket level */
	char *headers;  /* raw header block, lower-cased names */
	char *body;     /* de-chunked, NUL-terminated */
	size_t body_len;
} hc_response;

/* Sends one request (Connection: close) to 127.0.0.1:port and reads the whole answer.
 * extra_headers is "" or lines each ending in "\r\n". Returns 0, or -1 on socket errors. */
int hc_request(hc_response *out, int port, const char *method, const char *path,
	       const char *extra_headers, const char *body, size_t body_len);
void hc_response_free(hc_response *r);
/* Value of a header (name in lower case) copied into buf; NULL when absent. */
const char *hc_header(const hc_response *r, const char *name, char *buf, size_t n);

/* An open connection for requests sent piece by piece. */
int hc_connect(int port);
int hc_send_all(int fd, const char *data, size_t n);
/* Reads until the peer closes and parses the answer. Closes fd. */
int hc_read_response(hc_response *out, int fd);

/* Percent-encodes s for a query string into buf. */
void hc_urlencode(char *buf, size_t n, const char *s);

/* A `pkad serve` child started with --port 0 and extra arguments. */
typedef struct hc_daemon {
	pid_t pid;
	int port;
} hc_daemon;

/* Starts $PKAD_BIN serve --port 0 <args...> (NULL-terminated) and reads the port it
 * prints. The daemon's stderr goes to $PKAD_TEST_LOG or /dev/null. Returns 0 or -1. */
int hc_daemon_start(hc_daemon *d, const char *const *args);
/* SIGTERM, then waits up to timeout seconds (then SIGKILL). Returns the exit status, or
 * -1 when it had to be killed. Safe to call twice. */
int hc_daemon_stop(hc_daemon *d, double timeout);
/* The model flag the tests share with `pkad predict`: the embedded tables when the
 * repository has fragments/sites.tsv, else the unit-test fixture. Static storage. */
const char *const *hc_model_args(void);

#endif
