/* SPDX-License-Identifier: MIT */
/* test_normalize.c: counter-ion stripping, neutralisation and tautomer standardisation. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "normalize.h"
#include "obwrap.h"
#include "tautomer.h"

static obw_ctx *ctx;

static char *canon(const char *smi)
{
	obw_mol *m = NULL;
	char *s = NULL;
	if (obw_mol_parse(&m, ctx, smi, OBW_SMILES, NULL, 0) == 0)
		s = obw_mol_canonical(m, ctx, NULL, 0);
	obw_mol_free(m);
	return s;
}

/* Runs norm_molecule then taut_standardise on smi; returns the canonical SMILES (malloc'd)
 * and fills rep; *mol_out (if given) receives the molecule. */
static char *run(const char *smi, norm_report *rep, obw_mol **mol_out)
{
	obw_mol *m = NULL;
	pred_error err = {0, ""};
	char *s = NULL;
	norm_report_init(rep);
	if (obw_mol_parse(&m, ctx, smi, OBW_SMILES, err.msg, sizeof err.msg)) {
		fprintf(stderr, "parse '%s': %s\n", smi, err.msg);
		return NULL;
	}
	if (norm_molecule(m, ctx, rep, &err) == 0 && taut_standardise(m, rep, &err) == 0)
		s = obw_mol_canonical(m, ctx, NULL, 0);
	else
		fprintf(stderr, "normalise '%s': %s\n", smi, err.msg);
	if (mol_out)
		*mol_out = m;
	else
		obw_mol_free(m);
	return s;
}

/* One named fragment against the expected one: the same molecule (compared as Open Babel
 * canonical SMILES, pkad names fragments in its own canonical order), or the same text
 * where the name is not SMILES ("(45 heavy atoms)"). */
static int same_fragment(const char *got, size_t gn, const char *want, size_t wn)
{
	char g[256], w[256];
	snprintf(g, sizeof g, "%.*s", (int)gn, got);
	snprintf(w, sizeof w, "%.*s", (int)wn, want);
	char *cg = canon(g), *cw = canon(w);
	int same = cg && cw ? strcmp(cg, cw) == 0 : strcmp(g, w) == 0;
	free(cg);
	free(cw);
	return same;
}

/* A warning "removed N fragments: A, B" matches needle when the text before the names is
 * equal and the names are the same molecules in the same order. */
static int fragment_warning_matches(const char *warn, const char *needle)
{
	const char *gw = strstr(warn, ": "), *nw = strstr(needle, ": ");
	if (!gw || !nw || gw - warn != nw - needle || strncmp(warn, needle, (size_t)(nw - needle)))
		return 0;
	for (gw += 2, nw += 2; *gw && *nw;) {
		size_t gn = strcspn(gw, ","), nn = strcspn(nw, ",");
		if (!same_fragment(gw, gn, nw, nn))
			return 0;
		gw += gn + (gw[gn] ? 2 : 0);
		nw += nn + (nw[nn] ? 2 : 0);
	}
	return !*gw && !*nw;
}

static int has_warning(const norm_report *rep, const char *needle)
{
	int fragments = strncmp(needle, "removed ", 8) == 0 && strstr(needle, "fragment");
	for (size_t i = 0; i < rep->n; i++)
		if (fragments ? fragment_warning_matches(rep->warn[i], needle)
			      : strstr(rep->warn[i], needle) != NULL)
			return 1;
	return 0;
}

/* input -> expected form (compared as canonical SMILES) and a phrase of the warning, NULL
 * when the input must come through unchanged with no warning. */
typedef struct norm_case {
	const char *input;
	const char *expect;
	const char *warning;
	const char *source;
} norm_case;

static void check_cases(const norm_case *cases, size_t n)
{
	for (size_t i = 0; i < n; i++) {
		norm_report rep;
		char *got = run(cases[i].input, &rep, NULL);
		char *want = canon(cases[i].expect);
		if (!got || !want || strcmp(got, want))
			fprintf(stderr, "case '%s' (%s):\n", cases[i].input, cases[i].source);
		CHECK_STR_EQ(got, want);
		if (cases[i].warning) {
			CHECK(has_warning(&rep, cases[i].warning));
		} else {
			CHECK_INT_EQ(rep.n, 0);
		}
		for (size_t k = 0; k < rep.n && (!got || !want || strcmp(got, want)); k++)
			fprintf(stderr, "  warning: %s\n", rep.warn[k]);
		free(got);
		free(want);
	}
}

