/* SPDX-License-Identifier: MIT */
/* smiles_check.c: SMILES token grammar checks that Open Babel's parser does not make
 * (it accepts "C(C" and "CC=" silently); plain C, no toolkit. */
#include "smiles_check.h"

#include <ctype.h>
#include <stdio.h>
#include <string.h>

enum { L_START, L_ATOM, L_BOND, L_OPEN, L_DOT };

static int fail(char *why, size_t whyn, const char *what, char ch, size_t pos)
{
	if (why && whyn) {
		if (ch)
			snprintf(why, whyn, "%s '%c' at position %zu", what, ch, pos + 1);
		else
			snprintf(why, whyn, "%s at position %zu", what, pos + 1);
	}
	return -2;
}

/* Length of a ring-closure label (digit or %nn) at s[i], 0 if none. */
static size_t ring_label(const char *s, size_t n, size_t i)
{
	if (isdigit((unsigned char)s[i]))
		return 1;
	if (s[i] == '%' && i + 2 < n && isdigit((unsigned char)s[i + 1]) &&
	    isdigit((unsigned char)s[i + 2]))
		return 3;
	return 0;
}

/* Classifies the token at s[i]: 'a' atom, 'r' ring label, '-' bond, or '(' ')' '.'; sets
 * *len to its length (0: not a SMILES token). */
static char token(const char *s, size_t n, size_t i, size_t *len)
{
	const char *close;
	*len = 1;
	if (s[i] == '[') {
		close = memchr(s + i, ']', n - i);
		*len = close ? (size_t)(close - (s + i)) + 1 : 0;
		return 'a';
	}
	if ((*len = ring_label(s, n, i)))
		return 'r';
	*len = 1;
	if (i + 1 < n && ((s[i] == 'C' && s[i + 1] == 'l') || (s[i] == 'B' && s[i + 1] == 'r')))
		*len = 2;
	if (strchr("BCNOPSFIbcnops*", s[i]))
		return 'a';
	if (strchr("-=#$:/\\~", s[i]))
		return '-';
	if (!strchr("().", s[i]))
		*len = 0;
	return s[i];
}

/* What may follow the previous token: returns the complaint, NULL when fine. */
static const char *misplaced(char t, int last, int depth)
{
	if (t == 'r' && last != L_ATOM && last != L_BOND)
		return "ring bond without an atom";
	if ((t == '(' || t == ')' || t == '.') && last != L_ATOM)
		return "misplaced";
	if (t == '-' && last != L_ATOM && last != L_OPEN)
		return "bond without an atom before it";
	if (t == ')' && depth == 0)
		return "unbalanced";
	return NULL;
}

static int ring_number(const char *s, size_t i)
{
	if (s[i] != '%')
		return s[i] - '0';
	return (s[i + 1] - '0') * 10 + (s[i + 2] - '0');
}

/* Ring-closure labels still open at the end: the first one, or -1. */
static int open_ring(const unsigned char *open)
{
	for (int k = 0; k < 100; k++)
		if (open[k])
			return k;
	return -1;
}

int obw_smiles_check(const char *s, size_t n, char *why, size_t whyn)
{
	int depth = 0, last = L_START;
	unsigned char open[100] = {0};
	size_t len = 0;
	for (size_t i = 0; i < n; i += len) {
		char t = token(s, n, i, &len);
		if (!len)
			return fail(why, whyn, s[i] == '[' ? "unclosed" : "unexpected character",
				    s[i], i);
		const char *bad = misplaced(t, last, depth);
		if (bad)
			return fail(why, whyn, bad, t == 'r' || t == '-' ? 0 : t, i);
		if (t == 'r')
			open[ring_number(s, i)] ^= 1;
		depth += t == '(' ? 1 : t == ')' ? -1 : 0;
		last = t == '(' ? L_OPEN : t == '-' ? L_BOND : t == '.' ? L_DOT : L_ATOM;
	}
	if (depth > 0)
		return fail(why, whyn, "unclosed", '(', n - 1);
	if (open_ring(open) >= 0) {
		if (why && whyn)
			snprintf(why, whyn, "ring bond %d is never closed", open_ring(open));
		return -2;
	}
	if (last != L_ATOM)
		return fail(why, whyn, "smiles ends with a bond, branch or dot", 0, n ? n - 1 : 0);
	return 0;
}

int obw_smiles_aromatic_count(const char *s, size_t n)
{
	int count = 0;
	for (size_t i = 0; i < n; i++) {
		if (s[i] != '[') {
			count += strchr("bcnops", s[i]) && s[i] ? 1 : 0;
			continue;
		}
		size_t j = i + 1;
		while (j < n && isdigit((unsigned char)s[j]))
			j++;
		count += j < n && islower((unsigned char)s[j]) ? 1 : 0;
		const char *close = memchr(s + i, ']', n - i);
		if (!close)
			break;
		i = (size_t)(close - s);
	}
	return count;
}
