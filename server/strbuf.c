/* SPDX-License-Identifier: MIT */
/* strbuf.c: growable text buffer. */
#include "strbuf.h"

#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static int grow(srv_buf *b, size_t extra)
{
	size_t want = b->len + extra + 1, cap = b->cap ? b->cap : 256;
	char *p;

	if (b->oom)
		return -1;
	if (want <= b->cap)
		return 0;
	while (cap < want)
		cap *= 2;
	p = realloc(b->p, cap);
	if (!p) {
		b->oom = 1;
		return -1;
	}
	b->p = p;
	b->cap = cap;
	return 0;
}

void srv_buf_append(srv_buf *b, const char *s, size_t n)
{
	if (grow(b, n) < 0)
		return;
	memcpy(b->p + b->len, s, n);
	b->len += n;
	b->p[b->len] = '\0';
}

void srv_buf_puts(srv_buf *b, const char *s)
{
	srv_buf_append(b, s, strlen(s));
}

void srv_buf_printf(srv_buf *b, const char *fmt, ...)
{
	va_list ap;
	int n;

	va_start(ap, fmt);
	n = vsnprintf(NULL, 0, fmt, ap);
	va_end(ap);
	if (n < 0 || grow(b, (size_t)n) < 0)
		return;
	va_start(ap, fmt);
	vsnprintf(b->p + b->len, (size_t)n + 1, fmt, ap);
	va_end(ap);
	b->len += (size_t)n;
}

char *srv_buf_take(srv_buf *b)
{
	char *p;

	if (b->oom) {
		srv_buf_free(b);
		return NULL;
	}
	if (!b->p)
		srv_buf_append(b, "", 0);
	p = b->p;
	b->p = NULL;
	b->len = b->cap = 0;
	return p;
}

void srv_buf_free(srv_buf *b)
{
	free(b->p);
	b->p = NULL;
	b->len = b->cap = 0;
}
