// ellipsa map: a whole-sphere map of a component, axial ratio, RHCP minus LHCP, vertical minus
// horizontal, tilt or A minus B, on an equal-area (Hammer) or rectangular projection, as SVG,
// PNG, PDF or the mapped values as CSV.
#include <cmath>
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/commands.hpp"
#include "cli/map_file.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/load.hpp"
#include "cli/number_list.hpp"
#include "exports/map_plot.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct MapArgs {
    std::string file, out, minus;
    MapChoices choices;  // --show, --projection, --levels, --bar, --range, --colormap, --title
    std::string size = "1200x720";
    std::optional<double> frequency_hz;
    double dpi = 150;
    bool force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa map: " << msg << "\n";
    return code;
}

int run_map(const MapArgs& a) {
    const auto format = format_from_path(a.out);
    if (!format) return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .svg, .png, .pdf or .csv");
    MapChoices choices = a.choices;
    choices.minus = !a.minus.empty();
    auto req = map_request(choices);
    if (!req) return fail(exit_usage, req.error().message);
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    if (Status st = io::check_destination(a.out, a.force); !st) return fail(exit_bad_input, st.error().format());
    auto s = load_pattern(a.file, a.load);
    if (!s) return fail(exit_bad_input, s.error().format());
    auto fi = pick_frequency(*s, a.frequency_hz, file_path(a.file));
    if (!fi) return fail(exit_bad_input, fi.error().format());
    std::optional<FarFieldSet> b;
    std::size_t fb = 0;
    if (!a.minus.empty()) {
        auto bs = load_pattern(a.minus, a.load);
        if (!bs) return fail(exit_bad_input, bs.error().format());
        auto k = find_frequency(*bs, s->frequencies[*fi].frequency_hz, file_path(a.minus));
        if (!k) return fail(exit_bad_input, k.error().format());
        b = std::move(*bs);
        fb = *k;
    }
    auto plot = make_map_plot(*s, *fi, *req, b ? &*b : nullptr, fb);
    if (!plot) return fail(exit_bad_input, file_path(a.file) + ": " + plot.error().message);
    auto bytes = map_file(a.out, *plot, *size);
    if (!bytes) return fail(exit_bad_input, bytes.error().message);
    if (Status st = io::write_file_atomically(a.out, *bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
    std::cout << "wrote " << a.out << ": " << plot->bar_label << " (" << plot->unit << "), "
              << format_frequency(s->frequencies[*fi].frequency_hz) << ", " << to_string(req->projection) << "\n";
    if (const std::string m = mounting_note(*s); !m.empty()) std::cout << "  " << m << " (the map is in the world frame)\n";
    return exit_ok;
}

Registered add_map(CLI::App& root) {
    auto a = std::make_shared<MapArgs>();
    CLI::App* sub = root.add_subcommand(
        "map", "Whole-sphere map (equal-area Hammer or rectangular) of a component, axial ratio, balance, tilt or A minus B");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    sub->add_option("--out", a->out, "Output file: .svg, .png, .pdf (the map) or .csv (the mapped values)")
        ->required()
        ->type_name("FILE");
    sub->add_option("--show", a->choices.show, "What to map: a component, or the axial ratio, a balance or the tilt (default total)")
        ->check(one_of(map_show_names()));
    sub->add_option("--minus", a->minus, "Second pattern B: map the shown component of FILE minus B (dB)")
        ->type_name("FILE");
    sub->add_option("--projection", a->choices.projection, "Map projection: hammer (equal-area, default), theta-phi or az-el")
        ->check(one_of(names_of(all_map_projections)));
    sub->add_option("--levels", a->choices.levels, "Contour levels in the map's unit, comma-separated, or none");
    sub->add_option("--bar", a->choices.scale, "Colour bar ends MIN,MAX in the map's unit");
    sub->add_option("--range", a->choices.range_db, "Component maps: colour bar span below the peak, dB (default 40)")
        ->check(map_range_check());
    sub->add_option("--colormap", a->choices.colormap, "Sequential colour map (default viridis)")
        ->check(one_of(names_of(all_color_maps, is_sequential)));
    add_frequency_option(sub, a->frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--title", a->choices.title, "Figure title (default: the pattern's name)");
    sub->add_option("--size", a->size, "Image size WIDTHxHEIGHT in pixels (default 1200x720)")
        ->check(pixel_size(exports::min_size_px, exports::min_size_px, exports::max_size_px));
    sub->add_option("--dpi", a->dpi, "Dots per inch (default 150)")->check(number_from_to(exports::min_dpi, exports::max_dpi));
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "a map of the sphere";
    return {sub, [a]() -> int { return run_map(*a); }};
}
const CommandRegistration registration(74, add_map);

}  // namespace

}  // namespace ellipsa::cli
