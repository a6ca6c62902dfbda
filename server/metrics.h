/* SPDX-License-Identifier: MIT */
/* metrics.h: request counters and latency histogram, rendered as Prometheus text. */
#ifndef PKAD_METRICS_H
#define PKAD_METRICS_H

#include <stddef.h>

#include "service.h"

/* Counters for n_routes routes plus one slot (index n_routes) for unmatched paths.
 * NULL when out of memory; srv_metrics_free accepts NULL. Thread-safe. */
srv_metrics *srv_metrics_new(size_t n_routes);
void srv_metrics_free(srv_metrics *m);

/* One finished request: route index, HTTP status, duration, molecules answered and how
 * many of them were per-item errors. */
void srv_metrics_request(srv_metrics *m, size_t route, int status, double seconds,
			 int molecules, int item_errors);

/* Prometheus text exposition format 0.0.4 of every counter, with the cache, queue and
 * in-flight gauges of svc. Malloc'd; NULL when out of memory. */
char *srv_metrics_render(srv_metrics *m, srv_service *svc);

#endif
