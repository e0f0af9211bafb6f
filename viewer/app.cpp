// run_viewer(): the window's life in named steps. Setup (settings, window), loading (the
// command-line files), start-up options, then per frame: the UI (viewer/frame.hpp) returns
// intents, apply() changes the state, effects are carried out, derived data is refreshed and
// uploaded, the frame is drawn; a scripted run finishes on its last frame; at the end the frame
// statistics and the settings.
#include "viewer/app.hpp"

#include <imgui.h>
#include <imgui_impl_opengl3.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <iostream>
#include <thread>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "viewer/exports_ui.hpp"
#include "viewer/desktop_dialog.hpp"
#include "viewer/file_loader.hpp"
#include "viewer/frame.hpp"
#include "viewer/gl.hpp"
#include "viewer/pattern_files.hpp"
#include "viewer/scene/settings.hpp"
#include "viewer/scripted_run.hpp"
#include "viewer/settings_file.hpp"
#include "viewer/state/apply.hpp"
#include "viewer/window.hpp"

namespace ellipsa::viewer {

namespace {
using Clock = std::chrono::steady_clock;
double ms_since(Clock::time_point t0) { return std::chrono::duration<double, std::milli>(Clock::now() - t0).count(); }

// --- Setup ---
struct Startup {
    SettingsPlace place;
    ViewerSettings settings;
    std::optional<std::string> imgui_ini;
};

// The user's settings and window layout; scripted runs (--frames) neither read nor write them.
// Every problem is said once, on stderr.
Startup read_settings(const ViewerOptions& o) {
    Startup st;
    if (!o.save_settings) return st;
    std::vector<std::string> warnings;
    st.place = settings_place(true);
    st.settings = load_settings(st.place, warnings);
    st.imgui_ini = load_imgui_ini(st.place, warnings);
    if (!st.place.problem.empty()) warnings.push_back("settings will not be saved: " + st.place.problem);
    for (const std::string& w : warnings) std::cerr << "ellipsa view: " << w << "\n";
    return st;
}

WindowRequest window_request(const ViewerOptions& o, const Startup& st) {
    WindowRequest r;
    r.context.software = o.software;
    r.context.width = o.width > 0 ? o.width : st.settings.window_width;
    r.context.height = o.height > 0 ? o.height : st.settings.window_height;
    r.context.vsync = !o.frame_stats;
    r.context.title = "ellipsa";
    r.imgui_ini = st.imgui_ini;
    return r;
}

// --- Loading ---
// The command-line files through the same background loader the UI uses, waited for so that the
// first frame shows them (Ctrl+C cancels); every error on stderr. Without a file that loads: the
// bundled examples, or the built-in demo. Returns how many of the files could not be read.
int load_start_files(const ViewerOptions& o, AppState& s, FileLoader& loader, StopSignals& stop) {
    for (std::size_t k = 0; k < o.files.size(); ++k) {
        if (k < o.file_options.size())
            loader.enqueue({o.files[k], k < o.file_joins.size() ? o.file_joins[k] : std::vector<std::string>{}, o.file_options[k],
                            k < o.file_installs.size() ? o.file_installs[k] : InstallRequest{}});
        else loader.enqueue(o.files[k], "");
    }
    int failed = 0;
    while (!loader.idle()) {
        if (stop.requested()) loader.cancel_current();
        Intents in = loader.poll();
        for (const Intent& i : in)
            if (const auto* done = std::get_if<intent::LoadFinished>(&i); done && !done->result) {
                std::cerr << "ellipsa view: " << done->result.error().format() << "\n";
                ++failed;
            }
        apply(s, std::move(in));
        std::this_thread::sleep_for(std::chrono::milliseconds(2));
    }
    Intents in = loader.poll();  // the final status (nothing being read)
    if (s.patterns.empty()) {
        std::string note;
        in.push_back(intent::AddPatterns{default_patterns(note), note});
    }
    in.push_back(intent::SelectPattern{0});
    apply(s, std::move(in));
    return failed;
}

// --- Start-up options ---
Intents start_options(const ViewerOptions& o, const AppState& s) {
    Intents in;
    ViewerSettings st = s.settings;
    if (!o.component.empty()) parse_component(o.component.c_str(), st.component);
    if (!o.color_by.empty()) parse_color_by(o.color_by, st.color_by);
    if (o.wireframe) st.wireframe = true;
    if (o.translucent) st.translucent = true;
    if (o.cut_style >= 0) st.polar_plot = o.cut_style == 0;
    st.cut_phase = o.cut_style == 2 || (o.cut_style < 0 && st.cut_phase);
    if (o.cut_components) st.cut_components = *o.cut_components;
    if (o.has_pin) st.cut_kind = 2;
    if (o.compare >= 0) in.push_back(intent::SetCompare{o.compare});  // before the colouring, which may need B
    in.push_back(intent::ChangeSettings{st});
    if (o.has_view) in.push_back(intent::SetView{o.view_azimuth_deg, o.view_elevation_deg});
    if (o.has_pin) in.push_back(intent::Pin{Direction{o.pin_theta_deg, o.pin_phi_deg}});
    if (o.diversity_panel) in.push_back(intent::ShowDiversity{true});
    if (o.band_panel) in.push_back(intent::ShowBand{true});
    if (auto t = parse_tab(o.tab)) in.push_back(intent::SelectTab{*t});
    if (!o.browse.empty()) in.push_back(intent::ShowBrowser{BrowserView::at(o.browse)});
    if (o.save_settings && !s.settings.seen_intro) in.push_back(intent::ShowIntro{true});  // first interactive run
    return in;
}

// --frequency: the first file's frequency within 0.5 % of the one asked for.
Result<std::size_t> start_frequency(double hz, const AppState& s) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return Error{"", 0, 0, "no pattern is open to choose a frequency of"};
    return find_frequency(a->set, hz, a->path.empty() ? a->set.name : a->path);
}

// --- Effects and derived data ---
// A recent-list entry: its file (whole, even with "::" in its name) and the files joined to it.
// A file no longer there goes to the loader as it is, whose message names it.
void start_recent(const Effects::Load& l, FileLoader& loader, const PrepareFile& prepare, Intents& out) {
    auto is_file = [](const std::string& p) {
        std::error_code ec;
        return std::filesystem::is_regular_file(p, ec);
    };
    const RecentEntry e = split_recent_entry(l.path, is_file);
    if (!prepare || !is_file(e.path)) {
        loader.enqueue(e.path, l.map);
        return;
    }
    auto r = prepare(e.path, l.map);  // an existing file: taken whole
    if (!r) {
        out.push_back(intent::LoadFinished{e.path, e.path, r.error()});
        return;
    }
    r->join = e.join;
    loader.enqueue(std::move(*r));
}

// Files named in the window, read as the command line reads a FILE argument when `prepare` is
// given; a name it refuses comes back as a failed load.
Intents start_loads(const Effects& fx, FileLoader& loader, const PrepareFile& prepare) {
    Intents out;
    for (const Effects::Load& l : fx.load) {
        if (l.recent) {
            start_recent(l, loader, prepare, out);
            continue;
        }
        if (!prepare) {
            loader.enqueue(l.path, l.map);
            continue;
        }
        auto r = prepare(l.path, l.map);
        if (r) loader.enqueue(std::move(*r));
        else out.push_back(intent::LoadFinished{l.path, l.path, r.error()});
    }
    if (fx.cancel_load) loader.cancel_current();
    return out;
}

// Exports asked for from the UI; their outcomes come back as intents for the next frame.
// File > Open: the desktop's dialog, or the window's own browser when it has none or it fails.
Intents start_file_dialog(const Effects& fx, DesktopDialog& dialog) {
    if (!fx.file_dialog || dialog.start(*fx.file_dialog)) return {};
    return {intent::DesktopDialogClosed{}, intent::ShowBrowser{BrowserView::at(*fx.file_dialog)}};
}

Intents run_exports(const Effects& fx, const AppState& s, const Derived& d, Window& w) {
    Intents out;
    if (fx.export_cut)
        out.push_back(intent::ExportFinished{ExportTarget::cut, export_cut_file(s, d.cut.value(), fx.export_cut->path, fx.export_cut->overwrite)});
    if (fx.export_view && is_surface_file(fx.export_view->path)) {  // the surface itself: no GL needed
        out.push_back(intent::ExportFinished{
            ExportTarget::view, export_surface_file(s, d.surface.value().mesh, fx.export_view->path, fx.export_view->overwrite)});
    } else if (fx.export_view) {
        glfwMakeContextCurrent(nullptr);  // the snapshot has its own headless context
        out.push_back(intent::ExportFinished{ExportTarget::view, export_view_file(s, fx.export_view->path, fx.export_view->overwrite)});
        w.context().make_current();
    }
    return out;
}

void upload(SceneRenderer& r, const Derived& d, DerivedChanges c) {
    if (c.surface) {
        if (d.surface.value().mesh.vertices.empty()) r.clear_surface();
        else r.set_surface(d.surface.value().mesh);
    }
    if (c.glyphs) r.set_glyphs(d.glyphs.value());
    if (c.ring) r.set_cut_ring(d.ring.value());
}

// --- Drawing ---
bool env_flag(const char* name) {
    const char* e = std::getenv(name);
    return e && *e && *e != '0';
}

// ELLIPSA_FRAME_PROFILE: one line per frame on stderr, with the GPU work finished at each stage.
struct FrameProfile {
    bool on = env_flag("ELLIPSA_FRAME_PROFILE");
    bool full_detail = env_flag("ELLIPSA_FULL_DETAIL");  // every grid line (comparisons and benchmarks)
    Clock::time_point t0, cleared, scene;
    void mark(Clock::time_point& at) {
        if (on) glFinish();
        at = Clock::now();
    }
    void print() const {
        if (!on) return;
        glFinish();
        const ImGuiIO& io = ImGui::GetIO();
        auto ms = [](Clock::time_point a, Clock::time_point b) { return std::chrono::duration<double, std::milli>(b - a).count(); };
        std::fprintf(stderr, "verts %d idx %d  cpu %.1f  scene %.1f  ui %.1f ms\n", io.MetricsRenderVertices, io.MetricsRenderIndices,
                     ms(t0, cleared), ms(cleared, scene), ms(scene, Clock::now()));
    }
};

// Clear to the panel colour (the tiled panels draw no background), the 3D view in its
// rectangle, then the UI on top.
void draw_frame(Window& w, const AppState& s, const Derived& d, const Layout& L, FrameProfile& prof) {
    ImGui::Render();
    const ImGuiIO& io = ImGui::GetIO();
    int fbw = 0, fbh = 0;
    glfwGetFramebufferSize(w.glfw(), &fbw, &fbh);
    const float sx = io.DisplaySize.x > 0 ? fbw / io.DisplaySize.x : 1, sy = io.DisplaySize.y > 0 ? fbh / io.DisplaySize.y : 1;
    glBindFramebuffer(GL_FRAMEBUFFER, 0);
    glViewport(0, 0, fbw, fbh);
    glDisable(GL_SCISSOR_TEST);
    glClearColor(panel_rgb[0], panel_rgb[1], panel_rgb[2], 1);
    glClear(GL_COLOR_BUFFER_BIT);
    prof.mark(prof.cleared);
    SceneStyle style;
    style.wireframe = s.settings.wireframe;
    style.translucent = s.settings.translucent;
    style.glyphs = s.settings.glyphs;
    style.cut_ring = d.cut.value().valid;
    style.background = {0.985f, 0.985f, 0.98f};
    style.full_detail = prof.full_detail;
    const int vx = int(L.view_pos.x * sx), vw = int(L.view_size.x * sx), vh = int(L.view_size.y * sy);
    const int vy = fbh - int((L.view_pos.y + L.view_size.y) * sy);
    w.scene().draw(s.camera, vx, vy, vw, vh, style, true);
    prof.mark(prof.scene);
    glViewport(0, 0, fbw, fbh);
    ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());
    prof.print();
}

