// SPDX-License-Identifier: MIT
// obwrap_internal.hpp: the wrapper's own C++ types, shared by the wrapper's .cpp files.
#ifndef PKAD_OBWRAP_INTERNAL_HPP
#define PKAD_OBWRAP_INTERNAL_HPP

#include "obwrap.h"

#include <openbabel/mol.h>
#include <openbabel/obconversion.h>
#include <openbabel/parsmart.h>

#include <cstddef>
#include <string>
#include <vector>

using OpenBabel::OBConversion;
using OpenBabel::OBFormat;
using OpenBabel::OBMol;
using OpenBabel::OBSmartsPattern;

enum { E_INVAL = -1, E_PARSE = -2, E_NOMEM = -4, E_INTERNAL = -5, E_UNSUPPORTED = -8 };

struct obw_ctx {
	OBConversion conv;
	OBFormat *smi = nullptr;
	OBFormat *can = nullptr;
	OBFormat *sdf = nullptr;
};

struct obw_mol {
	OBMol mol;
	std::vector<int> orig; /* input index of each OB atom (idx - 1) */
	std::vector<obw_atom> atoms;
	std::vector<obw_bond> bonds;
	std::vector<int> atom_bonds; /* each atom's bond indices in Open Babel's order */
	std::vector<int> ring_sizes, ring_offsets, ring_atoms;
	std::vector<obw_tetra> tetra;   /* specified tetrahedral centres */
	size_t n_cistrans = 0;          /* specified cis/trans double bonds */
	std::string canonical;          /* last canonical SMILES written, "" when stale */
	std::vector<int> canonical_order; /* atom index (0-based) of each atom token in it */
};

struct obw_pattern {
	OBSmartsPattern pat;
};

/* One-line message into msg (msgn bytes; msg may be NULL). */
void obw_set_msg(char *msg, size_t msgn, const char *fmt, ...)
	__attribute__((format(printf, 3, 4)));
/* Makes the calling thread's Open Babel typers ready under the locale lock (obwrap.cpp);
 * cheap after the first call in a thread. Every entry point that can perceive calls it. */
void obw_thread_ready(void);
/* A short, printable excerpt of user text for messages (obwrap.cpp). */
std::string obw_excerpt(const std::string &s);
/* Views of the current graph; reset forgets the toolkit's perception first, as after edits
 * (obwrap_graph.cpp). */
void obw_rebuild_cache(obw_mol *m, bool reset = true);
/* Folds ordinary explicit hydrogens into their heavy atom; returns how many. */
size_t obw_fold_hydrogens(obw_mol *m);
/* malloc'd copy of s, NULL when out of memory. */
char *obw_dup_string(const std::string &s);

#endif
