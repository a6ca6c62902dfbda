/* SPDX-License-Identifier: MIT */
/* service.h: the daemon's configuration and shared state, handed to every route handler. */
#ifndef PKAD_SERVICE_H
#define PKAD_SERVICE_H

#include <pthread.h>
#include <stdatomic.h>
#include <stddef.h>

#include "predictor.h"

typedef struct srv_pool srv_pool;
typedef struct srv_cache srv_cache;
typedef struct srv_metrics srv_metrics;

/* Every limit is a `pkad serve` flag; defaults in cmd_serve.c. */
typedef struct srv_config {
	const char *bind;      /* listen address, default 127.0.0.1 */
	int port;              /* 0 = any free port */
	int threads;           /* prediction workers */
	size_t max_body;       /* bytes of a JSON body; bytes of one NDJSON record */
	int max_batch;         /* molecules in one JSON batch */
	int max_atoms;         /* heavy atoms per molecule */
	double timeout;        /* seconds per molecule */
	int max_connections;   /* concurrent connections */
	int queue;             /* molecules waiting for a worker */
	int cache_size;        /* cached results (entries); 0 disables the cache */
	double grace;          /* seconds to finish in-flight work after SIGTERM */
	const char *token_file;
	const char *fragments; /* NULL: the embedded model */
	int log_smiles;
} srv_config;

/* Shared by all connection threads; fields are set before the HTTP layer starts and only
 * the atomics change afterwards. */
typedef struct srv_service {
	const srv_config *cfg;
	const pred_model *model;
	srv_pool *pool;
	srv_cache *cache;
	srv_metrics *metrics;
	const char *token; /* NULL: no authentication */
	size_t token_len;
	atomic_int draining; /* SIGTERM seen: answer 503 */
	atomic_long in_flight;
	pthread_mutex_t parse_mu; /* cJSON's parser writes a process-wide error position */
} srv_service;

/* Fills the prediction options of a request from the service limits. */
void srv_service_options(pred_options *out, const srv_service *svc, double ph, int curves);

/* Parses JSON text of length n under parse_mu. Returns the tree (cJSON_Delete) or NULL
 * with *err_at the byte offset where parsing stopped. */
struct cJSON *srv_json_parse(srv_service *svc, const char *text, size_t n, size_t *err_at);

#endif
