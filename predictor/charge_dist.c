/* SPDX-License-Identifier: MIT */
/* charge_dist.c: bonds from the charge of each site, the distance the interaction uses. */
#include <stdlib.h>

#include "engine.h"

/* A base site on an aromatic N of a six-membered ring with two ring neighbours: its cation
 * is an azinium, whose positive charge is shared by N1 and the ring atoms ortho and para to
 * it (C2, C6, C4 in the resonance forms of the pyridinium ion; common practice). */
static int is_azine_n(const eng_mol *e, const pred_model *m, const eng_site *s)
{
	const obw_atom *a = &e->atoms[s->atom];
	return m->sites[s->row].kind == PRED_BASE && a->element == 7 && a->aromatic &&
	       a->degree == 2 && (e->ring_sizes[s->atom] & (1u << 6));
}

static int in_six_ring(const eng_mol *e, int a)
{
	return e->atoms[a].aromatic && (e->ring_sizes[a] & (1u << 6));
}

/* Only a ring carbon takes a share: the form with the charge on an ortho or para ring N
 * (pyrazine, pyridazine) is a nitrenium ion and no real contributor. */
static int takes_charge(const eng_mol *e, int a)
{
	return e->atoms[a].element == 6;
}

/* Atoms ortho and para to ring N n (out[0..2]); returns how many were found. The para atom
 * closes the ring n-o1-x-p-y-o2 with both ortho atoms. */
static int ortho_para(const eng_mol *e, int n, int out[3])
{
	int k = 0, nn;
	const int *nb = eng_nbrs(e, n, &nn);
	for (int i = 0; i < nn && k < 2; i++)
		if (in_six_ring(e, nb[i]))
			out[k++] = nb[i];
	if (k < 2)
		return k;
	int n1, n2, n3, n4;
	const int *a1 = eng_nbrs(e, out[0], &n1);
	for (int i = 0; i < n1; i++) {
		if (a1[i] == n || !in_six_ring(e, a1[i]))
			continue;
		const int *a2 = eng_nbrs(e, a1[i], &n2);
		for (int j = 0; j < n2; j++) {
			const int *a3 = eng_nbrs(e, out[1], &n3);
			for (int q = 0; q < n3; q++) {
				if (a3[q] == n || a2[j] == out[0] || !in_six_ring(e, a2[j]))
					continue;
				const int *a4 = eng_nbrs(e, a3[q], &n4);
				for (int r = 0; r < n4; r++)
					if (a4[r] == a2[j]) {
						out[2] = a2[j];
						return 3;
					}
			}
		}
	}
	return 2;
}

/* Row i of e->qdist: the site's own distances, and for an azinium N the distance to the
 * atom of a base site through an ortho or para atom plus one bond where that is shorter (a
 * share of the charge one bond further away: W(d + 1) = 0.66 W(d)). Acid partners keep the
 * N1 distance: an anion on the ring is already counted by its ionic sigma (and the
 * charge_counted_once rows cancel W by the N1 distance), and on the train split spreading
 * towards anions too was worse (squared error of the tier A and handbook rows 8,930 with
 * base partners only, 8,955 with all; 9,084 without the spread). */
static void charge_row(eng_mol *e, const pred_model *m, size_t i, int *tmp, int *queue)
{
	int *row = e->qdist + i * e->nat, at[3];
	const int *own = e->dist + i * e->nat;
	for (size_t a = 0; a < e->nat; a++)
		row[a] = own[a];
	if (!is_azine_n(e, m, &e->sites[i]))
		return;
	int k = ortho_para(e, e->sites[i].atom, at);
	for (int c = 0; c < k; c++) {
		if (!takes_charge(e, at[c]))
			continue;
		eng_bfs(e, at[c], tmp, queue);
		for (size_t j = 0; j < e->n_sites; j++) {
			int a = e->sites[j].atom;
			if (j == i || m->sites[e->sites[j].row].kind != PRED_BASE)
				continue;
			if (tmp[a] >= 0 && row[a] > 0 && tmp[a] + 1 < row[a])
				row[a] = tmp[a] + 1;
		}
	}
}

int eng_charge_distances(eng_mol *e, const pred_model *m)
{
	e->qdist = malloc((e->n_sites * e->nat + 1) * sizeof *e->qdist);
	int *tmp = malloc((e->nat + 1) * sizeof *tmp);
	int *queue = malloc((e->nat + 1) * sizeof *queue);
	int rc = e->qdist && tmp && queue ? 0 : PRED_ENOMEM;
	for (size_t i = 0; !rc && i < e->n_sites; i++)
		charge_row(e, m, i, tmp, queue);
	free(tmp);
	free(queue);
	return rc;
}

int eng_charge_bonds(const int *qdist, size_t nat, size_t i, int atom_i, size_t j, int atom_j)
{
	int dij = qdist[i * nat + (size_t)atom_j], dji = qdist[j * nat + (size_t)atom_i];
	return dij < dji ? dij : dji; /* both -1 when not connected, 0 for one atom */
}
