/* SPDX-License-Identifier: MIT */
/* site_probe.h: test helpers that read one value off a prediction (site_probe.c). */
#ifndef PKAD_SITE_PROBE_H
#define PKAD_SITE_PROBE_H

#include <stddef.h>

#include "predictor.h"

/* The worker the helpers below predict with. */
void probe_use(pred_worker *w);
/* Loads the model of $PKAD_SOURCE_DIR/fragments, makes a worker and uses it; 1 (with a message
 * on stderr) when that fails. */
int probe_setup(pred_model **model, pred_worker **w);
void probe_teardown(pred_model *model, pred_worker *w);

/* pKa (and uncertainty, when unc is not NULL) of the first site of this group and kind;
 * NAN when the molecule has none. */
double site_value(const char *smiles, const char *group, pred_kind kind, double *unc);

double site_pka(const char *smiles, const char *group, pred_kind kind);

/* pKa of the most basic site of a molecule, NAN when it has none. */
double most_basic(const char *smiles);

/* Terms named `term` on the first site of this group and kind; -1 when there is none. */
int site_term_count(const char *smiles, const char *group, pred_kind kind,
			   const char *term);

/* Highest pKa among the sites of this group and kind (the last step of a polyprotic group);
 * NAN when the molecule has none. */
double site_max(const char *smiles, const char *group, pred_kind kind);

/* Lowest pKa among the sites of this group and kind (the first step); NAN when none. */
double site_min(const char *smiles, const char *group, pred_kind kind);

/* Interaction term of the site that ionises with another's charge present (the lower step
 * of a diamine), 0 when none; and the lowest site pKa (NAN: no site). */
void diamine_steps(const char *smiles, double *inter, double *low);

/* Sum of the terms whose detail holds needle on the first site of this group and kind. */
double site_detail_sum(const char *smiles, const char *group, pred_kind kind,
		       const char *needle);

/* Sum of the terms named term on the first base site of this group, and how many there are
 * (the count of a per-match correction is the ratio to one match's value). */
double base_term(const char *smiles, const char *group, const char *term, size_t *n);

/* The highest macroscopic pKa of a molecule (its last step), NAN when it has none. */
double last_macro(const char *smiles);

/* Value of the correction row id on the first base site of this group (its detail is the id,
 * or "id x N" for a row counted N times); 0 when absent. */
double corr_value(const char *smiles, const char *group, const char *id);

#endif
