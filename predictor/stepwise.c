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
}

static double interaction(const step_state *st, const eng_mol *e, const pred_model *m,
			  size_t i)
{
	double sum = 0;
	for (size_t j = 0; j < e->n_sites; j++) {
		if (j == i || !st->charge[j])
			continue;
		/* losing a proton lowers the site's charge by one: like charges nearby make that
		 * easier (positive) or harder (negative). */
		sum -= st->charge[j] * eng_pair_shift(e, m, i, j);
	}
	return sum;
}

/* Feature of the monoanion hydrogen-bond term of site i (-2 per ionised partner of its
 * pair row, see pair_hbond.c); *param is that row's parameter or -1. */
static double pair_feature(const step_state *st, const eng_mol *e, size_t i, int *param)
{
	double f = 0;
	*param = -1;
	for (size_t j = 0; e->pair_param && j < e->n_sites; j++) {
		int p = e->pair_param[i * e->n_sites + j];
		if (p < 0 || st->charge[j] >= 0 || (*param >= 0 && p != *param))
			continue;
		*param = p;
		f -= 2.0;
	}
	return f;
}

static double statistical(const step_state *st, size_t i)
{
	int n = st->eq_n[st->leader[i]], k = st->eq_done[st->leader[i]] + 1;
	return n > 1 ? log10((double)k / (double)(n - k + 1)) : 0.0;
}

/* An acid losing its proton while a base of the molecule still holds one makes a
 * zwitterion. The distance model overstates how much a near charge pair is stabilised in
 * water (solvation of the separate ions is not in it), so such a step is preferred over a
 * charge-neutralising one only when it is ahead by more than ZWITTERION_MARGIN units:
 * amino acids (ahead by 5 or more) keep their zwitterion, borderline cases such as
 * hydroxylamine (H3N+OH -> H2NOH, not H3N+O-) titrate as drawn. */
#define ZWITTERION_MARGIN 1.0

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

static void step_once(term_list *tls, step_state *st, const eng_mol *e, const pred_model *m)
{
	size_t best = 0;
	double best_rank = HUGE_VAL, best_stat = 0, best_int = 0, best_pf = 0;
	int best_pp = -1;
	for (size_t i = 0; i < e->n_sites; i++) {
		if (st->done[i])
			continue;
		int pp;
		double stat = statistical(st, i), inter = interaction(st, e, m, i);
		double pf = pair_feature(st, e, i, &pp);
		double eff = st->micro[i] + stat + inter + (pp >= 0 ? m->params[pp].value * pf : 0);
		double rank = eff + zwitterion_penalty(st, e, m, i);
		if (rank < best_rank) {
			best_rank = rank;
			best = i;
			best_stat = stat;
			best_int = inter;
			best_pf = pf;
			best_pp = pp;
		}
	}
	term_list *tl = &tls[best];
	if (best_pp >= 0)
		terms_add(tl, m, "hbond", best_pp, best_pf,
			  "proton held by the hydrogen-bonded anion of the pair");
	if (best_stat != 0)
		terms_add(tl, m, "statistical", -1, best_stat, "%d equivalent sites",
			  st->eq_n[st->leader[best]]);
	if (fabs(best_int) >= 0.005) {
		terms_add(tl, m, "interaction", -1, best_int,
			  "charges of sites ionised before this one");
		/* the distance model of the interaction is rough: a quarter of it as 1 sd */
		tl->extra_var += 0.0625 * best_int * best_int;
	}
	st->done[best] = 1;
	st->charge[best] -= 1;
	st->eq_done[st->leader[best]]++;
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
	int rc = st.micro && st.charge && st.done && st.eq_n && st.eq_done && st.leader
			 ? 0
			 : PRED_ENOMEM;
	if (!rc) {
		for (size_t i = 0; i < n; i++) {
			st.micro[i] = terms_sum(&tls[i]);
			st.charge[i] = m->sites[e->sites[i].row].kind == PRED_BASE ? 1 : 0;
		}
		equivalence(&st, e, symclass);
		for (size_t k = 0; k < n; k++)
			step_once(tls, &st, e, m);
	}
	free(st.micro);
	free(st.charge);
	free(st.done);
	free(st.eq_n);
	free(st.eq_done);
	free(st.leader);
	return rc;
}
