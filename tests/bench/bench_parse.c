/* SPDX-License-Identifier: MIT */
/* bench_parse.c: the benchmark baseline: bare Open Babel SMILES parsing (through obwrap) of
 * every line of a SMILES file, one thread, nothing else. Prints molecules parsed. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "obwrap.h"

int main(int argc, char **argv)
{
	char msg[256], line[65536];
	size_t ok = 0, bad = 0;
	FILE *f;
	obw_ctx *c;
	if (argc != 2) {
		fprintf(stderr, "usage: bench_parse FILE.smi\n");
		return 2;
	}
	if (!(f = fopen(argv[1], "r"))) {
		perror(argv[1]);
		return 1;
	}
	if (obw_global_init(msg, sizeof msg) < 0 || !(c = obw_ctx_new())) {
		fprintf(stderr, "bench_parse: %s\n", msg);
		return 1;
	}
	while (fgets(line, sizeof line, f)) {
		obw_mol *m = NULL;
		line[strcspn(line, " \t\r\n")] = '\0';
		if (!line[0] || line[0] == '#')
			continue;
		if (obw_mol_parse(&m, c, line, OBW_SMILES, msg, sizeof msg) == 0)
			ok++;
		else
			bad++;
		obw_mol_free(m);
	}
	fclose(f);
	obw_ctx_free(c);
	printf("%zu parsed, %zu unreadable\n", ok, bad);
	return 0;
}
