/* SPDX-License-Identifier: MIT */
/* record_reader.h: streams SMILES lines or SD records from a FILE*, one record at a time. */
#ifndef PKAD_RECORD_READER_H
#define PKAD_RECORD_READER_H

#include <stddef.h>
#include <stdio.h>

#include "predictor.h"

/* Bounds that keep memory flat on hostile input: a longer SMILES line or SD record is
 * consumed and answered with a PRED_ELIMIT record error. */
#define SRV_MAX_LINE (256u * 1024u)
#define SRV_MAX_SD_RECORD (8u * 1024u * 1024u)

typedef enum srv_input_format {
	SRV_IN_AUTO = 0, /* file extension, else content ("$$$$", "M  END", V2000/V3000) */
	SRV_IN_SMILES = 1,
	SRV_IN_SDF = 2
} srv_input_format;

/** One input record. When err.code is nonzero the record could not be read (over-long,
 *  NUL byte, no "M  END"); text then holds a short prefix for the error echo. */
typedef struct srv_record {
	size_t number;  /* 1-based position among the records */
	pred_format fmt;
	char *text;     /* SMILES token, or the mol block through its "M  END" line */
	char *id;       /* ID column, SD title, else the record number */
	char *raw;      /* SD: the whole record without its "$$$$" line; NULL for SMILES */
	pred_error err;
} srv_record;

typedef struct srv_reader srv_reader;

/** Reader over f (not closed by the reader). name is used for the extension check and may
 *  be NULL. Records are numbered from first_number. Returns 0 or PRED_ENOMEM / PRED_EINVAL
 *  (unknown format) with *out NULL. Free with srv_reader_free. One thread at a time. */
int srv_reader_new(srv_reader **out, FILE *f, const char *name, srv_input_format fmt,
		   size_t first_number, pred_error *err);
void srv_reader_free(srv_reader *rd);

/** Reads the next record: returns 1 and *out (free with srv_record_free), 0 at the end of
 *  the input, or a negative PRED_E* on a read error or when out of memory. */
int srv_reader_next(srv_record **out, srv_reader *rd, pred_error *err);
void srv_record_free(srv_record *rec);

/** The format the reader settled on (SRV_IN_SMILES or SRV_IN_SDF). */
srv_input_format srv_reader_format(const srv_reader *rd);

/** Number the next record would get (first_number + records read so far). */
size_t srv_reader_next_number(const srv_reader *rd);

/** Parses "smiles", "smi", "sdf", "sd" or "mol" (NULL or "auto" gives SRV_IN_AUTO).
 *  Returns 0 or PRED_EINVAL. */
int srv_input_format_parse(srv_input_format *out, const char *s);

#endif
