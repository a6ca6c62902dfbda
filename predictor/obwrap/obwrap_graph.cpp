/* SPDX-License-Identifier: MIT */
/* obwrap_graph.cpp: the cached views of a parsed molecule (atoms, bonds, rings, tetrahedral
 * centres, components) and the edits that species and normalisation make to it. */
#include "obwrap.h"
#include "obwrap_internal.hpp"

#include <openbabel/atom.h>
#include <openbabel/bond.h>
#include <openbabel/elements.h>
#include <openbabel/generic.h>
#include <openbabel/mol.h>
#include <openbabel/obiter.h>
#include <openbabel/parsmart.h>
#include <openbabel/ring.h>
#include <openbabel/stereo/cistrans.h>
#include <openbabel/stereo/stereo.h>
#include <openbabel/stereo/tetrahedral.h>

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <new>
#include <string>
#include <vector>

using namespace OpenBabel;

static int heavy_degree(OBAtom *a, int *valence)
{
	int deg = 0, val = 0;
	FOR_BONDS_OF_ATOM (b, a) {
		OBAtom *nb = b->GetNbrAtom(a);
		if (nb->GetAtomicNum() == 1)
			continue;
		deg++;
		val += (int)b->GetBondOrder();
	}
	*valence = val;
	return deg;
}

static int explicit_h(OBAtom *a)
{
	int n = 0;
	FOR_NBORS_OF_ATOM (nb, a)
		if (nb->GetAtomicNum() == 1)
			n++;
	return n;
}

/* Hybridisation counted from the bonds, not from OBAtom::GetHyb(): Open Babel's atom typer
 * switches the process locale on every call, which races between threads. A triple bond or
 * two double bonds on C/N is sp, a double or aromatic bond sp2, otherwise sp3 (and
 * four-connected S/P/Si... sp3); lone-pair atoms
 * next to a pi system (amide N, phenol O) therefore read sp3. */
static int hyb_of(OBAtom *a)
{
	int doubles = 0, triple = 0, aromatic = 0, bonds = 0;
	FOR_BONDS_OF_ATOM (b, a) {
		bonds++;
		aromatic |= b->IsAromatic() ? 1 : 0;
		doubles += b->GetBondOrder() == 2 ? 1 : 0;
		triple |= b->GetBondOrder() == 3 ? 1 : 0;
	}
	if (a->GetAtomicNum() == 1 || (bonds == 0 && a->GetImplicitHCount() == 0))
		return 0;
	int z = (int)a->GetAtomicNum();
	if (z > 10 && bonds + (int)a->GetImplicitHCount() >= 4)
		return 3; /* sulfone S, phosphate P: tetrahedral despite the double bonds */
	if (triple || (doubles >= 2 && (z == 6 || z == 7)))
		return a->IsAromatic() ? 2 : 1;
	return (doubles || aromatic || a->IsAromatic()) ? 2 : 3;
}

/* Orders the atoms of a ring along its bonds; falls back to OB's path order when the set
 * has chords (then any walk would be ambiguous). */
static std::vector<int> ring_order(OBMol &mol, const std::vector<int> &path)
{
	std::vector<int> out;
	std::vector<bool> used(path.size(), false);
	out.push_back(path[0]);
	used[0] = true;
	for (size_t step = 1; step < path.size(); step++) {
		bool found = false;
		for (size_t j = 0; j < path.size() && !found; j++) {
			if (used[j] || !mol.GetBond(out.back(), path[j]))
				continue;
			out.push_back(path[j]);
			used[j] = true;
			found = true;
		}
		if (!found)
			return path;
	}
	return out;
}

static void build_rings(obw_mol *m)
{
	m->ring_sizes.clear();
	m->ring_offsets.clear();
	m->ring_atoms.clear();
	std::vector<OBRing *> sssr = m->mol.GetSSSR();
	for (OBRing *r : sssr) {
		std::vector<int> ord = ring_order(m->mol, r->_path);
		m->ring_offsets.push_back((int)m->ring_atoms.size());
		m->ring_sizes.push_back((int)ord.size());
		for (int idx : ord)
			m->ring_atoms.push_back(idx - 1);
	}
}

static void smallest_ring_sizes(obw_mol *m)
{
	for (size_t k = 0; k < m->ring_sizes.size(); k++) {
		int size = m->ring_sizes[k];
		for (int i = 0; i < size; i++) {
			obw_atom &a = m->atoms[(size_t)m->ring_atoms[(size_t)(m->ring_offsets[k] + i)]];
			if (!a.ring_size || size < a.ring_size)
				a.ring_size = size;
		}
	}
}

