// Everything the viewer window knows, in one value: the loaded patterns, what is shown, the
// camera, the probe and the persistent settings. Panels read it and return intents; the loop in
// app.cpp applies them. Nothing here draws.
#pragma once
#include <atomic>
#include <deque>
#include <memory>
#include <optional>
#include <thread>
#include <string>
#include <vector>

#include "pattern/cut.hpp"
#include "pattern/far_field.hpp"
#include "pattern/summary.hpp"
#include "viewer/render_context.hpp"
#include "viewer/scene/camera.hpp"
#include "viewer/scene/cut_view.hpp"
#include "viewer/scene/picking.hpp"
#include "viewer/scene/poincare.hpp"
#include "viewer/scene/settings.hpp"
#include "viewer/scene/surface_mesh.hpp"
#include "viewer/ui_style.hpp"

namespace ellipsa::viewer {

struct LoadedPattern {
    FarFieldSet set;
    std::string path;  // empty for built-in patterns
    std::vector<PatternSummary> summaries;  // per frequency, filled on first use
};

// A file being read on a worker thread, so a large file never freezes the window. The worker
// touches only this object; the loop takes the result when `done` is set.
struct BackgroundLoad {
    std::string path, map;
    std::atomic<double> progress{0};
    std::atomic<bool> cancel{false}, done{false};
    std::optional<Result<FarFieldSet>> result;
    std::thread worker;
    ~BackgroundLoad() {
        cancel = true;
        if (worker.joinable()) worker.join();
    }
};

struct AppState {
    std::vector<LoadedPattern> patterns;
    int active = 0;    // A
    int compare = -1;  // B for the difference view, -1 none
    std::size_t freq = 0;
    ViewerSettings settings;
    OrbitCamera camera;
    RendererInfo renderer;
    UiFonts fonts;

    SurfaceMesh mesh;
    std::string mesh_error;  // why the surface cannot be shown (shown in the view)
    double mesh_build_ms = 0;
    bool mesh_dirty = true, glyphs_dirty = true, cut_dirty = true;
    CutData cut;

    std::optional<Pick> hover, pinned;
    // The Poincare cloud of the active pattern, recomputed only when its inputs change.
    struct {
        int generation = -1;
        int active = -1;
        std::size_t freq = 0;
        double within_db = 0;
        std::vector<PoincarePoint> points;
    } poincare;
    int generation = 0;  // bumped whenever patterns are opened or closed
    std::string path_input, map_input;
    std::string load_error;  // last failed load, shown until dismissed
    std::string load_error_printed;  // (start-up: already written to stderr)
    std::unique_ptr<BackgroundLoad> loading;                  // the file being read, if any
    std::deque<std::pair<std::string, std::string>> to_load;  // (path, map file) waiting their turn
    std::string note;        // e.g. "built-in demo"
    bool show_help = false;
    bool show_intro = false;
    bool want_export = false;
    std::string export_message, cut_export_message;

    const LoadedPattern* active_pattern() const {
        return active >= 0 && active < int(patterns.size()) ? &patterns[std::size_t(active)] : nullptr;
    }
    const LoadedPattern* compare_pattern() const {
        return compare >= 0 && compare < int(patterns.size()) && compare != active ? &patterns[std::size_t(compare)] : nullptr;
    }
    // The frequency index to use for pattern p (nearest to A's current frequency).
    std::size_t freq_for(const LoadedPattern& p) const;
    const PatternSummary* summary();
};

}  // namespace ellipsa::viewer
