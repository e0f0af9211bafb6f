// ellipsa render: a 3D snapshot of a pattern as PNG, through the headless EGL context (works with
// no display at all), or the gain surface itself as a 3D file (.glb, .ply; no GL needed).
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>
#include <cstdio>
#include <tuple>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/load.hpp"
#include "exports/render.hpp"
#include "pattern/colormap.hpp"
#include "pattern/components.hpp"
#include "viewer/scene/components.hpp"
#include "viewer/scene/surface_mesh.hpp"
#include "viewer/exports_ui.hpp"
#include "viewer/snapshot.hpp"

namespace ellipsa::cli {
namespace {
struct RenderArgs {
    std::string file, out, component = "total", color_by = "component", view, size = "1200x900", map = "viridis";
    std::optional<double> frequency_hz;
    double range_db = 30;
    bool force = false, glyphs = false, software = false;
    LoadOptions load;
};

// The headless renderer's image limits (exports::parse_pixel_size reads --size).
constexpr exports::PixelLimits render_limits{64, 64, 8192};

// The surface the view shows (viewer/scene/surface_mesh), written as glTF binary or PLY.
Status write_mesh_file(const FarFieldSet& s, const viewer::SnapshotOptions& o, const std::string& path, bool overwrite) {
    viewer::SurfaceOptions so;
    so.component = o.component;
    so.color_by = o.color_by;
    so.range_db = o.range_db;
    so.gain_map = o.gain_map;
    auto mesh = viewer::build_surface(s, o.frequency_index, so);
    if (!mesh) return mesh.error();
    return viewer::write_surface_file(s, o.frequency_index, o.component, *mesh, path, overwrite);
}

Registered add_render(CLI::App& root) {
    auto a = std::make_shared<RenderArgs>();
    CLI::App* sub = root.add_subcommand("render", "Write a 3D snapshot of a pattern (PNG, with colour bar); needs no display");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    sub->add_option("--out", a->out, "Output file: .png (a snapshot), .glb (glTF 2.0 binary) or .ply (the surface as a 3D file)")
        ->required()
        ->type_name("FILE");
    sub->add_option("--component", a->component, "Radius from this component (default total)")
        ->check(one_of(names_of(all_components)));
    sub->add_option("--color-by", a->color_by, "Colour by (default component)")
        ->check(one_of(names_of(viewer::all_color_by, +[](viewer::ColorBy c) { return c != viewer::ColorBy::difference; })));
    sub->add_option("--view", a->view, "Eye direction AZ,EL in degrees (azimuth from +x toward +y, elevation above xy; default 35,22)")
        ->check(number_pair({"AZ", -360, 360}, {"EL", -90, 90}, "degrees"))
        ->type_name("AZ,EL");
    sub->add_option("--size", a->size, "Image size WxH in pixels (default 1200x900)")
        ->check(pixel_size(render_limits.min_width, render_limits.min_height, render_limits.max_side));
    add_frequency_option(sub, a->frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--range", a->range_db, "Dynamic range below the peak shown by the radius, dB (default 30)")
        ->check(number_from_to(1.0, 200.0));
    sub->add_option("--colormap", a->map, "Sequential colour map for gain (default viridis)")
        ->check(one_of(names_of(all_color_maps, is_sequential)));
    sub->add_flag("--glyphs", a->glyphs, "Draw polarisation ellipses on the surface");
    sub->add_flag("--software", a->software, "Force Mesa's software renderer");
    sub->add_flag("--force", a->force, "Overwrite an existing output file");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "a 3D view";
    return {sub, [a]() -> int {
                viewer::SnapshotOptions o;
                // The names were checked while parsing (one_of: the lists in --help).
                parse_component(a->component.c_str(), o.component);
                viewer::parse_color_by(a->color_by, o.color_by);
                viewer::parse_color_map(a->map, o.gain_map);
                if (!a->view.empty()) std::tie(o.view_azimuth_deg, o.view_elevation_deg) = read_number_pair(a->view);
                auto size = exports::parse_pixel_size(a->size, render_limits);
                if (!size) {
                    std::cerr << "ellipsa render: " << size.error().format() << "\n";
                    return exit_usage;
                }
                o.width = size->width_px, o.height = size->height_px;
                o.range_db = a->range_db;
                o.glyphs = a->glyphs;
                o.software = a->software;
                if (const std::string ext = std::filesystem::path(a->out).extension().string();
                    ext != ".png" && !viewer::is_surface_file(a->out)) {  // as `cut` refuses what it cannot write
                    std::cerr << "ellipsa render: --out: expected a file name ending in .png, .glb or .ply, found '" << a->out << "'\n";
                    return exit_usage;
                }
                std::error_code ec;
                if (!a->force && std::filesystem::exists(a->out, ec)) {
                    std::cerr << "ellipsa render: " << a->out << " exists; use --force to overwrite it\n";
                    return exit_bad_input;
                }
                auto s = load_pattern(a->file, a->load);
                if (!s) {
                    std::cerr << "ellipsa render: " << s.error().format() << "\n";
                    return exit_bad_input;
                }
                auto k = pick_frequency(*s, a->frequency_hz, file_path(a->file));
                if (!k) {
                    std::cerr << "ellipsa render: " << k.error().format() << "\n";
                    return exit_bad_input;
                }
                o.frequency_index = *k;
                if (viewer::is_surface_file(a->out)) {
                    if (Status st = write_mesh_file(*s, o, a->out, a->force); !st) {
                        std::cerr << "ellipsa render: " << st.error().format() << "\n";
                        return exit_bad_input;
                    }
                    std::cout << "wrote " << a->out << " (the surface: radius 1 at the largest sample, +z up; glTF files +y up)\n";
                    return exit_ok;
                }
                if (Status st = viewer::render_snapshot_png(*s, o, a->out, a->force); !st) {
                    std::cerr << "ellipsa render: " << st.error().format() << "\n";
                    return exit_bad_input;
                }
                std::cout << "wrote " << a->out << " (" << o.width << "x" << o.height << ")\n";
                if (const std::string m = mounting_note(*s); !m.empty()) std::cout << "  " << m << "\n";
                return exit_ok;
            }};
}
const CommandRegistration registration(65, add_render);
}  // namespace
}  // namespace ellipsa::cli
