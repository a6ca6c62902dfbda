/* SPDX-License-Identifier: MIT */
/* ion_species.c: the microspecies at one pH, written as SMILES with formal charges. */
#include <stdlib.h>
#include <string.h>

#include "canon_rank.h"
#include "smiles_write.h"
#include "ion_states.h"

/* States below this fraction are not written out (symmetry-equivalent states are merged by
 * SMILES first, so a group of small equivalent states can still pass the 1% report cut). */
#define ION_CANDIDATE_MIN 0.001
#define ION_CANDIDATE_MAX 64
#define ION_REPORT_MIN 0.01

typedef struct candidate {
	size_t state;
	double fraction;
	int charge;
	char *smiles; /* in the result arena, NULL without a molecule */
} candidate;

static int cmp_candidate(const void *a, const void *b)
{
	const candidate *p = a, *q = b;
	if (p->fraction != q->fraction)
		return (p->fraction < q->fraction) - (p->fraction > q->fraction);
	return (p->state > q->state) - (p->state < q->state);
}

/* Whether site i is charged in the species built from cluster state s: cluster sites from
 * the bits, extra sites in their more likely form. */
static int site_on(const ion_work *w, size_t s, size_t i, const unsigned char *is_extra)
{
	for (size_t x = 0; is_extra[i] && x < w->nx; x++)
		if ((size_t)w->ex[x] == i)
			return w->xp[x] >= 0.5;
	for (size_t c = 0; c < w->nc; c++)
		if ((size_t)w->cl[c] == i)
			return (int)((s >> c) & 1u);
	return 0;
}

/* The species' SMILES by pkad's writer: atom[k] changed by dq[k] in charge and hydrogen
 * count, in the molecule's order, or in the species' own canonical order when equivalent
 * sites make several states one species. malloc'd; NULL when it cannot be written so. */
static char *species_written(const ion_input *in, const int *atom, const int *dq, size_t n)
{
	const obw_atom *at;
	size_t nat = obw_mol_atoms(in->mol, &at);
	obw_atom *edited = malloc((nat + 1) * sizeof *edited);
	int *rank = in->symclass ? malloc((nat + 1) * sizeof *rank) : NULL;
	int *scls = in->symclass ? malloc((nat + 1) * sizeof *scls) : NULL;
	char *s = NULL;
	if (edited && (!in->symclass || (rank && scls))) {
		memcpy(edited, at, nat * sizeof *edited);
		for (size_t k = 0; k < n; k++) {
			edited[atom[k]].charge += dq[k];
			edited[atom[k]].hcount += dq[k];
		}
		if (!in->symclass)
			s = smiles_write(in->mol, edited, in->rank, in->scls);
		else if (canon_rank(NULL, scls, rank, in->mol, edited) == 0)
			s = smiles_write(in->mol, edited, rank, scls);
	}
	free(edited);
	free(rank);
	free(scls);
	return s;
}

static char *species_smiles(pred_result *r, const ion_work *w, const ion_input *in, size_t s,
                            const unsigned char *is_extra, pred_error *err)
{
	int *atom = malloc((w->n + 1) * sizeof *atom), *dq = malloc((w->n + 1) * sizeof *dq);
	char *smi = NULL, *out = NULL, *msg = err ? err->msg : NULL;
	size_t msgn = err ? sizeof err->msg : 0, n = 0;
	int rc = atom && dq ? 0 : PRED_ENOMEM;
	for (size_t i = 0; i < w->n && !rc; i++) {
		if (!site_on(w, s, i, is_extra))
			continue;
		/* acid: lose H+ (charge -1, one H fewer); base: gain H+ (charge +1, one H more) */
		atom[n] = in->site_mol_atom[i];
		dq[n++] = w->q_on[i];
	}
	/* with equivalent sites the representative is written canonically, so that the name of
	 * the species does not depend on which equivalent atom its state happens to use */
	if (!rc && in->rank)
		smi = species_written(in, atom, dq, n);
	if (!rc && !smi && !(smi = obw_mol_smiles_edited(in->mol, in->ctx, atom, dq, n,
							 in->symclass != NULL, msg, msgn)))
		rc = PRED_EINTERNAL;
	if (!rc && !(out = res_strdup(r, smi)))
		rc = PRED_ENOMEM;
	if (rc && err)
		err->code = rc;
	free(smi);
	free(atom);
	free(dq);
	return out;
}

/* ",%d" of v at out (at most 12 bytes, no terminator); returns the length. The keys are
 * built for every written state, where snprintf was a visible cost. */
static size_t put_class(char *out, int v)
{
	char digits[12];
	size_t nd = 0, n = 0;
	unsigned u = v < 0 ? 0u - (unsigned)v : (unsigned)v;
	do {
		digits[nd++] = (char)('0' + u % 10);
		u /= 10;
	} while (u);
	out[n++] = ',';
	if (v < 0)
		out[n++] = '-';
	while (nd)
		out[n++] = digits[--nd];
	return n;
}

/* Key of a microstate up to symmetry: the sorted symmetry classes of its ionised sites. */
static char *state_key(pred_result *r, const ion_work *w, const ion_input *in, size_t s,
		       const unsigned char *is_extra)
{
	int *cls = malloc((w->n + 1) * sizeof *cls);
	if (!cls)
		return NULL;
	size_t n = 0;
	for (size_t i = 0; i < w->n; i++)
		if (site_on(w, s, i, is_extra))
			cls[n++] = 2 * in->symclass[in->site_mol_atom[i]] + (w->q_on[i] > 0);
	for (size_t i = 1; i < n; i++)
		for (size_t j = i; j > 0 && cls[j - 1] > cls[j]; j--) {
			int t = cls[j];
			cls[j] = cls[j - 1];
			cls[j - 1] = t;
		}
	char *key = res_alloc(r, 12 * n + 2);
	if (key) {
		size_t used = 0;
		key[used++] = 'k';
		for (size_t i = 0; i < n; i++)
			used += put_class(key + used, cls[i]);
		key[used] = '\0';
	}
	free(cls);
	return key;
}

