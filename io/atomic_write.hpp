// Write a file so that readers see either the old content or the new one, never a torn file:
// write to a temporary name in the same folder, flush, then move it into place.
#pragma once
#include <string>
#include <string_view>

#include "pattern/result.hpp"

namespace ellipsa::io {

// overwrite = false: refuse when anything is at `path` (a file, a folder, a link, even a dangling
// one; the message says to use --force). The last step itself decides (a rename that never
// replaces), so of two writers racing for one new name exactly one succeeds.
// overwrite = true: replace what is there; a replaced file keeps its permission bits (and its
// owner and group where the system allows).
// A new file gets the permissions the umask leaves of 0666, as with any program.
// Cost: the content written once, an fsync of the file and of its folder.
Status write_file_atomically(const std::string& path, std::string_view content, bool overwrite = true);

}  // namespace ellipsa::io
