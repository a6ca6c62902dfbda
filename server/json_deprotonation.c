/* SPDX-License-Identifier: MIT */
/* json_deprotonation.c: JSON of base-matching results and of the reagent-base table. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "json_deprotonation.h"
#include "json_result.h"

/* Adds a string made valid UTF-8 (user input may not be). */
static int add_text(cJSON *obj, const char *name, const char *s)
{
	char *clean = srv_utf8_clean(s, strlen(s));
	cJSON *item = clean ? cJSON_AddStringToObject(obj, name, clean) : NULL;
	free(clean);
	return item != NULL;
}

/* A JSON array of the pieces of a separated list ("a,b" or "x; y"), trimmed. */
static cJSON *split_list(const char *s, char sep)
{
	cJSON *arr = cJSON_CreateArray();
	for (const char *p = s; arr && p && *p;) {
		p += strspn(p, " ");
		size_t len = strcspn(p, (char[]){sep, 0});
		size_t keep = len;
		while (keep && p[keep - 1] == ' ')
			keep--;
		char *piece = keep ? srv_utf8_clean(p, keep) : NULL;
		if (piece)
			cJSON_AddItemToArray(arr, cJSON_CreateString(piece));
		free(piece);
		p += len + (p[len] == sep);
	}
	return arr;
}

static cJSON *site_json(const pred_deprot_site *s)
{
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	cJSON_AddNumberToObject(o, "atom", s->atom);
	add_text(o, "element", s->element ? s->element : "");
	add_text(o, "group", s->group ? s->group : "");
	srv_json_add_number(o, "pka", s->pka, 2, NULL);
	srv_json_add_number(o, "uncertainty", s->uncertainty, 2, NULL);
	srv_json_add_number(o, "delta_pka", s->delta_pka, 2, NULL);
	srv_json_add_number(o, "log_k", s->log_k, 2, NULL);
	srv_json_add_number(o, "fraction", s->fraction, 4, NULL);
	add_text(o, "verdict", s->verdict);
	return o;
}

static cJSON *base_json(const pred_deprotonation *d)
{
	cJSON *b = cJSON_CreateObject();
	if (!b)
		return NULL;
	add_text(b, "name", pred_deprotonation_base(d));
	add_text(b, "conjugate_acid", pred_deprotonation_conjugate_acid(d));
	srv_json_add_number(b, "pka", pred_deprotonation_base_pka(d), 2, NULL);
	add_text(b, "scale", pred_deprotonation_scale(d));
	cJSON_AddBoolToObject(b, "predicted", pred_deprotonation_base_is_predicted(d));
	return b;
}

static cJSON *strings(size_t n, const char *(*get)(const pred_deprotonation *, size_t),
                      const pred_deprotonation *d)
{
	cJSON *arr = cJSON_CreateArray();
	for (size_t i = 0; arr && i < n; i++) {
		char *clean = srv_utf8_clean(get(d, i), strlen(get(d, i)));
		if (clean)
			cJSON_AddItemToArray(arr, cJSON_CreateString(clean));
		free(clean);
	}
	return arr;
}

cJSON *srv_deprotonation_json(const pred_deprotonation *d, const char *id, const char *input)
{
	cJSON *o = cJSON_CreateObject(), *sites = cJSON_CreateArray();
	if (!o || !sites) {
		cJSON_Delete(o);
		cJSON_Delete(sites);
		return NULL;
	}
	if (id)
		add_text(o, "id", id);
	if (input)
		add_text(o, "input", input);
	add_text(o, "substrate", pred_deprotonation_substrate(d));
	cJSON_AddItemToObject(o, "base", base_json(d));
	srv_json_add_number(o, "equivalents", pred_deprotonation_equivalents(d), 3, NULL);
	add_text(o, "byproduct", pred_deprotonation_byproduct(d));
	for (size_t i = 0; i < pred_deprotonation_site_count(d); i++)
		cJSON_AddItemToArray(sites, site_json(pred_deprotonation_site(d, i)));
	cJSON_AddItemToObject(o, "sites", sites);
	cJSON_AddItemToObject(
	    o, "warnings",
	    strings(pred_deprotonation_warning_count(d), pred_deprotonation_warning, d));
	cJSON_AddItemToObject(
	    o, "cautions",
	    strings(pred_deprotonation_caution_count(d), pred_deprotonation_caution, d));
	return o;
}

static cJSON *one_base(const pred_base_info *b)
{
	cJSON *o = cJSON_CreateObject();
	if (!o)
		return NULL;
	add_text(o, "name", b->name);
	cJSON_AddItemToObject(o, "aliases", split_list(b->aliases, ','));
	add_text(o, "conjugate_acid", b->conjugate_acid);
	add_text(o, "conjugate_acid_smiles", b->conjugate_acid_smiles);
	srv_json_add_number(o, "pka", b->pka, 2, NULL);
	add_text(o, "scale", b->scale);
	if (isfinite(b->pka_dmso))
		srv_json_add_number(o, "pka_dmso", b->pka_dmso, 2, NULL);
	else
		cJSON_AddNullToObject(o, "pka_dmso");
	cJSON_AddBoolToObject(o, "organometallic", b->is_organometallic);
	add_text(o, "byproduct", b->byproduct);
	cJSON_AddItemToObject(o, "hazards", split_list(b->hazards, ';'));
	add_text(o, "source", b->source);
	return o;
}

cJSON *srv_bases_json(const pred_model *m)
{
	cJSON *o = cJSON_CreateObject(), *arr = cJSON_CreateArray();
	if (!o || !arr) {
		cJSON_Delete(o);
		cJSON_Delete(arr);
		return NULL;
	}
	for (size_t i = 0; i < pred_base_count(m); i++) {
		pred_base_info b;
		pred_base(&b, m, i);
		cJSON_AddItemToArray(arr, one_base(&b));
	}
	cJSON_AddItemToObject(o, "bases", arr);
	return o;
}
