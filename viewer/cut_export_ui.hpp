// "Export cut" from the viewer: the cut on screen written through the same exports code as
// `ellipsa cut` (exports/cut_figure.hpp, one Cairo drawing for SVG, PDF and PNG; CSV of the
// plotted values), with the B pattern's curves overlaid when comparing.
#pragma once
#include <string>

#include "viewer/app_state.hpp"

namespace ellipsa::viewer {

// Writes the current cut to `path` (format from the extension), replacing a file only when
// `overwrite`; returns a one-line message for the UI ("Wrote ..." or the error).
std::string export_current_cut(const AppState& s, const std::string& path, bool overwrite = false);

}  // namespace ellipsa::viewer
