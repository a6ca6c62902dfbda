/* SPDX-License-Identifier: MIT */
/* deprot_base.c: the base of a base-matching request, from the table or as a predicted SMILES. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "base_table.h"
#include "smiles_write.h"
#include "deprotonate.h"

static int fail(pred_error *err, int code, const char *msg)
{
	if (err) {
		err->code = code;
		snprintf(err->msg, sizeof err->msg, "%s", msg);
	}
	return code;
}

/* "unknown base 'x'; known: NaHCO3, Na2CO3, ..., DBU, ...": a short name of each. */
static int unknown_base(const pred_model *m, const char *base, pred_error *err)
{
	char msg[sizeof err->msg];
	int n = snprintf(msg, sizeof msg, "unknown base '%.40s'; known:", base);
	for (size_t i = 0; i < m->n_bases && n > 0 && (size_t)n < sizeof msg; i++) {
		/* the shorter of the name and its first alias */
		const char *a = m->bases[i].aliases, *nm = m->bases[i].name;
		size_t len = strlen(nm);
		if (a && *a && strcspn(a, ",") < len) {
			nm = a;
			len = strcspn(a, ",");
		}
		n += snprintf(msg + n, sizeof msg - (size_t)n, "%s %.*s", i ? "," : "", (int)len,
		              nm);
	}
	return fail(err, PRED_EINVAL, msg);
}

static int split_hazards(pred_deprotonation *d, const char *hazards)
{
	for (const char *p = hazards; *p;) {
		p += strspn(p, " ");
		size_t len = strcspn(p, ";");
		while (len && p[len - 1] == ' ')
			len--;
		if (len && deprot_caution(d, "%.*s", (int)len, p))
			return PRED_ENOMEM;
		p += strcspn(p, ";");
		p += *p == ';';
	}
	return 0;
}

static int from_table(pred_deprotonation *d, const frag_base *b)
{
	pred_result *r = d->sub;
	d->base = res_strdup(r, b->name);
	d->conj_acid = res_printf(r, "%s (%s)", b->conjugate_acid, b->conj_smiles);
	d->scale = res_strdup(r, b->scale);
	d->byproduct = res_strdup(r, b->byproduct);
	d->base_pka = b->pka;
	d->organometallic = b->organometallic;
	d->escapes = b->escapes;
	if (!d->base || !d->conj_acid || !d->scale || !d->byproduct)
		return PRED_ENOMEM;
	return split_hazards(d, b->hazards);
}

/* Molecule index of an anionic centre (negative atom with no positive neighbour: not the O
 * of a nitro group or an N-oxide), or -1 for a neutral base. */
static int anionic_centre(const obw_mol *mol)
{
	const obw_atom *at;
	const obw_bond *bd;
	size_t nat = obw_mol_atoms(mol, &at), nb = obw_mol_bonds(mol, &bd);
	for (size_t i = 0; i < nat; i++) {
		int balanced = 0;
		for (size_t k = 0; at[i].charge < 0 && k < nb; k++) {
			int o = bd[k].a == (int)i ? bd[k].b : bd[k].b == (int)i ? bd[k].a : -1;
			balanced |= o >= 0 && at[o].charge > 0;
		}
		if (at[i].charge < 0 && !balanced)
			return (int)i;
	}
	return -1;
}

/* The strongest conjugate-acid site: for an anionic base the weakest acid site of its
 * protonated form, for a neutral base its most basic site. */
static const pred_site *proton_site(const pred_result *br, pred_kind kind)
{
	const pred_site *best = NULL;
	for (size_t i = 0; i < pred_result_site_count(br); i++) {
		const pred_site *s = pred_result_site(br, i);
		if (s->kind == kind && (!best || s->pka > best->pka))
			best = s;
	}
	return best;
}

/* Adds one proton at molecule atom a (keeping only a's fragment, which drops counter-ions
 * such as Na+) and returns the canonical SMILES of that conjugate acid, malloc'd. */
static char *protonated(obw_mol *mol, obw_ctx *ctx, int a, char *msg, size_t msgn)
{
	const obw_atom *at;
	size_t nat = obw_mol_atoms(mol, &at);
	int *comp = calloc(nat + 1, sizeof *comp);
	unsigned char *keep = calloc(nat + 1, 1);
	char *out = NULL;
	int rc = comp && keep ? obw_mol_set_atom(mol, a, at[a].charge + 1, at[a].hcount + 1)
	                      : PRED_ENOMEM;
	if (!rc) {
		obw_mol_components(mol, comp, nat);
		for (size_t i = 0; i < nat; i++)
			keep[i] = comp[i] == comp[a];
		rc = obw_mol_keep_atoms(mol, keep, nat, msg, msgn);
	}
	if (!rc)
		rc = obw_mol_refresh(mol, msg, msgn);
	if (!rc)
		out = smiles_canonical(NULL, NULL, mol, ctx, msg, msgn);
	free(comp);
	free(keep);
	return out;
}