/* Salts and mixtures: the parent is the organic part (common practice of compound
 * registration: strip counter-ions and solvent of crystallisation). */
static const norm_case fragment_cases[] = {
	{"[Na+].[O-]C(=O)c1ccccc1", "OC(=O)c1ccccc1", "removed 1 fragment: [Na+]", "common practice"},
	{"Cl.NCCc1ccccc1", "NCCc1ccccc1", "removed 1 fragment: Cl", "common practice"},
	{"CC(=O)O.O.O", "CC(=O)O", "removed 2 fragments: O, O", "common practice"},
	/* sulfuric acid has more heavy atoms, but the carbon-containing part is the parent */
	{"OS(=O)(=O)O.CN", "CN", "removed 1 fragment: OS(=O)(=O)O", "common practice"},
	{"c1ccccc1.CC(=O)O", "c1ccccc1", "removed 1 fragment: CC(=O)O", "common practice"},
	{"[Na+].[Cl-]", "[Na+]", "removed 1 fragment: [Cl-]", "common practice"},
	/* a big removed fragment is named by its size, not by a long SMILES */
	{"CCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCC.CCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCC",
	 "CCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCCC", "removed 1 fragment: (45 heavy atoms)",
	 "common practice"},
};

/* Charged forms that are just another protonation state of an acid or base become neutral;
 * permanent charges stay (common practice; the pKa model starts from the neutral acid). */
static const norm_case charge_cases[] = {
	{"[NH3+]CC([O-])=O", "NCC(=O)O", "neutralised 2 charged atoms", "glycine zwitterion"},
	{"[O-]c1ccccc1", "Oc1ccccc1", "O- (atom 0)", "phenoxide"},
	{"C[S-]", "CS", "S- (atom 1)", "thiolate"},
	{"CC[O-]", "CCO", "O- (atom 2)", "alkoxide"},
	{"CS(=O)(=O)[O-]", "CS(=O)(=O)O", "neutralised 1 charged atom", "sulfonate"},
	{"OP(=O)([O-])[O-]", "OP(=O)(O)O", "neutralised 2", "phosphate"},
	{"c1cc[nH+]cc1", "c1ccncc1", "N+ (atom 3)", "pyridinium"},
	{"C[NH+](C)C", "CN(C)C", "N+ (atom 1)", "trimethylammonium"},
	{"CC=[NH2+]", "CC=N", "N+", "iminium"},
	{"C[N+](C)(C)CC(=O)[O-]", "C[N+](C)(C)CC(=O)O", "O- (atom 7)",
	 "betaine: carboxylate neutralised, quaternary N+ stays"},
	{"C[N+](=O)[O-]", "C[N+](=O)[O-]", NULL, "nitro is a permanent charge pair"},
	{"[O-][n+]1ccccc1", "[O-][n+]1ccccc1", NULL, "pyridine N-oxide"},
	{"C[N+](C)(C)C", "C[N+](C)(C)C", NULL, "quaternary ammonium"},
	{"C[S+](C)C", "C[S+](C)C", NULL, "sulfonium"},
};

/* Drawn tautomers to the form that dominates in water. Lactam/amide/keto predominance:
 * common practice (heterocyclic chemistry textbooks; 2- and 4-pyridone, uracil, guanine and
 * the quinolones exist as the oxo forms in water). Phenols, 1,3-dicarbonyl enols and
 * reductones stay enols (common practice). */
