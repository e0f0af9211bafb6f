#include "viewer/pattern_files.hpp"

#include <algorithm>
#include <cstdlib>
#include <filesystem>

#include "importers/far_field_csv.hpp"
#include "viewer/scene/demo_scene.hpp"

namespace ellipsa::viewer {

Result<FarFieldSet> load_pattern_file(const std::string& path) {
    auto r = read_far_field_csv(path);
    if (r && r->source.empty()) r->source = path;
    if (r && r->name.empty()) r->name = std::filesystem::path(path).stem().string();
    return r;
}

std::vector<std::string> example_files() {
    namespace fs = std::filesystem;
    std::vector<fs::path> dirs;
    if (const char* e = std::getenv("ELLIPSA_EXAMPLES"); e && *e) dirs.emplace_back(e);
#ifdef ELLIPSA_SOURCE_DIR
    dirs.emplace_back(fs::path(ELLIPSA_SOURCE_DIR) / "examples");
#endif
    std::vector<std::string> out;
    for (const fs::path& d : dirs) {
        std::error_code ec;
        if (!fs::is_directory(d, ec)) continue;
        for (const auto& e : fs::directory_iterator(d, ec))
            if (e.is_regular_file(ec) && e.path().extension() == ".csv") out.push_back(e.path().string());
        if (!out.empty()) break;
    }
    std::sort(out.begin(), out.end());
    return out;
}

std::vector<FarFieldSet> default_patterns(std::string& note) {
    std::vector<FarFieldSet> out;
    for (const std::string& f : example_files()) {
        auto r = load_pattern_file(f);
        if (r) out.push_back(std::move(*r));
        if (out.size() >= 6) break;
    }
    if (!out.empty()) {
        note = "opened the bundled examples";
        return out;
    }
    note = "no example files found: showing built-in closed-form demo antennas";
    return demo_patterns(1.0);
}

}  // namespace ellipsa::viewer
