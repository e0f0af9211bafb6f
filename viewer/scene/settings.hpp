// The viewer's own persistent settings (beside ImGui's imgui.ini): a small "key = value" text file
// under $XDG_CONFIG_HOME/ellipsa/viewer.conf (or ~/.config/ellipsa/viewer.conf). This header is
// the pure part: the values, and their text form. Unknown keys and bad values are skipped and
// reported, so an old or hand-edited file never stops the viewer from starting.
#pragma once
#include <functional>
#include <string>
#include <vector>

#include "pattern/polarisation.hpp"
#include "viewer/scene/colormap.hpp"
#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

struct ViewerSettings {
    Component component = Component::total;
    ColorBy color_by = ColorBy::component;
    ColorMap gain_map = ColorMap::viridis;
    double range_db = 30;
    bool wireframe = false;
    bool translucent = false;
    bool glyphs = true;
    double glyph_spacing_deg = 15;
    bool polar_plot = true;
    bool cut_phase = false;    // the cut panel shows each component's phase instead of its gain (rect)
    int cut_kind = 0;          // 0 phi = const, 1 theta = const, 2 through the pinned direction
    double cut_angle_deg = 0;  // phi for kind 0, theta for kind 1
    unsigned cut_components = 1u;  // bit per Component (bit 0: total)
    double poincare_within_db = 3;
    bool seen_intro = false;   // the first-run orientation was dismissed
    int window_width = 1280, window_height = 800;
    float left_panel_width = 285, right_panel_width = 315, cut_panel_height = 360;
    float polarisation_panel_height = 390;  // the top of the right column (ellipse and Poincare sphere)
    std::vector<std::string> recent_files;  // most recent first, at most max_recent
    static constexpr std::size_t max_recent = 10;

    // Put a path at the front of the recent list (removing an older copy).
    void remember_file(const std::string& path);
    bool operator==(const ViewerSettings&) const = default;
};

// A recent file as the list keeps it: the file's absolute path, then "::join=OTHER" for each file
// joined to it (the text of a FILE argument, so an entry reads as on the command line).
std::string recent_entry(const std::string& path, const std::vector<std::string>& join);
// An entry read back: the file and the files joined to it. A path may itself hold "::" (legal on
// Linux), so the text is not parsed as FILE::options: an entry that names an existing file as a
// whole is that file; else it is cut at "::join=" only where the text before names an existing
// file; a rest that names no file (moved away since) is cut at every "::join=", as written.
// `is_file` says whether a path names an existing file (the caller's file system; tests fake it).
struct RecentEntry {
    std::string path;
    std::vector<std::string> join;
    bool operator==(const RecentEntry&) const = default;
};
RecentEntry split_recent_entry(const std::string& entry, const std::function<bool(const std::string&)>& is_file);

std::string format_settings(const ViewerSettings& s);
// Parse settings text: a pure function of the text (no I/O), linear in its length. Every value
// is checked (finite, in range, whole where it counts something); a bad line keeps the default
// and its problem ("line 4: unknown key 'foo'") is appended to `warnings`: the first
// max_settings_warnings problems, then one line that counts the rest.
inline constexpr std::size_t max_settings_warnings = 20;
ViewerSettings parse_settings(const std::string& text, std::vector<std::string>* warnings = nullptr);

// `proposed` with every number outside its limits (or not finite, or not whole where it counts)
// replaced by the value in `fallback`: the same limits the parser applies.
ViewerSettings within_limits(ViewerSettings proposed, const ViewerSettings& fallback);

}  // namespace ellipsa::viewer
