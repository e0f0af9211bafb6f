// The panels of the viewer window. Each takes the state and the derived data as const, draws
// its widgets and returns what the user asked for as intents (viewer/state/intents.hpp); it
// never writes the state, and the analysis lives in pattern/ and viewer/scene/, never here.
// Text is made here, from numbers.
//
// Adding a panel: `Intents draw_xxx_panel(const AppState&, const Derived&)` in its own file,
// listed in viewer/CMakeLists.txt, and one entry in draw_panels() (viewer/frame.cpp): a docked
// tool is a closable tab of the plot strip (an `xxx_open` flag, a Tab and a ShowXxx intent that
// brings it to the front). A panel draws into the space it is given (GetContentRegionAvail) and
// lays itself out for both a wide strip (about 700 px) and a narrow one (about 500 px). Edits of
// the settings go out as ChangeSettings with an edited copy; new kinds of change as a new intent.
#pragma once
#include <imgui.h>

#include "viewer/state/app_state.hpp"
#include "viewer/state/derived.hpp"
#include "viewer/state/intents.hpp"

namespace ellipsa::viewer {

Intents draw_patterns_panel(const AppState& s, const Derived& d);
Intents draw_surface_panel(const AppState& s, const Derived& d);
Intents draw_probe_panel(const AppState& s, const Derived& d);
Intents draw_polarisation_panel(const AppState& s, const Derived& d);
Intents draw_cut_panel(const AppState& s, const Derived& d);
// Where the cut panel puts its parts in a content region `avail` (`line`: a text line with its
// spacing; `curves`: the figure table's rows; `gap`: the space between columns). The controls
// column and the plot side by side with the table under both, as long as that leaves the plot
// cut_plot_min px of height and the panel is 560 px wide; else (the plot strip at 800x600, or many
// curves) the plot a square over the full height, and the controls and the table turned (a column
// per curve) in the column beside it, so the plot keeps a usable size.
inline constexpr float cut_plot_min = 220;
struct CutPanelLayout {
    bool turned = false;              // the table turned beside the plot, not under it
    float controls_w = 0, top_h = 0;  // the controls column; the height of the controls and the plot
    ImVec2 plot;                      // the plot's child window
};
CutPanelLayout cut_panel_layout(ImVec2 avail, std::size_t curves, float line, float gap);
// A docked tool, a tab of the plot strip while s.diversity_open (its close button returns ShowDiversity{false}).
Intents draw_diversity_panel(const AppState& s, const Derived& d);
// A docked tool while s.band_open: one figure of A against frequency; a click picks the frequency.
Intents draw_band_panel(const AppState& s, const Derived& d);
// A docked tool while s.fading_open: the distribution curves of the received power of A, B and
// their selection and maximal-ratio combination in the diversity panel's environment (analytic:
// Rayleigh from MEG, exact combining from MEG and ECC; viewer/scene/diversity_view.hpp).
Intents draw_fading_panel(const AppState& s, const Derived& d);
// A docked tool while s.map_open: the surface's colouring on a whole-sphere map
// (Hammer equal-area, theta/phi or azimuth/elevation); hovering probes, a click pins (its Hover
// stands over the 3D view's: draw_ui() drops the view's when a panel gave one).
Intents draw_map_panel(const AppState& s, const Derived& d);
// The in-window file browser (panel_browser.cpp), a window over the others while AppState::browser is set.
Intents draw_file_browser(const AppState& s, const Derived& d);
Intents draw_help_overlay(const AppState& s);
// A section of the Patterns panel (viewer/mounting_panel.cpp): A's mounting, presets for the six
// axes and turns about the world axes, with exports::mounting_text of what is applied.
void draw_mounting_section(const AppState& s, Intents& in);
// The section under it: A's phase reference (x, y, z in metres, the estimated phase centre, the
// file's origin) and which one is in use (exports::reference_shift_text).
void draw_reference_section(const AppState& s, Intents& in);
// The first-run orientation: what each panel shows, dismissable (remembered in the settings).
Intents draw_intro_overlay(const AppState& s);

}  // namespace ellipsa::viewer
