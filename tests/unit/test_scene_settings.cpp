// Viewer settings text: round trip, bad lines reported with their line number and skipped,
// recent-file list kept short and without duplicates; and the cut-plot grid helpers.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "viewer/scene/settings.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

TEST_CASE("settings round-trip through their text form", "[scene][settings]") {
    ViewerSettings s;
    s.component = Component::rhcp;
    s.color_by = ColorBy::tilt;
    s.gain_map = ColorMap::magma;
    s.range_db = 42;
    s.wireframe = true;
    s.cut_kind = 1;
    s.cut_angle_deg = 60;
    s.cut_components = 0x181;
    s.window_width = 1600;
    s.remember_file("/data/b.csv");
    s.remember_file("/data/a b.csv");
    s.remember_file(recent_entry("/range/co.csv", {"/range/cross.csv"}));  // a joined pattern
    std::vector<std::string> w;
    ViewerSettings t = parse_settings(format_settings(s), &w);
    CHECK(w.empty());
    CHECK(t.component == Component::rhcp);
    CHECK(t.color_by == ColorBy::tilt);
    CHECK(t.gain_map == ColorMap::magma);
    CHECK(t.range_db == 42);
    CHECK(t.wireframe);
    CHECK(t.cut_kind == 1);
    CHECK(t.cut_angle_deg == 60);
    CHECK(t.cut_components == 0x181u);
    CHECK(t.window_width == 1600);
    REQUIRE(t.recent_files.size() == 3);
    CHECK(t.recent_files[0] == "/range/co.csv::join=/range/cross.csv");
    CHECK(t.recent_files[1] == "/data/a b.csv");
}

TEST_CASE("settings numbers with many digits survive their text form exactly", "[scene][settings]") {
    // Found by fuzz_settings: six significant digits turned 3.1234567891 into 3.12346.
    std::vector<std::string> w;
    const ViewerSettings s = parse_settings("range_db = 3.1234567891\nleft_panel_width = 150.123456789\n", &w);
    REQUIRE(w.empty());
    CHECK(s.range_db == 3.1234567891);
    CHECK(s.left_panel_width == 150.123456789f);
    const ViewerSettings t = parse_settings(format_settings(s), &w);
    CHECK(w.empty());
    CHECK(t == s);
}

TEST_CASE("bad settings lines are reported and skipped", "[scene][settings]") {
    std::vector<std::string> w;
    ViewerSettings t = parse_settings("range_db = 20\nnonsense\ncomponent = sideways\nrange_db = 9999\ngain_map = jet\nfoo = 1\n", &w);
    CHECK(t.range_db == 20);
    CHECK(t.component == Component::total);
    CHECK(t.gain_map == ColorMap::viridis);
    REQUIRE(w.size() == 5);
    CHECK(w[0].rfind("line 2:", 0) == 0);
    CHECK(w[2].find("range_db") != std::string::npos);
}

TEST_CASE("the recent-file list keeps the newest first, once, at most ten", "[scene][settings]") {
    ViewerSettings s;
    for (int i = 0; i < 14; ++i) s.remember_file("/f" + std::to_string(i));
    s.remember_file("/f7");
    CHECK(s.recent_files.size() == ViewerSettings::max_recent);
    CHECK(s.recent_files[0] == "/f7");
    CHECK(std::count(s.recent_files.begin(), s.recent_files.end(), "/f7") == 1);
}

