/* SPDX-License-Identifier: MIT */
/* engine.h: private interfaces between the steps of one prediction. */
#ifndef PKAD_ENGINE_H
#define PKAD_ENGINE_H

#include <stddef.h>
#include <stdint.h>

#include "model.h"
#include "obwrap.h"
#include "result.h"
#include "smarts_screen.h"

/* Elements a SMARTS pattern needs (bit z: atomic number z), by aromaticity. */
typedef struct smarts_req {
	uint64_t aliph, arom, any;
	uint64_t h_aliph, h_arom; /* first atom: an atom of this element carrying hydrogen */
} smarts_req;

void smarts_requirements(smarts_req *r, const char *smarts);
/* The molecule's elements in the same form. */
void smarts_mol_mask(smarts_req *out, const obw_atom *atoms, size_t n);
/* Zero when the pattern cannot match a molecule with these elements. */
int smarts_may_match(const smarts_req *r, const smarts_req *mol);

struct pred_worker {
	const pred_model *m;
	obw_ctx *ctx;
	obw_pattern **site_pat;  /* one per m->sites row, compiled on first use (perceive.c) */
	obw_pattern **subst_pat; /* one per m->substs row */
	obw_pattern **corr_pat;  /* one per m->corrs row */
	smarts_req *site_req, *subst_req, *corr_req;
	smarts_screen **site_scr, **subst_scr, **corr_scr; /* NULL entries: never screened */
	int n_shared; /* distinct recursive parts of all the screens (smarts_screen_share) */
	unsigned char *corr_ok; /* corr_ok[k * n_sites + r]: correction k applies to site row r */
	int *row_corr_start, *row_corrs; /* the corrections of row r, in table order:
					  * row_corrs[row_corr_start[r] .. row_corr_start[r + 1]) */
	int *pair_corrs; /* the hbond_pair(_z) rows of the corrections, in table order */
	size_t n_pair_corrs;
};

/* The perceived molecule: graph, substituent claims and the sites found. */
typedef struct eng_site {
	int row;       /* index into m->sites */
	int atom;      /* ionizable atom (molecule index) */
	int centre;    /* centre atom of substituent effects */
	int *match;    /* atoms of the site's SMARTS match */
	int n_match;
} eng_site;

typedef struct eng_mol {
	obw_mol *mol;
	const obw_atom *atoms;
	size_t nat;
	const obw_bond *bonds;
	size_t nbonds;
	int *adj_start; /* CSR adjacency: neighbours of a in adj[adj_start[a] .. adj_start[a+1]) */
	int *adj;
	int *adj_bond;  /* bond index of each adj[] entry */
	uint32_t *ring_sizes; /* per atom, bit k: in an SSSR ring of size k */
	uint32_t *kind;       /* sx_kind of each atom */
	unsigned char *scratch; /* the screen's working memory */
	int *kind_lists;        /* the screen's atoms by kind (sx_kind_lists) */
	sx_mol screen;  /* the graph as smarts_screen reads it */
	int *group;     /* substituent row claiming each atom, -1 none */
	int *group_root; /* root atom of the claim each atom belongs to, -1 none */
	unsigned char *hetero_pi; /* atom has a double or triple bond to a heteroatom */
	obw_rings rings;
	eng_site *sites;
	size_t n_sites;
	int *dist;      /* n_sites x nat: bonds from each site's ionizable atom */
	int *qdist;     /* n_sites x nat: bonds from the site's charge (charge_dist.c) */
	double *qroute; /* n_sites x n_sites: interaction carried by further routes, pKa units */
	smarts_req elements; /* what the molecule holds, to skip hopeless patterns */
	int *symclass;   /* symmetry class per atom (identity unless shared_rows) */
	int *rank;       /* canonical ranks and stereo classes (canon_rank) of every molecule */
	int *scls;       /* with sites: ties the atom order must not decide go to the ranks */
	int shared_rows; /* two sites come from one row: they may be equivalent */
	int *corr_start; /* CSR: first atoms matched by correction k in corr_atom[..] */
	int *corr_atom;
	int *pair_param; /* n_sites x n_sites: parameter of a monoanion hydrogen-bond pair, -1 */
	double *ion_pair; /* n_sites x n_sites: Hammett pair shift of an ionised ring group, NAN */
} eng_mol;

/* Breadth-first bond counts from atom `from` into dist (-1: not connected); queue holds nat. */
void eng_bfs(const eng_mol *e, int from, int *dist, int *queue);

/* The exocyclic =O or =S of ring atom c (the C=O of a ring amide), or -1 (charge_dist.c). */
int eng_ring_oxo_atom(const eng_mol *e, int c);
/* Fills e->qdist from e->dist: an azinium's charge is shared with its ortho and para ring
 * carbons, so its row counts the bonds from those plus one to a base site where shorter. */
int eng_charge_distances(eng_mol *e, const pred_model *m);
/* Bonds between the charges of sites i and j (the shorter of the two rows' counts). */
int eng_charge_bonds(const int *qdist, size_t nat, size_t i, int atom_i, size_t j, int atom_j);
/* Fills e->qroute for the sites as they stand (call again after dropping sites): the
 * interaction that routes between two sites other than the shortest carry (charge_dist.c). */
int eng_charge_routes(eng_mol *e, const pred_model *m);
/* Interaction of the charges of sites i and j: W of their charge distance plus the further
 * routes of e->qroute; 0 for one atom or separate fragments. */
double eng_pair_shift(const eng_mol *e, const pred_model *m, size_t i, size_t j);
/* Share of that interaction the pair takes: the product of the sites' charge scales. */
double eng_pair_scale(const eng_mol *e, const pred_model *m, size_t i, size_t j);

