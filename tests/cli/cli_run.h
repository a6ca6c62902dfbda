/* SPDX-License-Identifier: MIT */
/* cli_run.h: runs $PKAD_BIN with given arguments and stdin, captures stdout and the status. */
#ifndef PKAD_CLI_RUN_H
#define PKAD_CLI_RUN_H

#include <fcntl.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

typedef struct cli_out {
	char *out;   /* stdout, NUL-terminated (NUL bytes in it are kept; use len) */
	size_t len;
	char *err;   /* stderr */
	int status;  /* exit status, or 128 + signal number when killed */
} cli_out;

static inline void cli_out_free(cli_out *o)
{
	free(o->out);
	free(o->err);
	memset(o, 0, sizeof *o);
}

/* A temporary file holding n bytes of data; returns its path (malloc'd) or NULL. */
static inline char *cli_temp_file(const void *data, size_t n)
{
	const char *dir = getenv("TMPDIR") ? getenv("TMPDIR") : "/tmp";
	size_t len = strlen(dir) + 32;
	char *path = malloc(len);
	int fd;
	if (!path)
		return NULL;
	snprintf(path, len, "%s/pkad-cli-XXXXXX", dir);
	fd = mkstemp(path);
	if (fd < 0 || (n && write(fd, data, n) != (ssize_t)n)) {
		if (fd >= 0)
			close(fd), unlink(path);
		free(path);
		return NULL;
	}
	close(fd);
	return path;
}

static inline char *cli_slurp(const char *path, size_t *len)
{
	FILE *f = fopen(path, "rb");
	char *buf = NULL;
	size_t n = 0, cap = 0;
	if (!f)
		return NULL;
	for (;;) {
		if (n + 65536 + 1 > cap) {
			char *b = realloc(buf, cap = (n + 65536 + 1) * 2);
			if (!b)
				break;
			buf = b;
		}
		size_t got = fread(buf + n, 1, 65536, f);
		n += got;
		if (got == 0)
			break;
	}
	fclose(f);
	if (buf)
		buf[n] = '\0';
	if (len)
		*len = n;
	return buf;
}

/* The pkad binary under test (set by pkad_add_test). */
static inline const char *cli_bin(void)
{
	const char *b = getenv("PKAD_BIN");
	return b && *b ? b : "pkad";
}

/* Runs `pkad argv...` (argv NULL-terminated, without the program name) with stdin from
 * input_path (NULL: /dev/null). Returns 0, or -1 when the process could not be run. */
static inline int cli_run_file(cli_out *o, const char *const *argv, const char *input_path)
{
	char *out_path = cli_temp_file("", 0), *err_path = cli_temp_file("", 0);
	const char *args[64];
	size_t n = 0;
	pid_t pid;
	int st = 0;
	memset(o, 0, sizeof *o);
	if (!out_path || !err_path)
		goto fail;
	args[n++] = cli_bin();
	while (argv && *argv && n < 63)
		args[n++] = *argv++;
	args[n] = NULL;
	fflush(NULL);
	pid = fork();
	if (pid == 0) {
		int in = open(input_path ? input_path : "/dev/null", O_RDONLY);
		int out = open(out_path, O_WRONLY | O_TRUNC);
		int err = open(err_path, O_WRONLY | O_TRUNC);
		if (in < 0 || out < 0 || err < 0)
			_exit(126);
		dup2(in, 0), dup2(out, 1), dup2(err, 2);
		execv(args[0], (char *const *)args);
		_exit(127);
	}
	if (pid < 0 || waitpid(pid, &st, 0) < 0)
		goto fail;
	o->status = WIFEXITED(st) ? WEXITSTATUS(st) : 128 + WTERMSIG(st);
	o->out = cli_slurp(out_path, &o->len);
	o->err = cli_slurp(err_path, NULL);
	unlink(out_path), unlink(err_path);
	free(out_path), free(err_path);
	return o->out && o->err ? 0 : -1;
fail:
	if (out_path)
		unlink(out_path);
	if (err_path)
		unlink(err_path);
	free(out_path), free(err_path);
	return -1;
}

/* As cli_run_file with the input given as n bytes of text. */
static inline int cli_run(cli_out *o, const char *const *argv, const void *input, size_t n)
{
	char *path = cli_temp_file(input, n);
	int rc;
	if (!path) {
		memset(o, 0, sizeof *o);
		return -1;
	}
	rc = cli_run_file(o, argv, path);
	unlink(path);
	free(path);
	return rc;
}

/* Splits text into lines in place; returns a malloc'd array of *n line pointers. */
static inline char **cli_lines(char *text, size_t *n)
{
	size_t cap = 1;
	char **lines;
	for (const char *p = text; *p; p++)
		cap += *p == '\n';
	lines = malloc(cap * sizeof *lines);
	*n = 0;
	for (char *p = text; lines && p && *p;) {
		char *nl = strchr(p, '\n');
		lines[(*n)++] = p;
		if (!nl)
			break;
		*nl = '\0';
		p = nl + 1;
	}
	return lines;
}

#endif
