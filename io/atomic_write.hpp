// Write a file so that readers see either the old content or the new one, never a torn file:
// write to a temporary name in the same folder, flush, then rename over the target.
#pragma once
#include <string>
#include <string_view>

#include "pattern/result.hpp"

namespace ellipsa::io {

// overwrite = false refuses when `path` exists (the message says to use --force).
Status write_file_atomically(const std::string& path, std::string_view content, bool overwrite = true);

}  // namespace ellipsa::io
