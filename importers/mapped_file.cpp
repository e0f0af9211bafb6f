#include "importers/mapped_file.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <sys/mman.h>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa {

MappedFile::MappedFile(MappedFile&& o) noexcept : data_(o.data_), size_(o.size_), mapped_(o.mapped_) {
    o.data_ = nullptr;
    o.size_ = 0;
    o.mapped_ = false;
}

MappedFile& MappedFile::operator=(MappedFile&& o) noexcept {
    if (this != &o) {
        this->~MappedFile();
        data_ = o.data_;
        size_ = o.size_;
        mapped_ = o.mapped_;
        o.data_ = nullptr;
        o.size_ = 0;
        o.mapped_ = false;
    }
    return *this;
}

MappedFile::~MappedFile() {
    if (mapped_ && data_) ::munmap(const_cast<char*>(data_), size_);
    data_ = nullptr;
    size_ = 0;
    mapped_ = false;
}

Result<MappedFile> MappedFile::open(const std::string& path) {
    struct stat st {};
    if (::stat(path.c_str(), &st) != 0)
        return Error{path, 0, 0, std::string("cannot open the file: ") + std::strerror(errno)};
    if (S_ISDIR(st.st_mode)) return Error{path, 0, 0, "expected a file, found a directory"};
    if (!S_ISREG(st.st_mode)) return Error{path, 0, 0, "expected a regular file, found a device, pipe or socket"};
    MappedFile m;
    if (st.st_size == 0) return m;  // empty: the reader says so
    int fd = ::open(path.c_str(), O_RDONLY | O_CLOEXEC | O_NONBLOCK);
    if (fd < 0) return Error{path, 0, 0, std::string("cannot open the file: ") + std::strerror(errno)};
    const std::size_t n = std::size_t(st.st_size);
    void* p = ::mmap(nullptr, n, PROT_READ, MAP_PRIVATE, fd, 0);
    int e = errno;
    ::close(fd);
    if (p == MAP_FAILED) return Error{path, 0, 0, std::string("cannot map the file into memory: ") + std::strerror(e)};
    ::madvise(p, n, MADV_SEQUENTIAL);
    m.data_ = static_cast<const char*>(p);
    m.size_ = n;
    m.mapped_ = true;
    return m;
}

void MappedFile::release(std::size_t offset, std::size_t length) const {
    if (!mapped_ || offset >= size_) return;
    if (length > size_ - offset) length = size_ - offset;
    const std::size_t page = std::size_t(::sysconf(_SC_PAGESIZE));
    // Only whole pages inside the range.
    const std::size_t a = (offset + page - 1) / page * page;
    const std::size_t b = (offset + length) / page * page;
    if (b > a) ::madvise(const_cast<char*>(data_) + a, b - a, MADV_DONTNEED);
}

void MappedFile::prefetch(std::size_t offset, std::size_t length) const {
#ifndef MADV_POPULATE_READ
#define MADV_POPULATE_READ 22
#endif
    if (!mapped_ || offset >= size_) return;
    if (length > size_ - offset) length = size_ - offset;
    const std::size_t page = std::size_t(::sysconf(_SC_PAGESIZE));
    const std::size_t a = offset / page * page;
    // Best effort: older kernels answer EINVAL and the pages fault in as usual.
    ::madvise(const_cast<char*>(data_) + a, offset + length - a, MADV_POPULATE_READ);
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
