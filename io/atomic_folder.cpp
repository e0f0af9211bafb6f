#include "io/atomic_folder.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <filesystem>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa::io {

namespace {

std::string strip_slashes(std::string p) {
    while (p.size() > 1 && p.back() == '/') p.pop_back();
    return p;
}

void remove_tree(const std::string& p) {
    std::error_code ec;
    std::filesystem::remove_all(p, ec);
}

void sync_parent(const std::string& path) {
    const std::size_t slash = path.rfind('/');
    const std::string parent = slash == std::string::npos ? "." : slash == 0 ? "/" : path.substr(0, slash);
    int fd = ::open(parent.c_str(), O_RDONLY | O_DIRECTORY);
    if (fd >= 0) {
        ::fsync(fd);
        ::close(fd);
    }
}

}  // namespace

Status publish_folder(const std::string& target_in, const std::function<Status(const std::string&)>& fill,
                      bool overwrite) {
    const std::string target = strip_slashes(target_in);
    if (target.empty()) return Error{target_in, 0, 0, "expected a folder name"};
    struct stat st {};
    const bool exists = ::lstat(target.c_str(), &st) == 0;
    if (exists && !S_ISDIR(st.st_mode)) return Error{target, 0, 0, "exists and is not a folder; not replacing it"};
    if (exists && !overwrite) return Error{target, 0, 0, "already exists; use --force to replace it"};

    std::string tmp = target + ".tmp-XXXXXX";
    if (::mkdtemp(tmp.data()) == nullptr)
        return Error{target, 0, 0, std::string("cannot create a temporary folder beside it: ") + std::strerror(errno)};
    ::chmod(tmp.c_str(), 0755);
    Status filled = fill(tmp);
    if (!filled) {
        remove_tree(tmp);
        return filled;
    }
    if (!exists) {
        if (::rename(tmp.c_str(), target.c_str()) != 0) {
            const int e = errno;
            remove_tree(tmp);
            return Error{target, 0, 0, std::string("cannot move the finished folder into place: ") + std::strerror(e)};
        }
        sync_parent(target);
        return Ok{};
    }
    // Replace: swap the two folders in one step (Linux renameat2 RENAME_EXCHANGE), then delete the
    // old content, which now sits under the temporary name.
    if (::renameat2(AT_FDCWD, tmp.c_str(), AT_FDCWD, target.c_str(), RENAME_EXCHANGE) == 0) {
        sync_parent(target);
        remove_tree(tmp);
        return Ok{};
    }
    // File systems without exchange: move the old folder aside, the new one in, then delete the
    // old one; if the second move fails, put the old folder back.
    std::string old = target + ".old-XXXXXX";
    if (::mkdtemp(old.data()) == nullptr || ::rmdir(old.c_str()) != 0 || ::rename(target.c_str(), old.c_str()) != 0) {
        const int e = errno;
        remove_tree(tmp);
        return Error{target, 0, 0, std::string("cannot replace the existing folder: ") + std::strerror(e)};
    }
    if (::rename(tmp.c_str(), target.c_str()) != 0) {
        const int e = errno;
        ::rename(old.c_str(), target.c_str());
        remove_tree(tmp);
        return Error{target, 0, 0, std::string("cannot move the finished folder into place: ") + std::strerror(e)};
    }
    sync_parent(target);
    remove_tree(old);
    return Ok{};
}

}  // namespace ellipsa::io
