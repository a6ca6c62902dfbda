/* SPDX-License-Identifier: MIT */
/* test_obwrap_threads.c: workers with their own obw_ctx and patterns give the single-thread
 * results on the NCI set (the recipe of DESIGN.md "Known hazards"); run it under TSan too. */
#include <pthread.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "obwrap.h"

#define NCI_SET "/usr/share/RDKit/Data/NCI/first_5K.smi"
#define N_THREADS 2
#define MAX_MOLS 5000

static const char *smarts[] = {"[OX2H]C=O", "[OX2H]c", "[NX3;H2,H1;!$(NC=O)]", "n", "[#7+]",
			       "[SX4](=O)(=O)[OX2H,OX1-]", "c1ccccc1", "[R2]"};
enum { N_PATTERNS = sizeof smarts / sizeof smarts[0] };

typedef struct job {
	char **lines;
	size_t n;
	char **results; /* one malloc'd summary per line */
	int failed;
} job;

/* Double bonds drawn cis and trans (the NCI set has no '/' '\\' marks): maleic, fumaric
 * and citraconic acid, maleic acid with its hydrogens drawn, a diene (common practice). */
static const char *const marked[] = {"OC(=O)/C=C\\C(=O)O", "OC(=O)/C=C/C(=O)O",
				     "C/C(C(=O)O)=C/C(=O)O", "[H]/C(C(=O)O)=C(\\[H])C(=O)O",
				     "C/C=C/C=C\\C"};
enum { N_MARKED = sizeof marked / sizeof marked[0] };

static int load_lines(char ***out, const char *path)
{
	FILE *f = fopen(path, "r");
	char buf[8192];
	size_t n = 0;
	*out = NULL;
	if (!f)
		return -1;
	char **lines = calloc(MAX_MOLS + N_MARKED, sizeof *lines);
	for (size_t k = 0; lines && k < N_MARKED; k++)
		lines[n++] = strdup(marked[k]);
	while (lines && n < MAX_MOLS + N_MARKED && fgets(buf, sizeof buf, f))
		lines[n++] = strdup(buf);
	fclose(f);
	*out = lines;
	return (int)n;
}

/* Clone, deprotonate the first O-H, re-perceive, write: the edit path in the workers. */
static char *deprotonated(obw_ctx *c, const obw_mol *m)
{
	obw_mol *copy = NULL;
	const obw_atom *a;
	char *s = NULL;
	if (obw_mol_clone(&copy, m))
		return NULL;
	size_t na = obw_mol_atoms(copy, &a);
	for (size_t i = 0; i < na; i++) {
		if (a[i].element != 8 || a[i].hcount != 1 || a[i].charge)
			continue;
		if (obw_mol_set_atom(copy, (int)i, -1, 0) == 0 && obw_mol_refresh(copy, NULL, 0) == 0)
			s = obw_mol_canonical(copy, c, NULL, 0);
		break;
	}
	obw_mol_free(copy);
	return s;
}

/* Substituent pairs drawn cis about the molecule's double bonds (obw_mol_bond_cis, which
 * reads the stereo data the daemon's workers share no lock for). */
static int cis_pairs(const obw_mol *m)
{
	const obw_bond *b;
	size_t nb = obw_mol_bonds(m, &b);
	int n = 0;
	for (size_t k = 0; k < nb; k++) {
		if (b[k].order != 2 || b[k].aromatic)
			continue;
		for (size_t i = 0; i < nb; i++)
			for (size_t j = 0; j < nb; j++) {
				int x = b[i].a == b[k].a ? b[i].b : b[i].b == b[k].a ? b[i].a : -1;
				int y = b[j].a == b[k].b ? b[j].b : b[j].b == b[k].b ? b[j].a : -1;
				if (i != k && j != k && x >= 0 && y >= 0)
					n += obw_mol_bond_cis(m, x, b[k].a, b[k].b, y);
			}
	}
	return n;
}

/* Canonical SMILES, ring count, symmetry class count, cis pairs and the match count of
 * every pattern, as one comparable line (or the parse error). */
static char *summarise(obw_ctx *c, obw_pattern **pats, const char *line)
{
	char msg[256], buf[8192];
	obw_mol *m = NULL;
	if (obw_mol_parse(&m, c, line, OBW_SMILES, msg, sizeof msg))
		return strdup(msg);
	obw_rings r;
	const obw_atom *a;
	size_t na = obw_mol_atoms(m, &a);
	obw_mol_rings(m, &r);
	int *cls = calloc(na ? na : 1, sizeof *cls), maxc = 0;
	if (cls && obw_mol_symmetry(m, cls, na, msg, sizeof msg) == 0)
		for (size_t i = 0; i < na; i++)
			maxc = cls[i] > maxc ? cls[i] : maxc;
	free(cls);
	char *can = obw_mol_canonical(m, c, msg, sizeof msg);
	char *dep = deprotonated(c, m);
	int len = snprintf(buf, sizeof buf, "%s r%zu s%d z%d %s", can ? can : msg, r.n_rings,
			   maxc, cis_pairs(m), dep ? dep : "-");
	free(can);
	free(dep);
	for (int k = 0; k < N_PATTERNS && len > 0 && (size_t)len < sizeof buf; k++) {
		int *hits = NULL;
		int nm = obw_pattern_match(&hits, pats[k], m);
		free(hits);
		len += snprintf(buf + len, sizeof buf - (size_t)len, " %d", nm);
	}
	obw_mol_free(m);
	return strdup(buf);
}

/* A hand-written V2000 block of methanol (common practice): the mol-block reader runs in
 * the workers too. */
