/* SPDX-License-Identifier: MIT */
/* charge_dist.c: bonds from the charge of each site and the routes between two charges, the
 * geometry the charge interaction uses. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "engine.h"
#include "ionization.h"

/* A base site on an aromatic N of a six-membered ring with two ring neighbours: its cation
 * is an azinium, whose positive charge is shared by N1 and the ring atoms ortho and para to
 * it (C2, C6, C4 in the resonance forms of the pyridinium ion; common practice). */
static int is_azine_n(const eng_mol *e, const pred_model *m, const eng_site *s)
{
	const obw_atom *a = &e->atoms[s->atom];
	return m->sites[s->row].kind == PRED_BASE && a->element == 7 && a->aromatic &&
	       a->degree == 2 && (e->ring_sizes[s->atom] & (1u << 6));
}

static int in_six_ring(const eng_mol *e, int a)
{
	return e->atoms[a].aromatic && (e->ring_sizes[a] & (1u << 6));
}

/* Only a ring carbon takes a share: the form with the charge on an ortho or para ring N
 * (pyrazine, pyridazine) is a nitrenium ion and no real contributor. */
static int takes_charge(const eng_mol *e, int a)
{
	return e->atoms[a].element == 6;
}

/* Atoms ortho and para to ring N n (out[0..2]); returns how many were found. The para atom
 * closes the ring n-o1-x-p-y-o2 with both ortho atoms. */
static int ortho_para(const eng_mol *e, int n, int out[3])
{
	int k = 0, nn;
	const int *nb = eng_nbrs(e, n, &nn);
	for (int i = 0; i < nn && k < 2; i++)
		if (in_six_ring(e, nb[i]))
			out[k++] = nb[i];
	if (k < 2)
		return k;
	int n1, n2, n3, n4;
	const int *a1 = eng_nbrs(e, out[0], &n1);
	for (int i = 0; i < n1; i++) {
		if (a1[i] == n || !in_six_ring(e, a1[i]))
			continue;
		const int *a2 = eng_nbrs(e, a1[i], &n2);
		for (int j = 0; j < n2; j++) {
			const int *a3 = eng_nbrs(e, out[1], &n3);
			for (int q = 0; q < n3; q++) {
				if (a3[q] == n || a2[j] == out[0] || !in_six_ring(e, a2[j]))
					continue;
				const int *a4 = eng_nbrs(e, a3[q], &n4);
				for (int r = 0; r < n4; r++)
					if (a4[r] == a2[j]) {
						out[2] = a2[j];
						return 3;
					}
			}
		}
	}
	return 2;
}

/* Row i of e->qdist: the site's own distances, and for an azinium N the distance to the
 * atom of a base site through an ortho atom plus one bond, or through the para atom plus two,
 * where that is shorter (a share of the charge one bond further away: W(d + 1) = 0.66 W(d);
 * the para carbon lies farther from N1 and the field it carries is weaker: on the train
 * split, squared error of the tier A rows 4,173 with the para atom at plus one, 4,165 at plus
 * two, handbook rows 133.3 both; 2026-12-02). Acid partners keep the
 * N1 distance: an anion on the ring is already counted by its ionic sigma (and the
 * charge_counted_once rows cancel W by the N1 distance), and on the train split spreading
 * towards anions too was worse (squared error of the tier A and handbook rows 8,930 with
 * base partners only, 8,955 with all; 9,084 without the spread). */
static void charge_row(eng_mol *e, const pred_model *m, size_t i, int *tmp, int *queue)
{
	int *row = e->qdist + i * e->nat, at[3];
	const int *own = e->dist + i * e->nat;
	for (size_t a = 0; a < e->nat; a++)
		row[a] = own[a];
	if (!is_azine_n(e, m, &e->sites[i]))
		return;
	int k = ortho_para(e, e->sites[i].atom, at);
	for (int c = 0; c < k; c++) {
		if (!takes_charge(e, at[c]))
			continue;
		eng_bfs(e, at[c], tmp, queue);
		for (size_t j = 0; j < e->n_sites; j++) {
			int a = e->sites[j].atom;
			if (j == i || m->sites[e->sites[j].row].kind != PRED_BASE)
				continue;
			int via = tmp[a] + (c == 2 ? 2 : 1);
			if (tmp[a] >= 0 && row[a] > 0 && via < row[a])
				row[a] = via;
		}
	}
}

