/* SPDX-License-Identifier: MIT */
/* model.h: private types of the loaded model shared by the files of predictor/. */
#ifndef PKAD_MODEL_H
#define PKAD_MODEL_H

#include <stddef.h>

#include "predictor.h"

/* One numeric parameter of the model. Every number that `pkad fit` may refine is one of
 * these; the tables refer to parameters by index. */
typedef struct pred_param {
	char id[96];     /* "<site id>.parent", "<site id>.rho", "corr.<id>", "global.falloff" */
	double value;    /* in force (fitted when params.tsv has the row, else the table's) */
	double prior;    /* the published / table value */
	double prior_sd; /* ridge prior width; 0 = fixed, not fitted */
	int n;           /* training rows that informed it (0 = not fitted) */
	double rmse_cv;  /* cross-validated rmse of the class, 0 when unknown */
	int pair;        /* CORR_PAIR_* of the pair row it scales (CORR_PAIR_NONE for others) */
} pred_param;

typedef enum { SIGMA_PLAIN = 0, SIGMA_MINUS = 1, SIGMA_PLUS = 2 } sigma_scale;

typedef struct frag_site {
	char id[64];
	pred_kind kind;
	char group[48];
	char *smarts;
	int centre;
	int p_parent, p_rho, p_rho_star, p_ortho; /* parameter indices */
	int p_rho_para; /* slope of para substituents: its own parameter, or p_rho */
	sigma_scale sigma_para;
	double charge_scale; /* share of a unit charge the interaction counts at this site (1) */
	double unc;
	char *source;
} frag_site;

typedef struct frag_subst {
	char id[48];
	char *smarts;
	double sigma_m, sigma_p, sigma_p_minus, sigma_p_plus, sigma_star, sigma_i;
	int transparent;
	char *source;
} frag_subst;

typedef struct frag_corr {
	char id[64];
	char term[32];
	char *sites; /* comma list of site ids / groups, "*" = all */
	char *smarts;
	int p_value;
	double unc;
	int per_match; /* 1: the term counts every match at the site (count "match") */
	int pair;      /* CORR_PAIR_*: a monoanion hydrogen-bond pair row (pair_hbond.c) */
	char *source;
} frag_corr;

/* The pair kinds of corrections.tsv, read from the term column: "hbond_pair" rows take any
 * two sites the pattern matches; "hbond_pair_z" rows only two sites on the two ends of a
 * C=C whose configuration is given as cis (Z), since a SMARTS pattern does not read the
 * '/' '\\' marks of the input. */
enum { CORR_PAIR_NONE = 0, CORR_PAIR_ANY = 1, CORR_PAIR_Z = 2, CORR_PAIR_CHARGE = 3 };

/* Reagent bases for base matching (fragments/bases.tsv). */
typedef struct frag_base {
	char *name, *aliases, *conjugate_acid, *conj_smiles, *scale, *byproduct, *hazards, *source;
	double pka;
	int organometallic; /* quenched by any free OH / NH */
	double pka_dmso;    /* DMSO-scale value for comparison; NAN when unknown */
	int escapes;        /* by-product leaves as a gas, drawing K > 1 to completion */
} frag_base;

struct pred_model {
	pred_param *params;
	size_t n_params;
	size_t cap_params;
	int *param_slots; /* open-addressing index of params by id: index + 1, 0 empty */
	size_t n_param_slots;
	frag_site *sites;
	size_t n_sites;
	frag_subst *substs;
	size_t n_substs;
	int subst_aza; /* the "aza" row (ring nitrogen as a Hammett substituent), -1 none */
	frag_corr *corrs;
	size_t n_corrs;
	frag_base *bases;
	size_t n_bases;
	char params_version[128];
	char data_version[512];
	/* global parameter indices */
	int p_falloff;      /* attenuation per intervening bond of the Taft walk */
	int p_interaction;  /* charge-interaction scale (pKa units at distance 1) */
	int p_interaction_decay; /* per-bond decay of the charge interaction */
	int p_interaction_route; /* share of W per further route between two charges */
	int p_aryl_transmission; /* share of a ring substituent's sigma on an aryl the walk meets */
	int p_unc_scale;    /* calibration factor of every site uncertainty */
	int p_unc_size;     /* widening per 10 heavy atoms beyond 8 (see site_unc_factor) */
	int p_unc_sites;    /* widening per site beyond the first */
	int p_unc_floor;    /* no site uncertainty below this (repeatability of the data) */
	int p_amine_n;      /* sigma rise of a ring amino group per sigma* of its N-substituents */
	int p_fused_transmission; /* share of rho x sigma of a fused-ring substituent at a ring N */
	int p_fused5_transmission; /* the same for a substituent on a fused aromatic five-ring */
	int p_biaryl_transmission; /* share of rho x sigma of a group on an aryl of the Hammett ring */
	int p_alkyl_inductive; /* sigma rise of a ring alkyl carbon per sigma* of its own groups */
};

/* Index of the parameter with this id, or -1. */
int model_param_find(const pred_model *m, const char *id);
/* Adds a parameter (or returns the existing one's index); -1 on allocation failure. */
int model_param_add(pred_model *m, const char *id, double value, double prior_sd);

/* Design row of one predicted site, for `pkad fit`: the site's pKa equals
 * sum_k feature[k] * param_value[param[k]] + constant. Terms that no parameter scales
 * (interaction, statistical, generic estimates) are folded into the constant. */
typedef struct pred_design {
	size_t n;
	const int *param;
	const double *feature;
	double constant;
	double unc_factor; /* the molecule's widening of the site's uncertainty (>= 1) */
} pred_design;

/* Design of site i of a result; borrowed. */
void pred_result_design(const pred_result *r, size_t i, pred_design *out);

#endif
