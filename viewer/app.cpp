#include "viewer/app.hpp"

#include <imgui.h>
#include <imgui_impl_glfw.h>
#include <imgui_impl_opengl3.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <csignal>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <filesystem>
#include <iostream>
#include <thread>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "io/atomic_write.hpp"
#include "pattern/peak.hpp"
#include "viewer/app_state.hpp"
#include "viewer/cut_export_ui.hpp"
#include "viewer/gl.hpp"
#include "viewer/overlay.hpp"
#include "viewer/panel_diversity.hpp"
#include "viewer/panels.hpp"
#include "viewer/pattern_files.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene_renderer.hpp"
#include "viewer/settings_file.hpp"
#include "viewer/snapshot.hpp"

namespace ellipsa::viewer {

std::size_t AppState::freq_for(const LoadedPattern& p) const {
    const LoadedPattern* a = active_pattern();
    if (!a || &p == a || a->set.frequencies.empty()) return std::min(freq, p.set.frequencies.empty() ? 0 : p.set.frequencies.size() - 1);
    return p.set.nearest_frequency(a->set.frequencies[freq].frequency_hz);
}

const PatternSummary* AppState::summary() {
    LoadedPattern* a = active >= 0 && active < int(patterns.size()) ? &patterns[std::size_t(active)] : nullptr;
    if (!a || freq >= a->set.frequencies.size()) return nullptr;
    if (a->summaries.size() != a->set.frequencies.size()) a->summaries.assign(a->set.frequencies.size(), PatternSummary{});
    PatternSummary& sm = a->summaries[freq];
    if (sm.frequency_hz == 0 && sm.peak.value == 0) {
        sm = summarize(a->set, freq);
        if (sm.peak.value == 0) sm.peak.value = -1;  // computed, all-zero pattern
    }
    return &sm;
}

namespace {
std::vector<std::string> g_dropped;
// Ctrl+C or a polite kill closes the window normally, so the settings are still saved.
volatile std::sig_atomic_t g_stop = 0;
extern "C" void on_stop_signal(int) { g_stop = 1; }  // filled by the GLFW drop callback, drained each frame

double ms_since(std::chrono::steady_clock::time_point t0) {
    return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
}

// Take a finished read into the pattern list (or show its error; nothing else changes).
void accept_loaded(AppState& s, const std::string& f, Result<FarFieldSet> r) {
    {
        if (!r) {
            s.load_error = r.error().format();  // the loaded patterns and the view stay as they were
            return;
        }
        s.load_error.clear();
        LoadedPattern p;
        p.set = std::move(*r);
        p.path = f;
        s.patterns.push_back(std::move(p));
        s.settings.remember_file(std::filesystem::absolute(f).string());
        s.active = int(s.patterns.size()) - 1;
        s.freq = 0;
        s.note.clear();
        s.mesh_dirty = s.cut_dirty = true;
        ++s.generation;
    }
}

// Files asked for from the UI: read in the background, one at a time.
void queue_files(AppState& s, const std::vector<std::string>& files, const std::string& map = "") {
    for (const std::string& f : files) s.to_load.emplace_back(f, map);
}

void pump_background_load(AppState& s) {
    if (s.loading && s.loading->done) {
        s.loading->worker.join();
        BackgroundLoad& l = *s.loading;
        if (l.cancel)
            s.load_error = l.path + ": loading cancelled";
        else if (l.result)
            accept_loaded(s, l.path, std::move(*l.result));
        s.loading.reset();
    }
    if (!s.loading && !s.to_load.empty()) {
        auto l = std::make_unique<BackgroundLoad>();
        l->path = s.to_load.front().first;
        l->map = s.to_load.front().second;
        s.to_load.pop_front();
        BackgroundLoad* raw = l.get();
        l->worker = std::thread([raw] {
            auto r = load_pattern_file(raw->path, raw->map, [raw](double f) {
                raw->progress = f;
                return !raw->cancel.load();
            });
            raw->result.emplace(std::move(r));
            raw->done = true;
        });
        s.loading = std::move(l);
    }
}

// Make the shown component and colouring ones the active pattern can give.
void sanitise_choices(AppState& s) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return;
    if (!unavailable_reason(a->set, s.settings.component).empty()) s.settings.component = Component::total;
    if (!unavailable_reason(a->set, s.settings.color_by).empty()) s.settings.color_by = ColorBy::component;
    if (s.settings.color_by == ColorBy::difference && !s.compare_pattern()) s.settings.color_by = ColorBy::component;
    if (s.freq >= a->set.frequencies.size()) s.freq = 0;
}

void rebuild_surface(AppState& s, SceneRenderer& r) {
    sanitise_choices(s);
    const LoadedPattern* a = s.active_pattern();
    if (!a) {
        r.clear_surface();
        s.mesh = {};
        return;
    }
    const auto t0 = std::chrono::steady_clock::now();
    SurfaceOptions o;
    o.component = s.settings.component;
    o.color_by = s.settings.color_by;
    o.range_db = s.settings.range_db;
    o.gain_map = s.settings.gain_map;
    const LoadedPattern* b = s.compare_pattern();
    auto m = build_surface(a->set, s.freq, o, b ? &b->set : nullptr, b ? s.freq_for(*b) : 0);
    if (!m) {
        s.mesh_error = m.error().message;
        return;  // keep the previous surface
    }
    s.mesh_error.clear();
    s.mesh = std::move(*m);
    r.set_surface(s.mesh);
    s.mesh_build_ms = ms_since(t0);
    s.glyphs_dirty = true;
    s.cut_dirty = true;
}

void rebuild_cut(AppState& s, SceneRenderer& r) {
    s.cut = CutData{};
    const LoadedPattern* a = s.active_pattern();
    const std::optional<CutSpec> spec = cut_spec_for(s.settings, s.pinned ? std::optional(s.pinned->theta_deg) : std::nullopt,
                                                     s.pinned ? std::optional(s.pinned->phi_deg) : std::nullopt);
    if (!a || !spec) {
        r.set_cut_ring(LineSet{});
        return;
    }
    const LoadedPattern* b = s.compare_pattern();
    s.cut = build_cut_data(a->set, s.freq, b ? &b->set : nullptr, b ? s.freq_for(*b) : 0, *spec, s.settings.cut_components);
    r.set_cut_ring(s.cut.valid ? build_cut_ring(a->set, s.mesh, s.cut.theta_deg, s.cut.phi_deg, {0.10f, 0.10f, 0.12f}) : LineSet{});
}

struct Layout {
    ImVec2 menu_end;  // y of the menu bar bottom in .y
    ImVec2 left_pos, left_size, right_pos, right_size, cut_pos, cut_size, view_pos, view_size;
};

Layout compute_layout(const AppState& s, ImVec2 display, float menu_h) {
    Layout L;
    const float lw = std::min(s.settings.left_panel_width, display.x * 0.35f);
    const float rw = std::min(s.settings.right_panel_width, display.x * 0.35f);
    const float ch = std::min(s.settings.cut_panel_height, (display.y - menu_h) * 0.5f);
    L.left_pos = ImVec2(0, menu_h);
    L.left_size = ImVec2(lw, display.y - menu_h);
    L.right_pos = ImVec2(display.x - rw, menu_h);
    L.right_size = ImVec2(rw, display.y - menu_h);
    L.cut_pos = ImVec2(lw, display.y - ch);
    L.cut_size = ImVec2(display.x - lw - rw, ch);
    L.view_pos = ImVec2(lw, menu_h);
    L.view_size = ImVec2(display.x - lw - rw, display.y - menu_h - ch);
    return L;
}

bool begin_panel(const char* name, ImVec2 pos, ImVec2 size) {
    ImGui::SetNextWindowPos(pos, ImGuiCond_Always);
    ImGui::SetNextWindowSize(size, ImGuiCond_Always);
    ImGui::SetNextWindowBgAlpha(0.0f);  // the framebuffer is cleared to the panel colour
    return ImGui::Begin(name, nullptr, ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoCollapse |
                                           ImGuiWindowFlags_NoBringToFrontOnFocus);
}

void handle_keys(AppState& s, Intents& in) {
    ImGuiIO& io = ImGui::GetIO();
    if (io.WantTextInput) return;
    auto pressed = [](int key) { return ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey(key)), false); };
    auto pressed_glfw = [](int key) { return ImGui::IsKeyPressed(key, false); };
    if (pressed_glfw(GLFW_KEY_F1) || (io.KeyShift && pressed_glfw(GLFW_KEY_SLASH))) s.show_help = !s.show_help;
    if (pressed(ImGuiKey_Escape)) {
        if (s.show_help) s.show_help = false;
        else if (s.pinned) s.pinned.reset(), in.recut = true;
    }
    const OrbitCamera::Preset presets[] = {OrbitCamera::Preset::px, OrbitCamera::Preset::nx, OrbitCamera::Preset::py,
                                           OrbitCamera::Preset::ny, OrbitCamera::Preset::pz, OrbitCamera::Preset::nz};
    for (int k = 0; k < 6; ++k)
        if (pressed_glfw(GLFW_KEY_1 + k)) s.camera.look_from(presets[k]);
    if (io.KeyCtrl) {
        if (pressed_glfw(GLFW_KEY_E)) in.export_view = true;
        return;
    }
    if (pressed_glfw(GLFW_KEY_R)) in.reset_view = true;
    if (pressed_glfw(GLFW_KEY_W)) s.settings.wireframe = !s.settings.wireframe;
    if (pressed_glfw(GLFW_KEY_T)) s.settings.translucent = !s.settings.translucent;
    if (pressed_glfw(GLFW_KEY_G)) s.settings.glyphs = !s.settings.glyphs, in.rebuild_glyphs = true;
    if (pressed_glfw(GLFW_KEY_P)) s.settings.polar_plot = !s.settings.polar_plot;
    const LoadedPattern* a = s.active_pattern();
    if (!a) return;
    if (pressed_glfw(GLFW_KEY_C)) {
        // Step through the components the data can give.
        const int n = int(std::size(all_components));
        int i = int(s.settings.component);
        for (int k = 0; k < n; ++k) {
            i = (i + (io.KeyShift ? n - 1 : 1)) % n;
            if (unavailable_reason(a->set, all_components[i]).empty()) break;
        }
        s.settings.component = all_components[i];
        in.rebuild_surface = in.recut = true;
    }
    if (pressed_glfw(GLFW_KEY_V)) {
        const int n = int(std::size(all_color_by));
        int i = int(s.settings.color_by);
        for (int k = 0; k < n; ++k) {
            i = (i + 1) % n;
            const ColorBy c = all_color_by[i];
            if (unavailable_reason(a->set, c).empty() && (c != ColorBy::difference || s.compare_pattern())) break;
        }
        s.settings.color_by = all_color_by[i];
        in.rebuild_surface = true;
    }
    if (pressed_glfw(GLFW_KEY_PAGE_DOWN) && s.freq + 1 < a->set.frequencies.size()) ++s.freq, in.rebuild_surface = in.recut = true;
    if (pressed_glfw(GLFW_KEY_PAGE_UP) && s.freq > 0) --s.freq, in.rebuild_surface = in.recut = true;
    if (pressed(ImGuiKey_Tab) && s.patterns.size() > 1) {
        s.active = (s.active + 1) % int(s.patterns.size());
        if (s.compare == s.active) s.compare = -1;
        s.freq = 0;
        in.rebuild_surface = in.recut = true;
    }
}

