// The bundled DejaVu Sans faces, embedded in the library at build time (the build copies them
// from fonts-dejavu-core into build/fonts/ at configure time). The assembler's .incbin puts the
// bytes in read-only data; no file is opened at run time.
#include "exports/fonts.hpp"

#define ELLIPSA_INCBIN(sym, path)                   \
    __asm__(".section .rodata\n"                    \
            ".balign 16\n"                          \
            ".global " #sym "_begin\n.hidden " #sym "_begin\n"               \
            #sym "_begin:\n"                        \
            ".incbin \"" path "\"\n"                \
            ".global " #sym "_end\n.hidden " #sym "_end\n"                 \
            #sym "_end:\n"                          \
            ".byte 0\n"                             \
            ".previous\n")

ELLIPSA_INCBIN(ellipsa_font_regular, ELLIPSA_FONT_REGULAR);
ELLIPSA_INCBIN(ellipsa_font_bold, ELLIPSA_FONT_BOLD);

extern "C" __attribute__((visibility("hidden"))) const unsigned char ellipsa_font_regular_begin[], ellipsa_font_regular_end[];
extern "C" __attribute__((visibility("hidden"))) const unsigned char ellipsa_font_bold_begin[], ellipsa_font_bold_end[];

namespace ellipsa::exports {

FontBytes bundled_font_bytes(FontWeight w) {
    if (w == FontWeight::bold)
        return {ellipsa_font_bold_begin, std::size_t(ellipsa_font_bold_end - ellipsa_font_bold_begin)};
    return {ellipsa_font_regular_begin, std::size_t(ellipsa_font_regular_end - ellipsa_font_regular_begin)};
}

}  // namespace ellipsa::exports
