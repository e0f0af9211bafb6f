#include "viewer/settings_file.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstdlib>
#include <cstring>
#include <filesystem>

#include "io/atomic_write.hpp"

namespace ellipsa::viewer {

SettingsPlace settings_place(bool create) {
    namespace fs = std::filesystem;
    SettingsPlace p;
    // The XDG Base Directory Specification: a relative XDG_CONFIG_HOME is invalid and ignored.
    if (const char* x = std::getenv("XDG_CONFIG_HOME"); x && *x == '/')
        p.dir = (fs::path(x) / "ellipsa").string();
    else if (const char* h = std::getenv("HOME"); h && *h)
        p.dir = (fs::path(h) / ".config" / "ellipsa").string();
    if (p.dir.empty()) p.problem = "neither XDG_CONFIG_HOME nor HOME is set";
    if (p.dir.empty() || !create) return p;
    std::error_code ec;
    fs::create_directories(p.dir, ec);
    if (ec)
        p.problem = p.dir + ": cannot create the folder (" + ec.message() + ")";
    else if (!fs::is_directory(p.dir, ec))
        p.problem = p.dir + ": not a folder";
    return p;
}

Result<std::optional<std::string>> read_settings_text(const std::string& path, std::size_t max_bytes) {
    // O_NONBLOCK: opening a FIFO for reading returns at once instead of waiting for a writer.
    const int fd = ::open(path.c_str(), O_RDONLY | O_NONBLOCK | O_CLOEXEC);
    if (fd < 0) {
        if (errno == ENOENT) return std::optional<std::string>{};
        return Error{path, 0, 0, std::string("cannot open: ") + std::strerror(errno)};
    }
    struct Closer {
        int fd;
        ~Closer() { ::close(fd); }
    } closer{fd};
    struct stat st {};
    if (::fstat(fd, &st) != 0) return Error{path, 0, 0, std::string("cannot read: ") + std::strerror(errno)};
    if (!S_ISREG(st.st_mode)) return Error{path, 0, 0, "expected a regular file, found a device, pipe, socket or folder; not read"};
    if (std::size_t(st.st_size) > max_bytes)
        return Error{path, 0, 0, "expected at most " + std::to_string(max_bytes / 1024) + " KiB, found " +
                                     std::to_string(st.st_size / 1024) + " KiB; not read"};
    // Read at most max_bytes + 1, in case the file grows while it is read.
    std::string text(max_bytes + 1, '\0');
    std::size_t got = 0;
    while (got < text.size()) {
        const ssize_t n = ::read(fd, text.data() + got, text.size() - got);
        if (n < 0 && errno == EINTR) continue;
        if (n < 0) return Error{path, 0, 0, std::string("cannot read: ") + std::strerror(errno)};
        if (n == 0) break;
        got += std::size_t(n);
    }
    if (got > max_bytes) return Error{path, 0, 0, "grew past " + std::to_string(max_bytes / 1024) + " KiB while read; not read"};
    text.resize(got);
    return std::optional<std::string>(std::move(text));
}

namespace {
std::optional<std::string> read_or_warn(const std::string& path, std::vector<std::string>& warnings) {
    auto r = read_settings_text(path);
    if (!r) {
        warnings.push_back(r.error().format());
        return std::nullopt;
    }
    return std::move(*r);
}
}  // namespace

ViewerSettings load_settings(const SettingsPlace& p, std::vector<std::string>& warnings) {
    if (p.dir.empty()) return {};
    const std::string path = p.dir + "/viewer.conf";
    const std::optional<std::string> text = read_or_warn(path, warnings);
    if (!text) return {};
    std::vector<std::string> w;
    ViewerSettings s = parse_settings(*text, &w);
    for (std::string& m : w) warnings.push_back(path + ": " + m);
    return s;
}

std::optional<std::string> load_imgui_ini(const SettingsPlace& p, std::vector<std::string>& warnings) {
    if (p.dir.empty()) return std::nullopt;
    return read_or_warn(p.dir + "/imgui.ini", warnings);
}

namespace {
// Replace a settings file, never anything else: a missing file or a regular one is written
// (through a link, the file it points to, so the user's link stays); a FIFO, a device or a
// folder in its place is left alone.
Status save_one(const std::string& path, const std::string& text) {
    namespace fs = std::filesystem;
    std::error_code ec;
    std::string target = path;
    if (fs::is_symlink(path, ec)) {
        const fs::path resolved = fs::canonical(path, ec);
        if (ec) return Error{path, 0, 0, "a link that leads nowhere usable; not replaced"};
        target = resolved.string();
    }
    const fs::file_status st = fs::status(target, ec);
    if (fs::exists(st) && !fs::is_regular_file(st)) return Error{path, 0, 0, "not a regular file; not replaced"};
    return io::write_file_atomically(target, text, true);
}
}  // namespace

Status save_settings(const SettingsPlace& p, const ViewerSettings& s, const std::optional<std::string>& imgui_ini) {
    if (!p.can_save()) return Error{p.dir, 0, 0, p.problem.empty() ? "no folder for settings" : p.problem};
    if (Status st = save_one(p.dir + "/viewer.conf", format_settings(s)); !st) return st;
    if (imgui_ini) return save_one(p.dir + "/imgui.ini", *imgui_ini);
    return Ok{};
}

}  // namespace ellipsa::viewer
