// Files embedded into the executable at build time (cmake/embed_files.cmake): the shaders from
// shaders/, so the viewer needs nothing from disk at run time. (The bundled font is embedded once,
// in exports/font_data.hpp, and shared with the exports.)
#pragma once
#include <string_view>

namespace ellipsa::viewer {
// Contents of an embedded file by its base name ("surface.vert"); empty if unknown.
std::string_view embedded_file(const char* name);
}  // namespace ellipsa::viewer
