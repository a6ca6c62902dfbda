/* SPDX-License-Identifier: MIT */
/* stepwise.c: statistical and charge-interaction terms of multiprotic molecules. */
#include <math.h>
#include <stdlib.h>

#include "engine.h"
#include "ionization.h"

typedef struct step_state {
	double *micro;
	int *charge;  /* current charge of each site: base +1 while protonated, acid -1 when ionised */
	int *done;
	int *eq_n;    /* size of the equivalence class of each site */
	int *eq_done; /* members of that class already ionised (indexed by the class leader) */
	int *leader;
	int *block;    /* first site of the block of each site: equivalent sites on one centre */
	int *cnt;      /* scratch: ionised sites per block (indexed by the block's first site) */
	size_t *order; /* titration order, when chosen over all paths (best_order) */
	double *w;     /* n x n: eng_pair_shift of each pair, computed once */
} step_state;

/* Sites are equivalent when the same row matches symmetry-equivalent atoms. */
static void equivalence(step_state *st, const eng_mol *e, const int *symclass)
{
	for (size_t i = 0; i < e->n_sites; i++) {
		st->leader[i] = (int)i;
		for (size_t j = 0; j < i; j++)
			if (e->sites[j].row == e->sites[i].row &&
			    symclass[e->sites[j].atom] == symclass[e->sites[i].atom]) {
				st->leader[i] = st->leader[j];
				break;
			}
		st->eq_n[st->leader[i]]++;
	}
	/* a block: sites of one class two bonds apart (the OH of one P(=O)(OH)2) */
	for (size_t i = 0; i < e->n_sites; i++) {
		st->block[i] = (int)i;
		for (size_t j = 0; j < i; j++)
			if (st->leader[j] == st->leader[i] &&
			    e->dist[i * e->nat + (size_t)e->sites[j].atom] == 2) {
				st->block[i] = st->block[j];
				break;
			}
	}
}

static double interaction(const step_state *st, const eng_mol *e, size_t i)
{
	double sum = 0;
	for (size_t j = 0; j < e->n_sites; j++) {
		if (j == i || !st->charge[j])
			continue;
		/* losing a proton lowers the site's charge by one: like charges nearby make that
		 * easier (positive) or harder (negative). */
		sum -= st->charge[j] * st->w[i * e->n_sites + j];
	}
	return sum;
}

/* Feature of the pair term of site i (-2 per ionised partner of its hydrogen-bond pair
 * row, +1 per ionised partner of its charge pair row, see pair_hbond.c); *param is that
 * row's parameter or -1. */
static double pair_feature(const step_state *st, const eng_mol *e, const pred_model *m,
			   size_t i, int *param)
{
	double f = 0;
	*param = -1;
	for (size_t j = 0; e->pair_param && j < e->n_sites; j++) {
		int p = e->pair_param[i * e->n_sites + j];
		if (p < 0 || st->charge[j] >= 0 || (*param >= 0 && p != *param))
			continue;
		*param = p;
		f += eng_pair_is_charge(m, p) ? 1.0 : -2.0;
	}
	return f;
}

/* ln n!, summed rather than by lgamma, which writes the global signgam (a data race between
 * the daemon's worker threads); n counts sites or blocks, so the sum is short. */
static double log_factorial(int n)
{
	double v = 0;
	for (int k = 2; k <= n; k++)
		v += log((double)k);
	return v;
}

/* log10 of the number of states like the one with cnt[b] sites ionised in each of the nb
 * blocks of m sites: the symmetry permutes the sites of a block and the blocks, so nb! / (the
 * blocks with equal counts among themselves) x product of C(m, cnt[b]). */
static double log_orbit(const int *cnt, int nb, int m)
{
	double v = log_factorial(nb);
	for (int c = 0; c <= m; c++) {
		int mult = 0;
		for (int b = 0; b < nb; b++)
			mult += cnt[b] == c;
		v -= log_factorial(mult);
	}
	for (int b = 0; b < nb; b++)
		v += log_factorial(m) - log_factorial(cnt[b]) - log_factorial(m - cnt[b]);
	return v / log(10.0);
}

