#include "viewer/scene/settings.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <sstream>
#include <string_view>
#include <type_traits>

namespace ellipsa::viewer {

void ViewerSettings::remember_file(const std::string& path) {
    if (path.empty()) return;
    recent_files.erase(std::remove(recent_files.begin(), recent_files.end(), path), recent_files.end());
    recent_files.insert(recent_files.begin(), path);
    if (recent_files.size() > max_recent) recent_files.resize(max_recent);
}

std::string recent_entry(const std::string& path, const std::vector<std::string>& join) {
    std::string out = path;
    for (const std::string& j : join) out += "::join=" + j;
    return out;
}

namespace {
constexpr std::string_view join_mark = "::join=";

// The entry cut at every "::join=" (the form as written).
std::vector<std::string> pieces_of(const std::string& entry) {
    std::vector<std::string> pieces;
    std::size_t from = 0;
    for (std::size_t at; (at = entry.find(join_mark, from)) != std::string::npos; from = at + join_mark.size())
        pieces.push_back(entry.substr(from, at - from));
    pieces.push_back(entry.substr(from));
    return pieces;
}
}  // namespace

RecentEntry split_recent_entry(const std::string& entry, const std::function<bool(const std::string&)>& is_file) {
    if (is_file(entry)) return {entry, {}};
    const std::vector<std::string> pieces = pieces_of(entry);
    // Greedy: each file is the shortest run of pieces that names an existing file.
    std::vector<std::string> files;
    std::string current = pieces[0];
    for (std::size_t i = 1; i < pieces.size(); ++i) {
        if (is_file(current)) {
            files.push_back(current);
            current = pieces[i];
        } else {
            current += std::string(join_mark) + pieces[i];
        }
    }
    if (is_file(current)) files.push_back(current);
    else  // the rest names no file (moved away since): cut as written
        for (std::string& p : pieces_of(current)) files.push_back(std::move(p));
    RecentEntry e{files[0], {}};
    e.join.assign(files.begin() + 1, files.end());
    return e;
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

// Every number and flag of the settings with its limits: the one list that the text form, the
// parser and within_limits() use.
template <class S, class F>
void for_each_number(S& s, F&& f) {
    f("range_db", s.range_db, 3.0, 120.0);
    f("glyph_spacing_deg", s.glyph_spacing_deg, 3.0, 45.0);
    f("cut_kind", s.cut_kind, 0.0, 2.0);
    f("cut_angle_deg", s.cut_angle_deg, -360.0, 360.0);
    f("cut_components", s.cut_components, 0.0, 511.0);
    f("poincare_within_db", s.poincare_within_db, 0.1, 60.0);
    f("window_width", s.window_width, 320.0, 16384.0);
    f("window_height", s.window_height, 240.0, 16384.0);
    f("left_panel_width", s.left_panel_width, 150.0, 2000.0);
    f("right_panel_width", s.right_panel_width, 150.0, 2000.0);
    f("cut_panel_height", s.cut_panel_height, 100.0, 2000.0);
    f("polarisation_panel_height", s.polarisation_panel_height, 150.0, 2000.0);
}
template <class S, class F>
void for_each_flag(S& s, F&& f) {
    f("wireframe", s.wireframe);
    f("translucent", s.translucent);
    f("glyphs", s.glyphs);
    f("polar_plot", s.polar_plot);
    f("cut_phase", s.cut_phase);
    f("seen_intro", s.seen_intro);
}

// Written as "inside" so that NaN fails it; whole-number fields take whole numbers only.
template <class T>
bool number_fits(double d, double lo, double hi) {
    return d >= lo && d <= hi && (std::is_floating_point_v<T> || d == std::floor(d));
}

// One "key = value" line into s; false (and why) when the key or value is not usable.
bool parse_line(ViewerSettings& s, const std::string& k, const std::string& v, std::string& why) {
    if (k == "component") return parse_component(v.c_str(), s.component) || (why = "unknown component '" + v + "'", false);
    if (k == "color_by") return parse_color_by(v, s.color_by) || (why = "unknown colouring '" + v + "'", false);
    if (k == "gain_map") {
        ColorMap m;
        if (parse_color_map(v, m) && is_sequential(m)) return s.gain_map = m, true;
        return why = "'gain_map' expects viridis, cividis or magma, found '" + v + "'", false;
    }
    if (k == "recent") {
        if (!v.empty() && s.recent_files.size() < ViewerSettings::max_recent) s.recent_files.push_back(v);
        return true;
    }
    double d = 0;
    const bool num = to_double(v, d);
    bool known = false, ok = false;
    for_each_number(s, [&](const char* name, auto& field, double lo, double hi) {
        using T = std::remove_reference_t<decltype(field)>;
        if (k != name) return;
        known = true;
        ok = num && number_fits<T>(d, lo, hi);
        if (ok) field = static_cast<T>(d);
        else why = "'" + k + "' expects " + (std::is_floating_point_v<T> ? "a number" : "a whole number") + " from " +
                   number_text(lo) + " to " + number_text(hi) + ", found '" + v + "'";
    });
    for_each_flag(s, [&](const char* name, bool& field) {
        if (k != name) return;
        known = true;
        ok = num && (d == 0 || d == 1);
        if (ok) field = d != 0;
        else why = "'" + k + "' expects 0 or 1, found '" + v + "'";
    });
    if (!known) why = "unknown key '" + k + "'";
    return ok;
}
}  // namespace

std::string format_settings(const ViewerSettings& s) {
    std::ostringstream o;
    o << "# ellipsa viewer settings (written by the viewer; safe to delete)\n";
    o << "component = " << to_string(s.component) << "\n";
    o << "color_by = " << to_string(s.color_by) << "\n";
    o << "gain_map = " << to_string(s.gain_map) << "\n";
    // The shortest text that reads back as the same double (a float field widens exactly), so
    // that settings survive their own text form (the fuzz target checks it).
    for_each_number(s, [&](const char* name, const auto& field, double, double) {
        char b[32];
        const auto r = std::to_chars(b, b + sizeof b, double(field));
        o << name << " = " << std::string_view(b, std::size_t(r.ptr - b)) << "\n";
    });
    for_each_flag(s, [&](const char* name, bool field) { o << name << " = " << (field ? 1 : 0) << "\n"; });
    for (const std::string& f : s.recent_files) o << "recent = " << f << "\n";
    return o.str();
}

ViewerSettings parse_settings(const std::string& text, std::vector<std::string>* warnings) {
    ViewerSettings s;
    std::istringstream in(text);
    std::string line, why;
    std::size_t n = 0, problems = 0;
    auto warn = [&](const std::string& what) {
        if (warnings && ++problems <= max_settings_warnings) warnings->push_back("line " + std::to_string(n) + ": " + what);
    };
    while (std::getline(in, line)) {
        ++n;
        line = trim(line);
        if (line.empty() || line[0] == '#') continue;
        const auto eq = line.find('=');
        if (eq == std::string::npos) warn("expected 'key = value', found '" + line + "'");
        else if (!parse_line(s, trim(line.substr(0, eq)), trim(line.substr(eq + 1)), why)) warn(why);
    }
    if (warnings && problems > max_settings_warnings)
        warnings->push_back("and " + std::to_string(problems - max_settings_warnings) + " more problems, not listed");
    return s;
}

ViewerSettings within_limits(ViewerSettings proposed, const ViewerSettings& fallback) {
    std::vector<double> kept;  // the fallback's numbers, in the list's order
    for_each_number(fallback, [&](const char*, const auto& value, double, double) { kept.push_back(double(value)); });
    std::size_t i = 0;
    for_each_number(proposed, [&](const char*, auto& field, double lo, double hi) {
        using T = std::remove_reference_t<decltype(field)>;
        if (!number_fits<T>(double(field), lo, hi)) field = static_cast<T>(kept[i]);
        ++i;
    });
    if (!is_sequential(proposed.gain_map)) proposed.gain_map = fallback.gain_map;
    return proposed;
}

}  // namespace ellipsa::viewer