// --- Statistics and settings ---
// --frame-stats: {"frames", "median_ms", "p95_ms"} on stdout at exit.
void print_frame_stats(std::vector<double> ms) {
    std::sort(ms.begin(), ms.end());
    auto pct = [&](double q) {
        if (ms.empty()) return 0.0;
        const double idx = q * double(ms.size() - 1);
        const std::size_t i = std::size_t(idx);
        const double f = idx - double(i);
        return i + 1 < ms.size() ? ms[i] * (1 - f) + ms[i + 1] * f : ms[i];
    };
    std::printf("{\"frames\": %zu, \"median_ms\": %.3f, \"p95_ms\": %.3f}\n", ms.size(), pct(0.5), pct(0.95));
    std::fflush(stdout);
}

// The settings with the window's size, and ImGui's layout (a folder that cannot be made was
// reported at the start).
void save_on_exit(const Startup& st, ViewerSettings settings, const Window& w) {
    if (!st.place.can_save()) return;
    const auto [width, height] = w.size();
    if (width > 0 && height > 0) {
        ViewerSettings sized = settings;
        sized.window_width = width, sized.window_height = height;
        settings = within_limits(sized, settings);
    }
    if (Status r = save_settings(st.place, settings, w.imgui_ini()); !r)
        std::cerr << "ellipsa view: settings not saved: " << r.error().format() << "\n";
}
}  // namespace