/* The exocyclic =O or =S of ring carbon c (the C=O of a ring amide), or -1. */
int eng_ring_oxo_atom(const eng_mol *e, int c)
{
	int n;
	const int *nb = eng_nbrs(e, c, &n);
	for (int k = 0; k < n; k++) {
		const obw_atom *o = &e->atoms[nb[k]];
		if ((o->element == 8 || o->element == 16) && o->degree == 1 && o->hcount == 0 &&
		    o->charge == 0 && !o->in_ring)
			return nb[k];
	}
	return -1;
}

/* A ring =N- (two-connected, no H, uncharged) of an aromatic six-ring. */
static int is_ring_imine_n(const obw_atom *a)
{
	return a->element == 7 && a->aromatic && a->degree == 2 && a->hcount == 0 &&
	       a->charge == 0;
}

/* Rings of e->rings that hold atom x. */
static int rings_holding(const eng_mol *e, int x)
{
	const obw_rings *R = &e->rings;
	int n = 0;
	for (size_t k = 0; k < R->n_rings; k++)
		for (int j = 0; j < R->sizes[k]; j++)
			n += R->atoms[R->offsets[k] + (size_t)j] == x;
	return n;
}

/* A ring N-H beside one ring C=O and beside a fusion carbon that carries no other N (N5-H of
 * a 5H-pteridin-6-one): across the fusion its anion is an amide anion, not an amidinate
 * (N-C-N, the N8 anion of a pteridine-2,4,7-trione beside N1), and its charge lies on the
 * O, so it is counted from there. The lumazin-6-one second steps (1,3,7-trimethyl- 9.9,
 * the 2,4,6-trioxo-7-carboxylic acids 9.63-10.2, Serjeant & Dempsey 1979 via IUPAC dataset,
 * train rows) read 1.4-2.6 high with the N5-H distance (d 3) to N1 or N3. Returns the O. */
static int fused_amide_oxygen(const eng_mol *e, int n)
{
	int nn, o = -1, fused = 0;
	const int *nb = eng_nbrs(e, n, &nn);
	for (int i = 0; i < nn; i++) {
		int c = nb[i], x = eng_ring_oxo_atom(e, c), nc;
		if (e->atoms[c].element != 6 || !e->atoms[c].aromatic)
			return -1;
		if (x >= 0) {
			if (o >= 0)
				return -1; /* an imide N */
			o = x;
			continue;
		}
		if (rings_holding(e, c) < 2)
			continue;
		const int *cb = eng_nbrs(e, c, &nc);
		for (int k = 0; k < nc; k++)
			if (cb[k] != n && e->atoms[cb[k]].element == 7)
				return -1;
		fused = 1;
	}
	return fused ? o : -1;
}

/* Where the anion of a ring N-H acid site matched as the N alone (4-pyridone type) sits when
 * its six-ring holds a ring =N- meta to it and beside the C=O para to it (N1-H, N3, C4=O of
 * a pyrimidin-4(1H)-one): the anion is that of the 3H tautomer, an amide anion on N3 and O4,
 * so its charge is counted from N3. Pteridine-4,7-diones drawn 1H,8H (4,7-dihydroxy-
 * pteridine 6.08 / 9.62, 6-formyl- 5.93 / 9.31, Serjeant & Dempsey 1979 via IUPAC dataset,
 * train rows) took the interaction of N1, two bonds from N8, and read the second step 2.3-2.7
 * too high. Of two such N the lower canonical rank. An amide N-H beside a fusion carbon
 * without a second N counts from its O (above); -1 for other sites. */
