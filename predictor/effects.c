/* SPDX-License-Identifier: MIT */
/* effects.c: substituent effects of one site: Hammett ring, Taft walk, corrections. */
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"

enum { WALK_DEPTH = 6 };

/* The next free slot of tl with its scaling filled in, NULL when the list is full. */
static char *term_slot(term_list *tl, const pred_model *m, const char *term, int param,
		       double feature)
{
	if (tl->n == TERMS_MAX)
		return NULL;
	size_t i = tl->n++;
	tl->t[i].term = term;
	tl->t[i].detail = tl->detail[i];
	tl->t[i].value = param >= 0 ? m->params[param].value * feature : feature;
	tl->param[i] = param;
	tl->feature[i] = feature;
	return tl->detail[i];
}

void terms_add(term_list *tl, const pred_model *m, const char *term, int param, double feature,
	       const char *fmt, ...)
{
	char *detail = term_slot(tl, m, term, param, feature);
	if (!detail)
		return;
	va_list ap;
	va_start(ap, fmt);
	vsnprintf(detail, sizeof tl->detail[0], fmt, ap);
	va_end(ap);
}

void terms_add_text(term_list *tl, const pred_model *m, const char *term, int param,
		    double feature, const char *text)
{
	char *detail = term_slot(tl, m, term, param, feature);
	if (!detail)
		return;
	/* cut as vsnprintf cuts "%s" (the list is hot: a parent and most corrections) */
	size_t n = strnlen(text, sizeof tl->detail[0] - 1);
	memcpy(detail, text, n);
	detail[n] = '\0';
}

double terms_sum(const term_list *tl)
{
	double s = 0;
	for (size_t i = 0; i < tl->n; i++)
		s += tl->t[i].value;
	return s;
}

int eng_in_match(const eng_site *s, int atom)
{
	for (int i = 0; i < s->n_match; i++)
		if (s->match[i] == atom)
			return 1;
	return 0;
}

int eng_ring_index_of(const obw_rings *R, size_t k, int atom)
{
	for (int j = 0; j < R->sizes[k]; j++)
		if (R->atoms[R->offsets[k] + j] == atom)
			return j;
	return -1;
}

/* Ring k has `size` atoms, all aromatic. */
static int ring_is_aromatic_n(const eng_mol *e, size_t k, int size)
{
	if (e->rings.sizes[k] != size)
		return 0;
	for (int j = 0; j < size; j++)
		if (!e->atoms[e->rings.atoms[e->rings.offsets[k] + j]].aromatic)
			return 0;
	return 1;
}

int eng_ring_is_aromatic6(const eng_mol *e, size_t k)
{
	return ring_is_aromatic_n(e, k, 6);
}

/* An aromatic seven-ring: the Hammett ring of a tropolone (ring_position). */
static int ring_is_aromatic7(const eng_mol *e, size_t k)
{
	return ring_is_aromatic_n(e, k, 7);
}

enum { RING_CHOICES = 8 };

/* The candidate Hammett rings of a site: the aromatic six- (and seven-) rings holding the
 * centre, else those holding a neighbour of it (ring k[i] with ipso atom ipso[i]). Returns
 * the count. */
static int hammett_rings(const eng_mol *e, const eng_site *s, int *k, int *ipso)
{
	int found = 0;
	for (size_t r = 0; r < e->rings.n_rings && found < RING_CHOICES; r++)
		if ((eng_ring_is_aromatic6(e, r) || ring_is_aromatic7(e, r)) &&
		    eng_ring_index_of(&e->rings, r, s->centre) >= 0) {
			k[found] = (int)r;
			ipso[found++] = s->centre;
		}
	if (found)
		return found;
	int n;
	const int *nb = eng_nbrs(e, s->centre, &n);
	for (int j = 0; j < n; j++)
		for (size_t r = 0; r < e->rings.n_rings && found < RING_CHOICES; r++)
			if ((eng_ring_is_aromatic6(e, r) || ring_is_aromatic7(e, r)) &&
			    eng_ring_index_of(&e->rings, r, nb[j]) >= 0) {
				k[found] = (int)r;
				ipso[found++] = nb[j];
			}
	return found;
}