std::string export_name() {
    char b[64];
    std::time_t t = std::time(nullptr);
    std::strftime(b, sizeof b, "ellipsa-view-%Y%m%d-%H%M%S.png", std::localtime(&t));
    return b;
}
}  // namespace

int run_viewer(const ViewerOptions& opt) {
    std::signal(SIGINT, on_stop_signal);
    std::signal(SIGTERM, on_stop_signal);
    AppState s;
    DiversityPanelState diversity;  // the diversity panel (viewer/panel_diversity.hpp)
    diversity.open = opt.diversity_panel;
    // Scripted runs (--frames) neither read nor write the user's settings.
    std::vector<std::string> warnings;
    SettingsPlace place;
    if (opt.save_settings) {
        place = settings_place(true);
        s.settings = load_settings(place, warnings);
        if (!place.problem.empty()) warnings.push_back("settings will not be saved: " + place.problem);
    }
    for (const std::string& w : warnings) std::cerr << "ellipsa view: " << w << "\n";
    warnings.clear();

    ContextRequest req;
    req.software = opt.software;
    req.width = opt.width > 0 ? opt.width : s.settings.window_width;
    req.height = opt.height > 0 ? opt.height : s.settings.window_height;
    req.vsync = !opt.frame_stats;
    req.title = "ellipsa";
    auto ctx = create_window_context(req);
    if (!ctx) {
        std::cerr << "ellipsa view: " << ctx.error().format() << "\n";
        return 1;
    }
    RenderContext& rc = **ctx;
    s.renderer = rc.info();
    if (s.renderer.how.find("fell back") != std::string::npos) std::cerr << "ellipsa view: " << s.renderer.how << "\n";
    GLFWwindow* win = rc.window();
    glfwSetDropCallback(win, [](GLFWwindow*, int n, const char** paths) {
        for (int i = 0; i < n; ++i) g_dropped.emplace_back(paths[i]);
    });

    IMGUI_CHECKVERSION();
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    // The viewer reads and writes imgui.ini itself: bounded, regular files only, saved at exit.
    io.IniFilename = nullptr;
    if (opt.save_settings)
        if (const std::optional<std::string> ini = load_imgui_ini(place, warnings)) ImGui::LoadIniSettingsFromMemory(ini->data(), ini->size());
    for (const std::string& w : warnings) std::cerr << "ellipsa view: " << w << "\n";
    float xscale = 1, yscale = 1;
    glfwGetWindowContentScale(win, &xscale, &yscale);
    s.fonts = setup_ui_style(std::clamp(xscale, 1.0f, 3.0f));
    ImGui_ImplGlfw_InitForOpenGL(win, true);
    ImGui_ImplOpenGL3_Init("#version 330");

    SceneRenderer scene;
    if (Status st = scene.init(); !st) {
        std::cerr << "ellipsa view: " << st.error().format() << "\n";
        return 1;
    }
    scene.set_axes(build_axes(1.3));

    // Patterns: the command line, or the bundled example (or the built-in demo).
    if (!opt.files.empty()) {
        // Through the same background reader the UI uses, waiting here so the first frame shows them.
        queue_files(s, opt.files);
        while (s.loading || !s.to_load.empty()) {
            pump_background_load(s);
            if (!s.load_error.empty()) {
                std::cerr << "ellipsa view: " << s.load_error << "\n";
                s.load_error_printed = s.load_error;
                s.load_error.clear();
            }
            std::this_thread::sleep_for(std::chrono::milliseconds(2));
        }
        s.load_error = s.load_error_printed;
        if (s.patterns.empty()) {
            std::string note;
            for (FarFieldSet& f : default_patterns(note)) s.patterns.push_back({std::move(f), "", {}});
            s.note = note;
        }
        s.active = 0;
    } else {
        std::string note;
        for (FarFieldSet& f : default_patterns(note)) s.patterns.push_back({std::move(f), "", {}});
        s.note = note;
    }

    // Starting state asked for on the command line.
    if (!opt.component.empty()) parse_component(opt.component.c_str(), s.settings.component);
    if (!opt.color_by.empty()) parse_color_by(opt.color_by, s.settings.color_by);
    if (opt.compare >= 0 && opt.compare < int(s.patterns.size()) && opt.compare != s.active) s.compare = opt.compare;
    if (opt.has_view) s.camera.azimuth_deg = opt.view_azimuth_deg, s.camera.elevation_deg = std::clamp(opt.view_elevation_deg, -89.5, 89.5);
    if (opt.wireframe) s.settings.wireframe = true;
    if (opt.translucent) s.settings.translucent = true;
    if (opt.cut_style >= 0) s.settings.polar_plot = opt.cut_style == 0;
    if (opt.has_pin) {
        Pick p;
        p.theta_deg = opt.pin_theta_deg;
        p.phi_deg = wrap360(opt.pin_phi_deg);
        s.pinned = p;  // its point on the surface is filled in once the surface exists
        s.settings.cut_kind = 2;
    }

    s.show_intro = opt.save_settings && !s.settings.seen_intro;  // first interactive run

    std::vector<double> frame_ms;
    bool pressing = false;
    ImVec2 press_pos;
    int frame = 0;
    int exit_code = 0;
    while (!glfwWindowShouldClose(win) && (!g_stop || frame == 0)) {
        const auto t0 = std::chrono::steady_clock::now();
        if (opt.has_cursor) glfwSetCursorPos(win, opt.cursor_x, opt.cursor_y);
        glfwPollEvents();
        if (!g_dropped.empty()) {
            queue_files(s, g_dropped);
            g_dropped.clear();
        }
        ImGui_ImplOpenGL3_NewFrame();
        ImGui_ImplGlfw_NewFrame();
        ImGui::NewFrame();

        Intents in;
        // Menu bar.
        float menu_h = 0;
        if (ImGui::BeginMainMenuBar()) {
            if (ImGui::BeginMenu("File")) {
                for (const std::string& f : s.settings.recent_files)
                    if (ImGui::MenuItem(f.c_str())) in.open.push_back(f);
                if (s.settings.recent_files.empty()) ImGui::MenuItem("(no recent files)", nullptr, false, false);
                ImGui::Separator();
                if (ImGui::MenuItem("Export 3D view as PNG", "Ctrl+E")) in.export_view = true;
                if (ImGui::MenuItem("Quit")) glfwSetWindowShouldClose(win, 1);
                ImGui::EndMenu();
            }
            if (ImGui::BeginMenu("View")) {
                ImGui::MenuItem("Wireframe", "W", &s.settings.wireframe);
                ImGui::MenuItem("Translucent surface", "T", &s.settings.translucent);
                if (ImGui::MenuItem("Polarisation ellipses", "G", &s.settings.glyphs)) in.rebuild_glyphs = true;
                ImGui::MenuItem("Polar cut plot", "P", &s.settings.polar_plot);
                ImGui::MenuItem("Diversity (MEG, ECC, orientation)", nullptr, &diversity.open);
                if (ImGui::MenuItem("Reset view", "R")) in.reset_view = true;
                ImGui::Separator();
                ImGui::SliderFloat("left panel", &s.settings.left_panel_width, 200, 600, "%.0f px");
                ImGui::SliderFloat("right panel", &s.settings.right_panel_width, 200, 600, "%.0f px");
                ImGui::SliderFloat("cut panel", &s.settings.cut_panel_height, 150, 700, "%.0f px");
                ImGui::EndMenu();
            }
            if (ImGui::BeginMenu("Help")) {
                if (ImGui::MenuItem("Keys and mouse", "F1")) s.show_help = true;
                if (ImGui::MenuItem("What the panels show")) s.show_intro = true;
                ImGui::EndMenu();
            }
            const std::string r = "GL: " + s.renderer.renderer + (s.renderer.software ? "  (Mesa software)" : "  (hardware)");
            ImGui::SameLine(ImGui::GetWindowWidth() - ImGui::CalcTextSize(r.c_str()).x - 16);
            ImGui::TextDisabled("%s", r.c_str());
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", s.renderer.line().c_str());
            menu_h = ImGui::GetWindowSize().y;
            ImGui::EndMainMenuBar();
        }
        const Layout L = compute_layout(s, io.DisplaySize, menu_h);
        handle_keys(s, in);

        if (begin_panel("Patterns", L.left_pos, ImVec2(L.left_size.x, L.left_size.y * 0.52f))) in.merge(draw_patterns_panel(s));
        ImGui::End();
        if (begin_panel("Surface", ImVec2(L.left_pos.x, L.left_pos.y + L.left_size.y * 0.52f),
                        ImVec2(L.left_size.x, L.left_size.y * 0.48f)))
            in.merge(draw_surface_panel(s));
        ImGui::End();
        if (begin_panel("Probe", L.right_pos, ImVec2(L.right_size.x, L.right_size.y * 0.56f))) draw_probe_panel(s);
        ImGui::End();
        if (begin_panel("Polarisation", ImVec2(L.right_pos.x, L.right_pos.y + L.right_size.y * 0.56f),
                        ImVec2(L.right_size.x, L.right_size.y * 0.44f)))
            in.merge(draw_polarisation_panel(s));
        ImGui::End();
        if (begin_panel("Cut", L.cut_pos, L.cut_size)) in.merge(draw_cut_panel(s));
        ImGui::End();
        draw_diversity_panel(s, diversity);
        draw_help_overlay(s);
        draw_intro_overlay(s);

        // Apply intents.
        if (!in.open.empty()) queue_files(s, in.open, in.open_map);
        if (in.cancel_load && s.loading) s.loading->cancel = true;
        pump_background_load(s);
        if (in.close >= 0 && in.close < int(s.patterns.size()) && s.patterns.size() > 1) {
            s.patterns.erase(s.patterns.begin() + in.close);
            ++s.generation;
            if (s.compare == in.close) s.compare = -1;
            else if (s.compare > in.close) --s.compare;
            if (s.active >= in.close && s.active > 0) --s.active;
            s.freq = 0;
            s.hover.reset();
            s.pinned.reset();
            in.rebuild_surface = in.recut = true;
        }
        if (in.reset_view) s.camera.reset();
        if (!in.export_cut.empty()) s.cut_export_message = export_current_cut(s, in.export_cut);
        if (in.rebuild_surface) s.mesh_dirty = true;
        if (in.recut) s.cut_dirty = true;
        if (in.rebuild_glyphs) s.glyphs_dirty = true;
        if (s.mesh_dirty) {
            rebuild_surface(s, scene);
            s.mesh_dirty = false;
            if (s.pinned && s.active_pattern()) {
                const double r = surface_radius(s.active_pattern()->set, s.mesh, s.pinned->theta_deg, s.pinned->phi_deg);
                const Vec3 d = direction(s.pinned->theta_deg * deg, s.pinned->phi_deg * deg);
                s.pinned->point = glm::dvec3(r * d.x, r * d.y, r * d.z);
            }
        }
        if (s.glyphs_dirty) {
            const LoadedPattern* a = s.active_pattern();
            GlyphOptions g;
            g.spacing_deg = s.settings.glyph_spacing_deg;
            scene.set_glyphs(a && s.settings.glyphs ? build_glyphs(a->set, s.freq, s.mesh, g) : LineSet{});
            s.glyphs_dirty = false;
        }
        if (s.cut_dirty) {
            rebuild_cut(s, scene);
            s.cut_dirty = false;
        }

        // Mouse in the 3D view.
        const ImVec2 mp = io.MousePos;
        const bool in_view = mp.x >= L.view_pos.x && mp.y >= L.view_pos.y && mp.x < L.view_pos.x + L.view_size.x &&
                             mp.y < L.view_pos.y + L.view_size.y && !io.WantCaptureMouse;
        if (in_view) {
            if (ImGui::IsMouseDoubleClicked(0)) s.camera.reset();
            if (io.MouseWheel != 0) s.camera.zoom(io.MouseWheel);
            if (ImGui::IsMouseClicked(0)) pressing = true, press_pos = mp;
        }
        if (pressing && ImGui::IsMouseDown(0) && (io.MouseDelta.x != 0 || io.MouseDelta.y != 0))
            s.camera.orbit(io.MouseDelta.x, io.MouseDelta.y);
        if (pressing && ImGui::IsMouseReleased(0)) {
            pressing = false;
            const float dx = mp.x - press_pos.x, dy = mp.y - press_pos.y;
            if (dx * dx + dy * dy < 9 && in_view && s.hover) {
                s.pinned = s.hover;
                if (s.settings.cut_kind == 2) s.cut_dirty = true;
            }
        }
        if (in_view && !ImGui::IsMouseDown(0)) {
            const Ray ray = ray_through_pixel(s.camera, mp.x - L.view_pos.x, mp.y - L.view_pos.y, L.view_size.x, L.view_size.y);
            s.hover = pick_direction(s.mesh, ray);
        } else if (!in_view) {
            s.hover.reset();
        }

        // Overlays on the 3D view.
        ImDrawList* bg = ImGui::GetBackgroundDrawList();
        if (const LoadedPattern* a = s.active_pattern()) {
            const ImU32 ink = IM_COL32(34, 38, 46, 255), muted = IM_COL32(95, 100, 108, 255);
            std::string title = a->set.name;
            if (const LoadedPattern* b = s.compare_pattern(); b && s.settings.color_by == ColorBy::difference)
                title += "  minus  " + b->set.name;
            bg->AddText(s.fonts.title, s.fonts.title->FontSize, ImVec2(L.view_pos.x + 12, L.view_pos.y + 8), ink, title.c_str());
            char line[200];
            std::snprintf(line, sizeof line, "radius: %s, peak %.2f %s, range %g dB", label_of(s.settings.component),
                          s.mesh.peak_db, s.mesh.unit.c_str(), s.settings.range_db);
            bg->AddText(s.fonts.small, s.fonts.small->FontSize, ImVec2(L.view_pos.x + 12, L.view_pos.y + 32), muted, line);
            if (!s.mesh_error.empty())
                bg->AddText(s.fonts.body, s.fonts.body->FontSize, ImVec2(L.view_pos.x + 12, L.view_pos.y + 52),
                            IM_COL32(150, 40, 20, 255), s.mesh_error.c_str());
            const float bh = std::min(L.view_size.y * 0.55f, 320.0f);
            draw_color_bar(bg, ImVec2(L.view_pos.x + L.view_size.x - 64, L.view_pos.y + (L.view_size.y - bh) * 0.5f + 10),
                           ImVec2(16, bh), s.mesh.bar, s.fonts.small, s.fonts.small);
            draw_axis_labels(bg, s.camera, L.view_pos, L.view_size, 1.3, s.fonts.small);
            const std::string rl = "OpenGL: " + s.renderer.renderer + (s.renderer.software ? ", Mesa software" : ", hardware");
            bg->AddText(s.fonts.small, s.fonts.small->FontSize,
                        ImVec2(L.view_pos.x + 12, L.view_pos.y + L.view_size.y - s.fonts.small->FontSize - 6), muted, rl.c_str());
            auto mark = [&](const Pick& p, ImU32 col) {
                Projected q = project(s.camera, p.point, L.view_size.x, L.view_size.y);
                if (q.visible) bg->AddCircle(ImVec2(L.view_pos.x + float(q.x), L.view_pos.y + float(q.y)), 6, col, 16, 2.0f);
            };
            if (s.hover) mark(*s.hover, IM_COL32(255, 255, 255, 230));
            if (s.pinned) mark(*s.pinned, IM_COL32(20, 20, 20, 255));
        }
        ImGui::Render();

        // Draw: clear, the 3D view in its rectangle, then the UI on top.
        int fbw = 0, fbh = 0;
        glfwGetFramebufferSize(win, &fbw, &fbh);
        const float sx = io.DisplaySize.x > 0 ? fbw / io.DisplaySize.x : 1, sy = io.DisplaySize.y > 0 ? fbh / io.DisplaySize.y : 1;
        glBindFramebuffer(GL_FRAMEBUFFER, 0);
        glViewport(0, 0, fbw, fbh);
        // Clear to the panel colour: the tiled panels draw no background of their own.
        glDisable(GL_SCISSOR_TEST);
        glClearColor(panel_rgb[0], panel_rgb[1], panel_rgb[2], 1);
        glClear(GL_COLOR_BUFFER_BIT);
        SceneStyle style;
        style.wireframe = s.settings.wireframe;
        style.translucent = s.settings.translucent;
        style.glyphs = s.settings.glyphs;
        style.cut_ring = s.cut.valid;
        style.background = {0.985f, 0.985f, 0.98f};
        const int vx = int(L.view_pos.x * sx), vw = int(L.view_size.x * sx), vh = int(L.view_size.y * sy);
        const int vy = fbh - int((L.view_pos.y + L.view_size.y) * sy);
        static const bool profile = std::getenv("ELLIPSA_FRAME_PROFILE") != nullptr;
        auto tp0 = std::chrono::steady_clock::now();
        if (profile) glFinish();
        auto tp1 = std::chrono::steady_clock::now();
        scene.draw(s.camera, vx, vy, vw, vh, style, true);
        if (profile) glFinish();
        auto tp2 = std::chrono::steady_clock::now();
        glViewport(0, 0, fbw, fbh);
        ImGui_ImplOpenGL3_RenderDrawData(ImGui::GetDrawData());
        if (profile) {
            glFinish();
            std::fprintf(stderr, "verts %d idx %d  cpu %.1f  clear %.1f  scene %.1f  ui %.1f ms\n", io.MetricsRenderVertices, io.MetricsRenderIndices, std::chrono::duration<double, std::milli>(tp0 - t0).count(),
                         std::chrono::duration<double, std::milli>(tp1 - tp0).count(), std::chrono::duration<double, std::milli>(tp2 - tp1).count(),
                         ms_since(tp2));
        }

        ++frame;
        const bool last = opt.frames > 0 && frame >= opt.frames;
        if (last && !opt.export_cut.empty()) {
            const std::string msg = export_current_cut(s, opt.export_cut, opt.force);
            if (msg.rfind("Wrote", 0) != 0) {
                std::cerr << "ellipsa view: " << msg << "\n";
                exit_code = 1;
            }
        }
        if (last && !opt.screenshot.empty()) {
            std::vector<std::uint8_t> px(std::size_t(fbw) * fbh * 4);
            glPixelStorei(GL_PACK_ALIGNMENT, 1);
            glReadBuffer(GL_BACK);
            glReadPixels(0, 0, fbw, fbh, GL_RGBA, GL_UNSIGNED_BYTE, px.data());
            std::vector<std::uint8_t> flipped(px.size());
            const std::size_t rowb = std::size_t(fbw) * 4;
            for (int y = 0; y < fbh; ++y) std::copy_n(px.data() + std::size_t(fbh - 1 - y) * rowb, rowb, flipped.data() + std::size_t(y) * rowb);
            for (std::size_t i = 3; i < flipped.size(); i += 4) flipped[i] = 255;
            Status st = io::write_file_atomically(opt.screenshot, encode_png(flipped, fbw, fbh), opt.force);
            if (!st) {
                std::cerr << "ellipsa view: " << st.error().format() << "\n";
                exit_code = 1;
            }
        }
        glfwSwapBuffers(win);

        if (last && !opt.export_view.empty()) in.export_view = true;
        if (in.export_view) {
            // Same code path as `ellipsa render`, through a headless context of its own.
            const LoadedPattern* a = s.active_pattern();
            if (a) {
                SnapshotOptions so;
                so.component = s.settings.component;
                so.color_by = s.settings.color_by;
                so.gain_map = s.settings.gain_map;
                so.view_azimuth_deg = s.camera.azimuth_deg;
                so.view_elevation_deg = s.camera.elevation_deg;
                so.frequency_index = s.freq;
                so.range_db = s.settings.range_db;
                so.glyphs = s.settings.glyphs;
                const LoadedPattern* b = s.compare_pattern();
                so.compare = b ? &b->set : nullptr;
                so.compare_frequency_index = b ? s.freq_for(*b) : 0;
                const std::string path = opt.export_view.empty() ? export_name() : opt.export_view;
                // GLVND lets a thread hold only one window-system API's context at a time: release
                // the window's GLX context while the headless EGL context works, then take it back.
                glfwMakeContextCurrent(nullptr);
                Status st = render_snapshot_png(a->set, so, path, !opt.export_view.empty() && opt.force);
                s.export_message = st ? "Wrote " + std::filesystem::absolute(path).string() : "Export failed: " + st.error().format();
                if (!st && !opt.export_view.empty()) {
                    std::cerr << "ellipsa view: " << s.export_message << "\n";
                    exit_code = 1;
                }
            }
            rc.make_current();
        }
        frame_ms.push_back(ms_since(t0));
        if (last) break;
    }

    if (opt.frame_stats) {
        std::vector<double> v = frame_ms;
        std::sort(v.begin(), v.end());
        auto pct = [&](double q) {
            if (v.empty()) return 0.0;
            const double idx = q * double(v.size() - 1);
            const std::size_t i = std::size_t(idx);
            const double f = idx - double(i);
            return i + 1 < v.size() ? v[i] * (1 - f) + v[i + 1] * f : v[i];
        };
        std::printf("{\"frames\": %zu, \"median_ms\": %.3f, \"p95_ms\": %.3f}\n", frame_ms.size(), pct(0.5), pct(0.95));
        std::fflush(stdout);
    }
    if (opt.save_settings && place.can_save()) {  // (a folder that cannot be made was reported at start)
        int w = 0, h = 0;
        glfwGetWindowSize(win, &w, &h);
        if (w > 0 && h > 0) s.settings.window_width = w, s.settings.window_height = h;
        std::size_t ini_size = 0;
        const char* ini = ImGui::SaveIniSettingsToMemory(&ini_size);
        if (Status st = save_settings(place, s.settings, std::string(ini, ini_size)); !st)
            std::cerr << "ellipsa view: settings not saved: " << st.error().format() << "\n";
    }
    ImGui_ImplOpenGL3_Shutdown();
    ImGui_ImplGlfw_Shutdown();
    ImGui::DestroyContext();
    return exit_code;
}

}  // namespace ellipsa::viewer