static int mol_index(const obw_mol *mol, int orig)
{
	const obw_atom *at;
	size_t nat = obw_mol_atoms(mol, &at);
	for (size_t i = 0; i < nat; i++)
		if (at[i].orig_index == orig)
			return (int)i;
	return -1;
}

static int set_predicted(pred_deprotonation *d, const char *smiles, const pred_site *s,
                         const char *conj)
{
	pred_result *r = d->sub;
	d->base_pka = s->pka;
	d->base = res_strdup(r, smiles);
	d->scale = res_strdup(r, "water");
	d->conj_acid = res_printf(r, "%s (%s site, predicted pKa %.2f)", conj, s->group, s->pka);
	d->byproduct = res_printf(r, "the conjugate acid %s", conj);
	d->predicted = 1;
	if (!d->base || !d->scale || !d->conj_acid || !d->byproduct)
		return PRED_ENOMEM;
	return deprot_caution(d, "no hazard data for a base given as SMILES: read its safety "
	                         "data sheet");
}

static int no_site(const char *smiles, pred_error *err)
{
	char msg[200];
	snprintf(msg, sizeof msg, "base '%.60s' has no site that takes a proton", smiles);
	return fail(err, PRED_EINVAL, msg);
}

/* Anionic base: predict its conjugate acid and take that acid's weakest acid site. */
static int anionic_base(pred_deprotonation *d, pred_worker *w, obw_mol *mol, int centre,
                        const char *smiles, const pred_options *opt, pred_error *err)
{
	pred_result *cr = NULL;
	char msg[200] = "";
	char *conj = protonated(mol, w->ctx, centre, msg, sizeof msg);
	if (!conj)
		return fail(err, PRED_EINTERNAL, msg[0] ? msg : "cannot protonate the base");
	int rc = pred_predict(&cr, w, conj, PRED_FMT_SMILES, opt, err);
	const pred_site *s = rc ? NULL : proton_site(cr, PRED_ACID);
	if (!rc)
		rc = s ? set_predicted(d, smiles, s, conj) : no_site(smiles, err);
	pred_result_free(cr);
	free(conj);
	return rc;
}

/* Neutral base: predict it and take its most basic site. */
static int neutral_base(pred_deprotonation *d, pred_worker *w, obw_mol *mol, const char *smiles,
                        const pred_options *opt, pred_error *err)
{
	pred_result *br = NULL;
	char msg[200] = "", *conj = NULL;
	int rc = pred_predict(&br, w, smiles, PRED_FMT_SMILES, opt, err);
	const pred_site *s = rc ? NULL : proton_site(br, PRED_BASE);
	if (!rc && !s)
		rc = no_site(smiles, err);
	if (!rc && !(conj = protonated(mol, w->ctx, mol_index(mol, s->atom), msg, sizeof msg)))
		rc = fail(err, PRED_EINTERNAL, msg[0] ? msg : "cannot protonate the base");
	if (!rc)
		rc = set_predicted(d, smiles, s, conj);
	pred_result_free(br);
	free(conj);
	return rc;
}

static int from_smiles(pred_deprotonation *d, pred_worker *w, const char *smiles,
                       const pred_options *opt, pred_error *err)
{
	obw_mol *mol = NULL;
	char msg[200] = "";
	if (obw_mol_parse(&mol, w->ctx, smiles, OBW_SMILES, msg, sizeof msg))
		return unknown_base(w->m, smiles, err);
	int centre = anionic_centre(mol);
	int rc = centre >= 0 ? anionic_base(d, w, mol, centre, smiles, opt, err)
	                     : neutral_base(d, w, mol, smiles, opt, err);
	obw_mol_free(mol);
	return rc;
}

int deprot_resolve_base(pred_deprotonation *d, pred_worker *w, const char *base,
                        const pred_options *opt, pred_error *err)
{
	int k = base_table_find(w->m, base);
	if (k >= 0)
		return from_table(d, &w->m->bases[k]) ? fail(err, PRED_ENOMEM, "out of memory") : 0;
	return from_smiles(d, w, base, opt, err);
}

int deprot_free_oh_nh(int *out, size_t max, pred_worker *w, const char *smiles)
{
	obw_mol *mol = NULL;
	const obw_atom *at;
	int rc = obw_mol_parse(&mol, w->ctx, smiles, OBW_SMILES, NULL, 0);
	if (rc)
		return rc;
	size_t nat = obw_mol_atoms(mol, &at), n = 0;
	for (size_t i = 0; i < nat; i++)
		if ((at[i].element == 7 || at[i].element == 8) && at[i].hcount > 0 && n < max)
			out[n++] = at[i].orig_index;
	obw_mol_free(mol);
	return (int)n;
}
