// Colour maps: published anchor colours, monotonic lightness for the sequential maps, a neutral
// centre for the diverging map and a closed loop for the cyclic one.
#include <catch2/catch.hpp>

#include "pattern/colormap.hpp"

using namespace ellipsa;

namespace {
int byte(float c) { return int(c * 255.0f + 0.5f); }
}  // namespace

TEST_CASE("viridis and magma end on their published colours", "[colormap]") {
    // matplotlib's viridis table starts at (0.267004, 0.004874, 0.329415) = #440154 and ends at
    // (0.993248, 0.906157, 0.143936) = #FDE725 (van der Walt and Smith, matplotlib 2.0, 2015).
    ColorRgb a = map_color(ColorMap::viridis, 0), b = map_color(ColorMap::viridis, 1);
    CHECK(byte(a.r) == 0x44);
    CHECK(byte(a.g) == 0x01);
    CHECK(byte(a.b) == 0x54);
    CHECK(byte(b.r) == 0xFD);
    CHECK(byte(b.g) == 0xE7);
    CHECK(byte(b.b) == 0x25);
    // magma runs from near black (#000004) to pale yellow (#FCFDBF) (matplotlib magma table).
    ColorRgb m0 = map_color(ColorMap::magma, 0), m1 = map_color(ColorMap::magma, 1);
    CHECK(byte(m0.r) + byte(m0.g) + byte(m0.b) < 10);
    CHECK(byte(m1.r) == 0xFC);
    CHECK(byte(m1.b) == 0xBF);
    // Out-of-range values clamp.
    CHECK(byte(map_color(ColorMap::viridis, 7).r) == 0xFD);
    CHECK(byte(map_color(ColorMap::viridis, -3).r) == 0x44);
}

TEST_CASE("sequential maps rise monotonically in CIELAB lightness", "[colormap]") {
    // Design property of viridis, magma and cividis: lightness increases steadily from one end to
    // the other (van der Walt and Smith 2015; Nunez, Anderton and Renslow, PLoS ONE 13(7), 2018).
    for (ColorMap m : {ColorMap::viridis, ColorMap::magma, ColorMap::cividis}) {
        INFO(to_string(m));
        double prev = -1;
        for (int k = 0; k <= 100; ++k) {
            const double l = lightness(map_color(m, k / 100.0));
            CHECK(l > prev - 0.05);
            prev = l;
        }
        CHECK(lightness(map_color(m, 1)) - lightness(map_color(m, 0)) > 60);
    }
}

TEST_CASE("CIELAB lightness of sRGB greys", "[colormap]") {
    // sRGB 119/255 grey has L* = 50.0 (IEC 61966-2-1 transfer curve and CIE 1976 L*; from memory,
    // and it follows from Y = 0.1845: 116 * 0.1845^(1/3) - 16 = 50.0).
    CHECK(lightness({119 / 255.f, 119 / 255.f, 119 / 255.f}) == Approx(50.0).margin(0.3));
    CHECK(lightness({1, 1, 1}) == Approx(100.0).margin(0.01));
    CHECK(lightness({0, 0, 0}) == Approx(0.0).margin(0.01));
    // lab_to_rgb is the inverse for neutral colours.
    ColorRgb g = lab_to_rgb(50, 0, 0);
    CHECK(byte(g.r) == Approx(119).margin(1));
    CHECK(lightness(g) == Approx(50).margin(0.3));
}

TEST_CASE("the diverging map is blue below zero, near white at zero, red above", "[colormap]") {
    // ColorBrewer RdBu (Brewer 2003): centre #F7F7F7, ends #2166AC (blue) and #B2182B (red).
    ColorRgb lo = map_color(ColorMap::diverging, 0), mid = map_color(ColorMap::diverging, 0.5), hi = map_color(ColorMap::diverging, 1);
    CHECK(lo.b > lo.r);
    CHECK(hi.r > hi.b);
    CHECK(byte(mid.r) == 0xF7);
    CHECK(lightness(mid) > 95);
    // Lightness falls away from the centre on both sides.
    CHECK(lightness(map_color(ColorMap::diverging, 0.25)) < lightness(mid));
    CHECK(lightness(map_color(ColorMap::diverging, 0.75)) < lightness(mid));
}

TEST_CASE("the cyclic map closes on itself at constant lightness", "[colormap]") {
    // Tilt -90 and +90 deg are the same orientation: t = 0 and t = 1 must give the same colour.
    ColorRgb a = map_color(ColorMap::cyclic, 0), b = map_color(ColorMap::cyclic, 1);
    CHECK(a.r == Approx(b.r).margin(1e-5));
    CHECK(a.g == Approx(b.g).margin(1e-5));
    CHECK(a.b == Approx(b.b).margin(1e-5));
    // Isoluminant by construction (L* = 68): no orientation looks "stronger" than another.
    for (int k = 0; k < 36; ++k) CHECK(lightness(map_color(ColorMap::cyclic, k / 36.0)) == Approx(68).margin(1.5));
    // And it actually changes hue: opposite orientations differ clearly.
    ColorRgb c = map_color(ColorMap::cyclic, 0.5);
    CHECK(std::abs(c.r - a.r) + std::abs(c.g - a.g) + std::abs(c.b - a.b) > 0.3);
}

TEST_CASE("colour map names round-trip", "[colormap]") {
    for (ColorMap m : all_color_maps) {
        ColorMap out = ColorMap::cyclic;
        REQUIRE(parse_color_map(to_string(m), out));
        CHECK(out == m);
    }
    ColorMap out;
    CHECK_FALSE(parse_color_map("jet", out));  // no rainbow maps
    CHECK(is_sequential(ColorMap::viridis));
    CHECK_FALSE(is_sequential(ColorMap::diverging));
}
