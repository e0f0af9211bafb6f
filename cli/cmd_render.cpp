// ellipsa render: a 3D snapshot of a pattern as PNG, through the headless EGL context (works with
// no display at all), or the gain surface itself as a 3D file (.glb, .ply; no GL needed).
#include <iostream>
#include <memory>
#include <optional>

#include "cli/commands.hpp"
#include "io/atomic_write.hpp"
#include "cli/frequency_option.hpp"
#include "cli/load.hpp"
#include "cli/mounting_options.hpp"
#include "cli/render_options.hpp"
#include "importers/text.hpp"
#include "viewer/surface_file.hpp"

namespace ellipsa::cli {
namespace {
// The options as given (cli/render_options.hpp checks them and holds their defaults).
struct RenderArgs {
    std::string file, out, component, color_by, view, size, map;
    std::optional<double> frequency_hz, range_db;
    bool force = false, glyphs = false, software = false;
    LoadOptions load;
    // Unset options are empty (an empty value is refused while parsing).
    RenderChoices choices() const {
        auto given = [](const std::string& v) { return v.empty() ? std::nullopt : std::optional(v); };
        return {given(component), given(color_by), given(map), given(view), given(size), range_db, glyphs, software};
    }
};

int fail(int code, const std::string& message) {
    std::cerr << "ellipsa render: " << message << "\n";
    return code;
}

void add_render_options(CLI::App* sub, RenderArgs& a) {
    const RenderChecks& k = render_checks();
    const viewer::SnapshotOptions d;  // the defaults
    const std::string view = pair_text(d.view_azimuth_deg, d.view_elevation_deg, ','), size = pair_text(d.width, d.height, 'x');
    sub->add_option("--component", a.component, std::string("Radius from this component (default ") + to_string(d.component) + ")")
        ->check(k.component);
    sub->add_option("--color-by", a.color_by, std::string("Colour by (default ") + viewer::to_string(d.color_by) + ")")->check(k.color_by);
    sub->add_option("--view", a.view, "Eye direction AZ,EL in degrees (azimuth from +x toward +y, elevation above xy; default " + view + ")")
        ->check(k.view)
        ->type_name("AZ,EL");
    sub->add_option("--size", a.size, "Image size WxH in pixels (default " + size + ")")->check(k.size);
    add_frequency_option(sub, a.frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--range", a.range_db, "Dynamic range below the peak shown by the radius, dB (default " + text::number(d.range_db) + ")")
        ->check(k.range);
    sub->add_option("--colormap", a.map, std::string("Sequential colour map for gain (default ") + to_string(d.gain_map) + ")")
        ->check(k.colormap);
    sub->add_flag("--glyphs", a.glyphs, "Draw polarisation ellipses on the surface");
    sub->add_flag("--software", a.software, "Force Mesa's software renderer");
}

int run_render(const RenderArgs& a) {
    auto o = render_options(a.choices());  // checked while parsing too: the same checks
    if (!o) return fail(exit_usage, o.error().message);
    if (Status st = check_render_out(a.out); !st) return fail(exit_usage, st.error().message);
    if (Status st = io::check_destination(a.out, a.force); !st) return fail(exit_bad_input, st.error().format());
    auto s = load_pattern(a.file, a.load);
    if (!s) return fail(exit_bad_input, s.error().format());
    auto k = pick_frequency(*s, a.frequency_hz, file_path(a.file));
    if (!k) return fail(exit_bad_input, k.error().format());
    o->frequency_index = *k;
    auto wrote = write_render(*s, *o, a.out, a.force);
    if (!wrote) return fail(exit_bad_input, wrote.error().format());
    std::cout << "wrote " << a.out << " " << *wrote << "\n";
    if (viewer::is_surface_file(a.out)) return exit_ok;
    if (const std::string m = mounting_note(*s); !m.empty()) std::cout << "  " << m << "\n";
    return exit_ok;
}

Registered add_render(CLI::App& root) {
    auto a = std::make_shared<RenderArgs>();
    CLI::App* sub = root.add_subcommand("render", "Write a 3D snapshot of a pattern (PNG, with colour bar); needs no display");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    sub->add_option("--out", a->out, "Output file: .png (a snapshot), .glb (glTF 2.0 binary) or .ply (the surface as a 3D file)")
        ->required()
        ->type_name("FILE");
    add_render_options(sub, *a);
    sub->add_flag("--force", a->force, "Overwrite an existing output file");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "a 3D view";
    return {sub, [a]() -> int { return run_render(*a); }};
}
const CommandRegistration registration(65, add_render);
}  // namespace
}  // namespace ellipsa::cli
