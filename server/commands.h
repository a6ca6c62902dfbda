/* SPDX-License-Identifier: MIT */
/* commands.h: the pkad subcommands that main.c dispatches. */
#ifndef PKAD_COMMANDS_H
#define PKAD_COMMANDS_H

/* Each returns the process exit status: 0 success, 1 failure, 2 usage error.
 * argv[0] is the subcommand name. */
int cmd_predict(int argc, char **argv);
int cmd_serve(int argc, char **argv);
int cmd_deprotonate(int argc, char **argv);
int cmd_validate(int argc, char **argv);
int cmd_fit(int argc, char **argv);

#endif
