// From a pattern to a cut figure: sample the cut with the core (sample_cut, cut_power,
// beam_figures), check that every asked-for component can be computed from the data, and build
// the CutPlot value and the CSV of the plotted values. The numbers in the CSV and the curves in
// the plot are the same vectors, straight from the core.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "exports/cut_plot.hpp"
#include "pattern/cut.hpp"
#include "pattern/far_field.hpp"
#include "pattern/components.hpp"
#include "pattern/result.hpp"

namespace ellipsa::exports {

// Parse "total,rhcp,lhcp"; the Error names the unknown entry and lists the known names.
Result<std::vector<Component>> parse_component_list(const std::string& text);

// "Elevation cut, φ = 0°", "Azimuth cut, θ = 90°", "Great circle through θ = 45.0°, φ = 0.0°".
std::string describe_cut(const CutSpec& spec);

// The cut every figure and CSV is made from: the core's one cut value (pattern/cut.hpp).
using CutData = ComponentCut;

// The plotted values: a header line, then one row per cut sample:
//   angle_deg,theta_deg,phi_deg,<component>_<unit>,...
// dB values are 10 log10 of cut_power() printed with 17 significant digits (they read back as
// the same doubles); "-inf" for zero power, an empty field outside the sampled region.
// With `phase_deg` (cut_phases(), exports/cut_phase.hpp) each component's column is followed by
// <component>_phase_deg, empty where the component has no phase.
std::string cut_csv(const FarFieldSet& s, const CutData& c, const std::vector<std::vector<double>>* phase_deg = nullptr);

struct FigureOptions {
    PlotStyle style = PlotStyle::polar;
    double range_db = 40;
    std::string title;  // empty: the pattern's name
    std::optional<double> top_db;
};
CutPlot make_cut_plot(const FarFieldSet& s, const CutData& c, const FigureOptions& o);
// Overlay: add the curves of another pattern's cut (same kind of cut), the table's names
// prefixed with `prefix` ("B: turnstile, ") and the tags on the plot with `tag_prefix` ("B ").
void add_curves(CutPlot& plot, const FarFieldSet& s, const CutData& c, const std::string& prefix, const std::string& tag_prefix);

}  // namespace ellipsa::exports
