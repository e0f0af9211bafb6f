#include "viewer/scene/settings.hpp"

#include <algorithm>
#include <cmath>
#include <type_traits>
#include <cstdio>
#include <cstdlib>
#include <sstream>

namespace ellipsa::viewer {

void ViewerSettings::remember_file(const std::string& path) {
    if (path.empty()) return;
    recent_files.erase(std::remove(recent_files.begin(), recent_files.end(), path), recent_files.end());
    recent_files.insert(recent_files.begin(), path);
    if (recent_files.size() > max_recent) recent_files.resize(max_recent);
}

namespace {
std::string trim(const std::string& s) {
    const auto a = s.find_first_not_of(" \t\r"), b = s.find_last_not_of(" \t\r");
    return a == std::string::npos ? "" : s.substr(a, b - a + 1);
}
std::string number_text(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%g", v);
    return b;
}
bool to_double(const std::string& v, double& out) {
    char* end = nullptr;
    const double d = std::strtod(v.c_str(), &end);
    if (end == v.c_str() || *end) return false;
    out = d;
    return true;
}
}  // namespace

std::string format_settings(const ViewerSettings& s) {
    std::ostringstream o;
    o << "# ellipsa viewer settings (written by the viewer; safe to delete)\n";
    o << "component = " << to_string(s.component) << "\n";
    o << "color_by = " << to_string(s.color_by) << "\n";
    o << "gain_map = " << to_string(s.gain_map) << "\n";
    o << "range_db = " << s.range_db << "\n";
    o << "wireframe = " << s.wireframe << "\n";
    o << "translucent = " << s.translucent << "\n";
    o << "glyphs = " << s.glyphs << "\n";
    o << "glyph_spacing_deg = " << s.glyph_spacing_deg << "\n";
    o << "polar_plot = " << s.polar_plot << "\n";
    o << "cut_kind = " << s.cut_kind << "\n";
    o << "cut_angle_deg = " << s.cut_angle_deg << "\n";
    o << "cut_components = " << s.cut_components << "\n";
    o << "poincare_within_db = " << s.poincare_within_db << "\n";
    o << "seen_intro = " << s.seen_intro << "\n";
    o << "window_width = " << s.window_width << "\n";
    o << "window_height = " << s.window_height << "\n";
    o << "left_panel_width = " << s.left_panel_width << "\n";
    o << "right_panel_width = " << s.right_panel_width << "\n";
    o << "cut_panel_height = " << s.cut_panel_height << "\n";
    for (const std::string& f : s.recent_files) o << "recent = " << f << "\n";
    return o.str();
}

ViewerSettings parse_settings(const std::string& text, std::vector<std::string>* warnings) {
    ViewerSettings s;
    std::istringstream in(text);
    std::string line;
    int n = 0;
    std::size_t problems = 0;
    auto warn = [&](const std::string& what) {
        if (warnings && ++problems <= max_settings_warnings) warnings->push_back("line " + std::to_string(n) + ": " + what);
    };
    while (std::getline(in, line)) {
        ++n;
        line = trim(line);
        if (line.empty() || line[0] == '#') continue;
        const auto eq = line.find('=');
        if (eq == std::string::npos) {
            warn("expected 'key = value', found '" + line + "'");
            continue;
        }
        const std::string k = trim(line.substr(0, eq)), v = trim(line.substr(eq + 1));
        double d = 0;
        const bool num = to_double(v, d);
        // Written as "inside" so that NaN fails it; whole-number fields take whole numbers only.
        auto need_num = [&](auto& field, double lo, double hi) {
            using T = std::remove_reference_t<decltype(field)>;
            const bool whole = !std::is_floating_point_v<T>;
            if (num && d >= lo && d <= hi && (!whole || d == std::floor(d)))
                field = static_cast<T>(d);
            else
                warn("'" + k + "' expects " + (whole ? "a whole number" : "a number") + " from " + number_text(lo) + " to " +
                     number_text(hi) + ", found '" + v + "'");
        };
        auto need_bool = [&](bool& field) {
            if (!num || (d != 0 && d != 1))
                warn("'" + k + "' expects 0 or 1, found '" + v + "'");
            else
                field = d != 0;
        };
        if (k == "component") {
            if (!parse_component(v.c_str(), s.component)) warn("unknown component '" + v + "'");
        } else if (k == "color_by") {
            if (!parse_color_by(v, s.color_by)) warn("unknown colouring '" + v + "'");
        } else if (k == "gain_map") {
            if (!parse_color_map(v, s.gain_map) || !is_sequential(s.gain_map)) {
                warn("'gain_map' expects viridis, cividis or magma, found '" + v + "'");
                s.gain_map = ColorMap::viridis;
            }
        } else if (k == "range_db") need_num(s.range_db, 3, 120);
        else if (k == "wireframe") need_bool(s.wireframe);
        else if (k == "translucent") need_bool(s.translucent);
        else if (k == "glyphs") need_bool(s.glyphs);
        else if (k == "glyph_spacing_deg") need_num(s.glyph_spacing_deg, 3, 45);
        else if (k == "polar_plot") need_bool(s.polar_plot);
        else if (k == "cut_kind") need_num(s.cut_kind, 0, 2);
        else if (k == "cut_angle_deg") need_num(s.cut_angle_deg, -360, 360);
        else if (k == "cut_components") need_num(s.cut_components, 0, 511);
        else if (k == "poincare_within_db") need_num(s.poincare_within_db, 0.1, 60);
        else if (k == "seen_intro") need_bool(s.seen_intro);
        else if (k == "window_width") need_num(s.window_width, 320, 16384);
        else if (k == "window_height") need_num(s.window_height, 240, 16384);
        else if (k == "left_panel_width") need_num(s.left_panel_width, 150, 2000);
        else if (k == "right_panel_width") need_num(s.right_panel_width, 150, 2000);
        else if (k == "cut_panel_height") need_num(s.cut_panel_height, 100, 2000);
        else if (k == "recent") {
            if (!v.empty() && s.recent_files.size() < ViewerSettings::max_recent) s.recent_files.push_back(v);
        } else
            warn("unknown key '" + k + "'");
    }
    if (warnings && problems > max_settings_warnings)
        warnings->push_back("and " + std::to_string(problems - max_settings_warnings) + " more problems, not listed");
    return s;
}

}  // namespace ellipsa::viewer
