/* SPDX-License-Identifier: MIT */
/* obwrap.cpp: the thin Open Babel wrapper behind obwrap.h (with obwrap_smiles.cpp, the only
 * C++ in pkad): parsing, cached views, editing, SMARTS. */
#include "obwrap.h"
#include "obwrap_internal.hpp"
#include "smiles_check.h"

#include <openbabel/atom.h>
#include <openbabel/bond.h>
#include <openbabel/bondtyper.h>
#include <openbabel/elements.h>
#include <openbabel/generic.h>
#include <openbabel/graphsym.h>
#include <openbabel/mol.h>
#include <openbabel/obconversion.h>
#include <openbabel/oberror.h>
#include <openbabel/obiter.h>
#include <openbabel/parsmart.h>
#include <openbabel/phmodel.h>
#include <openbabel/ring.h>
#include <openbabel/stereo/cistrans.h>
#include <openbabel/stereo/tetrahedral.h>
#include <openbabel/typer.h>

#include <algorithm>
#include <cctype>
#include <clocale>
#include <cstdarg>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <mutex>
#include <new>
#include <sstream>
#include <string>
#include <vector>

using namespace OpenBabel;

/* Defined per thread in libopenbabel (THREAD_LOCAL) but not declared by its headers. */
namespace OpenBabel {
extern thread_local OBBondTyper bondtyper;
extern thread_local OBPhModel phmodel;
} // namespace OpenBabel

void obw_set_msg(char *msg, size_t msgn, const char *fmt, ...)
{
	if (!msg || !msgn)
		return;
	va_list ap;
	va_start(ap, fmt);
	vsnprintf(msg, msgn, fmt, ap);
	va_end(ap);
}

/* A short, printable excerpt of user text for messages. */
static std::string excerpt(const std::string &s)
{
	if (s.size() <= 60)
		return s;
	return s.substr(0, 57) + "...";
}

char *obw_dup_string(const std::string &s)
{
	char *p = static_cast<char *>(malloc(s.size() + 1));
	if (p)
		memcpy(p, s.c_str(), s.size() + 1);
	return p;
}

/* ---- cached views --------------------------------------------------------------------- */

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
static void rebuild_cache(obw_mol *m, bool reset = true)
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
static size_t fold_hydrogens(obw_mol *m)
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

/* ---- lifecycle ------------------------------------------------------------------------ */

static int warm_up(char *msg, size_t msgn);

static std::once_flag init_once;
static int init_status = E_INTERNAL;
static char init_msg[256];

extern "C" int obw_global_init(char *msg, size_t msgn)
{
	try {
		std::call_once(init_once, [] {
			setlocale(LC_NUMERIC, "C");
			obErrorLog.StopLogging();
			obErrorLog.SetOutputLevel(obError);
			init_status = warm_up(init_msg, sizeof init_msg);
		});
		if (init_status)
			obw_set_msg(msg, msgn, "%s", init_msg);
		return init_status;
	} catch (...) {
		obw_set_msg(msg, msgn, "open babel initialisation failed");
		return E_INTERNAL;
	}
}

extern "C" obw_ctx *obw_ctx_new(void)
{
	try {
		obw_ctx *c = new obw_ctx;
		c->smi = OBConversion::FindFormat("smi");
		c->can = OBConversion::FindFormat("can");
		c->sdf = OBConversion::FindFormat("sdf");
		if (!c->smi || !c->can || !c->sdf) {
			delete c;
			return nullptr;
		}
		return c;
	} catch (...) {
		return nullptr;
	}
}

extern "C" void obw_ctx_free(obw_ctx *c)
{
	try {
		delete c;
	} catch (...) {
	}
}

/* ---- parsing -------------------------------------------------------------------------- */

static int read_with(obw_ctx *c, OBFormat *f, const std::string &text, OBMol &mol)
{
	std::istringstream in(text);
	c->conv.SetInFormat(f);
	c->conv.SetInStream(&in, false);
	bool ok = f->ReadMolecule(&mol, &c->conv);
	c->conv.SetInStream(nullptr, false);
	return ok ? 0 : E_PARSE;
}

static int parse_smiles(obw_mol *m, obw_ctx *c, const char *text, char *msg, size_t msgn)
{
	size_t n = strcspn(text, " \t\r\n\v\f");
	std::string smi(text, n);
	if (smi.empty()) {
		obw_set_msg(msg, msgn, "empty smiles");
		return E_PARSE;
	}
	char why[160] = "";
	if (obw_smiles_check(smi.data(), smi.size(), why, sizeof why)) {
		obw_set_msg(msg, msgn, "invalid smiles '%s': %s", excerpt(smi).c_str(), why);
		return E_PARSE;
	}
	if (read_with(c, c->smi, smi, m->mol) || m->mol.NumAtoms() == 0) {
		obw_set_msg(msg, msgn, "cannot read smiles '%s' (unknown element, bad ring closure or "
				   "bracket atom)", excerpt(smi).c_str());
		return E_PARSE;
	}
	int arom = 0;
	FOR_ATOMS_OF_MOL (a, m->mol)
		arom += a->IsAromatic() ? 1 : 0;
	if (arom < obw_smiles_aromatic_count(smi.data(), smi.size())) {
		obw_set_msg(msg, msgn, "cannot kekulize the aromatic atoms of '%s'", excerpt(smi).c_str());
		return E_PARSE;
	}
	return 0;
}