int run_viewer(const ViewerOptions& opt) {
    StopSignals stop;  // before any thread starts: Ctrl+C and SIGTERM close the window normally
    const Startup st = read_settings(opt);
    auto opened = Window::open(window_request(opt, st));
    if (!opened) {
        std::cerr << "ellipsa view: " << opened.error().format() << "\n";
        return 1;
    }
    Window& w = **opened;
    if (w.renderer().how.find("fell back") != std::string::npos) std::cerr << "ellipsa view: " << w.renderer().how << "\n";
    AppState s;
    s.settings = st.settings;
    FileLoader loader;
    DesktopDialog dialog;
    // A scripted run shows exactly the files it was given, or fails: never the examples instead.
    if (load_start_files(opt, s, loader, stop) > 0 && opt.frames > 0) return 1;
    apply(s, start_options(opt, s));
    if (opt.frequency_hz) {
        const Result<std::size_t> f = start_frequency(*opt.frequency_hz, s);
        if (!f) {
            std::cerr << "ellipsa view: --frequency: " << f.error().format() << "\n";
            return 1;
        }
        apply(s, Intents{intent::SetFrequency{*f}});
    }
    Derived d;
    upload(w.scene(), d, refresh(d, s));

    const ScriptedRun script(opt);
    FrameProfile profile;
    std::vector<double> frame_ms;
    Intents carried;  // outcomes of last frame's exports
    int exit_code = 0;
    for (int frame = 0;; ++frame) {
        profile.t0 = Clock::now();
        script.place_pointer(w);
        Intents in = std::exchange(carried, {});
        append(in, script.frame_intents(s));
        if (std::vector<std::string> dropped = w.begin_frame(); !dropped.empty()) in.push_back(intent::OpenFiles{std::move(dropped), ""});
        append(in, loader.poll());
        append(in, dialog.poll());
        Layout layout;
        append(in, draw_ui(s, d, w.renderer(), layout));
        const Effects fx = apply(s, std::move(in));
        Intents later = start_loads(fx, loader, opt.prepare);  // refused names, a dialog that failed
        append(later, start_file_dialog(fx, dialog));
        upload(w.scene(), d, refresh(d, s, ImGui::IsAnyItemActive()));
        draw_view_overlay(s, d, layout, w.fonts(), w.renderer());
        draw_frame(w, s, d, layout, profile);
        const bool last = script.is_last(frame);
        if (last) exit_code = script.finish(s, d, w);
        w.swap();
        carried = run_exports(fx, s, d, w);
        append(carried, std::move(later));
        frame_ms.push_back(ms_since(profile.t0));
        if (last || s.quit || w.close_requested() || stop.requested()) break;
    }
    if (opt.frame_stats) print_frame_stats(frame_ms);
    save_on_exit(st, s.settings, w);
    return exit_code;
}

}  // namespace ellipsa::viewer
