/* SPDX-License-Identifier: MIT */
/* http_checks.c: helpers shared by the live-daemon tests. */
#include "http_checks.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

int http_get(hc_response *r, const char *path)
{
	hc_request(r, http_main.port, "GET", path, "", NULL, 0);
	return r->status;
}

int http_post(hc_response *r, const char *path, const char *ctype, const char *body)
{
	char head[256];

	snprintf(head, sizeof head, "Content-Type: %s\r\n", ctype);
	hc_request(r, http_main.port, "POST", path, head, body, strlen(body));
	return r->status;
}

static const char *error_field(const hc_response *r, const char *name)
{
	static char buf[512];
	cJSON *o = cJSON_Parse(r->body ? r->body : "");
	const cJSON *e = cJSON_GetObjectItemCaseSensitive(o, "error");
	const cJSON *v = cJSON_GetObjectItemCaseSensitive(e, name);

	snprintf(buf, sizeof buf, "%s", cJSON_IsString(v) ? v->valuestring : "");
	cJSON_Delete(o);
	return buf;
}

const char *http_error_code(const hc_response *r)
{
	return error_field(r, "code");
}

const char *http_error_message(const hc_response *r)
{
	return error_field(r, "message");
}

int http_stream_chunk(int fd, const char *chunk)
{
	char head[32];
	size_t n = strlen(chunk);

	snprintf(head, sizeof head, "%zx\r\n", n);
	if (hc_send_all(fd, head, strlen(head)) < 0 || hc_send_all(fd, chunk, n) < 0)
		return -1;
	return hc_send_all(fd, "\r\n", 2);
}

int http_stream_open(int port, const char *first_chunk)
{
	const char *head = "POST /v1/pka HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n"
			   "Content-Type: application/x-ndjson\r\nTransfer-Encoding: chunked\r\n\r\n";
	int fd = hc_connect(port);

	if (fd < 0)
		return -1;
	/* An empty chunk would end the body: send none. */
	if (hc_send_all(fd, head, strlen(head)) < 0 ||
	    (*first_chunk && http_stream_chunk(fd, first_chunk) < 0)) {
		close(fd);
		return -1;
	}
	return fd;
}

int http_stream_close(hc_response *r, int fd)
{
	memset(r, 0, sizeof *r);
	if (hc_send_all(fd, "0\r\n\r\n", 5) < 0) {
		close(fd);
		return -1;
	}
	return hc_read_response(r, fd);
}

char *http_without_id(cJSON *obj)
{
	cJSON_DeleteItemFromObjectCaseSensitive(obj, "id");
	return cJSON_PrintUnformatted(obj);
}

cJSON *http_cli_answer(const char *smiles)
{
	char cmd[8192], line[1 << 16];
	const char *const *model = hc_model_args();
	FILE *p;
	cJSON *o = NULL;

	snprintf(cmd, sizeof cmd, "echo '%s' | '%s' predict %s %s", smiles, getenv("PKAD_BIN"),
		 model[0] ? model[0] : "", model[0] ? model[1] : "");
	if (!(p = popen(cmd, "r")))
		return NULL;
	if (fgets(line, sizeof line, p))
		o = cJSON_Parse(line);
	pclose(p);
	if (o)
		cJSON_DeleteItemFromObjectCaseSensitive(o, "id");
	return o;
}
