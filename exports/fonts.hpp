// The fonts every export uses: DejaVu Sans (regular and bold) bundled into the library, loaded
// through FreeType and handed to Cairo as cairo-ft faces. Nothing depends on the system font
// path or fontconfig at run time, and hinting is off so that output is the same on every machine.
#pragma once
#include <cairo.h>

#include "exports/font_data.hpp"

namespace ellipsa::exports {

// The Cairo face for a weight; created on first use and kept for the life of the process
// (thread-safe initialisation). Returns nullptr only if FreeType cannot read the embedded font.
cairo_font_face_t* font_face(FontWeight w);

// Select a face and size (in user units) on a context, with deterministic font options
// (grey antialiasing, no hinting, unhinted metrics).
void set_font(cairo_t* cr, FontWeight w, double size);

}  // namespace ellipsa::exports
