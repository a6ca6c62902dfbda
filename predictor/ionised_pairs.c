/* SPDX-License-Identifier: MIT */
/* ionised_pairs.c: ring groups that ionise before a phenol-type site: the pair shift that
 * takes the sigma of the ionised group instead of the neutral one (eng_ionised_pairs). */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"

/* The substituent row of the ionised form of group row k: the same id with its final H
 * read as "-" (COOH -> COO-, OH -> O-, SO3H -> SO3-); -1 where the table has none. */
static int ionised_row(const pred_model *m, int k)
{
	char id[sizeof m->substs[k].id];
	size_t len = strlen(m->substs[k].id);
	if (len < 2 || m->substs[k].id[len - 1] != 'H')
		return -1;
	memcpy(id, m->substs[k].id, len + 1);
	id[len - 1] = '-';
	for (size_t r = 0; r < m->n_substs; r++)
		if (!strcmp(m->substs[r].id, id))
			return (int)r;
	return -1;
}

/* The site sigma of a row at ring position pos (3 meta, 4 para). */
static double site_sigma(const frag_site *row, const frag_subst *t, int pos)
{
	const double v[] = {t->sigma_p, t->sigma_p_minus, t->sigma_p_plus};
	return pos == 3 ? t->sigma_m : v[row->sigma_para];
}

/* Pairs of site i, and the acid sites in the groups meta and para on its Hammett ring. */
static void ionised_pairs_of(eng_mol *e, const pred_model *m, const double *micro, size_t i,
			     unsigned char *seen, int *queue, int *depth)
{
	const eng_site *s = &e->sites[i];
	const frag_site *row = &m->sites[s->row];
	int ipso = -1;
	if (row->sigma_para != 1)
		return;
	int k = m->params[row->p_rho].value != 0 ? eng_hammett_ring(e, m, s, &ipso, seen, queue, depth)
						 : -1;
	if (k < 0)
		return;
	const obw_rings *R = &e->rings;
	int i0 = eng_ring_index_of(R, (size_t)k, ipso), size = R->sizes[k];
	size_t n = e->n_sites;
	for (size_t j = 0; j < n; j++) {
		const eng_site *t = &e->sites[j];
		int x = e->group_root[t->atom], g = e->group[t->atom];
		if (j == i || x < 0 || x == t->atom || g < 0 || m->sites[t->row].kind != PRED_ACID ||
		    micro[j] > micro[i] || (micro[j] == micro[i] && j > i) || eng_in_match(s, x))
			continue;
		int at = -1, nb;
		const int *b = eng_nbrs(e, x, &nb);
		for (int q = 0; q < nb && at < 0; q++)
			if (eng_ring_index_of(R, (size_t)k, b[q]) >= 0 && !eng_in_match(s, b[q]))
				at = eng_ring_index_of(R, (size_t)k, b[q]);
		int pos = at >= 0 ? eng_ring_position(e, s, (size_t)k, i0, at) : 0;
		int r = ionised_row(m, g);
		if ((pos != 3 && pos != 4) || (size == 7 && eng_in_match(s, R->atoms[R->offsets[k] + at])) ||
		    r < 0)
			continue;
		double rho = m->params[pos == 4 ? row->p_rho_para : row->p_rho].value;
		double v = rho * (site_sigma(row, &m->substs[g], pos) -
				  site_sigma(row, &m->substs[r], pos));
		e->ion_pair[i * n + j] = e->ion_pair[j * n + i] = v;
	}
}

int eng_ionised_pairs(eng_mol *e, const pred_model *m, const double *micro)
{
	size_t n = e->n_sites;
	free(e->ion_pair);
	e->ion_pair = malloc((n * n + 1) * sizeof *e->ion_pair);
	unsigned char *seen = calloc(e->nat + 1, 1);
	int *queue = malloc((e->nat + 1) * sizeof *queue);
	int *depth = malloc((e->nat + 1) * sizeof *depth);
	int rc = e->ion_pair && seen && queue && depth ? 0 : PRED_ENOMEM;
	for (size_t k = 0; !rc && k < n * n; k++)
		e->ion_pair[k] = NAN;
	for (size_t i = 0; !rc && i < n; i++)
		ionised_pairs_of(e, m, micro, i, seen, queue, depth);
	free(seen);
	free(queue);
	free(depth);
	return rc;
}
