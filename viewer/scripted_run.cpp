#include "viewer/scripted_run.hpp"

#include <algorithm>
#include <cstdint>
#include <cstdlib>
#include <iostream>
#include <vector>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "exports/png.hpp"
#include "io/atomic_write.hpp"
#include "io/place.hpp"
#include "viewer/exports_ui.hpp"
#include "viewer/gl.hpp"
#include "viewer/snapshot.hpp"

namespace ellipsa::viewer {

namespace {
// The back buffer as PNG bytes, top row first, opaque.
Result<std::string> back_buffer_png(Window& w) {
    int fbw = 0, fbh = 0;
    glfwGetFramebufferSize(w.glfw(), &fbw, &fbh);
    std::vector<std::uint8_t> px(std::size_t(fbw) * std::size_t(fbh) * 4), flipped(px.size());
    glPixelStorei(GL_PACK_ALIGNMENT, 1);
    glReadBuffer(GL_BACK);
    glReadPixels(0, 0, fbw, fbh, GL_RGBA, GL_UNSIGNED_BYTE, px.data());
    const std::size_t row = std::size_t(fbw) * 4;
    for (int y = 0; y < fbh; ++y) std::copy_n(px.data() + std::size_t(fbh - 1 - y) * row, row, flipped.data() + std::size_t(y) * row);
    for (std::size_t i = 3; i < flipped.size(); i += 4) flipped[i] = 255;
    return exports::encode_png(flipped.data(), fbw, fbh, 4, row);
}

// 0 when written; else the reason on stderr and 1.
int report(const char* option, const ExportOutcome& o) {
    if (o.status == ExportOutcome::Status::written) return 0;
    if (o.status == ExportOutcome::Status::exists)
        std::cerr << "ellipsa view: " << o.path << ": " << io::detail::exists_message << "\n";
    else
        std::cerr << "ellipsa view: " << option << ": " << o.error << "\n";
    return 1;
}
}  // namespace

ScriptedRun::ScriptedRun(const ViewerOptions& o) : o_(o) {
    const char* e = std::getenv("ELLIPSA_BENCH_STEP_FREQUENCY");
    step_frequency_ = o.frames > 0 && e && *e && *e != '0';
}

Intents ScriptedRun::frame_intents(const AppState& s) const {
    const LoadedPattern* a = s.active_pattern();
    if (!step_frequency_ || !a || a->set.frequencies.size() < 2) return {};
    return {intent::SetFrequency{(s.freq + 1) % a->set.frequencies.size()}};
}

void ScriptedRun::place_pointer(Window& w) const {
    if (o_.has_cursor) glfwSetCursorPos(w.glfw(), o_.cursor_x, o_.cursor_y);
}

int ScriptedRun::finish(const AppState& s, const Derived& d, Window& w) const {
    int code = 0;
    if (!o_.export_cut.empty()) code |= report("--export-cut", export_cut_file(s, d.cut.value(), o_.export_cut, o_.force));
    if (!o_.screenshot.empty()) {
        const Result<std::string> png = back_buffer_png(w);
        code |= report("--screenshot", write_export(o_.screenshot, o_.force, [&]() -> Status {
                           if (!png) return png.error();
                           return io::write_file_atomically(o_.screenshot, *png, o_.force);
                       }));
    }
    if (!o_.export_view.empty() && is_surface_file(o_.export_view)) {  // the surface as a 3D file: no GL needed
        code |= report("--export-view", export_surface_file(s, d.surface.value().mesh, o_.export_view, o_.force));
    } else if (!o_.export_view.empty()) {
        // The snapshot renders through its own headless context (the path of `ellipsa render`).
        glfwMakeContextCurrent(nullptr);
        code |= report("--export-view", export_view_file(s, o_.export_view, o_.force));
        w.context().make_current();
    }
    return code;
}

}  // namespace ellipsa::viewer
