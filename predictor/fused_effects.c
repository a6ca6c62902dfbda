/* SPDX-License-Identifier: MIT */
/* fused_effects.c: substituents that reach a site's Hammett ring from a ring fused to it:
 * a benzo (six-) ring of a quinoline-type ring N (global.fused_transmission) and an aromatic
 * five-ring of a purine-type N (global.fused5_transmission). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"

/* Bond distance from atom `from` to `to` inside rings k and q, -1 if not reached (a fused 6-6
 * system is bipartite, so every path between two atoms has the same parity). */
static int ring_pair_distance(const eng_mol *e, size_t k, size_t q, int from, int to)
{
	const obw_rings *R = &e->rings;
	int atoms[12], dist[12], n_at = 0;
	for (int j = 0; j < 6; j++)
		atoms[n_at++] = R->atoms[R->offsets[k] + j];
	for (int j = 0; j < 6; j++)
		if (eng_ring_index_of(R, k, R->atoms[R->offsets[q] + j]) < 0)
			atoms[n_at++] = R->atoms[R->offsets[q] + j];
	for (int i = 0; i < n_at; i++)
		dist[i] = atoms[i] == from ? 0 : -1;
	for (int d = 0; d < n_at; d++)
		for (int i = 0; i < n_at; i++) {
			if (dist[i] != d)
				continue;
			int n;
			const int *nb = eng_nbrs(e, atoms[i], &n);
			for (int t = 0; t < n; t++)
				for (int u = 0; u < n_at; u++)
					if (atoms[u] == nb[t] && dist[u] < 0)
						dist[u] = d + 1;
		}
	for (int i = 0; i < n_at; i++)
		if (atoms[i] == to)
			return dist[i];
	return -1;
}

/* Atom a (on a ring fused to ring k) is bonded to a fusion atom that is bonded to a ring N
 * of ring k: the peri position of that N. */
static int peri_to_ring_n(const eng_mol *e, size_t k, int a)
{
	int n;
	const int *nb = eng_nbrs(e, a, &n);
	for (int j = 0; j < n; j++) {
		if (eng_ring_index_of(&e->rings, k, nb[j]) < 0)
			continue;
		int n2;
		const int *nb2 = eng_nbrs(e, nb[j], &n2);
		for (int t = 0; t < n2; t++)
			if (e->atoms[nb2[t]].element == 7 && eng_ring_index_of(&e->rings, k, nb2[t]) >= 0)
				return 1;
	}
	return 0;
}

/* An amino or nitro group on a fused ring: corrections.tsv holds their whole effect at a ring
 * N (fused_ring_amino_*, fused_ring_nitro, ring_amine_*), so the fused-ring term leaves them. */
static int fused_own_row(const eng_mol *e, int x, int a)
{
	const obw_atom *n_atom = &e->atoms[x];
	if (n_atom->element != 7 || n_atom->aromatic)
		return 0;
	if (n_atom->charge > 0)
		return 1; /* nitro, ammonium */
	int n;
	const int *nb = eng_nbrs(e, x, &n);
	for (int j = 0; j < n; j++)
		if (nb[j] != a && e->atoms[nb[j]].element == 6 && !e->atoms[nb[j]].aromatic &&
		    e->hetero_pi[nb[j]])
			return 0; /* amide N */
	return n_atom->charge == 0;
}

/* The groups on atom a of ring q fused to the site's Hammett ring, each as param x rho x
 * sigma: sigma_p (the row's para scale) where conj, else sigma_m; where names the route in
 * the term. Leaves what is seen, in ring q, the site's own, fused at a, and, with own_rows,
 * a group that has correction rows of its own (fused_own_row). Marks what it counted. */
static void fused_groups_at(term_list *tl, const eng_mol *e, const pred_model *m,
			    const eng_site *s, size_t q, int a, int param, int conj,
			    int own_rows, const char *where, unsigned char *seen)
{
	const frag_site *row = &m->sites[s->row];
	double rho = m->params[row->p_rho].value;
	int n;
	const int *nb = eng_nbrs(e, a, &n);
	for (int t = 0; t < n; t++) {
		int x = nb[t];
		if (seen[x] || eng_ring_index_of(&e->rings, q, x) >= 0 || eng_in_match(s, x) ||
		    eng_fused_with(e, q, a, x) || (own_rows && fused_own_row(e, x, a)))
			continue;
		sigmas g;
		eng_group_sigmas(&g, e, m, x);
		const double v[] = {g.p, g.p_minus, g.p_plus};
		double sigma = conj ? v[row->sigma_para] : g.m;
		terms_add(tl, m, g.generic ? "generic_substituent" : "hammett", param, -rho * sigma,
			  "%s %s, %s %.2f, rho %.2f", where, g.label, conj ? "sigma_p" : "sigma_m",
			  sigma, rho);
		if (g.generic) {
			tl->n_generic++;
			tl->extra_var += 0.16 * 0.16;
		}
		eng_mark_group(seen, e, x);
	}
}

