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

struct CutData {
    CutSpec spec;
    std::size_t freq_index = 0;
    CutSamples samples;
    std::vector<Component> components;
    std::vector<std::vector<double>> power;  // linear, per component, NaN outside the data
    std::vector<BeamFigures> beams;          // per component
};

// Sample the cut and compute each component. step_deg <= 0 uses default_cut_step(grid).
// Errors: frequency index out of range, a component the data cannot give, theta outside 0..180.
Result<CutData> compute_cut(const FarFieldSet& s, std::size_t freq_index, const CutSpec& spec,
                            const std::vector<Component>& components, double step_deg = 0);

// The plotted values: a header line, then one row per cut sample:
//   angle_deg,theta_deg,phi_deg,<component>_<unit>,...
// dB values are 10 log10 of cut_power() printed with 17 significant digits (they read back as
// the same doubles); "-inf" for zero power, an empty field outside the sampled region.
std::string cut_csv(const FarFieldSet& s, const CutData& c);

struct FigureOptions {
    PlotStyle style = PlotStyle::polar;
    double range_db = 40;
    std::string title;  // empty: the pattern's name
    std::optional<double> top_db;
};
CutPlot make_cut_plot(const FarFieldSet& s, const CutData& c, const FigureOptions& o);
// Overlay: add the curves of another pattern's cut (same kind of cut), legend entries prefixed.
void add_curves(CutPlot& plot, const FarFieldSet& s, const CutData& c, const std::string& prefix);

}  // namespace ellipsa::exports
