// SPDX-License-Identifier: MIT
// header_cxx.cpp: predictor.h compiles alone as C++.
#include "predictor.h"
int header_cxx_dummy() { return PRED_OK; }