static const norm_case tautomer_cases[] = {
	{"Oc1ccccn1", "O=c1cccc[nH]1", "input tautomer changed: lactim to lactam", "2-pyridone"},
	{"Oc1ccncc1", "O=c1cc[nH]cc1", "hydroxy-azine to azinone", "4-pyridone"},
	{"Oc1ccnc(O)n1", "O=c1cc[nH]c(=O)[nH]1", "input tautomer changed", "uracil"},
	{"Oc1ccc2ccccc2n1", "O=c1ccc2ccccc2[nH]1", "lactim to lactam", "2-quinolone"},
	/* the same lactams from the other Kekule form (C2=C3 drawn, the C=N away from C-OH):
	 * the H goes round the ring to the N beside C-OH */
	{"CCc1cccnc1O", "CCc1ccc[nH]c1=O", "lactim to lactam", "3-ethyl-2-pyridone as C2=C3"},
	{"Oc1ncccc1CC", "CCc1ccc[nH]c1=O", "lactim to lactam", "3-ethyl-2-pyridone as C2=N1"},
	{"Cc1nc2ccccc2nc1O", "O=c1[nH]c2ccccc2nc1C", "lactim to lactam",
	 "3-methylquinoxalin-2(1H)-one"},
	{"Oc1nccc2c1cccc2", "O=c1[nH]ccc2c1cccc2", "lactim to lactam", "isoquinolin-1(2H)-one"},
	/* through the fused ring: isoquinolin-3-ol in both Kekule forms, cinnolin-3-ol */
	{"OC1=NC=C2C=CC=CC2=C1", "O=c1[nH]cc2c(c1)cccc2", "lactim to lactam",
	 "isoquinolin-3(2H)-one as C3=N2"},
	{"OC1=CC2=CC=CC=C2C=N1", "O=c1[nH]cc2c(c1)cccc2", "lactim to lactam",
	 "isoquinolin-3(2H)-one as C3=C4"},
	{"Oc1nnc2c(c1)cccc2", "O=c1[nH]nc2c(c1)cccc2", "lactim to lactam", "cinnolin-3(2H)-one"},
	{"Oc1ccc2ncccc2c1", "Oc1ccc2c(c1)cccn2", NULL, "quinolin-6-ol stays (N not beside C-OH)"},
	{"Oc1cccnc1", "Oc1cccnc1", NULL, "3-hydroxypyridine stays (no lactam without a charge)"},
	{"Oc1ccnc2ccccc12", "O=c1cc[nH]c2ccccc12", "input tautomer changed", "4-quinolone"},
	{"Nc1nc(O)c2nc[nH]c2n1", "Nc1nc2[nH]cnc2c(=O)[nH]1", "lactim to lactam", "guanine"},
	/* between two ring N the H goes to the one away from the amino carbon, whichever the
	 * Kekule form bonds to C-OH by the double bond: cytosine is the 1H amino-oxo tautomer
	 * (common practice), and its thione and 5-amino relatives follow it */
	{"Nc1ccnc(O)n1", "Nc1cc[nH]c(=O)n1", "lactim to lactam", "cytosine, C2=N1 drawn"},
	{"Oc1nccc(N)n1", "Nc1cc[nH]c(=O)n1", "lactim to lactam", "cytosine, C2=N3 drawn"},
	{"Sc1ncc(c(n1)N)N", "Nc1nc(=S)[nH]cc1N", "thiolactim to thiolactam",
	 "4,5-diaminopyrimidine-2(1H)-thione"},
	/* one tautomer for every Kekule form and atom order: the N-H beside the C=O (4(3H)-
	 * pyrimidinone, the major form in water; common practice) before the N para to it, a
	 * thione before a lactam (thioamide tautomers are the more favoured, common practice),
	 * the para N where there is no N beside C-OH (pyridazin-4(1H)-one) */
	{"OC1=NC=NC=C1", "O=c1ccnc[nH]1", "lactim to lactam", "4(3H)-pyrimidinone as C4=N3"},
	{"OC1=CC=NC=N1", "O=c1ccnc[nH]1", "lactim to lactam", "4(3H)-pyrimidinone as C4=C5"},
	{"C1=NC=NC(O)=C1", "O=c1ccnc[nH]1", "lactim to lactam", "4(3H)-pyrimidinone, OH last"},
	{"OC1=CC(O)=NC=N1", "O=c1cc(O)nc[nH]1", "lactim to lactam",
	 "6-hydroxypyrimidin-4(3H)-one as C4=C5"},
	{"OC1=NC=NC(O)=C1", "O=c1cc(O)nc[nH]1", "lactim to lactam",
	 "6-hydroxypyrimidin-4(3H)-one as C4=N3"},
	{"OC1=CC(S)=NC=N1", "S=c1cc(O)nc[nH]1", "thiolactim to thiolactam",
	 "6-hydroxypyrimidine-4(3H)-thione, SH drawn second"},
	{"SC1=NC=NC(O)=C1", "S=c1cc(O)nc[nH]1", "thiolactim to thiolactam",
	 "6-hydroxypyrimidine-4(3H)-thione, SH drawn first"},
	{"OC1=CC=NN=C1", "O=c1cc[nH]nc1", "hydroxy-azine to azinone",
	 "pyridazin-4(1H)-one as C4=C5"},
	{"OC1=CN=NC=C1", "O=c1cc[nH]nc1", "hydroxy-azine to azinone",
	 "pyridazin-4(1H)-one as C3=C4"},
	{"Oc1ncnc2c1cccc2", "O=c1[nH]cnc2ccccc12", "lactim to lactam", "quinazolin-4(3H)-one"},
	/* a drawn 4(1H)-pyrimidinone goes to the 4(3H) form too (the same preference for the
	 * N-H beside the C=O), in monocyclic and fused rings; the N-H stays where it is beside
	 * another N (1,2,4-triazin-5(2H)-ones) or beside C-SH */
	{"O=c1cc[nH]cn1", "O=c1ccnc[nH]1", "4(1H)-azinone to the N-H beside the C=O",
	 "4(3H)-pyrimidinone from the 1H form"},
	{"CSc1cc(=O)nc[nH]1", "CSc1cc(=O)[nH]cn1", "4(1H)-azinone", "6-methylthio-4(3H)-one"},
	{"S=c1cc[nH]cn1", "S=c1ccnc[nH]1", "4(1H)-azinone", "pyrimidine-4(3H)-thione"},
	{"O=c1nc[nH]c2ccccc12", "O=c1[nH]cnc2ccccc12", "4(1H)-azinone",
	 "quinazolin-4(3H)-one from the 1H form"},
	{"O=c1nc[nH]c2nc[nH]c12", "O=c1[nH]cnc2nc[nH]c12", "4(1H)-azinone",
	 "hypoxanthine N3-H to N1-H"},
	{"O=c1cn[nH]c(n1)N", "Nc1nc(=O)cn[nH]1", NULL, "3-amino-1,2,4-triazin-5(2H)-one stays"},
	{"O=c1cc(S)[nH]cn1", "O=c1cc(S)[nH]cn1", NULL, "6-mercapto-4(1H)-one stays"},
	{"Cn1cnc(=O)cc1", "Cn1ccc(=O)nc1", NULL, "1-methyl-4(1H)-pyrimidinone stays"},
	/* of two N beside C-OH the one whose N-H keeps the benzo ring benzenoid (the more
	 * aromatic form, common practice): quinazolin-2(1H)-one, not the o-quinonoid 3H-one */
	{"Oc1ncc2c(n1)cccc2", "O=c1ncc2ccccc2[nH]1", "lactim to lactam", "quinazolin-2(1H)-one"},
	{"c1nc(O)nc2ccccc12", "O=c1ncc2ccccc2[nH]1", "lactim to lactam",
	 "quinazolin-2(1H)-one, other order"},
	/* 2,4-dihydroxypyridine: the 2-pyridone (N-H beside C=O) keeps the 4-OH */
	{"Oc1ccnc(c1)O", "O=c1cc(O)cc[nH]1", "lactim to lactam", "4-hydroxypyridin-2(1H)-one"},
	{"Nc1nc2nc[nH]c2c(O)n1", "Nc1nc2nc[nH]c2c(=O)[nH]1", "lactim to lactam",
	 "7H-guanine drawn C6=C5 (N1-H, not N3-H)"},
	{"CCC1(c2ccccc2)C(O)=NC(O)=NC1=O", "CCC1(c2ccccc2)C(=O)NC(=O)NC1=O", "lactim to lactam",
	 "phenobarbital"},
	{"CC(O)=N", "CC(N)=O", "input tautomer changed: iminol to amide", "acetamide"},
	{"C/C(O)=N/C", "CC(=O)NC", "iminol to amide", "N-methylacetamide, E/Z mark dropped"},
	{"CC(S)=N", "CC(N)=S", "thioiminol to thioamide", "thioacetamide"},
	{"CC(O)=C", "CC(C)=O", "input tautomer changed: enol to ketone", "acetone"},
	{"OC1=CCCCC1", "O=C1CCCCC1", "enol to ketone", "cyclohexanone"},
	{"C/C=C(/O)C", "CCC(C)=O", "enol to ketone", "butanone, E/Z mark dropped"},
	{"Oc1ccccc1", "Oc1ccccc1", NULL, "phenol stays"},
	{"Oc1cccnc1", "Oc1cccnc1", NULL, "3-hydroxypyridine has no lactam form"},
	{"Oc1cccc2cccnc12", "Oc1cccc2cccnc12", NULL, "8-hydroxyquinoline stays a phenol"},
	{"CC(O)=CC(C)=O", "CC(O)=CC(C)=O", NULL, "acetylacetone enol stays (conjugated)"},
	{"OC[C@H](O)[C@H]1OC(=O)C(O)=C1O", "OC[C@H](O)[C@H]1OC(=O)C(O)=C1O", NULL,
	 "ascorbic acid (reductone) stays"},
	{"CC(=O)O", "CC(=O)O", NULL, "acetic acid untouched"},
};

