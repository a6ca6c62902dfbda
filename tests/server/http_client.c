/* SPDX-License-Identifier: MIT */
/* http_client.c: test-side HTTP/1.1 client and `pkad serve` launcher. */
#include "http_client.h"

#include <arpa/inet.h>
#include <ctype.h>
#include <errno.h>
#include <fcntl.h>
#include <netinet/in.h>
#include <poll.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>
#include <sys/socket.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <time.h>
#include <unistd.h>

int hc_connect(int port)
{
	struct sockaddr_in a;
	int fd = socket(AF_INET, SOCK_STREAM, 0);

	if (fd < 0)
		return -1;
	memset(&a, 0, sizeof a);
	a.sin_family = AF_INET;
	a.sin_port = htons((unsigned short)port);
	a.sin_addr.s_addr = htonl(INADDR_LOOPBACK);
	if (connect(fd, (struct sockaddr *)&a, sizeof a) < 0) {
		close(fd);
		return -1;
	}
	return fd;
}

int hc_send_all(int fd, const char *data, size_t n)
{
	while (n) {
		ssize_t k = send(fd, data, n, MSG_NOSIGNAL);
		if (k < 0 && errno == EINTR)
			continue;
		if (k <= 0)
			return -1;
		data += k;
		n -= (size_t)k;
	}
	return 0;
}

/* Decodes a chunked body in place; returns the decoded length. */
static size_t dechunk(char *b, size_t n)
{
	size_t in = 0, out = 0;

	while (in < n) {
		char *end;
		unsigned long len = strtoul(b + in, &end, 16);
		char *crlf = strstr(end, "\r\n");
		if (!crlf || !len)
			break;
		in = (size_t)(crlf - b) + 2;
		if (in + len > n)
			len = n - in;
		memmove(b + out, b + in, len);
		out += len;
		in += len + 2;
	}
	b[out] = '\0';
	return out;
}

static int parse_response(hc_response *out, char *raw, size_t n)
{
	char *sep = strstr(raw, "\r\n\r\n");

	if (!sep || sscanf(raw, "HTTP/1.%*d %d", &out->status) != 1)
		return -1;
	*sep = '\0';
	out->headers = raw;
	out->body_len = n - (size_t)(sep + 4 - raw);
	out->body = malloc(out->body_len + 1);
	if (!out->body)
		return -1;
	memcpy(out->body, sep + 4, out->body_len);
	out->body[out->body_len] = '\0';
	{
		char te[32];
		if (hc_header(out, "transfer-encoding", te, sizeof te) && strstr(te, "chunked"))
			out->body_len = dechunk(out->body, out->body_len);
	}
	return 0;
}

int hc_read_response(hc_response *out, int fd)
{
	size_t cap = 1 << 16, n = 0;
	char *raw = malloc(cap);

	memset(out, 0, sizeof *out);
	while (raw) {
		ssize_t k;
		if (n + 1 >= cap) {
			char *p = realloc(raw, cap *= 2);
			if (!p)
				break;
			raw = p;
		}
		k = recv(fd, raw + n, cap - n - 1, 0);
		if (k < 0 && errno == EINTR)
			continue;
		if (k <= 0)
			break;
		n += (size_t)k;
	}
	close(fd);
	if (!raw)
		return -1;
	raw[n] = '\0';
	if (parse_response(out, raw, n) < 0) {
		free(raw);
		memset(out, 0, sizeof *out);
		return -1;
	}
	return 0;
}

const char *hc_header(const hc_response *r, const char *name, char *buf, size_t n)
{
	size_t len = strlen(name);

	for (const char *p = r->headers ? strstr(r->headers, "\r\n") : NULL; p;
	     p = strstr(p + 2, "\r\n")) {
		const char *v = p + 2;
		size_t k = 0;
		if (strncasecmp(v, name, len) || v[len] != ':')
			continue;
		v += len + 1;
		while (*v == ' ')
			v++;
		while (v[k] && v[k] != '\r' && k + 1 < n)
			k++;
		memcpy(buf, v, k);
		buf[k] = '\0';
		return buf;
	}
	return NULL;
}

void hc_response_free(hc_response *r)
{
	free(r->headers);
	free(r->body);
	memset(r, 0, sizeof *r);
}

