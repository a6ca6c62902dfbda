/* SPDX-License-Identifier: MIT */
/* route_pka_post.c: POST /v1/pka with a JSON body, one molecule or a batch. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include <cjson/cJSON.h>

#include "http_errors.h"
#include "predict_job.h"
#include "route_pka.h"

/* One molecule of a request: its SMILES and id are borrowed from the parsed body. */
typedef struct pka_item {
	const char *smiles;
	const char *id;
	char num[32]; /* a numeric id, as text */
	srv_job job;
} pka_item;

typedef struct pka_body {
	double ph;
	int curves;
	size_t n;
	pka_item *items;
	int batch; /* "molecules" given: answer {"results":[...]} */
} pka_body;

/* Names the first key of obj outside allowed; 400 into out. */
static int unknown_field_or_reply(srv_response *out, const cJSON *obj,
				  const char *const *allowed, const char *where)
{
	for (const cJSON *c = obj->child; c; c = c->next) {
		size_t k = 0;
		while (allowed[k] && strcmp(allowed[k], c->string))
			k++;
		if (!allowed[k]) {
			srv_reply_error(out, "bad_request", "%sunknown field '%.60s'", where, c->string);
			return -1;
		}
	}
	return 0;
}

/* smiles (a string, required) and id (string or number, optional) of one object. */
static int item_or_reply(srv_response *out, const cJSON *obj, pka_item *it, const char *where)
{
	const cJSON *smiles = cJSON_GetObjectItemCaseSensitive(obj, "smiles");
	const cJSON *id = cJSON_GetObjectItemCaseSensitive(obj, "id");

	if (!cJSON_IsObject(obj))
		return srv_reply_error(out, "bad_request", "%snot an object", where), -1;
	if (!smiles)
		return srv_reply_error(out, "bad_request", "%smissing field 'smiles'", where), -1;
	if (!cJSON_IsString(smiles))
		return srv_reply_error(out, "bad_request", "%s'smiles' is not a string", where), -1;
	it->smiles = smiles->valuestring;
	if (cJSON_IsString(id)) {
		it->id = id->valuestring;
	} else if (cJSON_IsNumber(id)) {
		snprintf(it->num, sizeof it->num, "%.15g", id->valuedouble);
		it->id = it->num;
	} else if (id && !cJSON_IsNull(id)) {
		return srv_reply_error(out, "bad_request", "%s'id' is not a string or number", where), -1;
	}
	return 0;
}

static int options_or_reply(srv_response *out, const cJSON *root, pka_body *b)
{
	const cJSON *ph = cJSON_GetObjectItemCaseSensitive(root, "ph");
	const cJSON *curves = cJSON_GetObjectItemCaseSensitive(root, "curves");

	b->ph = 7.4;
	if (ph && (!cJSON_IsNumber(ph) || ph->valuedouble < -2 || ph->valuedouble > 16))
		return srv_reply_error(out, "bad_request", "'ph' is not a number in -2..16"), -1;
	if (ph)
		b->ph = ph->valuedouble;
	if (curves && !cJSON_IsBool(curves))
		return srv_reply_error(out, "bad_request", "'curves' is not true or false"), -1;
	b->curves = cJSON_IsTrue(curves);
	return 0;
}

static int molecules_or_reply(srv_response *out, const cJSON *mols, pka_body *b,
			      srv_service *svc)
{
	char where[48];
	size_t n = 0;

	if (!cJSON_IsArray(mols))
		return srv_reply_error(out, "bad_request", "'molecules' is not an array"), -1;
	n = (size_t)cJSON_GetArraySize(mols);
	if (n > (size_t)svc->cfg->max_batch)
		return srv_reply_error(out, "too_many_molecules", "%zu molecules; the limit is %d",
				       n, svc->cfg->max_batch), -1;
	b->n = n;
	b->batch = 1;
	b->items = calloc(n ? n : 1, sizeof *b->items);
	if (!b->items)
		return srv_reply_error(out, "out_of_memory", "out of memory"), -1;
	n = 0;
	for (const cJSON *m = mols->child; m; m = m->next, n++) {
		static const char *const allowed[] = {"smiles", "id", NULL};
		snprintf(where, sizeof where, "molecules[%zu]: ", n);
		if (item_or_reply(out, m, &b->items[n], where) < 0 ||
		    unknown_field_or_reply(out, m, allowed, where) < 0)
			return -1;
		if (!b->items[n].id) {
			/* Like `pkad predict`: a record without an id is named by its position. */
			snprintf(b->items[n].num, sizeof b->items[n].num, "%zu", n + 1);
			b->items[n].id = b->items[n].num;
		}
	}
	return 0;
}

