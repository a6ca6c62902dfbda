/* SPDX-License-Identifier: MIT */
/* json_validate.h: the JSON form of a validation run. */
#ifndef PKAD_JSON_VALIDATE_H
#define PKAD_JSON_VALIDATE_H

#include <cjson/cJSON.h>

#include "validate.h"

/** {"overall": stats, "classes": {name: stats}, "worst": [rows], "not_scored": [rows],
 *  "unreadable": n}; stats carry rows, found, rmse, mae, within_1, bias, coverage,
 *  calibration. NULL when out of memory. Caller frees with cJSON_Delete. */
cJSON *srv_validation_json(const srv_validation *v, size_t worst);

#endif
