// Map figures: every pixel shows the sample whose cell holds it, in the viewer's colour map;
// unsampled parts stay empty; the CSV holds every sample; all formats render.
#include <catch2/catch.hpp>

#include <cmath>
#include <sstream>

#include "exports/map_plot.hpp"
#include "exports/render.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

namespace {
FarFieldSet upper_half_dipole() {
    ReferenceAntenna z;
    z.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(z, 2.0, 1e9);
    // Keep theta 0..90: the lower hemisphere is unsampled.
    s.grid.theta.count = 46;
    for (FarField& f : s.frequencies) {
        f.e_theta.resize(s.grid.size());
        f.e_phi.resize(s.grid.size());
    }
    s.name = "upper half";
    return s;
}
std::uint32_t expected_colour(const MapPlot& p, std::size_t k) {
    const double t = std::clamp((p.values[k] - p.lo) / (p.hi - p.lo), 0.0, 1.0);
    const ColorRgb c = map_color(p.map, t);
    auto q = [](float v) { return std::uint32_t(std::lround(v * 255)); };
    return 0xFF000000u | (q(c.r) << 16) | (q(c.g) << 8) | q(c.b);
}
}  // namespace

TEST_CASE("map raster: each pixel is its cell's sample in the colour map, unsampled stays empty", "[export][map]") {
    const FarFieldSet s = upper_half_dipole();
    MapRequest r;
    r.projection = MapProjection::theta_phi;
    auto p = make_map_plot(s, 0, r);
    REQUIRE(p);
    // Bar: the peak 1.76 dBi (10 log10 1.5, Balanis sec. 4.2) rounded up to 2, down 40 dB.
    CHECK(p->hi == 2);
    CHECK(p->lo == -38);
    const MapRaster m = map_raster(*p);
    REQUIRE(m.width == 360);  // 2-degree grid: one pixel per degree
    REQUIRE(m.height == 180);
    // Pixel centres at (phi, theta) = (px + 0.5, py + 0.5) degrees on the theta/phi map.
    for (int py : {10, 45, 88})
        for (int px : {0, 101, 359}) {
            const auto k = sample_of(s.grid, py + 0.5, px + 0.5);
            REQUIRE(k);
            CHECK(m.argb[std::size_t(py * m.width + px)] == expected_colour(*p, *k));
        }
    // Below theta 90 there are no samples: transparent, so the hatching shows.
    for (int py : {95, 150, 179}) CHECK(m.argb[std::size_t(py * m.width + 17)] == 0u);
    // Hammer: the corners lie outside the ellipse.
    r.projection = MapProjection::hammer;
    auto h = make_map_plot(s, 0, r);
    REQUIRE(h);
    CHECK(map_raster(*h).argb[0] == 0u);
}

TEST_CASE("map plot: defaults, contours, CSV and every format", "[export][map]") {
    ReferenceAntenna ts;
    ts.kind = ReferenceKind::crossed_dipoles;
    ts.phase_deg = -90;
    const FarFieldSet s = synthesize(ts, 3.0, 2.45e9);
    MapRequest r;
    r.quantity = MapQuantity::axial_ratio;
    auto p = make_map_plot(s, 0, r);
    REQUIRE(p);
    CHECK(p->lo == 0);
    CHECK(p->hi == 20);
    REQUIRE(p->contours.size() == 1);
    CHECK(p->contours[0].level == 3);
    // The 3 dB contour of the turnstile (conventions.md: AR = 1/|cos t|) lies at
    // t = acos(10^(-3/20)) = 44.93 deg and 180 - that, within the linear interpolation between 3-degree samples.
    const double t3 = std::acos(std::pow(10.0, -3.0 / 20)) / deg;
    for (const ContourSegment& c : p->contours[0].segments)
        CHECK(std::min(std::abs(c.theta0_deg - t3), std::abs(c.theta0_deg - (180 - t3))) < 0.2);
    CHECK(p->quantity_key == "axial_ratio_db");
    const std::string csv = map_csv(*p);
    std::size_t lines = 0;
    for (char c : csv) lines += c == '\n';
    CHECK(lines == s.grid.size() + 1);
    CHECK(csv.rfind("theta_deg,phi_deg,azimuth_deg,elevation_deg,map_x,map_y,axial_ratio_db\n", 0) == 0);
    CHECK(csv.find(",inf\n") != std::string::npos);  // the linear horizon
    for (FileFormat f : {FileFormat::svg, FileFormat::pdf, FileFormat::png}) {
        auto bytes = render_image([&](cairo_t* cr, double w, double h) { draw_map_plot(cr, *p, w, h); }, f, RenderSize{1200, 720, 150});
        REQUIRE(bytes);
        CHECK(bytes->size() > 1000);
    }
    // Magnitude-only data cannot give an axial ratio: the error says why.
    FarFieldSet m = s;
    m.content = FieldContent::magnitude_only;
    auto bad = make_map_plot(m, 0, r);
    REQUIRE(!bad);
    CHECK(bad.error().message.find("phase") != std::string::npos);
}