static int tautomer_charge_atom(const eng_mol *e, const pred_model *m, const eng_site *s)
{
	const obw_atom *a = &e->atoms[s->atom];
	if (m->sites[s->row].kind != PRED_ACID || a->element != 7 || !a->aromatic ||
	    a->hcount == 0)
		return -1;
	int o = fused_amide_oxygen(e, s->atom);
	if (o >= 0 || s->n_match != 1)
		return o;
	const obw_rings *R = &e->rings;
	int best = -1;
	for (size_t k = 0; k < R->n_rings; k++) {
		if (R->sizes[k] != 6)
			continue;
		const int *ra = R->atoms + R->offsets[k];
		int i0 = -1;
		for (int j = 0; j < 6; j++)
			if (ra[j] == s->atom)
				i0 = j;
		if (i0 < 0 || eng_ring_oxo_atom(e, ra[(i0 + 3) % 6]) < 0 ||
		    e->atoms[ra[(i0 + 3) % 6]].element != 6)
			continue;
		for (int d = 2; d <= 4; d += 2) {
			int x = ra[(i0 + d) % 6];
			if (is_ring_imine_n(&e->atoms[x]) &&
			    (best < 0 || (e->rank && e->rank[x] < e->rank[best])))
				best = x;
		}
	}
	return best;
}

/* Moves the charge of such sites to their tautomer's N for the interaction with the other
 * acid sites: both rows of each pair count the bonds between the two charges. Base partners
 * keep the N-H distance (an azinium beside the anion is the neutral tautomer itself).
 * Returns 0 or PRED_ENOMEM. */
static int tautomer_charges(eng_mol *e, const pred_model *m, int *tmp, int *queue)
{
	size_t n = e->n_sites, nat = e->nat;
	int *at = malloc((n + 1) * sizeof *at), any = 0;
	if (!at)
		return PRED_ENOMEM;
	for (size_t i = 0; i < n; i++) {
		int x = tautomer_charge_atom(e, m, &e->sites[i]);
		any |= x >= 0;
		at[i] = x >= 0 ? x : e->sites[i].atom;
	}
	for (size_t i = 0; any && i < n; i++) {
		if (at[i] == e->sites[i].atom)
			continue;
		eng_bfs(e, at[i], tmp, queue);
		for (size_t j = 0; j < n; j++) {
			if (j == i || m->sites[e->sites[j].row].kind != PRED_ACID)
				continue;
			int d = tmp[at[j]];
			e->qdist[i * nat + (size_t)e->sites[j].atom] = d;
			e->qdist[j * nat + (size_t)e->sites[i].atom] = d;
		}
	}
	free(at);
	return 0;
}

int eng_charge_distances(eng_mol *e, const pred_model *m)
{
	e->qdist = malloc((e->n_sites * e->nat + 1) * sizeof *e->qdist);
	int *tmp = malloc((e->nat + 1) * sizeof *tmp);
	int *queue = malloc((e->nat + 1) * sizeof *queue);
	int rc = e->qdist && tmp && queue ? 0 : PRED_ENOMEM;
	for (size_t i = 0; !rc && i < e->n_sites; i++)
		charge_row(e, m, i, tmp, queue);
	if (!rc)
		rc = tautomer_charges(e, m, tmp, queue);
	free(tmp);
	free(queue);
	return rc;
}

int eng_charge_bonds(const int *qdist, size_t nat, size_t i, int atom_i, size_t j, int atom_j)
{
	int dij = qdist[i * nat + (size_t)atom_j], dji = qdist[j * nat + (size_t)atom_i];
	return dij < dji ? dij : dji; /* both -1 when not connected, 0 for one atom */
}

