/* SPDX-License-Identifier: MIT */
/* test_fit.c: site ranking, the ridge least-squares step and the params.tsv writer of fit. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "fit.h"
#include "harness.h"
#include "model.h"
#include "site_match.h"

/* Substituted benzoic acids in water at 25 C: sigma (Hammett 1937 / HLT1991 Table I, as in
 * shared data/substituent-constants.csv) and pKa (CRC Handbook, dissociation constants of
 * organic acids; from memory). Hammett's definition gives rho = 1 and pKa0 = 4.20. */
static const double sigma[] = {0.00, 0.78, 0.71, 0.23, 0.37, -0.17, -0.27};
static const double pka[] = {4.20, 3.44, 3.45, 3.98, 3.83, 4.37, 4.47};
enum { NB = 7 };

static pred_model *toy_model(double rho_prior, double rho_sd)
{
	pred_model *m = calloc(1, sizeof *m);
	m->p_falloff = -1;
	model_param_add(m, "benzoic.parent", 4.0, 100.0);
	model_param_add(m, "benzoic.rho", rho_prior, rho_sd);
	model_param_add(m, "global.interaction", 5.96, 1.0);
	return m;
}

/* Design of the series: pKa = parent * 1 + rho * (-sigma); one extra row may be an outlier. */
static void toy_data(fit_data *d, double outlier)
{
	size_t n = NB + (outlier != 0);
	memset(d, 0, sizeof *d);
	d->n = n;
	d->y = calloc(n, sizeof *d->y);
	d->w = calloc(n, sizeof *d->w);
	d->c = calloc(n, sizeof *d->c);
	d->fold = calloc(n, sizeof *d->fold);
	d->off = calloc(n + 1, sizeof *d->off);
	d->param = calloc(2 * n, sizeof *d->param);
	d->feat = calloc(2 * n, sizeof *d->feat);
	for (size_t i = 0; i < n; i++) {
		size_t s = i < NB ? i : 0;
		d->y[i] = i < NB ? pka[s] : pka[0] + outlier;
		d->w[i] = 1.0;
		d->param[2 * i] = 0, d->feat[2 * i] = 1.0;
		d->param[2 * i + 1] = 1, d->feat[2 * i + 1] = -sigma[s];
		d->off[i + 1] = 2 * (i + 1);
		d->fold[i] = (unsigned)(i % 3);
	}
}

/* Closed form of the ridge problem with two columns: (X'X + P) t = X'y + P prior. */
static void closed_form(double *t, const pred_model *m, const fit_data *d, double sd)
{
	double a = 0, b = 0, c = 0, u = 0, v = 0, p0, p1, det;
	for (size_t i = 0; i < d->n; i++) {
		double x = d->feat[2 * i + 1];
		a += 1, b += x, c += x * x, u += d->y[i], v += x * d->y[i];
	}
	p0 = sd * sd / (m->params[0].prior_sd * m->params[0].prior_sd);
	p1 = sd * sd / (m->params[1].prior_sd * m->params[1].prior_sd);
	a += p0, c += p1, u += p0 * m->params[0].prior, v += p1 * m->params[1].prior;
	det = a * c - b * b;
	t[0] = (c * u - b * v) / det;
	t[1] = (a * v - b * u) / det;
}

static void test_fit__ranks_sites_by_acidity_and_basicity(void)
{
	pred_site s[5] = {{.kind = PRED_ACID, .pka = 4.2}, {.kind = PRED_ACID, .pka = 9.9},
			  {.kind = PRED_BASE, .pka = 5.0}, {.kind = PRED_ACID, .pka = 2.1},
			  {.kind = PRED_BASE, .pka = 9.1}};
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_ACID, 1), 3);
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_ACID, 2), 0);
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_ACID, 3), 1);
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_ACID, 4), -1);
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_BASE, 1), 4);
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_BASE, 2), 2);
	CHECK_INT_EQ(pred_site_rank(s, 5, PRED_BASE, 3), -1);
	CHECK_INT_EQ(pred_site_rank(s, 0, PRED_ACID, 1), -1);
}

static void test_fit__ties_rank_in_site_order(void)
{
	pred_site s[3] = {{.kind = PRED_ACID, .pka = 3.0}, {.kind = PRED_ACID, .pka = 3.0},
			  {.kind = PRED_ACID, .pka = 3.0}};
	CHECK_INT_EQ(pred_site_rank(s, 3, PRED_ACID, 1), 0);
	CHECK_INT_EQ(pred_site_rank(s, 3, PRED_ACID, 2), 1);
	CHECK_INT_EQ(pred_site_rank(s, 3, PRED_ACID, 3), 2);
}

