// The bundled DejaVu Sans faces, embedded in the library at build time (the build copies them
// from fonts-dejavu-core into build/fonts/ at configure time). The assembler's .incbin puts the
// bytes in read-only data, followed by their length as a 64-bit word computed by the assembler;
// no file is opened at run time.
#include <cstdint>

#include "exports/font_data.hpp"

#define ELLIPSA_INCBIN(sym, path)                          \
    __asm__(".section .rodata\n"                           \
            ".balign 16\n"                                 \
            ".global " #sym "_data\n"                      \
            ".hidden " #sym "_data\n" #sym "_data:\n"      \
            ".incbin \"" path "\"\n"                       \
            "1:\n"                                         \
            ".byte 0\n"                                    \
            ".balign 8\n"                                  \
            ".global " #sym "_size\n"                      \
            ".hidden " #sym "_size\n" #sym "_size:\n"      \
            ".quad 1b - " #sym "_data\n"                   \
            ".previous\n")

ELLIPSA_INCBIN(ellipsa_font_regular, ELLIPSA_FONT_REGULAR);
ELLIPSA_INCBIN(ellipsa_font_bold, ELLIPSA_FONT_BOLD);

extern "C" {
__attribute__((visibility("hidden"))) extern const unsigned char ellipsa_font_regular_data[];
__attribute__((visibility("hidden"))) extern const std::uint64_t ellipsa_font_regular_size;
__attribute__((visibility("hidden"))) extern const unsigned char ellipsa_font_bold_data[];
__attribute__((visibility("hidden"))) extern const std::uint64_t ellipsa_font_bold_size;
}

namespace ellipsa::exports {

FontBytes bundled_font_bytes(FontWeight w) {
    if (w == FontWeight::bold) return {ellipsa_font_bold_data, std::size_t(ellipsa_font_bold_size)};
    return {ellipsa_font_regular_data, std::size_t(ellipsa_font_regular_size)};
}

}  // namespace ellipsa::exports
