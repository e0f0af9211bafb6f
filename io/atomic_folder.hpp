// Publish a folder as a whole: build it under a temporary name beside the target, then move it
// into place with one rename (or an atomic exchange with the old folder when replacing), so
// readers see the old folder or the new one, never a half-written mix. A failure at any step
// removes the temporary folder and leaves an existing target untouched.
#pragma once
#include <functional>
#include <string>

#include "pattern/result.hpp"

namespace ellipsa::io {

// fill(dir) writes the folder's files into `dir` (a fresh, empty temporary folder).
// overwrite = false refuses when the target exists (the message says to use --force); a target
// that exists but is not a folder is always refused.
Status publish_folder(const std::string& target, const std::function<Status(const std::string& dir)>& fill,
                      bool overwrite);

}  // namespace ellipsa::io