/* Statistical term of site i's step: log10 of the number of equivalent states before the
 * step over the number after it (common practice: a symmetric diacid's two steps lie log 4
 * apart). n equivalent sites on separate centres give log10(k / (n - k + 1)) at the k-th
 * step; two equivalent P(OH)2 groups titrate -log 4, 0, 0, +log 4 (one OH of each first),
 * not as four free sites. Blocks of unequal size keep the free-site form. */
static double statistical(const step_state *st, const eng_mol *e, size_t i)
{
	int L = st->leader[i], n = st->eq_n[L], k = st->eq_done[L] + 1;
	if (n < 2)
		return 0.0;
	int nb = 0, m = -1, ok = 1;
	for (size_t j = 0; j < e->n_sites; j++) {
		if (st->leader[j] != L || st->block[j] != (int)j)
			continue;
		int size = 0, on = 0;
		for (size_t q = j; q < e->n_sites; q++)
			if (st->block[q] == (int)j) {
				size++;
				on += st->done[q];
			}
		ok = ok && (m < 0 || size == m);
		m = size;
		st->cnt[nb++] = on;
	}
	if (!ok || m == 1)
		return log10((double)k / (double)(n - k + 1));
	int b = 0;
	for (size_t j = 0; j < e->n_sites && st->block[j] != st->block[i]; j++)
		b += st->leader[j] == L && st->block[j] == (int)j;
	double before = log_orbit(st->cnt, nb, m);
	st->cnt[b]++;
	return before - log_orbit(st->cnt, nb, m);
}

/* An acid losing its proton while a base of the molecule still holds one makes a
 * zwitterion. The distance model overstates how much a near charge pair is stabilised in
 * water (solvation of the separate ions is not in it), so such a step is preferred over a
 * charge-neutralising one only when it is ahead by more than ZWITTERION_MARGIN units:
 * amino acids (ahead by 5 or more) keep their zwitterion, borderline cases such as
 * hydroxylamine (H3N+OH -> H2NOH, not H3N+O-) titrate as drawn. Chosen on the train split
 * with the path order below (broad tier A train rmse 1.085 at 0.5, 1.087 at 0.8, 1.088 at
 * 1.0; core train 0.459 at each): at 1.0 the mono-Mannich phenols (ammonium-phenoxide by
 * 0.98) titrated amine first. */
#define ZWITTERION_MARGIN 0.5

/* Penalty of the step in log units: 0 for ordinary steps, ZWITTERION_MARGIN for one making
 * a zwitterion, and far more when the two charges would sit one or two bonds apart
 * (H3N+-O-, C=NH+-O-: minor tautomers whose stability the distance model cannot judge). */
static double zwitterion_penalty(const step_state *st, const eng_mol *e, const pred_model *m,
				 size_t i)
{
	if (m->sites[e->sites[i].row].kind != PRED_ACID)
		return 0;
	double pen = 0;
	for (size_t j = 0; j < e->n_sites; j++) {
		if (st->charge[j] <= 0)
			continue;
		int d = e->dist[i * e->nat + (size_t)e->sites[j].atom];
		pen = fmax(pen, d >= 0 && d <= 2 ? 100.0 : ZWITTERION_MARGIN);
	}
	return pen;
}

/* Effective value of site i's step when the sites ionised so far are those marked in done
 * (the charges in st are theirs): micro value, statistical, interaction and hydrogen-bond
 * terms; *stat, *inter, *pf and *pp get the parts. */
static double step_value(const step_state *st, const eng_mol *e, const pred_model *m, size_t i,
			 double *stat, double *inter, double *pf, int *pp)
{
	*stat = statistical(st, e, i);
	*inter = interaction(st, e, i);
	*pf = pair_feature(st, e, m, i, pp);
	return st->micro[i] + *stat + *inter + (*pp >= 0 ? m->params[*pp].value * *pf : 0);
}

