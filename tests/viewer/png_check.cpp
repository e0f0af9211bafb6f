// Checks a screenshot for the viewer tests: png_check FILE WIDTH HEIGHT [MIN_SURFACE_FRACTION]
//   - the PNG loads and has exactly WIDTH x HEIGHT pixels;
//   - it is not blank: at least 64 distinct colours and a luminance spread (std dev > 8 of 255);
//   - surface pixels are present: at least MIN_SURFACE_FRACTION (default 0.02) of all pixels are
//     strongly coloured (HSV saturation > 0.35 and value > 0.15). The UI and backgrounds are
//     near-grey by design, so saturated pixels come from the colour-mapped surface, glyphs and plots.
// With a fifth argument "neutral:X0,Y0,X1,Y1:MIN:MAX" (fractions of the width and height), the
// share of the box's pixels in the "not measured" region's light neutral grey (every channel 150 to
// 225, channels within 10 of each other) must lie in [MIN, MAX]: present below a hemisphere, absent
// for a full sphere (viewer/scene/surface_mesh.hpp, UnsampledRegion).
// Exit 0 when all hold; 1 with a message otherwise.
#include <stb_image.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <set>

// The share of light neutral grey pixels in a box given as "neutral:X0,Y0,X1,Y1:MIN:MAX".
int check_neutral(const char* file, const char* spec, const unsigned char* px, int w, int h) {
    double x0, y0, x1, y1, lo, hi;
    if (std::sscanf(spec, "neutral:%lf,%lf,%lf,%lf:%lf:%lf", &x0, &y0, &x1, &y1, &lo, &hi) != 6) {
        std::fprintf(stderr, "png_check: expected neutral:X0,Y0,X1,Y1:MIN:MAX, found %s\n", spec);
        return 1;
    }
    long in_box = 0, neutral = 0;
    for (int y = int(y0 * h); y < int(y1 * h) && y < h; ++y)
        for (int x = int(x0 * w); x < int(x1 * w) && x < w; ++x) {
            const unsigned char* p = px + 3 * (long(y) * w + x);
            const int mx = std::max({p[0], p[1], p[2]}), mn = std::min({p[0], p[1], p[2]});
            ++in_box;
            if (mn >= 150 && mx <= 225 && mx - mn <= 10) ++neutral;
        }
    const double share = in_box ? double(neutral) / double(in_box) : 0;
    std::printf("png_check: %s neutral grey in the box %.3f (expected %.3f to %.3f)\n", file, share, lo, hi);
    if (share >= lo && share <= hi) return 0;
    std::fprintf(stderr, "png_check: %s: the share of neutral grey %.3f is outside %.3f to %.3f\n", file, share, lo, hi);
    return 1;
}

int main(int argc, char** argv) {
    if (argc < 4) {
        std::fprintf(stderr, "usage: png_check FILE WIDTH HEIGHT [MIN_SURFACE_FRACTION]\n");
        return 2;
    }
    const int want_w = std::atoi(argv[2]), want_h = std::atoi(argv[3]);
    const double min_frac = argc > 4 ? std::atof(argv[4]) : 0.02;
    int w = 0, h = 0, n = 0;
    unsigned char* px = stbi_load(argv[1], &w, &h, &n, 3);
    if (!px) {
        std::fprintf(stderr, "png_check: %s: cannot read PNG (%s)\n", argv[1], stbi_failure_reason());
        return 1;
    }
    int fails = 0;
    if (w != want_w || h != want_h) {
        std::fprintf(stderr, "png_check: %s is %dx%d, expected %dx%d\n", argv[1], w, h, want_w, want_h);
        ++fails;
    }
    std::set<unsigned> colours;
    double sum = 0, sum2 = 0;
    long saturated = 0;
    const long total = long(w) * h;
    for (long i = 0; i < total; ++i) {
        const int r = px[3 * i], g = px[3 * i + 1], b = px[3 * i + 2];
        if (colours.size() < 100000) colours.insert(unsigned(r) << 16 | unsigned(g) << 8 | b);
        const double y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
        sum += y, sum2 += y * y;
        const int mx = std::max({r, g, b}), mn = std::min({r, g, b});
        if (mx > 38 && double(mx - mn) / mx > 0.35) ++saturated;
    }
    const double mean = sum / total, sd = std::sqrt(std::max(0.0, sum2 / total - mean * mean));
    const double frac = double(saturated) / total;
    std::printf("png_check: %s %dx%d, %zu colours, luminance mean %.1f sd %.1f, surface fraction %.3f\n", argv[1], w, h,
                colours.size(), mean, sd, frac);
    if (colours.size() < 64 || sd <= 8) {
        std::fprintf(stderr, "png_check: %s looks blank\n", argv[1]);
        ++fails;
    }
    if (frac < min_frac) {
        std::fprintf(stderr, "png_check: %s has too few surface pixels (%.3f < %.3f)\n", argv[1], frac, min_frac);
        ++fails;
    }
    if (argc > 5) fails += check_neutral(argv[1], argv[5], px, w, h);
    stbi_image_free(px);
    return fails ? 1 : 0;
}
