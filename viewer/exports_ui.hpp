// Exports from the viewer, returned as outcomes (ExportOutcome in viewer/state/app_state.hpp):
// the 3D view through the headless snapshot (the code behind `ellipsa render`) and the cut on
// screen through the exports code (behind `ellipsa cut`: one Cairo drawing for SVG, PDF and
// PNG; CSV of the plotted values), with B's curves overlaid when comparing. Without `overwrite`
// an existing file (or link, even a dangling one) is never replaced: the outcome is `exists`
// and the panel offers to replace it; a scripted run turns it into an error.
#pragma once
#include <functional>
#include <string>

#include "exports/cut_plot.hpp"
#include "pattern/result.hpp"

#include "viewer/scene/cut_view.hpp"
#include "viewer/scene/surface_mesh.hpp"
#include "viewer/surface_file.hpp"
#include "viewer/state/app_state.hpp"

namespace ellipsa::viewer {

// Write a file through `write` (which gets `overwrite` itself) unless something is already at
// `path` and overwrite is off; a refusal by the writer (a file that appeared meanwhile) is
// `exists` too.
ExportOutcome write_export(const std::string& path, bool overwrite, const std::function<Status()>& write);

// The cut figure of the state: the one value that the cut panel draws on screen and the export
// writes (A's curves, and B's when comparing, named by letter on the plot and by antenna in the
// table). Needs an active pattern and cut.a.
exports::CutPlot cut_figure(const AppState& s, const CutData& cut);

// What the phase view says, on screen and when asked to export, when every chosen component is the
// total (a power, with no phase): when no_phase_component(cut) holds.
inline constexpr char no_phase_component_text[] = "No phase: the total is a power. Choose a component (Components..) to see its phase.";
bool no_phase_component(const ComponentCut& cut);

ExportOutcome export_cut_file(const AppState& s, const CutData& cut, const std::string& path, bool overwrite);

// Renders through its own headless context: a caller with a current window context releases it
// first and makes it current again afterwards (GLVND allows one window-system API per thread).
ExportOutcome export_view_file(const AppState& s, const std::string& path, bool overwrite);

// The surface on screen (the derived mesh) as a 3D file (viewer/surface_file.hpp); needs no GL context.
ExportOutcome export_surface_file(const AppState& s, const SurfaceMesh& mesh, const std::string& path, bool overwrite);

// A file name in the current folder for an export from the UI: "<stem>-YYYYmmdd-HHMMSS.<ext>".
std::string timestamped_name(const std::string& stem, const std::string& extension);

}  // namespace ellipsa::viewer
