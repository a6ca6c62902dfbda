/* SPDX-License-Identifier: MIT */
/* test_concurrency.c: 16 parallel clients, different molecules each; every answer of the
 * daemon equals the answer of `pkad predict` for the same molecule (ids aside). */
#include <pthread.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include <cjson/cJSON.h>

#include "harness.h"
#include "http_client.h"

/* Debian package rdkit-data: the first 5,000 structures of the NCI open database. */
#define NCI_SET "/usr/share/RDKit/Data/NCI/first_5K.smi"
#define N_CLIENTS 16
#define PER_CLIENT 24
#define N_MOLS (N_CLIENTS * PER_CLIENT)

static char *smiles[N_MOLS];
static char *answer[N_MOLS]; /* daemon's answer without id, unformatted */
static hc_daemon daemon_proc = {-1, -1};

static void on_alarm(int sig)
{
	(void)sig;
	if (daemon_proc.pid > 0)
		kill(daemon_proc.pid, SIGKILL);
	_exit(1);
}

static int read_molecules(void)
{
	FILE *f = fopen(NCI_SET, "r");
	char line[4096];
	int n = 0;

	if (!f)
		return -1;
	while (n < N_MOLS && fgets(line, sizeof line, f)) {
		line[strcspn(line, " \t\r\n")] = '\0';
		if (*line)
			smiles[n++] = strdup(line);
	}
	fclose(f);
	return n == N_MOLS ? 0 : -1;
}

/* A placeholder answer, allocated like cJSON's printed text. */
static char *cjson_text(const char *s)
{
	cJSON *o = cJSON_CreateString(s);
	char *t = cJSON_PrintUnformatted(o);
	cJSON_Delete(o);
	return t;
}

static char *without_id(cJSON *o)
{
	cJSON_DeleteItemFromObjectCaseSensitive(o, "id");
	return cJSON_PrintUnformatted(o);
}

/* Molecule i by GET (even i) or by a one-molecule POST (odd i). */
static void ask_one(int i)
{
	char path[8192], enc[8000], head[] = "Content-Type: application/json\r\n";
	hc_response r;
	cJSON *o;

	if (i % 2 == 0) {
		hc_urlencode(enc, sizeof enc, smiles[i]);
		snprintf(path, sizeof path, "/v1/pka?smiles=%s", enc);
		hc_request(&r, daemon_proc.port, "GET", path, "", NULL, 0);
	} else {
		cJSON *req = cJSON_CreateObject();
		char *body;
		cJSON_AddStringToObject(req, "smiles", smiles[i]);
		body = cJSON_PrintUnformatted(req);
		hc_request(&r, daemon_proc.port, "POST", "/v1/pka", head, body, strlen(body));
		cJSON_free(body);
		cJSON_Delete(req);
	}
	o = cJSON_Parse(r.body ? r.body : "");
	answer[i] = o ? without_id(o) : cjson_text("(no answer)");
	cJSON_Delete(o);
	hc_response_free(&r);
}

/* The molecules of client c as one batch; results come back in order. */
static void ask_batch(int c)
{
	cJSON *req = cJSON_CreateObject(), *mols = cJSON_AddArrayToObject(req, "molecules");
	cJSON *root, *o;
	const char *head = "Content-Type: application/json\r\n";
	char *body;
	hc_response r;

	for (int k = 0; k < PER_CLIENT; k++) {
		cJSON *m = cJSON_CreateObject();
		cJSON_AddStringToObject(m, "smiles", smiles[c * PER_CLIENT + k]);
		cJSON_AddItemToArray(mols, m);
	}
	body = cJSON_PrintUnformatted(req);
	hc_request(&r, daemon_proc.port, "POST", "/v1/pka", head, body, strlen(body));
	root = cJSON_Parse(r.body ? r.body : "");
	o = cJSON_GetObjectItem(root, "results");
	for (int k = 0; k < PER_CLIENT; k++) {
		cJSON *it = cJSON_GetArrayItem(o, k);
		answer[c * PER_CLIENT + k] = it ? without_id(it) : cjson_text("(no answer)");
	}
	cJSON_Delete(root);
	cJSON_free(body);
	cJSON_Delete(req);
	hc_response_free(&r);
}

static void *client(void *arg)
{
	int c = (int)(long)arg;

	if (c % 4 == 3)
		ask_batch(c);
	else
		for (int k = 0; k < PER_CLIENT; k++)
			ask_one(c * PER_CLIENT + k);
	return NULL;
}

/* `pkad predict` over the same molecules, one line each, in order; NULL-safe. */
static char **cli_answers(void)
{
	char path[] = "/tmp/pkad-conc-XXXXXX", cmd[8192], *line = malloc(1 << 20);
	const char *const *model = hc_model_args();
	char **out = calloc(N_MOLS, sizeof *out);
	int fd = mkstemp(path), n = 0;
	FILE *f = fdopen(fd, "w"), *p;

	for (int i = 0; i < N_MOLS; i++)
		fprintf(f, "%s %d\n", smiles[i], i);
	fclose(f);
	snprintf(cmd, sizeof cmd, "'%s' predict --threads 2 %s %s '%s'", getenv("PKAD_BIN"),
		 model[0] ? model[0] : "", model[0] ? model[1] : "", path);
	p = popen(cmd, "r");
	while (p && n < N_MOLS && fgets(line, 1 << 20, p)) {
		cJSON *o = cJSON_Parse(line);
		out[n++] = o ? without_id(o) : cjson_text("(bad cli line)");
		cJSON_Delete(o);
	}
	if (p)
		pclose(p);
	unlink(path);
	free(line);
	return out;
}

int main(void)
{
	const char *args[] = {"--threads", "4", "--cache-size", "0", NULL};
	pthread_t t[N_CLIENTS];
	char **want;
	int mismatches = 0;

	if (read_molecules() < 0) {
		printf("skipped: %s (Debian package rdkit-data) is missing\n", NCI_SET);
		return 77;
	}
	signal(SIGALRM, on_alarm);
	alarm(600);
	if (hc_daemon_start(&daemon_proc, args) < 0) {
		fprintf(stderr, "cannot start '%s serve'\n", getenv("PKAD_BIN"));
		return 1;
	}
	for (long c = 0; c < N_CLIENTS; c++)
		pthread_create(&t[c], NULL, client, (void *)c);
	for (int c = 0; c < N_CLIENTS; c++)
		pthread_join(t[c], NULL);
	/* exit status 0: under ThreadSanitizer a report makes it non-zero */
	CHECK_INT_EQ(hc_daemon_stop(&daemon_proc, 60), 0);
	want = cli_answers();
	for (int i = 0; i < N_MOLS; i++) {
		if (want[i] && answer[i] && !strcmp(want[i], answer[i]))
			continue;
		if (mismatches++ < 3)
			fprintf(stderr, "molecule %d '%s':\n  daemon %s\n  cli    %s\n", i, smiles[i],
				answer[i] ? answer[i] : "(null)", want[i] ? want[i] : "(null)");
	}
	CHECK_INT_EQ(mismatches, 0);
	printf("%d molecules from %d clients compared with pkad predict\n", N_MOLS, N_CLIENTS);
	for (int i = 0; i < N_MOLS; i++) {
		cJSON_free(want[i]);
		cJSON_free(answer[i]);
		free(smiles[i]);
	}
	free(want);
	return harness_done();
}

