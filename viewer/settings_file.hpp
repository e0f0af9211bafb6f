// Reading and writing the viewer's settings file and choosing where imgui.ini lives:
// $XDG_CONFIG_HOME/ellipsa/ (or ~/.config/ellipsa/). Failures never stop the viewer.
#pragma once
#include <string>
#include <vector>

#include "viewer/scene/settings.hpp"

namespace ellipsa::viewer {

// The folder (created on save); empty when neither XDG_CONFIG_HOME nor HOME is set.
std::string config_dir();
ViewerSettings load_settings(std::vector<std::string>& warnings);
// Through a temporary file and a rename; returns false (and a message) on failure.
bool save_settings(const ViewerSettings& s, std::string& message);

}  // namespace ellipsa::viewer