/* Whether ring a comes before ring b in canonical order: the lowest rank of the atoms of a
 * not in b against that of the atoms of b not in a. */
static int ring_before(const eng_mol *e, int a, int b)
{
	int low[2] = {(int)e->nat, (int)e->nat}, k[2] = {a, b};
	for (int i = 0; i < 2; i++)
		for (int j = 0; j < e->rings.sizes[k[i]]; j++) {
			int x = e->rings.atoms[e->rings.offsets[k[i]] + j];
			if (eng_ring_index_of(&e->rings, (size_t)k[1 - i], x) < 0 && e->rank[x] < low[i])
				low[i] = e->rank[x];
		}
	return low[0] < low[1];
}

/* Atoms a and x share a ring other than ring k (ring fusion, not a substituent). */
int eng_fused_with(const eng_mol *e, size_t k, int a, int x)
{
	for (size_t q = 0; q < e->rings.n_rings; q++)
		if (q != k && eng_ring_index_of(&e->rings, q, a) >= 0 &&
		    eng_ring_index_of(&e->rings, q, x) >= 0)
			return 1;
	return 0;
}

/* Estimate for an atom no substituent row claims, from element, bonding and charge. The
 * values are rough class averages of substituent-constants.csv rows (estimates, flagged). */
static void generic_sigmas(sigmas *g, const eng_mol *e, int x)
{
	const obw_atom *a = &e->atoms[x];
	static const struct {
		int el;
		double m, p, star;
		const char *label;
	} by_element[] = {
		{7, -0.15, -0.60, 0.60, "amino-like N"},   {8, 0.10, -0.30, 1.50, "ether-like O"},
		{16, 0.15, 0.00, 1.20, "sulfur group"},    {15, 0.30, 0.40, 1.50, "phosphorus group"},
		{5, 0.00, 0.10, 0.00, "boron group"},      {14, -0.05, -0.07, -0.80, "silyl group"},
		{34, 0.15, 0.00, 1.10, "selenium group"},  {9, 0.34, 0.06, 3.10, "fluoro"},
		{17, 0.37, 0.23, 2.96, "chloro"},          {35, 0.39, 0.23, 2.84, "bromo"},
		{53, 0.35, 0.18, 2.46, "iodo"},
	};
	memset(g, 0, sizeof *g);
	g->generic = 1;
	if (a->charge > 0) {
		*g = (sigmas){0.85, 0.80, 0.80, 0.80, 3.70, "cationic group", 1};
		return;
	}
	if (a->charge < 0) {
		*g = (sigmas){-0.10, -0.10, 0.30, -0.10, -1.00, "anionic group", 1};
		return;
	}
	if (a->element == 6) {
		if (e->hetero_pi[x])
			*g = (sigmas){0.35, 0.45, 0.85, 0.45, 1.60, "acyl-like C", 1};
		else
			*g = (sigmas){-0.07, -0.15, -0.15, -0.30, 0.0, "alkyl", 0};
		return;
	}
	for (size_t i = 0; i < sizeof by_element / sizeof by_element[0]; i++)
		if (by_element[i].el == a->element) {
			*g = (sigmas){by_element[i].m, by_element[i].p, by_element[i].p,
				      by_element[i].p, by_element[i].star, by_element[i].label, 1};
			return;
		}
	*g = (sigmas){0.20, 0.20, 0.20, 0.20, 1.00, "unknown group", 1};
}

void eng_group_sigmas(sigmas *g, const eng_mol *e, const pred_model *m, int x)
{
	int k = e->group[x];
	if (k < 0 || e->group_root[x] != x) {
		generic_sigmas(g, e, x);
		return;
	}
	const frag_subst *t = &m->substs[k];
	*g = (sigmas){t->sigma_m, t->sigma_p, t->sigma_p_minus, t->sigma_p_plus, t->sigma_star,
		      t->id, 0};
}

