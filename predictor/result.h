/* SPDX-License-Identifier: MIT */
/* result.h: the private layout of pred_result, filled by predict.c and ionization.c. */
#ifndef PKAD_RESULT_H
#define PKAD_RESULT_H

#include <stddef.h>

#include "predictor.h"

/* Per-site design (see model.h pred_design), parallel to the site's terms. */
typedef struct site_design {
	size_t n;
	int *param;
	double *feature;
	double constant;
	double unc_factor;
} site_design;

typedef struct res_chunk res_chunk;

struct pred_result {
	res_chunk *arena; /* every string and array below lives here, freed at once */
	char *smiles;
	pred_site *sites;
	site_design *design;
	double *micro; /* per site: pKa without the statistical and interaction terms */
	size_t n_sites;
	char **warnings;
	size_t n_warnings;
	char **notes;
	size_t n_notes;
	double *macro;
	size_t n_macro;
	double ph;
	double charge;
	pred_species *species;
	size_t n_species;
	int has_pi;
	double pi;
	int approximate;
	pred_curves *curves;
};

/* Arena allocation tied to the result: zeroed memory, NULL on exhaustion. */
void *res_alloc(pred_result *r, size_t size);
char *res_strdup(pred_result *r, const char *s);
char *res_printf(pred_result *r, const char *fmt, ...);
/* Append a warning or a note (copied). Returns 0 or PRED_ENOMEM. */
int res_warn(pred_result *r, const char *fmt, ...);
int res_note(pred_result *r, const char *fmt, ...);

#endif