/* Open Babel's OBLocale is one global object whose SetLocale/RestoreLocale keep a counter
 * and a saved-locale string without a lock; two threads inside it corrupt the heap. Two
 * things call it after start-up: the MDL reader, on every record, and the first use in each
 * thread of the typers that Open Babel keeps per thread (atom, bond and pH typers: their
 * lazy data-table Init, reached for example from stereo perception in the canonical SMILES
 * writer). Both run under this one lock: mol-block reads take it, and every entry point of
 * the wrapper that can reach a typer first calls obw_thread_ready. */
static std::mutex locale_lock;

void obw_thread_ready(void)
{
	static thread_local bool ready = false;
	if (ready)
		return;
	std::lock_guard<std::mutex> hold(locale_lock);
	OpenBabel::atomtyper.Init();
	OpenBabel::bondtyper.Init();
	OpenBabel::phmodel.Init();
	ready = true;
}

static int parse_molblock(obw_mol *m, obw_ctx *c, const char *text, char *msg, size_t msgn)
{
	int rc;
	{
		std::lock_guard<std::mutex> hold(locale_lock);
		rc = read_with(c, c->sdf, text, m->mol);
	}
	if (rc || m->mol.NumAtoms() == 0) {
		obw_set_msg(msg, msgn, "cannot read mol block (bad counts line or atom block)");
		return E_PARSE;
	}
	return 0;
}

static int parse_into(obw_mol *m, obw_ctx *c, const char *text, int format, char *msg,
		      size_t msgn)
{
	int rc = format == OBW_SMILES ? parse_smiles(m, c, text, msg, msgn)
				      : parse_molblock(m, c, text, msg, msgn);
	if (rc)
		return rc;
	m->orig.resize(m->mol.NumAtoms());
	for (size_t i = 0; i < m->orig.size(); i++)
		m->orig[i] = (int)i;
	/* the SMILES reader leaves aromaticity and rings perceived on the graph it built;
	 * perceiving them again is needed only when folding hydrogens changed that graph */
	size_t folded = fold_hydrogens(m);
	rebuild_cache(m, format != OBW_SMILES || folded > 0 || !m->mol.HasAromaticPerceived() ||
				 !m->mol.HasSSSRPerceived());
	return 0;
}

extern "C" int obw_mol_parse(obw_mol **out, obw_ctx *c, const char *text, int format,
			     char *msg, size_t msgn)
{
	*out = nullptr;
	if (!c || !text || (format != OBW_SMILES && format != OBW_MOLBLOCK)) {
		obw_set_msg(msg, msgn, "invalid argument to obw_mol_parse");
		return E_INVAL;
	}
	obw_mol *m = nullptr;
	try {
		obw_thread_ready();
		m = new obw_mol;
		int rc = parse_into(m, c, text, format, msg, msgn);
		if (rc) {
			delete m;
			return rc;
		}
		*out = m;
		return 0;
	} catch (const std::bad_alloc &) {
		delete m;
		obw_set_msg(msg, msgn, "out of memory reading molecule");
		return E_NOMEM;
	} catch (...) {
		delete m;
		obw_set_msg(msg, msgn, "open babel failed on this molecule");
		return E_INTERNAL;
	}
}

extern "C" void obw_mol_free(obw_mol *m)
{
	try {
		delete m;
	} catch (...) {
	}
}

extern "C" int obw_mol_clone(obw_mol **out, const obw_mol *m)
{
	*out = nullptr;
	try {
		obw_thread_ready();
		*out = new obw_mol(*m);
		return 0;
	} catch (const std::bad_alloc &) {
		return E_NOMEM;
	} catch (...) {
		return E_INTERNAL;
	}
}

/* ---- read access ---------------------------------------------------------------------- */

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

extern "C" int obw_mol_symmetry(obw_mol *m, int *cls, size_t n, char *msg, size_t msgn)
{
	try {
		obw_thread_ready();
		if (n != m->atoms.size()) {
			obw_set_msg(msg, msgn, "symmetry array has %zu slots for %zu atoms", n,
				m->atoms.size());
			return E_INVAL;
		}
		std::vector<unsigned int> sym;
		OBGraphSym gs(&m->mol);
		gs.GetSymmetry(sym);
		if (sym.size() != n) {
			obw_set_msg(msg, msgn, "symmetry perception failed");
			return E_INTERNAL;
		}
		for (size_t i = 0; i < n; i++)
			cls[i] = (int)sym[i];
		return 0;
	} catch (...) {
		obw_set_msg(msg, msgn, "symmetry perception failed");
		return E_INTERNAL;
	}
}

/* ---- editing -------------------------------------------------------------------------- */

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
		rebuild_cache(m);
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
		rebuild_cache(m);
		return 0;
	} catch (const std::bad_alloc &) {
		obw_set_msg(msg, msgn, "out of memory re-perceiving molecule");
		return E_NOMEM;
	} catch (...) {
		obw_set_msg(msg, msgn, "cannot re-perceive molecule");
		return E_INTERNAL;
	}
}