static obw_atom atom_view(OBAtom *a, int orig)
{
	obw_atom v;
	memset(&v, 0, sizeof v);
	v.element = (int)a->GetAtomicNum();
	v.charge = a->GetFormalCharge();
	v.hcount = (int)a->GetImplicitHCount() + explicit_h(a);
	v.isotope = (int)a->GetIsotope();
	v.aromatic = a->IsAromatic() ? 1 : 0;
	v.in_ring = a->IsInRing() ? 1 : 0;
	v.degree = heavy_degree(a, &v.valence);
	v.hyb = hyb_of(a);
	v.radical = (int)a->GetSpinMultiplicity();
	v.orig_index = orig;
	return v;
}

/* Forgets every perception so the next query recomputes it from the current graph. */
static void reset_perception(OBMol &mol)
{
	mol.SetAromaticPerceived(false);
	mol.SetSSSRPerceived(false);
	mol.SetLSSRPerceived(false);
	mol.SetRingAtomsAndBondsPerceived(false);
	mol.SetRingTypesPerceived(false);
	mol.SetAtomTypesPerceived(false);
	mol.SetHybridizationPerceived(false);
	mol.SetClosureBondsPerceived(false);
}

/* Specified tetrahedral centres, neighbours as atom indices (-1: implicit or folded H). */
static void build_tetra(obw_mol *m)
{
	OBMol &mol = m->mol;
	m->tetra.clear();
	m->n_cistrans = 0;
	for (OBGenericData *d : mol.GetAllData(OBGenericDataType::StereoData)) {
		OBStereoBase *st = static_cast<OBStereoBase *>(d);
		if (st->GetType() == OBStereo::CisTrans &&
		    static_cast<OBCisTransStereo *>(st)->GetConfig().specified)
			m->n_cistrans++;
		if (st->GetType() != OBStereo::Tetrahedral)
			continue;
		OBTetrahedralStereo::Config cfg = static_cast<OBTetrahedralStereo *>(st)->GetConfig(
			OBStereo::Clockwise, OBStereo::ViewFrom);
		OBAtom *centre = mol.GetAtomById(cfg.center);
		if (!cfg.specified || cfg.refs.size() != 3 || !centre)
			continue;
		obw_tetra t;
		t.centre = (int)centre->GetIdx() - 1;
		unsigned long ids[4] = {cfg.from, cfg.refs[0], cfg.refs[1], cfg.refs[2]};
		for (int k = 0; k < 4; k++) {
			OBAtom *a = ids[k] == OBStereo::ImplicitRef ? nullptr : mol.GetAtomById(ids[k]);
			t.nbr[k] = a ? (int)a->GetIdx() - 1 : -1;
		}
		m->tetra.push_back(t);
	}
}

/* Views of the current graph; reset forgets the toolkit's perception first (after edits). */
void obw_rebuild_cache(obw_mol *m, bool reset)
{
	OBMol &mol = m->mol;
	m->canonical.clear();
	if (reset)
		reset_perception(mol);
	m->atoms.clear();
	m->bonds.clear();
	FOR_ATOMS_OF_MOL (a, mol)
		m->atoms.push_back(atom_view(&*a, m->orig[a->GetIdx() - 1]));
	FOR_BONDS_OF_MOL (b, mol) {
		obw_bond v;
		v.a = (int)b->GetBeginAtomIdx() - 1;
		v.b = (int)b->GetEndAtomIdx() - 1;
		v.order = (int)b->GetBondOrder();
		v.aromatic = b->IsAromatic() ? 1 : 0;
		v.in_ring = b->IsInRing() ? 1 : 0;
		m->bonds.push_back(v);
	}
	m->atom_bonds.clear();
	FOR_ATOMS_OF_MOL (a, mol)
		FOR_BONDS_OF_ATOM (b, &*a)
			m->atom_bonds.push_back((int)b->GetIdx());
	build_rings(m);
	smallest_ring_sizes(m);
	build_tetra(m);
}

/* ---- hydrogens ------------------------------------------------------------------------ */

/* An ordinary explicit hydrogen: no isotope, no charge, one bond, to a non-hydrogen. */
static bool foldable_h(OBAtom *a)
{
	if (a->GetAtomicNum() != 1 || a->GetIsotope() || a->GetFormalCharge())
		return false;
	if (a->GetExplicitDegree() != 1)
		return false;
	OBBond *b = *a->BeginBonds();
	return b->GetBondOrder() == 1 && b->GetNbrAtom(a)->GetAtomicNum() != 1;
}

