#include "importers/text_source.hpp"

#include <algorithm>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa {

namespace {

std::string reason(int e) { return std::strerror(e); }

std::string bytes_text(std::size_t n) { return std::to_string(n) + " bytes"; }

long count_newlines(std::string_view s) {
    long n = 0;
    const char* p = s.data();
    const char* const e = p + s.size();
    while (p < e) {
        const void* q = std::memchr(p, '\n', std::size_t(e - p));
        if (!q) break;
        ++n;
        p = static_cast<const char*>(q) + 1;
    }
    return n;
}

// The file is not what it was when opened: it shrank (now < before) or was written to.
Error changed_error(const std::string& path, std::size_t before, std::size_t now) {
    const std::string what = now < before ? "expected the file to keep its size while it is read, found it shrank from "
                                          : "expected the file to stay as it was while it is read, found it changed (";
    return Error{path, 0, 0,
                 what + bytes_text(before) + (now < before ? " to " : ", now ") + bytes_text(now) + (now < before ? "" : ")") +
                     "; is it still being written? read it again once it is complete"};
}

}  // namespace

TextSource TextSource::memory(std::string_view text) {
    TextSource s;
    s.memory_ = text;
    s.size_ = text.size();
    return s;
}

Result<TextSource> TextSource::open(const std::string& path) {
    struct stat st {};
    if (path.empty()) return Error{"", 0, 0, "expected a file name, found an empty one"};  // "" (an unset variable in a script)
    if (::stat(path.c_str(), &st) != 0) return Error{path, 0, 0, "cannot open the file: " + reason(errno)};
    if (S_ISDIR(st.st_mode)) return Error{path, 0, 0, "expected a file, found a directory"};
    if (!S_ISREG(st.st_mode)) return Error{path, 0, 0, "expected a regular file, found a device, pipe or socket"};
    TextSource s;
    s.path_ = path;
    s.fd_ = ::open(path.c_str(), O_RDONLY | O_CLOEXEC | O_NONBLOCK);
    if (s.fd_ < 0) return Error{path, 0, 0, "cannot open the file: " + reason(errno)};
    // What was opened counts (the name may have been replaced in between).
    if (::fstat(s.fd_, &st) != 0 || !S_ISREG(st.st_mode))
        return Error{path, 0, 0, "expected a regular file, found a device, pipe or socket"};
    s.size_ = std::size_t(st.st_size);
    s.modified_ = st.st_mtim;
    ::posix_fadvise(s.fd_, 0, 0, POSIX_FADV_SEQUENTIAL);
    return s;
}

TextSource::TextSource(TextSource&& o) noexcept
    : memory_(o.memory_), path_(std::move(o.path_)), fd_(o.fd_), size_(o.size_), modified_(o.modified_) {
    o.fd_ = -1;
}

TextSource& TextSource::operator=(TextSource&& o) noexcept {
    if (this != &o) {
        if (fd_ >= 0) ::close(fd_);
        memory_ = o.memory_;
        path_ = std::move(o.path_);
        fd_ = o.fd_;
        size_ = o.size_;
        modified_ = o.modified_;
        o.fd_ = -1;
    }
    return *this;
}

TextSource::~TextSource() {
    if (fd_ >= 0) ::close(fd_);
}

Result<std::string_view> TextSource::view(std::size_t offset, std::size_t length, std::vector<char>& buffer) const {
    offset = std::min(offset, size_);
    length = std::min(length, size_ - offset);
    if (fd_ < 0) return memory_.substr(offset, length);
    if (buffer.size() < length) buffer.resize(length);
    std::size_t got = 0;
    while (got < length) {
        const ssize_t r = ::pread(fd_, buffer.data() + got, length - got, off_t(offset + got));
        if (r < 0 && errno == EINTR) continue;
        if (r < 0) return Error{path_, 0, 0, "cannot read the file: " + reason(errno)};
        if (r == 0) {
            struct stat st {};
            return changed_error(path_, size_, ::fstat(fd_, &st) == 0 ? std::size_t(st.st_size) : offset + got);
        }
        got += std::size_t(r);
    }
    return std::string_view(buffer.data(), length);
}

Status TextSource::unchanged() const {
    if (fd_ < 0) return Ok{};
    struct stat st {};
    if (::fstat(fd_, &st) != 0) return Error{path_, 0, 0, "cannot read the file: " + reason(errno)};
    if (std::size_t(st.st_size) == size_ && st.st_mtim.tv_sec == modified_.tv_sec && st.st_mtim.tv_nsec == modified_.tv_nsec)
        return Ok{};
    return changed_error(path_, size_, std::size_t(st.st_size));
}

long TextSource::line_number_at(std::size_t offset) const {
    offset = std::min(offset, size_);
    if (fd_ < 0) return 1 + count_newlines(memory_.substr(0, offset));
    std::vector<char> buffer;
    long n = 1;
    for (std::size_t at = 0; at < offset;) {
        auto w = view(at, std::min<std::size_t>(offset - at, 1u << 20), buffer);
        if (!w || w->empty()) return 0;
        n += count_newlines(*w);
        at += w->size();
    }
    return n;
}

Result<std::string> read_small_file(const std::string& path, std::size_t max_bytes, const char* what) {
    struct stat st {};
    if (::stat(path.c_str(), &st) != 0) return Error{path, 0, 0, std::string("cannot open ") + what + ": " + reason(errno)};
    if (S_ISDIR(st.st_mode)) return Error{path, 0, 0, std::string("expected ") + what + ", found a folder"};
    if (!S_ISREG(st.st_mode))
        return Error{path, 0, 0, std::string("expected ") + what + " (a regular file), found a device, pipe or socket"};
    if (std::size_t(st.st_size) > max_bytes)
        return Error{path, 0, 0, std::string("expected ") + what + " of at most " + bytes_text(max_bytes) + ", found " +
                                     bytes_text(std::size_t(st.st_size))};
    auto src = TextSource::open(path);
    if (!src) return src.error();
    if (src->size() > max_bytes)
        return Error{path, 0, 0, std::string("expected ") + what + " of at most " + bytes_text(max_bytes) + ", found " +
                                     bytes_text(src->size())};
    std::vector<char> buffer;
    auto w = src->view(0, src->size(), buffer);
    if (!w) return w.error();
    return std::string(*w);
}

std::size_t available_memory_bytes() {
    std::FILE* f = std::fopen("/proc/meminfo", "r");
    if (!f) return 0;
    char line[256];
    std::size_t kb = 0;
    while (std::fgets(line, sizeof line, f)) {
        unsigned long long v = 0;
        if (std::sscanf(line, "MemAvailable: %llu kB", &v) == 1) {
            kb = std::size_t(v);
            break;
        }
    }
    std::fclose(f);
    return kb * 1024;
}

}  // namespace ellipsa
