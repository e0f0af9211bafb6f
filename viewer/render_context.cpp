#include "viewer/render_context.hpp"

#include <EGL/egl.h>
#include <EGL/eglext.h>

#include <cstdlib>
#include <cstring>
#include <string>

#include "viewer/gl.hpp"

namespace ellipsa::viewer {

namespace {
std::string gl_string(GLenum e) {
    const GLubyte* s = glGetString(e);
    return s ? reinterpret_cast<const char*>(s) : "";
}

bool looks_software(const std::string& renderer) {
    for (const char* w : {"llvmpipe", "softpipe", "swrast", "Software", "software"})
        if (renderer.find(w) != std::string::npos) return true;
    return false;
}

// --- Headless EGL ----------------------------------------------------------------------------
class HeadlessContext final : public RenderContext {
public:
    ~HeadlessContext() override {
        if (display_ != EGL_NO_DISPLAY) {
            eglMakeCurrent(display_, EGL_NO_SURFACE, EGL_NO_SURFACE, EGL_NO_CONTEXT);
            if (context_ != EGL_NO_CONTEXT) eglDestroyContext(display_, context_);
            // The display is left initialised: it is one per process, and Mesa 22's llvmpipe
            // crashed (a call through a stale pointer) when a second context on a display that
            // had been terminated and initialised again was torn down, as a Python session
            // writing two reports did. eglInitialize on an initialised display just succeeds.
            // The display is released when the process ends.
        }
    }
    const RendererInfo& info() const override { return info_; }
    void make_current() override { eglMakeCurrent(display_, EGL_NO_SURFACE, EGL_NO_SURFACE, context_); }

    EGLDisplay display_ = EGL_NO_DISPLAY;
    EGLContext context_ = EGL_NO_CONTEXT;
    RendererInfo info_;
};

std::string egl_error_text(const char* what) {
    char buf[96];
    std::snprintf(buf, sizeof buf, "%s failed (EGL error 0x%04x)", what, unsigned(eglGetError()));
    return buf;
}

Result<std::unique_ptr<HeadlessContext>> try_headless() {
    auto get_platform_display =
        reinterpret_cast<PFNEGLGETPLATFORMDISPLAYEXTPROC>(eglGetProcAddress("eglGetPlatformDisplayEXT"));
    if (!get_platform_display) return Error{"", 0, 0, "EGL has no eglGetPlatformDisplayEXT"};
    auto c = std::make_unique<HeadlessContext>();
    c->display_ = get_platform_display(EGL_PLATFORM_SURFACELESS_MESA, EGL_DEFAULT_DISPLAY, nullptr);
    if (c->display_ == EGL_NO_DISPLAY) return Error{"", 0, 0, "no EGL surfaceless platform (Mesa's EGL_MESA_platform_surfaceless)"};
    EGLint major = 0, minor = 0;
    if (!eglInitialize(c->display_, &major, &minor)) {
        c->display_ = EGL_NO_DISPLAY;
        return Error{"", 0, 0, egl_error_text("eglInitialize")};
    }
    if (!eglBindAPI(EGL_OPENGL_API)) return Error{"", 0, 0, egl_error_text("eglBindAPI(OpenGL)")};
    const EGLint config_attribs[] = {EGL_SURFACE_TYPE, EGL_PBUFFER_BIT, EGL_RENDERABLE_TYPE, EGL_OPENGL_BIT,
                                     EGL_RED_SIZE, 8, EGL_GREEN_SIZE, 8, EGL_BLUE_SIZE, 8, EGL_NONE};
    EGLConfig config = nullptr;
    EGLint n = 0;
    if (!eglChooseConfig(c->display_, config_attribs, &config, 1, &n) || n < 1) config = nullptr;  // EGL_NO_CONFIG_KHR
    const EGLint ctx_attribs[] = {EGL_CONTEXT_MAJOR_VERSION, 3, EGL_CONTEXT_MINOR_VERSION, 3,
                                  EGL_CONTEXT_OPENGL_PROFILE_MASK, EGL_CONTEXT_OPENGL_CORE_PROFILE_BIT, EGL_NONE};
    c->context_ = eglCreateContext(c->display_, config, EGL_NO_CONTEXT, ctx_attribs);
    if (c->context_ == EGL_NO_CONTEXT) return Error{"", 0, 0, egl_error_text("eglCreateContext(OpenGL 3.3 core)")};
    if (!eglMakeCurrent(c->display_, EGL_NO_SURFACE, EGL_NO_SURFACE, c->context_))
        return Error{"", 0, 0, egl_error_text("eglMakeCurrent without a surface")};
    return c;
}
}  // namespace

bool software_forced_by_env() {
    const char* a = std::getenv("LIBGL_ALWAYS_SOFTWARE");
    return a && *a && std::strcmp(a, "0") != 0 && std::strcmp(a, "false") != 0;
}

void fill_renderer_info(RendererInfo& info, const std::string& context, bool forced, const std::string& fallback_reason) {
    info.renderer = gl_string(GL_RENDERER);
    info.version = gl_string(GL_VERSION);
    info.software = looks_software(info.renderer);
    info.context = context;
    if (forced)
        info.how = "software forced (--software or LIBGL_ALWAYS_SOFTWARE)";
    else if (!fallback_reason.empty())
        info.how = "hardware context failed (" + fallback_reason + "), fell back to Mesa software";
    else if (info.software)
        info.how = "no GPU driver answered, Mesa chose its software renderer";
    else
        info.how = "hardware";
}

std::string RendererInfo::line() const {
    std::string s = renderer.empty() ? std::string("unknown renderer") : renderer;
    s += software ? " - Mesa software" : " - hardware";
    s += ", " + context;
    if (!how.empty() && how != "hardware") s += "; " + how;
    return s;
}

void force_software_rendering() {
    setenv("LIBGL_ALWAYS_SOFTWARE", "1", 1);
    setenv("MESA_LOADER_DRIVER_OVERRIDE", "llvmpipe", 1);
}

Result<std::unique_ptr<RenderContext>> create_headless_context(const ContextRequest& r) {
    if (r.software) force_software_rendering();
    const bool forced = r.software || software_forced_by_env();
    auto c = try_headless();
    std::string fallback;
    if (!c && !forced) {
        fallback = c.error().message;
        force_software_rendering();
        c = try_headless();
    }
    if (!c) return Error{"", 0, 0, "cannot create a headless OpenGL 3.3 context: " + c.error().message};
    fill_renderer_info((*c)->info_, "headless EGL (surfaceless)", forced, fallback);
    return std::unique_ptr<RenderContext>(std::move(*c));
}

}  // namespace ellipsa::viewer
