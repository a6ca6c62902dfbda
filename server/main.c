/* SPDX-License-Identifier: MIT */
/* main.c: the pkad executable; dispatches subcommands from one table. */
#include <stdio.h>
#include <string.h>

#include "commands.h"
#include "predictor.h"

typedef struct command {
	const char *name;
	int (*run)(int argc, char **argv);
	const char *summary;
} command;

static const command commands[] = {
	{"predict", cmd_predict, "predict the pKa of every site of SMILES or SD records"},
	{"serve", cmd_serve, "run the HTTP/JSON daemon"},
	{"deprotonate", cmd_deprotonate, "will a base deprotonate the acid sites of a molecule"},
	{"validate", cmd_validate, "score the model against reference CSV files"},
	{"fit", cmd_fit, "refit the model's parameters on the train split"},
};

static void usage(FILE *f)
{
	fprintf(f, "usage: pkad <command> [options]\n\ncommands:\n");
	for (size_t i = 0; i < sizeof commands / sizeof commands[0]; i++)
		fprintf(f, "  %-12s %s\n", commands[i].name, commands[i].summary);
	fprintf(f, "\n'pkad <command> --help' shows the options of one command.\n");
}

int main(int argc, char **argv)
{
	if (argc < 2) {
		usage(stderr);
		return 2;
	}
	if (!strcmp(argv[1], "--help") || !strcmp(argv[1], "-h")) {
		usage(stdout);
		return 0;
	}
	if (!strcmp(argv[1], "--version")) {
		printf("pkad %s\n", pred_version());
		return 0;
	}
	for (size_t i = 0; i < sizeof commands / sizeof commands[0]; i++)
		if (!strcmp(argv[1], commands[i].name))
			return commands[i].run(argc - 1, argv + 1);
	fprintf(stderr, "pkad: unknown command '%s'\n", argv[1]);
	usage(stderr);
	return 2;
}
