#include "viewer/frame.hpp"

#include <algorithm>
#include <cstdio>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "viewer/exports_ui.hpp"
#include "viewer/overlay.hpp"
#include "viewer/panels.hpp"
#include "viewer/scene/picking.hpp"

namespace ellipsa::viewer {

Layout compute_layout(const ViewerSettings& s, ImVec2 display, float menu_h) {
    Layout L;
    // Side panels take at most 28 % of the width each, so a small window keeps room for the view and the cut.
    const float lw = std::min(s.left_panel_width, display.x * 0.28f);
    const float rw = std::min(s.right_panel_width, display.x * 0.28f);
    const float ch = std::min(s.cut_panel_height, (display.y - menu_h) * 0.5f);
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

namespace {
void file_menu(const AppState& s, Intents& in) {
    if (!ImGui::BeginMenu("File")) return;
    for (const std::string& f : s.settings.recent_files)
        if (ImGui::MenuItem(f.c_str())) in.push_back(intent::OpenFiles{{f}, ""});
    if (s.settings.recent_files.empty()) ImGui::MenuItem("(no recent files)", nullptr, false, false);
    ImGui::Separator();
    if (ImGui::MenuItem("Export 3D view as PNG", "Ctrl+E")) in.push_back(intent::ExportView{timestamped_name("ellipsa-view", "png"), false});
    if (ImGui::MenuItem("Export 3D surface as glTF (.glb)")) in.push_back(intent::ExportView{timestamped_name("ellipsa-surface", "glb"), false});
    if (ImGui::MenuItem("Export 3D surface as PLY")) in.push_back(intent::ExportView{timestamped_name("ellipsa-surface", "ply"), false});
    if (ImGui::MenuItem("Quit")) in.push_back(intent::Quit{});
    ImGui::EndMenu();
}

void view_menu(const AppState& s, Intents& in) {
    if (!ImGui::BeginMenu("View")) return;
    ViewerSettings st = s.settings;
    ImGui::MenuItem("Wireframe", "W", &st.wireframe);
    ImGui::MenuItem("Translucent surface", "T", &st.translucent);
    ImGui::MenuItem("Polarisation ellipses", "G", &st.glyphs);
    ImGui::MenuItem("Polar cut plot", "P", &st.polar_plot);
    if (ImGui::MenuItem("Diversity (MEG, ECC, orientation)", nullptr, s.diversity_open)) in.push_back(intent::ShowDiversity{!s.diversity_open});
    if (ImGui::MenuItem("Figures against frequency", nullptr, s.band_open)) in.push_back(intent::ShowBand{!s.band_open});
    if (ImGui::MenuItem("2D map (equal-area)", nullptr, s.map_open)) in.push_back(intent::ShowMap{!s.map_open});
    if (ImGui::MenuItem("Reset view", "R")) in.push_back(intent::ResetView{});
    ImGui::Separator();
    const ImGuiSliderFlags clamp = ImGuiSliderFlags_AlwaysClamp;
    ImGui::SliderFloat("left panel", &st.left_panel_width, 200, 600, "%.0f px", clamp);
    ImGui::SliderFloat("right panel", &st.right_panel_width, 200, 600, "%.0f px", clamp);
    ImGui::SliderFloat("cut panel", &st.cut_panel_height, 150, 700, "%.0f px", clamp);
    if (!(st == s.settings)) in.push_back(intent::ChangeSettings{st});
    ImGui::EndMenu();
}
}  // namespace

Intents draw_menu(const AppState& s, const RendererInfo& renderer, float& menu_h) {
    Intents in;
    menu_h = 0;
    if (!ImGui::BeginMainMenuBar()) return in;
    file_menu(s, in);
    view_menu(s, in);
    if (ImGui::BeginMenu("Help")) {
        if (ImGui::MenuItem("Keys and mouse", "F1")) in.push_back(intent::ShowHelp{true});
        if (ImGui::MenuItem("What the panels show")) in.push_back(intent::ShowIntro{true});
        ImGui::EndMenu();
    }
    const std::string r = "GL: " + renderer.renderer + (renderer.software ? "  (Mesa software)" : "  (hardware)");
    ImGui::SameLine(ImGui::GetWindowWidth() - ImGui::CalcTextSize(r.c_str()).x - 16);
    ImGui::TextDisabled("%s", r.c_str());
    if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", renderer.line().c_str());
    menu_h = ImGui::GetWindowSize().y;
    ImGui::EndMainMenuBar();
    return in;
}

namespace {
bool begin_panel(const char* name, ImVec2 pos, ImVec2 size) {
    ImGui::SetNextWindowPos(pos, ImGuiCond_Always);
    ImGui::SetNextWindowSize(size, ImGuiCond_Always);
    ImGui::SetNextWindowBgAlpha(0.0f);  // the framebuffer is cleared to the panel colour
    return ImGui::Begin(name, nullptr, ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoCollapse |
                                           ImGuiWindowFlags_NoBringToFrontOnFocus);
}

// One tiled panel: placed, drawn when visible, its intents appended.
template <class Draw>
void tiled(Intents& in, const char* name, ImVec2 pos, ImVec2 size, Draw&& draw) {
    if (begin_panel(name, pos, size)) append(in, draw());
    ImGui::End();
}
}  // namespace

Intents draw_panels(const AppState& s, const Derived& d, const Layout& L) {
    Intents in;
    const ImVec2 lp = L.left_pos, ls = L.left_size, rp = L.right_pos, rs = L.right_size;
    tiled(in, "Patterns", lp, ImVec2(ls.x, ls.y * 0.52f), [&] { return draw_patterns_panel(s, d); });
    tiled(in, "Surface", ImVec2(lp.x, lp.y + ls.y * 0.52f), ImVec2(ls.x, ls.y * 0.48f), [&] { return draw_surface_panel(s, d); });
    tiled(in, "Probe", rp, ImVec2(rs.x, rs.y * 0.56f), [&] { return draw_probe_panel(s, d); });
    tiled(in, "Polarisation", ImVec2(rp.x, rp.y + rs.y * 0.56f), ImVec2(rs.x, rs.y * 0.44f), [&] { return draw_polarisation_panel(s, d); });
    tiled(in, "Cut", L.cut_pos, L.cut_size, [&] { return draw_cut_panel(s, d); });
    append(in, draw_diversity_panel(s, d));
    append(in, draw_band_panel(s, d));
    append(in, draw_help_overlay(s));
    append(in, draw_intro_overlay(s));
    return in;
}

namespace {
// W, T, G and P fold into one copy of the settings (one ChangeSettings per frame).
void toggle_keys(const AppState& s, Intents& in) {
    auto pressed = [](int key) { return ImGui::IsKeyPressed(key, false); };
    ViewerSettings st = s.settings;
    if (pressed(GLFW_KEY_W)) st.wireframe = !st.wireframe;
    if (pressed(GLFW_KEY_T)) st.translucent = !st.translucent;
    if (pressed(GLFW_KEY_G)) st.glyphs = !st.glyphs;
    if (pressed(GLFW_KEY_P)) st.polar_plot = !st.polar_plot;
    if (!(st == s.settings)) in.push_back(intent::ChangeSettings{st});
}
}  // namespace

Intents read_keys(const AppState& s) {
    Intents in;
    const ImGuiIO& io = ImGui::GetIO();
    if (io.WantTextInput || ImGui::IsAnyItemActive()) return in;
    auto pressed = [](int key) { return ImGui::IsKeyPressed(key, false); };
    if (pressed(GLFW_KEY_F1) || (io.KeyShift && pressed(GLFW_KEY_SLASH))) in.push_back(intent::ShowHelp{!s.show_help});
    if (ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Escape), false)) in.push_back(intent::Escape{});
    const OrbitCamera::Preset presets[] = {OrbitCamera::Preset::px, OrbitCamera::Preset::nx, OrbitCamera::Preset::py,
                                           OrbitCamera::Preset::ny, OrbitCamera::Preset::pz, OrbitCamera::Preset::nz};
    for (int k = 0; k < 6; ++k)
        if (pressed(GLFW_KEY_1 + k)) in.push_back(intent::LookFrom{presets[k]});
    if (io.KeyCtrl) {
        if (pressed(GLFW_KEY_E)) in.push_back(intent::ExportView{timestamped_name("ellipsa-view", "png"), false});
        return in;
    }
    if (pressed(GLFW_KEY_R)) in.push_back(intent::ResetView{});
    toggle_keys(s, in);
    if (pressed(GLFW_KEY_C)) in.push_back(intent::StepComponent{io.KeyShift ? -1 : 1});
    if (pressed(GLFW_KEY_V)) in.push_back(intent::StepColorBy{});
    if (pressed(GLFW_KEY_PAGE_DOWN)) in.push_back(intent::StepFrequency{1});
    if (pressed(GLFW_KEY_PAGE_UP)) in.push_back(intent::StepFrequency{-1});
    if (ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Tab), false)) in.push_back(intent::NextPattern{});
    return in;
}

