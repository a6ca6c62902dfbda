/* SPDX-License-Identifier: MIT */
/* normalize.c: strips counter-ions and solvents and neutralises drawn protonation states. */
#include "normalize.h"

#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "smiles_write.h"

void norm_report_init(norm_report *rep)
{
	memset(rep, 0, sizeof *rep);
}

void norm_warn(norm_report *rep, const char *fmt, ...)
{
	va_list ap;
	if (!rep || rep->n >= NORM_WARN_MAX)
		return;
	if (rep->n == NORM_WARN_MAX - 1) {
		snprintf(rep->warn[rep->n++], NORM_WARN_LEN, "... more changes");
		return;
	}
	va_start(ap, fmt);
	vsnprintf(rep->warn[rep->n++], NORM_WARN_LEN, fmt, ap);
	va_end(ap);
}

static int fail(pred_error *err, int code, const char *fmt, ...)
{
	va_list ap;
	if (err) {
		err->code = code;
		va_start(ap, fmt);
		vsnprintf(err->msg, sizeof err->msg, fmt, ap);
		va_end(ap);
	}
	return code;
}

/* ---- fragments ------------------------------------------------------------------------ */

typedef struct frag_size {
	int heavy;
	int carbon;
} frag_size;

/* The fragment to keep: carbon-containing first, then most heavy atoms, then the first. */
static int pick_fragment(const frag_size *fs, size_t n)
{
	size_t best = 0;
	for (size_t k = 1; k < n; k++) {
		int better_c = fs[k].carbon && !fs[best].carbon;
		int same_c = !fs[k].carbon == !fs[best].carbon;
		if (better_c || (same_c && fs[k].heavy > fs[best].heavy))
			best = k;
	}
	return (int)best;
}

/* Canonical SMILES of fragment k of m, malloc'd (NULL when it cannot be written). */
static char *fragment_smiles(const obw_mol *m, obw_ctx *c, const int *comp, size_t nat,
			     int k)
{
	obw_mol *copy = NULL;
	unsigned char *keep = malloc(nat);
	char *s = NULL;
	if (keep && obw_mol_clone(&copy, m) == 0) {
		for (size_t i = 0; i < nat; i++)
			keep[i] = comp[i] == k;
		if (obw_mol_keep_atoms(copy, keep, nat, NULL, 0) == 0)
			s = smiles_canonical(NULL, NULL, copy, c, NULL, 0);
	}
	obw_mol_free(copy);
	free(keep);
	return s;
}

/* Removed fragments larger than this are named by size: canonical SMILES of a big graph
 * costs Open Babel seconds, and the line would not hold it anyway. */
enum { NAMED_FRAGMENT_MAX = 40 };

/* "removed 2 fragments: [Na+], O" into rep; the list is cut to fit the line. */
static void warn_removed(norm_report *rep, const obw_mol *m, obw_ctx *c, const int *comp,
			 const frag_size *fs, size_t ncomp, int kept)
{
	const obw_atom *a;
	size_t nat = obw_mol_atoms(m, &a);
	char line[NORM_WARN_LEN];
	int first = 1;
	int len = snprintf(line, sizeof line, "removed %zu fragment%s:", ncomp - 1,
			   ncomp > 2 ? "s" : "");
	for (size_t k = 0; k < ncomp; k++) {
		if ((int)k == kept || len < 0 || (size_t)len >= sizeof line)
			continue;
		char *s = NULL, size[48];
		if (fs[k].heavy <= NAMED_FRAGMENT_MAX)
			s = fragment_smiles(m, c, comp, nat, (int)k);
		snprintf(size, sizeof size, "(%d heavy atoms)", fs[k].heavy);
		len += snprintf(line + len, sizeof line - (size_t)len, "%s %s", first ? "" : ",",
				s ? s : size);
		first = 0;
		free(s);
	}
	norm_warn(rep, "%s", line);
}

static int strip_fragments(obw_mol *m, obw_ctx *c, norm_report *rep, pred_error *err)
{
	const obw_atom *a;
	size_t nat = obw_mol_atoms(m, &a);
	int *comp = malloc((nat ? nat : 1) * sizeof *comp);
	frag_size *fs = calloc(nat ? nat : 1, sizeof *fs);
	unsigned char *keep = malloc(nat ? nat : 1);
	int rc = 0;
	if (!comp || !fs || !keep) {
		rc = fail(err, PRED_ENOMEM, "out of memory");
		goto done;
	}
	size_t ncomp = obw_mol_components(m, comp, nat);
	if (ncomp < 2)
		goto done;
	for (size_t i = 0; i < nat; i++) {
		fs[comp[i]].heavy += a[i].element != 1;
		fs[comp[i]].carbon |= a[i].element == 6;
	}
	int kept = pick_fragment(fs, ncomp);
	warn_removed(rep, m, c, comp, fs, ncomp, kept);
	for (size_t i = 0; i < nat; i++)
		keep[i] = comp[i] == kept;
	char msg[256] = "";
	if (obw_mol_keep_atoms(m, keep, nat, msg, sizeof msg))
		rc = fail(err, PRED_EINTERNAL, "%s", msg);
done:
	free(comp);
	free(fs);
	free(keep);
	return rc;
}

