/* SPDX-License-Identifier: MIT */
/* perceive.c: graph, substituent claims and ionizable sites of one molecule. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "canon_rank.h"
#include "engine.h"

static int build_graph(eng_mol *e)
{
	e->adj_start = calloc(e->nat + 1, sizeof *e->adj_start);
	e->adj = malloc((2 * e->nbonds + 1) * sizeof *e->adj);
	e->adj_bond = malloc((2 * e->nbonds + 1) * sizeof *e->adj_bond);
	if (!e->adj_start || !e->adj || !e->adj_bond)
		return PRED_ENOMEM;
	for (size_t i = 0; i < e->nbonds; i++) {
		e->adj_start[e->bonds[i].a + 1]++;
		e->adj_start[e->bonds[i].b + 1]++;
	}
	for (size_t a = 0; a < e->nat; a++)
		e->adj_start[a + 1] += e->adj_start[a];
	int *fill = calloc(e->nat + 1, sizeof *fill);
	e->hetero_pi = calloc(e->nat + 1, 1);
	if (!fill || !e->hetero_pi) {
		free(fill);
		return PRED_ENOMEM;
	}
	for (size_t i = 0; i < e->nbonds; i++) {
		int a = e->bonds[i].a, b = e->bonds[i].b;
		e->adj_bond[e->adj_start[a] + fill[a]] = (int)i;
		e->adj[e->adj_start[a] + fill[a]++] = b;
		e->adj_bond[e->adj_start[b] + fill[b]] = (int)i;
		e->adj[e->adj_start[b] + fill[b]++] = a;
		if (e->bonds[i].order >= 2) {
			e->hetero_pi[a] |= e->atoms[b].element != 6;
			e->hetero_pi[b] |= e->atoms[a].element != 6;
		}
	}
	free(fill);
	return 0;
}

/* The screen's view of the molecule: the CSR graph plus the SSSR ring sizes of each atom. */
static int screen_view(eng_mol *e, const pred_worker *w)
{
	size_t own = smarts_screen_scratch(e->nat);
	e->ring_sizes = calloc(e->nat + 1, sizeof *e->ring_sizes);
	e->kind = malloc((e->nat + 1) * sizeof *e->kind);
	e->kind_lists = malloc((33 + e->nat) * sizeof *e->kind_lists);
	/* the screen's scratch, the values of the shared parts, which rows of them are clear */
	size_t rows = (size_t)w->n_shared * e->nat;
	e->scratch = malloc(own + rows + (size_t)w->n_shared + 1);
	if (!e->ring_sizes || !e->kind || !e->kind_lists || !e->scratch)
		return PRED_ENOMEM;
	smarts_screen_scratch_init(e->scratch, e->nat);
	memset(e->scratch + own + rows, 0, (size_t)w->n_shared);
	uint32_t kinds = 0;
	int has_h = 0;
	for (size_t a = 0; a < e->nat; a++) {
		kinds |= e->kind[a] = sx_kind(e->atoms[a].element, e->atoms[a].aromatic);
		has_h |= e->atoms[a].element == 1;
	}
	for (size_t k = 0; k < e->rings.n_rings; k++) {
		int size = e->rings.sizes[k];
		for (int i = 0; i < size && size < 32; i++)
			e->ring_sizes[e->rings.atoms[e->rings.offsets[k] + i]] |= (uint32_t)1 << size;
	}
	sx_kind_lists(e->kind_lists, e->kind_lists + 33, e->kind, e->nat);
	const int *ob_bonds = NULL;
	int lists = !has_h && obw_mol_atom_bonds(e->mol, &ob_bonds) == 2 * e->nbonds;
	e->screen = (sx_mol){e->atoms,     e->bonds,		e->nat,
			     e->adj_start, e->adj,		e->adj_bond,
			     ob_bonds,	   e->ring_sizes,	e->kind,
			     e->kind_lists, e->kind_lists + 33, kinds,
			     lists,	   e->scratch,		e->scratch + own,
			     e->scratch + own + rows};
	return 0;
}

/* One table row's pattern: prefilter, screen, and Open Babel's compiled pattern, which the
 * worker compiles on first use (the screen lists the matches of most rows itself). */