static void hammett_term(term_list *tl, const pred_model *m, const frag_site *row, int pos,
			 const sigmas *g)
{
	double sigma = g->m;
	const char *name = "sigma_m";
	int rho = pos == 4 ? row->p_rho_para : row->p_rho;
	if (pos != 3) {
		static const char *const names[] = {"sigma_p", "sigma_p-", "sigma_p+"};
		const double v[] = {g->p, g->p_minus, g->p_plus};
		sigma = v[row->sigma_para];
		name = names[row->sigma_para];
	}
	terms_add(tl, m, g->generic ? "generic_substituent" : "hammett", rho, -sigma,
		  "%d-%s, %s %.2f, rho %.2f", pos, g->label, name, sigma, m->params[rho].value);
	if (g->generic) {
		tl->n_generic++;
		tl->extra_var += 0.16;
	}
	if (pos == 2 && row->p_ortho >= 0)
		terms_add(tl, m, "ortho", row->p_ortho, 1.0, "2-%s, ortho proximity", g->label);
}

void eng_mark_group(unsigned char *seen, const eng_mol *e, int x)
{
	/* 2: the group is counted (met at its root, or an unclaimed atom); 3: met at another of
	 * its atoms, which the walk counts as generic atoms, but its root no more */
	int mark = e->group_root[x] < 0 || e->group_root[x] == x ? 2 : 3;
	seen[x] = (unsigned char)mark;
	if (e->group_root[x] < 0)
		return;
	for (size_t a = 0; a < e->nat; a++)
		if (e->group_root[a] == e->group_root[x] && seen[a] != 2)
			seen[a] = (unsigned char)mark;
}

/* Atoms the walk passes through without a term: plain carbon, and aromatic ring atoms no
 * group claims (a ring nitrogen of a heteroaromatic parent is part of that parent; remote
 * heteroaryl rings count through the aryl rows of substituents.tsv). */
static int plain_carbon(const eng_mol *e, int x)
{
	const obw_atom *a = &e->atoms[x];
	if (a->aromatic && a->charge == 0)
		return 1;
	return a->element == 6 && a->charge == 0 && !e->hetero_pi[x];
}

/* Substituents on an aryl group the walk met at depth d (rooted at ring atom x): meta and para
 * ones reach the site through the ring as t x sigma on top of the aryl's sigma*, with t the
 * aryl transmission (params.tsv global.aryl_transmission). Ortho ones are left out (their
 * proximity to the CH2 is not the ring's). Marks what it counted. */
static void aryl_ring_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			      const eng_site *s, int x, int d, unsigned char *seen)
{
	const frag_site *row = &m->sites[s->row];
	double t = m->params[m->p_aryl_transmission].value;
	double att = pow(m->params[m->p_falloff].value, d - 1);
	const obw_rings *R = &e->rings;
	for (size_t k = 0; t != 0 && k < R->n_rings; k++) {
		int i0 = eng_ring_index_of(R, k, x);
		if (i0 < 0 || !eng_ring_is_aromatic6(e, k))
			continue;
		for (int j = 0; j < 6; j++) {
			int a = R->atoms[R->offsets[k] + j], dj = abs(j - i0);
			int pos = (dj < 6 - dj ? dj : 6 - dj) + 1, n;
			if (pos < 3)
				continue;
			const int *nb = eng_nbrs(e, a, &n);
			for (int q = 0; q < n; q++) {
				int y = nb[q];
				if (seen[y] || eng_ring_index_of(R, k, y) >= 0 || eng_in_match(s, y) ||
				    eng_fused_with(e, k, a, y))
					continue;
				sigmas g;
				eng_group_sigmas(&g, e, m, y);
				double sigma = pos == 3 ? g.m : g.p;
				terms_add(tl, m, g.generic ? "generic_substituent" : "taft",
					  row->p_rho_star, -t * sigma * att,
					  "%d-%s on an aryl at %d bonds, sigma %.2f x %.2f x %.2f", pos,
					  g.label, d, sigma, t, att);
				if (g.generic) {
					tl->n_generic++;
					tl->extra_var += 0.16 * att * t;
				}
				eng_mark_group(seen, e, y);
			}
		}
		return; /* one ring: the one the walk entered */
	}
}

/* What the walk does with a group it meets d bonds out (attenuation att = f^(d-1)). */
typedef void (*walk_visit)(void *ctx, const sigmas *sg, int x, int d, double att,
			   unsigned char *seen);

/* Whether x is an atom of a (non-transparent) group other than its root: a group the walk
 * reaches at its root and at another atom at one depth is its tabulated self. */
