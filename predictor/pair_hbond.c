/* SPDX-License-Identifier: MIT */
/* pair_hbond.c: acid pairs whose monoanion is held by an intramolecular hydrogen bond. */
#include <stdlib.h>
#include <string.h>

#include "engine.h"

/* Pair rows of corrections.tsv carry this term. The row's value v (negative) is added to
 * both sites as an ordinary correction: the first proton leaves more easily because the
 * anion is bonded to the other OH. Once one site is ionised, the other holds its proton in
 * a hydrogen bond to that anion, and gains -2v (eng_stepwise, and the pair shift of the
 * microstate model), so pKa1 falls by |v| and pKa2 rises by |v|: the monoanions of
 * 2,2-dialkylmalonic and cyclopentene-1,2-dicarboxylic acids. */
static const char PAIR_TERM[] = "hbond_pair";

/* Sites of one pair lie within this many bonds (O-C-C-C-C-C-O of a glutaric acid). */
enum { PAIR_MAX_BONDS = 6 };

static int corr_has_atom(const eng_mol *e, size_t k, int atom)
{
	for (int i = e->corr_start[k]; i < e->corr_start[k + 1]; i++)
		if (e->corr_atom[i] == atom)
			return 1;
	return 0;
}

static int site_takes(const eng_mol *e, const pred_worker *w, size_t k, size_t i)
{
	const eng_site *s = &e->sites[i];
	return w->m->sites[s->row].kind == PRED_ACID &&
	       w->corr_ok[k * w->m->n_sites + (size_t)s->row] && corr_has_atom(e, k, s->atom);
}

/* Parameter of the first pair row shared by sites i and j, or -1. */
static int pair_param(const eng_mol *e, const pred_worker *w, size_t i, size_t j)
{
	int d = e->dist[i * e->nat + (size_t)e->sites[j].atom];
	if (d <= 0 || d > PAIR_MAX_BONDS)
		return -1;
	for (size_t p = 0; p < w->n_pair_corrs; p++) {
		size_t k = (size_t)w->pair_corrs[p];
		if (e->corr_start[k] < e->corr_start[k + 1] && site_takes(e, w, k, i) &&
		    site_takes(e, w, k, j))
			return w->m->corrs[k].p_value;
	}
	return -1;
}

size_t eng_pair_rows(int *out, const pred_model *m)
{
	size_t n = 0;
	for (size_t k = 0; k < m->n_corrs; k++)
		if (!strcmp(m->corrs[k].term, PAIR_TERM))
			out[n++] = (int)k;
	return n;
}

int eng_pair_hbonds(eng_mol *e, const pred_worker *w)
{
	size_t n = e->n_sites;
	free(e->pair_param);
	e->pair_param = malloc((n * n + 1) * sizeof *e->pair_param);
	if (!e->pair_param)
		return PRED_ENOMEM;
	for (size_t i = 0; i < n; i++)
		for (size_t j = 0; j < n; j++)
			e->pair_param[i * n + j] = i == j ? -1 : pair_param(e, w, i, j);
	return 0;
}
