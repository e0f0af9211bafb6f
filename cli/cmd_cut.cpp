// ellipsa cut: one cut through a pattern as a figure (SVG, PDF, PNG) or as the plotted values (CSV).
#include <cmath>
#include <cstdio>
#include <iostream>
#include <memory>
#include <optional>

#include "exports/cut_plot.hpp"
#include "cli/commands.hpp"
#include "io/atomic_write.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/format.hpp"
#include "cli/load.hpp"
#include "exports/cut_export.hpp"
#include "exports/cut_figure.hpp"
#include "exports/figure_text.hpp"
#include "exports/render.hpp"
#include "pattern/component_phase.hpp"
#include "pattern/peak.hpp"
#include "pattern/summary.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct CutArgs {
    std::string file;
    std::optional<double> phi_deg, theta_deg;
    bool through_peak = false;
    std::string components = "total";
    std::string style = "polar";
    bool style_given = false;
    bool phase = false;
    std::optional<double> frequency_hz;
    double range_db = 40;
    std::string title;
    std::string size = "1200x900";
    double dpi = 150;
    std::optional<double> step_deg;
    bool force = false;
    std::string out;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa cut: " << msg << "\n";
    return code;
}

// One component's line of the summary, in the core's words: "RHCP: peak 3.38 dBic at theta =
// 180.0 deg, HPBW none: the beam's edge lies outside ..., F/B 12.30 dB".
std::string beam_line(const FarFieldSet& s, const CutSpec& spec, const ComponentCut& cut, std::size_t i) {
    const std::string name = short_label(cut.components[i]);
    const BeamFigures& b = cut.beams[i];
    bool positive = false;
    for (double p : cut.power[i]) positive = positive || p > 0;
    if (!positive) return name + ": no power on this cut";
    return name + ": peak " + level_text(b.peak_db, db_decimals, db_unit(s.quantity, cut.components[i])) + " at " +
           spec.angle_name() + " = " + cut_angle_text(spec, b.peak_angle_deg, angle_decimals, "deg") + ", HPBW " +
           beamwidth_text(b, spec.angle_name(), "deg") + ", F/B " + front_to_back_text(b.front_to_back_db, b.front_to_back_above_db);
}

int run_cut(const CutArgs& a) {
    const int chosen = int(a.phi_deg.has_value()) + int(a.theta_deg.has_value()) + int(a.through_peak);
    if (chosen != 1) return fail(exit_usage, "choose exactly one cut: --phi DEG, --theta DEG or --through-peak");
    const auto format = format_from_path(a.out);
    if (!format) return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .svg, .png, .pdf or .csv");
    PlotStyle style;
    if (!parse_plot_style(a.style, style)) return fail(exit_usage, "--style: expected polar or rect, found \"" + a.style + "\"");
    if (a.phase && a.style_given && style == PlotStyle::polar)
        return fail(exit_usage, "--phase plots on a rectangular grid (a phase has no radius); leave out --style polar or use --style rect");
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    auto comps = parse_component_list(a.components);
    if (!comps) return fail(exit_usage, comps.error().format());
    if (Status st = io::check_destination(a.out, a.force); !st) return fail(exit_bad_input, st.error().format());

    const std::string path = file_path(a.file);
    auto s = load_pattern(a.file, a.load);
    if (!s) return fail(exit_bad_input, s.error().format());
    if (s->source.empty()) s->source = path;
    auto fi = pick_frequency(*s, a.frequency_hz, path);
    if (!fi) return fail(exit_bad_input, fi.error().format());
    for (Component c : *comps)
        if (auto why = a.phase ? phase_unavailable(*s, c) : component_unavailable(*s, c)) return fail(exit_bad_input, path + ": " + *why);

    CutSpec spec;
    if (a.phi_deg) {
        spec = CutSpec::phi_cut(*a.phi_deg);
    } else if (a.theta_deg) {
        if (!(*a.theta_deg >= 0 && *a.theta_deg <= 180)) return fail(exit_usage, "--theta: expected 0..180 deg");
        spec = CutSpec::theta_cut(*a.theta_deg);
    } else {
        // The elevation cut through the peak of the total power (the plane summarize() measures
        // its elevation beamwidth in; phi = 0 when the peak is at a pole, where its phi is arbitrary).
        const Peak pk = find_peak(*s, *fi, Component::total);
        spec = CutSpec::phi_cut(std::round(elevation_plane_phi_deg(s->grid, pk) * 10) / 10);  // to 0.1 deg, as shown
    }
    CutExportRequest req;
    req.spec = spec;
    req.components = *comps;
    req.figure.style = style;
    req.figure.range_db = a.range_db;
    req.figure.title = a.title;
    req.size = *size;
    req.step_deg = a.step_deg.value_or(0);
    req.phase = a.phase;
    auto cut = export_cut(*s, *fi, req, a.out, a.force);
    if (!cut) return fail(exit_bad_input, cut.error().file.empty() ? path + ": " + cut.error().message : cut.error().format());

    std::cout << "wrote " << a.out << ": " << spec.label() << ", " << format_frequency(s->frequencies[*fi].frequency_hz) << "\n";
    if (const std::string m = mounting_note(*s); !m.empty()) std::cout << "  " << m << " (the cut is in the world frame)\n";
    if (a.phase) std::cout << "  phase relative to " << phase_reference_text(*s, *fi) << "\n";
    for (std::size_t i = 0; i < cut->components.size(); ++i) std::cout << "  " << beam_line(*s, spec, *cut, i) << "\n";
    return exit_ok;
}