/* Builds graph, claims and sites from a normalised molecule. */
int eng_perceive(eng_mol *e, pred_worker *w, obw_mol *mol, pred_error *err);
void eng_free(eng_mol *e);

/* Neighbours of atom a. */
static inline const int *eng_nbrs(const eng_mol *e, int a, int *n)
{
	*n = e->adj_start[a + 1] - e->adj_start[a];
	return e->adj + e->adj_start[a];
}

/* Accumulates the terms of one site; the engine then copies them into the result. */
enum { TERMS_MAX = 64 };
typedef struct term_list {
	size_t n;
	pred_term t[TERMS_MAX];
	int param[TERMS_MAX];     /* parameter scaling the term, -1 for a constant */
	double feature[TERMS_MAX];
	char detail[TERMS_MAX][96];
	double extra_var; /* uncertainty added in quadrature by extrapolation */
	int n_generic;
} term_list;

/* Adds a term; value = param value * feature (param >= 0) or feature (param < 0). */
void terms_add(term_list *tl, const pred_model *m, const char *term, int param, double feature,
	       const char *fmt, ...);
/* terms_add with a fixed detail text (no formatting). */
void terms_add_text(term_list *tl, const pred_model *m, const char *term, int param,
		    double feature, const char *text);
double terms_sum(const term_list *tl);

/* Hammett ring, Taft walk and corrections of site s. */
void eng_site_effects(term_list *tl, const eng_mol *e, const pred_worker *w, const eng_site *s);
/* Shared by effects.c and ionised_pairs.c: whether atom is one of site s's own atoms; the
 * place of atom in ring k (-1 when absent); the Hammett ring of s (its index, -1 none; *ipso
 * its atom bonded to or at the centre; seen, queue, depth clear nat+1 scratch arrays); the
 * Hammett position (2 ortho, 3 meta, 4 para) of place j of ring k from the ipso place i0. */
int eng_in_match(const eng_site *s, int atom);
int eng_ring_index_of(const obw_rings *R, size_t k, int atom);
int eng_hammett_ring(const eng_mol *e, const pred_model *m, const eng_site *s, int *ipso,
		     unsigned char *seen, int *queue, int *depth);
int eng_ring_position(const eng_mol *e, const eng_site *s, size_t k, int i0, int j);

/* Substituent constants of a group (tabulated, or estimated from element and charge). */
typedef struct sigmas {
	double m, p, p_minus, p_plus, star;
	const char *label;
	int generic; /* 0 tabulated, 1 estimated from element and charge */
} sigmas;

/* Also shared with fused_effects.c (effects.c): whether ring k is an aromatic six-ring;
 * whether atoms a and x share a ring other than ring k (fusion); the constants of the group
 * rooted at x; marks the group of x as counted in seen; the inductive walk of a plain sp3
 * carbon x on the ring at position pos (global.alkyl_inductive). */
int eng_ring_is_aromatic6(const eng_mol *e, size_t k);
int eng_fused_with(const eng_mol *e, size_t k, int a, int x);
void eng_group_sigmas(sigmas *g, const eng_mol *e, const pred_model *m, int x);
void eng_mark_group(unsigned char *seen, const eng_mol *e, int x);
void eng_alkyl_c_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			 const eng_site *s, int x, int pos, unsigned char *seen, int *queue,
			 int *depth);
/* The groups on a ring fused to Hammett ring k of site s: benzo rings of quinoline-type ring
 * N, aromatic five-rings of purine-type N (fused_effects.c). */
void eng_fused_ring_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			    const eng_site *s, size_t k, unsigned char *seen);
void eng_fused5_ring_effects(term_list *tl, const eng_mol *e, const pred_model *m,
			     const eng_site *s, size_t k, unsigned char *seen);
/* Fills e->ion_pair: where an acid site's group sits meta or para on the Hammett ring of a
 * site with a higher micro value (it ionises first), the pair shift is rho x (sigma of the
 * neutral group - sigma of its ionised row), which replaces the charge interaction. */
int eng_ionised_pairs(eng_mol *e, const pred_model *m, const double *micro);

/* Fills e->pair_param from the hbond_pair(_z) and charge_pair rows of corrections.tsv
 * (pair_hbond.c). */
int eng_pair_hbonds(eng_mol *e, const pred_worker *w);
/* 1 when parameter param is that of a charge_pair row (pair_hbond.c). */
int eng_pair_is_charge(const pred_model *m, int param);
/* 1 unless correction k is an hbond_pair_z row that no other site pairs with site i (a
 * Z row adds its value to a site only with a cis partner; pair_hbond.c). */
int eng_pair_row_holds(const eng_mol *e, const pred_worker *w, size_t k, size_t i);
/* Indices of the hbond_pair rows of m's corrections, in table order, into out (room for
 * m->n_corrs); returns the count. */
size_t eng_pair_rows(int *out, const pred_model *m);

/* Stepwise statistical and interaction terms (see DEVELOPERS.md): a titration from the fully
 * protonated form, each step ionising the site of lowest effective pKa. tls[i] holds the
 * terms of e->sites[i] and gains the two terms; symclass gives atom symmetry classes. */
int eng_stepwise(term_list *tls, const eng_mol *e, const pred_model *m, const int *symclass);

/* Normalisation and tautomer step on the parsed molecule; warnings go to r. */
int eng_normalise(pred_result *r, obw_mol *mol, obw_ctx *ctx, pred_error *err);

#endif
