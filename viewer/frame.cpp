#include "viewer/frame.hpp"

#include <algorithm>
#include <cstdio>

#define GLFW_INCLUDE_NONE
#include <GLFW/glfw3.h>

#include "exports/figure_text.hpp"
#include "viewer/exports_ui.hpp"
#include "viewer/overlay.hpp"
#include "viewer/panels.hpp"
#include "viewer/scene/file_browser.hpp"
#include "viewer/scene/picking.hpp"

namespace ellipsa::viewer {

Layout compute_layout(const ViewerSettings& s, ImVec2 display, float menu_h) {
    Layout L;
    const float H = std::max(0.0f, display.y - menu_h);
    L.narrow = display.x < narrow_width || display.y < narrow_height;
    // Side panels take at most 28 % of the width each (a narrow window's left column a little more,
    // as it is the only one), so the view and the plot strip keep their room.
    const float lw = L.narrow ? std::min(s.left_panel_width, std::max(240.0f, display.x * 0.34f))
                              : std::min(s.left_panel_width, display.x * 0.28f);
    const float rw = L.narrow ? 0.0f : std::min(s.right_panel_width, display.x * 0.28f);
    const float ch = std::min(s.cut_panel_height, H * 0.5f);
    L.left_pos = ImVec2(0, menu_h);
    L.left_size = ImVec2(lw, H);
    if (!L.narrow) {
        const float ph = std::clamp(s.polarisation_panel_height, std::min(200.0f, H * 0.5f), std::max(H * 0.5f, H - 160));
        L.polar_pos = ImVec2(display.x - rw, menu_h);
        L.polar_size = ImVec2(rw, ph);
        L.probe_pos = ImVec2(display.x - rw, menu_h + ph);
        L.probe_size = ImVec2(rw, H - ph);
    }
    L.strip_pos = ImVec2(lw, display.y - ch);
    L.strip_size = ImVec2(display.x - lw - rw, ch);
    L.area_pos = ImVec2(lw, menu_h);
    L.area_size = ImVec2(display.x - lw - rw, H - ch);
    const float header = 2.6f * menu_h, key = std::min(5.2f * menu_h, L.area_size.x * 0.3f);
    L.view_pos = ImVec2(L.area_pos.x, L.area_pos.y + header);
    L.view_size = ImVec2(std::max(0.0f, L.area_size.x - key), std::max(0.0f, L.area_size.y - header));
    L.key_pos = ImVec2(L.view_pos.x + L.view_size.x, L.view_pos.y);
    L.key_size = ImVec2(L.area_size.x - L.view_size.x, L.view_size.y);
    return L;
}

namespace {
// The in-window browser in the folder of the latest recent file, else the current folder.
BrowserView browse_from(const AppState& s) {
    const std::vector<std::string> recent = recent_folders(s.settings.recent_files, 1);
    return BrowserView::at(recent.empty() ? std::string(".") : recent[0]);
}

void file_menu(const AppState& s, Intents& in) {
    if (!ImGui::BeginMenu("File")) return;
    if (ImGui::MenuItem("Open...", "Ctrl+O")) in.push_back(intent::OpenFileDialog{});
    if (ImGui::MenuItem("Open in this window...")) in.push_back(intent::ShowBrowser{browse_from(s)});
    ImGui::Separator();
    for (const std::string& f : s.settings.recent_files)
        if (ImGui::MenuItem(f.c_str())) in.push_back(intent::OpenFiles{{f}, "", true});
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
    if (ImGui::MenuItem("Fading and combining", nullptr, s.fading_open)) in.push_back(intent::ShowFading{!s.fading_open});
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
bool begin_panel(const char* name, ImVec2 pos, ImVec2 size, ImGuiWindowFlags extra = 0) {
    ImGui::SetNextWindowPos(pos, ImGuiCond_Always);
    ImGui::SetNextWindowSize(size, ImGuiCond_Always);
    ImGui::SetNextWindowBgAlpha(0.0f);  // the framebuffer is cleared to the panel colour
    return ImGui::Begin(name, nullptr, ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoCollapse |
                                           ImGuiWindowFlags_NoBringToFrontOnFocus | extra);
}

// One tiled panel: placed, drawn when visible, its intents appended.
template <class Draw>
void tiled(Intents& in, const char* name, ImVec2 pos, ImVec2 size, Draw&& draw) {
    if (size.x > 0 && size.y > 0 && begin_panel(name, pos, size)) append(in, draw());
    if (size.x > 0 && size.y > 0) ImGui::End();
}

// One tab of a tabbed panel: what it shows and whether it can be closed (a docked tool).
struct TabEntry {
    Tab tab;
    const char* label;
    bool closable;
    Intents (*draw)(const AppState&, const Derived&);
};

// The intent that closes a docked tool.
Intent close_tool(Tab t) {
    if (t == Tab::diversity) return intent::ShowDiversity{false};
    if (t == Tab::map) return intent::ShowMap{false};
    if (t == Tab::fading) return intent::ShowFading{false};
    return intent::ShowBand{false};
}

// A row of tab buttons (the shown one highlighted; tools with a close button), then the shown
// tab's panel below them. Selection is state: a click returns SelectTab.
void tab_row(const std::vector<TabEntry>& tabs, Tab shown, Intents& in) {
    const ImGuiStyle& st = ImGui::GetStyle();
    for (std::size_t k = 0; k < tabs.size(); ++k) {
        const TabEntry& t = tabs[k];
        if (k) ImGui::SameLine(0, 2);
        const bool on = t.tab == shown;
        ImGui::PushStyleColor(ImGuiCol_Button, st.Colors[on ? ImGuiCol_TabActive : ImGuiCol_Tab]);
        ImGui::PushStyleColor(ImGuiCol_Text, st.Colors[on ? ImGuiCol_Text : ImGuiCol_TextDisabled]);
        if (ImGui::Button(t.label) && !on) in.push_back(intent::SelectTab{t.tab});
        ImGui::PopStyleColor(2);
        if (!t.closable) continue;
        ImGui::SameLine(0, 0);
        ImGui::PushID(t.label);
        if (ImGui::SmallButton("x")) in.push_back(close_tool(t.tab));
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("Close %s", t.label);
        ImGui::PopID();
    }
}

void tabbed(Intents& in, const char* id, ImVec2 pos, ImVec2 size, const std::vector<TabEntry>& tabs, Tab shown,
            const AppState& s, const Derived& d) {
    if (size.x <= 0 || size.y <= 0) return;
    if (begin_panel(id, pos, size, ImGuiWindowFlags_NoTitleBar | ImGuiWindowFlags_NoScrollbar)) {
        tab_row(tabs, shown, in);
        ImGui::Separator();
        const TabEntry* t = &tabs.front();
        for (const TabEntry& e : tabs)
            if (e.tab == shown) t = &e;
        ImGui::BeginChild(t->label, ImVec2(0, 0), false);
        append(in, t->draw(s, d));
        ImGui::EndChild();
    }
    ImGui::End();
}

// A handle along the bottom edge of the current panel: dragging it changes the panel's height
// (the polarisation panel over the probe).
void height_handle(const AppState& s, float height, Intents& in) {
    const ImVec2 wp = ImGui::GetWindowPos(), ws = ImGui::GetWindowSize();
    ImGui::SetCursorScreenPos(ImVec2(wp.x, wp.y + ws.y - 7));
    ImGui::InvisibleButton("##height", ImVec2(ws.x, 7));
    const bool hot = ImGui::IsItemHovered() || ImGui::IsItemActive();
    if (hot) ImGui::SetMouseCursor(ImGuiMouseCursor_ResizeNS);
    ImGui::GetWindowDrawList()->AddLine(ImVec2(wp.x + ws.x * 0.4f, wp.y + ws.y - 3), ImVec2(wp.x + ws.x * 0.6f, wp.y + ws.y - 3),
                                        hot ? IM_COL32(90, 95, 105, 255) : IM_COL32(180, 182, 180, 255), 2.0f);
    const float dy = ImGui::GetIO().MouseDelta.y;
    if (ImGui::IsItemActive() && dy != 0) {
        ViewerSettings st = s.settings;
        st.polarisation_panel_height = height + dy;
        in.push_back(intent::ChangeSettings{st});
    }
}
}  // namespace

Intents draw_panels(const AppState& s, const Derived& d, const Layout& L) {
    Intents in;
    const ImVec2 lp = L.left_pos, ls = L.left_size;
    std::vector<TabEntry> strip = {{Tab::cut, "Cut", false, draw_cut_panel}};
    if (L.narrow) {
        tabbed(in, "##left", lp, ls, {{Tab::patterns, "Patterns", false, draw_patterns_panel}, {Tab::surface, "Surface", false, draw_surface_panel}},
               s.left_tab, s, d);
        strip.push_back({Tab::probe, "Probe", false, draw_probe_panel});
        strip.push_back({Tab::polarisation, "Polarisation", false, draw_polarisation_panel});
    } else {
        tiled(in, "Patterns", lp, ImVec2(ls.x, ls.y * 0.52f), [&] { return draw_patterns_panel(s, d); });
        tiled(in, "Surface", ImVec2(lp.x, lp.y + ls.y * 0.52f), ImVec2(ls.x, ls.y * 0.48f), [&] { return draw_surface_panel(s, d); });
        tiled(in, "Polarisation", L.polar_pos, L.polar_size, [&] {
            Intents p = draw_polarisation_panel(s, d);
            height_handle(s, L.polar_size.y, p);
            return p;
        });
        tiled(in, "Probe", L.probe_pos, L.probe_size, [&] { return draw_probe_panel(s, d); });
    }
    if (s.diversity_open) strip.push_back({Tab::diversity, "Diversity", true, draw_diversity_panel});
    if (s.band_open) strip.push_back({Tab::band, "Band", true, draw_band_panel});
    if (s.map_open) strip.push_back({Tab::map, "Map", true, draw_map_panel});
    if (s.fading_open) strip.push_back({Tab::fading, "Fading", true, draw_fading_panel});
    // A tab that this layout does not have (the probe in a wide window) shows the cut.
    Tab shown = Tab::cut;
    for (const TabEntry& t : strip)
        if (t.tab == s.strip_tab) shown = t.tab;
    tabbed(in, "##strip", L.strip_pos, L.strip_size, strip, shown, s, d);
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
    if (io.WantTextInput || ImGui::IsAnyItemActive() || s.browser) return in;  // the browser reads its own keys
    auto pressed = [](int key) { return ImGui::IsKeyPressed(key, false); };
    if (pressed(GLFW_KEY_F1) || (io.KeyShift && pressed(GLFW_KEY_SLASH))) in.push_back(intent::ShowHelp{!s.show_help});
    if (ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Escape), false)) in.push_back(intent::Escape{});
    const OrbitCamera::Preset presets[] = {OrbitCamera::Preset::px, OrbitCamera::Preset::nx, OrbitCamera::Preset::py,
                                           OrbitCamera::Preset::ny, OrbitCamera::Preset::pz, OrbitCamera::Preset::nz};
    for (int k = 0; k < 6; ++k)
        if (pressed(GLFW_KEY_1 + k)) in.push_back(intent::LookFrom{presets[k]});
    if (io.KeyCtrl) {
        if (pressed(GLFW_KEY_O)) in.push_back(intent::OpenFileDialog{});
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
        if (p && !p->measured) in.push_back(intent::Hover{std::nullopt, true});
        else in.push_back(intent::Hover{p ? std::optional(Direction{p->theta_deg, p->phi_deg}) : std::nullopt, false});
    } else if (!over_view && (s.hover || s.hover_not_measured)) {
        in.push_back(intent::Hover{std::nullopt, false});
    }
    return in;
}

