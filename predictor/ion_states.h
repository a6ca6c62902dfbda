/* SPDX-License-Identifier: MIT */
/* ion_states.h: private microstate enumeration shared by ionization.c and ion_species.c. */
#ifndef PKAD_ION_STATES_H
#define PKAD_ION_STATES_H

#include <stddef.h>

#include "ionization.h"

/* Sites enumerated exactly (2^12 = 4096 microstates); more go to the mean-field part. */
#define ION_EXACT_MAX 12

/* A microstate is a bit set over the exact sites: bit c set means cluster site c is
 * charged (acid deprotonated, base protonated). Weights are log10 and relative to pH 0:
 * log10 w(s, pH) = logw0[s] + nrem[s] * pH, nrem = protons removed from the fully
 * protonated form. Sites outside the cluster ("extra") are independent two-state sites
 * that feel the mean charges of all other sites (mean field). */
typedef struct ion_work {
	const pred_result *r;
	size_t n;          /* all sites */
	const double *pka; /* micro pKa per site: r->micro, or the site values */
	double *W;         /* n x n pair shifts, pKa units, 0 on the diagonal */
	int *q_on;         /* per site: charge of the charged form, -1 acid, +1 base */
	int fixed;         /* formal charge outside the sites (quaternary N, ...) */
	size_t nc, nx;     /* cluster and extra site counts */
	int *cl, *ex;      /* site indices (into r->sites) of cluster and extras */
	size_t ns;         /* 1 << nc */
	double *logw0;
	int *nrem, *charge;
	/* scratch of one evaluation at a pH */
	double *frac; /* ns fractions of the cluster states */
	double *qbar; /* n mean charges per site */
	double *xp;   /* nx probabilities that each extra site is charged */
} ion_work;

/* Allocates every array in r's arena, picks the cluster (the sites nearest ph) and
 * enumerates it. Returns 0 or PRED_ENOMEM. */
int ion_work_init(ion_work *w, pred_result *r, const pred_model *m, const ion_input *in, double ph);
/* Fills w->frac, w->qbar and w->xp at this pH; returns the mean net charge. */
double ion_work_eval(ion_work *w, double ph);
/* Fraction of each net charge lo..lo+nq-1 at the last evaluated pH, into out[nq]. */
void ion_work_charge_dist(const ion_work *w, int lo, size_t nq, double *out);
/* Macroscopic pKa values, ascending, n of them, into out[n] (uses the state at ph). */
void ion_work_macro(ion_work *w, double ph, double *out);

/* Fills r->species from the last evaluation (see ionization.h). Returns 0 or a PRED_E*. */
int ion_species_fill(pred_result *r, const ion_work *w, const ion_input *in, pred_error *err);

#endif
