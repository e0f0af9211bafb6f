// Publish a folder as a whole: build it under a temporary name beside the target, then move it
// into place with one rename (or an atomic exchange with the old folder when replacing), so
// readers see the old folder or the new one, never a half-written mix. A failure at any step
// removes the temporary folder and leaves an existing target untouched.
#pragma once
#include <functional>
#include <string>
#include <vector>

#include "pattern/result.hpp"

namespace ellipsa::io {

// The file every published folder holds, which says that ellipsa made it: only such a folder
// is ever replaced.
inline constexpr const char* folder_marker = ".ellipsa-folder";

// fill(dir) writes the folder's files into `dir` (a fresh, empty temporary folder); the marker
// file is added to them. A new folder gets the permissions the umask leaves of 0777.
// overwrite = false: refuse when anything is at the target (decided by the last step itself, as
// in write_file_atomically, so two racing publications cannot both succeed).
// overwrite = true: replace only a folder that holds the marker (one this function made; any
// other folder may hold the user's files), and never one that holds a file of `inputs` (the
// files its content is made from); the new folder keeps the old one's permission bits.
// A target that exists and is not a folder is always refused.
Status publish_folder(const std::string& target, const std::function<Status(const std::string& dir)>& fill,
                      bool overwrite, const std::vector<std::string>& inputs = {});

}  // namespace ellipsa::io
