// Write a file so that readers see either the old content or the new one, never a torn file:
// write to a temporary name in the same folder, flush, then move it into place.
#pragma once
#include <string>
#include <string_view>

#include "pattern/result.hpp"

namespace ellipsa::io {

// Always refused, before anything is written: a folder at `path`, and a character or block
// device, FIFO or socket (e.g. /dev/full, /dev/null): a write through one cannot be atomic and
// a rename over one would remove its node, so ellipsa writes regular files only.
// overwrite = false: refuse when anything is at `path` (a file, a link, even a dangling one; the
// message says to use --force). The last step itself decides (a rename that never replaces), so
// of two writers racing for one new name exactly one succeeds.
// overwrite = true: replace a regular file, which keeps its permission bits (and its owner and
// group where the system allows). A symbolic link at `path` is not followed: the link itself is
// replaced by the new file, and what it pointed to is untouched.
// A failed write (folder missing or read-only, disk full) says which folder and why, and leaves
// no temporary file and whatever was at `path` as it was.
// A new file gets the permissions the umask leaves of 0666, as with any program.
// Cost: the content written once, an fsync of the file and of its folder.
Status write_file_atomically(const std::string& path, std::string_view content, bool overwrite = true);

// The refusals write_file_atomically makes before it writes anything (a folder, a device, FIFO
// or socket at `path`; without overwrite, anything at all), for a command to ask before a long
// computation. The same messages: the write itself still decides.
Status check_destination(const std::string& path, bool overwrite);

}  // namespace ellipsa::io