/* Ionises site i: its terms go to tls[i], the state moves on. */
static void take_step(term_list *tls, step_state *st, const eng_mol *e, const pred_model *m,
		      size_t i)
{
	int pp;
	double stat, inter, pf;
	step_value(st, e, m, i, &stat, &inter, &pf, &pp);
	term_list *tl = &tls[i];
	if (pp >= 0 && eng_pair_is_charge(m, pp))
		terms_add(tl, m, "charge_pair", pp, pf,
			  "charge of the other group on the same centre");
	else if (pp >= 0)
		terms_add(tl, m, "hbond", pp, pf,
			  "proton held by the hydrogen-bonded anion of the pair");
	if (fabs(stat) > 1e-9)
		terms_add(tl, m, "statistical", -1, stat, "%d equivalent sites",
			  st->eq_n[st->leader[i]]);
	if (fabs(inter) >= 0.005) {
		terms_add(tl, m, "interaction", -1, inter,
			  "charges of sites ionised before this one");
		/* the distance model of the interaction is rough: a quarter of it as 1 sd */
		tl->extra_var += 0.0625 * inter * inter;
	}
	st->done[i] = 1;
	st->charge[i] -= 1;
	st->eq_done[st->leader[i]]++;
}

/* Whether site i goes before site j among equal values: by the canonical rank of the site
 * atom (the atom order of the input must not decide), then by index (equivalent sites). */
static int site_before(const eng_mol *e, size_t i, size_t j)
{
	if (e->rank) {
		int ri = e->rank[e->sites[i].atom], rj = e->rank[e->sites[j].atom];
		if (ri != rj)
			return ri < rj;
	}
	return i < j;
}

/* Effective value of site i for the greedy order: its step value, zwitterion penalty
 * included. */
static double greedy_value(const step_state *st, const eng_mol *e, const pred_model *m,
			   size_t i)
{
	int pp;
	double stat, inter, pf;
	return step_value(st, e, m, i, &stat, &inter, &pf, &pp) + zwitterion_penalty(st, e, m, i);
}

/* Whether the greedy order takes site i before site j now. */
static int greedy_before(const step_state *st, const eng_mol *e, const pred_model *m,
			 size_t i, size_t j)
{
	double vi = greedy_value(st, e, m, i), vj = greedy_value(st, e, m, j);
	return vi < vj - 1e-9 || (fabs(vi - vj) <= 1e-9 && site_before(e, i, j));
}

/* Site the greedy order ionises next: the lowest effective value, zwitterion penalty
 * included. */
static size_t greedy_next(const step_state *st, const eng_mol *e, const pred_model *m)
{
	size_t best = 0;
	double best_rank = HUGE_VAL;
	for (size_t i = 0; i < e->n_sites; i++) {
		if (st->done[i])
			continue;
		double rank = greedy_value(st, e, m, i);
		/* equal values: the lower canonical rank first, never the input order */
		if (rank < best_rank - 1e-9 ||
		    (fabs(rank - best_rank) <= 1e-9 && site_before(e, i, best))) {
			best_rank = rank;
			best = i;
		}
	}
	return best;
}

/* Sites of the water window up to which their order is chosen over all titration paths
 * (2^k states), and sites in all up to which that is tried (bit masks of the state). */
enum { ORDER_EXACT_MAX = 14, ORDER_SITES_MAX = 32 };

/* The water window of the path order: sites whose micro value lies outside it (the O of a
 * carbonyl near -7, a C-H acid near 20) ionise before or after every site inside it in any
 * order that matters, so they take the greedy order and do not double the paths searched. */
#define ORDER_WINDOW_LO (-2.0)
#define ORDER_WINDOW_HI 16.0

/* Puts st in the state of the sites in mask ionised (from the fully protonated form). */
static void set_state(step_state *st, const eng_mol *e, const pred_model *m, unsigned mask)
{
	size_t n = e->n_sites;
	for (size_t i = 0; i < n; i++)
		st->eq_done[i] = 0;
	for (size_t i = 0; i < n; i++) {
		int on = (mask >> i) & 1u;
		st->done[i] = on;
		st->charge[i] = (m->sites[e->sites[i].row].kind == PRED_BASE ? 1 : 0) - on;
		st->eq_done[st->leader[i]] += on;
	}
}

