/* SPDX-License-Identifier: MIT */
/* fragments_embedded.h: the fragment tables compiled into the binary. */
#ifndef PKAD_FRAGMENTS_EMBEDDED_H
#define PKAD_FRAGMENTS_EMBEDDED_H

typedef struct frag_embedded {
	const char *name;    /* file name, e.g. "sites.tsv" */
	const char *content; /* NUL-terminated text */
} frag_embedded;

/* Terminated by a row whose name is NULL. */
extern const frag_embedded frag_embedded_files[];

#endif
