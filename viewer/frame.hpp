// One frame of the window's UI, in named steps: the menu bar, the layout of the tiled panels,
// the panels themselves, the keys, the mouse in the 3D view and the overlay drawn over the view.
// Every step reads the state and the derived data as const and returns intents; run_viewer()
// (viewer/app.cpp) applies them.
#pragma once
#include <imgui.h>

#include "viewer/render_context.hpp"
#include "viewer/state/app_state.hpp"
#include "viewer/state/derived.hpp"
#include "viewer/state/intents.hpp"
#include "viewer/ui_style.hpp"

namespace ellipsa::viewer {

// Where everything goes, in ImGui's screen coordinates. A wide window has three columns: left
// (Patterns over Surface), centre (the view over the plot strip) and right (Polarisation over
// Probe). A narrow one (under narrow_width x narrow_height) drops the right column: Probe and
// Polarisation become tabs of the plot strip, and Patterns and Surface tabs of the left column.
// The view keeps a header band (title and caption) and a strip for the colour bar and the
// ellipse key clear of the 3D scene, so nothing is drawn over the surface.
inline constexpr float narrow_width = 1100, narrow_height = 660;
struct Layout {
    bool narrow = false;
    ImVec2 left_pos, left_size;
    ImVec2 polar_pos, polar_size, probe_pos, probe_size;  // the right column (zero when narrow)
    ImVec2 strip_pos, strip_size;                         // the plot strip: cut and docked tools
    ImVec2 area_pos, area_size;                           // the view's whole rectangle
    ImVec2 view_pos, view_size;                           // the 3D scene inside it
    ImVec2 key_pos, key_size;                             // the strip right of the scene (colour bar, ellipse key)
    bool in_view(ImVec2 p) const {
        return p.x >= view_pos.x && p.y >= view_pos.y && p.x < view_pos.x + view_size.x && p.y < view_pos.y + view_size.y;
    }
};
// menu_h: the menu bar's height, which also scales the header band and the key strip with the font.
Layout compute_layout(const ViewerSettings& s, ImVec2 display, float menu_h);

// The menu bar; menu_h receives its height.
Intents draw_menu(const AppState& s, const RendererInfo& renderer, float& menu_h);
// The tiled panels (the tabbed ones showing the state's tab) and the help and first-run overlays.
Intents draw_panels(const AppState& s, const Derived& d, const Layout& L);
// Keys (ignored while a widget has the keyboard).
Intents read_keys(const AppState& s);
// The mouse over the 3D view: turn, zoom, reset, hover and click to pin. A press that began on a
// panel is never taken for the view.
Intents read_mouse(const AppState& s, const Derived& d, const Layout& L);
// The whole UI of a frame: menu, layout (into `layout`), panels, keys, mouse, in that order.
Intents draw_ui(const AppState& s, const Derived& d, const RendererInfo& renderer, Layout& layout);
// Title, caption, colour bar, ellipse key, axis labels and the hover and pin marks.
void draw_view_overlay(const AppState& s, const Derived& d, const Layout& L, const UiFonts& fonts, const RendererInfo& r);

}  // namespace ellipsa::viewer
