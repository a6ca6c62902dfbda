/* SPDX-License-Identifier: MIT */
/* cmd_serve.c: `pkad serve`, the HTTP/JSON daemon: options, start-up, signals, shutdown. */
#include <errno.h>
#include <getopt.h>
#include <signal.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "cache.h"
#include "commands.h"
#include "http.h"
#include "metrics.h"
#include "routes.h"
#include "service.h"
#include "worker_pool.h"

typedef enum { OPT_INT, OPT_SIZE, OPT_DOUBLE, OPT_TEXT, OPT_FLAG } opt_kind;

/* One row per flag: the field of srv_config it sets and the accepted range. */
typedef struct serve_opt {
	const char *name;
	opt_kind kind;
	size_t offset;
	double min, max;
	const char *help;
} serve_opt;

#define CFG(field) offsetof(srv_config, field)
static const serve_opt serve_opts[] = {
	{"bind", OPT_TEXT, CFG(bind), 0, 0, "ADDR  listen address (default 127.0.0.1: loopback only)"},
	{"port", OPT_INT, CFG(port), 0, 65535, "N     TCP port (default 8080; 0 = any free port)"},
	{"threads", OPT_INT, CFG(threads), 1, 1024, "N     prediction workers (default: cores)"},
	{"max-body", OPT_SIZE, CFG(max_body), 64, 1e12, "BYTES JSON body, or one NDJSON record (default 4194304)"},
	{"max-batch", OPT_INT, CFG(max_batch), 1, 1e7, "N     molecules per JSON batch (default 1000)"},
	{"max-atoms", OPT_INT, CFG(max_atoms), 1, 1e5, "N     heavy atoms per molecule (default 200)"},
	{"timeout", OPT_DOUBLE, CFG(timeout), 0.001, 3600, "SEC   time per molecule (default 10)"},
	{"max-connections", OPT_INT, CFG(max_connections), 1, 1e5, "N     requests at once, then 429 (default 256)"},
	{"queue", OPT_INT, CFG(queue), 1, 1e7, "N     molecules waiting for a worker, then 429 (default 1024)"},
	{"cache-size", OPT_INT, CFG(cache_size), 0, 1e8, "N     cached results, LRU (default 10000; 0 = off)"},
	{"grace", OPT_DOUBLE, CFG(grace), 0, 3600, "SEC   time to finish in-flight work on SIGTERM (default 30)"},
	{"token-file", OPT_TEXT, CFG(token_file), 0, 0, "FILE  require 'Authorization: Bearer <first line of FILE>'"},
	{"fragments", OPT_TEXT, CFG(fragments), 0, 0, "DIR   load the model from DIR instead of the embedded copy"},
	{"log-smiles", OPT_FLAG, CFG(log_smiles), 0, 0, "      put the first SMILES of each request in the access log"},
};
#define N_OPTS (sizeof serve_opts / sizeof serve_opts[0])

static void usage(FILE *f)
{
	fprintf(f, "usage: pkad serve [options]\n\n");
	for (size_t i = 0; i < N_OPTS; i++)
		fprintf(f, "  --%-16s %s\n", serve_opts[i].name, serve_opts[i].help);
	fprintf(f, "  --%-16s %s\n", "help", "      this text\n\n"
		"GET /healthz stays open without the token (liveness probes); every other route\n"
		"needs it when --token-file is given. SIGTERM or SIGINT: stop taking work, finish\n"
		"what is in flight (new requests get 503), exit 0.\n");
}

static void config_defaults(srv_config *c)
{
	long cores = sysconf(_SC_NPROCESSORS_ONLN);

	memset(c, 0, sizeof *c);
	c->bind = "127.0.0.1";
	c->port = 8080;
	c->threads = cores > 0 ? (int)cores : 1;
	c->max_body = 4u << 20;
	c->max_batch = 1000;
	c->max_atoms = 200;
	c->timeout = 10;
	c->max_connections = 256;
	c->queue = 1024;
	c->cache_size = 10000;
	c->grace = 30;
}

/* Stores the text of one flag into its field; -1 when it is out of range. */
static int opt_apply(const serve_opt *o, const char *arg, srv_config *c)
{
	char *field = (char *)c + o->offset, *end = NULL;
	double v = 0;

	if (o->kind == OPT_FLAG) {
		*(int *)field = 1;
		return 0;
	}
	if (o->kind == OPT_TEXT) {
		*(const char **)field = arg;
		return 0;
	}
	errno = 0;
	v = strtod(arg, &end);
	if (errno || end == arg || *end || v < o->min || v > o->max ||
	    (o->kind != OPT_DOUBLE && v != (double)(long long)v)) {
		fprintf(stderr, "pkad serve: --%s '%s' is not a number in %g..%g\n", o->name, arg,
			o->min, o->max);
		return -1;
	}
	if (o->kind == OPT_INT)
		*(int *)field = (int)v;
	else if (o->kind == OPT_SIZE)
		*(size_t *)field = (size_t)v;
	else
		*(double *)field = v;
	return 0;
}

