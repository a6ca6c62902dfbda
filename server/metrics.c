/* SPDX-License-Identifier: MIT */
/* metrics.c: counters of the daemon and their Prometheus text exposition. */
#include "metrics.h"

#include <pthread.h>
#include <stdlib.h>

#include "cache.h"
#include "routes.h"
#include "strbuf.h"
#include "worker_pool.h"

/* Statuses the daemon answers; anything else is counted under the last slot. */
static const int statuses[] = {200, 400, 401, 404, 405, 413, 415, 422, 429, 500, 503, 0};
#define N_STATUS (sizeof statuses / sizeof statuses[0])

/* Latency bucket bounds in seconds (upper, inclusive), then +Inf. */
static const double bounds[] = {0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1,
				0.25,  0.5,    1,     2.5,  5,     10};
#define N_BOUNDS (sizeof bounds / sizeof bounds[0])

struct srv_metrics {
	pthread_mutex_t mu;
	size_t n_routes;
	unsigned long long *requests; /* [(n_routes + 1) * N_STATUS] */
	unsigned long long buckets[N_BOUNDS + 1];
	double seconds_sum;
	unsigned long long seconds_count, molecules, item_errors;
};

srv_metrics *srv_metrics_new(size_t n_routes)
{
	srv_metrics *m = calloc(1, sizeof *m);
	if (!m)
		return NULL;
	m->n_routes = n_routes;
	m->requests = calloc((n_routes + 1) * N_STATUS, sizeof *m->requests);
	if (!m->requests) {
		free(m);
		return NULL;
	}
	pthread_mutex_init(&m->mu, NULL);
	return m;
}

void srv_metrics_free(srv_metrics *m)
{
	if (!m)
		return;
	pthread_mutex_destroy(&m->mu);
	free(m->requests);
	free(m);
}

static size_t status_slot(int status)
{
	size_t i = 0;
	while (i + 1 < N_STATUS && statuses[i] != status)
		i++;
	return i;
}

void srv_metrics_request(srv_metrics *m, size_t route, int status, double seconds,
			 int molecules, int item_errors)
{
	size_t b = 0;

	if (route > m->n_routes)
		route = m->n_routes;
	while (b < N_BOUNDS && seconds > bounds[b])
		b++;
	pthread_mutex_lock(&m->mu);
	m->requests[route * N_STATUS + status_slot(status)]++;
	m->buckets[b]++;
	m->seconds_sum += seconds;
	m->seconds_count++;
	m->molecules += (unsigned long long)(molecules - item_errors);
	m->item_errors += (unsigned long long)item_errors;
	pthread_mutex_unlock(&m->mu);
}

static void render_requests(srv_buf *b, const srv_metrics *m)
{
	srv_buf_puts(b, "# HELP pkad_http_requests_total HTTP requests answered, by route and status.\n"
			"# TYPE pkad_http_requests_total counter\n");
	for (size_t r = 0; r <= m->n_routes; r++) {
		const char *method = r < m->n_routes ? srv_routes[r].method : "any";
		const char *path = r < m->n_routes ? srv_routes[r].label : "unmatched";
		for (size_t s = 0; s < N_STATUS; s++) {
			unsigned long long n = m->requests[r * N_STATUS + s];
			if (!n)
				continue;
			srv_buf_printf(b, "pkad_http_requests_total{method=\"%s\",route=\"%s\",status=\"", method, path);
			if (statuses[s])
				srv_buf_printf(b, "%d\"} %llu\n", statuses[s], n);
			else
				srv_buf_printf(b, "other\"} %llu\n", n);
		}
	}
}

static void render_latency(srv_buf *b, const srv_metrics *m)
{
	unsigned long long cum = 0;

	srv_buf_puts(b, "# HELP pkad_http_request_duration_seconds Time from request to last byte queued.\n"
			"# TYPE pkad_http_request_duration_seconds histogram\n");
	for (size_t i = 0; i < N_BOUNDS; i++) {
		cum += m->buckets[i];
		srv_buf_printf(b, "pkad_http_request_duration_seconds_bucket{le=\"%g\"} %llu\n",
			       bounds[i], cum);
	}
	cum += m->buckets[N_BOUNDS];
	srv_buf_printf(b, "pkad_http_request_duration_seconds_bucket{le=\"+Inf\"} %llu\n", cum);
	srv_buf_printf(b, "pkad_http_request_duration_seconds_sum %.6f\n", m->seconds_sum);
	srv_buf_printf(b, "pkad_http_request_duration_seconds_count %llu\n", m->seconds_count);
}

static void render_counter(srv_buf *b, const char *name, const char *type, const char *help,
			   unsigned long long v)
{
	srv_buf_printf(b, "# HELP %s %s\n# TYPE %s %s\n%s %llu\n", name, help, name, type, name, v);
}

static void render_service(srv_buf *b, const srv_metrics *m, srv_service *svc)
{
	srv_cache_stats cs = {0};

	render_counter(b, "pkad_molecules_predicted_total", "counter",
		       "Molecules answered with a prediction.", m->molecules);
	render_counter(b, "pkad_molecule_errors_total", "counter",
		       "Molecules answered with a per-item error.", m->item_errors);
	if (svc->cache)
		srv_cache_stats_get(svc->cache, &cs);
	render_counter(b, "pkad_cache_hits_total", "counter", "Result cache hits.", cs.hits);
	render_counter(b, "pkad_cache_misses_total", "counter", "Result cache misses.", cs.misses);
	render_counter(b, "pkad_cache_evictions_total", "counter", "Result cache evictions.",
		       cs.evictions);
	render_counter(b, "pkad_cache_entries", "gauge", "Results held in the cache.", cs.entries);
	render_counter(b, "pkad_http_requests_in_flight", "gauge", "Requests being answered.",
		       (unsigned long long)atomic_load(&svc->in_flight));
	render_counter(b, "pkad_queue_depth", "gauge", "Molecules waiting for a worker.",
		       svc->pool ? srv_pool_queued(svc->pool) : 0);
}

char *srv_metrics_render(srv_metrics *m, srv_service *svc)
{
	srv_buf b = {0};

	pthread_mutex_lock(&m->mu);
	render_requests(&b, m);
	render_latency(&b, m);
	render_service(&b, m, svc);
	pthread_mutex_unlock(&m->mu);
	return srv_buf_take(&b);
}
