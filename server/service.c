/* SPDX-License-Identifier: MIT */
/* service.c: prediction options derived from the daemon's limits. */
#include "service.h"

#include <cjson/cJSON.h>

void srv_service_options(pred_options *out, const srv_service *svc, double ph, int curves)
{
	pred_options_init(out);
	out->ph = ph;
	out->curves = curves;
	out->max_heavy_atoms = svc->cfg->max_atoms;
	out->max_seconds = svc->cfg->timeout;
}

cJSON *srv_json_parse(srv_service *svc, const char *text, size_t n, size_t *err_at)
{
	const char *end = NULL;
	cJSON *root;

	pthread_mutex_lock(&svc->parse_mu);
	root = cJSON_ParseWithLengthOpts(text, n, &end, 0);
	pthread_mutex_unlock(&svc->parse_mu);
	*err_at = end && end >= text ? (size_t)(end - text) : 0;
	return root;
}
