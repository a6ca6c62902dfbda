/* SPDX-License-Identifier: MIT */
/* deprotonate.h: private layout of pred_deprotonation, shared by the base-matching files. */
#ifndef PKAD_DEPROTONATE_H
#define PKAD_DEPROTONATE_H

#include "engine.h"
#include "result.h"

/* Every string and array lives in the arena of the substrate's result (sub), so one free
 * releases everything. */
struct pred_deprotonation {
	pred_result *sub; /* prediction of the substrate */
	char *base;       /* table name, or the SMILES given */
	char *conj_acid;
	char *scale;
	double base_pka;
	int predicted; /* base given as SMILES, its value predicted */
	int organometallic;
	int escapes; /* by-product leaves as a gas */
	double equiv;
	char *byproduct;
	pred_deprot_site *sites;
	size_t n_sites;
	char **cautions;
	size_t n_cautions;
	char **warnings;
	size_t n_warnings;
};

/* Append a formatted caution or warning (copied into the arena). 0 or PRED_ENOMEM. */
int deprot_caution(pred_deprotonation *d, const char *fmt, ...);
int deprot_warn(pred_deprotonation *d, const char *fmt, ...);

/* Fills the base fields of d from the table entry or by predicting the SMILES base.
 * Returns 0 or a PRED_E* with err set (unknown base lists the known ones). */
int deprot_resolve_base(pred_deprotonation *d, pred_worker *w, const char *base,
                        const pred_options *opt, pred_error *err);

/* Fraction of the substrate deprotonated at equilibrium for K = 10^log_k and equiv
 * equivalents of base (mass balance, see deprotonate.c). */
double deprot_fraction(double log_k, double equiv);

/* Input atom indices of the heteroatoms (O, N) that carry hydrogen in the substrate, into
 * out[max]; returns their count or a negative PRED_E*. */
int deprot_free_oh_nh(int *out, size_t max, pred_worker *w, const char *smiles);

#endif
