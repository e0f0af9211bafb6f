// The viewer's window and what it owns: the GLFW window with its OpenGL context, Dear ImGui with
// its GLFW and OpenGL 3 backends and our fonts, the scene renderer, the files dropped on the
// window, and the stop signals (Ctrl+C, SIGTERM), which close the window like its close button
// so that settings are still saved. No globals: the drop callback reaches the window through
// GLFW's user pointer, and the signals arrive through a signalfd that the loop polls.
#pragma once
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "pattern/result.hpp"
#include "viewer/render_context.hpp"
#include "viewer/scene_renderer.hpp"
#include "viewer/ui_style.hpp"

struct GLFWwindow;

namespace ellipsa::viewer {

// Blocks SIGINT and SIGTERM for the whole process (threads started later inherit it) and
// delivers them through a descriptor instead. Make it before any thread starts.
class StopSignals {
public:
    StopSignals();
    ~StopSignals();  // restores the signal mask
    StopSignals(const StopSignals&) = delete;
    StopSignals& operator=(const StopSignals&) = delete;
    // True once a stop signal has arrived (polls without blocking).
    bool requested();

private:
    int fd_ = -1;
    bool seen_ = false;
};

struct WindowRequest {
    ContextRequest context;
    std::optional<std::string> imgui_ini;  // window layout to start from
};

class Window {
public:
    // Opens the window, sets up ImGui (without an ini file of its own) and the scene renderer.
    static Result<std::unique_ptr<Window>> open(const WindowRequest& r);
    ~Window();
    Window(const Window&) = delete;
    Window& operator=(const Window&) = delete;

    GLFWwindow* glfw() const { return window_; }
    RenderContext& context() { return *context_; }
    SceneRenderer& scene() { return scene_; }
    const RendererInfo& renderer() const { return context_->info(); }
    const UiFonts& fonts() const { return fonts_; }

    bool close_requested() const;
    void request_close();
    // Poll events and start an ImGui frame; returns the files dropped on the window since.
    std::vector<std::string> begin_frame();
    void swap();
    // The window size in screen coordinates (0 x 0 when unknown) and ImGui's layout text.
    std::pair<int, int> size() const;
    std::string imgui_ini() const;

private:
    Window() = default;
    std::unique_ptr<RenderContext> context_;
    GLFWwindow* window_ = nullptr;
    bool imgui_ready_ = false;
    UiFonts fonts_;
    SceneRenderer scene_;
    std::vector<std::string> dropped_;
};

}  // namespace ellipsa::viewer
