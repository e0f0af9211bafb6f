// The bundled DejaVu Sans faces (regular and bold), embedded once in the library at build time
// (font_data.cpp) and used by every output that draws text: the Cairo exports (fonts.hpp) and the
// viewer's Dear ImGui atlas. No file is opened and no system font is consulted at run time.
#pragma once
#include <cstddef>

namespace ellipsa::exports {

enum class FontWeight { regular, bold };

struct FontBytes {
    const unsigned char* data;
    std::size_t size;
};
// The embedded TrueType bytes of a weight; valid for the life of the process. Costs nothing.
FontBytes bundled_font_bytes(FontWeight w);

}  // namespace ellipsa::exports
