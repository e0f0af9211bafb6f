// ellipsa view: the interactive viewer (3D gain surface, polarisation, cuts).
#include <iostream>
#include <memory>

#include "cli/commands.hpp"
#include "io/atomic_write.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/load.hpp"
#include "exports/cut_figure.hpp"
#include "exports/render.hpp"
#include "viewer/app.hpp"
#include "pattern/components.hpp"
#include "viewer/scene/components.hpp"
#include "viewer/state/app_state.hpp"
#include <iterator>
#include <tuple>
#include <optional>
#include <cmath>
#include <cstdio>
#include <filesystem>

namespace ellipsa::cli {
namespace {
// The window's size limits (--size).
constexpr exports::PixelLimits view_limits{320, 240, 16384};
struct ViewArgs {
    std::vector<std::string> files;
    bool software = false, frame_stats = false;
    std::string size, screenshot;
    int frames = 0;
    std::string component, color_by, pin, view, export_cut, export_view, cursor, cut_style, cut_components;
    int compare = 0;
    bool wireframe = false, translucent = false;
    bool diversity = false;
    bool band = false;
    LoadOptions load;
    bool force = false;
    std::optional<double> frequency_hz;
    std::string tab;
    std::string browse;
};

// The first refusal of the files a scripted run would write (one already there without --force,
// a dangling link too; a folder or a device always), before the window opens.
Status outputs_refused(const ViewArgs& a) {
    for (const std::string* f : {&a.screenshot, &a.export_cut, &a.export_view})
        if (!f->empty())
            if (Status st = io::check_destination(*f, a.force); !st) return st;
    return Ok{};
}

// A file named in the window (typed, recent, dropped, chosen) and the map file typed beside it,
// read as a FILE argument of the command line: "co.csv::join=cross.csv" or "x.csv::up=+x" work
// there too; the command's own options are not applied to it.
Result<viewer::FileRequest> prepare_in_window(const std::string& text, const std::string& map) {
    LoadOptions none;
    none.map_file = map;
    auto p = prepare_load(text, none);
    if (!p) return p.error();
    auto install = install_request(p->mounting);
    if (!install) return Error{p->path, 0, 0, install.error().message};
    return viewer::FileRequest{p->path, std::move(p->join), std::move(p->options), std::move(*install)};
}

// Every file's reader options, made here as for every other command (cli/load.hpp); a bad option
// or map file is refused before the window opens.
int file_options(const ViewArgs& a, viewer::ViewerOptions& o) {
    for (const std::string& f : a.files) {
        auto p = prepare_load(f, a.load);
        if (!p) {
            std::cerr << "ellipsa view: " << p.error().format() << "\n";
            return exit_bad_input;
        }
        std::error_code ec;
        if (a.frames > 0 && !std::filesystem::is_regular_file(p->path, ec)) {  // a scripted run never falls back to the examples
            std::cerr << "ellipsa view: " << p->path << ": expected a pattern file, found " << (std::filesystem::exists(p->path, ec) ? "no regular file" : "nothing") << "\n";
            return exit_bad_input;
        }
        if (!p->beside_map.empty()) std::cerr << "ellipsa view: " << p->path << ": read with the map file beside it, " << p->beside_map << "\n";
        auto install = install_request(p->mounting);  // checked while parsing; named all the same
        if (!install) {
            std::cerr << "ellipsa view: " << p->path << ": " << install.error().format() << "\n";
            return exit_usage;
        }
        o.files.push_back(p->path);
        o.file_options.push_back(std::move(p->options));
        o.file_installs.push_back(std::move(*install));
        o.file_joins.push_back(std::move(p->join));
    }
    o.prepare = prepare_in_window;
    return exit_ok;
}

void add_view_options(CLI::App* sub, ViewArgs& a) {
    sub->add_option("FILE", a.files, "Far-field CSV files, each may carry its own options (FILE::map=...); default: the bundled examples");
    sub->add_flag("--software", a.software, "Force Mesa's software renderer (llvmpipe)");
    sub->add_option("--size", a.size, "Window size WxH in pixels (default: as last time, first 1280x800)")
        ->check(pixel_size(view_limits.min_width, view_limits.min_height, view_limits.max_side));
    sub->add_option("--frames", a.frames, "Run this many frames and exit")->check(number_from_to(1, 1000000));
    sub->add_option("--screenshot", a.screenshot, "With --frames: write the last frame to this PNG")->type_name("FILE");
    sub->add_flag("--frame-stats", a.frame_stats,
                  "Print one JSON line {\"frames\", \"median_ms\", \"p95_ms\"} at exit (vsync off)");
    sub->add_option("--component", a.component, "Start with this component as the radius")
        ->check(one_of(names_of(all_components)));
    sub->add_option("--color-by", a.color_by, "Start with this colouring")->check(one_of(names_of(viewer::all_color_by)));
    sub->add_option("--compare", a.compare, "Start comparing with FILE number N (1-based) as B")->check(number_from_to(1, 1000));
    sub->add_option("--pin", a.pin, "Start with THETA,PHI (deg) pinned, and the cut through it")
        ->check(number_pair({"THETA", 0, 180}, {"PHI", -360, 360}, "degrees"))
        ->type_name("THETA,PHI");
    sub->add_option("--view", a.view, "Start looking from AZ,EL (deg)")
        ->check(number_pair({"AZ", -360, 360}, {"EL", -90, 90}, "degrees"))
        ->type_name("AZ,EL");
    sub->add_flag("--wireframe", a.wireframe, "Start with the wireframe on");
    sub->add_option("--cursor", a.cursor, "With --frames: hold the mouse pointer at X,Y window pixels (probe screenshots)")
        ->check(number_pair({"X", 0, 16384}, {"Y", 0, 16384}, "window pixels"))
        ->type_name("X,Y");
    sub->add_option("--export-view", a.export_view, "With --frames: export the 3D view of the last frame as PNG (as Ctrl+E)")
        ->type_name("FILE");
    sub->add_option("--export-cut", a.export_cut, "With --frames: write the cut of the last frame (.svg, .png, .pdf or .csv)")
        ->type_name("FILE");
    sub->add_option("--cut-style", a.cut_style, "Start with a polar or rect cut plot of the gains, or the phases (phase)")
        ->check(one_of({"polar", "rect", "phase"}));
    sub->add_option("--cut-components", a.cut_components, "Start with these components in the cut: comma-separated (see 'cut --components')");
    sub->add_flag("--translucent", a.translucent, "Start with a translucent surface");
    sub->add_flag("--diversity", a.diversity, "Start with the diversity panel open (MEG, ECC, orientation curve)");
    sub->add_flag("--band", a.band, "Start with the figures-against-frequency panel open");
    add_frequency_option(sub, a.frequency_hz, "Start at this frequency (the first file's nearest within 0.5 %; default its first)");
    sub->add_option("--tab", a.tab, "Start with this panel in front: patterns, surface (left column of a narrow window), cut, probe, polarisation (plot strip of a narrow window), diversity, band, map (the 2D map)")
        ->check(one_of(std::vector<std::string>(std::begin(viewer::tab_names), std::end(viewer::tab_names))));
    sub->add_option("--browse", a.browse, "Start with the in-window file browser open in FOLDER (File > Open in this window)")
        ->type_name("FOLDER");
    sub->add_flag("--force", a.force, "Replace the files of --screenshot, --export-view and --export-cut if they exist");
    add_load_options(sub, a.load);
}

// The window: renderer, size, a scripted run's frames and screenshot.
int window_options(const ViewArgs& a, viewer::ViewerOptions& o) {
    o.software = a.software;
    o.frames = a.frames;
    o.screenshot = a.screenshot;
    o.frame_stats = a.frame_stats;
    if (!a.screenshot.empty() && a.frames == 0) {
        std::cerr << "ellipsa view: --screenshot needs --frames N (the last frame is written)\n";
        return exit_usage;
    }
    if (!a.size.empty()) {
        auto size = exports::parse_pixel_size(a.size, view_limits);
        if (!size) {
            std::cerr << "ellipsa view: " << size.error().format() << "\n";
            return exit_usage;
        }
        o.width = size->width_px, o.height = size->height_px;
    }
    o.save_settings = a.frames == 0;
    return exit_ok;
}

// The names of the starting component and colouring, and what a scripted run writes besides the
// screenshot.
int look_and_exports(const ViewArgs& a, viewer::ViewerOptions& o) {
    if (!a.export_cut.empty() && a.frames == 0) {
        std::cerr << "ellipsa view: --export-cut needs --frames N (the cut of the last frame is written)\n";
        return exit_usage;
    }
    o.export_cut = a.export_cut;
    o.export_view = a.export_view;
    if (!a.cursor.empty()) {
        if (a.frames == 0) {
            std::cerr << "ellipsa view: --cursor needs --frames N\n";
            return exit_usage;
        }
        std::tie(o.cursor_x, o.cursor_y) = read_number_pair(a.cursor);
        o.has_cursor = true;
    }
    if (!a.export_view.empty() && a.frames == 0) {
        std::cerr << "ellipsa view: --export-view needs --frames N\n";
        return exit_usage;
    }
    o.component = a.component;
    o.color_by = a.color_by;
    return exit_ok;
}

// What the window starts with: comparison, surface style, panels, frequency, tab, pin and view.
int start_state(const ViewArgs& a, viewer::ViewerOptions& o) {
    if (a.compare != 0 && (a.compare < 1 || a.compare > int(a.files.size()))) {
        std::cerr << "ellipsa view: --compare expects a FILE number from 1 to " << a.files.size() << ", found "
                  << a.compare << "\n";
        return exit_usage;
    }
    o.compare = a.compare - 1;
    o.wireframe = a.wireframe;
    o.translucent = a.translucent;
    if (!a.cut_style.empty()) o.cut_style = a.cut_style == "rect" ? 1 : a.cut_style == "phase" ? 2 : 0;
    if (!a.cut_components.empty()) {
        auto list = exports::parse_component_list(a.cut_components);
        if (!list) {
            std::cerr << "ellipsa view: --cut-components: " << list.error().message << "\n";
            return exit_usage;
        }
        unsigned bits = 0;
        for (Component c : *list) bits |= 1u << unsigned(c);
        o.cut_components = bits;
    }
    o.diversity_panel = a.diversity;
    o.band_panel = a.band;
    if (a.frequency_hz && !(std::isfinite(*a.frequency_hz) && *a.frequency_hz > 0)) {
        std::cerr << "ellipsa view: --frequency expects a positive frequency in Hz, found " << *a.frequency_hz << "\n";
        return exit_usage;
    }
    o.frequency_hz = a.frequency_hz;
    o.tab = a.tab;
    o.browse = a.browse;
    if (!a.pin.empty()) {
        std::tie(o.pin_theta_deg, o.pin_phi_deg) = read_number_pair(a.pin);  // checked while parsing
        o.has_pin = true;
    }
    if (!a.view.empty()) {
        std::tie(o.view_azimuth_deg, o.view_elevation_deg) = read_number_pair(a.view);
        o.has_view = true;
    }
    return exit_ok;
}

Registered add_view(CLI::App& root) {
    auto a = std::make_shared<ViewArgs>();
    CLI::App* sub = root.add_subcommand("view", "Open the viewer: 3D gain surfaces, polarisation explorer and cuts");
    add_view_options(sub, *a);
    return {sub, [a]() -> int {
                viewer::ViewerOptions o;
                for (auto step : {file_options, window_options, look_and_exports, start_state})
                    if (int rc = step(*a, o); rc != exit_ok) return rc;
                if (Status st = outputs_refused(*a); !st) {
                    std::cerr << "ellipsa view: " << st.error().format() << "\n";
                    return exit_bad_input;
                }
                o.force = a->force;
                return viewer::run_viewer(o);
            }};
}
const CommandRegistration registration(50, add_view);
}  // namespace
}  // namespace ellipsa::cli