/* Perrin numbers the steps of a glycine cation amine (9.78) then COOH (2.35), and those of
 * a 3-hydroxypyridine OH (8.7) then ring N (4.9) (data/iupac-pka.csv, perrin rows). */
static void test_fit__steps_rank_both_kinds_in_water_window(void)
{
	pred_site gly[3] = {{.kind = PRED_BASE, .pka = 9.6}, {.kind = PRED_ACID, .pka = 2.4},
			    {.kind = PRED_BASE, .pka = -9.0}};
	pred_site hyp[2] = {{.kind = PRED_ACID, .pka = 8.6}, {.kind = PRED_BASE, .pka = 4.8}};
	pred_site ace[2] = {{.kind = PRED_ACID, .pka = 4.8}, {.kind = PRED_BASE, .pka = -6.0}};
	CHECK_INT_EQ(pred_site_rank_steps(gly, 3, PRED_BASE, 1, 2), 0);
	CHECK_INT_EQ(pred_site_rank_steps(gly, 3, PRED_BASE, 2, 2), 1);
	CHECK_INT_EQ(pred_site_rank(gly, 3, PRED_BASE, 2), 2);
	CHECK_INT_EQ(pred_site_rank_steps(gly, 3, PRED_ACID, 2, 2), 0);
	CHECK_INT_EQ(pred_site_rank_steps(hyp, 2, PRED_BASE, 1, 2), 0);
	CHECK_INT_EQ(pred_site_rank_steps(hyp, 2, PRED_BASE, 2, 2), 1);
	CHECK_INT_EQ(pred_site_rank_steps(ace, 2, PRED_ACID, 1, 1), 0);
	CHECK_INT_EQ(pred_site_rank_steps(ace, 2, PRED_ACID, 2, 1), -1);
}

/* A naphtholsulfonic acid's first measured step is the OH: the sulfonic acid is fully ionised
 * in water (Serjeant & Dempsey rows in data/iupac-pka.csv); acetamide's only measured base
 * step is O-protonation below 0 (Perrin, handbook-bases.csv -0.63). */
static void test_fit__steps_put_unmeasurable_sites_last(void)
{
	pred_site nso[2] = {{.kind = PRED_ACID, .pka = -1.5}, {.kind = PRED_ACID, .pka = 9.3}};
	pred_site amd[2] = {{.kind = PRED_ACID, .pka = 15.1}, {.kind = PRED_BASE, .pka = -0.5}};
	CHECK_INT_EQ(pred_site_rank_steps(nso, 2, PRED_ACID, 1, 2), 1);
	CHECK_INT_EQ(pred_site_rank_steps(nso, 2, PRED_ACID, 2, 2), 0);
	CHECK_INT_EQ(pred_site_rank(nso, 2, PRED_ACID, 1), 0);
	CHECK_INT_EQ(pred_site_rank_steps(amd, 2, PRED_BASE, 1, 1), 1);
	CHECK_INT_EQ(pred_site_rank_steps(amd, 2, PRED_BASE, 2, 1), -1);
	CHECK_INT_EQ(pred_site_rank_steps(amd, 2, PRED_ACID, 1, 1), 0);
}

/* Perrin lists one step of 2-methylbenzimidazole, the ring N cation (6.18, data/iupac-pka.csv
 * perrin rows); the NH deprotonates near 12 and is not that step. With two rows of a
 * molecule that has one base site in the window, the other kind's site is still a step. */
static void test_fit__steps_keep_to_the_row_kind_when_it_has_enough_sites(void)
{
	pred_site bim[2] = {{.kind = PRED_ACID, .pka = 11.8}, {.kind = PRED_BASE, .pka = 6.2}};
	CHECK_INT_EQ(pred_site_rank_steps(bim, 2, PRED_BASE, 1, 1), 1);
	CHECK_INT_EQ(pred_site_rank_steps(bim, 2, PRED_BASE, 1, 2), 0);
	CHECK_INT_EQ(pred_site_rank_steps(bim, 2, PRED_BASE, 1, 0), 0);
	CHECK_INT_EQ(pred_site_rank_steps(bim, 2, PRED_BASE, 2, 1), -1);
}

/* A compilation that lists fewer steps than the molecule has in the water window left some
 * out, so the listed ones are paired with the predicted ones by value, in order. Serjeant &
 * Dempsey list N-methyliminodiacetic acid as acid1 2.144, acid2 9.57 (data/iupac-pka.csv): two
 * carboxyls and the ammonium are three steps, and the ammonium is the listed acid2. Where
 * the listing reaches the last step in the window (glycine's two Perrin rows, 9.78 and 2.35),
 * the numbering alone decides. */
