#include "exports/fonts.hpp"

#include <ft2build.h>
#include FT_FREETYPE_H
#include <cairo-ft.h>

namespace ellipsa::exports {

namespace {

struct Faces {
    FT_Library library = nullptr;
    FT_Face ft[2] = {nullptr, nullptr};
    cairo_font_face_t* cairo[2] = {nullptr, nullptr};

    Faces() {
        if (FT_Init_FreeType(&library) != 0) return;
        for (int k = 0; k < 2; ++k) {
            const FontBytes b = bundled_font_bytes(k == 0 ? FontWeight::regular : FontWeight::bold);
            if (FT_New_Memory_Face(library, b.data, FT_Long(b.size), 0, &ft[k]) != 0) {
                ft[k] = nullptr;
                continue;
            }
            // No hinting: glyph outlines are the designer's, so the same text renders the same way
            // whatever FreeType's hinting defaults are.
            cairo[k] = cairo_ft_font_face_create_for_ft_face(ft[k], FT_LOAD_NO_HINTING);
        }
    }
    // Kept for the life of the process: Cairo may hold scaled fonts that reference the faces.
};

Faces& faces() {
    static Faces f;
    return f;
}

}  // namespace

cairo_font_face_t* font_face(FontWeight w) { return faces().cairo[w == FontWeight::bold ? 1 : 0]; }

void set_font(cairo_t* cr, FontWeight w, double size) {
    if (cairo_font_face_t* f = font_face(w)) cairo_set_font_face(cr, f);
    cairo_set_font_size(cr, size);
    cairo_font_options_t* o = cairo_font_options_create();
    cairo_font_options_set_antialias(o, CAIRO_ANTIALIAS_GRAY);
    cairo_font_options_set_hint_style(o, CAIRO_HINT_STYLE_NONE);
    cairo_font_options_set_hint_metrics(o, CAIRO_HINT_METRICS_OFF);
    cairo_font_options_set_subpixel_order(o, CAIRO_SUBPIXEL_ORDER_DEFAULT);
    cairo_set_font_options(cr, o);
    cairo_font_options_destroy(o);
}

}  // namespace ellipsa::exports
