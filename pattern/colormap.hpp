// Colour maps for the viewer and the exports: what a number on a surface or a map looks like. Pure
// code (no GL, no Cairo), in the core so that the viewer and the exports use the same maps.
//
// Sequential quantities (gain) use a perceptually uniform map (viridis, cividis, magma: van der
// Walt and Smith, matplotlib 2015; cividis: Nunez, Anderton and Renslow, PLoS ONE 2018). Differences
// use a diverging map centred on zero (ColorBrewer RdBu, Brewer 2003, blue for negative). Tilt uses a
// cyclic map: a constant-lightness hue circle in CIELAB, so -90 deg and +90 deg meet. No rainbow maps.
// Each map is a short table of published anchor colours interpolated linearly in sRGB; a lookup
// costs a few multiplies and no allocation.
#pragma once
#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <string>

namespace ellipsa {

struct ColorRgb {
    float r = 0, g = 0, b = 0;  // sRGB, 0..1
};

enum class ColorMap { viridis, cividis, magma, diverging, cyclic };
inline constexpr ColorMap all_color_maps[] = {ColorMap::viridis, ColorMap::cividis, ColorMap::magma,
                                              ColorMap::diverging, ColorMap::cyclic};
const char* to_string(ColorMap m);
bool parse_color_map(const std::string& name, ColorMap& out);
// True for the maps meant for sequential quantities (viridis, cividis, magma).
bool is_sequential(ColorMap m);

// One map resolved for many lookups (the viewer's surface looks up a million colours per rebuild):
// the map's table chosen once, its colours already in 0..1, so a lookup is a clamp, one index and
// three multiply-adds, inline. map_color(m, t) is ColorLookup(m)(t).
class ColorLookup {
public:
    explicit ColorLookup(ColorMap m);
    // Colour at t in [0, 1] (clamped; the cyclic map wraps instead); NaN gives a neutral grey.
    ColorRgb operator()(double t) const {
        if (std::isnan(t)) return {0.62f, 0.62f, 0.62f};
        const double x = (cyclic_ ? t - std::floor(t) : std::clamp(t, 0.0, 1.0)) * double(segments_);
        const std::size_t i = std::min<std::size_t>(std::size_t(x), segments_ - 1);
        const float f = float(x - double(i));
        const ColorRgb &a = table_[i], &b = table_[i + 1];
        return {a.r + f * (b.r - a.r), a.g + f * (b.g - a.g), a.b + f * (b.b - a.b)};
    }

private:
    const ColorRgb* table_;  // segments_ + 1 colours, evenly spaced in t
    std::size_t segments_;
    bool cyclic_;
};

// Colour at t in [0, 1] (clamped; the cyclic map wraps instead, so t and t+1 give the same colour).
// NaN gives a neutral grey.
ColorRgb map_color(ColorMap m, double t);

// CIELAB lightness L* (0..100) of an sRGB colour (D65), for tests and legends.
double lightness(ColorRgb c);
// sRGB colour of a CIELAB colour (D65), clipped to the gamut.
ColorRgb lab_to_rgb(double l, double a, double b);

}  // namespace ellipsa
