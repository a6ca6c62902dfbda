/* SPDX-License-Identifier: MIT */
/* deprotonate.c: base matching: will this base deprotonate that site, and how far? */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "deprotonate.h"

#define DEPROT_COMPLETE 0.99
#define DEPROT_NEGLIGIBLE 0.01
/* Across pKa scales a verdict needs this margin (pKa units) to stand: DMSO values of neutral
 * O-H and N-H acids run roughly 10-15 units above aqueous ones (ethanol 29.8 vs 15.9,
 * water 31.4 vs 15.7: the reagent-bases table), so small deltas are not meaningful. */
#define DEPROT_SCALE_MARGIN 5.0
#define DEPROT_STRONG_PKA 30.0
#define DEPROT_MAX_OHNH 64

static int fail(pred_error *err, int code, const char *msg)
{
	if (err) {
		err->code = code;
		snprintf(err->msg, sizeof err->msg, "%s", msg);
	}
	return code;
}

void pred_deprot_request_init(pred_deprot_request *req)
{
	memset(req, 0, sizeof *req);
	req->atom = -1;
	req->equivalents = 1.0;
}

/* SH + B <=> S- + HB with K = [S-][HB]/([SH][B]); from 1 of SH and e of B, x reacts:
 * K (1 - x)(e - x) = x^2. The root in [0, min(1, e)], written so that it stays exact for
 * very large and very small K: x = 2e / ((1 + e) + sqrt((1 + e)^2 - 4e (1 - 1/K))). */
double deprot_fraction(double log_k, double equiv)
{
	if (!(equiv > 0))
		return 0;
	double lk = log_k > 300 ? 300 : log_k < -300 ? -300 : log_k;
	double inv_k = pow(10.0, -lk), s = 1 + equiv;
	double disc = s * s - 4 * equiv * (1 - inv_k);
	double x = 2 * equiv / (s + sqrt(disc > 0 ? disc : 0));
	double cap = equiv < 1 ? equiv : 1;
	return x > cap ? cap : x;
}

static const char *verdict(double fraction)
{
	return fraction > DEPROT_COMPLETE     ? "complete"
	       : fraction < DEPROT_NEGLIGIBLE ? "negligible"
	                                      : "partial";
}

static int check_request(const pred_deprot_request *req, pred_error *err)
{
	char msg[160];
	if (!req->substrate || !*req->substrate)
		return fail(err, PRED_EINVAL, "no substrate smiles given");
	if (!req->base || !*req->base)
		return fail(err, PRED_EINVAL, "no base given (a table name or a smiles)");
	if (!isfinite(req->equivalents) || req->equivalents <= 0) {
		snprintf(msg, sizeof msg, "equivalents must be a number greater than 0, got %g",
		         req->equivalents);
		return fail(err, PRED_EINVAL, msg);
	}
	return 0;
}

/* Acid sites of the substrate in order of acidity (most acidic first), into order[]. */
static size_t acid_order(const pred_result *r, size_t *order)
{
	size_t n = 0;
	for (size_t i = 0; i < r->n_sites; i++) {
		if (r->sites[i].kind != PRED_ACID)
			continue;
		size_t j = n++;
		for (; j > 0 && r->sites[order[j - 1]].pka > r->sites[i].pka; j--)
			order[j] = order[j - 1];
		order[j] = i;
	}
	return n;
}

static int check_sites(const pred_result *r, size_t n_acid, int atom, pred_error *err)
{
	char msg[200];
	if (!n_acid) {
		snprintf(msg, sizeof msg, "substrate %.120s has no acid site to deprotonate",
		         r->smiles ? r->smiles : "");
		return fail(err, PRED_EINVAL, msg);
	}
	for (size_t i = 0; atom >= 0 && i < r->n_sites; i++)
		if (r->sites[i].kind == PRED_ACID && r->sites[i].atom == atom)
			return 0;
	if (atom < 0)
		return 0;
	snprintf(msg, sizeof msg, "atom %d is not an acid site of the substrate", atom);
	return fail(err, PRED_EINVAL, msg);
}

static pred_deprot_site site_outcome(const pred_deprotonation *d, const pred_site *s, double avail)
{
	pred_deprot_site o = {s->atom, s->element, s->group, s->pka, s->uncertainty, 0, 0, 0, ""};
	o.delta_pka = d->base_pka - s->pka;
	o.log_k = o.delta_pka;
	o.fraction = deprot_fraction(o.log_k, avail);
	if (d->escapes && o.log_k > 0) /* gas leaves: a favourable equilibrium runs over */
		o.fraction = avail < 1 ? avail : 1;
	o.verdict = verdict(o.fraction);
	return o;
}

static int warn_taken_first(pred_deprotonation *d, const pred_site *s, double used)
{
	return deprot_warn(d,
	                   "the %s at atom %d (pKa %.1f) is more acidic and takes %.2f equivalents "
	                   "of base first",
	                   s->group, s->atom, s->pka, used);
}