/* Parses the whole body into b (borrowing strings from root); 4xx into out. */
static int body_or_reply(srv_response *out, const cJSON *root, pka_body *b, srv_service *svc)
{
	static const char *const allowed[] = {"smiles", "id", "molecules", "ph", "curves", NULL};
	const cJSON *mols = cJSON_GetObjectItemCaseSensitive(root, "molecules");

	if (!cJSON_IsObject(root))
		return srv_reply_error(out, "bad_request", "the body is not a JSON object"), -1;
	if (unknown_field_or_reply(out, root, allowed, "") < 0 || options_or_reply(out, root, b) < 0)
		return -1;
	if (mols && cJSON_GetObjectItemCaseSensitive(root, "smiles"))
		return srv_reply_error(out, "bad_request", "give 'smiles' or 'molecules', not both"), -1;
	if (mols)
		return molecules_or_reply(out, mols, b, svc);
	b->n = 1;
	b->items = calloc(1, sizeof *b->items);
	if (!b->items)
		return srv_reply_error(out, "out_of_memory", "out of memory"), -1;
	return item_or_reply(out, root, &b->items[0], "");
}

/* Runs every item in order through the cache and workers. -1 when the queue was full. */
static int run_items(srv_service *svc, pka_body *b)
{
	srv_run run;
	size_t started = 0;
	int refused = 0;

	srv_run_init(&run, svc, b->ph, b->curves);
	for (size_t i = 0; i < b->n && !refused; i++) {
		if (i >= run.window)
			srv_run_finish(&run, &b->items[i - run.window].job);
		b->items[i].job.input = b->items[i].smiles;
		refused = srv_run_start(&run, &b->items[i].job) < 0;
		started = i + 1;
	}
	for (size_t i = started > run.window ? started - run.window : 0; i < started; i++)
		srv_run_finish(&run, &b->items[i].job);
	srv_run_destroy(&run);
	return refused ? -1 : 0;
}

static int encode_answer(srv_response *out, const pka_body *b)
{
	srv_buf buf = {0};
	int status = 200;

	if (b->batch)
		srv_buf_puts(&buf, "{\"results\":[");
	for (size_t i = 0; i < b->n; i++) {
		if (i)
			srv_buf_puts(&buf, ",");
		srv_job_append(&buf, &b->items[i].job, b->items[i].id);
		out->item_errors += b->items[i].job.code != 0;
	}
	if (b->batch)
		srv_buf_puts(&buf, "]}");
	else if (b->items[0].job.code)
		status = srv_error_status(pred_status_name(b->items[0].job.code));
	out->molecules = (int)b->n;
	return srv_reply_body(out, status, "application/json", srv_buf_take(&buf));
}

static int run_and_encode(srv_response *out, srv_service *svc, pka_body *b)
{
	if (b->n)
		snprintf(out->log_smiles, sizeof out->log_smiles, "%s", b->items[0].smiles);
	if (run_items(svc, b) < 0) {
		out->retry_after = 1;
		return srv_reply_error(out, "overloaded", "the work queue is full; retry later");
	}
	return encode_answer(out, b);
}

int srv_route_pka_post(srv_response *out, const srv_request *req, srv_service *svc)
{
	pka_body b = {0};
	cJSON *root = NULL;
	size_t err_at = 0;

	if (!srv_media_type_is(req->content_type, "application/json"))
		return srv_reply_error(out, "unsupported_media_type",
				       "content type '%.60s' is not application/json or "
				       "application/x-ndjson", req->content_type ? req->content_type : "");
	if (req->n_query)
		return srv_reply_error(out, "bad_request", "unknown query parameter '%.60s'",
				       req->query[0].key);
	root = srv_json_parse(svc, req->body, req->body_len, &err_at);
	if (!root)
		srv_reply_error(out, "bad_request", "malformed JSON near byte %zu", err_at);
	else if (body_or_reply(out, root, &b, svc) == 0)
		run_and_encode(out, svc, &b);
	for (size_t i = 0; i < b.n && b.items; i++)
		srv_job_clear(&b.items[i].job);
	free(b.items);
	cJSON_Delete(root);
	return out->status;
}
