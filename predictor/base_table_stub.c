/* SPDX-License-Identifier: MIT */
/* base_table_stub.c: placeholder until the reagent-base table parser lands (issue 5). */
#include "fragment_table.h"

int base_table_parse(pred_model *m, const char *text, const char *file, pred_error *err)
{
	(void)m;
	(void)text;
	(void)file;
	(void)err;
	return 0;
}
