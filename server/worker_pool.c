/* SPDX-License-Identifier: MIT */
/* worker_pool.c: a fixed set of prediction threads and their bounded job queue. */
#include "worker_pool.h"

#include <stdlib.h>
#include <string.h>

typedef struct pool_thread {
	pthread_t tid;
	pred_worker *worker;
	srv_pool *pool;
	int started;
} pool_thread;

struct srv_pool {
	pthread_mutex_t mu;
	pthread_cond_t has_job;  /* workers wait here */
	pthread_cond_t has_room; /* blocking submitters wait here */
	srv_job *head, *tail;
	size_t queued, capacity;
	int stopping;
	int n_threads;
	pool_thread *threads;
};

void srv_batch_init(srv_batch *b)
{
	pthread_mutex_init(&b->mu, NULL);
	pthread_cond_init(&b->cv, NULL);
}

void srv_batch_destroy(srv_batch *b)
{
	pthread_cond_destroy(&b->cv);
	pthread_mutex_destroy(&b->mu);
}

void srv_job_wait(srv_job *j)
{
	pthread_mutex_lock(&j->batch->mu);
	while (!j->done)
		pthread_cond_wait(&j->batch->cv, &j->batch->mu);
	pthread_mutex_unlock(&j->batch->mu);
}

/* Next job, or NULL when stopping and the queue is empty. */
static srv_job *pool_take(srv_pool *p)
{
	srv_job *j;

	pthread_mutex_lock(&p->mu);
	while (!p->head && !p->stopping)
		pthread_cond_wait(&p->has_job, &p->mu);
	j = p->head;
	if (j) {
		p->head = j->next;
		if (!p->head)
			p->tail = NULL;
		p->queued--;
		pthread_cond_signal(&p->has_room);
	}
	pthread_mutex_unlock(&p->mu);
	return j;
}

static void *pool_main(void *arg)
{
	pool_thread *t = arg;
	srv_job *j;

	while ((j = pool_take(t->pool)) != NULL) {
		srv_batch *b = j->batch;
		srv_job_run(j, t->worker);
		/* After done is set the submitter may free j: touch only b from here. */
		pthread_mutex_lock(&b->mu);
		j->done = 1;
		pthread_cond_broadcast(&b->cv);
		pthread_mutex_unlock(&b->mu);
	}
	return NULL;
}

int srv_pool_submit(srv_pool *p, srv_job *j, int wait)
{
	pthread_mutex_lock(&p->mu);
	while (wait && p->queued >= p->capacity && !p->stopping)
		pthread_cond_wait(&p->has_room, &p->mu);
	if (p->stopping || p->queued >= p->capacity) {
		pthread_mutex_unlock(&p->mu);
		return -1;
	}
	j->next = NULL;
	j->done = 0;
	if (p->tail)
		p->tail->next = j;
	else
		p->head = j;
	p->tail = j;
	p->queued++;
	pthread_cond_signal(&p->has_job);
	pthread_mutex_unlock(&p->mu);
	return 0;
}

size_t srv_pool_queued(srv_pool *p)
{
	size_t n;

	pthread_mutex_lock(&p->mu);
	n = p->queued;
	pthread_mutex_unlock(&p->mu);
	return n;
}

int srv_pool_threads(const srv_pool *p)
{
	return p->n_threads;
}

/* Creates the workers in this thread (the toolkit state is built before any thread runs
 * it), then starts the threads. */
static int pool_start(srv_pool *p, const pred_model *m, pred_error *err)
{
	for (int i = 0; i < p->n_threads; i++) {
		int rc = pred_worker_new(&p->threads[i].worker, m, err);
		if (rc < 0)
			return rc;
		p->threads[i].pool = p;
	}
	for (int i = 0; i < p->n_threads; i++) {
		if (pthread_create(&p->threads[i].tid, NULL, pool_main, &p->threads[i])) {
			if (err) {
				err->code = PRED_EINTERNAL;
				strcpy(err->msg, "cannot start a worker thread");
			}
			return PRED_EINTERNAL;
		}
		p->threads[i].started = 1;
	}
	return 0;
}

int srv_pool_new(srv_pool **out, const pred_model *m, int threads, int capacity,
		 pred_error *err)
{
	srv_pool *p = calloc(1, sizeof *p);
	int rc;

	*out = NULL;
	if (!p || !(p->threads = calloc(threads > 0 ? (size_t)threads : 1, sizeof *p->threads))) {
		free(p);
		return PRED_ENOMEM;
	}
	pthread_mutex_init(&p->mu, NULL);
	pthread_cond_init(&p->has_job, NULL);
	pthread_cond_init(&p->has_room, NULL);
	p->capacity = (size_t)(capacity > 0 ? capacity : 1);
	p->n_threads = threads;
	rc = pool_start(p, m, err);
	if (rc < 0) {
		srv_pool_free(p);
		return rc;
	}
	*out = p;
	return 0;
}

void srv_pool_free(srv_pool *p)
{
	if (!p)
		return;
	pthread_mutex_lock(&p->mu);
	p->stopping = 1;
	pthread_cond_broadcast(&p->has_job);
	pthread_cond_broadcast(&p->has_room);
	pthread_mutex_unlock(&p->mu);
	for (int i = 0; i < p->n_threads; i++) {
		if (p->threads[i].started)
			pthread_join(p->threads[i].tid, NULL);
		pred_worker_free(p->threads[i].worker);
	}
	pthread_cond_destroy(&p->has_room);
	pthread_cond_destroy(&p->has_job);
	pthread_mutex_destroy(&p->mu);
	free(p->threads);
	free(p);
}
