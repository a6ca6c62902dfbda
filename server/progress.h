/* SPDX-License-Identifier: MIT */
/* progress.h: a one-line progress report on stderr for long batches. */
#ifndef PKAD_PROGRESS_H
#define PKAD_PROGRESS_H

#include <stddef.h>

typedef struct srv_progress {
	int mode;        /* -1 automatic, 0 off, 1 on */
	int shown;       /* a line was drawn and needs its newline */
	size_t done;     /* records written */
	size_t failed;   /* of which with an error */
	double start;    /* monotonic seconds */
	double last;     /* time of the last redraw */
} srv_progress;

/** mode -1 shows progress only when stderr is a terminal and the run takes over 2 s. */
void srv_progress_init(srv_progress *p, int mode);
/** Counts one written record and redraws at most a few times a second. */
void srv_progress_tick(srv_progress *p, int failed);
/** Draws the final figures (when progress was shown) and ends the line. */
void srv_progress_end(srv_progress *p);

#endif