static int group_member(const eng_mol *e, const pred_model *m, int x)
{
	int g = e->group[x];
	return g >= 0 && e->group_root[x] != x && !m->substs[g].transparent;
}

/* Orders the n atoms of one depth: group roots and other atoms before the other members of
 * groups, then by canonical rank, so that the atom order of the input never decides which
 * atom of a group the walk meets first, or which group takes a shared substituent. */
static void sort_layer(const eng_mol *e, const pred_model *m, int *q, int n)
{
	for (int i = 1; i < n; i++)
		for (int j = i; j > 0; j--) {
			int a = q[j - 1], b = q[j], ma = group_member(e, m, a), mb = group_member(e, m, b);
			if (ma < mb || (ma == mb && (!e->rank || e->rank[a] < e->rank[b])))
				break;
			q[j - 1] = b;
			q[j] = a;
		}
}

/* Breadth-first walk from atom `from`, one depth at a time: plain carbons, transparent groups
 * and the site's own atoms are passed through; any other group is marked seen (mark_group),
 * then visited once, and ends its branch; the groups of one depth are visited before the
 * next depth is queued, and a group counted already is not counted again. With
 * `alkyl` set, a transparent group is visited too (its sigma*) and passed through. */
static void walk_from(const eng_mol *e, const pred_model *m, const eng_site *s, int from,
		      int alkyl, unsigned char *seen, int *queue, int *depth, walk_visit visit,
		      void *ctx)
{
	double f = m->params[m->p_falloff].value;
	int head = 0, tail = 0, n;
	seen[from] = 1;
	const int *nb = eng_nbrs(e, from, &n);
	for (int j = 0; j < n; j++)
		if (!seen[nb[j]]) {
			seen[nb[j]] = 1;
			depth[tail] = 1;
			queue[tail++] = nb[j];
		}
	while (head < tail) {
		int end = tail, d = depth[head];
		sort_layer(e, m, queue + head, end - head);
		for (int i = head; i < end; i++) {
			int x = queue[i], g = e->group[x];
			int root = g >= 0 && e->group_root[x] == x && !m->substs[g].transparent;
			/* atoms of the site's own match belong to the parent: passed through, not
			 * counted, except an sp3 carbon standing for "R" (the R of R-COOH may be a
			 * CF3) */
			int r_position = eng_in_match(s, x) && e->atoms[x].element == 6 &&
					 e->atoms[x].hyb == 3;
			int transparent = !(root && (r_position || !eng_in_match(s, x))) &&
					  (eng_in_match(s, x) || (g >= 0 ? m->substs[g].transparent
								     : plain_carbon(e, x)));
			if (transparent)
				continue;
			queue[i] = -1; /* a group ends its branch */
			if (seen[x] == 2 || (seen[x] == 3 && root))
				continue; /* its group is counted already */
			sigmas sg;
			eng_group_sigmas(&sg, e, m, x);
			eng_mark_group(seen, e, x);
			visit(ctx, &sg, x, d, pow(f, d - 1), seen);
		}
		for (int i = head; i < end; i++) {
			int x = queue[i];
			if (x < 0)
				continue;
			int g = e->group[x];
			if (alkyl && g >= 0 && e->group_root[x] == x && !eng_in_match(s, x)) {
				sigmas sg;
				eng_group_sigmas(&sg, e, m, x);
				visit(ctx, &sg, x, d, pow(f, d - 1), seen);
			}
			if (d >= WALK_DEPTH)
				continue;
			nb = eng_nbrs(e, x, &n);
			for (int j = 0; j < n; j++)
				if (!seen[nb[j]]) {
					seen[nb[j]] = 1;
					depth[tail] = d + 1;
					queue[tail++] = nb[j];
				}
		}
		head = end;
	}
}

/* Sum of the attenuated sigma* the walk meets (the N-substituents of an amino group). */
typedef struct star_sum {
	double star, generic_var;
} star_sum;

static void add_star(void *ctx, const sigmas *sg, int x, int d, double att, unsigned char *seen)
{
	star_sum *acc = ctx;
	(void)x;
	(void)d;
	(void)seen;
	acc->star += sg->star * att;
	if (sg->generic)
		acc->generic_var += 0.16 * att;
}