typedef struct row_pat {
	const smarts_req *req;
	const smarts_screen *scr;
	obw_pattern **pat;
	const char *smarts;
} row_pat;

/* Matches of a row (obw_pattern_match's list, *na atoms each): none when the element
 * prefilter says so, the screen's own when it decides them, else Open Babel's where the
 * screen allows. */
static int pattern_matches(int **out, int *na, const eng_mol *e, const row_pat *rp,
			   const int *taken, const int *first_taken)
{
	*out = NULL;
	*na = 0;
	if (!smarts_may_match(rp->req, &e->elements))
		return 0;
	int n = smarts_screen_matches(out, rp->scr, &e->screen, taken, first_taken);
	if (n >= 0) {
		*na = rp->scr->pats[0].n_atoms;
		return n;
	}
	if (!smarts_screen_may_match(rp->scr, &e->screen))
		return 0;
	if (!*rp->pat && !(*rp->pat = obw_pattern_parse(rp->smarts, NULL, 0)))
		return PRED_ENOMEM; /* the loader has compiled this pattern once already */
	*na = obw_pattern_atom_count(*rp->pat);
	return obw_pattern_match(out, *rp->pat, e->mol);
}

/* Substituent groups claim their atoms in table order; an atom belongs to one group. */
static int claim_groups(eng_mol *e, pred_worker *w)
{
	const pred_model *m = w->m;
	for (size_t a = 0; a < e->nat; a++)
		e->group[a] = e->group_root[a] = -1;
	for (size_t g = 0; g < m->n_substs; g++) {
		int *hits = NULL, k;
		row_pat rp = {&w->subst_req[g], w->subst_scr[g], &w->subst_pat[g],
			      m->substs[g].smarts};
		/* a match holding a claimed atom is of no use: the screen leaves it out */
		int n = pattern_matches(&hits, &k, e, &rp, e->group, NULL);
		if (n <= 0) {
			if (n < 0)
				return n;
			continue;
		}
		for (int i = 0; i < n; i++) {
			const int *mt = hits + (size_t)i * k;
			int free_all = 1;
			for (int j = 0; j < k && free_all; j++)
				free_all = e->group[mt[j]] < 0;
			if (!free_all)
				continue;
			for (int j = 0; j < k; j++) {
				e->group[mt[j]] = (int)g;
				e->group_root[mt[j]] = mt[0];
			}
		}
		free(hits);
	}
	return 0;
}

static int has_site(const eng_mol *e, int atom, pred_kind kind, const pred_model *m)
{
	for (size_t i = 0; i < e->n_sites; i++)
		if (e->sites[i].atom == atom && m->sites[e->sites[i].row].kind == kind)
			return 1;
	return 0;
}

static int add_site(eng_mol *e, int row, const int *mt, int k, int centre)
{
	eng_site *grown = realloc(e->sites, (e->n_sites + 1) * sizeof *grown);
	if (!grown)
		return PRED_ENOMEM;
	e->sites = grown;
	eng_site *s = &e->sites[e->n_sites];
	s->match = malloc((size_t)k * sizeof *s->match);
	if (!s->match)
		return PRED_ENOMEM;
	memcpy(s->match, mt, (size_t)k * sizeof *s->match);
	s->n_match = k;
	s->row = row;
	s->atom = mt[0];
	s->centre = mt[centre < k ? centre : 0];
	e->n_sites++;
	return 0;
}

enum { MATCH_SORT_MAX = 64 };

/* The canonical ranks of the k atoms of mt, ascending, into out (k <= MATCH_SORT_MAX). */
static void sorted_ranks(const eng_mol *e, const int *mt, int k, int *out)
{
	for (int i = 0; i < k; i++) {
		int r = e->rank[mt[i]], j = i;
		for (; j > 0 && out[j - 1] > r; j--)
			out[j] = out[j - 1];
		out[j] = r;
	}
}

/* Whether match mt (k atoms) comes before the match of site s in canonical order: the
 * canonical ranks of their atoms as sets (Open Babel keeps one mapping per atom set, in an
 * order of its own), ascending, compared as words. */
