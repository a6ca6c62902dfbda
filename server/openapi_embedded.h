/* SPDX-License-Identifier: MIT */
/* openapi_embedded.h: server/openapi.json, compiled in by cmake/embed_file.cmake. */
#ifndef PKAD_OPENAPI_EMBEDDED_H
#define PKAD_OPENAPI_EMBEDDED_H

extern const char srv_openapi_json[];

#endif
