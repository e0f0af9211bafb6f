// A read-only view of a whole file, memory-mapped when possible.
//
// Only regular files are opened (a FIFO, device or directory is refused before it is opened,
// so nothing can block). The mapping is released when the object goes away. Mapping costs no
// heap memory: pages are read on demand and the reader drops them behind itself
// (release()) so resident memory stays small even for files larger than RAM.
#pragma once
#include <cstddef>
#include <string>
#include <string_view>

#include "pattern/result.hpp"

namespace ellipsa {

class MappedFile {
public:
    MappedFile() = default;
    MappedFile(const MappedFile&) = delete;
    MappedFile& operator=(const MappedFile&) = delete;
    MappedFile(MappedFile&& o) noexcept;
    MappedFile& operator=(MappedFile&& o) noexcept;
    ~MappedFile();

    // Open and map `path`. Errors name the path and the reason.
    static Result<MappedFile> open(const std::string& path);

    std::string_view text() const { return {data_, size_}; }
    // Tell the kernel the bytes [offset, offset + length) are not needed for now (resident
    // memory drops; a later read faults them back in from the page cache).
    void release(std::size_t offset, std::size_t length) const;
    // Map the pages of [offset, offset + length) now, in one call, instead of one fault at a time.
    void prefetch(std::size_t offset, std::size_t length) const;

private:
    const char* data_ = nullptr;
    std::size_t size_ = 0;
    bool mapped_ = false;
};

// Bytes of memory the system can give us now (MemAvailable from /proc/meminfo), or 0 when unknown.
std::size_t available_memory_bytes();

}  // namespace ellipsa