/* ---- charges -------------------------------------------------------------------------- */

/* Marks each atom that has a positively (pos) or negatively (neg) charged neighbour; one
 * pass over the bonds. */
static void neighbour_charges(const obw_bond *b, size_t nb, const obw_atom *a,
			      unsigned char *pos, unsigned char *neg)
{
	for (size_t k = 0; k < nb; k++) {
		pos[b[k].a] |= a[b[k].b].charge > 0;
		neg[b[k].a] |= a[b[k].b].charge < 0;
		pos[b[k].b] |= a[b[k].a].charge > 0;
		neg[b[k].b] |= a[b[k].a].charge < 0;
	}
}

static const char *symbol(int z)
{
	switch (z) {
	case 7:
		return "N";
	case 8:
		return "O";
	case 15:
		return "P";
	case 16:
		return "S";
	default:
		return "?";
	}
}

/* The H change that neutralises atom i (+1 adds, -1 removes), 0 when the charge stays. */
static int neutralising_h(const obw_atom *a, int i, int has_pos, int has_neg)
{
	int z = a[i].element;
	if (a[i].charge == -1 && !has_pos && (z == 8 || z == 16 || z == 7))
		return 1;
	if (a[i].charge == 1 && !has_neg && a[i].hcount > 0 &&
	    (z == 7 || z == 8 || z == 15 || z == 16))
		return -1;
	return 0;
}

/* dh[i]: the H change that neutralises atom i. Returns 0 or PRED_ENOMEM. */
static int plan_neutralisation(int *dh, const obw_mol *m)
{
	const obw_atom *a;
	const obw_bond *b;
	size_t nat = obw_mol_atoms(m, &a), nb = obw_mol_bonds(m, &b);
	unsigned char *pos = calloc(nat ? nat : 1, 2);
	if (!pos)
		return PRED_ENOMEM;
	unsigned char *neg = pos + nat;
	neighbour_charges(b, nb, a, pos, neg);
	for (size_t i = 0; i < nat; i++)
		dh[i] = neutralising_h(a, (int)i, pos[i], neg[i]);
	free(pos);
	return 0;
}

static int neutralise(obw_mol *m, norm_report *rep, pred_error *err)
{
	const obw_atom *a;
	size_t nat = obw_mol_atoms(m, &a);
	int *dh = calloc(nat ? nat : 1, sizeof *dh), changed = 0, len = 0, rc = 0;
	char line[NORM_WARN_LEN] = "";
	if (!dh || plan_neutralisation(dh, m)) {
		free(dh);
		return fail(err, PRED_ENOMEM, "out of memory");
	}
	for (size_t i = 0; i < nat && !rc; i++) {
		if (!dh[i])
			continue;
		if (len >= 0 && (size_t)len < sizeof line)
			len += snprintf(line + len, sizeof line - (size_t)len, "%s%s%s (atom %d)",
					changed ? ", " : "", symbol(a[i].element),
					a[i].charge > 0 ? "+" : "-", a[i].orig_index);
		changed++;
		rc = obw_mol_set_atom(m, (int)i, 0, a[i].hcount + dh[i]);
	}
	free(dh);
	if (rc)
		return fail(err, rc, "cannot neutralise charged atoms");
	if (changed)
		norm_warn(rep, "neutralised %d charged atom%s drawn as another protonation state: %s",
			  changed, changed > 1 ? "s" : "", line);
	return 0;
}

int norm_molecule(obw_mol *m, obw_ctx *c, norm_report *rep, pred_error *err)
{
	char msg[256] = "";
	size_t before = rep->n;
	int rc = strip_fragments(m, c, rep, err);
	if (!rc)
		rc = neutralise(m, rep, err);
	/* every change is reported, so an unchanged report means nothing to re-perceive */
	if (!rc && (rep->n != before || rep->n >= NORM_WARN_MAX - 1) &&
	    obw_mol_refresh(m, msg, sizeof msg))
		rc = fail(err, PRED_EINTERNAL, "%s", msg);
	return rc;
}
