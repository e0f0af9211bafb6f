// ellipsa report: one folder with index.html and report.md (same content), the figures table per
// pattern and frequency, the principal cuts as SVG/PNG/CSV, and a comparison when several
// patterns are given. The folder is built under a temporary name and renamed into place.
#include <iostream>
#include <memory>
#include <optional>

#include "exports/cut_plot.hpp"
#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "exports/render.hpp"
#include "cli/frequency_option.hpp"
#include "cli/environment_options.hpp"
#include "cli/load.hpp"
#include "cli/report_options.hpp"
#include "cli/report_3d.hpp"
#include "exports/report.hpp"
#include "pattern/environment.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct ReportArgs {
    std::vector<std::string> files;
    std::string out;
    std::optional<double> frequency_hz;
    std::string title = "Antenna pattern report";
    std::string size = "1200x900";
    double dpi = 150;
    double range_db = 40;
    std::string style = "polar";
    EnvironmentOptions environment;
    bool force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa report: " << msg << "\n";
    return code;
}

int run_report(const ReportArgs& a) {
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    auto built = chosen_environment(a.environment);
    if (auto* u = std::get_if<UsageError>(&built)) return fail(exit_usage, u->message);
    if (auto* er = std::get_if<Error>(&built)) return fail(exit_bad_input, er->format());
    auto options = report_options({a.title, a.style, a.frequency_hz, a.range_db}, *size, std::get<ChosenEnvironment>(built));
    if (!options) return fail(exit_usage, options.error().message);
    ReportOptions& o = *options;
    add_report_3d_views(o, *size);

    std::vector<ReportInput> inputs;
    for (const std::string& f : a.files) {
        auto s = load_pattern(f, a.load);
        if (!s) return fail(exit_bad_input, s.error().format());
        inputs.push_back({file_path(f), std::move(*s)});
    }
    // --force replaces only a folder ellipsa made, and never one that holds what the report reads.
    std::vector<std::string> read;
    for (const std::string& f : a.files) read.push_back(file_path(f));
    for (const std::string& f : {a.load.map_file, a.load.map.rfind('@', 0) == 0 ? a.load.map.substr(1) : std::string(),
                                 a.environment.profile})
        if (!f.empty()) read.push_back(f);
    auto written = publish_report(a.out, inputs, o, a.force, read);
    if (!written) return fail(exit_bad_input, written.error().format());
    std::cout << "wrote " << a.out << "/index.html and report.md with " << *written << " figure and data files\n";
    return exit_ok;
}

Registered add_report(CLI::App& root) {
    auto a = std::make_shared<ReportArgs>();
    CLI::App* sub = root.add_subcommand(
        "report", "Write a report folder (index.html + report.md): figures, principal cuts, comparison");
    sub->add_option("FILE", a->files, "Far-field CSV files (one or more)")->required();
    sub->add_option("--out", a->out, "Output folder (created; replaced only with --force)")->required()->type_name("FOLDER");
    add_frequency_option(sub, a->frequency_hz, "Only this frequency (nearest within 0.5 %; default all)");
    sub->add_option("--title", a->title, "Report title");
    sub->add_option("--size", a->size, "Cut figure size WIDTHxHEIGHT in pixels (default 1200x900)")
        ->check(pixel_size(exports::min_size_px, exports::min_size_px, exports::max_size_px));
    sub->add_option("--dpi", a->dpi, "Dots per inch of the figures (default 150)")->check(number_from_to(exports::min_dpi, exports::max_dpi));
    sub->add_option("--range", a->range_db, "Dynamic range of the cut plots, dB (default 40)")->check(number_from_to(exports::min_range_db, exports::max_range_db));
    sub->add_option("--style", a->style, "Cut figures: polar (default) or rect")->check(one_of({"polar", "rect"}));
    add_environment_options(sub, a->environment);
    sub->add_flag("--force", a->force, "Replace the output folder if it exists");
    add_load_options(sub, a->load);
    // Its maps, 3D views and shares of the sphere need a sphere; cut data go to cut, probe and info.
    a->load.whole_sphere_figure = "a report (maps, 3D views, shares of the sphere)";
    return {sub, [a]() -> int { return run_report(*a); }};
}
const CommandRegistration registration(80, add_report);

}  // namespace

}  // namespace ellipsa::cli
