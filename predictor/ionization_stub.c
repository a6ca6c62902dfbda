/* SPDX-License-Identifier: MIT */
/* ionization_stub.c: placeholder until the microstate model lands (issue 5). */
#include <math.h>

#include "ionization.h"

int ionization_fill(pred_result *r, const pred_model *m, const ion_input *in,
		    const pred_options *opt, pred_error *err)
{
	(void)m;
	(void)in;
	(void)err;
	r->ph = opt->ph;
	return 0;
}

double ionization_pair_shift(const pred_model *m, int bonds)
{
	double a = m->params[m->p_interaction].value, k = m->params[m->p_interaction_decay].value;
	return a * exp(-k * (bonds - 1));
}
