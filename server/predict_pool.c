/* SPDX-License-Identifier: MIT */
/* predict_pool.c: worker threads over a bounded ring of records, written back in order. */
#include "predict_pool.h"

#include <pthread.h>
#include <stdio.h>
#include <stdlib.h>

/* A slot of the reorder window: queued by the reader, done by a worker, freed by emit. */
enum { SLOT_FREE = 0, SLOT_QUEUED, SLOT_DONE };

typedef struct slot {
	srv_record *rec;
	char *text;
	int failed;
	int state;
} slot;

typedef struct pool {
	const srv_pool_ops *ops;
	slot *slots;
	size_t window;
	size_t n_read, n_claimed, n_written; /* sequence numbers; n_written <= n_claimed <= n_read */
	int closed;                          /* no more records will be queued */
	pthread_mutex_t mu;
	pthread_cond_t work, done;
} pool;

typedef struct worker_arg {
	pool *p;
	pred_worker *w;
} worker_arg;

static void *worker_main(void *arg)
{
	worker_arg *wa = arg;
	pool *p = wa->p;
	pthread_mutex_lock(&p->mu);
	for (;;) {
		while (p->n_claimed == p->n_read && !p->closed)
			pthread_cond_wait(&p->work, &p->mu);
		if (p->n_claimed == p->n_read)
			break;
		slot *s = &p->slots[p->n_claimed++ % p->window];
		pthread_mutex_unlock(&p->mu);
		int failed = 0;
		char *text = p->ops->process(p->ops->arg, wa->w, s->rec, &failed);
		pthread_mutex_lock(&p->mu);
		s->text = text, s->failed = failed, s->state = SLOT_DONE;
		pthread_cond_signal(&p->done);
	}
	pthread_mutex_unlock(&p->mu);
	return NULL;
}

static void slot_clear(slot *s)
{
	srv_record_free(s->rec);
	free(s->text);
	s->rec = NULL, s->text = NULL, s->state = SLOT_FREE;
}

/* With the lock held: writes the finished records that are next in order. With wait_one,
 * blocks until at least one was written (or none is outstanding). */
static int drain(pool *p, int wait_one)
{
	int emitted = 0;
	while (p->n_written < p->n_read) {
		slot *s = &p->slots[p->n_written % p->window];
		if (s->state != SLOT_DONE) {
			if (!wait_one || emitted)
				return 0;
			pthread_cond_wait(&p->done, &p->mu);
			continue;
		}
		pthread_mutex_unlock(&p->mu);
		int rc = p->ops->emit(p->ops->arg, s->rec, s->text, s->failed || !s->text);
		pthread_mutex_lock(&p->mu);
		slot_clear(s);
		p->n_written++, emitted = 1;
		if (rc < 0)
			return rc;
	}
	return 0;
}

/* The calling thread reads and writes; it only blocks when the window is full. */
static int feed(pool *p)
{
	int rc = 0;
	pthread_mutex_lock(&p->mu);
	while (rc == 0) {
		int full = p->n_read - p->n_written == p->window;
		rc = drain(p, full);
		if (rc || full)
			continue;
		pthread_mutex_unlock(&p->mu);
		srv_record *rec = NULL;
		int st = p->ops->read(p->ops->arg, &rec);
		pthread_mutex_lock(&p->mu);
		if (st <= 0) {
			rc = st < 0 ? st : 1;
			break;
		}
		slot *s = &p->slots[p->n_read++ % p->window];
		s->rec = rec, s->state = SLOT_QUEUED;
		pthread_cond_signal(&p->work);
	}
	while (rc == 1 && p->n_written < p->n_read) {
		int d = drain(p, 1);
		rc = d < 0 ? d : rc;
	}
	p->closed = 1;
	pthread_cond_broadcast(&p->work);
	pthread_mutex_unlock(&p->mu);
	return rc == 1 ? 0 : rc;
}

static int run_inline(const srv_pool_ops *ops, pred_worker *w)
{
	for (;;) {
		srv_record *rec = NULL;
		int failed = 0, rc = ops->read(ops->arg, &rec);
		if (rc <= 0)
			return rc;
		char *text = ops->process(ops->arg, w, rec, &failed);
		rc = ops->emit(ops->arg, rec, text, failed || !text);
		free(text);
		srv_record_free(rec);
		if (rc < 0)
			return rc;
	}
}

static int pool_init(pool *p, const srv_pool_ops *ops, size_t window)
{
	p->ops = ops;
	p->window = window;
	p->slots = calloc(window, sizeof *p->slots);
	if (!p->slots)
		return PRED_ENOMEM;
	pthread_mutex_init(&p->mu, NULL);
	pthread_cond_init(&p->work, NULL);
	pthread_cond_init(&p->done, NULL);
	return 0;
}

static void pool_destroy(pool *p)
{
	for (size_t i = 0; i < p->window; i++)
		slot_clear(&p->slots[i]);
	free(p->slots);
	pthread_mutex_destroy(&p->mu);
	pthread_cond_destroy(&p->work);
	pthread_cond_destroy(&p->done);
}

static size_t start_workers(pool *p, pthread_t *tids, worker_arg *args, pred_worker **workers,
			    size_t n)
{
	size_t started = 0;
	for (; started < n; started++) {
		args[started] = (worker_arg){p, workers[started]};
		if (pthread_create(&tids[started], NULL, worker_main, &args[started]))
			break;
	}
	return started;
}

static void stop_workers(pool *p, pthread_t *tids, size_t started)
{
	pthread_mutex_lock(&p->mu);
	p->closed = 1;
	pthread_cond_broadcast(&p->work);
	pthread_mutex_unlock(&p->mu);
	for (size_t i = 0; i < started; i++)
		pthread_join(tids[i], NULL);
}

int srv_pool_run(const srv_pool_ops *ops, pred_worker **workers, size_t n_workers,
		 size_t window, pred_error *err)
{
	pool p = {0};
	pthread_t *tids = NULL;
	worker_arg *args = NULL;
	size_t started = 0;
	int rc;
	if (n_workers <= 1)
		return run_inline(ops, workers[0]);
	rc = pool_init(&p, ops, window < 2 * n_workers ? 2 * n_workers : window);
	tids = calloc(n_workers, sizeof *tids);
	args = calloc(n_workers, sizeof *args);
	if (rc || !tids || !args)
		rc = PRED_ENOMEM;
	if (rc == 0 && (started = start_workers(&p, tids, args, workers, n_workers)) < n_workers)
		rc = PRED_EINTERNAL;
	if (rc == 0)
		rc = feed(&p);
	if (p.slots) {
		stop_workers(&p, tids, started);
		pool_destroy(&p);
	}
	if (rc && err && !err->code) {
		err->code = rc;
		snprintf(err->msg, sizeof err->msg, "%s", pred_status_name(rc));
	}
	free(tids);
	free(args);
	return rc;
}
