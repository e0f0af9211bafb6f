// A cut plot as a plain value (what to draw), and the one function that draws it on any Cairo
// context. SVG, PDF and PNG all go through draw_cut_plot(), so the three formats cannot drift
// apart, and the viewer can draw the same figure into an image surface.
//
// Polar layout (AngleLayout::signed_half, phi and great-circle cuts): angle 0 at the top,
// positive angles clockwise, so an elevation cut reads as a side view with +z up.
// Polar layout (AngleLayout::full_turn, theta = const cuts): phi = 0 at the right, increasing
// counter-clockwise, so an azimuth cut reads as the xy-plane seen from +z.
// The radius is linear in dB from top_db - range_db (centre) to top_db (rim); lower values sit
// on the centre.
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <cairo.h>

#include "pattern/cut.hpp"
#include "pattern/db_scale.hpp"

namespace ellipsa::exports {

enum class PlotStyle { polar, rect };
bool parse_plot_style(std::string_view name, PlotStyle& out);

enum class AngleLayout {
    signed_half,  // angles -180..180
    full_turn     // angles 0..360
};

struct PlotCurve {
    std::string label;              // legend text, e.g. "Total" or "RHCP"
    std::string unit;               // "dBi", "dBic" or "dB"
    std::vector<double> angle_deg;  // a uniform closed loop, as from sample_cut()
    std::vector<double> value_db;   // NaN outside the sampled region, -inf for zero power
    std::optional<BeamFigures> beam;  // readouts in the legend: peak, HPBW, F/B
};

struct CutPlot {
    PlotStyle style = PlotStyle::polar;
    AngleLayout layout = AngleLayout::signed_half;
    std::string title;
    std::string subtitle;                 // cut, frequency, quantity
    std::string angle_symbol = "θ";       // angle readouts: "θ = 90.0°"
    std::string value_label = "Gain";     // radial / y axis, unit appended
    std::string value_unit = "dBi";
    std::string negative_side, positive_side;  // signed layout: what the two halves are ("φ = 180°")
    double range_db = 40;
    std::optional<double> top_db;  // default: the highest value, rounded up (db_scale)
    std::vector<PlotCurve> curves;
    int marked_curve = 0;  // the curve that gets -3 dB markers (-1: none)
    std::vector<std::string> notes;  // small print under the legend
};

// The figure's dB scale: the core's one rule (pattern/db_scale.hpp) for top_db, or the highest
// value of every curve, and range_db.
DbScale plot_scale(const CutPlot& p);

// Draw the whole figure into the rectangle [0, width] x [0, height] in user units of points
// (1/72 in). Costs a few hundred path segments per curve; no allocation beyond Cairo's own.
void draw_cut_plot(cairo_t* cr, const CutPlot& p, double width_pt, double height_pt);

}  // namespace ellipsa::exports
