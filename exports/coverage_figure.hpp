// Sphere coverage as a figure and as values: for one or two patterns, per component (and for a
// pair, the best of the two in every direction), the share of the sphere or of an elevation
// band where the component is at least a level (pattern/sphere_coverage.hpp), as curves against
// the level and as figures at chosen levels.
#pragma once
#include <string>
#include <vector>

#include "exports/xy_plot.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "pattern/sphere_coverage.hpp"

namespace ellipsa::exports {

struct CoverageRequest {
    std::vector<Component> components{Component::total};
    ElevationBand band;                            // whole sphere by default
    std::vector<double> levels_db{0, -3, -6, -10};  // figures at these levels
    std::string title;
};

struct CoverageSeries {
    std::string label;    // "Total", "A. turnstile θ component", "best of A and B, total"
    Component component = Component::total;
    int pattern = 0;      // 0, 1, or -1 for the best of two
    std::string unit;     // "dBi", "dBic", "dB"
    CoverageCurve curve;
};

// One series per pattern and component; with two patterns also the best of both per component
// (B interpolated onto A's grid where the grids differ). freq_index per pattern. Errors: a
// component the data cannot give.
Result<std::vector<CoverageSeries>> coverage_series(const std::vector<const FarFieldSet*>& sets,
                                                    const std::vector<std::string>& labels,
                                                    const std::vector<std::size_t>& freq_indices, const CoverageRequest& r);

// "whole sphere", "within 30° of the horizon", "elevation −10° to 40°".
std::string describe_band(const ElevationBand& b);

// Curves of share (%) against level, from the highest value down by 40 dB in 0.1 dB steps (each
// point exact on the step function), with the chosen levels as dashed markers.
XyFigure make_coverage_figure(const std::vector<CoverageSeries>& series, const CoverageRequest& r, const std::string& subtitle);

// level_db (one decimal) and one share column per series (0..1), at 0.1 dB steps from the highest
// value (rounded up to whole dB) down by 60 dB.
std::string coverage_csv(const std::vector<CoverageSeries>& series);

}  // namespace ellipsa::exports
