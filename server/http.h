/* SPDX-License-Identifier: MIT */
/* http.h: the HTTP listener (libmicrohttpd hidden behind it). */
#ifndef PKAD_HTTP_H
#define PKAD_HTTP_H

#include "service.h"

typedef struct srv_http srv_http;

/* Listens on svc->cfg->bind and port (0 = any free port) with one thread per connection
 * and answers every request through the route table. *port receives the bound port.
 * Returns 0, or -1 with msg set. */
int srv_http_start(srv_http **out, srv_service *svc, int *port, char *msg, size_t msgn);
/* Closes the listener and every connection after the handlers running now return.
 * Accepts NULL. */
void srv_http_stop(srv_http *h);

#endif
