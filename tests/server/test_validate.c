/* SPDX-License-Identifier: MIT */
/* test_validate.c: CSV reading with file:line:column errors, reference rows, statistics and
 * the SVG parity plot of `pkad validate` (no prediction involved). */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "harness.h"
#include "validate.h"

static srv_csv *parse(const char *text, pred_error *e)
{
	srv_csv *c = NULL;
	srv_csv_parse(&c, "t.csv", text, strlen(text), e);
	return c;
}

static void test_csv__reads_quotes_commas_and_crlf(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("name,smiles,pka\r\n\"acid, acetic\",CC(=O)O,4.76\r\n"
			   "\"say \"\"hi\"\"\",O,15.7\r\n", &e);
	CHECK(c != NULL);
	if (!c)
		return;
	CHECK_INT_EQ(srv_csv_rows(c), 2);
	CHECK_INT_EQ(srv_csv_cols(c), 3);
	CHECK_INT_EQ(srv_csv_column(c, "pka"), 2);
	CHECK_INT_EQ(srv_csv_column(c, "split"), -1);
	CHECK_STR_EQ(srv_csv_cell(c, 0, 0), "acid, acetic");
	CHECK_STR_EQ(srv_csv_cell(c, 1, 0), "say \"hi\"");
	CHECK_STR_EQ(srv_csv_cell(c, 1, 2), "15.7");
	CHECK_INT_EQ(srv_csv_line(c, 1), 3);
	CHECK_INT_EQ(srv_csv_colno(c, 0, 1), 16);
	srv_csv_free(c);
}

static void test_csv__quoted_newline_counts_lines(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("a,b\n\"x\ny\",1\nz,2\n", &e);
	CHECK(c != NULL);
	if (!c)
		return;
	CHECK_STR_EQ(srv_csv_cell(c, 0, 0), "x\ny");
	CHECK_INT_EQ(srv_csv_line(c, 1), 4);
	srv_csv_free(c);
}

static void test_csv__wrong_field_count_names_line_and_column(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("a,b,c\n1,2,3\n4,5\n", &e);
	CHECK(c == NULL);
	CHECK_INT_EQ(e.code, PRED_EDATA);
	CHECK_STR_EQ(e.msg, "t.csv:3:3: expected 3 fields, got 2");
}

static void test_csv__unterminated_quote_is_an_error(void)
{
	pred_error e = {0, ""};
	CHECK(parse("a,b\n1,\"open\n", &e) == NULL);
	CHECK_STR_EQ(e.msg, "t.csv:2:3: unterminated quoted field");
	CHECK(parse("a,b\n1,x\"y\n", &e) == NULL);
	CHECK_STR_EQ(e.msg, "t.csv:2:4: quote inside an unquoted field");
	CHECK(parse("", &e) == NULL);
	CHECK_STR_EQ(e.msg, "t.csv:1:1: empty file, expected a header row");
}

static void test_refs__bad_number_names_line_and_column(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("smiles,pka,kind\nCC(=O)O,4.76,acid\nO,abc,acid\n", &e);
	srv_ref *r = NULL;
	size_t n = 0;
	CHECK_INT_EQ(srv_ref_read(&r, &n, c, &e), PRED_EDATA);
	CHECK_STR_EQ(e.msg, "t.csv:3:3: pka: not a number 'abc'");
	CHECK(r == NULL);
	srv_csv_free(c);
	c = parse("smiles,pka,kind\nN,9.25,alkali\n", &e);
	CHECK_INT_EQ(srv_ref_read(&r, &n, c, &e), PRED_EDATA);
	CHECK_STR_EQ(e.msg, "t.csv:2:8: kind: expected acid or base, got 'alkali'");
	srv_csv_free(c);
	c = parse("smiles,kind\nN,base\n", &e);
	CHECK_INT_EQ(srv_ref_read(&r, &n, c, &e), PRED_EDATA);
	CHECK_STR_EQ(e.msg, "t.csv:1:1: missing column 'pka'");
	srv_csv_free(c);
}

static void test_refs__reads_optional_columns(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("name,smiles,pka,pka_index,site_class,kind,split\n"
			   "oxalic acid,OC(=O)C(=O)O,4.27,2,dicarboxylic_acid,acid,test\n", &e);
	srv_ref *r = NULL;
	size_t n = 0;
	CHECK_INT_EQ(srv_ref_read(&r, &n, c, &e), 0);
	CHECK_INT_EQ(n, 1);
	if (n == 1) {
		CHECK_INT_EQ(r[0].pka_index, 2);
		CHECK_INT_EQ(r[0].kind, PRED_ACID);
		CHECK_STR_EQ(r[0].site_class, "dicarboxylic_acid");
		CHECK_STR_EQ(r[0].split, "test");
		CHECK_STR_EQ(r[0].name, "oxalic acid");
		CHECK_NEAR(r[0].pka, 4.27, 1e-12);
	}
	free(r);
	srv_csv_free(c);
}

