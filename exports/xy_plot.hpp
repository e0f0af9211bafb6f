// Plots of figures against a number (frequency, level): one or more panels stacked over a shared
// x axis, each with its own y axis, series drawn as points at the samples joined by thin lines
// (only a visual aid), optional vertical markers (band edges) and horizontal reference lines.
// The same look as the cut plots (exports/plot_pen.hpp); SVG, PDF and PNG all come from
// draw_xy_figure() through exports/render.hpp.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include <cairo.h>

namespace ellipsa::exports {

struct XySeries {
    std::string label;
    std::vector<double> x, y;  // y NaN: no value there (the line breaks, no point)
    int style = 0;             // colour and dash index (palette.hpp): the same index is the same look
    int dash = -1;             // a dash pattern of its own (palette.hpp curve_dash index); -1: the style's
    double width = 1;          // line width factor
    bool points = true;        // a marker at every sample
    bool lines = true;         // thin joining lines
    // An empty label keeps the series out of the legend (a note can explain it instead).
};

struct XyMarker {
    double x = 0;
    std::string label;  // small text at the top of the line
};

struct XyPanel {
    std::string y_label;  // "Peak gain"
    std::string y_unit;   // "dBi"
    std::vector<XySeries> series;
    std::optional<double> y_min, y_max;  // default: the data range, padded to whole ticks
    std::optional<double> y_tick_step;   // ticks at whole multiples of this (phase: 45 deg); default nice_ticks
    std::vector<XyMarker> markers;       // dashed vertical lines
    std::vector<double> y_references;    // dotted horizontal lines (e.g. AR 3 dB)
    std::string empty_text;              // shown when no series has a value
    // A logarithmic y axis with ticks at whole decades (values <= 0 have no place on it); y_min,
    // y_max and the references stay in data units. For probabilities down to 1e-6 (fading CDFs).
    bool log_y = false;
};

struct XyFigure {
    std::string title, subtitle;
    std::string x_label;  // "Frequency"
    std::string x_unit;   // "MHz"
    double x_scale = 1;   // x values are divided by this for the axis (Hz -> MHz: 1e6)
    std::optional<double> x_min, x_max;  // in data units
    std::optional<double> x_tick_step;   // ticks at whole multiples of this, in axis units; default nice_ticks
    std::vector<XyPanel> panels;
    std::vector<std::string> notes;  // small print at the bottom
};

// Tick positions for [lo, hi]: steps of 1, 2 or 5 times a power of ten, about `target` of them.
std::vector<double> nice_ticks(double lo, double hi, int target = 5);
// Whole multiples of `step` in [lo, hi].
std::vector<double> step_ticks(double lo, double hi, double step);

// Draw the figure into [0, width] x [0, height] (points). Costs a few path segments per sample.
void draw_xy_figure(cairo_t* cr, const XyFigure& f, double width_pt, double height_pt);

}  // namespace ellipsa::exports