/* Routes between two charged ring atoms: the shortest carries W(d) as before; up to
 * ROUTE_MAX - 1 further routes through saturated ring atoms (the second and third N-C-C-N of
 * piperazine and DABCO) each add route_weight * W(their length), the classical sum over the
 * paths of a field effect with a share below one chosen on the train split (params.tsv).
 * Not counted: routes through aromatic atoms (a ring's share of a charge is already in the
 * ionic sigma and aza terms of the Hammett ring) or other sp2 atoms, and charges outside
 * the ring (both moved train rows the wrong way, DEVELOPERS.md). Beyond ROUTE_MAX_BONDS
 * bonds the term is small. */
#define ROUTE_MAX 3
#define ROUTE_MAX_BONDS 10

/* An sp3 atom: a further route counts only through saturated bridges. */
static int is_saturated(const eng_mol *e, int x)
{
	return !e->atoms[x].aromatic && e->atoms[x].hyb == 3;
}

typedef struct route_work {
	unsigned char *blocked;
	unsigned char *shared; /* on every route from a to b (cut atoms between them) */
	int *par;
	int *queue;
} route_work;

/* Breadth-first from a over unblocked atoms; the bond count to b (-1 when unreachable), with
 * par[] the parent of each reached atom. */
static int route_bfs(const eng_mol *e, route_work *rw, int a, int b)
{
	for (size_t x = 0; x < e->nat; x++)
		rw->par[x] = -2;
	int head = 0, tail = 0;
	rw->par[a] = -1;
	rw->queue[tail++] = a;
	while (head < tail && rw->par[b] == -2) {
		int x = rw->queue[head++], n;
		const int *nb = eng_nbrs(e, x, &n);
		for (int j = 0; j < n; j++)
			if (rw->par[nb[j]] == -2 && !rw->blocked[nb[j]]) {
				rw->par[nb[j]] = x;
				rw->queue[tail++] = nb[j];
			}
	}
	if (rw->par[b] == -2)
		return -1;
	int len = 0;
	for (int x = b; x != a; x = rw->par[x])
		len++;
	return len;
}

/* The shortest route from a to b whose interior atoms are all saturated (in par[]; its
 * length, -1 when there is none); leaves those other atoms blocked. */
static int saturated_route(const eng_mol *e, route_work *rw, int a, int b)
{
	for (size_t x = 0; x < e->nat; x++)
		rw->blocked[x] = !is_saturated(e, (int)x) && (int)x != a && (int)x != b;
	return route_bfs(e, rw, a, b);
}

/* Marks the interior atoms of the route just found that every route must pass (an atom in
 * no ring always is one; a ring atom when blocking it alone cuts a from b). */
static void mark_shared(const eng_mol *e, route_work *rw, int a, int b, int *path, int len)
{
	int k = 0;
	for (int x = rw->par[b]; x != a; x = rw->par[x])
		path[k++] = x;
	for (int q = 0; q < k && q < len; q++) {
		int v = path[q];
		rw->shared[v] = !e->atoms[v].in_ring;
		if (rw->shared[v])
			continue;
		rw->blocked[v] = 1;
		rw->shared[v] = route_bfs(e, rw, a, b) < 0;
		rw->blocked[v] = 0;
	}
}

/* Blocks the interior atoms of the route in par[] that other routes may avoid; returns
 * how many it blocked (0: the route adds nothing new). */
static int block_route(route_work *rw, int a, int b)
{
	int k = 0;
	for (int x = rw->par[b]; x != a; x = rw->par[x])
		if (!rw->shared[x] && !rw->blocked[x]) {
			rw->blocked[x] = 1;
			k++;
		}
	return k;
}

