#include "exports/cut_figure.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "exports/csv_text.hpp"
#include "exports/figure_text.hpp"

namespace ellipsa::exports {

Result<std::vector<Component>> parse_component_list(const std::string& text) {
    std::vector<Component> out;
    std::size_t pos = 0;
    while (pos <= text.size()) {
        std::size_t comma = text.find(',', pos);
        std::string item = text.substr(pos, comma == std::string::npos ? std::string::npos : comma - pos);
        while (!item.empty() && item.front() == ' ') item.erase(item.begin());
        while (!item.empty() && item.back() == ' ') item.pop_back();
        Component c;
        if (!parse_component(item.c_str(), c)) {
            std::string known;
            for (Component k : all_components) known += (known.empty() ? "" : ", ") + std::string(to_string(k));
            return Error{"--components", 0, 0, "unknown component \"" + item + "\"; expected a comma-separated list of " + known};
        }
        for (Component have : out)
            if (have == c) return Error{"--components", 0, 0, "component \"" + item + "\" is listed twice"};
        out.push_back(c);
        if (comma == std::string::npos) break;
        pos = comma + 1;
    }
    if (out.empty()) return Error{"--components", 0, 0, "expected at least one component"};
    return out;
}

std::string describe_cut(const CutSpec& spec) {
    char buf[160];
    switch (spec.kind) {
        case CutKind::phi_const: std::snprintf(buf, sizeof buf, "Elevation cut, φ = %g°", spec.phi_deg); break;
        case CutKind::theta_const:
            std::snprintf(buf, sizeof buf, "%s, θ = %g°", spec.theta_deg == 90 ? "Azimuth cut" : "Conical cut",
                          spec.theta_deg);
            break;
        case CutKind::great_circle: {
            double t, p;
            to_spherical(spec.centre, t, p);
            std::snprintf(buf, sizeof buf, "Great circle through θ = %.1f°, φ = %.1f°", t / deg, p / deg);
            break;
        }
    }
    return buf;
}

namespace {
std::string lower(std::string s) {
    for (char& c : s) c = char(c >= 'A' && c <= 'Z' ? c - 'A' + 'a' : c);
    return s;
}
}  // namespace

std::string cut_csv(const FarFieldSet& s, const CutData& c, const std::vector<std::vector<double>>* phase_deg) {
    std::string out = "angle_deg,theta_deg,phi_deg";
    for (Component comp : c.components) {
        out += std::string(",") + to_string(comp) + "_" + lower(db_unit(s.quantity, comp));
        if (phase_deg) out += std::string(",") + to_string(comp) + "_phase_deg";
    }
    out += "\n";
    const CutSamples& x = c.samples;
    out.reserve(out.size() + x.angle_deg.size() * (3 + c.components.size()) * 20);
    for (std::size_t k = 0; k < x.angle_deg.size(); ++k) {
        append_csv_number(out, x.angle_deg[k]);
        out += ',';
        append_csv_number(out, x.theta_deg[k]);
        out += ',';
        append_csv_number(out, x.phi_deg[k]);
        for (std::size_t i = 0; i < c.components.size(); ++i) {
            out += ',';
            const double p = c.power[i][k];
            if (!std::isnan(p)) append_csv_number(out, to_db(p));
            if (phase_deg) {
                out += ',';
                append_csv_number(out, (*phase_deg)[i][k]);  // NaN: an empty field
            }
        }
        out += '\n';
    }
    return out;
}

namespace {

PlotCurve curve_of(const FarFieldSet& s, const CutData& c, std::size_t i, const std::string& prefix, const std::string& tag_prefix) {
    PlotCurve pc;
    pc.label = prefix + long_label(c.components[i], s.ludwig3_reference);
    pc.tag = tag_prefix + short_label(c.components[i]);
    pc.unit = db_unit(s.quantity, c.components[i]);
    pc.angle_deg = c.samples.angle_deg;
    pc.value_db.resize(c.power[i].size());
    for (std::size_t k = 0; k < pc.value_db.size(); ++k) pc.value_db[k] = std::isnan(c.power[i][k]) ? NAN : to_db(c.power[i][k]);
    // A curve with no positive sample has no peak to read.
    bool positive = false;
    for (double p : c.power[i]) positive = positive || p > 0;
    if (positive) pc.beam = c.beams[i];
    return pc;
}

}  // namespace

CutPlot make_cut_plot(const FarFieldSet& s, const CutData& c, const FigureOptions& o) {
    CutPlot p;
    p.style = o.style;
    p.range_db = o.range_db;
    p.top_db = o.top_db;
    p.title = o.title.empty() ? (s.name.empty() ? std::string("Far-field cut") : s.name) : o.title;
    const double f = s.frequencies[c.freq_index].frequency_hz;
    p.value_label = quantity_label(s.quantity);
    // The distinct units of the plotted components, linear parts first: "dBi", "dBic", "dBi, dBic" or "dB".
    std::vector<std::string> units;
    for (bool circular : {false, true})
        for (Component k : c.components)
            if (is_circular(k) == circular && std::find(units.begin(), units.end(), db_unit(s.quantity, k)) == units.end())
                units.push_back(db_unit(s.quantity, k));
    p.value_unit.clear();
    for (const std::string& u : units) p.value_unit += (p.value_unit.empty() ? "" : ", ") + u;
    p.subtitle = describe_cut(c.spec) + "  ·  " + format_frequency(f) + "  ·  " + p.value_label + " (" + p.value_unit + ")";
    switch (c.spec.kind) {
        case CutKind::phi_const: {
            p.layout = AngleLayout::signed_half;
            p.angle_symbol = "θ";
            char a[64], b[64];
            std::snprintf(a, sizeof a, "θ < 0: φ = %g°", wrap360(c.spec.phi_deg + 180));
            std::snprintf(b, sizeof b, "φ = %g°", c.spec.phi_deg);
            p.negative_side = a;
            p.positive_side = b;
            break;
        }
        case CutKind::theta_const:
            p.layout = AngleLayout::full_turn;
            p.angle_symbol = "φ";
            break;
        case CutKind::great_circle:
            p.layout = AngleLayout::signed_half;
            p.angle_symbol = "angle";
            break;
    }
    p.axis_note = cut_axis_text(c.spec);
    for (std::size_t i = 0; i < c.components.size(); ++i) p.curves.push_back(curve_of(s, c, i, "", ""));
    // -3 dB markers on the first curve that has a half-power beamwidth.
    p.marked_curve = -1;
    for (std::size_t i = 0; i < p.curves.size() && p.marked_curve < 0; ++i)
        if (p.curves[i].beam && p.curves[i].beam->hpbw_deg) p.marked_curve = int(i);
    p.notes.push_back("F/B: peak against the point 180° further round this cut.");
    char grid[200];
    std::snprintf(grid, sizeof grid, "Data: %s, %s; grid θ step %g°, φ step %g°; cut sampled every %.3g°.",
                  to_string(s.quantity), to_string(s.content), s.grid.theta.step_deg, s.grid.phi.step_deg,
                  c.samples.step_deg);
    p.notes.push_back(grid);
    if (!s.source.empty()) p.notes.push_back("Source: " + s.source);
    return p;
}

void add_curves(CutPlot& plot, const FarFieldSet& s, const CutData& c, const std::string& prefix, const std::string& tag_prefix) {
    for (std::size_t i = 0; i < c.components.size(); ++i) plot.curves.push_back(curve_of(s, c, i, prefix, tag_prefix));
}

}  // namespace ellipsa::exports