Intents read_mouse(const AppState& s, const Derived& d, const Layout& L) {
    Intents in;
    const ImGuiIO& io = ImGui::GetIO();
    const ImVec2 mp = io.MousePos;
    const bool over_view = L.in_view(mp) && !io.WantCaptureMouse;
    // A press belongs to the view when it began there and not on an ImGui window.
    const bool view_press = !io.MouseDownOwned[0] && L.in_view(io.MouseClickedPos[0]);
    if (over_view) {
        if (ImGui::IsMouseDoubleClicked(0)) in.push_back(intent::ResetView{});
        if (io.MouseWheel != 0) in.push_back(intent::Zoom{io.MouseWheel});
    }
    if (view_press && ImGui::IsMouseDown(0) && (io.MouseDelta.x != 0 || io.MouseDelta.y != 0))
        in.push_back(intent::Orbit{io.MouseDelta.x, io.MouseDelta.y});
    if (view_press && over_view && ImGui::IsMouseReleased(0) && s.hover) {
        const float dx = mp.x - io.MouseClickedPos[0].x, dy = mp.y - io.MouseClickedPos[0].y;
        if (dx * dx + dy * dy < 9) in.push_back(intent::Pin{*s.hover});
    }
    if (over_view && !ImGui::IsMouseDown(0)) {
        const Ray ray = ray_through_pixel(s.camera, mp.x - L.view_pos.x, mp.y - L.view_pos.y, L.view_size.x, L.view_size.y);
        const std::optional<Pick> p = pick_direction(d.surface.value().mesh, ray);
        in.push_back(intent::Hover{p ? std::optional(Direction{p->theta_deg, p->phi_deg}) : std::nullopt});
    } else if (!over_view && s.hover) {
        in.push_back(intent::Hover{std::nullopt});
    }
    return in;
}

