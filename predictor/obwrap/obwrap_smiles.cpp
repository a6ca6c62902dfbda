// SPDX-License-Identifier: MIT
// obwrap_smiles.cpp: SMILES writing of the wrapper: canonical SMILES with the atom order it
// used, and microspecies written by rewriting the changed atoms' tokens.
#include "obwrap_internal.hpp"

#include <openbabel/atom.h>
#include <openbabel/elements.h>
#include <openbabel/generic.h>

#include <cctype>
#include <cstdlib>
#include <cstring>
#include <sstream>

using namespace OpenBabel;


/* The writer's "O" option leaves the output order of the atoms on the molecule. */
static void keep_order(obw_mol *m)
{
	m->canonical_order.clear();
	OBPairData *d = dynamic_cast<OBPairData *>(m->mol.GetData("SMILES Atom Order"));
	if (!d)
		return;
	std::istringstream is(d->GetValue());
	int idx;
	while (is >> idx)
		m->canonical_order.push_back(idx - 1);
	m->mol.DeleteData(d);
}

static std::string write_canonical(obw_mol *m, obw_ctx *c)
{
	std::ostringstream os;
	c->conv.SetOutFormat(c->can);
	c->conv.AddOption("O", OBConversion::OUTOPTIONS);
	c->conv.SetOutStream(&os, false);
	bool ok = c->can->WriteMolecule(&m->mol, &c->conv);
	c->conv.SetOutStream(nullptr, false);
	c->conv.RemoveOption("O", OBConversion::OUTOPTIONS);
	if (!ok)
		return std::string();
	std::string s = os.str();
	s = s.substr(0, s.find_first_of(" \t\r\n"));
	m->canonical = s;
	keep_order(m);
	return s;
}

/* A written SMILES handed out as a malloc'd copy; NULL with msg set when empty. */
static char *smiles_out(const std::string &s, const char *what, char *msg, size_t msgn)
{
	if (s.empty()) {
		obw_set_msg(msg, msgn, "cannot write %s", what);
		return nullptr;
	}
	char *p = obw_dup_string(s);
	if (!p)
		obw_set_msg(msg, msgn, "out of memory writing smiles");
	return p;
}

extern "C" char *obw_mol_canonical(obw_mol *m, obw_ctx *c, char *msg, size_t msgn)
{
	try {
		obw_thread_ready();
		return smiles_out(write_canonical(m, c), "canonical smiles", msg, msgn);
	} catch (...) {
		obw_set_msg(msg, msgn, "cannot write canonical smiles");
		return nullptr;
	}
}

/* Length of the atom token at s[i] ('[...]' or an organic-subset symbol), 0 if none. */
static size_t atom_token(const std::string &s, size_t i)
{
	char ch = s[i];
	if (ch == '[') {
		size_t close = s.find(']', i);
		return close == std::string::npos ? 0 : close - i + 1;
	}
	if ((ch == 'C' && i + 1 < s.size() && s[i + 1] == 'l') ||
	    (ch == 'B' && i + 1 < s.size() && s[i + 1] == 'r'))
		return 2;
	return ch && std::strchr("BCNOPSFIbcnops*", ch) ? 1 : 0;
}

/* Bracket form of an atom token with a new hydrogen count and charge; isotope and
 * chirality marks of the old token are kept. */
static std::string retoken(const std::string &tok, OBAtom *a, int h, int charge)
{
	std::string body = tok[0] == '[' ? tok.substr(1, tok.size() - 2) : tok;
	size_t i = 0;
	std::string iso, sym, chir;
	while (i < body.size() && isdigit((unsigned char)body[i]))
		iso += body[i++];
	sym += body[i++];
	if (i < body.size() && islower((unsigned char)body[i]) && isupper((unsigned char)sym[0]) &&
	    std::string("lrieag").find(body[i]) != std::string::npos &&
	    OBElements::GetAtomicNum((sym + body[i]).c_str()) == a->GetAtomicNum())
		sym += body[i++];
	while (i < body.size() && body[i] == '@')
		chir += body[i++];
	std::string out = "[" + iso + sym + chir;
	if (h > 0)
		out += h > 1 ? "H" + std::to_string(h) : "H";
	if (charge)
		out += (charge > 0 ? "+" : "-") +
		       (std::abs(charge) > 1 ? std::to_string(std::abs(charge)) : "");
	return out + "]";
}

