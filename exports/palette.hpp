// Colours and line styles for curves: the Okabe-Ito palette (M. Okabe, K. Ito, "Color Universal
// Design", 2008; also B. Wong, Nature Methods 8, 441, 2011), which stays distinguishable under
// the common colour-vision deficiencies. Yellow is left out (too pale on white paper) and black
// is kept for text and axes. Each curve also gets its own dash pattern, so a figure printed in
// grey or read by someone who cannot tell two hues apart still separates the curves.
#pragma once
#include <cstddef>

namespace ellipsa::exports {

struct Rgb {
    double r, g, b;  // 0..1
};

inline constexpr Rgb okabe_ito_curves[] = {
    {0 / 255.0, 114 / 255.0, 178 / 255.0},    // blue
    {213 / 255.0, 94 / 255.0, 0 / 255.0},     // vermillion
    {0 / 255.0, 158 / 255.0, 115 / 255.0},    // bluish green
    {204 / 255.0, 121 / 255.0, 167 / 255.0},  // reddish purple
    {230 / 255.0, 159 / 255.0, 0 / 255.0},    // orange
    {86 / 255.0, 180 / 255.0, 233 / 255.0},   // sky blue
    {0.0, 0.0, 0.0},                          // black
};
inline constexpr std::size_t curve_colour_count = sizeof okabe_ito_curves / sizeof okabe_ito_curves[0];

inline Rgb curve_colour(std::size_t i) { return okabe_ito_curves[i % curve_colour_count]; }

// Dash pattern of curve i, in multiples of the line width: {on, off, on, off}; {0} is solid.
struct Dash {
    double d[4];
    int count;  // 0 = solid
};
inline Dash curve_dash(std::size_t i) {
    constexpr Dash dashes[] = {
        {{0, 0, 0, 0}, 0},     // solid
        {{5, 2.5, 0, 0}, 2},   // dashed
        {{6, 2, 1, 2}, 4},     // dash-dot
        {{1, 1.8, 0, 0}, 2},   // dotted
        {{9, 3, 0, 0}, 2},     // long dash
        {{4, 1.5, 1, 1.5}, 4}, // short dash-dot
    };
    constexpr std::size_t n = sizeof dashes / sizeof dashes[0];
    // Step through colours first, then dashes: 7 colours x 6 dashes before a repeat.
    return dashes[(i + i / curve_colour_count) % n];
}

// Greys for the frame (print-friendly: light grid, dark text).
inline constexpr Rgb ink{0.10, 0.10, 0.10};
inline constexpr Rgb ink_soft{0.33, 0.33, 0.33};
inline constexpr Rgb grid_major{0.78, 0.78, 0.78};
inline constexpr Rgb grid_minor{0.90, 0.90, 0.90};

}  // namespace ellipsa::exports
