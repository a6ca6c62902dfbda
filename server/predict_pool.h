/* SPDX-License-Identifier: MIT */
/* predict_pool.h: runs records through worker threads and hands results back in input order. */
#ifndef PKAD_PREDICT_POOL_H
#define PKAD_PREDICT_POOL_H

#include <stddef.h>

#include "predictor.h"
#include "record_reader.h"

/* The three steps of a batch. read and emit run in the calling thread only, process in the
 * worker threads (one pred_worker each). */
typedef struct srv_pool_ops {
	/* Next record: 1 and *out, 0 at the end, negative to stop with an error. */
	int (*read)(void *arg, srv_record **out);
	/* Text for one record (malloc'd, NULL when out of memory); *failed nonzero when the
	 * record got an error. Must be thread-safe across different workers. */
	char *(*process)(void *arg, pred_worker *w, const srv_record *rec, int *failed);
	/* Writes one record's text; negative to stop (write error). */
	int (*emit)(void *arg, const srv_record *rec, const char *text, int failed);
	void *arg;
} srv_pool_ops;

/** Runs the batch with n_workers threads (workers[i] for thread i; n_workers == 1 runs in
 *  the calling thread). At most `window` records are held at once, so memory stays bounded
 *  however long the input. Returns 0, or the first negative code of read/emit (or
 *  PRED_ENOMEM / PRED_EINTERNAL for the pool itself) with err set. */
int srv_pool_run(const srv_pool_ops *ops, pred_worker **workers, size_t n_workers,
		 size_t window, pred_error *err);

#endif
