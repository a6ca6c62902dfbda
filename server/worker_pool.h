/* SPDX-License-Identifier: MIT */
/* worker_pool.h: prediction threads, each owning one pred_worker, fed by a bounded queue. */
#ifndef PKAD_WORKER_POOL_H
#define PKAD_WORKER_POOL_H

#include <pthread.h>
#include <stddef.h>

#include "predictor.h"

/* Completion signal shared by the jobs of one request. */
typedef struct srv_batch {
	pthread_mutex_t mu;
	pthread_cond_t cv;
} srv_batch;

/* One molecule to predict. The submitter owns the job and its input; the worker fills
 * json and code, then sets done under batch->mu and broadcasts batch->cv. */
typedef struct srv_job {
	const char *input;        /* SMILES (text up to the first whitespace is read) */
	const pred_options *opt;
	char *key;                /* malloc'd cache key, set by srv_run_start */
	char *json;               /* malloc'd result or error object without "id" */
	int code;                 /* 0 or the PRED_E* of the molecule */
	int done;
	int cached;               /* answered from the cache, never queued */
	srv_batch *batch;
	struct srv_job *next;
} srv_job;

typedef struct srv_pool srv_pool;

/* Starts threads workers (one pred_worker each) over the read-only model; capacity bounds
 * the jobs waiting. Returns 0 or a PRED_E* with err set. */
int srv_pool_new(srv_pool **out, const pred_model *m, int threads, int capacity,
		 pred_error *err);
/* Runs what is queued, then joins the workers. Accepts NULL. */
void srv_pool_free(srv_pool *p);

/* Queues a job. wait == 0: returns -1 at once when the queue is full (the caller answers
 * 429); otherwise blocks until there is room. Returns 0 when queued. Thread-safe. */
int srv_pool_submit(srv_pool *p, srv_job *j, int wait);

/* Jobs waiting (not yet picked by a worker). */
size_t srv_pool_queued(srv_pool *p);
int srv_pool_threads(const srv_pool *p);

/* Runs one job on this thread's worker: predict, encode. Defined in predict_job.c. */
void srv_job_run(srv_job *j, pred_worker *w);

void srv_batch_init(srv_batch *b);
void srv_batch_destroy(srv_batch *b);
/* Blocks until j->done. */
void srv_job_wait(srv_job *j);

#endif
