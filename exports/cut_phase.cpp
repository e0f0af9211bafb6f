#include "exports/cut_phase.hpp"

#include <cmath>
#include <cstdio>

#include "exports/figure_text.hpp"
#include "pattern/component_phase.hpp"

namespace ellipsa::exports {

std::vector<std::vector<double>> cut_phases(const FarFieldSet& s, const CutData& c) {
    std::vector<std::vector<double>> out;
    for (Component comp : c.components) out.push_back(cut_phase_deg(s, c.samples, comp));
    return out;
}

void break_at_wraps(const std::vector<double>& x, const std::vector<double>& y, std::vector<double>& xo,
                    std::vector<double>& yo) {
    xo.clear();
    yo.clear();
    for (std::size_t k = 0; k < x.size() && k < y.size(); ++k) {
        if (k > 0 && std::abs(y[k] - y[k - 1]) > 180) {  // false when either is NaN
            xo.push_back(0.5 * (x[k] + x[k - 1]));
            yo.push_back(NAN);
        }
        xo.push_back(x[k]);
        yo.push_back(y[k]);
    }
}

std::string cut_phase_note(const FarFieldSet& s, std::size_t freq_index) {
    char floor[48];
    std::snprintf(floor, sizeof floor, "%g", linear_threshold);
    return "Phase relative to " + phase_reference_text(s, freq_index) + "; exp(+jωt), wrapped to (-180°, 180°]; no line where "
           "a component has no field (at most " + floor + " of the total power there) or no data.";
}

namespace {
// One line a component that has a phase (not the total, a power), labelled prefix + its name, in
// style first + its place among c.components (the viewer's colours, which count the total too).
void add_phase_series(XyPanel& p, const FarFieldSet& s, const CutData& c, const std::vector<std::vector<double>>& phases,
                      const std::string& prefix, int first) {
    for (std::size_t i = 0; i < c.components.size() && i < phases.size(); ++i) {
        if (!has_phase(c.components[i])) continue;
        XySeries sr;
        sr.label = prefix + long_label(c.components[i], s.ludwig3_reference);
        sr.style = first + int(i);
        sr.points = false;
        break_at_wraps(c.samples.angle_deg, phases[i], sr.x, sr.y);
        p.series.push_back(std::move(sr));
    }
}
}  // namespace

XyFigure make_cut_phase_figure(const FarFieldSet& s, const CutData& c, const std::vector<std::vector<double>>& phases,
                               const std::string& title) {
    XyFigure f;
    f.title = title.empty() ? (s.name.empty() ? std::string("Far-field cut") : s.name) : title;
    f.subtitle = describe_cut(c.spec) + "  ·  " + format_frequency(s.frequencies[c.freq_index].frequency_hz) + "  ·  Phase (°)";
    const bool full_turn = c.spec.kind == CutKind::theta_const;
    f.x_label = full_turn ? "φ" : c.spec.kind == CutKind::phi_const ? "θ" : "Angle";
    f.x_unit = "°";
    f.x_min = full_turn ? 0.0 : -180.0;
    f.x_max = full_turn ? 360.0 : 180.0;
    f.x_tick_step = 45;
    XyPanel& p = f.panels.emplace_back();
    p.y_label = "Phase";
    p.y_unit = "°";
    p.y_min = phase_axis_lo_deg;
    p.y_max = phase_axis_hi_deg;
    p.y_tick_step = phase_tick_deg;
    p.empty_text = "No phase on this cut: every chosen component is zero here.";
    add_phase_series(p, s, c, phases, "", 0);
    f.notes.push_back(cut_phase_note(s, c.freq_index));
    f.notes.push_back(cut_axis_text(c.spec));
    if (!s.source.empty()) f.notes.push_back("Source: " + s.source);
    return f;
}

XyFigure make_cut_phase_comparison(const FarFieldSet& a, const CutData& ca, const std::vector<std::vector<double>>& pa,
                                   const FarFieldSet& b, const CutData& cb, const std::vector<std::vector<double>>& pb) {
    XyFigure f = make_cut_phase_figure(a, ca, pa, a.name + " (A) and " + b.name + " (B)");
    XyPanel& p = f.panels.front();
    for (XySeries& sr : p.series) sr.label = "A: " + a.name + ", " + sr.label;
    add_phase_series(p, b, cb, pb, "B: " + b.name + ", ", int(ca.components.size()));
    f.subtitle = describe_cut(ca.spec) + "  ·  " + format_frequency(a.frequencies[ca.freq_index].frequency_hz) + " (A), " +
                 format_frequency(b.frequencies[cb.freq_index].frequency_hz) + " (B)  ·  Phase (°)";
    f.notes.front() = "A: " + f.notes.front();
    f.notes.insert(f.notes.begin() + 1, "B: " + cut_phase_note(b, cb.freq_index));
    for (std::string& n : f.notes)
        if (n.rfind("Source: ", 0) == 0) n = "Source (A): " + n.substr(8);
    if (!b.source.empty()) f.notes.push_back("Source (B): " + b.source);
    return f;
}

}  // namespace ellipsa::exports
