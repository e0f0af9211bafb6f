// Map projections (Hammer's equal-area property), map values against closed forms, contours.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"
#include "pattern/sphere_map.hpp"

using namespace ellipsa;

namespace {
// Area on the map of the cell [t0, t1] x [p0, p1] (degrees): its outline, each edge split into
// many points, by the shoelace formula (common practice).
double map_area(MapProjection p, double t0, double t1, double p0, double p1) {
    std::vector<MapPoint> o;
    const int n = 64;
    for (int k = 0; k < n; ++k) o.push_back(project(p, t0, p0 + (p1 - p0) * k / n));
    for (int k = 0; k < n; ++k) o.push_back(project(p, t0 + (t1 - t0) * k / n, p1));
    for (int k = 0; k < n; ++k) o.push_back(project(p, t1, p1 - (p1 - p0) * k / n));
    for (int k = 0; k < n; ++k) o.push_back(project(p, t1 - (t1 - t0) * k / n, p0));
    double a = 0;
    for (std::size_t k = 0; k < o.size(); ++k) {
        const MapPoint &u = o[k], &w = o[(k + 1) % o.size()];
        a += u.x * w.y - w.x * u.y;
    }
    return std::abs(a) / 2;
}
}  // namespace

TEST_CASE("Hammer projection: area on the map is solid angle", "[map]") {
    // Hammer (1892), as in Snyder, Flattening the Earth (1993) pp. 130-133: equal-area. The whole
    // sphere fills the ellipse of semi-axes 2 sqrt2 and sqrt2, area pi * 2 sqrt2 * sqrt2 = 4 pi.
    const MapBounds b = map_bounds(MapProjection::hammer);
    CHECK(pi * b.x_max * b.y_max == Approx(4 * pi).epsilon(1e-12));
    // A cell's solid angle is dphi (cos t0 - cos t1) (conventions.md); its map area must match.
    for (auto [t0, t1, p0, p1] : {std::array<double, 4>{10, 20, 30, 50}, {80, 95, 170, 179}, {120, 160, -40, 10},
                                  {0.5, 5, 0, 90}, {60, 61, 200, 201}}) {
        const double sr = (p1 - p0) * deg * (std::cos(t0 * deg) - std::cos(t1 * deg));
        INFO(t0 << ".." << t1 << ", " << p0 << ".." << p1);
        CHECK(map_area(MapProjection::hammer, t0, t1, p0, p1) == Approx(sr).epsilon(1e-4));
    }
    // Not so for the rectangular maps (their area is dtheta dphi in degrees^2): a cap near the
    // pole is larger there than its solid angle says.
    CHECK(map_area(MapProjection::theta_phi, 0.5, 5, 0, 90) * deg * deg > 1.5 * (90 * deg) * (std::cos(0.5 * deg) - std::cos(5 * deg)));
}

TEST_CASE("projections invert", "[map]") {
    for (MapProjection p : {MapProjection::theta_phi, MapProjection::azimuth_elevation, MapProjection::hammer})
        for (double t : {1.0, 30.0, 89.0, 135.0, 179.0})
            for (double ph : {0.0, 45.0, 179.0, 181.0, 300.0}) {
                const MapPoint m = project(p, t, ph);
                const auto back = unproject(p, m.x, m.y);
                REQUIRE(back);
                CHECK(back->first == Approx(t).margin(1e-9));
                CHECK(std::remainder(back->second - ph, 360.0) == Approx(0).margin(1e-9));
            }
    // Outside the ellipse there is no direction.
    CHECK(!unproject(MapProjection::hammer, 2.9, 0.3));
    // Azimuth/elevation: elevation 90 - theta, azimuth = phi wrapped to [-180, 180) (conventions.md).
    const MapPoint a = project(MapProjection::azimuth_elevation, 30, 270);
    CHECK(a.x == Approx(-90));
    CHECK(a.y == Approx(60));
}

