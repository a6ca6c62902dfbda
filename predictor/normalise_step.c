/* SPDX-License-Identifier: MIT */
/* normalise_step.c: runs input normalisation and tautomer standardisation for predict.c. */
#include "engine.h"
#include "normalize.h"
#include "tautomer.h"

int eng_normalise(pred_result *r, obw_mol *mol, obw_ctx *ctx, pred_error *err)
{
	norm_report rep;
	norm_report_init(&rep);
	int rc = norm_molecule(mol, ctx, &rep, err);
	if (!rc)
		rc = taut_standardise(mol, &rep, err);
	for (size_t i = 0; i < rep.n && !rc; i++)
		rc = res_warn(r, "%s", rep.warn[i]);
	return rc;
}
