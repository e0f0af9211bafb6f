#include "viewer/pattern_files.hpp"

#include <algorithm>
#include <cstdlib>
#include <filesystem>

#include "importers/far_field_csv.hpp"
#include "pattern/integrate.hpp"
#include "viewer/scene/demo_scene.hpp"

namespace ellipsa::viewer {

Result<FarFieldSet> load_pattern_file(const std::string& path, const CsvReadOptions& options,
                                      const std::vector<std::string>& join) {
    auto r = read_joined_far_field_csv(path, join, options);
    if (r && r->grid.sampling == Sampling::cuts)  // the window draws surfaces over the sphere
        return Error{path, 0, 0,
                     "the viewer's 3D view needs the whole sphere; " + sphere_shortfall(r->grid) +
                         ": ellipsa cut, probe and info read cuts"};
    if (r && r->source.empty()) r->source = path;
    if (r && r->name.empty()) r->name = std::filesystem::path(path).stem().string();
    return r;
}

Result<FarFieldSet> load_pattern_file(const std::string& path, const std::string& map_file,
                                      std::function<bool(double)> progress) {
    CsvReadOptions ro;
    ro.progress = std::move(progress);
    const std::string map = map_file.empty() ? find_csv_map_beside(path) : map_file;
    if (!map.empty())
        if (Status st = read_csv_map_file(map, ro); !st) return st.error();
    return load_pattern_file(path, ro);
}

std::vector<std::string> example_files() {
    namespace fs = std::filesystem;
    std::vector<fs::path> dirs;
    if (const char* e = std::getenv("ELLIPSA_EXAMPLES"); e && *e) dirs.emplace_back(e);
#ifdef ELLIPSA_EXAMPLES_FROM_BINDIR
    // An installed copy: the examples' folder beside the executable's (packaging/CMakeLists.txt).
    std::error_code exe_ec;
    const fs::path exe = fs::read_symlink("/proc/self/exe", exe_ec);
    if (!exe_ec) dirs.push_back((exe.parent_path() / ELLIPSA_EXAMPLES_FROM_BINDIR).lexically_normal());
#endif
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
    // Full-sphere patterns first: the first one is what the viewer shows.
    std::stable_partition(out.begin(), out.end(), [](const FarFieldSet& s) { return s.grid.has_north_pole() && s.grid.has_south_pole(); });
    if (!out.empty()) {
        note = "opened the bundled examples";
        return out;
    }
    note = "no example files found: showing built-in closed-form demo antennas";
    return demo_patterns(1.0);
}

}  // namespace ellipsa::viewer