Intents draw_ui(const AppState& s, const Derived& d, const RendererInfo& renderer, Layout& layout) {
    float menu_h = 0;
    Intents in = draw_menu(s, renderer, menu_h);
    layout = compute_layout(s.settings, ImGui::GetIO().DisplaySize, menu_h);
    append(in, draw_panels(s, d, layout));
    append(in, read_keys(s));
    append(in, read_mouse(s, d, layout));
    append(in, draw_map_panel(s, d));
    return in;
}

void draw_view_overlay(const AppState& s, const Derived& d, const Layout& L, const UiFonts& fonts, const RendererInfo& r) {
    const LoadedPattern* a = s.active_pattern();
    ImDrawList* bg = ImGui::GetBackgroundDrawList();
    if (!a) {
        bg->AddText(fonts.body, fonts.body->FontSize, ImVec2(L.view_pos.x + 12, L.view_pos.y + 12), IM_COL32(95, 100, 108, 255),
                    "No pattern open: type a path in the Patterns panel, pick a recent file, or drop a CSV here.");
        return;
    }
    const ImU32 ink = IM_COL32(34, 38, 46, 255), muted = IM_COL32(95, 100, 108, 255);
    const SurfaceView& sv = d.surface.value();
    const ImVec2 o = L.view_pos, size = L.view_size;
    std::string title = a->set.name;
    if (const LoadedPattern* b = s.compare_pattern(); b && s.settings.color_by == ColorBy::difference) title += "  minus  " + b->set.name;
    bg->AddText(fonts.title, fonts.title->FontSize, ImVec2(o.x + 12, o.y + 8), ink, title.c_str());
    char line[200];
    std::snprintf(line, sizeof line, "radius: %s, peak %.2f %s, range %g dB", short_label(s.settings.component), sv.mesh.peak_db,
                  sv.mesh.unit.c_str(), s.settings.range_db);
    bg->AddText(fonts.small, fonts.small->FontSize, ImVec2(o.x + 12, o.y + 32), muted, line);
    if (!sv.error.empty()) bg->AddText(fonts.body, fonts.body->FontSize, ImVec2(o.x + 12, o.y + 52), IM_COL32(150, 40, 20, 255), sv.error.c_str());
    const float bh = std::min(size.y * 0.55f, 320.0f);
    draw_color_bar(bg, ImVec2(o.x + size.x - 64, o.y + (size.y - bh) * 0.5f + 10), ImVec2(16, bh), sv.mesh.bar, fonts.small, fonts.small);
    draw_axis_labels(bg, s.camera, o, size, 1.3, fonts.small);
    const std::string rl = "OpenGL: " + r.renderer + (r.software ? ", Mesa software" : ", hardware");
    bg->AddText(fonts.small, fonts.small->FontSize, ImVec2(o.x + 12, o.y + size.y - fonts.small->FontSize - 6), muted, rl.c_str());
    auto mark = [&](const Direction& at, ImU32 col) {
        const Projected q = project(s.camera, surface_point(s, d, at), size.x, size.y);
        if (q.visible) bg->AddCircle(ImVec2(o.x + float(q.x), o.y + float(q.y)), 6, col, 16, 2.0f);
    };
    if (s.hover) mark(*s.hover, IM_COL32(255, 255, 255, 230));
    if (s.pinned) mark(*s.pinned, IM_COL32(20, 20, 20, 255));
}

}  // namespace ellipsa::viewer