static const char methanol_mol[] =
	"methanol\n  handmade\n\n"
	"  2  1  0  0  0  0  0  0  0  0999 V2000\n"
	"    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"    1.4000    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0\n"
	"  1  2  1  0  0  0  0\nM  END\n";

static int molblock_ok(obw_ctx *c)
{
	obw_mol *m = NULL;
	char *s = NULL;
	if (obw_mol_parse(&m, c, methanol_mol, OBW_MOLBLOCK, NULL, 0) == 0)
		s = obw_mol_canonical(m, c, NULL, 0);
	int ok = s && !strcmp(s, "CO");
	free(s);
	obw_mol_free(m);
	return ok;
}

static void *run_job(void *arg)
{
	job *j = arg;
	obw_ctx *c = obw_ctx_new();
	obw_pattern *pats[N_PATTERNS] = {0};
	int ok = c != NULL;
	for (int k = 0; k < N_PATTERNS; k++)
		ok = ok && (pats[k] = obw_pattern_parse(smarts[k], NULL, 0)) != NULL;
	for (size_t i = 0; ok && i < j->n; i++) {
		j->results[i] = summarise(c, pats, j->lines[i]);
		ok = i % 50 || molblock_ok(c);
	}
	j->failed = !ok;
	for (int k = 0; k < N_PATTERNS; k++)
		obw_pattern_free(pats[k]);
	obw_ctx_free(c);
	return NULL;
}

/* Fresh threads whose very first call writes canonical SMILES of a molecule with a
 * stereocentre: Open Babel builds its per-thread atom typer right there, and that build
 * goes through the process-wide OBLocale. Under ThreadSanitizer this reported a race (and
 * in the daemon a corrupted heap) until the wrapper serialised the first use per thread. */
enum { N_FRESH = 8 };
static pthread_barrier_t fresh_start;

static void *fresh_thread(void *arg)
{
	char **out = arg;
	pthread_barrier_wait(&fresh_start);
	obw_ctx *c = obw_ctx_new();
	obw_mol *m = NULL;
	if (c && obw_mol_parse(&m, c, "N[C@@H](C)C(=O)O.[Na+]", OBW_SMILES, NULL, 0) == 0)
		*out = obw_mol_canonical(m, c, NULL, 0);
	obw_mol_free(m);
	obw_ctx_free(c);
	return NULL;
}

static void test_obwrap_threads__first_call_in_fresh_threads(void)
{
	pthread_t tid[N_FRESH];
	char *out[N_FRESH] = {0};
	CHECK_INT_EQ(pthread_barrier_init(&fresh_start, NULL, N_FRESH), 0);
	for (int t = 0; t < N_FRESH; t++)
		CHECK_INT_EQ(pthread_create(&tid[t], NULL, fresh_thread, &out[t]), 0);
	for (int t = 0; t < N_FRESH; t++)
		pthread_join(tid[t], NULL);
	pthread_barrier_destroy(&fresh_start);
	for (int t = 0; t < N_FRESH; t++) {
		CHECK(out[t] != NULL);
		CHECK_STR_EQ(out[t] ? out[t] : "", out[0] ? out[0] : "?");
	}
	for (int t = 0; t < N_FRESH; t++)
		free(out[t]);
}

static void free_results(char **r, size_t n)
{
	for (size_t i = 0; r && i < n; i++)
		free(r[i]);
	free(r);
}

/* Every thread's results equal the single-thread reference, line by line. */
static void compare(job *ref, job *jobs)
{
	for (int t = 0; t < N_THREADS; t++) {
		CHECK(!jobs[t].failed);
		size_t diff = 0;
		for (size_t i = 0; i < ref->n; i++)
			if (!jobs[t].results[i] || strcmp(jobs[t].results[i], ref->results[i])) {
				if (diff++ < 3)
					fprintf(stderr, "thread %d line %zu: '%s' vs '%s'\n", t, i + 1,
						jobs[t].results[i], ref->results[i]);
			}
		CHECK_INT_EQ(diff, 0);
	}
}

static void test_obwrap_threads__workers_match_single_thread(char **lines, size_t n)
{
	job ref = {lines, n, calloc(n, sizeof(char *)), 0}, jobs[N_THREADS];
	pthread_t tid[N_THREADS];
	run_job(&ref);
	CHECK(!ref.failed);
	/* the marked lines come first: maleic acid has one cis pair, fumaric acid none */
	CHECK(ref.results[0] && strstr(ref.results[0], " z1 "));
	CHECK(ref.results[1] && strstr(ref.results[1], " z0 "));
	for (int t = 0; t < N_THREADS; t++) {
		jobs[t] = (job){lines, n, calloc(n, sizeof(char *)), 0};
		CHECK_INT_EQ(pthread_create(&tid[t], NULL, run_job, &jobs[t]), 0);
	}
	for (int t = 0; t < N_THREADS; t++)
		pthread_join(tid[t], NULL);
	compare(&ref, jobs);
	printf("threads: %d workers x %zu molecules agree with one thread\n", N_THREADS, n);
	for (int t = 0; t < N_THREADS; t++)
		free_results(jobs[t].results, n);
	free_results(ref.results, n);
}

int main(void)
{
	char msg[256] = "", **lines = NULL;
	CHECK_INT_EQ(obw_global_init(msg, sizeof msg), 0);
	test_obwrap_threads__first_call_in_fresh_threads();
	int n = load_lines(&lines, NCI_SET);
	if (n < 0) {
		printf("skip: %s missing (install rdkit-data)\n", NCI_SET);
		return harness_done();
	}
	CHECK(n > 1000);
	test_obwrap_threads__workers_match_single_thread(lines, (size_t)n);
	free_results(lines, (size_t)n);
	return harness_done();
}
