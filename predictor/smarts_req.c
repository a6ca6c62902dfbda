/* SPDX-License-Identifier: MIT */
/* smarts_req.c: the elements a SMARTS pattern cannot match without, to skip hopeless
 * patterns before the toolkit's matcher runs (each pattern is then tried only on molecules
 * that hold what it names). Conservative: anything unclear adds no requirement. */
#include <ctype.h>
#include <string.h>

#include "engine.h"

static const struct {
	const char *sym;
	int z;
} elements[] = {{"Cl", 17}, {"Br", 35}, {"Si", 14}, {"Se", 34}, {"Na", 11}, {"Li", 3},
		{"Mg", 12}, {"Al", 13}, {"As", 33}, {"Te", 52}, {"B", 5},   {"C", 6},
		{"N", 7},   {"O", 8},   {"F", 9},   {"P", 15},  {"S", 16},  {"I", 53},
		{"H", 1},   {"K", 19}};

/* Element symbol at p (uppercase first); returns its length, 0 when none. */
static int element_at(const char *p, int *z)
{
	for (size_t i = 0; i < sizeof elements / sizeof elements[0]; i++) {
		size_t n = strlen(elements[i].sym);
		if (!strncmp(p, elements[i].sym, n)) { /* two-letter symbols come first */
			*z = elements[i].z;
			return (int)n;
		}
	}
	return 0;
}

static void require(smarts_req *r, int z, int aromatic, int any)
{
	if (z <= 0 || z >= 64)
		return;
	uint64_t bit = (uint64_t)1 << z;
	if (any)
		r->any |= bit;
	else if (aromatic)
		r->arom |= bit;
	else
		r->aliph |= bit;
}

/* One top-level conjunct of a bracket atom, [start, end). */
static void bracket_conjunct(smarts_req *r, const char *p, const char *end)
{
	if (memchr(p, ',', (size_t)(end - p)) || p == end)
		return;
	int z = 0;
	if (*p == '#' && isdigit((unsigned char)p[1])) {
		for (p++; p < end && isdigit((unsigned char)*p); p++)
			z = 10 * z + (*p - '0');
		require(r, z, 0, 1);
		return;
	}
	static const char arom[] = "cnops";
	const char *a = strchr(arom, *p);
	if (*p && a) {
		static const int az[] = {6, 7, 8, 15, 16};
		require(r, az[a - arom], 1, 0);
		return;
	}
	if (isupper((unsigned char)*p) && *p != 'H' && *p != 'X' && *p != 'D' && *p != 'R' &&
	    *p != 'A' && element_at(p, &z))
		require(r, z, 0, 0);
}

/* The ']' closing the bracket atom that starts at p, past any nested recursive SMARTS. */
static const char *bracket_end(const char *p)
{
	int depth = 1;
	for (; *p; p++) {
		depth += *p == '[';
		depth -= *p == ']';
		if (!depth)
			return p;
	}
	return NULL;
}

static const char *bracket(smarts_req *r, const char *p)
{
	const char *close = bracket_end(p);
	if (!close)
		return p + strlen(p);
	if (!memchr(p, '$', (size_t)(close - p)))
		for (const char *q = p; q < close;) {
			const char *semi = memchr(q, ';', (size_t)(close - q));
			const char *end = semi ? semi : close;
			bracket_conjunct(r, q, end);
			q = semi ? semi + 1 : close;
		}
	return close + 1;
}

/* Nonzero when a conjunct such as "OX2H1" or "nH" asks for at least one hydrogen. */
static int needs_h(const char *p, const char *end)
{
	if (memchr(p, ',', (size_t)(end - p)) || memchr(p, '!', (size_t)(end - p)))
		return 0;
	for (const char *q = p + 1; q < end; q++)
		if (*q == 'H' && !(q + 1 < end && islower((unsigned char)q[1])))
			return !(q + 1 < end && q[1] == '0');
	return 0;
}

/* The first atom of an acid pattern usually carries its proton ([OX2H1], [nH1]): record
 * which element must then hold hydrogen somewhere in the molecule. */
static void first_atom_h(smarts_req *r, const char *smarts)
{
	if (smarts[0] != '[')
		return;
	const char *close = bracket_end(smarts + 1);
	if (!close || memchr(smarts, '$', (size_t)(close - smarts)))
		return;
	for (const char *q = smarts + 1; q < close;) {
		const char *semi = memchr(q, ';', (size_t)(close - q));
		const char *end = semi ? semi : close;
		smarts_req one;
		memset(&one, 0, sizeof one);
		bracket_conjunct(&one, q, end);
		if ((one.aliph || one.arom) && needs_h(q, end)) {
			r->h_aliph |= one.aliph;
			r->h_arom |= one.arom;
		}
		q = semi ? semi + 1 : close;
	}
}

void smarts_requirements(smarts_req *r, const char *smarts)
{
	memset(r, 0, sizeof *r);
	first_atom_h(r, smarts);
	int depth = 0; /* inside a recursive $( ... ) */
	for (const char *p = smarts; *p;) {
		if (p[0] == '$' && p[1] == '(') {
			depth++;
			p += 2;
		} else if (*p == '(' && depth) {
			depth++;
			p++;
		} else if (*p == ')' && depth) {
			depth--;
			p++;
		} else if (depth) {
			p++;
		} else if (*p == '[') {
			p = bracket(r, p + 1);
		} else {
			int z = 0, n = isupper((unsigned char)*p) ? element_at(p, &z) : 0;
			if (n && strchr("BCNOPSFI", *p)) {
				require(r, z, 0, 0);
				p += n;
			} else {
				if (strchr("cnops", *p))
					bracket_conjunct(r, p, p + 1);
				p++;
			}
		}
	}
}

void smarts_mol_mask(smarts_req *out, const obw_atom *atoms, size_t n)
{
	memset(out, 0, sizeof *out);
	for (size_t i = 0; i < n; i++) {
		int z = atoms[i].element;
		if (z <= 0 || z >= 64)
			continue;
		uint64_t bit = (uint64_t)1 << z;
		if (atoms[i].aromatic)
			out->arom |= bit;
		else
			out->aliph |= bit;
		if (atoms[i].hcount > 0 && atoms[i].aromatic)
			out->h_arom |= bit;
		else if (atoms[i].hcount > 0)
			out->h_aliph |= bit;
	}
	if (out->aliph || out->arom)
		out->any = out->aliph | out->arom;
}

int smarts_may_match(const smarts_req *r, const smarts_req *mol)
{
	return !(r->aliph & ~mol->aliph) && !(r->arom & ~mol->arom) && !(r->any & ~mol->any) &&
	       !(r->h_aliph & ~mol->h_aliph) && !(r->h_arom & ~mol->h_arom);
}