/* Without a molecule (tests of the model on hand-built sites) a species is written as one
 * character per site in site order: '-' ionised acid, '+' protonated base, '0' neutral. */
static char *state_string(pred_result *r, const ion_work *w, size_t s,
                          const unsigned char *is_extra)
{
	char *out = res_alloc(r, w->n + 1);
	for (size_t i = 0; out && i < w->n; i++)
		out[i] = site_on(w, s, i, is_extra) ? (w->q_on[i] < 0 ? '-' : '+') : '0';
	return out;
}

/* Insert into the most-abundant-first list cand[0..nc), at most ION_CANDIDATE_MAX long. */
static size_t insert_candidate(candidate *cand, size_t nc, size_t s, double f)
{
	size_t at = nc < ION_CANDIDATE_MAX ? nc : ION_CANDIDATE_MAX - 1;
	if (nc == ION_CANDIDATE_MAX && f <= cand[at].fraction)
		return nc;
	while (at > 0 && cand[at - 1].fraction < f) {
		cand[at] = cand[at - 1];
		at--;
	}
	cand[at] = (candidate){s, f, 0, NULL};
	return nc < ION_CANDIDATE_MAX ? nc + 1 : nc;
}

/* Cluster states worth writing (the dominant one always), most abundant first. */
static size_t pick_states(const ion_work *w, candidate *cand)
{
	size_t nc = 0, top = 0;
	double ext = 1;
	for (size_t x = 0; x < w->nx; x++)
		ext *= w->xp[x] >= 0.5 ? w->xp[x] : 1 - w->xp[x];
	for (size_t s = 1; s < w->ns; s++)
		if (w->frac[s] > w->frac[top])
			top = s;
	for (size_t s = 0; s < w->ns; s++)
		if (s == top || w->frac[s] * ext >= ION_CANDIDATE_MIN)
			nc = insert_candidate(cand, nc, s, w->frac[s] * ext);
	return nc;
}

static int state_charge(const ion_work *w, size_t s, const unsigned char *is_extra)
{
	int q = w->fixed;
	for (size_t i = 0; i < w->n; i++)
		q += site_on(w, s, i, is_extra) ? w->q_on[i] : 0;
	return q;
}

/* Merge candidates with the same SMILES (symmetry-equivalent microstates). */
static size_t merge_same(candidate *cand, size_t nc)
{
	size_t out = 0;
	for (size_t i = 0; i < nc; i++) {
		size_t j = 0;
		while (j < out && !(cand[i].smiles && cand[j].smiles &&
		                    !strcmp(cand[i].smiles, cand[j].smiles)))
			j++;
		if (j < out) {
			cand[j].fraction += cand[i].fraction;
			/* the representative (whose SMILES is written) is the lowest state number,
			 * whatever order rounding gave equal fractions */
			if (cand[i].state < cand[j].state)
				cand[j].state = cand[i].state;
		} else
			cand[out++] = cand[i];
	}
	qsort(cand, out, sizeof *cand, cmp_candidate);
	return out;
}

static int write_species(pred_result *r, const candidate *cand, size_t nc)
{
	size_t keep = 1;
	while (keep < nc && cand[keep].fraction >= ION_REPORT_MIN)
		keep++;
	r->species = res_alloc(r, keep * sizeof *r->species);
	if (!r->species)
		return PRED_ENOMEM;
	for (size_t i = 0; i < keep; i++)
		r->species[i] = (pred_species){cand[i].smiles, cand[i].fraction, cand[i].charge};
	r->n_species = keep;
	return 0;
}

int ion_species_fill(pred_result *r, const ion_work *w, const ion_input *in, pred_error *err)
{
	candidate *cand = res_alloc(r, ION_CANDIDATE_MAX * sizeof *cand);
	unsigned char *is_extra = res_alloc(r, w->n + 1);
	if (!cand || !is_extra)
		return PRED_ENOMEM;
	for (size_t x = 0; x < w->nx; x++)
		is_extra[w->ex[x]] = 1;
	size_t nc = pick_states(w, cand);
	int by_symmetry = in && in->mol && in->symclass;
	for (size_t i = 0; i < nc; i++) {
		cand[i].charge = state_charge(w, cand[i].state, is_extra);
		cand[i].smiles = by_symmetry ? state_key(r, w, in, cand[i].state, is_extra)
					     : NULL;
		if (!in || !in->mol)
			cand[i].smiles = state_string(r, w, cand[i].state, is_extra);
		if ((by_symmetry || !in || !in->mol) && !cand[i].smiles)
			return PRED_ENOMEM;
	}
	/* equivalent microstates are one species; then only those reported need a SMILES
	 * (the list is most abundant first) */
	nc = merge_same(cand, nc);
	if (in && in->mol)
		for (size_t i = 0; i < nc; i++) {
			if (i > 0 && cand[i].fraction < ION_REPORT_MIN) {
				nc = i;
				break;
			}
			cand[i].smiles = species_smiles(r, w, in, cand[i].state, is_extra, err);
			if (!cand[i].smiles)
				return err ? err->code : PRED_EINTERNAL;
		}
	return write_species(r, cand, nc);
}
