#include "exports/coverage_figure.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>

#include "exports/csv_text.hpp"
#include "exports/cut_figure.hpp"
#include "exports/plot_pen.hpp"

namespace ellipsa::exports {

Result<std::vector<CoverageSeries>> coverage_series(const std::vector<const FarFieldSet*>& sets,
                                                    const std::vector<std::string>& labels,
                                                    const std::vector<std::size_t>& fi, const CoverageRequest& r) {
    std::vector<CoverageSeries> out;
    for (Component c : r.components) {
        std::vector<std::vector<double>> values;
        for (std::size_t i = 0; i < sets.size(); ++i) {
            if (auto why = component_unavailable(*sets[i], c)) return Error{"", 0, 0, labels[i] + ": " + *why};
            values.push_back(component_power_samples(*sets[i], fi[i], c));
            const std::string name = long_label(c, sets[i]->ludwig3_reference);
            out.push_back({labels[i].empty() ? name : labels[i] + " " + name, c, int(i), db_unit(sets[i]->quantity, c),
                           coverage_curve(sets[i]->grid, values.back(), r.band)});
        }
        if (sets.size() == 2) {
            const std::vector<double> b_on_a = component_power_on_grid(*sets[1], fi[1], c, sets[0]->grid);
            out.push_back({"best of both, " + long_label(c, sets[0]->ludwig3_reference), c, -1,
                           db_unit(sets[0]->quantity, c), coverage_curve(sets[0]->grid, best_of(values[0], b_on_a), r.band)});
        }
    }
    return out;
}

std::string describe_band(const ElevationBand& b) {
    if (b.whole_sphere()) return "whole sphere";
    if (std::abs(b.min_deg + b.max_deg) < 1e-9) return "within " + num(b.max_deg, 0) + "° of the horizon";
    return "elevation " + num(b.min_deg, 0) + "° to " + num(b.max_deg, 0) + "°";
}

namespace {
// The highest finite level over all series, rounded up to whole dB (0 when there is none).
double top_level(const std::vector<CoverageSeries>& series) {
    double hi = -INFINITY;
    for (const CoverageSeries& s : series)
        for (double v : s.curve.level_db)
            if (std::isfinite(v)) {
                hi = std::max(hi, v);
                break;  // levels are descending
            }
    return std::isfinite(hi) ? std::ceil(hi - 1e-9) : 0.0;
}
}  // namespace

XyFigure make_coverage_figure(const std::vector<CoverageSeries>& series, const CoverageRequest& r, const std::string& subtitle) {
    XyFigure f;
    f.title = r.title.empty() ? "Sphere coverage" : r.title;
    f.subtitle = subtitle;
    f.x_label = "Level";
    f.x_unit = series.empty() ? "dBi" : series[0].unit;
    const double top = top_level(series);
    f.x_min = top - 40;
    f.x_max = top;
    XyPanel p;
    p.y_label = "Share of the " + std::string(r.band.whole_sphere() ? "sphere" : "band") + " at or above";
    p.y_unit.assign(1, '%');  // (assigning the literal trips a false GCC 12 -Wrestrict warning here)
    p.y_min = 0;
    p.y_max = 100;
    for (std::size_t i = 0; i < series.size(); ++i) {
        XySeries s;
        s.label = series[i].label;
        s.style = int(i);
        s.points = false;
        for (int k = 0; k <= 400; ++k) {
            const double lvl = top - 0.1 * k;
            s.x.push_back(lvl);
            s.y.push_back(100 * share_at_or_above(series[i].curve, lvl));
        }
        p.series.push_back(std::move(s));
    }
    for (double l : r.levels_db) p.markers.push_back({l, num(l, 1)});
    f.panels.push_back(std::move(p));
    f.notes.push_back("Share of the solid angle (" + describe_band(r.band) +
                      ") where the component is at least the level: each grid sample stands for its cell's exact solid "
                      "angle, with the power interpolated inside the cell. Where the data do not reach, nothing is counted.");
    return f;
}

std::string coverage_csv(const std::vector<CoverageSeries>& series) {
    std::string out = "level_db";
    for (const CoverageSeries& s : series) {
        std::string name = s.label;
        for (char& c : name)
            if (c == ',') c = ';';
        out += "," + name;
    }
    out += "\n";
    const double top = top_level(series);
    for (int k = 0; k <= 600; ++k) {
        // Levels on whole tenths of a dB, written as such and read back for the share.
        char text[32];
        std::snprintf(text, sizeof text, "%.1f", top - 0.1 * k);
        const double lvl = std::strtod(text, nullptr);
        out += text;
        for (const CoverageSeries& s : series) {
            out += ",";
            append_csv_number(out, share_at_or_above(s.curve, lvl));
        }
        out += "\n";
    }
    return out;
}

}  // namespace ellipsa::exports
