#include "viewer/settings_file.hpp"

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "io/atomic_write.hpp"

namespace ellipsa::viewer {

std::string config_dir() {
    namespace fs = std::filesystem;
    if (const char* x = std::getenv("XDG_CONFIG_HOME"); x && *x) return (fs::path(x) / "ellipsa").string();
    if (const char* h = std::getenv("HOME"); h && *h) return (fs::path(h) / ".config" / "ellipsa").string();
    return "";
}

ViewerSettings load_settings(std::vector<std::string>& warnings) {
    const std::string dir = config_dir();
    if (dir.empty()) return {};
    std::ifstream in(dir + "/viewer.conf");
    if (!in) return {};
    std::stringstream ss;
    ss << in.rdbuf();
    std::vector<std::string> w;
    ViewerSettings s = parse_settings(ss.str(), &w);
    for (std::string& m : w) warnings.push_back(dir + "/viewer.conf: " + m);
    return s;
}

bool save_settings(const ViewerSettings& s, std::string& message) {
    const std::string dir = config_dir();
    if (dir.empty()) return true;
    std::error_code ec;
    std::filesystem::create_directories(dir, ec);
    Status st = io::write_file_atomically(dir + "/viewer.conf", format_settings(s), true);
    if (!st) message = st.error().format();
    return st.ok();
}

}  // namespace ellipsa::viewer