/* The sites as bit masks, for the zwitterion penalty of a state (ZWITTERION_MARGIN, or 100
 * with the charges 1-2 bonds apart, as for a step: an acid site ionised while a base site
 * still holds its proton). near[i]: the base sites within 2 bonds of acid site i. */
typedef struct zw_masks {
	unsigned acid, base, near[ORDER_SITES_MAX];
} zw_masks;

static void zw_masks_init(zw_masks *z, const eng_mol *e, const pred_model *m)
{
	size_t n = e->n_sites;
	z->acid = z->base = 0;
	for (size_t i = 0; i < n; i++) {
		z->near[i] = 0;
		if (m->sites[e->sites[i].row].kind == PRED_ACID)
			z->acid |= 1u << i;
		else
			z->base |= 1u << i;
	}
	for (size_t i = 0; i < n; i++)
		for (size_t j = 0; j < n; j++) {
			int d = e->dist[i * e->nat + (size_t)e->sites[j].atom];
			if (((z->acid >> i) & 1u) && ((z->base >> j) & 1u) && d >= 0 && d <= 2)
				z->near[i] |= 1u << j;
		}
}

/* Penalty of the state whose ionised sites are the bits of s. */
static double state_penalty(const zw_masks *z, unsigned s, size_t n)
{
	unsigned acids = s & z->acid, bases = ~s & z->base;
	if (!acids || !bases)
		return 0;
	for (size_t i = 0; i < n; i++)
		if (((acids >> i) & 1u) && (z->near[i] & bases))
			return 100.0;
	return ZWITTERION_MARGIN;
}

/* The titration order through the most populated states: of all orders (paths from the
 * fully protonated state, one site per step), the one whose states, one at each level of
 * protons lost, have the lowest summed free energy (in pKa units at pH 0: the step values
 * of the path up to that level, plus the state's zwitterion penalty). The greedy order looks
 * one step ahead only: where the first step that wins (the amine of a nitrilotriacetic acid
 * cation, micro value far below the zwitterion's carboxyl plus the margin) leads to states
 * far from the dominant ones at the next levels, this order takes the carboxyl first, as
 * water does. Equal sums go by site_before, as in the greedy order. order gets n site
 * indices; returns 0 or PRED_ENOMEM. */
static int best_order(size_t *order, step_state *st, const eng_mol *e, const pred_model *m,
		      const size_t *idx, size_t k, unsigned base)
{
	size_t n = e->n_sites, ns = (size_t)1 << k;
	double *g = malloc(ns * sizeof *g), *best = malloc(ns * sizeof *best);
	unsigned char *last = malloc(ns);
	if (!g || !best || !last) {
		free(g);
		free(best);
		free(last);
		return PRED_ENOMEM;
	}
	zw_masks z;
	zw_masks_init(&z, e, m);
	unsigned full = base; /* the full mask of state s, kept in step with s */
	g[0] = best[0] = 0;
	for (size_t s = 1; s < ns; s++) {
		size_t i = 0;
		while (!((s >> i) & 1u))
			i++;
		unsigned prev = (unsigned)(s & ~((size_t)1 << i));
		full = base;
		for (size_t j = 0; j < k; j++)
			if ((prev >> j) & 1u)
				full |= 1u << idx[j];
		int pp;
		double stat, inter, pf;
		set_state(st, e, m, full);
		g[s] = g[prev] + step_value(st, e, m, idx[i], &stat, &inter, &pf, &pp);
		double here = g[s] + state_penalty(&z, full | 1u << idx[i], n);
		best[s] = HUGE_VAL;
		last[s] = 0;
		/* on ties the site that goes first in the greedy order (site_before) is not the
		 * last one */
		for (size_t j = 0; j < k; j++) {
			if (!((s >> j) & 1u))
				continue;
			double v = best[s & ~((size_t)1 << j)];
			if (v < best[s] - 1e-9 || (fabs(v - best[s]) <= 1e-9 &&
						     site_before(e, idx[last[s]], idx[j]))) {
				best[s] = v;
				last[s] = (unsigned char)j;
			}
		}
		best[s] += here;
	}
	size_t s = ns - 1;
	for (size_t q = k; q-- > 0;) {
		order[q] = idx[last[s]];
		s &= ~((size_t)1 << last[s]);
	}
	free(g);
	free(best);
	free(last);
	set_state(st, e, m, base);
	return 0;
}

