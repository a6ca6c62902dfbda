/* SPDX-License-Identifier: MIT */
/* cache.c: LRU cache: a chained hash table over a doubly linked recency list. */
#include "cache.h"

#include <pthread.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

typedef struct entry {
	char *key, *value;
	uint64_t hash;
	struct entry *chain;      /* next in the hash bucket */
	struct entry *prev, *next; /* recency list, most recent at head */
} entry;

struct srv_cache {
	pthread_mutex_t mu;
	entry **buckets;
	size_t n_buckets, entries, capacity;
	entry *head, *tail;
	unsigned long long hits, misses, evictions;
};

/* FNV-1a, 64 bit. */
static uint64_t hash_key(const char *s)
{
	uint64_t h = 14695981039346656037ULL;
	for (; *s; s++)
		h = (h ^ (unsigned char)*s) * 1099511628211ULL;
	return h;
}

static char *dup_text(const char *s)
{
	size_t n = strlen(s) + 1;
	char *d = malloc(n);
	if (d)
		memcpy(d, s, n);
	return d;
}

srv_cache *srv_cache_new(size_t capacity)
{
	srv_cache *c = calloc(1, sizeof *c);
	if (!c)
		return NULL;
	c->capacity = capacity;
	c->n_buckets = capacity ? capacity * 2 + 1 : 1;
	c->buckets = calloc(c->n_buckets, sizeof *c->buckets);
	if (!c->buckets) {
		free(c);
		return NULL;
	}
	pthread_mutex_init(&c->mu, NULL);
	return c;
}

void srv_cache_free(srv_cache *c)
{
	if (!c)
		return;
	for (entry *e = c->head, *n; e; e = n) {
		n = e->next;
		free(e->key);
		free(e->value);
		free(e);
	}
	pthread_mutex_destroy(&c->mu);
	free(c->buckets);
	free(c);
}

static void list_unlink(srv_cache *c, entry *e)
{
	if (e->prev)
		e->prev->next = e->next;
	else
		c->head = e->next;
	if (e->next)
		e->next->prev = e->prev;
	else
		c->tail = e->prev;
	e->prev = e->next = NULL;
}

static void list_push_front(srv_cache *c, entry *e)
{
	e->next = c->head;
	e->prev = NULL;
	if (c->head)
		c->head->prev = e;
	c->head = e;
	if (!c->tail)
		c->tail = e;
}

/* The slot that points at the entry of key (or at the NULL ending its chain). */
static entry **find_slot(srv_cache *c, const char *key, uint64_t h)
{
	entry **slot = &c->buckets[h % c->n_buckets];
	while (*slot && ((*slot)->hash != h || strcmp((*slot)->key, key)))
		slot = &(*slot)->chain;
	return slot;
}

char *srv_cache_get(srv_cache *c, const char *key)
{
	uint64_t h = hash_key(key);
	char *v = NULL;
	entry *e;

	pthread_mutex_lock(&c->mu);
	e = *find_slot(c, key, h);
	if (e) {
		list_unlink(c, e);
		list_push_front(c, e);
		v = dup_text(e->value);
	}
	if (v)
		c->hits++;
	else
		c->misses++;
	pthread_mutex_unlock(&c->mu);
	return v;
}

static void evict_oldest(srv_cache *c)
{
	entry *e = c->tail;
	entry **slot = find_slot(c, e->key, e->hash);

	*slot = e->chain;
	list_unlink(c, e);
	free(e->key);
	free(e->value);
	free(e);
	c->entries--;
	c->evictions++;
}

void srv_cache_put(srv_cache *c, const char *key, const char *value)
{
	uint64_t h = hash_key(key);
	entry **slot, *e;

	if (!c->capacity)
		return;
	pthread_mutex_lock(&c->mu);
	if (*find_slot(c, key, h))
		goto done; /* a concurrent request stored the same answer */
	if (c->entries >= c->capacity)
		evict_oldest(c);
	e = calloc(1, sizeof *e);
	if (!e || !(e->key = dup_text(key)) || !(e->value = dup_text(value))) {
		if (e)
			free(e->key);
		free(e);
		goto done; /* a cache that cannot grow just misses */
	}
	e->hash = h;
	slot = find_slot(c, key, h);
	*slot = e;
	list_push_front(c, e);
	c->entries++;
done:
	pthread_mutex_unlock(&c->mu);
}

void srv_cache_stats_get(srv_cache *c, srv_cache_stats *out)
{
	pthread_mutex_lock(&c->mu);
	out->hits = c->hits;
	out->misses = c->misses;
	out->evictions = c->evictions;
	out->entries = c->entries;
	out->capacity = c->capacity;
	pthread_mutex_unlock(&c->mu);
}