/* Zwitterion in a salt: counter-ion gone, charges neutralised, input indices kept. */
static void test_normalize__kept_atoms_keep_input_index(void)
{
	norm_report rep;
	obw_mol *m = NULL;
	char *s = run("[Na+].[NH3+]CC([O-])=O", &rep, &m);
	const obw_atom *a;
	size_t n = m ? obw_mol_atoms(m, &a) : 0;
	CHECK_INT_EQ(n, 5);
	CHECK(n == 5 && a[0].element == 7 && a[0].orig_index == 1 && a[0].hcount == 2);
	CHECK(n == 5 && a[3].element == 8 && a[3].orig_index == 4 && a[3].hcount == 1);
	CHECK_INT_EQ(rep.n, 2);
	free(s);
	obw_mol_free(m);
}

/* The tautomer step moves H only: same atoms, same input indices (2-pyridone). */
static void test_normalize__tautomer_keeps_atoms(void)
{
	norm_report rep;
	obw_mol *m = NULL;
	char *s = run("[H]Oc1ccccn1", &rep, &m);
	const obw_atom *a;
	size_t n = m ? obw_mol_atoms(m, &a) : 0;
	CHECK_INT_EQ(n, 7);
	CHECK(n == 7 && a[0].element == 8 && a[0].orig_index == 1 && a[0].hcount == 0);
	CHECK(n == 7 && a[6].element == 7 && a[6].orig_index == 7 && a[6].hcount == 1);
	CHECK(has_warning(&rep, "at atom 1 (H moved to atom 7)"));
	free(s);
	obw_mol_free(m);
}

