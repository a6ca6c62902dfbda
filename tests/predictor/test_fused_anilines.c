/* SPDX-License-Identifier: MIT */
/* test_fused_anilines.c: amino groups on the benzo ring of fused azines and azoles
 * (aniline_fused_pyrazine, aniline_indazole_alpha of fragments/corrections.tsv) against
 * reference rows. */
#include <math.h>

#include "harness.h"
#include "predictor.h"
#include "site_probe.h"

static pred_model *model;
static pred_worker *worker;

/* 5- and 6-aminoquinoxaline 2.59 and 2.92 (Perrin 1965 via IUPAC dataset, perrin2321 and
 * perrin2322 of data/iupac-pka.csv) lie more than a unit under 1- and 2-naphthylamine (3.92
 * from memory; 4.16, Perrin 1965 via IUPAC dataset): the pyrazine N draw on the anilino N.
 * Tolerance 0.5 (class uncertainty about 0.4). */
static void test_fused_anilines__quinoxaline_amines_below_naphthylamines(void)
{
	double q5 = site_pka("Nc1cccc2c1nccn2", "aniline", PRED_BASE);
	double q6 = site_pka("Nc1ccc2c(c1)nccn2", "aniline", PRED_BASE);
	double n1 = site_pka("Nc1cccc2ccccc12", "aniline", PRED_BASE);
	double n2 = site_pka("Nc1ccc2ccccc2c1", "aniline", PRED_BASE);
	CHECK(!isnan(q5) && !isnan(q6) && !isnan(n1) && !isnan(n2));
	CHECK_NEAR(q5, 2.59, 0.5);
	CHECK_NEAR(q6, 2.92, 0.5);
	CHECK(n1 - q5 > 0.7);
	CHECK(n2 - q6 > 0.7);
}

/* 4- and 7-aminoindazole 3.26 and 3.02 (Perrin 1965 via IUPAC dataset, perrin2218 and
 * perrin2221 of data/iupac-pka.csv), well under aniline 4.60 (Perrin 1965 via IUPAC
 * dataset). Tolerance 0.6. */
static void test_fused_anilines__indazole_alpha_amines(void)
{
	double i4 = site_pka("Nc1cccc2c1cn[nH]2", "aniline", PRED_BASE);
	double i7 = site_pka("Nc1cccc2c1[nH]nc2", "aniline", PRED_BASE);
	double an = site_pka("Nc1ccccc1", "aniline", PRED_BASE);
	CHECK(!isnan(i4) && !isnan(i7) && !isnan(an));
	CHECK_NEAR(i4, 3.26, 0.6);
	CHECK_NEAR(i7, 3.02, 0.6);
	CHECK(an - i4 > 0.7);
	CHECK(an - i7 > 0.7);
}

int main(void)
{
	if (probe_setup(&model, &worker))
		return 1;
	RUN(test_fused_anilines__quinoxaline_amines_below_naphthylamines);
	RUN(test_fused_anilines__indazole_alpha_amines);
	probe_teardown(model, worker);
	return harness_done();
}
