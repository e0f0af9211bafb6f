// ellipsa band: figures against frequency (peak gain, directivity, efficiency, MEG, axial ratio,
// HPBW, front-to-back, AR beamwidth; ECC and diversity gain for a pair) as a plot (SVG, PNG, PDF),
// or as values (CSV, JSON), with the gain and axial-ratio band edges on stdout.
#include <cmath>
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/band_json.hpp"
#include "cli/usage.hpp"
#include "cli/band_text.hpp"
#include "cli/commands.hpp"
#include "cli/format.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "exports/band_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct BandArgs {
    std::vector<std::string> files;
    std::string out, size = "1200x900";
    BandChoices choices;  // --environment, --direction, --show, --ar-threshold, --pair, --title
    double dpi = 150;
    bool force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa band: " << msg << "\n";
    return code;
}

int run_band(const BandArgs& a) {
    auto req = band_request(a.choices, a.files.size());
    if (!req) return fail(exit_usage, req.error().message);
    if (!std::string_view(a.out).ends_with(".json") && !format_from_path(a.out))
        return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .svg, .png, .pdf, .csv or .json");
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    if (Status st = io::check_destination(a.out, a.force); !st) return fail(exit_bad_input, st.error().format());

    std::vector<FarFieldSet> loaded;
    std::vector<std::string> paths;
    for (const std::string& f : a.files) {
        auto s = load_pattern(f, a.load);
        if (!s) return fail(exit_bad_input, s.error().format());
        paths.push_back(file_path(f));
        if (s->name.empty()) s->name = paths.back();
        loaded.push_back(std::move(*s));
    }
    std::vector<const FarFieldSet*> ptrs;
    std::vector<std::string> names;
    for (const FarFieldSet& s : loaded) ptrs.push_back(&s), names.push_back(s.name);
    auto run = band_run(ptrs, names, paths, a.choices.pair, *req);
    if (!run) return fail(exit_bad_input, run.error().message);
    auto bytes = band_file(a.out, paths, *run, *req, *size);
    if (!bytes) return fail(exit_bad_input, bytes.error().message);
    if (Status st = io::write_file_atomically(a.out, *bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
    std::cout << "wrote " << a.out << "\n";
    for (std::size_t i = 0; i < run->sets.size(); ++i) {
        std::cout << "\n" << paths[i] << ": " << run->sets[i].figures.size() << " frequencies";
        if (const std::string m = mounting_note(*run->sets[i].set); !m.empty()) std::cout << "\n  " << m;
        std::cout << band_summary_text(run->sets[i].summary);
    }
    return exit_ok;
}

Registered add_band(CLI::App& root) {
    auto a = std::make_shared<BandArgs>();
    CLI::App* sub = root.add_subcommand(
        "band", "Figures against frequency (gain, efficiency, MEG, axial ratio, HPBW, ECC) as a plot, CSV or JSON");
    sub->add_option("FILE", a->files, "Far-field CSV files (one or more; several are overlaid)")->required();
    sub->add_option("--out", a->out, "Output file: .svg, .png, .pdf (the plot), .csv or .json (the values)")
        ->required()
        ->type_name("FILE");
    sub->add_option("--show", a->choices.show,
                    "Panels, comma-separated: gain, efficiency, meg, axial-ratio, hpbw, front-to-back, ar-beamwidth, "
                    "ecc, diversity-gain (default gain,efficiency,axial-ratio,hpbw; ecc added with --pair)");
    sub->add_option("--environment", a->choices.environments,
                    "Environments for MEG and ECC, comma-separated presets: uniform, indoor, urban, rural (default uniform)");
    sub->add_option("--direction", a->choices.direction, "Also read the axial ratio at THETA,PHI (deg) at every frequency")
        ->check(band_direction_check())
        ->type_name("THETA,PHI");
    sub->add_option("--ar-threshold", a->choices.ar_threshold_db, "Axial-ratio limit of the AR beamwidth, dB (default 3)")
        ->check(band_ar_threshold_check());
    sub->add_flag("--pair", a->choices.pair, "ECC and diversity gain between the first two files at their shared frequencies");
    sub->add_option("--title", a->choices.title, "Figure title (default: the pattern's name)");
    sub->add_option("--size", a->size, "Image size WIDTHxHEIGHT in pixels (default 1200x900)")
        ->check(pixel_size(exports::min_size_px, exports::min_size_px, exports::max_size_px));
    sub->add_option("--dpi", a->dpi, "Dots per inch (default 150)")->check(number_from_to(exports::min_dpi, exports::max_dpi));
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    add_load_options(sub, a->load);
    return {sub, [a]() -> int { return run_band(*a); }};
}
const CommandRegistration registration(72, add_band);

}  // namespace

}  // namespace ellipsa::cli
