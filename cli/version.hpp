#pragma once
#include <string>

namespace ellipsa::cli {
// "ellipsa 0.1.0" (the provenance line of reports; no GL probed).
std::string version_line();
// "ellipsa 0.1.0\n" plus a line saying which OpenGL renderer the viewer would use.
std::string version_text();
}  // namespace ellipsa::cli