TEST_CASE("map values against closed forms", "[map]") {
    ReferenceAntenna ts;
    ts.kind = ReferenceKind::crossed_dipoles;
    ts.phase_deg = -90;
    const FarFieldSet s = synthesize(ts, 5.0, 1e9);
    // conventions.md: the turnstile's AR is 1/|cos t| at angle t from the normal, every azimuth.
    auto ar = map_values(s, 0, MapQuantity::axial_ratio, Component::total);
    REQUIRE(ar);
    for (int i = 0; i < s.grid.theta.count; i += 3)
        for (int j = 0; j < s.grid.phi.count; j += 7) {
            const double t = s.grid.theta.value_deg(i) * deg;
            const double v = (*ar)[s.grid.index(i, j)];
            if (std::abs(std::cos(t)) < 1e-9)
                CHECK(std::isinf(v));
            else
                CHECK(v == Approx(-20 * std::log10(std::abs(std::cos(t)))).margin(1e-9));
        }
    // Right-hand toward +z, left-hand toward -z (phase -90 deg, reference.hpp; IEEE Std 145).
    auto bal = map_values(s, 0, MapQuantity::circular_balance, Component::total);
    REQUIRE(bal);
    CHECK((*bal)[s.grid.index(0, 0)] > 100);
    CHECK((*bal)[s.grid.index(s.grid.theta.count - 1, 0)] < -100);
    // A z dipole is all vertical: V minus H is +inf dB, its tilt 0 (along theta-hat).
    ReferenceAntenna z;
    z.kind = ReferenceKind::short_dipole;
    const FarFieldSet d = synthesize(z, 5.0, 1e9);
    auto vh = map_values(d, 0, MapQuantity::linear_balance, Component::total);
    REQUIRE(vh);
    CHECK(std::isinf((*vh)[d.grid.index(18, 3)]));
    auto tilt = map_values(d, 0, MapQuantity::tilt, Component::total);
    REQUIRE(tilt);
    CHECK((*tilt)[d.grid.index(18, 3)] == Approx(0).margin(1e-9));
    CHECK(std::isnan((*tilt)[d.grid.index(0, 0)]));  // zero field on the axis: no tilt
    // A minus B of the same pattern is 0 dB (where there is power).
    auto diff = map_values(d, 0, MapQuantity::difference, Component::total, &d, 0);
    REQUIRE(diff);
    CHECK((*diff)[d.grid.index(18, 3)] == Approx(0).margin(1e-12));
    CHECK(!map_values(d, 0, MapQuantity::difference, Component::total));  // no B
    FarFieldSet m = d;
    m.content = FieldContent::magnitude_only;
    CHECK(!map_values(m, 0, MapQuantity::axial_ratio, Component::total));
}

TEST_CASE("contours of a short dipole lie where 1.5 sin^2 t equals the level", "[map]") {
    // Short dipole G = 1.5 sin^2 t (Balanis sec. 4.2); the -3 dB-below-peak contour is at
    // sin^2 t = 0.5, t = 45 and 135 deg, one ring each.
    ReferenceAntenna z;
    z.kind = ReferenceKind::short_dipole;
    const FarFieldSet d = synthesize(z, 1.0, 1e9);
    auto v = map_values(d, 0, MapQuantity::component, Component::total);
    REQUIRE(v);
    const double level = 10 * std::log10(1.5 * 0.5);
    const auto segs = contour_segments(d.grid, *v, level);
    CHECK(segs.size() == std::size_t(2 * d.grid.phi.count));  // two closed rings across the seam
    for (const ContourSegment& s : segs) {
        // Linear interpolation in dB between 1-degree samples: within 0.01 deg of the closed form.
        CHECK(std::min(std::abs(s.theta0_deg - 45), std::abs(s.theta0_deg - 135)) < 0.01);
    }
    // sample_of: the cell that holds a direction.
    CHECK(*sample_of(d.grid, 10.4, 20.4) == d.grid.index(10, 20));
    CHECK(*sample_of(d.grid, 10.6, 359.7) == d.grid.index(11, 0));
}