/* The most acidic site takes base first; each later site sees what is left. */
static int evaluate(pred_deprotonation *d, const size_t *order, size_t n_acid, int atom)
{
	pred_result *r = d->sub;
	double avail = d->equiv;
	d->sites = res_alloc(r, (n_acid + 1) * sizeof *d->sites);
	if (!d->sites)
		return PRED_ENOMEM;
	for (size_t k = 0; k < n_acid; k++) {
		const pred_site *s = &r->sites[order[k]];
		pred_deprot_site o = site_outcome(d, s, avail);
		if (atom < 0 || s->atom == atom)
			d->sites[d->n_sites++] = o;
		else if (o.fraction > 0.005 && warn_taken_first(d, s, o.fraction))
			return PRED_ENOMEM;
		if (atom >= 0 && s->atom == atom)
			break;
		avail -= o.fraction;
		avail = avail > 0 ? avail : 0;
	}
	/* report in input atom order */
	for (size_t i = 1; i < d->n_sites; i++)
		for (size_t j = i; j > 0 && d->sites[j - 1].atom > d->sites[j].atom; j--) {
			pred_deprot_site t = d->sites[j];
			d->sites[j] = d->sites[j - 1];
			d->sites[j - 1] = t;
		}
	return 0;
}

static int warn_scale(pred_deprotonation *d)
{
	double margin = INFINITY;
	for (size_t i = 0; i < d->n_sites; i++)
		margin = fmin(margin, fabs(d->sites[i].delta_pka));
	int rc = 0;
	if (!strcmp(d->scale, "estimate"))
		rc = deprot_warn(
		    d,
		    "the pKa of %s (%.0f) is an estimate, not a measured aqueous value; "
		    "only a wide margin is meaningful",
		    d->conj_acid, d->base_pka);
	else if (strcmp(d->scale, "water"))
		rc = deprot_warn(
		    d,
		    "the base's value (%.1f) is on the %s scale and the substrate's "
		    "(predicted) on the water scale; %s values of neutral O-H and N-H "
		    "acids run about 10-15 units higher, so delta pKa is a rough guide and "
		    "the verdict holds only with a margin over %.0f units",
		    d->base_pka, !strcmp(d->scale, "dmso") ? "DMSO" : "THF",
		    !strcmp(d->scale, "dmso") ? "DMSO" : "THF", DEPROT_SCALE_MARGIN);
	else
		return 0;
	if (!rc && margin < DEPROT_SCALE_MARGIN)
		rc = deprot_warn(d,
		                 "here the margin is only %.1f units: treat the verdict as "
		                 "uncertain",
		                 margin);
	return rc;
}

static int list_atoms(char *buf, size_t n, const int *atoms, size_t k, int skip)
{
	int len = 0, count = 0;
	buf[0] = '\0';
	for (size_t i = 0; i < k && (size_t)len < n; i++)
		if (atoms[i] != skip) {
			len += snprintf(buf + len, n - (size_t)len, "%s%d", count ? ", " : "",
			                atoms[i]);
			count++;
		}
	return count;
}

/* Organometallics are quenched by any free OH or NH; other very strong bases also react
 * with an OH/NH that is not the site asked about. Names the protonated by-product. */
static int warn_quench(pred_deprotonation *d, pred_worker *w, const char *smiles, int atom)
{
	int atoms[DEPROT_MAX_OHNH];
	char list[200];
	int n = 0;
	if (!d->organometallic && !(d->base_pka >= DEPROT_STRONG_PKA && atom >= 0))
		return 0;
	if ((n = deprot_free_oh_nh(atoms, DEPROT_MAX_OHNH, w, smiles)) < 0)
		return n;
	int skip = d->organometallic ? -1 : atom;
	if (!list_atoms(list, sizeof list, atoms, (size_t)n, skip))
		return 0;
	if (d->organometallic)
		return deprot_warn(d,
		                   "%s is quenched by the free OH/NH of the substrate (atom %s): "
		                   "each consumes one equivalent and gives %s",
		                   d->base, list, d->byproduct);
	return deprot_warn(d,
	                   "the free OH/NH at atom %s also reacts with %s and consumes it, giving "
	                   "%s",
	                   list, d->base, d->byproduct);
}

static int fill(pred_deprotonation *d, pred_worker *w, const pred_deprot_request *req,
                const pred_options *opt, pred_error *err)
{
	size_t *order = res_alloc(d->sub, (d->sub->n_sites + 1) * sizeof *order);
	if (!order)
		return fail(err, PRED_ENOMEM, "out of memory");
	size_t n_acid = acid_order(d->sub, order);
	int rc = check_sites(d->sub, n_acid, req->atom, err);
	if (!rc)
		rc = deprot_resolve_base(d, w, req->base, opt, err);
	if (!rc && (evaluate(d, order, n_acid, req->atom) || warn_scale(d)))
		rc = fail(err, PRED_ENOMEM, "out of memory");
	if (!rc && (rc = warn_quench(d, w, req->substrate, req->atom)))
		rc = fail(err, rc, "cannot read the substrate's OH/NH groups");
	if (!rc && deprot_caution(d, "local rules and institutional safety practice govern: "
	                             "read the safety data sheet and follow your institution's "
	                             "procedures before handling"))
		rc = fail(err, PRED_ENOMEM, "out of memory");
	return rc;
}

int pred_deprotonate(pred_deprotonation **out, pred_worker *w, const pred_deprot_request *req,
                     const pred_options *opt, pred_error *err)
{
	pred_options defaults;
	*out = NULL;
	int rc = check_request(req, err);
	if (rc)
		return rc;
	if (!opt) {
		pred_options_init(&defaults);
		opt = &defaults;
	}
	pred_deprotonation *d = calloc(1, sizeof *d);
	if (!d)
		return fail(err, PRED_ENOMEM, "out of memory");
	d->equiv = req->equivalents;
	rc = pred_predict(&d->sub, w, req->substrate, PRED_FMT_SMILES, opt, err);
	if (!rc)
		rc = fill(d, w, req, opt, err);
	if (rc) {
		pred_deprotonation_free(d);
		return rc;
	}
	*out = d;
	return 0;
}