/* An amine N on ring atom a (bonded to carbons only, none of them a non-aromatic carbon
 * with a pi bond to a heteroatom, as in an amide; an aromatic neighbour's Kekule bonds do
 * not count): its donation follows what its own substituents withdraw. */
static int is_amine_n(const eng_mol *e, int x, int a)
{
	const obw_atom *n_atom = &e->atoms[x];
	if (n_atom->element != 7 || n_atom->charge != 0 || n_atom->aromatic || e->hetero_pi[x])
		return 0;
	int n;
	const int *nb = eng_nbrs(e, x, &n);
	for (int j = 0; j < n; j++)
		if (nb[j] != a && (e->atoms[nb[j]].element != 6 ||
				   (!e->atoms[nb[j]].aromatic && e->hetero_pi[nb[j]])))
			return 0;
	return 1;
}

/* The N-substituents of an amino group x at ring position pos: beyond the methyls and H of
 * the tabulated NH2, NHCH3 and NMe2 rows, each group raises the amino group's sigma by
 * global.amine_n_sigma x its sigma* (attenuated per bond from the N, as in the walk; the
 * alkyl rows count here with their own sigma*, ethyl -0.10, t-butyl -0.30). */
static void amine_n_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			    const eng_site *s, int x, int pos, unsigned char *seen, int *queue,
			    int *depth)
{
	star_sum acc = {0, 0};
	walk_from(e, m, s, x, 1, seen, queue, depth, add_star, &acc);
	if (fabs(acc.star) < 1e-9 || m->p_amine_n < 0)
		return;
	const frag_site *row = &m->sites[s->row];
	double rho = m->params[pos == 4 ? row->p_rho_para : row->p_rho].value;
	terms_add(tl, m, "hammett", m->p_amine_n, -rho * acc.star,
		  "%d-amino N-substituents, sigma* %.2f, rho %.2f", pos, acc.star, rho);
	tl->extra_var += acc.generic_var;
}

/* A ring substituent that is a plain sp3 carbon (the generic alkyl row, or no row): its
 * own groups pull on the ring by induction, so its sigma rises by global.alkyl_inductive x
 * the sigma* they give it (attenuated per bond from the carbon, as in the walk). The prior
 * 0.068 is 0.17 x 0.4: across CH3, CH2OH, CH2OCH3, CH2Cl and CH2CN, sigma_m rises by about
 * 0.17 per unit sigma*(CH2X) (HLT1991 Table I and Taft sigma*, substituent-constants.csv,
 * own arithmetic), and sigma*(CH2X) is about 0.4 sigma*(X). */
void eng_alkyl_c_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			 const eng_site *s, int x, int pos, unsigned char *seen, int *queue,
			 int *depth)
{
	const obw_atom *c = &e->atoms[x];
	int g = e->group[x];
	if (m->p_alkyl_inductive < 0 || c->element != 6 || c->aromatic || c->charge != 0 ||
	    e->hetero_pi[x] || (g >= 0 && !m->substs[g].transparent))
		return;
	star_sum acc = {0, 0};
	walk_from(e, m, s, x, 1, seen, queue, depth, add_star, &acc);
	if (fabs(acc.star) < 1e-9)
		return;
	const frag_site *row = &m->sites[s->row];
	double rho = m->params[pos == 4 ? row->p_rho_para : row->p_rho].value;
	terms_add(tl, m, "hammett", m->p_alkyl_inductive, -rho * acc.star,
		  "%d-alkyl groups beyond its carbon, sigma* %.2f, rho %.2f", pos, acc.star, rho);
	tl->extra_var += acc.generic_var;
}

/* Whether atom y is the ionizable atom of a base site of the molecule. */
static int base_site_atom(const eng_mol *e, const pred_model *m, int y)
{
	for (size_t i = 0; i < e->n_sites; i++)
		if (e->sites[i].atom == y && m->sites[e->sites[i].row].kind == PRED_BASE)
			return 1;
	return 0;
}

/* Meta and para groups of an aryl bonded at x to the Hammett ring k at position pos (a 5-aryl-
 * pyrimidine, a biphenyl-4-carboxylic acid): global.biaryl_transmission x rho x sigma of the
 * group on the aryl (sigma_p para, sigma_m meta to x). Ortho ones are left out, as on an aryl
 * the walk meets, and so is a group that is a base site itself (an anilino N): where it
 * protonates first its donation is gone (5-(4-aminophenyl)pyrimidines, second step), and the
 * charge interaction counts it. Marks what it counted. */
