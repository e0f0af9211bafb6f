// The phase of a cut's components (pattern/component_phase.hpp) as a figure and as values: what
// `ellipsa cut --phase` writes and what the viewer's cut panel draws in its phase view.
//
// The figure is rectangular (a phase has no radius): x the cut's angle, y the phase from -180 to
// 180 deg with ticks every 45 deg, one line per component in the cut figure's colours. A line
// breaks where the component has no phase (no field, outside the data) and where the wrapped
// phase jumps by more than 180 deg between neighbouring samples (it went round through +-180).
#pragma once
#include <string>
#include <vector>

#include "exports/cut_figure.hpp"
#include "exports/xy_plot.hpp"

namespace ellipsa::exports {

// The y axis: the phase range and its tick step, deg.
inline constexpr double phase_axis_lo_deg = -180, phase_axis_hi_deg = 180, phase_tick_deg = 45;

// The phase of each of the cut's components along it (deg in (-180, 180], NaN where there is
// none), in the order of c.components. The caller checks phase_unavailable() for each.
std::vector<std::vector<double>> cut_phases(const FarFieldSet& s, const CutData& c);

// x and y with a NaN point put between neighbours whose phases differ by more than 180 deg, so
// that a line drawn through them (breaking at NaN) never crosses the plot at a wrap.
void break_at_wraps(const std::vector<double>& x, const std::vector<double>& y, std::vector<double>& x_out,
                    std::vector<double>& y_out);

// The figure: title (empty: the pattern's name), the cut, frequency and "Phase (deg)" as subtitle,
// the phase reference and the gaps' meaning as notes.
XyFigure make_cut_phase_figure(const FarFieldSet& s, const CutData& c, const std::vector<std::vector<double>>& phases,
                               const std::string& title);

// Two antennas' phases on one figure, as the viewer's phase view shows a comparison: A's series
// then B's, labelled "A: <name>, <component>" and "B: ...", in the colours that continue from A's;
// the title names both, and the small print gives each one's phase reference (they may differ).
XyFigure make_cut_phase_comparison(const FarFieldSet& a, const CutData& ca, const std::vector<std::vector<double>>& pa,
                                   const FarFieldSet& b, const CutData& cb, const std::vector<std::vector<double>>& pb);

// The small print of every phase view: "Phase relative to the file's origin; wrapped to
// (-180°, 180°]; no line where a component has no field (at most 1e-12 of the total power)."
std::string cut_phase_note(const FarFieldSet& s, std::size_t freq_index);

}  // namespace ellipsa::exports