int hc_request(hc_response *out, int port, const char *method, const char *path,
	       const char *extra_headers, const char *body, size_t body_len)
{
	char head[1024];
	int fd = hc_connect(port), n;

	memset(out, 0, sizeof *out);
	if (fd < 0)
		return -1;
	n = snprintf(head, sizeof head, "%s %s HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n"
		     "%s", method, path, extra_headers);
	if (body)
		n += snprintf(head + n, sizeof head - (size_t)n, "Content-Length: %zu\r\n", body_len);
	n += snprintf(head + n, sizeof head - (size_t)n, "\r\n");
	if (hc_send_all(fd, head, (size_t)n) < 0 || (body && hc_send_all(fd, body, body_len) < 0)) {
		close(fd);
		return -1;
	}
	return hc_read_response(out, fd);
}

void hc_urlencode(char *buf, size_t n, const char *s)
{
	static const char hex[] = "0123456789ABCDEF";
	size_t k = 0;

	for (; *s && k + 4 < n; s++) {
		unsigned char c = (unsigned char)*s;
		if (isalnum(c) || strchr("-._~", c)) {
			buf[k++] = (char)c;
		} else {
			buf[k++] = '%';
			buf[k++] = hex[c >> 4];
			buf[k++] = hex[c & 15];
		}
	}
	buf[k] = '\0';
}

const char *const *hc_model_args(void)
{
	static char path[4096];
	static const char *args[3];
	const char *src = getenv("PKAD_SOURCE_DIR");

	snprintf(path, sizeof path, "%s/fragments/sites.tsv", src ? src : ".");
	if (access(path, R_OK) == 0) {
		args[0] = NULL;
		return args;
	}
	snprintf(path, sizeof path, "%s/tests/predictor/fixture", src ? src : ".");
	args[0] = "--fragments";
	args[1] = path;
	args[2] = NULL;
	return args;
}

static void child_exec(int out_fd, const char *const *args)
{
	const char *bin = getenv("PKAD_BIN"), *log = getenv("PKAD_TEST_LOG");
	const char *argv[64] = {bin, "serve", "--port", "0"};
	const char *const *model = hc_model_args();
	int n = 4, err = open(log ? log : "/dev/null", O_WRONLY | O_CREAT | O_APPEND, 0644);

	for (; *model && n < 40; model++)
		argv[n++] = *model;
	for (; args && *args && n < 62; args++)
		argv[n++] = *args;
	argv[n] = NULL;
	dup2(out_fd, 1);
	if (err >= 0)
		dup2(err, 2);
	execv(bin, (char *const *)argv);
	_exit(127);
}

/* Reads the daemon's stdout until the listening line; returns the port or -1. */
static int read_port(int fd)
{
	char buf[512];
	size_t n = 0;
	struct pollfd p = {fd, POLLIN, 0};

	while (n + 1 < sizeof buf && poll(&p, 1, 30000) > 0) {
		ssize_t k = read(fd, buf + n, sizeof buf - n - 1);
		char *at;
		if (k <= 0)
			return -1;
		n += (size_t)k;
		buf[n] = '\0';
		if ((at = strstr(buf, "listening on http://")) && strchr(at, '\n')) {
			char *colon = strrchr(at, ':');
			return colon ? atoi(colon + 1) : -1;
		}
	}
	return -1;
}

int hc_daemon_start(hc_daemon *d, const char *const *args)
{
	int fds[2];

	d->pid = -1;
	d->port = -1;
	if (!getenv("PKAD_BIN") || pipe(fds) < 0)
		return -1;
	d->pid = fork();
	if (d->pid == 0) {
		close(fds[0]);
		child_exec(fds[1], args);
	}
	close(fds[1]);
	if (d->pid > 0)
		d->port = read_port(fds[0]);
	close(fds[0]);
	if (d->port <= 0) {
		hc_daemon_stop(d, 1);
		return -1;
	}
	return 0;
}

int hc_daemon_stop(hc_daemon *d, double timeout)
{
	int status = 0;
	struct timespec ts = {0, 10 * 1000000L};

	if (d->pid <= 0)
		return -1;
	kill(d->pid, SIGTERM);
	for (double t = 0; t < timeout; t += 0.01) {
		if (waitpid(d->pid, &status, WNOHANG) == d->pid) {
			d->pid = -1;
			return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
		}
		nanosleep(&ts, NULL);
	}
	kill(d->pid, SIGKILL);
	waitpid(d->pid, &status, 0);
	d->pid = -1;
	return -1;
}
