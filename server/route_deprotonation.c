/* SPDX-License-Identifier: MIT */
/* route_deprotonation.c: POST /v1/deprotonation (base matching) and GET /v1/bases. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include <cjson/cJSON.h>

#include "http_errors.h"
#include "json_deprotonation.h"
#include "json_result.h"
#include "routes.h"

static int encode_or_reply(srv_response *out, cJSON *obj)
{
	char *text = srv_json_line(obj), *body = NULL;
	if (text && (body = malloc(strlen(text) + 1)))
		strcpy(body, text);
	cJSON_free(text);
	if (!body)
		return srv_reply_error(out, "out_of_memory", "out of memory");
	return srv_reply_body(out, 200, "application/json", body);
}

static int unknown_field_or_reply(srv_response *out, const cJSON *root)
{
	static const char *const allowed[] = {"smiles", "base", "equivalents", "atom", "id", NULL};
	for (const cJSON *c = root->child; c; c = c->next) {
		size_t k = 0;
		while (allowed[k] && strcmp(allowed[k], c->string))
			k++;
		if (!allowed[k])
			return srv_reply_error(out, "bad_request", "unknown field '%.60s'",
			                       c->string),
			       -1;
	}
	return 0;
}

/* Fills req from the body (strings borrowed from root); 400 into out. The values the
 * library checks (equivalents > 0, the atom being an acid site) it answers itself. */
static int request_or_reply(srv_response *out, const cJSON *root, pred_deprot_request *req)
{
	const cJSON *smiles = cJSON_GetObjectItemCaseSensitive(root, "smiles");
	const cJSON *base = cJSON_GetObjectItemCaseSensitive(root, "base");
	const cJSON *equiv = cJSON_GetObjectItemCaseSensitive(root, "equivalents");
	const cJSON *atom = cJSON_GetObjectItemCaseSensitive(root, "atom");
	if (!cJSON_IsObject(root))
		return srv_reply_error(out, "bad_request", "the body is not a JSON object"), -1;
	if (unknown_field_or_reply(out, root) < 0)
		return -1;
	if (!cJSON_IsString(smiles) || !cJSON_IsString(base))
		return srv_reply_error(out, "bad_request",
		                       "'smiles' and 'base' are required strings"),
		       -1;
	if (equiv && !cJSON_IsNumber(equiv))
		return srv_reply_error(out, "bad_request", "'equivalents' is not a number"), -1;
	if (atom && !cJSON_IsNull(atom) &&
	    (!cJSON_IsNumber(atom) || atom->valuedouble < 0 || atom->valuedouble > 1e6 ||
	     atom->valuedouble != floor(atom->valuedouble)))
		return srv_reply_error(out, "bad_request", "'atom' is not an atom index"), -1;
	pred_deprot_request_init(req);
	req->substrate = smiles->valuestring;
	req->base = base->valuestring;
	if (equiv)
		req->equivalents = equiv->valuedouble;
	if (cJSON_IsNumber(atom))
		req->atom = (int)atom->valuedouble;
	return 0;
}

/* A worker of its own: base matching is an interactive question, not a batch, and the
 * prediction pool runs only pKa jobs. */
static int answer(srv_response *out, srv_service *svc, const pred_deprot_request *req,
                  const char *id)
{
	pred_worker *w = NULL;
	pred_deprotonation *d = NULL;
	pred_options opt;
	pred_error err = {0};
	srv_service_options(&opt, svc, 7.4, 0);
	int rc = pred_worker_new(&w, svc->model, &err);
	if (!rc)
		rc = pred_deprotonate(&d, w, req, &opt, &err);
	if (rc)
		srv_reply_error(out, srv_error_code(rc), "%s", err.msg);
	else
		encode_or_reply(out, srv_deprotonation_json(d, id, req->substrate));
	out->molecules = 1;
	pred_deprotonation_free(d);
	pred_worker_free(w);
	return out->status;
}

int srv_route_deprotonation(srv_response *out, const srv_request *req, srv_service *svc)
{
	pred_deprot_request dr;
	size_t err_at = 0;
	if (!srv_media_type_is(req->content_type, "application/json"))
		return srv_reply_error(out, "unsupported_media_type",
		                       "send the request as application/json");
	cJSON *root = srv_json_parse(svc, req->body, req->body_len, &err_at);
	if (!root)
		return srv_reply_error(out, "bad_request", "malformed JSON near byte %zu", err_at);
	if (request_or_reply(out, root, &dr) == 0) {
		const cJSON *id = cJSON_GetObjectItemCaseSensitive(root, "id");
		answer(out, svc, &dr, cJSON_IsString(id) ? id->valuestring : NULL);
	}
	cJSON_Delete(root);
	return out->status;
}

int srv_route_bases(srv_response *out, const srv_request *req, srv_service *svc)
{
	(void)req;
	if (!svc->model)
		return srv_reply_error(out, "internal_error", "no model loaded");
	return encode_or_reply(out, srv_bases_json(svc->model));
}
