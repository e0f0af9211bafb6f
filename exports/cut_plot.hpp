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
#include <utility>
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
    std::string label;              // the table's name of the curve, e.g. "Total" or "A: printed dipole, Total"
    std::string tag;                // the short text at its peak marker on the plot, e.g. "Total" or "A Total"
    std::string unit;               // "dBi", "dBic" or "dB"
    std::vector<double> angle_deg;  // a uniform closed loop, as from sample_cut()
    std::vector<double> value_db;   // NaN outside the sampled region, -inf for zero power
    std::optional<BeamFigures> beam;  // its row of the table: peak, HPBW, F/B, side lobe
};

// The dynamic range a cut plot takes (`ellipsa cut --range`, the report's, Python's write_cut),
// dB below the top of the scale: enough for one grid step, no more than the scale can label.
inline constexpr double min_range_db = 3, max_range_db = 200;

struct CutPlot {
    PlotStyle style = PlotStyle::polar;
    AngleLayout layout = AngleLayout::signed_half;
    std::string title;
    std::string subtitle;                 // cut, frequency, quantity
    std::string angle_symbol = "θ";       // angle readouts: "θ = 90.0°"
    std::string value_label = "Gain";     // radial / y axis, unit appended
    std::string value_unit = "dBi";
    std::string negative_side, positive_side;  // signed layout: what the two halves are ("φ = 180°")
    std::string axis_note;  // what the angle axis means and which way is positive (cut_axis_text)
    double range_db = 40;  // from min_range_db to max_range_db
    std::optional<double> top_db;  // default: the highest value, rounded up (db_scale)
    std::vector<PlotCurve> curves;
    int marked_curve = 0;  // the curve that gets -3 dB markers (-1: none)
    std::vector<std::string> notes;  // small print beside or under the table
};

// The figure's dB scale: the core's one rule (pattern/db_scale.hpp) for top_db, or the highest
// value of every curve, and range_db.
DbScale plot_scale(const CutPlot& p);

// The compact table of figures under the plot, one row per curve, the same on screen (the
// viewer's cut panel) and in files: curve, peak, at (angle), HPBW, F/B, side lobe.
struct CutTable {
    std::vector<std::string> header;
    std::vector<std::vector<std::string>> rows;  // rows[i] belongs to curves[i]
};
CutTable cut_table(const CutPlot& p);
// The key to the figure's marks, for the small print of screen and files: the axis, the
// half-power marks, the grey region, the radial scale.
std::vector<std::string> cut_key_notes(const CutPlot& p);
// Angle ranges [a0, a1] where no curve has data (outside the sampled region), shaded grey.
std::vector<std::pair<double, double>> no_data_ranges(const CutPlot& p);

// Layout: the plot with a marker and a short tag at each curve's peak (no legend box), the
// table under it, the small print beside a polar plot or under a rectangular one.
// Draw the whole figure into the rectangle [0, width] x [0, height] in user units of points
// (1/72 in). Costs a few hundred path segments per curve; no allocation beyond Cairo's own.
void draw_cut_plot(cairo_t* cr, const CutPlot& p, double width_pt, double height_pt);

}  // namespace ellipsa::exports
