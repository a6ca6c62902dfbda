/* SPDX-License-Identifier: MIT */
/* predict_options.h: the options of `pkad predict`, parsed from one option table. */
#ifndef PKAD_PREDICT_OPTIONS_H
#define PKAD_PREDICT_OPTIONS_H

#include <stddef.h>

#include "output_formats.h"
#include "predictor.h"
#include "record_reader.h"

typedef struct srv_predict_opts {
	pred_options pred;     /* pH, atom limit, time budget, curves */
	srv_output_format out;
	srv_input_format in;
	size_t threads;        /* 0: one per online CPU */
	int progress;          /* -1 automatic (stderr is a terminal and the run is long), 0, 1 */
	const char *fragments; /* NULL: the embedded model */
	char **files;          /* borrowed from argv; none: stdin */
	int n_files;
} srv_predict_opts;

/** Parses argv (argv[0] is "predict"). Returns -1 when the command should run, else the
 *  exit status to return at once: 0 after --help or --version (printed to stdout), 2 for a
 *  usage error (message and usage on stderr). */
int srv_predict_opts_parse(srv_predict_opts *out, int argc, char **argv);

#endif