TEST_CASE("settings values must be finite, in range and whole where they count", "[scene][settings]") {
    // NaN passes a check written as `d < lo || d > hi`; every such value must keep its default.
    std::vector<std::string> w;
    const ViewerSettings d;
    ViewerSettings t = parse_settings("window_width = nan\nwindow_height = -inf\ncut_panel_height = nan\n"
                                      "left_panel_width = inf\nrange_db = -nan\ncut_kind = 1.5\ncut_angle_deg = nan\n"
                                      "cut_components = 2.5\nright_panel_width = 1e400\nglyphs = nan\n",
                                      &w);
    CHECK(w.size() == 10);
    CHECK(t.window_width == d.window_width);
    CHECK(t.window_height == d.window_height);
    CHECK(t.cut_panel_height == d.cut_panel_height);
    CHECK(t.left_panel_width == d.left_panel_width);
    CHECK(t.right_panel_width == d.right_panel_width);
    CHECK(t.range_db == d.range_db);
    CHECK(t.cut_kind == d.cut_kind);
    CHECK(t.cut_angle_deg == d.cut_angle_deg);
    CHECK(t.cut_components == d.cut_components);
    CHECK(t.glyphs == d.glyphs);
    // Nothing non-finite can be written back.
    CHECK(format_settings(t).find("nan") == std::string::npos);
    CHECK(format_settings(t).find("inf") == std::string::npos);
}

TEST_CASE("a settings text full of problems reports a bounded list", "[scene][settings]") {
    std::string text;
    for (int i = 0; i < 5000; ++i) text += "nonsense\n";
    std::vector<std::string> w;
    parse_settings(text, &w);
    REQUIRE(w.size() == max_settings_warnings + 1);
    CHECK(w.back() == "and 4980 more problems, not listed");
}


// A file name may hold "::" on Linux (POSIX allows any byte but '/' and NUL in a name), so a
// recent entry is read back by which of its parts name files, not as FILE::options.
TEST_CASE("recent entries reopen as they were, even with \"::\" in a file name", "[scene][settings]") {
    const std::vector<std::string> files = {"/d/a::b.csv", "/d/c::up=+x.csv", "/d/co.csv", "/d/cross::2.csv",
                                            "/d/x::join=/y.csv"};
    auto is_file = [&](const std::string& p) { return std::find(files.begin(), files.end(), p) != files.end(); };
    auto round_trip = [&](const std::string& path, const std::vector<std::string>& join) {
        ViewerSettings s;
        s.remember_file(recent_entry(path, join));
        std::vector<std::string> w;
        const ViewerSettings t = parse_settings(format_settings(s), &w);
        CHECK(w.empty());
        REQUIRE(t.recent_files.size() == 1);
        return split_recent_entry(t.recent_files[0], is_file);
    };
    // A literal path with "::" (even one that reads like an option) reopens as that file.
    CHECK(round_trip("/d/a::b.csv", {}) == RecentEntry{"/d/a::b.csv", {}});
    CHECK(round_trip("/d/c::up=+x.csv", {}) == RecentEntry{"/d/c::up=+x.csv", {}});
    CHECK(round_trip("/d/x::join=/y.csv", {}) == RecentEntry{"/d/x::join=/y.csv", {}});
    // Joined entries reopen joined, whatever their names hold.
    CHECK(round_trip("/d/co.csv", {"/d/cross::2.csv"}) == RecentEntry{"/d/co.csv", {"/d/cross::2.csv"}});
    CHECK(round_trip("/d/a::b.csv", {"/d/cross::2.csv", "/d/co.csv"}) ==
          RecentEntry{"/d/a::b.csv", {"/d/cross::2.csv", "/d/co.csv"}});
    CHECK(round_trip("/d/x::join=/y.csv", {"/d/co.csv"}) == RecentEntry{"/d/x::join=/y.csv", {"/d/co.csv"}});
    // Files moved away since: cut as written, so the loader names the missing file itself.
    CHECK(round_trip("/gone/p.csv", {"/gone/q.csv"}) == RecentEntry{"/gone/p.csv", {"/gone/q.csv"}});
    CHECK(round_trip("/d/co.csv", {"/gone/q.csv", "/d/a::b.csv"}) ==
          RecentEntry{"/d/co.csv", {"/gone/q.csv", "/d/a::b.csv"}});
    CHECK(round_trip("/gone/a::b.csv", {}) == RecentEntry{"/gone/a::b.csv", {}});
}
