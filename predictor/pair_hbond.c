/* SPDX-License-Identifier: MIT */
/* pair_hbond.c: acid pairs whose monoanion is held by an intramolecular hydrogen bond. */
#include <stdlib.h>

#include "engine.h"

/* Pair rows of corrections.tsv (frag_corr.pair, set by the loader from the term column).
 * The row's value v (negative) is added to both sites as an ordinary correction: the first
 * proton leaves more easily because the anion is bonded to the other OH. Once one site is
 * ionised, the other holds its proton in a hydrogen bond to that anion, and gains -2v
 * (eng_stepwise, and the pair shift of the microstate model), so pKa1 falls by |v| and pKa2
 * rises by |v|: the monoanions of 2,2-dialkylmalonic and cyclopentene-1,2-dicarboxylic
 * acids. An "hbond_pair_z" row holds only for two sites on the two ends of a C=C drawn cis
 * (maleic, not fumaric acid): the pattern cannot tell the two apart, the drawn
 * configuration can (obw_mol_bond_cis; an unmarked double bond reads not cis). A
 * "charge_pair" row joins two sites on one centre (two bonds apart: the OH of one
 * P(=O)(OH)2) whose charges repel more than the bond-count fall-off of the interaction
 * gives: the site ionising second gains v per ionised partner, the first nothing. */

/* Sites of one pair lie within this many bonds (O-C-C-C-C-C-O of a glutaric acid). */
enum { PAIR_MAX_BONDS = 6 };

/* A site sits on an end of a double bond when its ionizable atom is at most this many
 * bonds from that carbon (O-C(=O)-C= of an acrylic acid). */
enum { ENE_MAX_BONDS = 2 };

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

/* Bonds from site i's ionizable atom to atom a; -1 when not connected. */
static int site_dist(const eng_mol *e, size_t i, int a)
{
	return e->dist[i * e->nat + (size_t)a];
}

/* The neighbour of atom b (not c) one bond nearer to site i, -1 none: the substituent on b
 * that leads to the site. */
static int toward_site(const eng_mol *e, size_t i, int b, int c)
{
	int n;
	const int *nb = eng_nbrs(e, b, &n);
	for (int k = 0; k < n; k++)
		if (nb[k] != c && site_dist(e, i, nb[k]) == site_dist(e, i, b) - 1)
			return nb[k];
	return -1;
}

/* Site i on carbon b and site j on carbon c of the non-aromatic double bond b=c, each
 * nearer its own end, and the two substituents that lead to them drawn cis. */
static int cis_on_bond(const eng_mol *e, size_t i, size_t j, int b, int c)
{
	int db = site_dist(e, i, b), dc = site_dist(e, j, c);
	if (db < 1 || db > ENE_MAX_BONDS || dc < 1 || dc > ENE_MAX_BONDS ||
	    site_dist(e, i, c) != db + 1 || site_dist(e, j, b) != dc + 1)
		return 0;
	int x = toward_site(e, i, b, c), y = toward_site(e, j, c, b);
	return x >= 0 && y >= 0 && obw_mol_bond_cis(e->mol, x, b, c, y);
}

/* Sites i and j sit cis on the two ends of a C=C (either way round). */
static int cis_on_ene(const eng_mol *e, size_t i, size_t j)
{
	for (size_t k = 0; k < e->nbonds; k++) {
		const obw_bond *bd = &e->bonds[k];
		if (bd->order != 2 || bd->aromatic || e->atoms[bd->a].element != 6 ||
		    e->atoms[bd->b].element != 6)
			continue;
		if (cis_on_bond(e, i, j, bd->a, bd->b) || cis_on_bond(e, i, j, bd->b, bd->a))
			return 1;
	}
	return 0;
}

/* Pair row k holds for sites i and j. */
static int row_pairs(const eng_mol *e, const pred_worker *w, size_t k, size_t i, size_t j)
{
	if (e->corr_start[k] == e->corr_start[k + 1] || !site_takes(e, w, k, i) ||
	    !site_takes(e, w, k, j))
		return 0;
	if (w->m->corrs[k].pair == CORR_PAIR_CHARGE)
		return site_dist(e, i, e->sites[j].atom) == 2;
	return w->m->corrs[k].pair != CORR_PAIR_Z || cis_on_ene(e, i, j);
}

static int pair_near(const eng_mol *e, size_t i, size_t j)
{
	int d = site_dist(e, i, e->sites[j].atom);
	return d > 0 && d <= PAIR_MAX_BONDS;
}

/* Parameter of the first pair row shared by sites i and j, or -1. */
static int pair_param(const eng_mol *e, const pred_worker *w, size_t i, size_t j)
{
	if (!pair_near(e, i, j))
		return -1;
	for (size_t p = 0; p < w->n_pair_corrs; p++) {
		size_t k = (size_t)w->pair_corrs[p];
		if (row_pairs(e, w, k, i, j))
			return w->m->corrs[k].p_value;
	}
	return -1;
}

int eng_pair_is_charge(const pred_model *m, int param)
{
	return m->params[param].pair == CORR_PAIR_CHARGE;
}

int eng_pair_row_holds(const eng_mol *e, const pred_worker *w, size_t k, size_t i)
{
	if (w->m->corrs[k].pair != CORR_PAIR_Z)
		return 1;
	for (size_t j = 0; j < e->n_sites; j++)
		if (j != i && pair_near(e, i, j) && row_pairs(e, w, k, i, j))
			return 1;
	return 0;
}

size_t eng_pair_rows(int *out, const pred_model *m)
{
	size_t n = 0;
	for (size_t k = 0; k < m->n_corrs; k++)
		if (m->corrs[k].pair)
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
