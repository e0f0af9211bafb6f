// ellipsa view: the interactive viewer (3D gain surface, polarisation, cuts).
#include <iostream>
#include <memory>

#include "cli/commands.hpp"
#include "viewer/app.hpp"

namespace ellipsa::cli {
namespace {
struct ViewArgs {
    std::vector<std::string> files;
    bool software = false, frame_stats = false;
    std::string size, screenshot;
    int frames = 0;
};

Registered add_view(CLI::App& root) {
    auto a = std::make_shared<ViewArgs>();
    CLI::App* sub = root.add_subcommand("view", "Open the viewer: 3D gain surfaces, polarisation explorer and cuts");
    sub->add_option("FILE", a->files, "Far-field CSV files (default: the bundled example)");
    sub->add_flag("--software", a->software, "Force Mesa's software renderer (llvmpipe)");
    sub->add_option("--size", a->size, "Window size WxH in pixels (default: as last time, first 1280x800)");
    sub->add_option("--frames", a->frames, "Run this many frames and exit")->check(CLI::Range(1, 1000000));
    sub->add_option("--screenshot", a->screenshot, "With --frames: write the last frame to this PNG");
    sub->add_flag("--frame-stats", a->frame_stats,
                  "Print one JSON line {\"frames\", \"median_ms\", \"p95_ms\"} at exit (vsync off)");
    return {sub, [a]() -> int {
                viewer::ViewerOptions o;
                o.files = a->files;
                o.software = a->software;
                o.frames = a->frames;
                o.screenshot = a->screenshot;
                o.frame_stats = a->frame_stats;
                if (!a->screenshot.empty() && a->frames == 0) {
                    std::cerr << "ellipsa view: --screenshot needs --frames N (the last frame is written)\n";
                    return exit_usage;
                }
                if (!a->size.empty()) {
                    int w = 0, h = 0;
                    char tail = 0;
                    if (std::sscanf(a->size.c_str(), "%dx%d%c", &w, &h, &tail) != 2 || w < 320 || h < 240 || w > 16384 || h > 16384) {
                        std::cerr << "ellipsa view: --size expects WxH with W >= 320 and H >= 240, e.g. 1280x800; found '"
                                  << a->size << "'\n";
                        return exit_usage;
                    }
                    o.width = w, o.height = h;
                }
                o.save_settings = a->frames == 0;  // scripted runs leave the user's settings alone
                return viewer::run_viewer(o);
            }};
}
const CommandRegistration registration(50, add_view);
}  // namespace
}  // namespace ellipsa::cli