/* Extra interaction of sites i and j from their routes beyond the shortest, pKa units. */
static double extra_routes(const eng_mol *e, const pred_model *m, route_work *rw, int *path,
			   int a, int b)
{
	if (!e->atoms[a].in_ring || !e->atoms[b].in_ring)
		return 0;
	memset(rw->blocked, 0, e->nat);
	memset(rw->shared, 0, e->nat);
	int len = route_bfs(e, rw, a, b);
	if (len < 2 || len > ROUTE_MAX_BONDS)
		return 0;
	/* of equally short routes the saturated one is the shortest route, so that a route
	 * through aromatic atoms never counts as a further one (1,2,3,4-tetrahydroquinoxaline:
	 * the ethano bridge and the benzo ring join its two N by 3 bonds each) and the breadth-
	 * first order of the atoms does not decide */
	int saturated = saturated_route(e, rw, a, b) == len;
	memset(rw->blocked, 0, e->nat);
	if (!saturated)
		route_bfs(e, rw, a, b);
	mark_shared(e, rw, a, b, path, len);
	/* mark_shared reused par[]: the same route again */
	if (saturated)
		saturated_route(e, rw, a, b);
	else
		route_bfs(e, rw, a, b);
	memset(rw->blocked, 0, e->nat);
	if (!block_route(rw, a, b))
		return 0;
	for (size_t x = 0; x < e->nat; x++)
		rw->blocked[x] |= !is_saturated(e, (int)x) && !rw->shared[x] && (int)x != a &&
				  (int)x != b;
	double sum = 0;
	for (int r = 1; r < ROUTE_MAX; r++) {
		int d = route_bfs(e, rw, a, b);
		if (d < 0 || !block_route(rw, a, b))
			break;
		sum += ionization_pair_shift(m, d);
	}
	return sum * ionization_route_weight(m);
}

int eng_charge_routes(eng_mol *e, const pred_model *m)
{
	size_t n = e->n_sites;
	free(e->qroute);
	e->qroute = calloc(n * n + 1, sizeof *e->qroute);
	route_work rw = {malloc(e->nat + 1), malloc(e->nat + 1),
			 malloc((e->nat + 1) * sizeof(int)), malloc((e->nat + 1) * sizeof(int))};
	int *path = malloc((e->nat + 1) * sizeof *path);
	int rc = e->qroute && rw.blocked && rw.shared && rw.par && rw.queue && path ? 0
										    : PRED_ENOMEM;
	for (size_t i = 0; !rc && i < n; i++)
		for (size_t j = i + 1; j < n; j++) {
			double x = extra_routes(e, m, &rw, path, e->sites[i].atom, e->sites[j].atom);
			e->qroute[i * n + j] = e->qroute[j * n + i] = x;
		}
	free(rw.blocked);
	free(rw.shared);
	free(rw.par);
	free(rw.queue);
	free(path);
	return rc;
}

/* Share of W that a pair of sites takes: the product of their rows' charge scales, so that
 * the pair shift stays one number for both steps (the free energy of the state with both
 * charges) and each end of the pair counts its own charge. An alkanethiolate's charge sits
 * on the large sulfur at the end of a C-S bond of 1.82 A (C-C 1.54, C-N 1.47, C-O 1.43;
 * common practice), so the bond count puts it nearer the other charge than it is; the
 * dithiols and aminothiols of the train split ionise their second site at about 0.8 x 0.8
 * and 0.8 of the full W (sites.tsv, thiol). */
double eng_pair_scale(const eng_mol *e, const pred_model *m, size_t i, size_t j)
{
	return m->sites[e->sites[i].row].charge_scale * m->sites[e->sites[j].row].charge_scale;
}

double eng_pair_shift(const eng_mol *e, const pred_model *m, size_t i, size_t j)
{
	if (e->ion_pair && !isnan(e->ion_pair[i * e->n_sites + j]))
		return e->ion_pair[i * e->n_sites + j];
	int d = eng_charge_bonds(e->qdist, e->nat, i, e->sites[i].atom, j, e->sites[j].atom);
	if (d <= 0)
		return 0;
	return eng_pair_scale(e, m, i, j) *
	       (ionization_pair_shift(m, d) + (e->qroute ? e->qroute[i * e->n_sites + j] : 0));
}
