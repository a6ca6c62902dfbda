/* SPDX-License-Identifier: MIT */
/* cmd_deprotonate.c: `pkad deprotonate`, will a base deprotonate the acid sites of a SMILES. */
#include <errno.h>
#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "commands.h"
#include "json_deprotonation.h"
#include "json_result.h"
#include "predictor.h"

typedef struct deprot_opts {
	pred_deprot_request req;
	int json;
	int list_bases;
	const char *fragments;
	const char *smiles; /* positional; NULL: SMILES lines from stdin */
} deprot_opts;

static const struct option long_opts[] = {
    {"base", required_argument, NULL, 'b'},   {"equiv", required_argument, NULL, 'e'},
    {"atom", required_argument, NULL, 'a'},   {"list-bases", no_argument, NULL, 'l'},
    {"format", required_argument, NULL, 'f'}, {"fragments", required_argument, NULL, 'F'},
    {"help", no_argument, NULL, 'h'},         {NULL, 0, NULL, 0},
};

static void usage(FILE *f)
{
	fprintf(
	    f,
	    "usage: pkad deprotonate --base NAME|SMILES [--equiv X] [--atom N]\n"
	    "                        [--format text|json] [--fragments DIR] [SMILES]\n"
	    "       pkad deprotonate --list-bases [--format text|json]\n\n"
	    "Says whether a base deprotonates the acid sites of the substrate SMILES (or of\n"
	    "each SMILES line on stdin): delta pKa, equilibrium constant, fraction deprotonated,\n"
	    "verdict, by-product and the handling cautions of the base.\n\n"
	    "  --base NAME|SMILES  a base of the table (see --list-bases) or any base as SMILES\n"
	    "  --equiv X           equivalents of base per substrate (default 1)\n"
	    "  --atom N            only the acid site at input atom N (0-based)\n"
	    "  --list-bases        print the table of reagent bases\n"
	    "  --format text|json  output form (default text; json gives one object per line)\n"
	    "  --fragments DIR     load the model from DIR instead of the built-in one\n");
}

/* "pkad deprotonate: OPT 'ARG' PROBLEM" (arg NULL: "OPT PROBLEM"), usage, exit status 2. */
static int usage_error(const char *opt, const char *arg, const char *problem)
{
	if (arg)
		fprintf(stderr, "pkad deprotonate: %s '%s' %s\n", opt, arg, problem);
	else
		fprintf(stderr, "pkad deprotonate: %s %s\n", opt, problem);
	usage(stderr);
	return 2;
}

static int parse_number(double *out, const char *s)
{
	char *end;
	errno = 0;
	*out = strtod(s, &end);
	return *s && !*end && !errno && isfinite(*out) ? 0 : -1;
}

static int set_option(deprot_opts *o, int c, const char *arg)
{
	double x;
	switch (c) {
	case 'b':
		o->req.base = arg;
		return 0;
	case 'l':
		o->list_bases = 1;
		return 0;
	case 'F':
		o->fragments = arg;
		return 0;
	case 'e':
		if (parse_number(&o->req.equivalents, arg))
			return usage_error("--equiv", arg, "is not a number");
		return 0;
	case 'a':
		if (parse_number(&x, arg) || x < 0 || x != floor(x) || x > 1e6)
			return usage_error("--atom", arg, "is not an atom index (0, 1, 2, ...)");
		o->req.atom = (int)x;
		return 0;
	case 'f':
		if (strcmp(arg, "json") && strcmp(arg, "text"))
			return usage_error("--format", arg, "is not text or json");
		o->json = !strcmp(arg, "json");
		return 0;
	case 'h':
		usage(stdout);
		return 0;
	default:
		usage(stderr);
		return 2;
	}
}

/* Returns -1 to run, else the exit status (0 after --help). */
static int parse_opts(deprot_opts *o, int argc, char **argv)
{
	int c;
	memset(o, 0, sizeof *o);
	pred_deprot_request_init(&o->req);
	optind = 1;
	while ((c = getopt_long(argc, argv, "", long_opts, NULL)) != -1) {
		int st = set_option(o, c, optarg);
		if (st || c == 'h')
			return c == 'h' ? 0 : st;
	}
	if (optind < argc - 1)
		return usage_error("argument", argv[optind + 1], "is extra: give one SMILES");
	o->smiles = optind < argc ? argv[optind] : NULL;
	if (!o->list_bases && !o->req.base)
		return usage_error("--base NAME|SMILES", NULL, "is required (see --list-bases)");
	return -1;
}

static void print_base_text(const pred_base_info *b)
{
	printf("%s", b->name);
	if (*b->aliases)
		printf(" (%s)", b->aliases);
	printf("\n  conjugate acid %s %s, pKa %.4g (%s", b->conjugate_acid,
	       b->conjugate_acid_smiles, b->pka, b->scale);
	if (isfinite(b->pka_dmso) && strcmp(b->scale, "dmso"))
		printf("; DMSO %.4g", b->pka_dmso);
	printf(")\n  by-product: %s\n  hazards: %s\n  source: %s\n", b->byproduct, b->hazards,
	       b->source);
}