static int match_before(const eng_mol *e, const int *mt, int k, const eng_site *s)
{
	if (k != s->n_match || k > MATCH_SORT_MAX)
		return 0;
	int a[MATCH_SORT_MAX], b[MATCH_SORT_MAX];
	sorted_ranks(e, mt, k, a);
	sorted_ranks(e, s->match, k, b);
	for (int j = 0; j < k; j++)
		if (a[j] != b[j])
			return a[j] < b[j];
	return 0;
}

/* Site rows in table order; the first row matching an atom claims it for its kind. Of the
 * row's matches rooted at one atom (the thione S of a 2-thiouracil has a ring N on either
 * side as its centre) the one first in canonical order is the site, never the first in atom
 * order. */
static int find_sites(eng_mol *e, pred_worker *w)
{
	const pred_model *m = w->m;
	/* per kind and atom: the row of its site, -1 none (a match rooted there is not used) */
	int *sited = malloc((2 * e->nat + 1) * sizeof *sited), rc = sited ? 0 : PRED_ENOMEM;
	for (size_t a = 0; sited && a < 2 * e->nat; a++)
		sited[a] = -1;
	for (size_t r = 0; r < m->n_sites && !rc; r++) {
		int *hits = NULL, *of_kind = sited + (m->sites[r].kind == PRED_ACID ? 0 : e->nat), k;
		row_pat rp = {&w->site_req[r], w->site_scr[r], &w->site_pat[r], m->sites[r].smarts};
		int n = pattern_matches(&hits, &k, e, &rp, NULL, of_kind);
		size_t first = e->n_sites; /* the sites of this row start here */
		rc = n < 0 ? n : 0;
		for (int i = 0; i < n && !rc; i++) {
			const int *mt = hits + (size_t)i * k;
			eng_site *same = NULL;
			for (size_t q = first; q < e->n_sites && !same; q++)
				if (e->sites[q].atom == mt[0])
					same = &e->sites[q];
			if (same) {
				if (match_before(e, mt, k, same)) {
					memcpy(same->match, mt, (size_t)k * sizeof *mt);
					same->centre = mt[m->sites[r].centre < k ? m->sites[r].centre : 0];
				}
				continue;
			}
			if (has_site(e, mt[0], m->sites[r].kind, m))
				continue;
			rc = add_site(e, (int)r, mt, k, m->sites[r].centre);
			of_kind[mt[0]] = (int)r;
		}
		free(hits);
	}
	free(sited);
	return rc;
}

/* want[k] = 1 for each correction k that applies to a site of the molecule: only those are
 * matched. */
static void corr_wanted(unsigned char *want, const eng_mol *e, const pred_worker *w)
{
	for (size_t i = 0; i < e->n_sites; i++) {
		int r = e->sites[i].row;
		for (int j = w->row_corr_start[r]; j < w->row_corr_start[r + 1]; j++)
			want[w->row_corrs[j]] = 1;
	}
}

/* Appends the first atoms of correction k's matches to e->corr_atom (used of cap). */
static int corr_atoms(eng_mol *e, const pred_worker *w, size_t k, size_t *used, size_t *cap)
{
	const pred_model *m = w->m;
	int *hits = NULL, na;
	row_pat rp = {&w->corr_req[k], w->corr_scr[k], &w->corr_pat[k], m->corrs[k].smarts};
	int n = pattern_matches(&hits, &na, e, &rp, NULL, NULL);
	if (n < 0)
		return n;
	for (int i = 0; i < n; i++) {
		if (*used == *cap) {
			*cap = *cap ? 2 * *cap : 16;
			int *grown = realloc(e->corr_atom, *cap * sizeof *grown);
			if (!grown) {
				free(hits);
				return PRED_ENOMEM;
			}
			e->corr_atom = grown;
		}
		e->corr_atom[(*used)++] = hits[(size_t)i * na];
	}
	free(hits);
	e->corr_start[k + 1] = (int)*used;
	return 0;
}