static void test_fit__listed_steps_pair_by_value_when_steps_are_missing(void)
{
	pred_site mida[3] = {{.kind = PRED_ACID, .pka = 1.9}, {.kind = PRED_BASE, .pka = 9.6},
			     {.kind = PRED_ACID, .pka = 2.7}};
	int mi[2] = {1, 2};
	double mv[2] = {2.144, 9.57};
	pred_listed_steps ml = {2, mi, mv};
	pred_site gly[2] = {{.kind = PRED_BASE, .pka = 8.0}, {.kind = PRED_ACID, .pka = 2.4}};
	int gi[2] = {1, 2};
	double gv[2] = {9.78, 2.35};
	pred_listed_steps gl = {2, gi, gv};
	int one[1] = {1};
	double far[1] = {12.0};
	pred_listed_steps fl = {1, one, far};
	CHECK_INT_EQ(pred_site_rank_listed(mida, 3, PRED_ACID, 1, &ml), 0);
	CHECK_INT_EQ(pred_site_rank_listed(mida, 3, PRED_ACID, 2, &ml), 1);
	CHECK_INT_EQ(pred_site_rank_steps(mida, 3, PRED_ACID, 2, 2), 2);
	/* complete listing: by number, however far the values */
	CHECK_INT_EQ(pred_site_rank_listed(gly, 2, PRED_BASE, 1, &gl), 0);
	CHECK_INT_EQ(pred_site_rank_listed(gly, 2, PRED_BASE, 2, &gl), 1);
	/* one listed step of three: the nearest in value */
	CHECK_INT_EQ(pred_site_rank_listed(mida, 3, PRED_ACID, 1, &fl), 1);
	/* no list: as the steps rule with no row count */
	CHECK_INT_EQ(pred_site_rank_listed(mida, 3, PRED_ACID, 2, NULL),
		     pred_site_rank_steps(mida, 3, PRED_ACID, 2, 0));
	/* an index that is not listed, or more values than steps: by number */
	CHECK_INT_EQ(pred_site_rank_listed(mida, 3, PRED_ACID, 3, &ml),
		     pred_site_rank_steps(mida, 3, PRED_ACID, 3, 2));
	CHECK_INT_EQ(pred_site_rank_listed(mida, 1, PRED_ACID, 1, &ml),
		     pred_site_rank_steps(mida, 1, PRED_ACID, 1, 2));
}

static void check_against_closed_form(double rho_prior, double rho_sd)
{
	pred_model *m = toy_model(rho_prior, rho_sd);
	pred_fit_options opt;
	fit_data d;
	fit_cols cols;
	double theta[2], want[2];
	pred_fit_options_init(&opt);
	opt.resid_sd = 0.5;
	opt.huber = 1e9; /* plain least squares: the closed form has no reweighting */
	toy_data(&d, 0);
	CHECK_INT_EQ(fit_cols_build(&cols, m, &d, -1), 0);
	CHECK_INT_EQ(cols.n, 2); /* global.interaction is used by no row */
	CHECK_INT_EQ(fit_solve(theta, m, &d, &cols, NULL, &opt, NULL), 0);
	closed_form(want, m, &d, opt.resid_sd);
	CHECK_NEAR(theta[0], want[0], 1e-9);
	CHECK_NEAR(theta[1], want[1], 1e-9);
	fit_cols_clear(&cols);
	fit_data_clear(&d);
	pred_model_free(m);
}

/* Solves the toy benzoic series (no outlier, residual sd 0.5) with the given rho prior. */
static int solve_toy(double theta[2], double rho_prior, double rho_sd)
{
	pred_model *m = toy_model(rho_prior, rho_sd);
	pred_fit_options opt;
	fit_data d;
	fit_cols cols;
	pred_fit_options_init(&opt);
	opt.resid_sd = 0.5;
	toy_data(&d, 0);
	fit_cols_build(&cols, m, &d, -1);
	int rc = fit_solve(theta, m, &d, &cols, NULL, &opt, NULL);
	fit_cols_clear(&cols);
	fit_data_clear(&d);
	pred_model_free(m);
	return rc;
}

static void test_fit__solver_equals_closed_form_ridge(void)
{
	double theta[2];
	check_against_closed_form(1.0, 100.0);
	check_against_closed_form(2.0, 0.05); /* a tight prior pulls rho towards 2 */
	solve_toy(theta, 2.0, 0.05);
	CHECK(theta[1] > 1.8); /* the data alone say 1.0 */
}