static void test_normalize__report_is_bounded(void)
{
	norm_report rep;
	norm_report_init(&rep);
	for (int i = 0; i < 3 * NORM_WARN_MAX; i++)
		norm_warn(&rep, "warning %d", i);
	CHECK_INT_EQ(rep.n, NORM_WARN_MAX);
	CHECK_STR_EQ(rep.warn[NORM_WARN_MAX - 1], "... more changes");
}

static void test_normalize__fragments(void)
{
	check_cases(fragment_cases, sizeof fragment_cases / sizeof fragment_cases[0]);
}

static void test_normalize__charges(void)
{
	check_cases(charge_cases, sizeof charge_cases / sizeof charge_cases[0]);
}

static void test_normalize__tautomers(void)
{
	check_cases(tautomer_cases, sizeof tautomer_cases / sizeof tautomer_cases[0]);
}

int main(void)
{
	char msg[256] = "";
	CHECK_INT_EQ(obw_global_init(msg, sizeof msg), 0);
	ctx = obw_ctx_new();
	CHECK(ctx != NULL);
	if (!ctx)
		return harness_done();
	RUN(test_normalize__fragments);
	RUN(test_normalize__charges);
	RUN(test_normalize__tautomers);
	RUN(test_normalize__kept_atoms_keep_input_index);
	RUN(test_normalize__tautomer_keeps_atoms);
	RUN(test_normalize__report_is_bounded);
	obw_ctx_free(ctx);
	return harness_done();
}