Intents draw_ui(const AppState& s, const Derived& d, const RendererInfo& renderer, Layout& layout) {
    float menu_h = 0;
    Intents in = draw_menu(s, renderer, menu_h);
    layout = compute_layout(s.settings, ImGui::GetIO().DisplaySize, menu_h);
    append(in, draw_panels(s, d, layout));
    append(in, draw_file_browser(s, d));
    append(in, read_keys(s));
    // A panel that probes (the map) gave its own Hover: it stands over the 3D view's.
    const bool panel_hover = std::any_of(in.begin(), in.end(), [](const Intent& i) { return std::holds_alternative<intent::Hover>(i); });
    for (Intent& i : read_mouse(s, d, layout))
        if (!panel_hover || !std::holds_alternative<intent::Hover>(i)) in.push_back(std::move(i));
    return in;
}

// The caption under the title: what sets the radius, its peak (rounded as every figure is), the range.
std::string view_caption(const AppState& s, const Derived& d) {
    return exports::radius_caption(short_label(s.settings.component), d.peak_db.value(), d.surface.value().mesh.unit,
                                   s.settings.range_db);
}

void draw_view_overlay(const AppState& s, const Derived& d, const Layout& L, const UiFonts& fonts, const RendererInfo&) {
    const LoadedPattern* a = s.active_pattern();
    ImDrawList* bg = ImGui::GetBackgroundDrawList();
    const ImVec2 o = L.area_pos;
    const ImU32 ink = IM_COL32(34, 38, 46, 255), muted = IM_COL32(95, 100, 108, 255);
    if (!a) {
        bg->AddText(fonts.body, fonts.body->FontSize, ImVec2(o.x + 12, o.y + 12), muted,
                    "No pattern open: type a path in the Patterns panel, pick a recent file, or drop a CSV here.", nullptr,
                    L.area_size.x - 24);
        return;
    }
    // The header and the key strip on the scene's background colour (the scene, drawn before the
    // UI, clears its own rectangle to it), so the view reads as one.
    const ImU32 view_bg = IM_COL32(251, 251, 250, 255);
    bg->AddRectFilled(o, ImVec2(o.x + L.area_size.x, L.view_pos.y), view_bg);
    bg->AddRectFilled(L.key_pos, ImVec2(L.key_pos.x + L.key_size.x, L.key_pos.y + L.key_size.y), view_bg);
    const SurfaceView& sv = d.surface.value();
    std::string title = a->list_name();
    if (const LoadedPattern* b = s.compare_pattern(); b && s.settings.color_by == ColorBy::difference) title += "  minus  " + b->list_name();
    const float wrap = L.area_size.x - 24;
    bg->PushClipRect(o, ImVec2(o.x + L.area_size.x, o.y + L.area_size.y));
    bg->AddText(fonts.title, fonts.title->FontSize, ImVec2(o.x + 12, o.y + 6), ink, title.c_str());
    bg->AddText(fonts.small, fonts.small->FontSize, ImVec2(o.x + 12, o.y + 8 + fonts.title->FontSize), muted, view_caption(s, d).c_str(),
                nullptr, wrap);
    if (!sv.error.empty())
        bg->AddText(fonts.body, fonts.body->FontSize, ImVec2(L.view_pos.x + 12, L.view_pos.y + 4), IM_COL32(150, 40, 20, 255),
                    sv.error.c_str(), nullptr, L.view_size.x - 24);
    // The key strip: the colour bar on top, the ellipse key under it.
    const float kx = L.key_pos.x + 10, kw = L.key_size.x - 14;
    const float key_h = s.settings.glyphs && a->set.has_phase() ? 4 * fonts.small->FontSize * 1.35f + 10 : 0;
    const float unsampled_h = sv.mesh.unsampled.empty() ? 0 : fonts.small->FontSize * 1.35f + 8;
    const float title_h = color_bar_title_height(sv.mesh.bar, fonts.small, kw);
    const float bar_h = std::max(40.0f, std::min(320.0f, L.key_size.y - title_h - key_h - unsampled_h - 16));
    if (!sv.mesh.vertices.empty())
        draw_color_bar(bg, ImVec2(kx, L.key_pos.y + title_h + 4), ImVec2(14, bar_h), sv.mesh.bar, fonts.small, fonts.small, kw);
    if (unsampled_h > 0) draw_unsampled_key(bg, ImVec2(kx, L.key_pos.y + L.key_size.y - key_h - unsampled_h), fonts.small, ink);
    if (key_h > 0) draw_ellipse_key(bg, ImVec2(kx, L.key_pos.y + L.key_size.y - key_h), fonts.small, ink);
    bg->PopClipRect();
    bg->PushClipRect(L.view_pos, ImVec2(L.view_pos.x + L.view_size.x, L.view_pos.y + L.view_size.y));
    draw_axis_labels(bg, s.camera, L.view_pos, L.view_size, 1.3, fonts.small);
    // The mounting applied, in the words of every output (exports::mounting_text), at the view's
    // foot, and the world's up and horizon above it.
    std::string mounting = "mounting: " + exports::mounting_text(a->set);
    if (const std::string moved = exports::reference_shift_text(a->set, s.freq); !moved.empty())
        mounting += "\nphase reference " + moved;
    const float mh = fonts.small->CalcTextSizeA(fonts.small->FontSize, 1e9f, L.view_size.x - 24, mounting.c_str()).y;
    const float foot = L.view_pos.y + L.view_size.y - mh - 6;
    bg->AddText(fonts.small, fonts.small->FontSize, ImVec2(L.view_pos.x + 12, foot), muted, mounting.c_str(), nullptr,
                L.view_size.x - 24);
    const float gr = std::clamp(L.view_size.y * 0.05f, 14.0f, 24.0f);
    draw_world_up(bg, s.camera, L.view_pos, L.view_size, 1.3, fonts.small, ImVec2(L.view_pos.x + 14 + gr, foot - gr - 6), gr);
    auto mark = [&](const Direction& at, ImU32 col) {
        const Projected q = project(s.camera, surface_point(s, d, at), L.view_size.x, L.view_size.y);
        if (q.visible) bg->AddCircle(ImVec2(L.view_pos.x + float(q.x), L.view_pos.y + float(q.y)), 6, col, 16, 2.0f);
    };
    if (s.hover) mark(*s.hover, IM_COL32(255, 255, 255, 230));
    if (s.pinned) mark(*s.pinned, IM_COL32(20, 20, 20, 255));
    bg->PopClipRect();
}

}  // namespace ellipsa::viewer
