/* SPDX-License-Identifier: MIT */
/* smarts_share.c: the registry that gives every distinct recursive part and atom token of a
 * set of screens one slot, so that each is valued once per molecule and atom. */
#include <stdlib.h>
#include <string.h>

#include "smarts_screen.h"

static size_t key_hash(char kind, const char *text, size_t len)
{
	size_t h = (size_t)2166136261u ^ (unsigned char)kind; /* FNV-1a */
	for (size_t i = 0; i < len; i++)
		h = (h ^ (unsigned char)text[i]) * 16777619u;
	return h;
}

static int same_key(const char *key, char kind, const char *text, size_t len)
{
	return key[0] == kind && !strncmp(key + 1, text, len) && !key[len + 1];
}

/* Doubles the registry (texts and hash); nonzero when out of memory. */
static int shared_grow(sx_shared *reg)
{
	int cap = reg->cap ? 2 * reg->cap : 64;
	char **texts = realloc(reg->texts, (size_t)cap * sizeof *texts);
	int *slots = calloc(2 * (size_t)cap, sizeof *slots);
	if (texts)
		reg->texts = texts;
	if (!texts || !slots) {
		free(slots);
		return 1;
	}
	for (int k = 0; k < reg->n; k++) {
		size_t h = key_hash(reg->texts[k][0], reg->texts[k] + 1, strlen(reg->texts[k] + 1));
		while (slots[h % (2 * (size_t)cap)])
			h++;
		slots[h % (2 * (size_t)cap)] = k + 1;
	}
	free(reg->slots);
	reg->slots = slots;
	reg->cap = cap;
	return 0;
}

/* Slot of key (a kind letter, then len bytes of text) in reg; -1 when out of memory. */
static int shared_slot(sx_shared *reg, char kind, const char *text, size_t len)
{
	if (reg->n == reg->cap && shared_grow(reg))
		return -1;
	size_t h = key_hash(kind, text, len), size = 2 * (size_t)reg->cap;
	for (; reg->slots[h % size]; h++)
		if (same_key(reg->texts[reg->slots[h % size] - 1], kind, text, len))
			return reg->slots[h % size] - 1;
	char *key = malloc(len + 2);
	if (!key)
		return -1;
	key[0] = kind;
	memcpy(key + 1, text, len);
	key[len + 1] = '\0';
	reg->texts[reg->n] = key;
	reg->slots[h % size] = reg->n + 1;
	return reg->n++;
}

int smarts_screen_share(smarts_screen *s, sx_shared *reg)
{
	if (s)
		s->own_memo = 1; /* until every part has its slot */
	for (int p = 0; s && p < s->n_pats; p++) {
		sx_pat *pt = &s->pats[p];
		if (p > 0 && (pt->shared = shared_slot(reg, '$', pt->text, strlen(pt->text))) < 0)
			return -1;
		for (int i = 0; i < pt->n_atoms; i++) {
			sx_patom *pa = &pt->atoms[i];
			pa->shared = shared_slot(reg, 'a', s->smarts + pa->text_at,
						 (size_t)pa->text_len);
			if (pa->shared < 0)
				return -1;
		}
	}
	if (s)
		s->own_memo = 0;
	return 0;
}

void sx_shared_clear(sx_shared *reg)
{
	for (int k = 0; k < reg->n; k++)
		free(reg->texts[k]);
	free(reg->texts);
	free(reg->slots);
	*reg = (sx_shared){NULL, 0, 0, NULL};
}
