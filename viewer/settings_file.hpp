// Reading and writing the viewer's settings (viewer.conf) and ImGui's window layout (imgui.ini)
// in $XDG_CONFIG_HOME/ellipsa/ (or ~/.config/ellipsa/ when it is unset, empty or relative, as the
// XDG Base Directory Specification says). Failures never stop the viewer: a folder
// that cannot be made means the viewer runs without saving and says so once; a settings file
// that is not a regular file of sane size (a FIFO, a link to /dev/zero, a huge file) is not
// read, with a warning.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/result.hpp"
#include "viewer/scene/settings.hpp"

namespace ellipsa::viewer {

// Largest settings file read (viewer.conf or imgui.ini); anything bigger is not ours.
inline constexpr std::size_t max_settings_file_bytes = 256 * 1024;

// Where settings live, and whether they can be saved there.
struct SettingsPlace {
    std::string dir;      // the folder; "" when neither XDG_CONFIG_HOME nor HOME is set
    std::string problem;  // why settings will not be saved ("" when they will)
    bool can_save() const { return !dir.empty() && problem.empty(); }
};

// The folder from the environment, created when `create` (never throws; a failure is recorded
// in `problem`).
SettingsPlace settings_place(bool create);

// The text of a settings file: regular files up to max_bytes only; opening never blocks (a FIFO
// is refused, not waited on). None when the file does not exist; an Error says what is wrong.
Result<std::optional<std::string>> read_settings_text(const std::string& path, std::size_t max_bytes = max_settings_file_bytes);

// viewer.conf from the place (defaults when absent or unreadable; every problem in `warnings`).
ViewerSettings load_settings(const SettingsPlace& p, std::vector<std::string>& warnings);
// imgui.ini's text from the place, if there is a usable one (problems in `warnings`).
std::optional<std::string> load_imgui_ini(const SettingsPlace& p, std::vector<std::string>& warnings);

// Write viewer.conf and imgui.ini (when given) through temporary files and renames.
Status save_settings(const SettingsPlace& p, const ViewerSettings& s, const std::optional<std::string>& imgui_ini);

}  // namespace ellipsa::viewer
