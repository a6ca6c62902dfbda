/* SPDX-License-Identifier: MIT */
/* ionization.h: microstate model over the predicted sites (macro pKa, species, charge). */
#ifndef PKAD_IONIZATION_H
#define PKAD_IONIZATION_H

#include <stddef.h>

#include "model.h"
#include "obwrap.h"
#include "result.h"

/* Input of the microstate model. site_mol_atom[i] is the molecule atom index (obw_mol
 * order) of r->sites[i]; dist holds one row of nat distances (bonds; -1 when not connected)
 * per site: dist[i * nat + a] is the distance from site i's charge to atom a (its atom, or
 * for an azinium its ring, see charge_dist.c; a pair takes the shorter count). The microscopic
 * pKa of site i is r->micro[i] (the site's pKa without the stepwise statistical and
 * interaction terms, which the microstate model accounts for; NULL: the site values).
 * mol may be NULL (tests on hand-built sites): no SMILES is written and each species'
 * smiles is its site-state string, one character per site ('-' ionised acid, '+'
 * protonated base, '0' neutral); dist NULL means no interactions. */
typedef struct ion_input {
	obw_mol *mol;
	obw_ctx *ctx;
	const int *site_mol_atom;
	const int *dist;
	size_t nat;
	/* symmetry class of every atom when some sites may be equivalent (else NULL):
	 * microstates whose ionised sites have the same classes are one species */
	const int *symclass;
	/* n_sites x n_sites pKa shifts added to the charge interaction of two sites (monoanion
	 * hydrogen bonds of two acids, pair_hbond.c; routes beyond the shortest, charge_dist.c),
	 * or NULL */
	const double *pair_extra;
	/* canonical ranks and stereo classes of mol's atoms (canon_rank) when pkad's own
	 * writer wrote its SMILES (smiles_write.c), else NULL: species are then written the
	 * same way, in this order or canonically per species */
	const int *rank;
	const int *scls;
} ion_input;

/* Fills r->macro, r->ph, r->charge, r->species, r->has_pi/pi, r->approximate and, when
 * opt->curves, r->curves. Returns 0 or a PRED_E* with err set. */
int ionization_fill(pred_result *r, const pred_model *m, const ion_input *in,
		    const pred_options *opt, pred_error *err);

/* Charge-interaction energy in pKa units between two unit charges `bonds` bonds apart
 * (the shift of the second site's pKa when the first is already ionised). */
double ionization_pair_shift(const pred_model *m, int bonds);
/* Share of W(d) that each further route between two charges adds (charge_dist.c). */
double ionization_route_weight(const pred_model *m);

#endif
