/* SPDX-License-Identifier: MIT */
/* obwrap.cpp: the thin Open Babel wrapper behind obwrap.h (with obwrap_graph.cpp,
 * obwrap_pattern.cpp and obwrap_smiles.cpp, the only C++ in pkad): start-up, contexts,
 * parsing, the per-thread typers and the locale lock, symmetry classes. */
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
std::string obw_excerpt(const std::string &s)
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
		obw_set_msg(msg, msgn, "invalid smiles '%s': %s", obw_excerpt(smi).c_str(), why);
		return E_PARSE;
	}
	if (read_with(c, c->smi, smi, m->mol) || m->mol.NumAtoms() == 0) {
		obw_set_msg(msg, msgn, "cannot read smiles '%s' (unknown element, bad ring closure or "
				   "bracket atom)", obw_excerpt(smi).c_str());
		return E_PARSE;
	}
	int arom = 0;
	FOR_ATOMS_OF_MOL (a, m->mol)
		arom += a->IsAromatic() ? 1 : 0;
	if (arom < obw_smiles_aromatic_count(smi.data(), smi.size())) {
		obw_set_msg(msg, msgn, "cannot kekulize the aromatic atoms of '%s'", obw_excerpt(smi).c_str());
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
	size_t folded = obw_fold_hydrogens(m);
	obw_rebuild_cache(m, format != OBW_SMILES || folded > 0 || !m->mol.HasAromaticPerceived() ||
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


/* ---- SMARTS --------------------------------------------------------------------------- */


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
