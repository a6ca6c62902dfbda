/* SPDX-License-Identifier: MIT */
/* predictor.h: the public API of the pkad predictor library (sites, pKa, ionization, bases). */
#ifndef PKAD_PREDICTOR_H
#define PKAD_PREDICTOR_H

#include <stddef.h>

#ifdef __cplusplus
extern "C" {
#endif

/* ---- errors -------------------------------------------------------------------------- */

/** Status codes: 0 is success, every failure is negative. pred_status_name() gives the
 *  stable lower-case name that JSON error objects carry ("invalid_smiles", ...). */
typedef enum pred_status {
	PRED_OK = 0,
	PRED_EINVAL = -1,       /* bad argument or request */
	PRED_EPARSE = -2,       /* molecule text unreadable */
	PRED_EDATA = -3,        /* malformed fragment or data file */
	PRED_ENOMEM = -4,       /* out of memory */
	PRED_EINTERNAL = -5,    /* impossible state or toolkit failure */
	PRED_ELIMIT = -6,       /* molecule over a size limit (heavy atoms, length) */
	PRED_ETIMEOUT = -7,     /* molecule took longer than its time budget */
	PRED_EUNSUPPORTED = -8  /* element, valence or structure the model cannot handle */
} pred_status;

/** Caller-owned error detail: code plus a one-line lower-case message. */
typedef struct pred_error {
	int code;
	char msg[256];
} pred_error;

/** Stable name of a status code ("ok", "invalid_argument", "invalid_smiles", "bad_data",
 *  "out_of_memory", "internal_error", "too_many_atoms", "timeout", "unsupported_structure").
 *  Never NULL; unknown codes give "internal_error". Thread-safe. */
const char *pred_status_name(int code);

/* ---- version ------------------------------------------------------------------------- */

/** pkad version string ("0.1.0"); static storage. Thread-safe. */
const char *pred_version(void);

/* ---- lifecycle ----------------------------------------------------------------------- */

typedef struct pred_model pred_model;
typedef struct pred_worker pred_worker;

/** Initialise the chemistry toolkit. Call once from the main thread before any worker is
 *  created or any other thread starts. Sets the "C" numeric locale. Returns 0 or a PRED_E*. */
int pred_global_init(pred_error *err);

/** Load the model: fragment tables, substituent constants, fitted parameters, reagent bases.
 *  dir == NULL uses the copy embedded at build time (or $PKAD_FRAGMENTS when set).
 *  On failure *out is NULL and err names file:line. The model is read-only after loading
 *  and may be shared by any number of threads. Free with pred_model_free. */
int pred_model_load(pred_model **out, const char *dir, pred_error *err);
void pred_model_free(pred_model *m);

/** Version of the fitted parameters and of the data they were fitted on; borrowed. */
const char *pred_model_params_version(const pred_model *m);
const char *pred_model_data_version(const pred_model *m);

/** A worker owns the per-thread toolkit state (one converter). One worker per thread; a
 *  worker must never be used by two threads at once. Free with pred_worker_free. */
int pred_worker_new(pred_worker **out, const pred_model *m, pred_error *err);
void pred_worker_free(pred_worker *w);

/* ---- prediction ---------------------------------------------------------------------- */

typedef enum pred_format { PRED_FMT_SMILES = 0, PRED_FMT_MOLBLOCK = 1 } pred_format;

/** Options of one prediction; pred_options_init fills the defaults. */
typedef struct pred_options {
	double ph;           /* pH for the at_ph block; default 7.4; valid -2..16 */
	int max_heavy_atoms; /* default 200 */
	double max_seconds;  /* time budget per molecule; default 10 */
	int curves;          /* nonzero: compute charge and fraction curves over pH 0..14 */
	double curve_step;   /* pH step of the curves; default 0.25 */
} pred_options;

void pred_options_init(pred_options *opt);

typedef struct pred_result pred_result;

/** Predict every site of one molecule given as SMILES or as one MDL mol block.
 *  Returns 0 and *out, or a PRED_E* with *out NULL and err set (PRED_EPARSE for unreadable
 *  input, PRED_ELIMIT over max_heavy_atoms, PRED_ETIMEOUT, PRED_EUNSUPPORTED).
 *  A molecule without ionizable sites is a success with zero sites and a note.
 *  Caller frees with pred_result_free. Thread-safe with one worker per thread. */
int pred_predict(pred_result **out, pred_worker *w, const char *input, pred_format fmt,
		 const pred_options *opt, pred_error *err);
void pred_result_free(pred_result *r);

/* ---- results ------------------------------------------------------------------------- */

typedef enum pred_kind { PRED_ACID = 0, PRED_BASE = 1 } pred_kind;

/** One contribution to a site's pKa: a name ("parent", "hammett", "taft", "resonance",
 *  "alcohol_class", "ortho", "statistical", "interaction", "generic_substituent", ...),
 *  a human-readable detail ("4-NO2, sigma_p- 1.27, rho 2.23") and its value in pKa units. */
typedef struct pred_term {
	const char *term;
	const char *detail;
	double value;
} pred_term;

/** One ionizable site. kind PRED_ACID: HA -> A- + H+; PRED_BASE: pka is that of the
 *  conjugate acid BH+. atom is the 0-based index in the input's atom order. The pka is the
 *  sum of the terms. All pointers are borrowed from the result. */
typedef struct pred_site {
	int atom;
	const char *element;
	const char *group;      /* site class name, e.g. "phenol", "pyridine" */
	pred_kind kind;
	double pka;
	double uncertainty;     /* about one standard deviation, pKa units */
	const char *confidence; /* "high", "medium" or "low" */
	size_t n_terms;
	const pred_term *terms;
} pred_site;

/** One microspecies at the requested pH. */
typedef struct pred_species {
	const char *smiles; /* with formal charges */
	double fraction;
	int charge;
} pred_species;

/** Curves over pH: n_points values of ph[] and charge[]; fraction[s * n_points + k] is the
 *  fraction of the species of net charge series_charge[s] at ph[k]. */
typedef struct pred_curves {
	size_t n_points;
	const double *ph;
	const double *charge;
	size_t n_series;
	const int *series_charge;
	const double *fraction;
} pred_curves;

/** Canonical SMILES of the normalised structure that was predicted; borrowed. */
const char *pred_result_smiles(const pred_result *r);

size_t pred_result_site_count(const pred_result *r);
/** Site i (0 <= i < count), ordered by input atom index; borrowed. */
const pred_site *pred_result_site(const pred_result *r, size_t i);

/** Warnings: what normalisation changed (salt stripped, tautomer changed, charge
 *  neutralised) and extrapolations. Notes: plain remarks ("no ionizable site"). Borrowed. */
size_t pred_result_warning_count(const pred_result *r);
const char *pred_result_warning(const pred_result *r, size_t i);
size_t pred_result_note_count(const pred_result *r);
const char *pred_result_note(const pred_result *r, size_t i);

/** Macroscopic pKa values from the microstate model, ascending. */
size_t pred_result_macro_count(const pred_result *r);
double pred_result_macro_pka(const pred_result *r, size_t i);

/** The ionization state at the requested pH: pH, mean net charge, and the microspecies
 *  above 1% (at least the dominant one), most abundant first. */
double pred_result_ph(const pred_result *r);
double pred_result_charge(const pred_result *r);
size_t pred_result_species_count(const pred_result *r);
const pred_species *pred_result_species(const pred_result *r, size_t i);

/** Isoelectric point of an ampholyte; returns 0 and sets *out, or -1 when there is none. */
int pred_result_isoelectric(const pred_result *r, double *out);

/** Nonzero when the site count exceeded the exact limit and a bounded approximation was
 *  used for the ionization block. */
int pred_result_ionization_is_approximate(const pred_result *r);

/** Curves, or NULL unless opt->curves was set. Borrowed. */
const pred_curves *pred_result_curves(const pred_result *r);

/* ---- base matching ------------------------------------------------------------------- */

/** One reagent base of the model's table (fragments/bases.tsv); strings borrowed from the
 *  model. pka is that of the conjugate acid on `scale` ("water", "dmso", "thf", or
 *  "estimate" for very weak acids such as H2, NH3, alkanes); pka_dmso is NAN when unknown. */
typedef struct pred_base_info {
	const char *name;
	const char *aliases; /* comma-separated, may be "" */
	const char *conjugate_acid;
	const char *conjugate_acid_smiles;
	double pka;
	const char *scale;
	double pka_dmso;
	int is_organometallic; /* quenched by any free OH or NH */
	const char *byproduct;
	const char *hazards; /* semicolon-separated cautions */
	const char *source;
} pred_base_info;

/** Number of reagent bases in the model's table. Thread-safe. */
size_t pred_base_count(const pred_model *m);
/** Fills *out with base i (0 <= i < count). Thread-safe. */
void pred_base(pred_base_info *out, const pred_model *m, size_t i);

/** A base-matching question; pred_deprot_request_init fills the defaults (atom -1 = every
 *  acid site of the substrate, equivalents 1). base is a table name or alias (compared
 *  without case, ignoring spaces, '-' and '_') or else a SMILES of the base. */
typedef struct pred_deprot_request {
	const char *substrate; /* SMILES */
	int atom;              /* 0-based input atom index of one acid site, or -1 */
	const char *base;
	double equivalents;    /* of base per substrate, > 0 */
} pred_deprot_request;

void pred_deprot_request_init(pred_deprot_request *req);

/** The outcome for one acid site of the substrate. delta_pka = pKa(conjugate acid of the
 *  base) - pKa(site); log_k = log10 of K of substrate + base <=> conjugate base + conjugate
 *  acid; fraction = share of the site deprotonated at equilibrium from the mass balance
 *  (more acidic sites take base first); verdict "complete" (> 99%), "partial" or
 *  "negligible" (< 1%). Strings borrowed from the result. */
typedef struct pred_deprot_site {
	int atom;
	const char *element;
	const char *group;
	double pka;
	double uncertainty;
	double delta_pka;
	double log_k;
	double fraction;
	const char *verdict;
} pred_deprot_site;

typedef struct pred_deprotonation pred_deprotonation;

/** Match a base against the acid sites of a substrate. Errors (PRED_EINVAL with a message):
 *  unknown base (the message lists the known ones), a substrate without acid site, an atom
 *  that is not an acid site, equivalents <= 0 or not finite; PRED_EPARSE etc. from the
 *  prediction of substrate or base. opt supplies the limits of pred_predict (NULL:
 *  defaults). Caller frees with pred_deprotonation_free. Thread-safe, one worker per thread. */
int pred_deprotonate(pred_deprotonation **out, pred_worker *w, const pred_deprot_request *req,
		     const pred_options *opt, pred_error *err);
void pred_deprotonation_free(pred_deprotonation *d);

/** Canonical SMILES of the substrate; the base as matched (table name, or the SMILES given)
 *  with its conjugate acid, that acid's pKa and scale, and whether pkad predicted the value
 *  (base given as SMILES). Borrowed. */
const char *pred_deprotonation_substrate(const pred_deprotonation *d);
const char *pred_deprotonation_base(const pred_deprotonation *d);
const char *pred_deprotonation_conjugate_acid(const pred_deprotonation *d);
double pred_deprotonation_base_pka(const pred_deprotonation *d);
const char *pred_deprotonation_scale(const pred_deprotonation *d);
int pred_deprotonation_base_is_predicted(const pred_deprotonation *d);
double pred_deprotonation_equivalents(const pred_deprotonation *d);
/** What the base leaves behind ("hydrogen gas (H2)"). Borrowed. */
const char *pred_deprotonation_byproduct(const pred_deprotonation *d);

/** The acid sites considered (one when an atom was given), in input atom order. */
size_t pred_deprotonation_site_count(const pred_deprotonation *d);
const pred_deprot_site *pred_deprotonation_site(const pred_deprotonation *d, size_t i);

/** Handling cautions of the base; the last one always says that local rules and
 *  institutional safety practice govern. Warnings: scale mismatch and how it limits the
 *  verdict, reagent quenched by a free OH/NH, sites that take base first. Borrowed. */
size_t pred_deprotonation_caution_count(const pred_deprotonation *d);
const char *pred_deprotonation_caution(const pred_deprotonation *d, size_t i);
size_t pred_deprotonation_warning_count(const pred_deprotonation *d);
const char *pred_deprotonation_warning(const pred_deprotonation *d, size_t i);

/* ---- fitting (`pkad fit`, `pkad validate`) -------------------------------------------- */

/** Index of the site that an experimental value of (kind, index) refers to: the index-th most
 *  acidic acid site (ascending pKa) or the index-th most basic base site (descending pKa);
 *  index is 1-based. Returns -1 when the result has fewer sites of that kind. Thread-safe. */
long pred_result_match(const pred_result *r, pred_kind kind, int index);

/** Like pred_result_match, but numbers the steps of the molecule as the compilations do:
 *  the sites of the row's kind with pKa in 0..14 and of the other kind in 1..13 ranked
 *  together first (a base book's second
 *  step of an amino acid is its COOH, its first step of a 3-hydroxypyridine the OH), then
 *  the sites of the row's kind outside that window (an amide measured by an acidity
 *  function). n_steps is the number of the molecule's rows of this kind (0: unknown): when
 *  the row's kind has at least that many sites in 0..14, only those are ranked (a book that
 *  lists one step of a benzimidazole measured its ring N, not its NH). Returns -1 when
 *  there are too few. Thread-safe. */
long pred_result_match_steps(const pred_result *r, pred_kind kind, int index, int n_steps);

/** The steps a compilation lists for one molecule and kind: its distinct pka_index values in
 *  ascending order and the value of each (the mean where two rows share an index). */
typedef struct pred_listed_steps {
	size_t n;
	const int *index;
	const double *pka;
} pred_listed_steps;

/** Like pred_result_match_steps with n_steps the highest listed index, except where that
 *  numbering cannot name the step: when the molecule has more steps in the water window (both
 *  kinds, as pred_result_match_steps ranks them) than the highest listed index, the book has
 *  left steps out, and the listed steps are paired with the predicted ones in order, by the
 *  assignment of least summed squared difference. listed NULL or empty: as
 *  pred_result_match_steps with n_steps 0. Returns -1 when there is no such site. Thread-safe. */
long pred_result_match_listed(const pred_result *r, pred_kind kind, int index,
			      const pred_listed_steps *listed);

/** One experimental value used for fitting; strings are borrowed from the caller. */
typedef struct pred_fit_row {
	const char *smiles;
	pred_kind kind;
	int pka_index;  /* 1-based, see pred_result_match */
	double pka;
	double weight;  /* relative weight, > 0 (e.g. lower for less reliable grades) */
	int match_steps; /* nonzero: the site is found with pred_result_match_steps */
	int n_steps;     /* the molecule's rows of this kind, for match_steps (0: unknown) */
	const pred_listed_steps *listed; /* with match_steps: the molecule's listed steps of this
					    kind (NULL: match by n_steps alone) */
} pred_fit_row;

/** Options of pred_fit; pred_fit_options_init fills the defaults. */
typedef struct pred_fit_options {
	int folds;           /* k of the k-fold cross-validation of the class rmse; default 5 */
	double resid_sd;     /* residual sd scaling the ridge priors; 0 (default): the rms
				residual of the untrimmed rows at the start */
	double huber;        /* residual (pKa units) beyond which weights fall off; default 1.0 */
	double trim;         /* rows off by more than this under the starting values are left
				out (missing site class, tautomer, data error); 0 = keep; default 3 */
	int search_falloff;  /* nonzero: outer 1-D search of the fall-off factor; default 1 */
	double falloff_lo, falloff_hi; /* search interval; default 0.30 .. 0.60 */
	double falloff_sd;   /* prior sd of the fall-off when the model gives none; default 0.1 */
	double unc_quantile; /* class error stored as rmse_cv: this quantile of the |cv
				residuals| (default 0.68, about one sd); 0: their rms */
} pred_fit_options;

void pred_fit_options_init(pred_fit_options *opt);

typedef struct pred_fit_report pred_fit_report;

/** Refit the model's free parameters (prior_sd > 0) by weighted least squares with a ridge
 *  towards their published priors, on the given rows (the caller passes the training split
 *  only). On success the fitted values are in force in m; m must not be used by any worker
 *  during the call (not thread-safe). Rows that cannot be read or have no matching site are
 *  counted in the report. Free the report with pred_fit_report_free. */
int pred_fit(pred_fit_report **out, pred_model *m, const pred_fit_row *rows, size_t n_rows,
	     const pred_fit_options *opt, pred_error *err);
void pred_fit_report_free(pred_fit_report *rep);

/** Figures of a fit: rows used, unreadable, without a matching site, trimmed; the weighted
 *  training rmse before and after, the overall cross-validated rmse, the fall-off chosen.
 *  The fit relinearises (re-predicts with the new values) and keeps a step only when the
 *  exact penalised loss falls, so rmse_after is exact, not the linear estimate. */
typedef struct pred_fit_summary {
	size_t n_rows, n_used, n_unreadable, n_unmatched, n_trimmed, n_params;
	double rmse_before, rmse_after, rmse_cv, falloff;
	double resid_sd; /* the residual sd the priors were weighed against */
	int folds;
	double unc_quantile;
} pred_fit_summary;
void pred_fit_report_summary(const pred_fit_report *rep, pred_fit_summary *out);

/** Writes params.tsv (format in fragments/README.md) with every fitted parameter; rows of an
 *  existing file at path whose ids the fit did not touch are kept. data_version names the
 *  data the fit used. Returns 0 or a PRED_E* with err set. */
int pred_fit_write_params(const pred_model *m, const pred_fit_report *rep, const char *path,
			  const char *data_version, pred_error *err);

#ifdef __cplusplus
}
#endif

#endif
