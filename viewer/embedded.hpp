// Files embedded into the executable at build time (cmake/embed_files.cmake): the shaders from
// shaders/ and the bundled DejaVu Sans font, so the viewer needs nothing from disk at run time.
#pragma once
#include <string_view>

namespace ellipsa::viewer {
// Contents of an embedded file by its base name ("surface.vert", "DejaVuSans.ttf"); empty if unknown.
std::string_view embedded_file(const char* name);
}  // namespace ellipsa::viewer