/* ---- SMARTS --------------------------------------------------------------------------- */

extern "C" obw_pattern *obw_pattern_parse(const char *smarts, char *msg, size_t msgn)
{
	obw_pattern *p = nullptr;
	try {
		obw_thread_ready();
		if (!smarts || !*smarts) {
			obw_set_msg(msg, msgn, "empty smarts");
			return nullptr;
		}
		p = new obw_pattern;
		if (!p->pat.Init(smarts) || p->pat.NumAtoms() == 0) {
			obw_set_msg(msg, msgn, "invalid smarts '%s'", excerpt(smarts).c_str());
			delete p;
			return nullptr;
		}
		return p;
	} catch (...) {
		delete p;
		obw_set_msg(msg, msgn, "invalid smarts '%s'", excerpt(smarts).c_str());
		return nullptr;
	}
}

extern "C" void obw_pattern_free(obw_pattern *p)
{
	try {
		delete p;
	} catch (...) {
	}
}

extern "C" int obw_pattern_atom_count(const obw_pattern *p)
{
	return (int)p->pat.NumAtoms();
}

extern "C" int obw_pattern_match(int **out, const obw_pattern *p, obw_mol *m)
{
	*out = nullptr;
	try {
		obw_thread_ready();
		/* unique by (first atom, atom set): a symmetric pattern such as the two OH of
		 * [OX2H1]C(=O)[OX2H1] gives one match per first atom, where unique-by-set
		 * matching would give one match in all */
		std::vector<std::vector<int>> all;
		if (!p->pat.Match(m->mol, all, OBSmartsPattern::All) || all.empty())
			return 0;
		size_t na = p->pat.NumAtoms();
		std::vector<int> keys, key(na); /* keys of the kept matches, na ints each */
		std::vector<size_t> kept;
		keys.reserve(all.size() * na);
		kept.reserve(all.size());
		for (size_t i = 0; i < all.size(); i++) {
			const std::vector<int> &mt = all[i];
			if (mt.size() != na)
				return E_INTERNAL;
			std::copy(mt.begin(), mt.end(), key.begin());
			std::sort(key.begin() + 1, key.end());
			bool seen = false;
			for (size_t k = 0; k < kept.size() && !seen; k++)
				seen = std::equal(key.begin(), key.end(), keys.begin() + (long)(k * na));
			if (seen)
				continue;
			keys.insert(keys.end(), key.begin(), key.end());
			kept.push_back(i);
		}
		int *v = static_cast<int *>(malloc(kept.size() * na * sizeof(int)));
		if (!v)
			return E_NOMEM;
		for (size_t k = 0; k < kept.size(); k++)
			for (size_t j = 0; j < na; j++)
				v[k * na + j] = all[kept[k]][j] - 1;
		*out = v;
		return (int)kept.size();
	} catch (const std::bad_alloc &) {
		return E_NOMEM;
	} catch (...) {
		return E_INTERNAL;
	}
}

/* ---- warm-up -------------------------------------------------------------------------- */

/* One full parse / match / symmetry / write so that Open Babel's lazily built global tables
 * (element data, typers, aromaticity model) exist before any worker thread starts. */
static const char warm_molblock[] = "\n  warm-up\n\n"
				    "  2  1  0  0  0  0  0  0  0  0999 V2000\n"
				    "    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
				    "    1.5000    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
				    "  1  2  1  0  0  0  0  0  0  0  0  0\n"
				    "M  END\n";

static int warm_up(char *msg, size_t msgn)
{
	obw_ctx *c = obw_ctx_new();
	if (!c) {
		obw_set_msg(msg, msgn, "open babel formats smi, can or sdf are missing");
		return E_INTERNAL;
	}
	obw_mol *m = nullptr, *mb = nullptr;
	obw_pattern *p = obw_pattern_parse("[OX2H1]-[CX3]=O", msg, msgn);
	int rc = p ? obw_mol_parse(&m, c, "OC(=O)c1ccc[nH+]c1C[NH3+].[Cl-]", OBW_SMILES, msg, msgn)
		   : E_INTERNAL;
	if (!rc)
		rc = obw_mol_parse(&mb, c, warm_molblock, OBW_MOLBLOCK, msg, msgn);
	if (!rc) {
		int *hits = nullptr;
		std::vector<int> cls(m->atoms.size());
		rc = obw_pattern_match(&hits, p, m) == 1 ? 0 : E_INTERNAL;
		free(hits);
		if (!rc)
			rc = obw_mol_symmetry(m, cls.data(), cls.size(), msg, msgn);
		char *can = rc ? nullptr : obw_mol_canonical(m, c, msg, msgn);
		if (!rc && !can)
			rc = E_INTERNAL;
		free(can);
	}
	if (rc && msg && !*msg)
		obw_set_msg(msg, msgn, "open babel warm-up failed");
	obw_mol_free(mb);
	obw_mol_free(m);
	obw_pattern_free(p);
	obw_ctx_free(c);
	return rc;
}
