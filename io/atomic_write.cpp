#include "io/atomic_write.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa::io {

Status write_file_atomically(const std::string& path, std::string_view content, bool overwrite) {
    struct stat st {};
    if (!overwrite && ::stat(path.c_str(), &st) == 0)
        return Error{path, 0, 0, "already exists; use --force to replace it"};
    std::string tmp = path + ".tmp-XXXXXX";
    int fd = ::mkstemp(tmp.data());
    if (fd < 0) return Error{path, 0, 0, std::string("cannot create a temporary file beside it: ") + std::strerror(errno)};
    const char* p = content.data();
    std::size_t left = content.size();
    while (left > 0) {
        ssize_t w = ::write(fd, p, left);
        if (w < 0) {
            if (errno == EINTR) continue;
            int e = errno;
            ::close(fd);
            ::unlink(tmp.c_str());
            return Error{path, 0, 0, std::string("write failed: ") + std::strerror(e)};
        }
        p += w;
        left -= std::size_t(w);
    }
    ::fchmod(fd, 0644);
    if (::fsync(fd) != 0 || ::close(fd) != 0) {
        int e = errno;
        ::unlink(tmp.c_str());
        return Error{path, 0, 0, std::string("write failed: ") + std::strerror(e)};
    }
    if (::rename(tmp.c_str(), path.c_str()) != 0) {
        int e = errno;
        ::unlink(tmp.c_str());
        return Error{path, 0, 0, std::string("cannot rename the temporary file into place: ") + std::strerror(e)};
    }
    return Ok{};
}

}  // namespace ellipsa::io
