/* SPDX-License-Identifier: MIT */
/* predict_job.h: an ordered run of molecules of one request through the cache and pool. */
#ifndef PKAD_PREDICT_JOB_H
#define PKAD_PREDICT_JOB_H

#include "service.h"
#include "strbuf.h"
#include "worker_pool.h"

/* The molecules of one request, started in input order and finished in input order; at
 * most `window` are with the workers at once, so one request keeps every worker busy
 * without filling the queue. */
typedef struct srv_run {
	srv_service *svc;
	srv_batch batch;
	pred_options opt;
	size_t window;
	int admitted; /* a job was queued: later ones wait for room instead of failing */
} srv_run;

void srv_run_init(srv_run *run, srv_service *svc, double ph, int curves);
void srv_run_destroy(srv_run *run);

/* Answers j (input set by the caller) from the cache or queues it. Returns 0, or -1 when
 * the queue is full before this request got any job in (the caller answers 429; j is then
 * finished already). */
int srv_run_start(srv_run *run, srv_job *j);
/* Waits for j and stores a fresh answer in the cache; j->json stays with the caller. */
void srv_run_finish(srv_run *run, srv_job *j);
/* Frees what a finished job holds. */
void srv_job_clear(srv_job *j);

/* Appends the answer of j with "id" first when id is not NULL: the same text
 * srv_result_text(r, id, input) gives. */
void srv_job_append(srv_buf *b, const srv_job *j, const char *id);

#endif