/* Folds ordinary explicit hydrogens into their heavy atom; returns how many. */
size_t obw_fold_hydrogens(obw_mol *m)
{
	OBMol &mol = m->mol;
	std::vector<OBAtom *> gone;
	FOR_ATOMS_OF_MOL (a, mol)
		if (foldable_h(&*a))
			gone.push_back(&*a);
	for (OBAtom *h : gone) {
		OBAtom *heavy = (*h->BeginBonds())->GetNbrAtom(h);
		heavy->SetImplicitHCount(heavy->GetImplicitHCount() + 1);
	}
	std::vector<bool> drop(m->orig.size(), false);
	for (OBAtom *h : gone)
		drop[h->GetIdx() - 1] = true;
	std::vector<int> orig;
	for (size_t i = 0; i < drop.size(); i++)
		if (!drop[i])
			orig.push_back(m->orig[i]);
	for (size_t i = gone.size(); i-- > 0;)
		mol.DeleteAtom(gone[i], true);
	m->orig.swap(orig);
	return gone.size();
}

extern "C" size_t obw_mol_atoms(const obw_mol *m, const obw_atom **out)
{
	*out = m->atoms.data();
	return m->atoms.size();
}

extern "C" size_t obw_mol_bonds(const obw_mol *m, const obw_bond **out)
{
	*out = m->bonds.data();
	return m->bonds.size();
}

extern "C" size_t obw_mol_atom_bonds(const obw_mol *m, const int **out)
{
	*out = m->atom_bonds.data();
	return m->atom_bonds.size();
}

extern "C" size_t obw_mol_tetra(const obw_mol *m, const obw_tetra **out)
{
	*out = m->tetra.data();
	return m->tetra.size();
}

extern "C" size_t obw_mol_cistrans_count(const obw_mol *m)
{
	return m->n_cistrans;
}

/* Place of atom id among the four references of a cis/trans configuration, -1 none. */
static int ref_place(const OBCisTransStereo::Config &cfg, unsigned long id)
{
	for (size_t k = 0; k < cfg.refs.size() && k < 4; k++)
		if (cfg.refs[k] == id)
			return (int)k;
	return -1;
}

/* The facade is built without perception (perceive false): a SMILES or mol block reader
 * has stored the configurations it read, and perceiving here would run the symmetry
 * classes on every call, and from daemon threads. The places are read in the U shape
 * (refs 0, 1 on the begin atom, 2, 3 on the end atom; 0-3 and 1-2 cis) rather than with
 * OBCisTransStereo::IsCis, which answers "not cis" for the two heavy atoms of a double bond
 * whose hydrogens were drawn explicit and then folded (their places hold ImplicitRef). */
extern "C" int obw_mol_bond_cis(const obw_mol *m, int a, int b, int c, int d)
{
	try {
		int n = (int)m->atoms.size();
		if (a < 0 || b < 0 || c < 0 || d < 0 || a >= n || b >= n || c >= n || d >= n)
			return 0;
		OBMol &mol = const_cast<OBMol &>(m->mol);
		OBBond *bond = mol.GetBond(b + 1, c + 1);
		if (!bond || bond->GetBondOrder() != 2 || !mol.GetBond(a + 1, b + 1) ||
		    !mol.GetBond(c + 1, d + 1))
			return 0;
		OBStereoFacade facade(&mol, false);
		OBCisTransStereo *ct = facade.GetCisTransStereo(bond->GetId());
		if (!ct)
			return 0;
		OBCisTransStereo::Config cfg = ct->GetConfig(OBStereo::ShapeU);
		int x = ref_place(cfg, mol.GetAtom(a + 1)->GetId());
		int y = ref_place(cfg, mol.GetAtom(d + 1)->GetId());
		return cfg.specified && x >= 0 && y >= 0 && x + y == 3;
	} catch (...) {
		return 0;
	}
}

extern "C" const char *obw_element_symbol(int z)
{
	try {
		return z > 0 && z < 119 ? OBElements::GetSymbol((unsigned int)z) : "";
	} catch (...) {
		return "";
	}
}

extern "C" void obw_mol_rings(const obw_mol *m, obw_rings *out)
{
	out->n_rings = m->ring_sizes.size();
	out->sizes = m->ring_sizes.data();
	out->offsets = m->ring_offsets.data();
	out->atoms = m->ring_atoms.data();
}

static int find_root(std::vector<int> &up, int a)
{
	while (up[(size_t)a] != a)
		a = up[(size_t)a] = up[(size_t)up[(size_t)a]];
	return a;
}

