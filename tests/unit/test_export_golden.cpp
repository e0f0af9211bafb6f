// Golden-image check of one cut plot: the polar elevation cut of a 1.25-wavelength dipole,
// rendered in memory and compared with tests/data/golden/cut_dipole125_polar.png.
// Rendering is deterministic (bundled font, no hinting, fixed sizes), so the tolerance only has
// to absorb antialiasing differences between Cairo/pixman builds: mean difference below 0.5 of
// 255 per channel and fewer than 0.3 % of pixels off by more than 64.
// To regenerate after an intended change of look: ELLIPSA_UPDATE_GOLDEN=1 ./build/tests/ellipsa_tests "[golden]"
// and view the new file before committing it.
#include <catch2/catch.hpp>

#include <cstdlib>
#include <fstream>
#include <iterator>
#include <string>

#include "exports/cut_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

TEST_CASE("golden image: polar cut of a 1.25-wavelength dipole", "[export][golden]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    a.length_wl = 1.25;
    FarFieldSet s = synthesize(a, 1.0, 2.45e9);
    s.name = "Dipole, L = 1.25 wavelengths";
    auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total, Component::phi});
    REQUIRE(cut.ok());
    const CutPlot plot = make_cut_plot(s, *cut, {});
    RenderSize size;
    size.width_px = 800;
    size.height_px = 600;
    size.dpi = 100;
    auto png = render_image([&](cairo_t* cr, double w, double h) { draw_cut_plot(cr, plot, w, h); }, FileFormat::png, size);
    REQUIRE(png.ok());
    // Deterministic: a second rendering gives the same bytes (common practice for golden tests).
    auto again = render_image([&](cairo_t* cr, double w, double h) { draw_cut_plot(cr, plot, w, h); }, FileFormat::png, size);
    REQUIRE(again.ok());
    CHECK(*again == *png);

    const std::string golden_path = std::string(ELLIPSA_SOURCE_DIR) + "/tests/data/golden/cut_dipole125_polar.png";
    if (std::getenv("ELLIPSA_UPDATE_GOLDEN")) {
        REQUIRE(io::write_file_atomically(golden_path, *png).ok());
        WARN("golden image rewritten: " << golden_path);
        return;
    }
    std::ifstream in(golden_path, std::ios::binary);
    REQUIRE(in.good());
    const std::string golden((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    auto want = decode_png(golden);
    auto got = decode_png(*png);
    REQUIRE(want.ok());
    REQUIRE(got.ok());
    REQUIRE(got->width == want->width);
    REQUIRE(got->height == want->height);
    double sum = 0;
    std::size_t far_off = 0;
    for (std::size_t k = 0; k < got->rgb.size(); k += 3) {
        int worst = 0;
        for (int c = 0; c < 3; ++c) {
            const int d = std::abs(int((unsigned char)got->rgb[k + c]) - int((unsigned char)want->rgb[k + c]));
            sum += d;
            worst = std::max(worst, d);
        }
        if (worst > 64) ++far_off;
    }
    const double mean = sum / double(got->rgb.size());
    const double frac = double(far_off) / (double(got->rgb.size()) / 3);
    if (mean >= 0.5 || frac >= 0.003) {
        const std::string actual = "cut_dipole125_polar.actual.png";
        (void)io::write_file_atomically(actual, *png);
        FAIL_CHECK("differs from the golden image (mean " << mean << ", far-off fraction " << frac
                                                          << "); this run's image is in ./" << actual);
    }
    CHECK(mean < 0.5);
    CHECK(frac < 0.003);
}
