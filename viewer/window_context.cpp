// The GLFW window context (viewer/render_context.hpp): kept apart from the headless context, so
// that the snapshot library (reports from the command line and from Python) links no GLFW.
#include <memory>
#include <string>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "viewer/render_context.hpp"

namespace ellipsa::viewer {

namespace {

class WindowContext final : public RenderContext {
public:
    ~WindowContext() override {
        if (window_) glfwDestroyWindow(window_);
        glfwTerminate();
    }
    const RendererInfo& info() const override { return info_; }
    void make_current() override { glfwMakeContextCurrent(window_); }
    GLFWwindow* window() override { return window_; }

    GLFWwindow* window_ = nullptr;
    RendererInfo info_;
};

std::string glfw_error_text() {
    const char* d = nullptr;
    glfwGetError(&d);
    return d ? d : "unknown GLFW error";
}

GLFWwindow* open_window(const ContextRequest& r) {
    glfwDefaultWindowHints();
    glfwWindowHint(GLFW_CONTEXT_VERSION_MAJOR, 3);
    glfwWindowHint(GLFW_CONTEXT_VERSION_MINOR, 3);
    glfwWindowHint(GLFW_OPENGL_PROFILE, GLFW_OPENGL_CORE_PROFILE);
    return glfwCreateWindow(r.width, r.height, r.title.c_str(), nullptr, nullptr);
}

}  // namespace

Result<std::unique_ptr<RenderContext>> create_window_context(const ContextRequest& r) {
    if (!(r.width >= 1 && r.width <= 16384 && r.height >= 1 && r.height <= 16384))
        return Error{"", 0, 0, "window size " + std::to_string(r.width) + " x " + std::to_string(r.height) + " is not usable"};
    if (r.software) force_software_rendering();
    const bool forced = r.software || software_forced_by_env();
    if (!glfwInit()) {
        const std::string why = glfw_error_text();
        return Error{"", 0, 0,
                     "cannot open a window (" + why + "); is a display available? "
                     "Use 'ellipsa render' for images without a display"};
    }
    auto c = std::make_unique<WindowContext>();
    std::string fallback;
    c->window_ = open_window(r);
    if (!c->window_ && !forced) {
        fallback = glfw_error_text();
        force_software_rendering();
        c->window_ = open_window(r);
    }
    if (!c->window_) return Error{"", 0, 0, "cannot create an OpenGL 3.3 core window: " + glfw_error_text()};
    glfwMakeContextCurrent(c->window_);
    glfwSwapInterval(r.vsync ? 1 : 0);
    fill_renderer_info(c->info_, "GLFW window", forced, fallback);
    return std::unique_ptr<RenderContext>(std::move(c));
}

}  // namespace ellipsa::viewer