static void test_fit__recovers_hammett_benzoic_series(void)
{
	double theta[2];
	CHECK_INT_EQ(solve_toy(theta, 0.5, 100.0), 0);
	CHECK_NEAR(theta[0], 4.20, 0.10); /* benzoic acid 4.20 (Hammett 1937) */
	CHECK_NEAR(theta[1], 1.00, 0.10); /* rho = 1 by definition (Hammett 1937) */
}

static void test_fit__huber_weights_resist_an_outlier(void)
{
	pred_model *m = toy_model(1.0, 100.0);
	pred_fit_options opt;
	fit_data d;
	fit_cols cols;
	double robust[2], plain[2];
	pred_fit_options_init(&opt);
	opt.resid_sd = 0.5;
	toy_data(&d, 5.0); /* benzoic acid again, 5 units off: a data error */
	fit_cols_build(&cols, m, &d, -1);
	fit_solve(robust, m, &d, &cols, NULL, &opt, NULL);
	opt.huber = 1e9;
	fit_solve(plain, m, &d, &cols, NULL, &opt, NULL);
	CHECK(fabs(robust[0] - 4.20) < fabs(plain[0] - 4.20));
	CHECK_NEAR(robust[0], 4.20, 0.35);
	fit_cols_clear(&cols);
	fit_data_clear(&d);
	pred_model_free(m);
}

static char *read_all(const char *path)
{
	FILE *f = fopen(path, "rb");
	char *buf = calloc(1, 65536);
	if (f && buf)
		buf[fread(buf, 1, 65535, f)] = '\0';
	if (f)
		fclose(f);
	return buf;
}

static void test_fit__params_file_keeps_rows_it_did_not_fit(void)
{
	pred_model *m = toy_model(1.0, 100.0);
	pred_fit_report rep = {{0}, 0, NULL};
	char path[] = "test_fit_paramsXXXXXX", *text;
	int fd = mkstemp(path);
	FILE *f = fdopen(fd, "w");
	fputs("# interaction rows fitted elsewhere\nid\tvalue\tprior\tprior_sd\tn\trmse_cv\tnote\n"
	      "global.interaction\t5.96\t5.96\t1.0\t69\t0\tother helper\n"
	      "benzoic.rho\t0.5\t1\t1\t3\t0\tstale fit\n", f);
	fclose(f);
	rep.n_params = m->n_params;
	rep.fitted = calloc(m->n_params, 1);
	rep.fitted[1] = 1; /* benzoic.rho */
	m->params[1].value = 0.987;
	m->params[1].n = 7;
	CHECK_INT_EQ(pred_fit_write_params(m, &rep, path, "test rows", NULL), 0);
	text = read_all(path);
	CHECK(strstr(text, "# data_version: test rows\n") != NULL);
	CHECK(strstr(text, "# interaction rows fitted elsewhere\n") != NULL);
	CHECK(strstr(text, "global.interaction\t5.96\t5.96\t1.0\t69\t0\tother helper\n") != NULL);
	CHECK(strstr(text, "benzoic.rho\t0.9870\t1.0000\t100.0000\t7\t") != NULL);
	CHECK(strstr(text, "stale fit") == NULL);
	CHECK(strstr(text, "benzoic.parent") == NULL);
	CHECK(strstr(text, "# interaction") < strstr(text, "id\tvalue"));
	free(text);
	/* a second fit over the file replaces its own header lines instead of adding to them */
	CHECK_INT_EQ(pred_fit_write_params(m, &rep, path, "test rows", NULL), 0);
	text = read_all(path);
	const char *rm = strstr(text, "# rmse_cv:");
	CHECK(rm != NULL && strstr(rm + 1, "# rmse_cv:") == NULL);
	const char *dv = strstr(text, "# data_version:");
	CHECK(dv != NULL && strstr(dv + 1, "# data_version:") == NULL);
	CHECK(strstr(text, "# interaction rows fitted elsewhere\n") != NULL);
	free(text);
	free(rep.fitted);
	unlink(path);
	pred_model_free(m);
}

/* ---- the whole fit on the fixture tables (tests/predictor/fixture) --------------------- */

static const char *const fit_smiles[] = {"CC(=O)O", "CCC(=O)O", "OC(=O)CCl", "CCCC(=O)O",
					  "OC(=O)CCCl", "OC(=O)CC#N", "Oc1ccccc1", "Oc1ccc(Cl)cc1",
					  "OC(=O)c1ccccc1", "NCCO"};
enum { NF = sizeof fit_smiles / sizeof fit_smiles[0] };

