/* SPDX-License-Identifier: MIT */
/* cmd_fit.c: `pkad fit`: refits the model's parameters on the train split of reference CSVs
 * and writes fragments/params.tsv. */
#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "commands.h"
#include "validate.h"

typedef struct fopts {
	const char *out, *fragments, *match;
	double tier_b_weight, core_weight;
	pred_fit_options fit;
} fopts;

static void usage(FILE *f)
{
	fprintf(f, "usage: pkad fit [options] FILE.csv...\n"
		   "Refits parent pKa, reaction constants, corrections and the fall-off factor on\n"
		   "the rows whose split column is 'train' (the test split is never used).\n\n"
		   "  --out FILE           params file to write (default fragments/params.tsv)\n"
		   "  --fragments DIR      start from the model in DIR\n"
		   "  --folds K            k of the cross-validated class rmse (default 5)\n"
		   "  --tier-b-weight W    weight of rows graded tier B (default 0.25)\n"
		   "  --core-weight W      weight of rows from files with a site_class column, whose\n"
		   "                       site is assigned by hand (default 4)\n"
		   "  --no-falloff         keep the fall-off factor fixed\n"
		   "  --match auto|kind|steps  how a row finds its site (see pkad validate --help)\n"
		   "  --trim X             leave out rows off by more than X at the start\n"
		   "                       (default 3; 0 keeps every row)\n"
		   "  -h, --help           this text\n");
}

static int parse_opts(fopts *o, int argc, char **argv)
{
	static const struct option lo[] = {
		{"out", 1, 0, 'o'},	      {"fragments", 1, 0, 'F'}, {"folds", 1, 0, 'k'},
		{"tier-b-weight", 1, 0, 'b'}, {"no-falloff", 0, 0, 'n'}, {"help", 0, 0, 'h'},
		{"trim", 1, 0, 't'}, {"match", 1, 0, 'm'}, {"core-weight", 1, 0, 'c'},
		{0, 0, 0, 0}};
	int c;
	o->out = "fragments/params.tsv";
	o->match = "auto";
	o->fragments = NULL;
	o->tier_b_weight = 0.25;
	o->core_weight = 4.0;
	pred_fit_options_init(&o->fit);
	optind = 1;
	while ((c = getopt_long(argc, argv, "h", lo, NULL)) != -1) {
		switch (c) {
		case 'o': o->out = optarg; break;
		case 'F': o->fragments = optarg; break;
		case 'k': o->fit.folds = atoi(optarg); break;
		case 'b': o->tier_b_weight = strtod(optarg, NULL); break;
		case 'c': o->core_weight = strtod(optarg, NULL); break;
		case 'n': o->fit.search_falloff = 0; break;
		case 't': o->fit.trim = strtod(optarg, NULL); break;
		case 'm': o->match = optarg; break;
		case 'h': usage(stdout); return 1;
		default: usage(stderr); return 2;
		}
	}
	if (o->fit.folds < 2 || o->fit.folds > 20 || !(o->tier_b_weight > 0) ||
	    !(o->core_weight > 0))
		return fprintf(stderr, "pkad fit: --folds must be 2..20, weights > 0\n"), 2;
	if (srv_match_mode(o->match) < 0)
		return fprintf(stderr, "pkad fit: --match must be auto, kind or steps\n"), 2;
	if (optind >= argc)
		return fprintf(stderr, "pkad fit: no reference CSV given\n"), usage(stderr), 2;
	return 0;
}

/* Appends the train rows of one file to *rows; names the file in the data version. */
static int add_file(pred_fit_row **rows, size_t *n, srv_csv **csv, srv_ref **refs,
		    const char *path, const fopts *o, char *version, pred_error *e)
{
	size_t nr = 0, used = 0, len = strlen(version);
	pred_fit_row *nrows;
	int rc = srv_csv_load(csv, path, e), steps;
	double base_w;
	if (!rc)
		rc = srv_ref_read(refs, &nr, *csv, e);
	if (!rc && srv_csv_column(*csv, "split") < 0) {
		snprintf(e->msg, sizeof e->msg, "%s:1:1: no split column", path);
		rc = PRED_EDATA;
	}
	if (rc)
		return rc;
	steps = srv_match_steps(srv_match_mode(o->match), *csv);
	base_w = srv_csv_column(*csv, "site_class") >= 0 ? o->core_weight : 1.0;
	if (!(nrows = realloc(*rows, (*n + nr + 1) * sizeof *nrows)))
		return snprintf(e->msg, sizeof e->msg, "out of memory"), PRED_ENOMEM;
	*rows = nrows;
	for (size_t i = 0; i < nr; i++) {
		const srv_ref *r = &(*refs)[i];
		if (strcmp(r->split, "train"))
			continue;
		nrows[(*n)++] = (pred_fit_row){r->smiles, r->kind, r->pka_index, r->pka,
					       base_w * (strcmp(r->tier, "B") ? 1.0 : o->tier_b_weight),
					       steps, r->n_steps, r->listed};
		used++;
	}
	if (len < 200) {
		const char *base = strrchr(path, '/');
		snprintf(version + len, 256 - len, "%s%s:%zu train rows", len ? ", " : "",
			 base ? base + 1 : path, used);
	}
	return 0;
}

static void print_summary(const pred_fit_report *rep, const char *out)
{
	pred_fit_summary s;
	pred_fit_report_summary(rep, &s);
	printf("rows %zu, used %zu, unreadable %zu, no matching site %zu, trimmed %zu, "
	       "parameters %zu\n", s.n_rows, s.n_used, s.n_unreadable, s.n_unmatched,
	       s.n_trimmed, s.n_params);
	printf("weighted train rmse %.3f -> %.3f, cross-validated rmse %.3f, fall-off %.3f\n",
	       s.rmse_before, s.rmse_after, s.rmse_cv, s.falloff);
	printf("wrote %s\n", out);
}

static int run(const fopts *o, char **files, int nf)
{
	srv_csv **csv = calloc((size_t)nf + 1, sizeof *csv);
	srv_ref **refs = calloc((size_t)nf + 1, sizeof *refs);
	pred_fit_row *rows = NULL;
	pred_fit_report *rep = NULL;
	pred_model *m = NULL;
	pred_error e = {0, ""};
	char version[256] = "";
	size_t n = 0;
	int rc = csv && refs ? 0 : PRED_ENOMEM;
	for (int i = 0; !rc && i < nf; i++)
		rc = add_file(&rows, &n, &csv[i], &refs[i], files[i], o, version, &e);
	if (!rc && !(rc = pred_global_init(&e)) && !(rc = pred_model_load(&m, o->fragments, &e)))
		rc = pred_fit(&rep, m, rows, n, &o->fit, &e);
	if (!rc)
		rc = pred_fit_write_params(m, rep, o->out, version, &e);
	if (rc)
		fprintf(stderr, "pkad fit: %s\n", e.msg[0] ? e.msg : "out of memory");
	else
		print_summary(rep, o->out);
	pred_fit_report_free(rep);
	pred_model_free(m);
	free(rows);
	for (int i = 0; i < nf && csv && refs; i++) {
		free(refs[i]);
		srv_csv_free(csv[i]);
	}
	free(csv);
	free(refs);
	return rc ? 1 : 0;
}

int cmd_fit(int argc, char **argv)
{
	fopts o;
	int rc = parse_opts(&o, argc, argv);
	if (rc)
		return rc == 1 ? 0 : rc;
	return run(&o, argv + optind, argc - optind);
}