static void biaryl_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			   const eng_site *s, size_t k, int x, int pos, unsigned char *seen)
{
	const frag_site *row = &m->sites[s->row];
	const obw_rings *R = &e->rings;
	if (m->p_biaryl_transmission < 0 || !e->atoms[x].aromatic)
		return;
	double rho = m->params[pos == 4 ? row->p_rho_para : row->p_rho].value;
	for (size_t q = 0; q < R->n_rings; q++) {
		int i0 = eng_ring_index_of(R, q, x), shared = 0;
		if (q == k || i0 < 0 || !eng_ring_is_aromatic6(e, q))
			continue;
		for (int j = 0; j < 6; j++)
			shared += eng_ring_index_of(R, k, R->atoms[R->offsets[q] + j]) >= 0;
		if (shared)
			continue;
		for (int j = 0; j < 6; j++) {
			int a = R->atoms[R->offsets[q] + j], dj = abs(j - i0), n;
			int apos = (dj < 6 - dj ? dj : 6 - dj) + 1;
			if (apos < 3)
				continue;
			const int *nb = eng_nbrs(e, a, &n);
			for (int t = 0; t < n; t++) {
				int y = nb[t];
				if (seen[y] || eng_ring_index_of(R, q, y) >= 0 || eng_in_match(s, y) ||
				    eng_fused_with(e, q, a, y) || base_site_atom(e, m, y))
					continue;
				sigmas g;
				eng_group_sigmas(&g, e, m, y);
				double sigma = apos == 3 ? g.m : g.p;
				terms_add(tl, m, g.generic ? "generic_substituent" : "hammett",
					  m->p_biaryl_transmission, -rho * sigma,
					  "%d-%s on the %d-aryl, sigma %.2f, rho %.2f", apos, g.label,
					  pos, sigma, rho);
				if (g.generic) {
					tl->n_generic++;
					tl->extra_var += 0.16 * 0.09;
				}
				eng_mark_group(seen, e, y);
			}
		}
		return; /* one ring: the aryl's own */
	}
}

/* The C=O (C=S) para to the ring N-H of an acid site matched as the N alone is that site's
 * own acceptor (the carbonyl of a 4-pyridone takes the anion's charge), not a substituent of
 * its ring. A site whose match holds a C=O beside the N (2-pyridones, uracil N1) keeps a para
 * C=O as a substituent: that one is a second acceptor. */
static int own_para_oxo(const eng_mol *e, const pred_model *m, const eng_site *s, int ipso,
			int pos, int x)
{
	const obw_atom *c = &e->atoms[s->centre], *o = &e->atoms[x];
	return pos == 4 && ipso == s->centre && s->n_match == 1 &&
	       m->sites[s->row].kind == PRED_ACID &&
	       c->element == 7 && c->hcount > 0 && (o->element == 8 || o->element == 16) &&
	       o->degree == 1 && o->hcount == 0 && o->charge == 0 && !o->in_ring;
}

/* Hammett position (2 ortho, 3 meta, 4 para) of ring index j of ring k: bonds from the ipso
 * (index i0) + 1. On a seven-ring (tropolone) the bonds count from the nearest ring atom of
 * the match: the anion spreads its charge over both C-O carbons and is symmetric, so C3 and
 * C7 are ortho, C4 and C6 meta, C5, which the charge reaches from either O, para. */
int eng_ring_position(const eng_mol *e, const eng_site *s, size_t k, int i0, int j)
{
	const obw_rings *R = &e->rings;
	int n = R->sizes[k], best = n;
	for (int i = 0; i < n; i++) {
		if (i != i0 && (n == 6 || !eng_in_match(s, R->atoms[R->offsets[k] + i])))
			continue;
		int d = abs(j - i);
		d = d < n - d ? d : n - d;
		if (d < best)
			best = d;
	}
	return best + 1;
}