/* Titrates the sites whose micro value is below the window (greedy), then those inside it
 * (best_order when there are 3 to ORDER_EXACT_MAX of them, else greedy), then the rest
 * (greedy). */
static int titrate(term_list *tls, step_state *st, const eng_mol *e, const pred_model *m)
{
	size_t n = e->n_sites, k = 0, idx[ORDER_EXACT_MAX];
	int in[ORDER_SITES_MAX];
	for (size_t i = 0; i < n && n <= ORDER_SITES_MAX; i++) {
		in[i] = st->micro[i] >= ORDER_WINDOW_LO && st->micro[i] <= ORDER_WINDOW_HI;
		if (in[i] && k < ORDER_EXACT_MAX)
			idx[k] = i;
		k += in[i];
	}
	if (n > ORDER_SITES_MAX || k < 3 || k > ORDER_EXACT_MAX) {
		for (size_t q = 0; q < n; q++)
			take_step(tls, st, e, m, greedy_next(st, e, m));
		return 0;
	}
	size_t done = 0;
	unsigned base = 0;
	/* below the window: greedy among those sites */
	for (size_t q = 0; q < n; q++)
		if (st->micro[q] < ORDER_WINDOW_LO) {
			size_t pick = n;
			for (size_t i = 0; i < n; i++)
				if (!st->done[i] && st->micro[i] < ORDER_WINDOW_LO &&
				    (pick == n || greedy_before(st, e, m, i, pick)))
					pick = i;
			if (pick == n)
				break;
			take_step(tls, st, e, m, pick);
			base |= 1u << pick;
			done++;
		}
	int rc = best_order(st->order, st, e, m, idx, k, base);
	for (size_t q = 0; q < k && !rc; q++, done++)
		take_step(tls, st, e, m, st->order[q]);
	for (; done < n && !rc; done++)
		take_step(tls, st, e, m, greedy_next(st, e, m));
	return rc;
}

int eng_stepwise(term_list *tls, const eng_mol *e, const pred_model *m, const int *symclass)
{
	size_t n = e->n_sites;
	step_state st;
	st.micro = calloc(n + 1, sizeof *st.micro);
	st.charge = calloc(n + 1, sizeof *st.charge);
	st.done = calloc(n + 1, sizeof *st.done);
	st.eq_n = calloc(n + 1, sizeof *st.eq_n);
	st.eq_done = calloc(n + 1, sizeof *st.eq_done);
	st.leader = calloc(n + 1, sizeof *st.leader);
	st.block = calloc(n + 1, sizeof *st.block);
	st.cnt = calloc(n + 1, sizeof *st.cnt);
	st.order = calloc(n + 1, sizeof *st.order);
	st.w = malloc((n * n + 1) * sizeof *st.w);
	int rc = st.micro && st.charge && st.done && st.eq_n && st.eq_done && st.leader &&
			 st.block && st.cnt &&
			 st.order && st.w
		 ? 0
		 : PRED_ENOMEM;
	if (!rc) {
		for (size_t i = 0; i < n; i++)
			for (size_t j = 0; j < n; j++)
				st.w[i * n + j] = i == j ? 0 : eng_pair_shift(e, m, i, j);
		for (size_t i = 0; i < n; i++) {
			st.micro[i] = terms_sum(&tls[i]);
			st.charge[i] = m->sites[e->sites[i].row].kind == PRED_BASE ? 1 : 0;
		}
		equivalence(&st, e, symclass);
		/* with two window sites the path order is the greedy one (the final state is
		 * common, so the first step decides) */
		rc = titrate(tls, &st, e, m);
	}
	free(st.micro);
	free(st.charge);
	free(st.done);
	free(st.eq_n);
	free(st.eq_done);
	free(st.leader);
	free(st.block);
	free(st.cnt);
	free(st.order);
	free(st.w);
	return rc;
}
