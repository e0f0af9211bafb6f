#include "viewer/window.hpp"

#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>
#include <signal.h>
#include <sys/signalfd.h>
#include <unistd.h>

#include <algorithm>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "viewer/scene/glyphs.hpp"

namespace ellipsa::viewer {

namespace {
sigset_t stop_set() {
    sigset_t set;
    sigemptyset(&set);
    sigaddset(&set, SIGINT);
    sigaddset(&set, SIGTERM);
    return set;
}
}  // namespace

StopSignals::StopSignals() {
    const sigset_t set = stop_set();
    pthread_sigmask(SIG_BLOCK, &set, nullptr);
    fd_ = signalfd(-1, &set, SFD_NONBLOCK | SFD_CLOEXEC);
}

StopSignals::~StopSignals() {
    requested();  // take any signal still pending, so unblocking does not end the process
    if (fd_ >= 0) ::close(fd_);
    const sigset_t set = stop_set();
    pthread_sigmask(SIG_UNBLOCK, &set, nullptr);
}

bool StopSignals::requested() {
    signalfd_siginfo info;
    while (fd_ >= 0 && ::read(fd_, &info, sizeof info) == ssize_t(sizeof info)) seen_ = true;
    return seen_;
}

Result<std::unique_ptr<Window>> Window::open(const WindowRequest& r) {
    auto ctx = create_window_context(r.context);
    if (!ctx) return ctx.error();
    std::unique_ptr<Window> w(new Window());
    w->context_ = std::move(*ctx);
    w->window_ = w->context_->window();
    glfwSetWindowUserPointer(w->window_, w.get());
    glfwSetDropCallback(w->window_, [](GLFWwindow* g, int n, const char** paths) {
        auto* self = static_cast<Window*>(glfwGetWindowUserPointer(g));
        for (int i = 0; i < n; ++i) self->dropped_.emplace_back(paths[i]);
    });
    IMGUI_CHECKVERSION();
    ImGui::CreateContext();
    ImGui::GetIO().IniFilename = nullptr;  // the viewer reads and writes imgui.ini itself (settings_file.hpp)
    if (r.imgui_ini) ImGui::LoadIniSettingsFromMemory(r.imgui_ini->data(), r.imgui_ini->size());
    float xscale = 1, yscale = 1;
    glfwGetWindowContentScale(w->window_, &xscale, &yscale);
    w->fonts_ = setup_ui_style(std::clamp(xscale, 1.0f, 3.0f));
    ImGui_ImplGlfw_InitForOpenGL(w->window_, true);
    ImGui_ImplOpenGL3_Init("#version 330");
    w->imgui_ready_ = true;
    if (Status st = w->scene_.init(); !st) return st.error();
    w->scene_.set_axes(build_axes(1.3));
    return w;
}

Window::~Window() {
    if (context_) context_->make_current();
    if (imgui_ready_) {
        ImGui_ImplOpenGL3_Shutdown();
        ImGui_ImplGlfw_Shutdown();
        ImGui::DestroyContext();
    }
}

bool Window::close_requested() const { return glfwWindowShouldClose(window_); }
void Window::request_close() { glfwSetWindowShouldClose(window_, 1); }

std::vector<std::string> Window::begin_frame() {
    glfwPollEvents();
    ImGui_ImplOpenGL3_NewFrame();
    ImGui_ImplGlfw_NewFrame();
    ImGui::NewFrame();
    return std::exchange(dropped_, {});
}

void Window::swap() { glfwSwapBuffers(window_); }

std::pair<int, int> Window::size() const {
    int w = 0, h = 0;
    glfwGetWindowSize(window_, &w, &h);
    return {w, h};
}

std::string Window::imgui_ini() const {
    std::size_t n = 0;
    const char* text = ImGui::SaveIniSettingsToMemory(&n);
    return std::string(text, n);
}

}  // namespace ellipsa::viewer
