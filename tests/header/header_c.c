/* SPDX-License-Identifier: MIT */
/* header_c.c: predictor.h compiles alone as C11. */
#include "predictor.h"
int header_c_dummy(void);
int header_c_dummy(void) { return PRED_OK; }