static pred_model *fixture_model(void)
{
	char dir[1024];
	const char *src = getenv("PKAD_SOURCE_DIR");
	pred_model *m = NULL;
	pred_error e = {0, ""};
	snprintf(dir, sizeof dir, "%s/tests/predictor/fixture", src ? src : "..");
	if (pred_global_init(&e) || pred_model_load(&m, dir, &e))
		fprintf(stderr, "fixture model: %s\n", e.msg);
	return m;
}

/* The design of a site must reproduce its pKa exactly, or pkad fit would fit another model. */
static void test_fit__design_reproduces_site_pka(void)
{
	pred_model *m = fixture_model();
	pred_worker *w = NULL;
	CHECK(m != NULL);
	if (!m || pred_worker_new(&w, m, NULL))
		return;
	for (size_t i = 0; i < NF; i++) {
		pred_result *r = NULL;
		CHECK_INT_EQ(pred_predict(&r, w, fit_smiles[i], PRED_FMT_SMILES, NULL, NULL), 0);
		for (size_t k = 0; r && k < pred_result_site_count(r); k++) {
			pred_design d;
			double v;
			pred_result_design(r, k, &d);
			v = d.constant;
			for (size_t j = 0; j < d.n; j++)
				v += d.feature[j] * m->params[d.param[j]].value;
			CHECK_NEAR(v, pred_result_site(r, k)->pka, 1e-9);
		}
		pred_result_free(r);
	}
	pred_worker_free(w);
	pred_model_free(m);
}

/* Rows made by the model with carboxylic.parent raised by 0.30: the fit must find the 0.30
 * and leave the other parameters where they were. */
static void test_fit__recovers_a_shifted_parent(void)
{
	pred_model *m = fixture_model();
	pred_worker *w = NULL;
	pred_fit_row rows[NF];
	pred_fit_report *rep = NULL;
	pred_fit_options opt;
	pred_fit_summary sum;
	double ys[NF], before[64];
	int p = m ? model_param_find(m, "carboxylic.parent") : -1;
	CHECK(p >= 0 && m->n_params <= 64);
	if (p < 0 || m->n_params > 64 || pred_worker_new(&w, m, NULL))
		return;
	m->params[p].value += 0.30;
	for (size_t i = 0; i < NF; i++) {
		pred_result *r = NULL;
		long k;
		pred_predict(&r, w, fit_smiles[i], PRED_FMT_SMILES, NULL, NULL);
		k = r ? pred_result_match(r, PRED_ACID, 1) : -1;
		ys[i] = k >= 0 ? pred_result_site(r, (size_t)k)->pka : 0;
		rows[i] = (pred_fit_row){fit_smiles[i], PRED_ACID, 1, ys[i], 1.0, 0, 0, NULL};
		pred_result_free(r);
	}
	pred_worker_free(w);
	m->params[p].value -= 0.30;
	for (size_t j = 0; j < m->n_params; j++)
		before[j] = m->params[j].value;
	pred_fit_options_init(&opt);
	opt.search_falloff = 0;
	opt.resid_sd = 0.01; /* priors barely pull: the rows are exact */
	opt.folds = 2;
	CHECK_INT_EQ(pred_fit(&rep, m, rows, NF, &opt, NULL), 0);
	CHECK_NEAR(m->params[p].value, before[p] + 0.30, 0.01);
	for (size_t j = 0; j < m->n_params; j++)
		if ((int)j != p)
			CHECK_NEAR(m->params[j].value, before[j], 0.01);
	pred_fit_report_summary(rep, &sum);
	CHECK_INT_EQ(sum.n_rows, NF);
	CHECK_INT_EQ(sum.n_unmatched + sum.n_unreadable + sum.n_used + sum.n_trimmed, NF);
	CHECK(sum.rmse_after < 0.01 && sum.rmse_before > 0.1);
	pred_fit_report_free(rep);
	pred_model_free(m);
}

int main(void)
{
	RUN(test_fit__ranks_sites_by_acidity_and_basicity);
	RUN(test_fit__ties_rank_in_site_order);
	RUN(test_fit__steps_rank_both_kinds_in_water_window);
	RUN(test_fit__steps_put_unmeasurable_sites_last);
	RUN(test_fit__steps_keep_to_the_row_kind_when_it_has_enough_sites);
	RUN(test_fit__listed_steps_pair_by_value_when_steps_are_missing);
	RUN(test_fit__solver_equals_closed_form_ridge);
	RUN(test_fit__recovers_hammett_benzoic_series);
	RUN(test_fit__huber_weights_resist_an_outlier);
	RUN(test_fit__params_file_keeps_rows_it_did_not_fit);
	RUN(test_fit__design_reproduces_site_pka);
	RUN(test_fit__recovers_a_shifted_parent);
	return harness_done();
}
