/* SPDX-License-Identifier: MIT */
/* model.c: parameters of the loaded model, versions and release of the model. */
#include <stdlib.h>
#include <string.h>

#include "fragment_table.h"
#include "model.h"

static size_t id_hash(const char *id)
{
	size_t h = (size_t)2166136261u; /* FNV-1a */
	for (; *id; id++)
		h = (h ^ (unsigned char)*id) * 16777619u;
	return h;
}

/* The slot of id in m's index: the one holding it, else the empty one that ends its probe. */
static size_t param_slot(const pred_model *m, const char *id)
{
	size_t k = id_hash(id) % m->n_param_slots;
	while (m->param_slots[k] && strcmp(m->params[m->param_slots[k] - 1].id, id))
		k = (k + 1) % m->n_param_slots;
	return k;
}

/* Room for one more parameter, its index kept under half full; nonzero when out of memory. */
static int param_room(pred_model *m)
{
	if (m->n_params == m->cap_params) {
		size_t cap = m->cap_params ? 2 * m->cap_params : 256;
		pred_param *grown = realloc(m->params, cap * sizeof *grown);
		if (!grown)
			return 1;
		m->params = grown;
		m->cap_params = cap;
	}
	if (2 * (m->n_params + 1) <= m->n_param_slots)
		return 0;
	size_t n = m->n_param_slots ? 2 * m->n_param_slots : 1024;
	int *slots = calloc(n, sizeof *slots);
	if (!slots)
		return 1;
	free(m->param_slots);
	m->param_slots = slots;
	m->n_param_slots = n;
	for (size_t i = 0; i < m->n_params; i++)
		slots[param_slot(m, m->params[i].id)] = (int)i + 1;
	return 0;
}

int model_param_find(const pred_model *m, const char *id)
{
	if (!m->n_param_slots)
		return -1;
	int k = m->param_slots[param_slot(m, id)];
	return k - 1;
}

int model_param_add(pred_model *m, const char *id, double value, double prior_sd)
{
	int k = model_param_find(m, id);
	if (k >= 0)
		return k;
	if (strlen(id) >= sizeof m->params[0].id || param_room(m))
		return -1;
	pred_param *p = &m->params[m->n_params];
	memset(p, 0, sizeof *p);
	memcpy(p->id, id, strlen(id) + 1);
	p->value = p->prior = value;
	p->prior_sd = prior_sd;
	m->param_slots[param_slot(m, id)] = (int)m->n_params + 1;
	return (int)m->n_params++;
}

int frag_load_bases(pred_model *m, const char *dir, pred_error *err)
{
	char *text = NULL;
	int rc = frag_table_read(&text, dir, "bases.tsv", err);
	if (rc || !text)
		return rc;
	rc = base_table_parse(m, text, "fragments/bases.tsv", err);
	free(text);
	return rc;
}

const char *pred_model_params_version(const pred_model *m)
{
	return m->params_version;
}

const char *pred_model_data_version(const pred_model *m)
{
	return m->data_version;
}

static void free_bases(pred_model *m)
{
	for (size_t i = 0; i < m->n_bases; i++) {
		frag_base *b = &m->bases[i];
		free(b->name);
		free(b->aliases);
		free(b->conjugate_acid);
		free(b->conj_smiles);
		free(b->scale);
		free(b->byproduct);
		free(b->hazards);
		free(b->source);
	}
	free(m->bases);
}

void pred_model_free(pred_model *m)
{
	if (!m)
		return;
	for (size_t i = 0; i < m->n_sites; i++) {
		free(m->sites[i].smarts);
		free(m->sites[i].source);
	}
	for (size_t i = 0; i < m->n_substs; i++) {
		free(m->substs[i].smarts);
		free(m->substs[i].source);
	}
	for (size_t i = 0; i < m->n_corrs; i++) {
		free(m->corrs[i].sites);
		free(m->corrs[i].smarts);
		free(m->corrs[i].source);
	}
	free(m->sites);
	free(m->substs);
	free(m->corrs);
	free_bases(m);
	free(m->params);
	free(m->param_slots);
	free(m);
}
