/* SPDX-License-Identifier: MIT */
/* harness.h: the tiny test harness shared by every test executable. */
#ifndef PKAD_HARNESS_H
#define PKAD_HARNESS_H

#include <math.h>
#include <stdio.h>
#include <string.h>

static int harness_failures;
static int harness_checks;

#define CHECK(cond)                                                                        \
	do {                                                                               \
		harness_checks++;                                                          \
		if (!(cond)) {                                                             \
			harness_failures++;                                                \
			fprintf(stderr, "%s:%d: check failed: %s\n", __FILE__, __LINE__, #cond); \
		}                                                                          \
	} while (0)

#define CHECK_INT_EQ(got, want)                                                            \
	do {                                                                               \
		long long g_ = (long long)(got), w_ = (long long)(want);                   \
		harness_checks++;                                                          \
		if (g_ != w_) {                                                            \
			harness_failures++;                                                \
			fprintf(stderr, "%s:%d: %s: got %lld, expected %lld\n", __FILE__,  \
				__LINE__, #got, g_, w_);                                   \
		}                                                                          \
	} while (0)

#define CHECK_STR_EQ(got, want)                                                            \
	do {                                                                               \
		const char *g_ = (got), *w_ = (want);                                      \
		harness_checks++;                                                          \
		if (!g_ || !w_ || strcmp(g_, w_)) {                                        \
			harness_failures++;                                                \
			fprintf(stderr, "%s:%d: %s: got '%s', expected '%s'\n", __FILE__,  \
				__LINE__, #got, g_ ? g_ : "(null)", w_ ? w_ : "(null)");   \
		}                                                                          \
	} while (0)

/* |got - want| <= tol; name the source of `want` beside each use. */
#define CHECK_NEAR(got, want, tol)                                                         \
	do {                                                                               \
		double g_ = (got), w_ = (want);                                            \
		harness_checks++;                                                          \
		if (!(fabs(g_ - w_) <= (tol))) {                                           \
			harness_failures++;                                                \
			fprintf(stderr, "%s:%d: %s: got %.3f, expected %.3f +- %.3f\n",    \
				__FILE__, __LINE__, #got, g_, w_, (double)(tol));          \
		}                                                                          \
	} while (0)

/* Call at the end of main: prints the closing line and returns the exit status. */
static inline int harness_done(void)
{
	printf("%d passed, %d failed\n", harness_checks - harness_failures, harness_failures);
	return harness_failures ? 1 : 0;
}

#define RUN(test_fn)                                                                       \
	do {                                                                               \
		int before_ = harness_failures;                                            \
		test_fn();                                                                 \
		if (harness_failures != before_)                                           \
			fprintf(stderr, "FAIL %s\n", #test_fn);                            \
	} while (0)

#endif
