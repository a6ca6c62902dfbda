/* SPDX-License-Identifier: MIT */
/* cmd_validate.c: `pkad validate`: scores the model against reference CSV files. */
#include <cjson/cJSON.h>
#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "commands.h"
#include "json_result.h"
#include "json_validate.h"
#include "validate.h"

typedef struct vopts {
	const char *split, *plot, *kind, *tier, *format, *fragments, *title, *match;
	size_t worst;
} vopts;

/* The loaded inputs of one file, kept alive until the report is printed. */
typedef struct vfile {
	srv_csv *csv;
	srv_ref *rows;
	size_t n;
} vfile;

static void usage(FILE *f)
{
	fprintf(f, "usage: pkad validate [options] FILE.csv...\n"
		   "Scores the predicted pKa of the matching site against each reference row.\n\n"
		   "  --split test|train|all   rows of this split only (default all)\n"
		   "  --kind acid|base         rows of this kind only\n"
		   "  --tier T                 rows whose tier column is T (files with one)\n"
		   "  --format text|json|markdown   report format (default text)\n"
		   "  --worst N                list the N worst rows (default 20)\n"
		   "  --match auto|kind|steps  kind: the i-th site of the row's kind; steps: ranked\n"
		   "                           with the other kind's sites of pKa 1..13 unless the\n"
		   "                           molecule has no more rows of the kind than sites of\n"
		   "                           that kind in 1..13; where the molecule has more steps\n"
		   "                           in the window than the highest listed index, the\n"
		   "                           listed steps are paired with the predicted ones by\n"
		   "                           value, in order; auto (default): steps for files\n"
		   "                           without site_class\n"
		   "  --plot FILE.svg          write a parity plot\n"
		   "  --title TEXT             title of the plot and the Markdown section\n"
		   "  --fragments DIR          load the model from DIR\n"
		   "  -h, --help               this text\n");
}

static int parse_opts(vopts *o, int argc, char **argv)
{
	static const struct option lo[] = {
		{"split", 1, 0, 's'}, {"plot", 1, 0, 'p'},	{"kind", 1, 0, 'k'},
		{"tier", 1, 0, 't'},  {"format", 1, 0, 'f'},	{"worst", 1, 0, 'w'},
		{"title", 1, 0, 'T'}, {"fragments", 1, 0, 'F'}, {"help", 0, 0, 'h'},
		{"match", 1, 0, 'm'}, {0, 0, 0, 0}};
	int c;
	*o = (vopts){"all", NULL, NULL, NULL, "text", NULL, "pkad validation", "auto", 20};
	optind = 1;
	while ((c = getopt_long(argc, argv, "h", lo, NULL)) != -1) {
		switch (c) {
		case 's': o->split = optarg; break;
		case 'p': o->plot = optarg; break;
		case 'k': o->kind = optarg; break;
		case 't': o->tier = optarg; break;
		case 'f': o->format = optarg; break;
		case 'w': o->worst = (size_t)strtoul(optarg, NULL, 10); break;
		case 'T': o->title = optarg; break;
		case 'F': o->fragments = optarg; break;
		case 'm': o->match = optarg; break;
		case 'h': usage(stdout); return 1;
		default: usage(stderr); return 2;
		}
	}
	if (strcmp(o->split, "test") && strcmp(o->split, "train") && strcmp(o->split, "all"))
		return fprintf(stderr, "pkad validate: --split must be test, train or all\n"), 2;
	if (srv_match_mode(o->match) < 0)
		return fprintf(stderr, "pkad validate: --match must be auto, kind or steps\n"), 2;
	if (o->kind && strcmp(o->kind, "acid") && strcmp(o->kind, "base"))
		return fprintf(stderr, "pkad validate: --kind must be acid or base\n"), 2;
	if (strcmp(o->format, "text") && strcmp(o->format, "json") && strcmp(o->format, "markdown"))
		return fprintf(stderr, "pkad validate: --format must be text, json or markdown\n"), 2;
	if (optind >= argc)
		return fprintf(stderr, "pkad validate: no reference CSV given\n"), usage(stderr), 2;
	return 0;
}

static int keep(const srv_ref *r, const vopts *o, int has_tier)
{
	if (strcmp(o->split, "all") && strcmp(r->split, o->split))
		return 0;
	if (o->kind && r->kind != (strcmp(o->kind, "acid") ? PRED_BASE : PRED_ACID))
		return 0;
	return !o->tier || !has_tier || !strcmp(r->tier, o->tier);
}

/* Loads one file and keeps the rows that pass the filters (in file order). */
static int load_file(vfile *vf, const char *path, const vopts *o, pred_error *e)
{
	size_t m = 0;
	int rc = srv_csv_load(&vf->csv, path, e);
	if (!rc)
		rc = srv_ref_read(&vf->rows, &vf->n, vf->csv, e);
	if (!rc && strcmp(o->split, "all") && srv_csv_column(vf->csv, "split") < 0) {
		snprintf(e->msg, sizeof e->msg, "%s:1:1: no split column for --split %s", path,
			 o->split);
		rc = PRED_EDATA;
	}
	for (size_t i = 0; !rc && i < vf->n; i++)
		if (keep(&vf->rows[i], o, srv_csv_column(vf->csv, "tier") >= 0))
			vf->rows[m++] = vf->rows[i];
	vf->n = m;
	return rc;
}

static int report(const srv_validation *v, const vopts *o)
{
	if (!strcmp(o->format, "json")) {
		char *s = srv_json_line(srv_validation_json(v, o->worst));
		if (!s)
			return fprintf(stderr, "pkad validate: out of memory\n"), 1;
		puts(s);
		cJSON_free(s);
	} else if (!strcmp(o->format, "markdown")) {
		srv_validation_print_markdown(stdout, v, o->worst, o->title);
	} else {
		srv_validation_print_text(stdout, v, o->worst);
	}
	if (o->plot && srv_validation_plot(v, o->plot, o->title))
		return fprintf(stderr, "pkad validate: %s: cannot write the plot\n", o->plot), 1;
	return ferror(stdout) ? 1 : 0;
}

static int run(const vopts *o, char **files, int nf)
{
	vfile *vf = calloc((size_t)nf + 1, sizeof *vf);
	srv_validation v = {0};
	pred_model *m = NULL;
	pred_worker *w = NULL;
	pred_error e = {0, ""};
	int rc = vf ? 0 : PRED_ENOMEM, status = 1;
	for (int i = 0; !rc && i < nf; i++)
		rc = load_file(&vf[i], files[i], o, &e);
	if (!rc && !(rc = pred_global_init(&e)) && !(rc = pred_model_load(&m, o->fragments, &e)))
		rc = pred_worker_new(&w, m, &e);
	for (int i = 0; !rc && i < nf; i++)
		if ((rc = srv_validation_add(&v, w, vf[i].rows, vf[i].n, files[i],
					     srv_match_steps(srv_match_mode(o->match), vf[i].csv))))
			snprintf(e.msg, sizeof e.msg, "out of memory");
	if (rc)
		fprintf(stderr, "pkad validate: %s\n", e.msg[0] ? e.msg : "out of memory");
	else
		status = report(&v, o);
	srv_validation_clear(&v);
	pred_worker_free(w);
	pred_model_free(m);
	for (int i = 0; vf && i < nf; i++) {
		free(vf[i].rows);
		srv_csv_free(vf[i].csv);
	}
	free(vf);
	return status;
}

int cmd_validate(int argc, char **argv)
{
	vopts o;
	int rc = parse_opts(&o, argc, argv);
	if (rc)
		return rc == 1 ? 0 : rc;
	return run(&o, argv + optind, argc - optind);
}
