// What `ellipsa coverage` computes and writes (cli/coverage_json.hpp).
#include "cli/coverage_json.hpp"

#include <algorithm>

#include "cli/json.hpp"
#include "cli/usage.hpp"
#include "cli/mounting_options.hpp"
#include "exports/cut_figure.hpp"

namespace ellipsa::cli {

CLI::Validator coverage_horizon_check() { return number_above_to(0, 90); }

Result<ElevationBand> coverage_band(const std::optional<double>& horizon_deg,
                                    const std::optional<std::pair<double, double>>& elevation_deg) {
    if (horizon_deg && elevation_deg) return Error{"", 0, 0, "choose --horizon or --elevation, not both"};
    if (horizon_deg) {
        if (const std::string bad = check_number(coverage_horizon_check(), *horizon_deg); !bad.empty())
            return Error{"", 0, 0, "--horizon: " + bad};
        return horizon_band(*horizon_deg);
    }
    if (elevation_deg) {
        const auto [lo, hi] = *elevation_deg;
        if (!(lo < hi) || !(lo >= -90) || !(hi <= 90))
            return Error{"", 0, 0, "--elevation: expected MIN,MAX in degrees, -90 <= MIN < MAX <= 90"};
        return ElevationBand{lo, hi};
    }
    return ElevationBand{};
}

std::vector<Component> default_coverage_components(const std::vector<const FarFieldSet*>& sets) {
    std::vector<Component> out;
    if (sets.size() > 1) return {Component::total};
    for (Component c : {Component::total, Component::vertical, Component::horizontal, Component::rhcp, Component::lhcp}) {
        bool ok = true;
        for (const FarFieldSet* s : sets) ok = ok && !component_unavailable(*s, c);
        if (ok) out.push_back(c);
    }
    return out;
}

Result<std::vector<exports::CoverageSeries>> coverage_of(const std::vector<const FarFieldSet*>& sets,
                                                         const std::vector<std::string>& names,
                                                         const std::vector<std::size_t>& freq_indices,
                                                         exports::CoverageRequest& r) {
    if (r.components.empty()) r.components = default_coverage_components(sets);
    std::vector<std::string> labels;
    for (std::size_t i = 0; i < sets.size(); ++i)
        labels.push_back(sets.size() > 1 ? std::string(1, char('A' + i)) + ". " + names[i] : "");
    return exports::coverage_series(sets, labels, freq_indices, r);
}

Result<std::size_t> coverage_frequency(const FarFieldSet& b, double a_frequency_hz, const std::string& path) {
    return find_frequency(b, a_frequency_hz, path);
}

std::string coverage_json(const std::vector<exports::CoverageSeries>& series, const exports::CoverageRequest& r,
                          double frequency_hz, const std::vector<const FarFieldSet*>& sets) {
    JsonWriter j;
    j.begin_object().field("frequency_hz", frequency_hz);
    j.key("mountings").begin_array();  // one per pattern, A then B
    for (const FarFieldSet* s : sets) {
        j.begin_object();
        mounting_json(j, *s);
        j.end_object();
    }
    j.end_array();
    j.key("band").begin_object().field("elevation_min_deg", std::max(-90.0, r.band.min_deg));
    j.field("elevation_max_deg", std::min(90.0, r.band.max_deg));
    j.field("solid_angle_sr", series.empty() ? 0.0 : series[0].curve.band_solid_angle_sr).end_object();
    j.key("series").begin_array();
    for (const exports::CoverageSeries& s : series) {
        j.begin_object().field("label", s.label).field("component", to_string(s.component));
        j.key("pattern");
        if (s.pattern < 0)
            j.value("best of both");
        else
            j.value(std::string(1, char('A' + s.pattern)));
        j.field("unit", s.unit).field("sampled_share", s.curve.sampled_share);
        j.key("at_levels").begin_array();
        for (double l : r.levels_db)
            j.begin_object().field("level_db", l).field("share", share_at_or_above(s.curve, l)).end_object();
        j.end_array().end_object();
    }
    j.end_array().end_object();
    return j.str() + "\n";
}

Result<std::string> coverage_file(const std::string& path, const std::vector<exports::CoverageSeries>& series,
                                  const exports::CoverageRequest& r, double frequency_hz,
                                  const std::vector<const FarFieldSet*>& sets, const exports::RenderSize& size) {
    if (std::string_view(path).ends_with(".json")) return coverage_json(series, r, frequency_hz, sets);
    const auto format = exports::format_from_path(path);
    if (!format) return Error{"", 0, 0, path + ": expected a file name ending in .svg, .png, .pdf, .csv or .json"};
    if (*format == exports::FileFormat::csv) return exports::coverage_csv(series);
    const exports::XyFigure fig =
        exports::make_coverage_figure(series, r, format_frequency(frequency_hz) + ", " + exports::describe_band(r.band));
    return exports::render_image([&](cairo_t* cr, double w, double h) { exports::draw_xy_figure(cr, fig, w, h); }, *format, size,
                                 fig.title);
}

}  // namespace ellipsa::cli
