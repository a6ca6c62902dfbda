/* SPDX-License-Identifier: MIT */
/* validate_plot.c: the SVG parity plot (predicted against experimental pKa) of validate. */
#include <math.h>
#include <stdio.h>

#include "validate.h"

/* Plot geometry in SVG user units. */
enum { W = 640, H = 560, LEFT = 70, TOP = 40, SIZE = 440 };

/* A qualitative palette (Okabe & Ito 2008, colour-blind safe), then greys. */
static const char *const palette[] = {"#0072B2", "#D55E00", "#009E73", "#CC79A7",
				      "#E69F00", "#56B4E9", "#F0E442", "#000000",
				      "#7F7F7F", "#B3B3B3"};

typedef struct frame {
	double lo, hi;
} frame;

static double px(const frame *fr, double v)
{
	return LEFT + (v - fr->lo) / (fr->hi - fr->lo) * SIZE;
}

static double py(const frame *fr, double v)
{
	return TOP + SIZE - (v - fr->lo) / (fr->hi - fr->lo) * SIZE;
}

static const char *colour(size_t cls)
{
	size_t n = sizeof palette / sizeof palette[0];
	return palette[cls < n ? cls : n - 1];
}

/* Range covering every point, rounded out to whole units, at least -2..16. */
static frame range(const srv_point *pts, size_t n)
{
	frame fr = {-2, 16};
	for (size_t i = 0; i < n; i++) {
		double a = fmin(pts[i].reference, pts[i].predicted);
		double b = fmax(pts[i].reference, pts[i].predicted);
		if (isfinite(a) && a < fr.lo)
			fr.lo = floor(a);
		if (isfinite(b) && b > fr.hi)
			fr.hi = ceil(b);
	}
	return fr;
}

static void axes(FILE *f, const frame *fr)
{
	double step = (fr->hi - fr->lo) > 24 ? 4 : 2;
	fprintf(f, "<rect x=\"%d\" y=\"%d\" width=\"%d\" height=\"%d\" fill=\"none\" "
		   "stroke=\"#333\"/>\n", LEFT, TOP, SIZE, SIZE);
	for (double v = ceil(fr->lo / step) * step; v <= fr->hi + 1e-9; v += step) {
		fprintf(f, "<line x1=\"%.1f\" y1=\"%d\" x2=\"%.1f\" y2=\"%d\" stroke=\"#333\"/>"
			   "<text x=\"%.1f\" y=\"%d\" font-size=\"11\" text-anchor=\"middle\">%g"
			   "</text>\n", px(fr, v), TOP + SIZE, px(fr, v), TOP + SIZE + 5,
			px(fr, v), TOP + SIZE + 18, v);
		fprintf(f, "<line x1=\"%d\" y1=\"%.1f\" x2=\"%d\" y2=\"%.1f\" stroke=\"#333\"/>"
			   "<text x=\"%d\" y=\"%.1f\" font-size=\"11\" text-anchor=\"end\">%g"
			   "</text>\n", LEFT - 5, py(fr, v), LEFT, py(fr, v), LEFT - 8,
			py(fr, v) + 4, v);
	}
	fprintf(f, "<text x=\"%d\" y=\"%d\" font-size=\"13\" text-anchor=\"middle\">"
		   "experimental pKa</text>\n", LEFT + SIZE / 2, TOP + SIZE + 38);
	fprintf(f, "<text x=\"18\" y=\"%d\" font-size=\"13\" text-anchor=\"middle\" "
		   "transform=\"rotate(-90 18 %d)\">predicted pKa</text>\n", TOP + SIZE / 2,
		TOP + SIZE / 2);
}

/* The +-1 band as a polygon clipped to the frame, and the 1:1 line. */
static void band(FILE *f, const frame *fr)
{
	double lo = fr->lo, hi = fr->hi;
	fprintf(f, "<polygon fill=\"#999\" fill-opacity=\"0.2\" points=\"%.1f,%.1f %.1f,%.1f "
		   "%.1f,%.1f %.1f,%.1f %.1f,%.1f %.1f,%.1f\"/>\n",
		px(fr, lo), py(fr, lo + 1), px(fr, lo), py(fr, lo), px(fr, lo + 1), py(fr, lo),
		px(fr, hi), py(fr, hi - 1), px(fr, hi), py(fr, hi), px(fr, hi - 1), py(fr, hi));
	fprintf(f, "<line x1=\"%.1f\" y1=\"%.1f\" x2=\"%.1f\" y2=\"%.1f\" stroke=\"#555\" "
		   "stroke-dasharray=\"4 3\"/>\n", px(fr, lo), py(fr, lo), px(fr, hi),
		py(fr, hi));
}

static void legend(FILE *f, char *const *names, size_t n)
{
	int x = LEFT + SIZE + 12;
	fprintf(f, "<text x=\"%d\" y=\"%d\" font-size=\"12\" font-weight=\"bold\">class</text>\n",
		x, TOP + 8);
	for (size_t i = 0; i < n && i < 30; i++) {
		int y = TOP + 26 + (int)i * 16;
		fprintf(f, "<circle cx=\"%d\" cy=\"%d\" r=\"4\" fill=\"%s\"/><text x=\"%d\" "
			   "y=\"%d\" font-size=\"11\">", x + 4, y - 4, colour(i), x + 12, y);
		for (const char *p = names[i]; *p; p++) /* class names are plain; escape anyway */
			fputs(*p == '<' ? "&lt;" : *p == '&' ? "&amp;" : (char[2]){*p, 0}, f);
		fputs("</text>\n", f);
	}
}

int srv_plot_svg(FILE *f, const srv_point *pts, size_t n, char *const *class_names,
		 size_t n_classes, const char *title)
{
	frame fr = range(pts, n);
	fprintf(f, "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"%d\" height=\"%d\" "
		   "viewBox=\"0 0 %d %d\" font-family=\"sans-serif\">\n", W + 120, H, W + 120, H);
	fprintf(f, "<title>%s</title>\n<text x=\"%d\" y=\"24\" font-size=\"14\" "
		   "text-anchor=\"middle\">%s</text>\n", title, LEFT + SIZE / 2, title);
	band(f, &fr);
	axes(f, &fr);
	for (size_t i = 0; i < n; i++) {
		if (!isfinite(pts[i].predicted) || !isfinite(pts[i].reference))
			continue;
		fprintf(f, "<circle cx=\"%.1f\" cy=\"%.1f\" r=\"2.5\" fill=\"%s\" "
			   "fill-opacity=\"0.7\"/>\n", px(&fr, pts[i].reference),
			py(&fr, pts[i].predicted), colour(pts[i].cls));
	}
	legend(f, class_names, n_classes);
	fputs("</svg>\n", f);
	return ferror(f) ? -1 : 0;
}
