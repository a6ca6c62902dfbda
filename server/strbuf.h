/* SPDX-License-Identifier: MIT */
/* strbuf.h: a growable text buffer for building response bodies. */
#ifndef PKAD_STRBUF_H
#define PKAD_STRBUF_H

#include <stddef.h>

/* Zero-initialise; after a failed allocation every call is a no-op and oom stays set. */
typedef struct srv_buf {
	char *p;
	size_t len, cap;
	int oom;
} srv_buf;

void srv_buf_append(srv_buf *b, const char *s, size_t n);
void srv_buf_puts(srv_buf *b, const char *s);
void srv_buf_printf(srv_buf *b, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Hands the NUL-terminated text to the caller (free()); NULL after an allocation failure. */
char *srv_buf_take(srv_buf *b);
void srv_buf_free(srv_buf *b);

#endif
