// The renderer interface: one OpenGL 3.3 core context, either in a GLFW window or headless
// (EGL on Mesa's surfaceless platform, no display needed). The window, `ellipsa render`, exports
// and `--version` all go through here, so they agree on which GL renderer is used and why.
//
// Choosing the renderer: `software` forces Mesa's llvmpipe (LIBGL_ALWAYS_SOFTWARE=1 and
// MESA_LOADER_DRIVER_OVERRIDE=llvmpipe, set before the context is made). Otherwise a hardware
// context is tried first; if that fails, the software renderer is tried and the reason is kept in
// RendererInfo::how, which the UI and `--version` print in one line.
#pragma once
#include <memory>
#include <string>

#include "pattern/result.hpp"

struct GLFWwindow;

namespace ellipsa::viewer {

struct ContextRequest {
    bool software = false;  // force Mesa's software renderer
    int width = 1280, height = 800;
    std::string title = "ellipsa";
    bool vsync = true;      // window only
};

struct RendererInfo {
    std::string renderer;  // GL_RENDERER, e.g. "llvmpipe (LLVM 15.0.6, 256 bits)"
    std::string version;   // GL_VERSION
    bool software = false; // Mesa llvmpipe/softpipe/swrast
    std::string context;   // "GLFW window" or "headless EGL (surfaceless)"
    std::string how;       // why this renderer: "forced by --software", "no GPU driver answered", ...
    // "llvmpipe (LLVM 15.0.6, 256 bits) - Mesa software, headless EGL (surfaceless); forced by --software"
    std::string line() const;
};

class RenderContext {
public:
    virtual ~RenderContext() = default;
    virtual const RendererInfo& info() const = 0;
    virtual void make_current() = 0;
    // The GLFW window, or nullptr for a headless context.
    virtual GLFWwindow* window() { return nullptr; }
};

// Set the environment so that Mesa uses its software renderer for contexts made after this.
void force_software_rendering();
// Whether LIBGL_ALWAYS_SOFTWARE asks for the software renderer.
bool software_forced_by_env();
// The current context's renderer, and how it was chosen (both kinds of context fill it).
void fill_renderer_info(RendererInfo& info, const std::string& context, bool forced, const std::string& fallback_reason);

// A visible GLFW window with an OpenGL 3.3 core context. Fails (with a message) without a display.
// In viewer/window_context.cpp (the viewer's library), so the snapshot library links no GLFW.
Result<std::unique_ptr<RenderContext>> create_window_context(const ContextRequest& r);
// A headless context on EGL's surfaceless platform; render into framebuffer objects.
Result<std::unique_ptr<RenderContext>> create_headless_context(const ContextRequest& r);

}  // namespace ellipsa::viewer