/* Substituents of the Hammett ring k (ipso at ring index i0). Marks what it counted. */
static void ring_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			 const eng_site *s, size_t k, int ipso, unsigned char *seen, int *queue,
			 int *depth)
{
	const frag_site *row = &m->sites[s->row];
	const obw_rings *R = &e->rings;
	int i0 = eng_ring_index_of(R, k, ipso), aza = m->subst_aza, size = R->sizes[k];
	for (int j = 0; j < size; j++)
		seen[R->atoms[R->offsets[k] + j]] = 1;
	for (int j = 0; j < size; j++) {
		int a = R->atoms[R->offsets[k] + j];
		int pos = eng_ring_position(e, s, k, i0, j);
		if (a == ipso || (size == 7 && eng_in_match(s, a)))
			continue;
		if (e->atoms[a].element != 6 && !eng_in_match(s, a) && aza >= 0) {
			sigmas g = {m->substs[aza].sigma_m, m->substs[aza].sigma_p,
				     m->substs[aza].sigma_p_minus, m->substs[aza].sigma_p_plus, 0,
				     "aza", 0};
			hammett_term(tl, m, row, pos, &g);
		}
		int n;
		const int *nb = eng_nbrs(e, a, &n);
		for (int q = 0; q < n; q++) {
			int x = nb[q];
			if (eng_ring_index_of(R, k, x) >= 0 || eng_in_match(s, x) || eng_fused_with(e, k, a, x))
				continue;
			if (own_para_oxo(e, m, s, ipso, pos, x)) {
				seen[x] = 1;
				continue;
			}
			sigmas g;
			eng_group_sigmas(&g, e, m, x);
			hammett_term(tl, m, row, pos, &g);
			eng_mark_group(seen, e, x);
			if (!g.generic)
				biaryl_effects(tl, e, m, s, k, x, pos, seen);
			if (is_amine_n(e, x, a))
				amine_n_effects(tl, e, m, s, x, pos, seen, queue, depth);
			else
				eng_alkyl_c_effects(tl, e, m, s, x, pos, seen, queue, depth);
		}
	}
}

/* The Hammett ring of a site (its index, -1 none; *ipso its atom bonded to or at the centre).
 * Where the centre touches several aromatic six-rings (a diaryl ketone or amine, the N of a
 * phenothiazine, an anthraquinone carbonyl) the ring whose substituents shift the site most
 * is taken: the other rings then stand for the unsubstituted aryl of the parent class
 * (diarylamine, aryl ketone). Equal shifts (symmetric rings) go to the lowest canonical rank
 * of the ipso atom, then of the ring's atoms, so that the atom order of the input never
 * decides. seen, queue and depth are the caller's (all clear on entry and on return). */
int eng_hammett_ring(const eng_mol *e, const pred_model *m, const eng_site *s, int *ipso,
		     unsigned char *seen, int *queue, int *depth)
{
	int k[RING_CHOICES], at[RING_CHOICES];
	int n = hammett_rings(e, s, k, at), best = 0;
	term_list *tl = n > 1 ? malloc(sizeof *tl) : NULL;
	double best_shift = 0;
	for (int i = 0; tl && i < n; i++) {
		tl->n = 0;
		tl->extra_var = 0;
		tl->n_generic = 0;
		ring_effects(tl, e, m, s, (size_t)k[i], at[i], seen, queue, depth);
		memset(seen, 0, e->nat + 1);
		double shift = fabs(terms_sum(tl));
		int better = i == 0 || shift > best_shift + 1e-9;
		if (!better && fabs(shift - best_shift) <= 1e-9 && e->rank) {
			int ri = e->rank[at[i]], rb = e->rank[at[best]];
			better = ri < rb || (ri == rb && ring_before(e, k[i], k[best]));
		}
		if (better) {
			best = i;
			best_shift = shift;
		}
	}
	free(tl);
	if (n == 0)
		return -1;
	*ipso = at[best];
	return k[best];
}

/* One Taft term per group the walk from the centre meets: -rho* sigma* f^(d-1). */
typedef struct taft_ctx {
	term_list *tl;
	const eng_mol *e;
	const pred_model *m;
	const eng_site *s;
	const frag_site *row;
} taft_ctx;

/* A group of the Taft walk: its sigma* term; an aryl group also passes on its own meta and
 * para substituents (aryl_ring_effects). */
