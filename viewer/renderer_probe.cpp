#include "viewer/renderer_probe.hpp"

#include <cstdlib>

#include "viewer/render_context.hpp"

namespace ellipsa::viewer {

std::string probe_renderer_line() {
    // Keep Mesa's loader chatter off the user's terminal while probing.
    setenv("EGL_LOG_LEVEL", "fatal", 0);
    setenv("MESA_LOG_LEVEL", "error", 0);
    ContextRequest r;
    r.width = r.height = 16;
    auto ctx = create_headless_context(r);
    if (!ctx) return "unavailable (" + ctx.error().format() + ")";
    return (*ctx)->info().line();
}

}  // namespace ellipsa::viewer
