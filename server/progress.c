/* SPDX-License-Identifier: MIT */
/* progress.c: the progress line of `pkad predict` (stderr only, so pipes stay clean). */
#include "progress.h"

#include <stdio.h>
#include <time.h>
#include <unistd.h>

/* An automatic progress line appears only for runs longer than this. */
#define AUTO_AFTER_SECONDS 2.0
#define REDRAW_SECONDS 0.25

static double now(void)
{
	struct timespec ts;
	clock_gettime(CLOCK_MONOTONIC, &ts);
	return (double)ts.tv_sec + (double)ts.tv_nsec * 1e-9;
}

void srv_progress_init(srv_progress *p, int mode)
{
	*p = (srv_progress){0};
	p->mode = mode == -1 && !isatty(STDERR_FILENO) ? 0 : mode;
	p->start = p->last = now();
}

static void draw(srv_progress *p, double t)
{
	double rate = t > p->start ? (double)p->done / (t - p->start) : 0.0;
	fprintf(stderr, "\rpkad predict: %zu records, %zu failed, %.0f records/s ", p->done,
		p->failed, rate);
	p->shown = 1;
	p->last = t;
}

void srv_progress_tick(srv_progress *p, int failed)
{
	double t;
	p->done++;
	p->failed += failed != 0;
	/* the clock is read every 64 records only: a tick must cost nothing */
	if (!p->mode || (p->done & 63))
		return;
	t = now();
	if (p->mode == -1 && t - p->start < AUTO_AFTER_SECONDS)
		return;
	if (t - p->last >= REDRAW_SECONDS)
		draw(p, t);
}

void srv_progress_end(srv_progress *p)
{
	if (p->mode == 1 || p->shown) {
		draw(p, now());
		fputc('\n', stderr);
	}
}