/* The cached canonical SMILES with the listed atoms' tokens rewritten; "" when the cache
 * does not cover the molecule. */
static std::string edit_canonical(obw_mol *m, const int *atom, const int *dq, size_t n)
{
	const std::string &s = m->canonical;
	if (s.empty() || m->canonical_order.size() != m->atoms.size())
		return std::string();
	std::vector<int> change(m->atoms.size(), 0);
	for (size_t k = 0; k < n; k++)
		change[(size_t)atom[k]] += dq[k];
	std::string out;
	size_t tok = 0;
	for (size_t i = 0; i < s.size();) {
		size_t len = atom_token(s, i);
		if (!len) {
			out += s[i++];
			continue;
		}
		if (tok >= m->canonical_order.size())
			return std::string();
		int idx = m->canonical_order[tok++], d = change[(size_t)idx];
		const obw_atom &v = m->atoms[(size_t)idx];
		out += d ? retoken(s.substr(i, len), m->mol.GetAtom(idx + 1), v.hcount + d,
				   v.charge + d)
			 : s.substr(i, len);
		i += len;
	}
	return tok == m->canonical_order.size() ? out : std::string();
}

/* Writes m with each atom[k] changed by dq[k] in charge and hydrogen count, then restores
 * m: no copy and no re-perception, so one microspecies costs one SMILES write. */
static std::string write_edited(obw_mol *m, obw_ctx *c, const int *atom, const int *dq,
				size_t n, bool canonical)
{
	std::vector<std::pair<int, unsigned int>> saved;
	for (size_t k = 0; k < n; k++) {
		OBAtom *a = m->mol.GetAtom(atom[k] + 1);
		saved.emplace_back(a->GetFormalCharge(), a->GetImplicitHCount());
		int h = (int)a->GetImplicitHCount() + dq[k];
		a->SetFormalCharge(a->GetFormalCharge() + dq[k]);
		a->SetImplicitHCount((unsigned int)(h < 0 ? 0 : h));
	}
	OBFormat *f = canonical ? c->can : c->smi;
	std::ostringstream os;
	c->conv.SetOutFormat(f);
	c->conv.SetOutStream(&os, false);
	bool ok = f->WriteMolecule(&m->mol, &c->conv);
	c->conv.SetOutStream(nullptr, false);
	for (size_t k = n; k-- > 0;) {
		OBAtom *a = m->mol.GetAtom(atom[k] + 1);
		a->SetFormalCharge(saved[k].first);
		a->SetImplicitHCount(saved[k].second);
	}
	if (!ok)
		return std::string();
	std::string s = os.str();
	return s.substr(0, s.find_first_of(" \t\r\n"));
}

extern "C" char *obw_mol_smiles_edited(obw_mol *m, obw_ctx *c, const int *atom, const int *dq,
				       size_t n, int canonical, char *msg, size_t msgn)
{
	try {
		obw_thread_ready();
		for (size_t k = 0; k < n; k++)
			if (atom[k] < 0 || (size_t)atom[k] >= m->atoms.size()) {
				obw_set_msg(msg, msgn, "atom %d out of range", atom[k]);
				return nullptr;
			}
		bool unchanged = true;
		for (size_t k = 0; k < n; k++)
			unchanged = unchanged && dq[k] == 0;
		/* the molecule as it is: its canonical SMILES is already written */
		std::string s = canonical ? (unchanged ? m->canonical : std::string())
					  : edit_canonical(m, atom, dq, n);
		if (s.empty())
			s = write_edited(m, c, atom, dq, n, canonical != 0);
		return smiles_out(s, "smiles", msg, msgn);
	} catch (...) {
		obw_set_msg(msg, msgn, "cannot write smiles");
		return nullptr;
	}
}