/* First atoms of every correction pattern's matches, once per molecule. */
static int match_corrections(eng_mol *e, pred_worker *w)
{
	const pred_model *m = w->m;
	e->corr_start = calloc(m->n_corrs + 1, sizeof *e->corr_start);
	unsigned char *want = calloc(m->n_corrs + 1, 1);
	if (!e->corr_start || !want) {
		free(want);
		return PRED_ENOMEM;
	}
	corr_wanted(want, e, w);
	size_t used = 0, cap = 0;
	int rc = 0;
	for (size_t k = 0; k < m->n_corrs && !rc; k++) {
		e->corr_start[k + 1] = (int)used;
		if (want[k])
			rc = corr_atoms(e, w, k, &used, &cap);
	}
	free(want);
	return rc;
}

void eng_bfs(const eng_mol *e, int from, int *dist, int *queue)
{
	for (size_t a = 0; a < e->nat; a++)
		dist[a] = -1;
	int head = 0, tail = 0;
	dist[from] = 0;
	queue[tail++] = from;
	while (head < tail) {
		int a = queue[head++], n;
		const int *nb = eng_nbrs(e, a, &n);
		for (int j = 0; j < n; j++)
			if (dist[nb[j]] < 0) {
				dist[nb[j]] = dist[a] + 1;
				queue[tail++] = nb[j];
			}
	}
}

static int site_distances(eng_mol *e, const pred_model *m)
{
	e->dist = malloc((e->n_sites * e->nat + 1) * sizeof *e->dist);
	int *queue = malloc((e->nat + 1) * sizeof *queue);
	if (!e->dist || !queue) {
		free(queue);
		return PRED_ENOMEM;
	}
	for (size_t i = 0; i < e->n_sites; i++)
		eng_bfs(e, e->sites[i].atom, e->dist + i * e->nat, queue);
	free(queue);
	return eng_charge_distances(e, m);
}

int eng_perceive(eng_mol *e, pred_worker *w, obw_mol *mol, pred_error *err)
{
	memset(e, 0, sizeof *e);
	e->mol = mol;
	e->nat = obw_mol_atoms(mol, &e->atoms);
	e->nbonds = obw_mol_bonds(mol, &e->bonds);
	obw_mol_rings(mol, &e->rings);
	smarts_mol_mask(&e->elements, e->atoms, e->nat);
	e->group = malloc((e->nat + 1) * sizeof *e->group);
	e->group_root = malloc((e->nat + 1) * sizeof *e->group_root);
	int rc = e->group && e->group_root ? build_graph(e) : PRED_ENOMEM;
	if (!rc)
		rc = screen_view(e, w);
	/* canonical ranks and symmetry classes: ties that the atom order must not decide go to
	 * the ranks (site matches, Hammett rings); they serve the canonical SMILES later */
	if (!rc) {
		e->rank = malloc((e->nat + 1) * sizeof *e->rank);
		e->scls = malloc((e->nat + 1) * sizeof *e->scls);
		e->symclass = malloc((e->nat + 1) * sizeof *e->symclass);
		rc = e->rank && e->scls && e->symclass
			     ? canon_rank(e->symclass, e->scls, e->rank, e->mol, NULL)
			     : PRED_ENOMEM;
	}
	/* sites first: a molecule without one needs no substituent perception */
	if (!rc)
		rc = find_sites(e, w);
	if (!rc && e->n_sites)
		rc = claim_groups(e, w);
	if (!rc)
		rc = site_distances(e, w->m);
	if (!rc && e->n_sites)
		rc = match_corrections(e, w);
	if (rc && err) {
		err->code = rc;
		snprintf(err->msg, sizeof err->msg, "site perception failed (%s)",
			 pred_status_name(rc));
	}
	return rc;
}

void eng_free(eng_mol *e)
{
	for (size_t i = 0; i < e->n_sites; i++)
		free(e->sites[i].match);
	free(e->sites);
	free(e->dist);
	free(e->qdist);
	free(e->qroute);
	free(e->corr_start);
	free(e->symclass);
	free(e->rank);
	free(e->scls);
	free(e->corr_atom);
	free(e->pair_param);
	free(e->ion_pair);
	free(e->adj);
	free(e->adj_bond);
	free(e->ring_sizes);
	free(e->kind);
	free(e->kind_lists);
	free(e->scratch);
	free(e->adj_start);
	free(e->group);
	free(e->group_root);
	free(e->hetero_pi);
	memset(e, 0, sizeof *e);
}