/* Returns 0 to run, 1 after --help, 2 on a usage error. */
static int parse_options(srv_config *c, int argc, char **argv)
{
	struct option longs[N_OPTS + 2];
	int ch, idx;

	for (size_t i = 0; i < N_OPTS; i++)
		longs[i] = (struct option){serve_opts[i].name,
					   serve_opts[i].kind == OPT_FLAG ? no_argument : required_argument,
					   NULL, 0};
	longs[N_OPTS] = (struct option){"help", no_argument, NULL, 'h'};
	longs[N_OPTS + 1] = (struct option){NULL, 0, NULL, 0};
	config_defaults(c);
	optind = 1;
	while ((ch = getopt_long(argc, argv, "h", longs, &idx)) != -1) {
		if (ch == 'h')
			return usage(stdout), 1;
		if (ch != 0 || opt_apply(&serve_opts[idx], optarg, c) < 0)
			return usage(stderr), 2;
	}
	if (optind < argc) {
		fprintf(stderr, "pkad serve: unexpected argument '%s'\n", argv[optind]);
		return usage(stderr), 2;
	}
	return 0;
}

/* The token is the first line of the file, without surrounding white space. */
static char *read_token(const char *path)
{
	char buf[512], *s = buf, *e;
	FILE *f = fopen(path, "r");

	if (!f || !fgets(buf, sizeof buf, f)) {
		fprintf(stderr, "pkad serve: cannot read the token file '%s'\n", path);
		if (f)
			fclose(f);
		return NULL;
	}
	fclose(f);
	while (*s == ' ' || *s == '\t')
		s++;
	e = s + strlen(s);
	while (e > s && strchr(" \t\r\n", e[-1]))
		*--e = '\0';
	if (!*s) {
		fprintf(stderr, "pkad serve: the token file '%s' has an empty first line\n", path);
		return NULL;
	}
	return strdup(s);
}

/* Loads the model and builds the shared state; returns 0 or prints why not. */
static int service_open(srv_service *svc, const srv_config *c, pred_model **model)
{
	pred_error err = {0, ""};

	memset(svc, 0, sizeof *svc);
	svc->cfg = c;
	pthread_mutex_init(&svc->parse_mu, NULL);
	if (c->token_file) {
		if (!(svc->token = read_token(c->token_file)))
			return -1;
		svc->token_len = strlen(svc->token);
	}
	if (pred_global_init(&err) < 0 || pred_model_load(model, c->fragments, &err) < 0) {
		fprintf(stderr, "pkad serve: %s\n", err.msg);
		return -1;
	}
	svc->model = *model;
	svc->metrics = srv_metrics_new(srv_route_count);
	svc->cache = srv_cache_new((size_t)c->cache_size);
	if (!svc->metrics || !svc->cache) {
		fprintf(stderr, "pkad serve: out of memory\n");
		return -1;
	}
	return 0;
}

static void service_close(srv_service *svc, pred_model *model)
{
	srv_pool_free(svc->pool);
	srv_cache_free(svc->cache);
	srv_metrics_free(svc->metrics);
	pred_model_free(model);
	free((char *)svc->token);
	pthread_mutex_destroy(&svc->parse_mu);
}

static void sleep_ms(long ms)
{
	struct timespec ts = {ms / 1000, (ms % 1000) * 1000000L};
	nanosleep(&ts, NULL);
}

/* Waits for SIGTERM or SIGINT, then lets in-flight requests finish (new ones get 503). */
static void run_until_signal(srv_service *svc, const sigset_t *stop)
{
	int sig = 0;
	long waited = 0;

	sigwait(stop, &sig);
	atomic_store(&svc->draining, 1);
	fprintf(stderr, "pkad: signal %d: finishing %ld requests in flight\n", sig,
		(long)atomic_load(&svc->in_flight));
	while (atomic_load(&svc->in_flight) > 0 && waited < (long)(svc->cfg->grace * 1000)) {
		sleep_ms(20);
		waited += 20;
	}
}

static void print_listening(const srv_config *c, int port)
{
	int v6 = strchr(c->bind, ':') != NULL;

	printf("pkad: listening on http://%s%s%s:%d\n", v6 ? "[" : "", c->bind, v6 ? "]" : "",
	       port);
	fflush(stdout);
}

int cmd_serve(int argc, char **argv)
{
	srv_config cfg;
	srv_service svc;
	pred_model *model = NULL;
	pred_error err = {0, ""};
	srv_http *http = NULL;
	sigset_t stop;
	char msg[256];
	int rc = parse_options(&cfg, argc, argv), port = 0;

	if (rc)
		return rc == 1 ? 0 : 2;
	/* Every thread started from here on inherits the mask; only sigwait sees the signals. */
	sigemptyset(&stop);
	sigaddset(&stop, SIGTERM);
	sigaddset(&stop, SIGINT);
	pthread_sigmask(SIG_BLOCK, &stop, NULL);
	signal(SIGPIPE, SIG_IGN);
	rc = 1;
	if (service_open(&svc, &cfg, &model) < 0)
		goto done;
	if (srv_pool_new(&svc.pool, model, cfg.threads, cfg.queue, &err) < 0) {
		fprintf(stderr, "pkad serve: %s\n", err.msg);
		goto done;
	}
	if (srv_http_start(&http, &svc, &port, msg, sizeof msg) < 0) {
		fprintf(stderr, "pkad serve: %s\n", msg);
		goto done;
	}
	print_listening(&cfg, port);
	run_until_signal(&svc, &stop);
	rc = 0;
done:
	srv_http_stop(http);
	service_close(&svc, model);
	return rc;
}