/* Substituents on a benzo ring (aromatic, all carbon) fused to the Hammett ring of a
 * quinoline-, isoquinoline-, quinoxaline-, cinnoline- or phthalazine-type ring N (and both
 * outer rings of an acridine or phenazine): they reach the N through the ring fusion as
 * global.fused_transmission x rho x sigma, with sigma_p (the row's para scale) where the
 * cation's charge reaches their carbon (odd bond distance from the N: quinoline 5-, 7-;
 * isoquinoline 6-, 8-) and sigma_m elsewhere; not at the peri carbon of a ring N. The
 * quinazolines (pyrimidine group) are left out: their covalent hydration has its own rows.
 * Marks what it counted. */
void eng_fused_ring_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			    const eng_site *s, size_t k, unsigned char *seen)
{
	const frag_site *row = &m->sites[s->row];
	const obw_atom *c = &e->atoms[s->centre];
	if (m->p_fused_transmission < 0 || row->kind != PRED_BASE || c->element != 7 ||
	    !c->aromatic || eng_ring_index_of(&e->rings, k, s->centre) < 0 ||
	    (strcmp(row->group, "quinoline") != 0 && strcmp(row->group, "isoquinoline") != 0 &&
	     strcmp(row->group, "pyrazine") != 0 && strcmp(row->group, "pyridazine") != 0))
		return;
	const obw_rings *R = &e->rings;
	for (size_t q = 0; q < R->n_rings; q++) {
		if (q == k || !eng_ring_is_aromatic6(e, q))
			continue;
		int shared = 0, hetero = 0;
		for (int j = 0; j < 6; j++) {
			int b = R->atoms[R->offsets[q] + j];
			shared += eng_ring_index_of(R, k, b) >= 0;
			hetero += e->atoms[b].element != 6;
		}
		if (shared != 2 || hetero)
			continue;
		for (int j = 0; j < 6; j++) {
			int a = R->atoms[R->offsets[q] + j];
			if (eng_ring_index_of(R, k, a) >= 0)
				continue;
			/* the peri carbon of a ring N (quinoline 8-, acridine 4-, cinnoline 8-),
			 * whose group sits beside that N and acts through space (the H-bond of
			 * 8-hydroxy- and quinoline-8-carboxylic acid), not through the ring */
			int dist = ring_pair_distance(e, k, q, s->centre, a);
			if (dist < 0 || peri_to_ring_n(e, k, a))
				continue;
			fused_groups_at(tl, e, m, s, q, a, m->p_fused_transmission, dist % 2, 1,
					"fused-ring", seen);
		}
	}
}

/* Whether ring q is an aromatic five-ring without an exocyclic C=O or C=S (a purin-8-one or
 * -8-thione is not an azole ring: fused_imidazolone holds its effect). */
static int ring_is_azole5(const eng_mol *e, size_t q)
{
	const obw_rings *R = &e->rings;
	if (R->sizes[q] != 5)
		return 0;
	for (int j = 0; j < 5; j++) {
		int a = R->atoms[R->offsets[q] + j];
		if (!e->atoms[a].aromatic || eng_ring_oxo_atom(e, a) >= 0)
			return 0;
	}
	return 1;
}

/* Substituents on the carbons of an aromatic five-ring fused to the Hammett ring k of a
 * ring-N base (purine 8-, imidazo[4,5-b]- and [4,5-c]pyridine 2-, thieno- and pyrrolo-
 * pyrimidine groups): global.fused5_transmission x rho x sigma_p (the row's para scale) at
 * every carbon: the odd ring breaks the meta/para alternation of a benzo ring, and the
 * five-ring N lone pair conjugates each carbon with the azine (8-methylthio- and 2-methyl-
 * thioimidazopyridines, sigma_m 0.15 but sigma_p 0.00, fit without a term). Substituents
 * on the five-ring N (9-alkyl, glycosyl) are left to the parent and the corrections. Marks
 * what it counted. */
void eng_fused5_ring_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			     const eng_site *s, size_t k, unsigned char *seen)
{
	const frag_site *row = &m->sites[s->row];
	const obw_atom *c = &e->atoms[s->centre];
	if (m->p_fused5_transmission < 0 || row->kind != PRED_BASE || c->element != 7 ||
	    !c->aromatic || eng_ring_index_of(&e->rings, k, s->centre) < 0 ||
	    (strcmp(row->group, "pyridine") != 0 && strcmp(row->group, "pyrimidine") != 0))
		return;
	const obw_rings *R = &e->rings;
	for (size_t q = 0; q < R->n_rings; q++) {
		if (q == k || !ring_is_azole5(e, q))
			continue;
		int shared = 0;
		for (int j = 0; j < 5; j++)
			shared += eng_ring_index_of(R, k, R->atoms[R->offsets[q] + j]) >= 0;
		if (shared != 2)
			continue;
		for (int j = 0; j < 5; j++) {
			int a = R->atoms[R->offsets[q] + j];
			if (eng_ring_index_of(R, k, a) >= 0 || e->atoms[a].element != 6)
				continue;
			fused_groups_at(tl, e, m, s, q, a, m->p_fused5_transmission, 1, 0,
					"fused five-ring", seen);
		}
	}
}