static void add_taft(void *ctx, const sigmas *sg, int x, int d, double att, unsigned char *seen)
{
	taft_ctx *c = ctx;
	terms_add(c->tl, c->m, sg->generic ? "generic_substituent" : "taft", c->row->p_rho_star,
		  -sg->star * att, "%s at %d bond%s, sigma* %.2f x %.2f", sg->label, d,
		  d > 1 ? "s" : "", sg->star, att);
	if (sg->generic) {
		c->tl->n_generic++;
		c->tl->extra_var += 0.16 * att;
	}
	if (sg->generic)
		return;
	if (c->e->atoms[x].aromatic) {
		aryl_ring_effects(c->tl, c->e, c->m, c->s, x, d, seen);
		return;
	}
	/* a group holding the ring's first atom behind its root (OC6H5, COC6H5): the ring is
	 * met one bond further out */
	int n;
	const int *nb = eng_nbrs(c->e, x, &n);
	for (int j = 0; j < n; j++)
		if (c->e->atoms[nb[j]].aromatic && c->e->group[nb[j]] >= 0 &&
		    c->e->group_root[nb[j]] == x) {
			aryl_ring_effects(c->tl, c->e, c->m, c->s, nb[j], d + 1, seen);
			return;
		}
}

static void walk_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			 const eng_site *s, unsigned char *seen, int *queue, int *depth)
{
	const frag_site *row = &m->sites[s->row];
	if (m->params[row->p_rho_star].value == 0)
		return;
	taft_ctx c = {tl, e, m, s, row};
	walk_from(e, m, s, s->centre, 0, seen, queue, depth, add_taft, &c);
}

static void correction_effects(term_list *tl, const eng_mol *e, const pred_worker *w,
			       const eng_site *s)
{
	const pred_model *m = w->m;
	for (int j = w->row_corr_start[s->row]; j < w->row_corr_start[s->row + 1]; j++) {
		int k = w->row_corrs[j];
		const frag_corr *c = &m->corrs[k];
		int hits = 0;
		for (int i = e->corr_start[k]; i < e->corr_start[k + 1]; i++) {
			if (e->corr_atom[i] != s->atom)
				continue;
			hits++;
			if (!c->per_match)
				break;
		}
		/* a Z pair row needs a cis partner, which the pattern cannot see */
		/* a charge pair row acts only on the second site's step (stepwise.c) */
		if (!hits || c->pair == CORR_PAIR_CHARGE || (c->pair == CORR_PAIR_Z &&
			      !eng_pair_row_holds(e, w, (size_t)k, (size_t)(s - e->sites))))
			continue;
		/* a per-match row (one carboxymethyl arm of an ammonium, say) scales with the
		 * count, and so does the design column the fit regresses on */
		if (hits > 1)
			terms_add(tl, m, c->term, c->p_value, hits, "%s x %d", c->id, hits);
		else
			terms_add_text(tl, m, c->term, c->p_value, 1.0, c->id);
		tl->extra_var += hits * c->unc * c->unc;
	}
}

void eng_site_effects(term_list *tl, const eng_mol *e, const pred_worker *w, const eng_site *s)
{
	const pred_model *m = w->m;
	const frag_site *row = &m->sites[s->row];
	terms_add_text(tl, m, "parent", row->p_parent, 1.0, row->id);
	unsigned char *seen = calloc(e->nat + 1, 1);
	int *queue = malloc((e->nat + 1) * sizeof *queue);
	int *depth = malloc((e->nat + 1) * sizeof *depth);
	if (seen && queue && depth) {
		int ipso = -1, k = m->params[row->p_rho].value != 0
					   ? eng_hammett_ring(e, m, s, &ipso, seen, queue, depth)
					   : -1;
		if (k >= 0) {
			ring_effects(tl, e, m, s, (size_t)k, ipso, seen, queue, depth);
			eng_fused_ring_effects(tl, e, m, s, (size_t)k, seen);
			eng_fused5_ring_effects(tl, e, m, s, (size_t)k, seen);
		}
		walk_effects(tl, e, m, s, seen, queue, depth);
		correction_effects(tl, e, w, s);
	}
	free(seen);
	free(queue);
	free(depth);
}