/* Union-find over the bonds; a component's number is the order of its lowest atom. */
extern "C" size_t obw_mol_components(const obw_mol *m, int *comp, size_t n)
{
	size_t na = m->atoms.size();
	if (n < na)
		return 0;
	try {
		std::vector<int> up(na);
		for (size_t i = 0; i < na; i++)
			up[i] = (int)i;
		for (const obw_bond &b : m->bonds) {
			int x = find_root(up, b.a), y = find_root(up, b.b);
			if (x != y)
				up[(size_t)(x > y ? x : y)] = x < y ? x : y;
		}
		int count = 0;
		for (size_t i = 0; i < na; i++) {
			int r = find_root(up, (int)i);
			comp[i] = (size_t)r == i ? count++ : comp[r];
		}
		return (size_t)count;
	} catch (...) {
		return 0;
	}
}

extern "C" int obw_mol_keep_atoms(obw_mol *m, const unsigned char *keep, size_t n, char *msg,
				  size_t msgn)
{
	try {
		obw_thread_ready();
		if (n != m->atoms.size()) {
			obw_set_msg(msg, msgn, "keep array has %zu slots for %zu atoms", n,
				m->atoms.size());
			return E_INVAL;
		}
		std::vector<OBAtom *> gone;
		std::vector<int> orig;
		for (size_t i = 0; i < n; i++) {
			if (keep[i])
				orig.push_back(m->orig[i]);
			else
				gone.push_back(m->mol.GetAtom((int)i + 1));
		}
		for (size_t i = gone.size(); i-- > 0;)
			m->mol.DeleteAtom(gone[i], true);
		m->orig.swap(orig);
		obw_rebuild_cache(m);
		return 0;
	} catch (...) {
		obw_set_msg(msg, msgn, "cannot delete atoms");
		return E_INTERNAL;
	}
}

extern "C" int obw_mol_set_atom(obw_mol *m, int atom, int charge, int hcount)
{
	try {
		if (atom < 0 || (size_t)atom >= m->atoms.size() || hcount < 0)
			return E_INVAL;
		OBAtom *a = m->mol.GetAtom(atom + 1);
		int implicit = hcount - explicit_h(a);
		if (implicit < 0)
			return E_INVAL;
		a->SetFormalCharge(charge);
		a->SetImplicitHCount((unsigned int)implicit);
		m->canonical.clear();
		m->atoms[(size_t)atom].charge = charge;
		m->atoms[(size_t)atom].hcount = hcount;
		return 0;
	} catch (...) {
		return E_INTERNAL;
	}
}

/* A double bond that changes order loses its cis/trans configuration, which would
 * otherwise be written as '/' '\\' marks around a single bond. */
static void drop_cis_trans(OBMol &mol, OBBond *bond)
{
	unsigned long x = bond->GetBeginAtom()->GetId(), y = bond->GetEndAtom()->GetId();
	std::vector<OBGenericData *> stale;
	for (OBGenericData *d : mol.GetAllData(OBGenericDataType::StereoData)) {
		OBStereoBase *st = static_cast<OBStereoBase *>(d);
		if (st->GetType() != OBStereo::CisTrans)
			continue;
		OBCisTransStereo::Config cfg = static_cast<OBCisTransStereo *>(st)->GetConfig();
		if ((cfg.begin == x && cfg.end == y) || (cfg.begin == y && cfg.end == x))
			stale.push_back(d);
	}
	for (OBGenericData *d : stale)
		mol.DeleteData(d);
}

extern "C" int obw_mol_set_bond_order(obw_mol *m, int a, int b, int order)
{
	try {
		int n = (int)m->atoms.size();
		if (a < 0 || b < 0 || a >= n || b >= n || order < 1 || order > 3)
			return E_INVAL;
		OBBond *bond = m->mol.GetBond(a + 1, b + 1);
		if (!bond)
			return E_INVAL;
		if ((int)bond->GetBondOrder() != order)
			drop_cis_trans(m->mol, bond);
		bond->SetBondOrder(order);
		m->canonical.clear();
		for (obw_bond &v : m->bonds)
			if ((v.a == a && v.b == b) || (v.a == b && v.b == a))
				v.order = order;
		return 0;
	} catch (...) {
		return E_INTERNAL;
	}
}

extern "C" int obw_mol_refresh(obw_mol *m, char *msg, size_t msgn)
{
	try {
		obw_thread_ready();
		obw_rebuild_cache(m);
		return 0;
	} catch (const std::bad_alloc &) {
		obw_set_msg(msg, msgn, "out of memory re-perceiving molecule");
		return E_NOMEM;
	} catch (...) {
		obw_set_msg(msg, msgn, "cannot re-perceive molecule");
		return E_INTERNAL;
	}
}
