#include "io/atomic_write.hpp"

#include <cerrno>
#include <cstring>
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include "io/place.hpp"

namespace ellipsa::io {

namespace {

std::string reason(int e) { return std::strerror(e); }

// A fresh temporary file beside `path`, created with 0666 so the umask applies as it would to
// the file itself; its name in `tmp`. -1 with errno on failure.
int create_temporary(const std::string& path, std::string& tmp) {
    for (int attempt = 0; attempt < 100; ++attempt) {
        tmp = detail::temporary_name(path);
        const int fd = ::open(tmp.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0666);
        if (fd >= 0 || errno != EEXIST) return fd;
    }
    return -1;
}

int write_all(int fd, std::string_view content) {
    const char* p = content.data();
    std::size_t left = content.size();
    while (left > 0) {
        const ssize_t w = ::write(fd, p, left);
        if (w < 0 && errno == EINTR) continue;
        if (w < 0) return errno;
        p += w;
        left -= std::size_t(w);
    }
    return 0;
}

// The replaced file's permission bits, owner and group (best effort: only root may give a file
// away).
void keep_mode_of(int fd, const struct stat& old) {
    ::fchmod(fd, old.st_mode & 07777);
    struct stat now {};
    if (::fstat(fd, &now) == 0 && (now.st_uid != old.st_uid || now.st_gid != old.st_gid))
        if (::fchown(fd, old.st_uid, old.st_gid) == 0) ::fchmod(fd, old.st_mode & 07777);
}

// What is at `path` now (lstat: a link is not followed), refused before anything is written when
// no write may go there; `replacing` says a regular file will be replaced (its mode is kept).
Status check_target(const std::string& path, bool overwrite, struct stat& old, bool& replacing) {
    if (path.empty() || path.back() == '/')
        return Error{path, 0, 0, std::string("expected a file name, found ") + (path.empty() ? "nothing" : "a folder name")};
    replacing = false;
    if (::lstat(path.c_str(), &old) != 0) return Ok{};  // nothing there, or a folder problem the create step names
    if (S_ISDIR(old.st_mode)) return Error{path, 0, 0, "is a folder; expected a file name (a folder is never replaced by a file)"};
    if (const std::string kind = detail::unreplaceable_kind(old.st_mode); !kind.empty())
        return Error{path, 0, 0, "is " + kind + ", not a regular file; ellipsa writes regular files only (a device, FIFO or socket is never written to or replaced)"};
    if (!overwrite) return Error{path, 0, 0, detail::exists_message};
    replacing = S_ISREG(old.st_mode);
    return Ok{};
}

}  // namespace

Status check_destination(const std::string& path, bool overwrite) {
    struct stat old {};
    bool replacing = false;
    return check_target(path, overwrite, old, replacing);
}

Status write_file_atomically(const std::string& path, std::string_view content, bool overwrite) {
    struct stat old {};
    bool replacing = false;
    // Refuse early what the last step would refuse anyway (no need to write a large file first).
    if (Status ok = check_target(path, overwrite, old, replacing); !ok) return ok;
    std::string tmp;
    const int fd = create_temporary(path, tmp);
    if (fd < 0) return Error{path, 0, 0, detail::parent_problem(path, errno)};
    int e = write_all(fd, content);
    if (e == 0 && replacing) keep_mode_of(fd, old);
    if (e == 0 && ::fsync(fd) != 0) e = errno;
    if (::close(fd) != 0 && e == 0) e = errno;
    if (e != 0) {
        ::unlink(tmp.c_str());
        return Error{path, 0, 0, "write failed: " + reason(e)};
    }
    e = overwrite ? (::rename(tmp.c_str(), path.c_str()) == 0 ? 0 : errno) : detail::rename_no_replace(tmp, path, false);
    if (e != 0) {
        ::unlink(tmp.c_str());
        if (e == EEXIST) return Error{path, 0, 0, detail::exists_message};
        return Error{path, 0, 0, "cannot move the temporary file into place: " + reason(e)};
    }
    detail::sync_parent(path);
    return Ok{};
}

}  // namespace ellipsa::io
