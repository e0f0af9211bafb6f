// ellipsa map: a whole-sphere map of a component, axial ratio, RHCP minus LHCP, vertical minus
// horizontal, tilt or A minus B, on an equal-area (Hammer) or rectangular projection, as SVG,
// PNG, PDF or the mapped values as CSV.
#include <cmath>
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/commands.hpp"
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

// The values of --show: a component, or a map quantity other than those two.
std::vector<std::string> show_names() {
    std::vector<std::string> out = names_of(all_components);
    for (const std::string& q : names_of(all_map_quantities, +[](MapQuantity q) {
             return q != MapQuantity::component && q != MapQuantity::difference;
         }))
        out.push_back(q);
    return out;
}

struct MapArgs {
    std::string file, out, show = "total", minus, projection = "hammer", levels, scale, colormap = "viridis", title;
    std::string size = "1200x720";
    std::optional<double> frequency_hz;
    double range_db = 40, dpi = 150;
    bool force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa map: " << msg << "\n";
    return code;
}

Result<MapRequest> request_of(const MapArgs& a) {
    MapRequest r;
    r.title = a.title;
    r.range_db = a.range_db;
    if (!parse_component(a.show.c_str(), r.component)) {
        if (!parse_map_quantity(a.show.c_str(), r.quantity) || r.quantity == MapQuantity::component ||
            r.quantity == MapQuantity::difference)
            return Error{"", 0, 0, "--show: expected one of " + join(show_names(), ", ") + "; found \"" + a.show + "\""};
    }
    if (!a.minus.empty()) {
        if (r.quantity != MapQuantity::component) return Error{"", 0, 0, "--minus: a difference map needs a component for --show"};
        r.quantity = MapQuantity::difference;
    }
    if (!parse_map_projection(a.projection.c_str(), r.projection))
        return Error{"", 0, 0, "--projection: expected one of " + join(names_of(all_map_projections), ", ") + "; found \"" + a.projection + "\""};
    if (!parse_color_map(a.colormap, r.sequential) || !is_sequential(r.sequential))
        return Error{"", 0, 0, "--colormap: expected one of " + join(names_of(all_color_maps, is_sequential), ", ") + "; found \"" + a.colormap + "\""};
    if (!a.levels.empty()) {
        r.levels = parse_number_list(a.levels, true);
        if (!r.levels) return Error{"", 0, 0, "--levels: expected numbers separated by commas, or none; found \"" + a.levels + "\""};
    }
    if (!a.scale.empty()) {
        const auto s = parse_number_list(a.scale);
        if (!s || s->size() != 2 || !((*s)[0] < (*s)[1]))
            return Error{"", 0, 0, "--bar: expected MIN,MAX with MIN < MAX; found \"" + a.scale + "\""};
        r.scale_min = (*s)[0];
        r.scale_max = (*s)[1];
    }
    if (!std::isfinite(a.range_db) || a.range_db < 1) return Error{"", 0, 0, "--range: expected a number of dB from 1 to 200"};
    return r;
}

int run_map(const MapArgs& a) {
    const auto format = format_from_path(a.out);
    if (!format) return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .svg, .png, .pdf or .csv");
    auto req = request_of(a);
    if (!req) return fail(exit_usage, req.error().message);
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    std::error_code ec;
    if (!a.force && std::filesystem::exists(a.out, ec)) return fail(exit_bad_input, a.out + ": already exists; use --force to replace it");
    auto s = load_pattern(a.file, a.load);
    if (!s) return fail(exit_bad_input, s.error().format());
    auto fi = pick_frequency(*s, a.frequency_hz, a.file);
    if (!fi) return fail(exit_bad_input, fi.error().format());
    std::optional<FarFieldSet> b;
    std::size_t fb = 0;
    if (!a.minus.empty()) {
        auto bs = load_pattern(a.minus, a.load);
        if (!bs) return fail(exit_bad_input, bs.error().format());
        auto k = find_frequency(*bs, s->frequencies[*fi].frequency_hz, a.minus);
        if (!k) return fail(exit_bad_input, k.error().format());
        b = std::move(*bs);
        fb = *k;
    }
    auto plot = make_map_plot(*s, *fi, *req, b ? &*b : nullptr, fb);
    if (!plot) return fail(exit_bad_input, a.file + ": " + plot.error().message);
    std::string bytes;
    if (*format == FileFormat::csv) {
        bytes = map_csv(*plot);
    } else {
        auto img = render_image([&](cairo_t* cr, double w, double h) { draw_map_plot(cr, *plot, w, h); }, *format, *size, plot->title);
        if (!img) return fail(exit_bad_input, img.error().message);
        bytes = std::move(*img);
    }
    if (Status st = io::write_file_atomically(a.out, bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
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
    sub->add_option("--show", a->show, "What to map: a component, or the axial ratio, a balance or the tilt (default total)")
        ->check(one_of(show_names()));
    sub->add_option("--minus", a->minus, "Second pattern B: map the shown component of FILE minus B (dB)")
        ->type_name("FILE");
    sub->add_option("--projection", a->projection, "Map projection: hammer (equal-area, default), theta-phi or az-el")
        ->check(one_of(names_of(all_map_projections)));
    sub->add_option("--levels", a->levels, "Contour levels in the map's unit, comma-separated, or none");
    sub->add_option("--bar", a->scale, "Colour bar ends MIN,MAX in the map's unit");
    sub->add_option("--range", a->range_db, "Component maps: colour bar span below the peak, dB (default 40)");
    sub->add_option("--colormap", a->colormap, "Sequential colour map (default viridis)")
        ->check(one_of(names_of(all_color_maps, is_sequential)));
    add_frequency_option(sub, a->frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--title", a->title, "Figure title (default: the pattern's name)");
    sub->add_option("--size", a->size, "Image size WIDTHxHEIGHT in pixels (default 1200x720)");
    sub->add_option("--dpi", a->dpi, "Dots per inch (default 150)");
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "a map of the sphere";
    return {sub, [a]() -> int { return run_map(*a); }};
}
const CommandRegistration registration(74, add_map);

}  // namespace

}  // namespace ellipsa::cli
