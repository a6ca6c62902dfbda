/* SPDX-License-Identifier: MIT */
/* json_validate.c: the JSON form of a validation run (`pkad validate --format json`). */
#include <cjson/cJSON.h>
#include <stdlib.h>

#include "json_result.h"
#include "json_validate.h"

static cJSON *stat_json(const srv_stat *s)
{
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddNumberToObject(o, "rows", (double)s->n_rows);
	cJSON_AddNumberToObject(o, "found", (double)s->n_found);
	srv_json_add_number(o, "rmse", srv_stat_rmse(s), 3, NULL);
	srv_json_add_number(o, "mae", srv_stat_mae(s), 3, NULL);
	srv_json_add_number(o, "within_1", srv_stat_within1(s), 3, NULL);
	srv_json_add_number(o, "bias", srv_stat_bias(s), 3, NULL);
	srv_json_add_number(o, "coverage", srv_stat_coverage(s), 3, NULL);
	srv_json_add_number(o, "calibration", srv_stat_calibration(s), 3, NULL);
	return o;
}

static cJSON *eval_json(const srv_eval *e)
{
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddStringToObject(o, "file", e->file);
	cJSON_AddNumberToObject(o, "line", (double)e->ref->line);
	cJSON_AddStringToObject(o, "smiles", e->ref->smiles);
	cJSON_AddStringToObject(o, "kind", e->ref->kind == PRED_ACID ? "acid" : "base");
	cJSON_AddNumberToObject(o, "pka_index", e->ref->pka_index);
	srv_json_add_number(o, "experimental", e->ref->pka, 2, NULL);
	cJSON_AddStringToObject(o, "class", e->cls);
	if (e->status == SRV_EVAL_OK) {
		srv_json_add_number(o, "predicted", e->predicted, 2, NULL);
		srv_json_add_number(o, "uncertainty", e->uncertainty, 2, NULL);
		cJSON_AddStringToObject(o, "group", e->group);
	}
	cJSON_AddStringToObject(o, "diagnosis", e->status == SRV_EVAL_UNREADABLE ? e->msg
								  : e->diag);
	return o;
}

cJSON *srv_validation_json(const srv_validation *v, size_t worst)
{
	cJSON *o = cJSON_CreateObject(), *cl = cJSON_CreateObject(), *ws = cJSON_CreateArray();
	cJSON *bad = cJSON_CreateArray();
	size_t nw = 0, *w = srv_validation_worst(v, &nw);
	if (!o || !cl || !ws || !bad || !w) {
		cJSON_Delete(o), cJSON_Delete(cl), cJSON_Delete(ws), cJSON_Delete(bad);
		free(w);
		return NULL;
	}
	cJSON_AddItemToObject(o, "overall", stat_json(&v->all));
	for (size_t i = 0; i < v->classes.n; i++)
		cJSON_AddItemToObject(cl, v->classes.names[i], stat_json(&v->classes.stats[i]));
	cJSON_AddItemToObject(o, "classes", cl);
	for (size_t i = 0; i < nw && i < worst; i++)
		cJSON_AddItemToArray(ws, eval_json(&v->evals[w[i]]));
	cJSON_AddItemToObject(o, "worst", ws);
	for (size_t i = 0; i < v->n_evals; i++)
		if (v->evals[i].status != SRV_EVAL_OK)
			cJSON_AddItemToArray(bad, eval_json(&v->evals[i]));
	cJSON_AddItemToObject(o, "not_scored", bad);
	cJSON_AddNumberToObject(o, "unreadable", (double)v->n_unreadable);
	free(w);
	return o;
}
