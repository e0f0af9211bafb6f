// What `ellipsa render` makes of its options and how it writes its file (cli/render_options.hpp).
#include "cli/render_options.hpp"

#include <charconv>
#include <filesystem>
#include <mutex>
#include <tuple>

#include "cli/usage.hpp"
#include "pattern/colormap.hpp"
#include "pattern/components.hpp"
#include "viewer/scene/components.hpp"
#include "viewer/surface_file.hpp"

namespace ellipsa::cli {

namespace {

// "--name: why" when `check` refuses `text`: the words CLI11 gives a value refused while parsing.
Status refused(const char* option, const CLI::Validator& check, const std::string& text) {
    const std::string why = check(text);
    if (why.empty()) return Ok{};
    return Error{"", 0, 0, std::string(option) + ": " + why};
}

std::string shortest(double v) {
    char buf[40];
    return std::string(buf, std::to_chars(buf, buf + sizeof buf, v).ptr);
}

}  // namespace

const RenderChecks& render_checks() {
    static const RenderChecks checks{
        one_of(names_of(all_components)),
        // difference needs a second pattern, which the command does not take
        one_of(names_of(viewer::all_color_by, +[](viewer::ColorBy c) { return c != viewer::ColorBy::difference; })),
        one_of(names_of(all_color_maps, is_sequential)),
        number_pair({"AZ", -360, 360}, {"EL", -90, 90}, "degrees"),
        pixel_size(render_limits.min_width, render_limits.min_height, render_limits.max_side),
        number_from_to(1.0, 200.0)};
    return checks;
}

std::string pair_text(double a, double b, char sep) { return shortest(a) + sep + shortest(b); }

Result<viewer::SnapshotOptions> render_options(const RenderChoices& c) {
    const RenderChecks& k = render_checks();
    viewer::SnapshotOptions o;
    struct Given {
        const char* option;
        const CLI::Validator& check;
        std::optional<std::string> text;
    };
    for (const Given& g : {Given{"--component", k.component, c.component}, Given{"--color-by", k.color_by, c.color_by},
                           Given{"--view", k.view, c.view}, Given{"--size", k.size, c.size},
                           Given{"--range", k.range, c.range_db ? std::optional(shortest(*c.range_db)) : std::nullopt},
                           Given{"--colormap", k.colormap, c.colormap}})
        if (g.text)
            if (Status st = refused(g.option, g.check, *g.text); !st) return st.error();
    // Each text passed its check: the readers below accept it.
    if (c.component) parse_component(c.component->c_str(), o.component);
    if (c.color_by) viewer::parse_color_by(*c.color_by, o.color_by);
    if (c.colormap) parse_color_map(*c.colormap, o.gain_map);
    if (c.view) std::tie(o.view_azimuth_deg, o.view_elevation_deg) = read_number_pair(*c.view);
    if (c.size) {
        auto size = exports::parse_pixel_size(*c.size, render_limits);
        if (!size) return Error{"", 0, 0, "--size: " + size.error().message};
        o.width = size->width_px, o.height = size->height_px;
    }
    if (c.range_db) o.range_db = *c.range_db;
    o.glyphs = c.glyphs;
    o.software = c.software;
    return o;
}

Status check_render_out(const std::string& out) {
    // as `cut` refuses what it cannot write
    if (std::filesystem::path(out).extension().string() == ".png" || viewer::is_surface_file(out)) return Ok{};
    return Error{"", 0, 0, "--out: expected a file name ending in .png, .glb or .ply, found '" + out + "'"};
}

Result<std::string> write_render(const FarFieldSet& s, const viewer::SnapshotOptions& o, const std::string& out, bool force) {
    if (viewer::is_surface_file(out)) {
        if (Status st = viewer::write_surface_file(s, o, out, force); !st) return st.error();
        return std::string("(the surface: radius 1 at the largest sample, +z up; glTF files +y up)");
    }
    Status st = Ok{};
    {
        std::lock_guard<std::mutex> turn(viewer::snapshot_turn());
        st = viewer::render_snapshot_png(s, o, out, force);
    }
    if (!st) return st.error();
    return "(" + std::to_string(o.width) + "x" + std::to_string(o.height) + ")";
}

}  // namespace ellipsa::cli
