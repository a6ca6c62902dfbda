/* SPDX-License-Identifier: MIT */
/* predict_options.c: one option table for `pkad predict`: parsing, checks and usage text. */
#include "predict_options.h"

#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

typedef int (*opt_setter)(srv_predict_opts *o, const char *arg);

typedef struct opt_row {
	const char *name;
	const char *arg; /* NULL: a flag */
	opt_setter set;
	const char *help;
} opt_row;

/* Strict number parsing: the whole argument, finite, within [lo, hi]. */
static int parse_double(double *out, const char *s, double lo, double hi)
{
	char *end;
	double x = strtod(s, &end);
	if (end == s || *end || !isfinite(x) || x < lo || x > hi)
		return -1;
	*out = x;
	return 0;
}

static int parse_size(size_t *out, const char *s, double lo, double hi)
{
	double x;
	if (parse_double(&x, s, lo, hi) < 0 || x != floor(x))
		return -1;
	*out = (size_t)x;
	return 0;
}

static int bad_value(const char *opt, const char *arg, const char *want)
{
	fprintf(stderr, "pkad predict: --%s: '%s' is not %s\n", opt, arg, want);
	return -1;
}

static int set_ph(srv_predict_opts *o, const char *a)
{
	if (parse_double(&o->pred.ph, a, -2.0, 16.0) < 0)
		return bad_value("ph", a, "a pH between -2 and 16");
	return 0;
}

static int set_format(srv_predict_opts *o, const char *a)
{
	if (srv_output_format_parse(&o->out, a) < 0)
		return bad_value("format", a, "one of jsonl, csv, sdf");
	return 0;
}

static int set_format_in(srv_predict_opts *o, const char *a)
{
	if (srv_input_format_parse(&o->in, a) < 0)
		return bad_value("format-in", a, "one of auto, smiles, sdf");
	return 0;
}

static int set_threads(srv_predict_opts *o, const char *a)
{
	if (parse_size(&o->threads, a, 0, 256) < 0)
		return bad_value("threads", a, "a whole number from 0 (one per CPU) to 256");
	return 0;
}

static int set_max_atoms(srv_predict_opts *o, const char *a)
{
	size_t n;
	if (parse_size(&n, a, 1, 100000) < 0)
		return bad_value("max-atoms", a, "a whole number from 1 to 100000");
	o->pred.max_heavy_atoms = (int)n;
	return 0;
}

static int set_timeout(srv_predict_opts *o, const char *a)
{
	if (parse_double(&o->pred.max_seconds, a, 0.001, 86400.0) < 0)
		return bad_value("timeout", a, "a number of seconds from 0.001 to 86400");
	return 0;
}

static int set_progress(srv_predict_opts *o, const char *a)
{
	(void)a;
	o->progress = 1;
	return 0;
}

static int set_no_progress(srv_predict_opts *o, const char *a)
{
	(void)a;
	o->progress = 0;
	return 0;
}

static int set_curves(srv_predict_opts *o, const char *a)
{
	(void)a;
	o->pred.curves = 1;
	return 0;
}

static int set_fragments(srv_predict_opts *o, const char *a)
{
	o->fragments = a;
	return 0;
}

/* --help and --version answer at once; their setters only mark which one was asked. */
enum { ASK_NONE = 0, ASK_HELP, ASK_VERSION };

static const opt_row rows[] = {
	{"ph", "X", set_ph, "pH of the charge and species block (-2..16, default 7.4)"},
	{"format", "F", set_format, "output: jsonl (default), csv or sdf"},
	{"format-in", "F", set_format_in, "input: auto (default), smiles or sdf"},
	{"threads", "N", set_threads, "worker threads (default 1; 0: one per CPU)"},
	{"max-atoms", "N", set_max_atoms, "heavy-atom limit per molecule (default 200)"},
	{"timeout", "S", set_timeout, "time budget per molecule in seconds (default 10)"},
	{"curves", NULL, set_curves, "add charge and species curves over pH 0..14"},
	{"fragments", "DIR", set_fragments, "load the model from DIR instead of the built-in one"},
	{"progress", NULL, set_progress, "show progress on stderr (default: on a terminal)"},
	{"no-progress", NULL, set_no_progress, "never show progress"},
	{"version", NULL, NULL, "print the version and exit"},
	{"help", NULL, NULL, "print this help and exit"},
};
#define N_ROWS (sizeof rows / sizeof rows[0])

static void usage(FILE *f)
{
	fprintf(f, "usage: pkad predict [options] [FILE|-]...\n\n"
		   "Predicts the pKa of every site of each record: SMILES lines (SMILES [ID]) or\n"
		   "SD records. Writes one result per record, in input order, to stdout.\n\n"
		   "options:\n");
	for (size_t i = 0; i < N_ROWS; i++) {
		char left[32];
		snprintf(left, sizeof left, "--%s%s%s", rows[i].name, rows[i].arg ? " " : "",
			 rows[i].arg ? rows[i].arg : "");
		fprintf(f, "  %-18s %s\n", left, rows[i].help);
	}
	fprintf(f, "\nexit status: 0 all records predicted, 1 some record failed, 2 usage error\n");
}

static void defaults(srv_predict_opts *o)
{
	memset(o, 0, sizeof *o);
	pred_options_init(&o->pred);
	o->out = SRV_OUT_JSONL;
	o->in = SRV_IN_AUTO;
	o->threads = 1;
	o->progress = -1;
}

/* Applies option row i; returns 0, ASK_* for help/version, or -1 on a bad value. */
static int apply(srv_predict_opts *o, size_t i, const char *arg)
{
	if (!strcmp(rows[i].name, "help"))
		return ASK_HELP;
	if (!strcmp(rows[i].name, "version"))
		return ASK_VERSION;
	return rows[i].set(o, arg);
}

int srv_predict_opts_parse(srv_predict_opts *out, int argc, char **argv)
{
	struct option longopts[N_ROWS + 1];
	int idx, c, ask = ASK_NONE;
	defaults(out);
	for (size_t i = 0; i < N_ROWS; i++)
		longopts[i] = (struct option){rows[i].name, rows[i].arg ? required_argument
									: no_argument, NULL, 0};
	longopts[N_ROWS] = (struct option){NULL, 0, NULL, 0};
	static char prog[] = "pkad predict";
	argv[0] = prog; /* getopt's own messages then name the command */
	optind = 1;
	opterr = 1;
	while (ask == ASK_NONE && (c = getopt_long(argc, argv, "h", longopts, &idx)) != -1) {
		int st = c == 'h' ? ASK_HELP : c == 0 ? apply(out, (size_t)idx, optarg) : -1;
		if (st < 0) {
			usage(stderr);
			return 2;
		}
		ask = st;
	}
	if (ask == ASK_HELP)
		usage(stdout);
	if (ask == ASK_VERSION)
		printf("pkad %s\n", pred_version());
	if (ask != ASK_NONE)
		return 0;
	out->files = argv + optind;
	out->n_files = argc - optind;
	return -1;
}