Registered add_cut(CLI::App& root) {
    auto a = std::make_shared<CutArgs>();
    CLI::App* sub = root.add_subcommand(
        "cut", "Plot one cut (polar or rectangular) as SVG, PDF or PNG, or write its values as CSV");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    auto* o_phi = sub->add_option("--phi", a->phi_deg, "Elevation cut at this phi, deg (theta runs -180..180; negative = phi + 180)")
                      ->check(number_from_to(-360.0, 360.0));
    auto* o_theta = sub->add_option("--theta", a->theta_deg, "Conical cut at this theta, deg (90: the azimuth plane)")
                        ->check(number_from_to(0.0, 180.0));
    auto* o_peak = sub->add_flag("--through-peak", a->through_peak, "Elevation cut through the peak of the total power");
    o_phi->excludes(o_theta)->excludes(o_peak);
    o_theta->excludes(o_peak);
    sub->add_option("--components", a->components,
                    "Comma-separated: total, theta, phi, vertical, horizontal, co, cross, rhcp, lhcp (default total)");
    sub->add_option("--style", a->style, "polar (default) or rect")
        ->check(one_of({"polar", "rect"}))
        ->each([a](const std::string&) { a->style_given = true; });
    sub->add_flag("--phase", a->phase,
                  "Plot the phase of each component (deg, -180..180, rect) instead of its gain; a .csv gets a phase column "
                  "after each gain column. Relative to the phase reference (--phase-centre moves it); not for total");
    add_frequency_option(sub, a->frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--range", a->range_db, "Dynamic range shown below the top of the scale, dB (default 40)")
        ->check(number_from_to(exports::min_range_db, exports::max_range_db));
    sub->add_option("--title", a->title, "Figure title (default: the pattern's name)");
    sub->add_option("--size", a->size, "Image size WIDTHxHEIGHT in pixels (default 1200x900); SVG/PDF get the same physical size")
        ->check(pixel_size(exports::min_size_px, exports::min_size_px, exports::max_size_px));
    sub->add_option("--dpi", a->dpi, "Dots per inch: sets the physical size and text scale (default 150)")->check(number_from_to(exports::min_dpi, exports::max_dpi));
    sub->add_option("--step", a->step_deg, "Cut sample step, deg (default: a quarter of the grid step)")
        ->check(number_from_to(0.01, 10.0));
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    sub->add_option("--out", a->out, "Output file: .svg, .png, .pdf or .csv")->required()->type_name("FILE");
    add_load_options(sub, a->load);
    return {sub, [a]() -> int { return run_cut(*a); }};
}
const CommandRegistration registration(70, add_cut);

}  // namespace

}  // namespace ellipsa::cli
