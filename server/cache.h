/* SPDX-License-Identifier: MIT */
/* cache.h: a bounded LRU cache of encoded results, shared by all connection threads. */
#ifndef PKAD_CACHE_H
#define PKAD_CACHE_H

#include <stddef.h>

typedef struct srv_cache srv_cache;

/* The key is the input SMILES as sent plus every option that changes the answer (pH,
 * curves, limits): canonical SMILES would need a parse on the request thread, so two
 * spellings of one molecule are two entries. capacity 0 gives a cache that never hits.
 * Returns NULL when out of memory. Free with srv_cache_free (accepts NULL). */
srv_cache *srv_cache_new(size_t capacity);
void srv_cache_free(srv_cache *c);

/* A malloc'd copy of the value of key (the caller frees), or NULL on a miss. Counts the
 * hit or miss. Thread-safe. */
char *srv_cache_get(srv_cache *c, const char *key);
/* Stores a copy of value under key, evicting the least recently used entry when full. */
void srv_cache_put(srv_cache *c, const char *key, const char *value);

typedef struct srv_cache_stats {
	unsigned long long hits, misses, evictions;
	size_t entries, capacity;
} srv_cache_stats;
void srv_cache_stats_get(srv_cache *c, srv_cache_stats *out);

#endif