/* Glycine has two base rows in Perrin (9.78, 2.35) and two acid rows in Serjeant & Dempsey;
 * methylamine one base row (data/iupac-pka.csv). */
static void test_refs__counts_the_steps_of_each_molecule_and_kind(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("smiles,pka,pka_index,kind\n"
			   "NCC(=O)O,9.78,1,base\nCN,10.66,1,base\nNCC(=O)O,2.35,2,base\n"
			   "NCC(=O)O,2.35,1,acid\n", &e);
	srv_ref *r = NULL;
	size_t n = 0;
	CHECK_INT_EQ(srv_ref_read(&r, &n, c, &e), 0);
	CHECK_INT_EQ(n, 4);
	if (n == 4) {
		CHECK_INT_EQ(r[0].n_steps, 2);
		CHECK_INT_EQ(r[1].n_steps, 1);
		CHECK_INT_EQ(r[2].n_steps, 2);
		CHECK_INT_EQ(r[3].n_steps, 1);
		CHECK(r[0].listed == r[2].listed);
		CHECK(r[0].listed != r[3].listed);
		if (r[0].listed && r[0].listed->n == 2) {
			CHECK_INT_EQ(r[0].listed->index[0], 1);
			CHECK_INT_EQ(r[0].listed->index[1], 2);
			CHECK_NEAR(r[0].listed->pka[0], 9.78, 1e-12);
			CHECK_NEAR(r[0].listed->pka[1], 2.35, 1e-12);
		} else {
			CHECK(0);
		}
	}
	free(r);
	srv_csv_free(c);
}

/* Two books list the same step of acetic acid (4.76, 4.756: data/iupac-pka.csv style) and one
 * of them the fourth step only of a molecule (a compilation that skipped steps): the listed
 * steps are the distinct indices, ascending, with the mean of the values given for each. */
static void test_refs__listed_steps_are_distinct_and_averaged(void)
{
	pred_error e = {0, ""};
	srv_csv *c = parse("smiles,pka,pka_index,kind\n"
			   "CC(=O)O,4.76,1,acid\nOC(=O)CN(CC(=O)O)CC(=O)O,9.73,4,acid\n"
			   "CC(=O)O,4.756,1,acid\nOC(=O)CN(CC(=O)O)CC(=O)O,1.66,2,acid\n", &e);
	srv_ref *r = NULL;
	size_t n = 0;
	CHECK_INT_EQ(srv_ref_read(&r, &n, c, &e), 0);
	CHECK_INT_EQ(n, 4);
	if (n == 4 && r[0].listed && r[1].listed) {
		CHECK_INT_EQ(r[0].listed->n, 1);
		CHECK_NEAR(r[0].listed->pka[0], 4.758, 1e-9);
		CHECK_INT_EQ(r[1].listed->n, 2);
		CHECK_INT_EQ(r[1].listed->index[0], 2);
		CHECK_INT_EQ(r[1].listed->index[1], 4);
		CHECK_NEAR(r[1].listed->pka[0], 1.66, 1e-12);
		CHECK_INT_EQ(r[1].n_steps, 4);
	} else {
		CHECK(0);
	}
	free(r);
	srv_csv_free(c);
}

static void test_refs__auto_match_follows_the_site_class_column(void)
{
	pred_error e = {0, ""};
	srv_csv *core = parse("smiles,pka,kind,site_class\nO,15.7,acid,water_like\n", &e);
	srv_csv *book = parse("smiles,pka,kind,book\nO,15.7,acid,serjeant\n", &e);
	CHECK_INT_EQ(srv_match_mode("auto"), SRV_MATCH_AUTO);
	CHECK_INT_EQ(srv_match_mode("steps"), SRV_MATCH_STEPS);
	CHECK_INT_EQ(srv_match_mode("nearest"), -1);
	CHECK_INT_EQ(srv_match_steps(SRV_MATCH_AUTO, core), 0);
	CHECK_INT_EQ(srv_match_steps(SRV_MATCH_AUTO, book), 1);
	CHECK_INT_EQ(srv_match_steps(SRV_MATCH_KIND, book), 0);
	CHECK_INT_EQ(srv_match_steps(SRV_MATCH_STEPS, core), 1);
	srv_csv_free(core);
	srv_csv_free(book);
}

