#include "io/place.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <random>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa::io::detail {

std::string temporary_name(const std::string& path) {
    static constexpr char letters[] = "abcdefghijklmnopqrstuvwxyz0123456789";
    std::random_device rd;
    std::string name = path + ".tmp-";
    for (int i = 0; i < 8; ++i) name += letters[rd() % (sizeof letters - 1)];
    return name;
}

int rename_no_replace(const std::string& from, const std::string& to, bool folder) {
    if (::renameat2(AT_FDCWD, from.c_str(), AT_FDCWD, to.c_str(), RENAME_NOREPLACE) == 0) return 0;
    if (errno != EINVAL && errno != ENOSYS && errno != EOPNOTSUPP) return errno;
    // A file system without RENAME_NOREPLACE.
    struct stat st {};
    if (::lstat(to.c_str(), &st) == 0) return EEXIST;
    if (folder) return ::rename(from.c_str(), to.c_str()) == 0 ? 0 : (errno == ENOTEMPTY ? EEXIST : errno);
    if (::link(from.c_str(), to.c_str()) == 0) {
        ::unlink(from.c_str());
        return 0;
    }
    if (errno != EPERM && errno != EOPNOTSUPP) return errno;
    // No hard links either: claim the name with an exclusive create, then rename over the claim.
    const int fd = ::open(to.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0600);
    if (fd < 0) return errno;
    ::close(fd);
    if (::rename(from.c_str(), to.c_str()) == 0) return 0;
    const int e = errno;
    ::unlink(to.c_str());
    return e;
}

namespace {
std::string parent_of(const std::string& path) {
    const std::size_t slash = path.rfind('/');
    return slash == std::string::npos ? "." : slash == 0 ? "/" : path.substr(0, slash);
}
}  // namespace

std::string parent_problem(const std::string& path, int e) {
    const std::string parent = parent_of(path);
    if (e == ENOENT) return "cannot write: the folder " + parent + " does not exist";
    if (e == ENOTDIR) return "cannot write: " + parent + " is not a folder (or a part of it is not)";
    return "cannot create a file in the folder " + parent + ": " + std::strerror(e);
}

std::string unreplaceable_kind(unsigned st_mode) {
    if (S_ISCHR(st_mode)) return "a character device";
    if (S_ISBLK(st_mode)) return "a block device";
    if (S_ISFIFO(st_mode)) return "a FIFO (named pipe)";
    if (S_ISSOCK(st_mode)) return "a socket";
    return "";
}

void sync_parent(const std::string& path) {
    const std::string parent = parent_of(path);
    const int fd = ::open(parent.c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC);
    if (fd >= 0) {
        ::fsync(fd);
        ::close(fd);
    }
}

}  // namespace ellipsa::io::detail
