#include "pattern/colormap.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>

namespace ellipsa {

namespace {
struct Anchor {
    unsigned char r, g, b;
};
// viridis, 9 evenly spaced samples (matplotlib's viridis as listed by R viridisLite::viridis(9)).
constexpr Anchor viridis9[] = {{0x44, 0x01, 0x54}, {0x47, 0x2D, 0x7B}, {0x3B, 0x52, 0x8B},
                               {0x2C, 0x72, 0x8E}, {0x21, 0x91, 0x8C}, {0x28, 0xAE, 0x80},
                               {0x5E, 0xC9, 0x62}, {0xAD, 0xDC, 0x30}, {0xFD, 0xE7, 0x25}};
// magma, 9 evenly spaced samples (viridisLite::magma(9)).
constexpr Anchor magma9[] = {{0x00, 0x00, 0x04}, {0x1D, 0x11, 0x47}, {0x51, 0x12, 0x7C},
                             {0x82, 0x26, 0x81}, {0xB6, 0x36, 0x79}, {0xE6, 0x51, 0x64},
                             {0xFB, 0x88, 0x61}, {0xFE, 0xC2, 0x87}, {0xFC, 0xFD, 0xBF}};
// cividis, 10 evenly spaced samples (viridisLite::cividis(10), from memory; endpoints #00204D, #FFEA46).
constexpr Anchor cividis10[] = {{0x00, 0x20, 0x4D}, {0x00, 0x33, 0x6F}, {0x39, 0x48, 0x6B}, {0x57, 0x5C, 0x6D},
                               {0x70, 0x71, 0x73}, {0x8A, 0x87, 0x79}, {0xA6, 0x9D, 0x75}, {0xC4, 0xB5, 0x6C},
                               {0xE4, 0xCF, 0x5B}, {0xFF, 0xEA, 0x46}};
// ColorBrewer RdBu, 9 classes, reversed so that low (negative) is blue and high is red.
constexpr Anchor rdbu9[] = {{0x21, 0x66, 0xAC}, {0x43, 0x93, 0xC3}, {0x92, 0xC5, 0xDE},
                            {0xD1, 0xE5, 0xF0}, {0xF7, 0xF7, 0xF7}, {0xFD, 0xDB, 0xC7},
                            {0xF4, 0xA5, 0x82}, {0xD6, 0x60, 0x4D}, {0xB2, 0x18, 0x2B}};

// An anchor table as colours in 0..1.
template <std::size_t N>
std::array<ColorRgb, N> scaled(const Anchor (&t)[N]) {
    std::array<ColorRgb, N> out{};
    for (std::size_t i = 0; i < N; ++i) out[i] = {t[i].r / 255.f, t[i].g / 255.f, t[i].b / 255.f};
    return out;
}

double srgb_to_linear(double c) { return c <= 0.04045 ? c / 12.92 : std::pow((c + 0.055) / 1.055, 2.4); }
double linear_to_srgb(double c) {
    c = std::clamp(c, 0.0, 1.0);
    return c <= 0.0031308 ? 12.92 * c : 1.055 * std::pow(c, 1 / 2.4) - 0.055;
}
}  // namespace

const char* to_string(ColorMap m) {
    switch (m) {
        case ColorMap::viridis: return "viridis";
        case ColorMap::cividis: return "cividis";
        case ColorMap::magma: return "magma";
        case ColorMap::diverging: return "diverging";
        case ColorMap::cyclic: return "cyclic";
    }
    return "?";
}

bool parse_color_map(const std::string& name, ColorMap& out) {
    for (ColorMap m : all_color_maps)
        if (name == to_string(m)) {
            out = m;
            return true;
        }
    return false;
}

bool is_sequential(ColorMap m) { return m == ColorMap::viridis || m == ColorMap::cividis || m == ColorMap::magma; }

ColorRgb lab_to_rgb(double l, double a, double b) {
    // CIE 1976 L*a*b* to XYZ (D65 white), then XYZ to linear sRGB (IEC 61966-2-1).
    const double fy = (l + 16) / 116, fx = fy + a / 500, fz = fy - b / 200;
    auto finv = [](double t) { return t > 6.0 / 29 ? t * t * t : 3 * (6.0 / 29) * (6.0 / 29) * (t - 4.0 / 29); };
    const double x = 0.95047 * finv(fx), y = finv(fy), z = 1.08883 * finv(fz);
    const double r = 3.2404542 * x - 1.5371385 * y - 0.4985314 * z;
    const double g = -0.9692660 * x + 1.8760108 * y + 0.0415560 * z;
    const double bb = 0.0556434 * x - 0.2040259 * y + 1.0572252 * z;
    return {float(linear_to_srgb(r)), float(linear_to_srgb(g)), float(linear_to_srgb(bb))};
}

double lightness(ColorRgb c) {
    const double y = 0.2126729 * srgb_to_linear(c.r) + 0.7151522 * srgb_to_linear(c.g) + 0.0721750 * srgb_to_linear(c.b);
    return y > 216.0 / 24389 ? 116 * std::cbrt(y) - 16 : y * 24389.0 / 27;
}

namespace {
// The cyclic map: constant lightness and chroma, hue going once round (L* 68, C* 38 stays inside
// sRGB), tabulated once in 512 steps since lab_to_rgb costs several pow() calls.
const std::array<ColorRgb, 513>& cyclic_table() {
    static const std::array<ColorRgb, 513> table = [] {
        std::array<ColorRgb, 513> tb{};
        for (int k = 0; k <= 512; ++k) {
            const double h = 2 * 3.14159265358979323846 * k / 512;
            tb[std::size_t(k)] = lab_to_rgb(68, 38 * std::cos(h), 38 * std::sin(h));
        }
        return tb;
    }();
    return table;
}
}  // namespace

ColorLookup::ColorLookup(ColorMap m) : table_(nullptr), segments_(1), cyclic_(m == ColorMap::cyclic) {
    static const auto v = scaled(viridis9), g = scaled(magma9), d = scaled(rdbu9);
    static const auto c = scaled(cividis10);
    auto use = [&](const auto& t) { table_ = t.data(), segments_ = t.size() - 1; };
    switch (m) {
        case ColorMap::viridis: use(v); break;
        case ColorMap::cividis: use(c); break;
        case ColorMap::magma: use(g); break;
        case ColorMap::diverging: use(d); break;
        case ColorMap::cyclic: use(cyclic_table()); break;
    }
    if (!table_) use(v);
}

ColorRgb map_color(ColorMap m, double t) { return ColorLookup(m)(t); }

}  // namespace ellipsa