static void test_stats__figures_match_hand_computation(void)
{
	srv_stat s = {0};
	/* residuals +0.5, -1.5, +0.2 with uncertainties 0.6, 1.0, 0.1; one row without a site */
	srv_stat_add(&s, 5.0, 4.5, 0.6);
	srv_stat_add(&s, 3.0, 4.5, 1.0);
	srv_stat_add(&s, 9.2, 9.0, 0.1);
	srv_stat_add_missing(&s);
	CHECK_NEAR(srv_stat_rmse(&s), sqrt((0.25 + 2.25 + 0.04) / 3), 1e-12);
	CHECK_NEAR(srv_stat_mae(&s), (0.5 + 1.5 + 0.2) / 3, 1e-12);
	CHECK_NEAR(srv_stat_bias(&s), (0.5 - 1.5 + 0.2) / 3, 1e-12);
	CHECK_NEAR(srv_stat_within1(&s), 2.0 / 3, 1e-12);
	CHECK_NEAR(srv_stat_coverage(&s), 3.0 / 4, 1e-12);
	CHECK_NEAR(srv_stat_calibration(&s), 1.0 / 3, 1e-12);
	srv_stat empty = {0};
	CHECK(isnan(srv_stat_rmse(&empty)));
}

static void test_stats__classes_keep_first_appearance_order(void)
{
	srv_class_stats cs = {0};
	srv_stat_add(srv_class_stat(&cs, "phenol"), 10.0, 9.99, 0.3);
	srv_stat_add(srv_class_stat(&cs, "pyridine"), 5.2, 5.23, 0.3);
	srv_stat_add(srv_class_stat(&cs, "phenol"), 7.0, 7.15, 0.3);
	CHECK_INT_EQ(cs.n, 2);
	CHECK_STR_EQ(cs.names[0], "phenol");
	CHECK_INT_EQ(cs.stats[0].n_found, 2);
	srv_class_stats_clear(&cs);
	CHECK_INT_EQ(cs.n, 0);
}

static size_t count(const char *hay, const char *needle)
{
	size_t n = 0;
	for (const char *p = strstr(hay, needle); p; p = strstr(p + 1, needle))
		n++;
	return n;
}

static void test_plot__svg_has_points_band_line_and_legend(void)
{
	srv_point pts[3] = {{4.76, 4.70, 0}, {9.99, 10.3, 1}, {5.23, NAN, 1}};
	char *names[2] = {"carboxylic_acid", "a<b"};
	FILE *f = tmpfile();
	char buf[16384] = "";
	CHECK_INT_EQ(srv_plot_svg(f, pts, 3, names, 2, "parity"), 0);
	rewind(f);
	buf[fread(buf, 1, sizeof buf - 1, f)] = '\0';
	fclose(f);
	CHECK(strncmp(buf, "<svg ", 5) == 0);
	CHECK(strstr(buf, "</svg>\n") != NULL);
	CHECK_INT_EQ(count(buf, "<polygon"), 1);            /* the +-1 band */
	CHECK_INT_EQ(count(buf, "stroke-dasharray"), 1);    /* the 1:1 line */
	CHECK_INT_EQ(count(buf, "r=\"2.5\""), 2);           /* finite points only */
	CHECK_INT_EQ(count(buf, "r=\"4\""), 2);             /* legend swatches */
	CHECK(strstr(buf, "experimental pKa") && strstr(buf, "predicted pKa"));
	CHECK(strstr(buf, "a&lt;b") != NULL);
}

int main(void)
{
	RUN(test_csv__reads_quotes_commas_and_crlf);
	RUN(test_csv__quoted_newline_counts_lines);
	RUN(test_csv__wrong_field_count_names_line_and_column);
	RUN(test_csv__unterminated_quote_is_an_error);
	RUN(test_refs__bad_number_names_line_and_column);
	RUN(test_refs__reads_optional_columns);
	RUN(test_refs__counts_the_steps_of_each_molecule_and_kind);
	RUN(test_refs__listed_steps_are_distinct_and_averaged);
	RUN(test_refs__auto_match_follows_the_site_class_column);
	RUN(test_stats__figures_match_hand_computation);
	RUN(test_stats__classes_keep_first_appearance_order);
	RUN(test_plot__svg_has_points_band_line_and_legend);
	return harness_done();
}
