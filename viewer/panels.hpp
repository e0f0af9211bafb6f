// The side panels of the viewer window. Each reads the AppState, draws its widgets and returns
// what the user asked for; the analysis lives in pattern/ and viewer/scene/, never here.
#pragma once
#include <string>
#include <vector>

#include "viewer/app_state.hpp"
#include "viewer/scene/probe.hpp"

namespace ellipsa::viewer {

struct Intents {
    std::vector<std::string> open;  // files to load
    std::string open_map;           // column-map file for them ("" = look beside each file)
    int close = -1;                 // pattern index to close
    bool cancel_load = false;       // stop the file being read
    bool rebuild_surface = false;   // component, colouring, range or frequency changed
    bool rebuild_glyphs = false;
    bool recut = false;
    bool reset_view = false;
    bool export_view = false;
    std::string export_cut;  // file name (format from the extension)
    void merge(const Intents& o);
};

Intents draw_patterns_panel(AppState& s);
Intents draw_surface_panel(AppState& s);
void draw_probe_panel(AppState& s);
Intents draw_polarisation_panel(AppState& s);
Intents draw_cut_panel(AppState& s);
void draw_help_overlay(AppState& s);
// The first-run orientation: what each panel shows, dismissable (remembered in the settings).
void draw_intro_overlay(AppState& s);


}  // namespace ellipsa::viewer