static int list_bases(const pred_model *m, int json)
{
	if (json) {
		char *s = srv_json_line(srv_bases_json(m));
		if (!s)
			return 1;
		printf("%s\n", s);
		cJSON_free(s);
		return 0;
	}
	for (size_t i = 0; i < pred_base_count(m); i++) {
		pred_base_info b;
		pred_base(&b, m, i);
		print_base_text(&b);
	}
	printf("\nHazards are reminders, not a safety data sheet: local rules and institutional "
	       "safety practice govern.\n");
	return 0;
}

static void print_site_text(const pred_deprot_site *s)
{
	printf("site: atom %d (%s, %s), pKa %.2f +- %.2f\n", s->atom, s->element, s->group, s->pka,
	       s->uncertainty);
	printf("  delta pKa %+.2f, K = 10^%.2f, deprotonated at equilibrium: %.1f%%  -> %s\n",
	       s->delta_pka, s->log_k, 100 * s->fraction, s->verdict);
}

static void print_list(const char *title, size_t n,
                       const char *(*get)(const pred_deprotonation *, size_t),
                       const pred_deprotonation *d)
{
	if (!n)
		return;
	printf("%s:\n", title);
	for (size_t i = 0; i < n; i++)
		printf("  - %s\n", get(d, i));
}

static void print_text(const pred_deprotonation *d)
{
	printf("substrate: %s\n", pred_deprotonation_substrate(d));
	printf("base: %s, %.2f equivalents\n", pred_deprotonation_base(d),
	       pred_deprotonation_equivalents(d));
	printf("  conjugate acid %s, pKa %.2f (%s%s)\n", pred_deprotonation_conjugate_acid(d),
	       pred_deprotonation_base_pka(d), pred_deprotonation_scale(d),
	       pred_deprotonation_base_is_predicted(d) ? ", predicted by pkad" : "");
	for (size_t i = 0; i < pred_deprotonation_site_count(d); i++)
		print_site_text(pred_deprotonation_site(d, i));
	printf("by-product: %s\n", pred_deprotonation_byproduct(d));
	print_list("warnings", pred_deprotonation_warning_count(d), pred_deprotonation_warning, d);
	print_list("cautions", pred_deprotonation_caution_count(d), pred_deprotonation_caution, d);
}

static void print_error(const deprot_opts *o, const char *id, const char *input,
                        const pred_error *e)
{
	fprintf(stderr, "pkad deprotonate: %s%s%s\n", id ? id : "", id ? ": " : "", e->msg);
	if (!o->json)
		return;
	char *s = srv_json_line(srv_error_json(id, input, e));
	if (s)
		printf("%s\n", s);
	cJSON_free(s);
}

static int run_one(const deprot_opts *o, pred_worker *w, const char *smiles, const char *id)
{
	pred_deprot_request req = o->req;
	pred_deprotonation *d = NULL;
	pred_error e = {0};
	req.substrate = smiles;
	if (pred_deprotonate(&d, w, &req, NULL, &e) < 0) {
		print_error(o, id, smiles, &e);
		return 1;
	}
	if (o->json) {
		char *s = srv_json_line(srv_deprotonation_json(d, id, smiles));
		if (s)
			printf("%s\n", s);
		cJSON_free(s);
	} else {
		print_text(d);
	}
	pred_deprotonation_free(d);
	return 0;
}

/* One result per stdin line (SMILES[ whitespace id]), in order; blank lines are skipped. */
static int run_stdin(const deprot_opts *o, pred_worker *w)
{
	char *line = NULL;
	size_t cap = 0;
	int failed = 0, first = 1;
	while (getline(&line, &cap, stdin) > 0) {
		char *smi = line + strspn(line, " \t"), *id = smi + strcspn(smi, " \t\r\n");
		int has_id = *id == ' ' || *id == '\t';
		*id = '\0';
		if (has_id) {
			id += 1 + strspn(id + 1, " \t");
			id[strcspn(id, "\r\n")] = '\0';
		}
		if (!*smi)
			continue;
		if (!o->json && !first)
			printf("\n");
		first = 0;
		failed |= run_one(o, w, smi, has_id && *id ? id : NULL);
	}
	free(line);
	return failed;
}

int cmd_deprotonate(int argc, char **argv)
{
	deprot_opts o;
	pred_model *m = NULL;
	pred_worker *w = NULL;
	pred_error e = {0};
	int st = parse_opts(&o, argc, argv);
	if (st >= 0)
		return st;
	st = 1;
	if (pred_global_init(&e) < 0 || pred_model_load(&m, o.fragments, &e) < 0 ||
	    pred_worker_new(&w, m, &e) < 0) {
		fprintf(stderr, "pkad deprotonate: %s\n", e.msg);
		goto done;
	}
	if (o.list_bases)
		st = list_bases(m, o.json);
	else
		st = o.smiles ? run_one(&o, w, o.smiles, NULL) : run_stdin(&o, w);
done:
	pred_worker_free(w);
	pred_model_free(m);
	return st;
}
