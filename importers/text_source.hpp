// Where a reader's text comes from: bytes already in memory, or a regular file read in windows.
//
// A file is read with pread() into a buffer the caller owns, never memory-mapped: a mapped file
// that another program truncates while it is read kills the reader with SIGBUS, and no signal
// handler can recover from that cleanly in a multi-threaded library. Reading costs one copy from
// the page cache (about a tenth of the time the parser spends on the same bytes) and no
// resident memory beyond the windows. A file that shrinks or changes while it is read ends in
// an Error that says so.
#pragma once
#include <cstddef>
#include <ctime>
#include <string>
#include <string_view>
#include <vector>

#include "pattern/result.hpp"

namespace ellipsa {

class TextSource {
public:
    // Text in memory; it must outlive the source.
    static TextSource memory(std::string_view text);
    // Open a regular file for reading (a FIFO, device or directory is refused before it is
    // opened, and the opened file is checked again, so nothing can block). Errors name the path.
    static Result<TextSource> open(const std::string& path);

    TextSource(const TextSource&) = delete;
    TextSource& operator=(const TextSource&) = delete;
    TextSource(TextSource&& o) noexcept;
    TextSource& operator=(TextSource&& o) noexcept;
    ~TextSource();

    std::size_t size() const { return size_; }

    // The bytes [offset, offset + length), clipped at size(): a view of the text in memory, or the
    // bytes read into `buffer` (grown as needed). The view lives until `buffer` is used again.
    // An Error when the file now ends earlier than it did when opened, or cannot be read.
    Result<std::string_view> view(std::size_t offset, std::size_t length, std::vector<char>& buffer) const;

    // Ok when the file still has the size and modification time it had when opened (always Ok
    // in memory); otherwise an Error saying that it changed while it was read.
    Status unchanged() const;

    // Line number (1-based) of the line that holds byte `offset`: one pass over the bytes before
    // it, done only when an error is reported. 0 when the bytes cannot be read any more.
    long line_number_at(std::size_t offset) const;

private:
    TextSource() = default;
    std::string_view memory_;
    std::string path_;
    int fd_ = -1;
    std::size_t size_ = 0;
    timespec modified_{};
};

// The whole of a small side file (a map file, an elevation profile): a regular file only (a FIFO,
// device or directory is refused before it is opened, so nothing blocks or grows without
// bound), at most max_bytes (checked before reading). `what` names it in messages ("a map file").
Result<std::string> read_small_file(const std::string& path, std::size_t max_bytes, const char* what);

// Bytes of memory the system can give us now (MemAvailable from /proc/meminfo), or 0 when unknown.
std::size_t available_memory_bytes();

}  // namespace ellipsa
