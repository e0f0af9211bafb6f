// ellipsa coverage: the share of the sphere (or of an elevation band) where a component is at
// least a level, per component and, for two patterns, the best of both; figures at chosen levels
// on stdout, and the curves as SVG, PNG, PDF, CSV or JSON.
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/coverage_json.hpp"
#include "cli/frequency_option.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "cli/number_list.hpp"
#include "exports/coverage_figure.hpp"
#include "exports/cut_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct CoverageArgs {
    std::vector<std::string> files;
    std::string out, components, levels = "0,-3,-6,-10", elevation, title, size = "1200x900";
    std::optional<double> frequency_hz, horizon_deg;
    double dpi = 150;
    bool force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa coverage: " << msg << "\n";
    return code;
}

Result<CoverageRequest> request_of(const CoverageArgs& a) {
    CoverageRequest r;
    r.title = a.title;
    auto lv = parse_number_list(a.levels);
    if (!lv) return Error{"", 0, 0, "--levels: expected levels in dB separated by commas; found \"" + a.levels + "\""};
    r.levels_db = *lv;
    std::optional<std::pair<double, double>> elevation;
    const std::string found = "; found \"" + a.elevation + "\"";
    if (!a.elevation.empty()) {
        auto e = parse_number_list(a.elevation);
        if (!e || e->size() != 2) return Error{"", 0, 0, "--elevation: expected MIN,MAX in degrees, -90 <= MIN < MAX <= 90" + found};
        elevation = std::pair((*e)[0], (*e)[1]);
    }
    auto band = coverage_band(a.horizon_deg, elevation);
    if (!band) return Error{"", 0, 0, band.error().message + (band.error().message.starts_with("--elevation") ? found : "")};
    r.band = *band;
    r.components.clear();  // none: the defaults for the patterns read (coverage_of)
    if (!a.components.empty()) {
        auto c = parse_component_list(a.components);
        if (!c) return Error{"", 0, 0, "--components: " + c.error().message};
        r.components = *c;
    }
    return r;
}

std::string percent(double share) {
    char b[32];
    std::snprintf(b, sizeof b, "%6.1f %%", 100 * share);
    return b;
}

void print_table(const std::vector<CoverageSeries>& series, const CoverageRequest& r, const std::string& what) {
    std::cout << "share of the " << what << " at or above each level:\n";
    std::printf("  %-40s", "");
    for (double l : r.levels_db) std::printf(" %7.1f %s", l, series.empty() ? "dB" : series[0].unit.c_str());
    std::printf("\n");
    for (const CoverageSeries& s : series) {
        std::string label = s.label.size() > 40 ? s.label.substr(0, 39) + "~" : s.label;
        std::printf("  %-40s", label.c_str());
        for (double l : r.levels_db) std::printf(" %12s", percent(share_at_or_above(s.curve, l)).c_str());
        std::printf("\n");
    }
    std::cout << std::flush;
}

int run_coverage(const CoverageArgs& a) {
    if (a.files.size() > 2) return fail(exit_usage, "give one pattern file, or two for the best of both");
    auto req = request_of(a);
    if (!req) return fail(exit_usage, req.error().message);
    const bool json = std::string_view(a.out).ends_with(".json");
    const auto format = format_from_path(a.out);
    if (!a.out.empty() && !format && !json)
        return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .svg, .png, .pdf, .csv or .json");
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    if (!a.out.empty())
        if (Status st = io::check_destination(a.out, a.force); !st) return fail(exit_bad_input, st.error().format());
    std::vector<FarFieldSet> sets;
    std::vector<std::size_t> fi;
    std::vector<std::string> paths;
    for (const std::string& f : a.files) {
        auto s = load_pattern(f, a.load);
        if (!s) return fail(exit_bad_input, s.error().format());
        paths.push_back(file_path(f));
        auto k = sets.empty() ? pick_frequency(*s, a.frequency_hz, paths.back())
                              : coverage_frequency(*s, sets[0].frequencies[fi[0]].frequency_hz, paths.back());
        if (!k) return fail(exit_bad_input, k.error().format());
        if (s->name.empty()) s->name = paths.back();
        sets.push_back(std::move(*s));
        fi.push_back(*k);
    }
    std::vector<const FarFieldSet*> ptrs;
    std::vector<std::string> names;
    for (const FarFieldSet& s : sets) ptrs.push_back(&s), names.push_back(s.name);
    auto series = coverage_of(ptrs, names, fi, *req);
    if (!series) return fail(exit_bad_input, series.error().message);
    const double f_hz = sets[0].frequencies[fi[0]].frequency_hz;
    const std::string what = describe_band(req->band);
    char sampled[32];
    std::snprintf(sampled, sizeof sampled, "%.1f %%", 100 * (*series)[0].curve.sampled_share);
    std::cout << paths[0] << (sets.size() > 1 ? " and " + paths[1] : "") << ", " << format_frequency(f_hz) << ", " << what
              << " (" << sampled << " of it sampled)\n";
    for (std::size_t i = 0; i < sets.size(); ++i)
        if (const std::string m = mounting_note(sets[i]); !m.empty()) std::cout << "  " << paths[i] << ": " << m << "\n";
    print_table(*series, *req, what == "whole sphere" ? "sphere" : "band");
    if (a.out.empty()) return exit_ok;
    auto bytes = coverage_file(a.out, *series, *req, f_hz, ptrs, *size);
    if (!bytes) return fail(exit_bad_input, bytes.error().message);
    if (Status st = io::write_file_atomically(a.out, *bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
    std::cout << "wrote " << a.out << "\n";
    return exit_ok;
}

Registered add_coverage(CLI::App& root) {
    auto a = std::make_shared<CoverageArgs>();
    CLI::App* sub = root.add_subcommand(
        "coverage", "Share of the sphere (or an elevation band) where each component reaches a level; best of two patterns");
    sub->add_option("FILE", a->files, "Far-field CSV file, or two for the best of both in every direction")->required();
    sub->add_option("--out", a->out, "Also write the curves: .svg, .png, .pdf (plot), .csv or .json (values)")
        ->type_name("FILE");
    sub->add_option("--components", a->components,
                    "Comma-separated components (default total, vertical, horizontal, and rhcp, lhcp with phase; total for two files)");
    sub->add_option("--levels", a->levels, "Levels for the table, dB, comma-separated (default 0,-3,-6,-10)");
    sub->add_option("--horizon", a->horizon_deg, "Only directions within this many degrees of the horizon")
        ->check(coverage_horizon_check());
    sub->add_option("--elevation", a->elevation, "Only elevations MIN,MAX in degrees (-90..90)");
    add_frequency_option(sub, a->frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--title", a->title, "Figure title");
    sub->add_option("--size", a->size, "Image size WIDTHxHEIGHT in pixels (default 1200x900)")
        ->check(pixel_size(exports::min_size_px, exports::min_size_px, exports::max_size_px));
    sub->add_option("--dpi", a->dpi, "Dots per inch (default 150)")->check(number_from_to(exports::min_dpi, exports::max_dpi));
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "coverage of the sphere";
    return {sub, [a]() -> int { return run_coverage(*a); }};
}
const CommandRegistration registration(76, add_coverage);

}  // namespace

}  // namespace ellipsa::cli
