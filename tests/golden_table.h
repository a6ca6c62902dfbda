/* SPDX-License-Identifier: MIT */
/* golden_table.h: reads tests/golden.tsv and checks one case against a list of sites; shared
 * by the library runner and the CLI runner so both apply the same rule. */
#ifndef PKAD_GOLDEN_TABLE_H
#define PKAD_GOLDEN_TABLE_H

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"

typedef struct golden_case {
	char smiles[256];
	int atom;
	char kind[8];
	char group[64];
	double pka, tol;
	char name[128];
	int line;
} golden_case;

/* A site as either runner sees it. */
typedef struct golden_site {
	int atom;
	const char *kind;
	const char *group;
	double pka;
} golden_site;

static int golden_field(char *dst, size_t n, char **p)
{
	char *tab = strchr(*p, '\t');
	size_t len = tab ? (size_t)(tab - *p) : strcspn(*p, "\r\n");
	if (len >= n)
		return -1;
	memcpy(dst, *p, len);
	dst[len] = '\0';
	*p = tab ? tab + 1 : *p + len;
	return tab ? 0 : 1;
}

/* One data row: smiles atom kind group pka tol name source. Returns 0 or -1. */
static int golden_parse_row(golden_case *c, char *line)
{
	char atom[16], pka[32], tol[32], *p = line;
	if (golden_field(c->smiles, sizeof c->smiles, &p) || golden_field(atom, sizeof atom, &p) ||
	    golden_field(c->kind, sizeof c->kind, &p) || golden_field(c->group, sizeof c->group, &p) ||
	    golden_field(pka, sizeof pka, &p) || golden_field(tol, sizeof tol, &p) ||
	    golden_field(c->name, sizeof c->name, &p) || !*p)
		return -1; /* the source column must be there and non-empty */
	c->atom = atoi(atom);
	c->pka = strtod(pka, NULL);
	c->tol = strtod(tol, NULL);
	return c->tol > 0 ? 0 : -1;
}

/* Loads $PKAD_SOURCE_DIR/tests/golden.tsv; returns the case count (0 on failure). */
static size_t golden_load(golden_case **out)
{
	const char *src = getenv("PKAD_SOURCE_DIR");
	char path[4096], line[4096];
	size_t n = 0, cap = 0;
	int lineno = 0, header = 1;
	FILE *f;
	*out = NULL;
	snprintf(path, sizeof path, "%s/tests/golden.tsv", src ? src : ".");
	if (!(f = fopen(path, "r"))) {
		fprintf(stderr, "cannot open %s (is PKAD_SOURCE_DIR set?)\n", path);
		return 0;
	}
	while (fgets(line, sizeof line, f)) {
		lineno++;
		if (line[0] == '#' || line[0] == '\n')
			continue;
		if (header) {
			header = 0;
			continue;
		}
		if (n == cap)
			*out = realloc(*out, (cap = cap ? 2 * cap : 64) * sizeof **out);
		if (golden_parse_row(&(*out)[n], line) < 0) {
			fprintf(stderr, "golden.tsv:%d: malformed row\n", lineno);
			harness_failures++;
			continue;
		}
		(*out)[n++].line = lineno;
	}
	fclose(f);
	return n;
}

/* The case holds when a site of its kind and group sits on its atom, within tol. */
static void golden_check(const golden_case *c, const golden_site *sites, size_t n)
{
	const golden_site *hit = NULL;
	for (size_t i = 0; i < n; i++)
		if (sites[i].atom == c->atom && sites[i].kind && !strcmp(sites[i].kind, c->kind))
			hit = &sites[i];
	harness_checks++;
	if (!hit) {
		harness_failures++;
		fprintf(stderr, "golden.tsv:%d %s (%s): no %s site on atom %d\n", c->line, c->name,
			c->smiles, c->kind, c->atom);
		return;
	}
	harness_checks++;
	if (!hit->group || strcmp(hit->group, c->group)) {
		harness_failures++;
		fprintf(stderr, "golden.tsv:%d %s: group '%s', expected '%s'\n", c->line, c->name,
			hit->group ? hit->group : "(null)", c->group);
	}
	harness_checks++;
	if (!(fabs(hit->pka - c->pka) <= c->tol)) {
		harness_failures++;
		fprintf(stderr, "golden.tsv:%d %s: pka %.2f, expected %.2f +- %.2f\n", c->line,
			c->name, hit->pka, c->pka, c->tol);
	}
}

#endif
