/* SPDX-License-Identifier: MIT */
/* obwrap_pattern.cpp: SMARTS patterns through Open Babel (parse, atom count, unique matches). */
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
#include <openbabel/stereo/tetrahedral.h>

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <new>
#include <string>
#include <vector>

using namespace OpenBabel;

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
			obw_set_msg(msg, msgn, "invalid smarts '%s'", obw_excerpt(smarts).c_str());
			delete p;
			return nullptr;
		}
		return p;
	} catch (...) {
		delete p;
		obw_set_msg(msg, msgn, "invalid smarts '%s'", obw_excerpt(smarts).c_str());
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
