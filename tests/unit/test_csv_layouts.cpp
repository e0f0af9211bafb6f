// Angle layouts of range files (issue 14; docs/far-field-csv.md, "Angle layouts"): theta from
// -180, phi in any window, duplicates, and the two positioner grids. The fixtures in
// tests/data/csv/layouts (make_layouts.py there) hold one closed-form antenna, a tilted short
// dipole and a small loop in quadrature (Balanis sec. 4.2, 5.2), in every layout; each must give
// the figures of the same pattern written in the schema (reference.csv).
#include <catch2/catch.hpp>

#include <cmath>
#include <random>
#include <string>

#include "importers/far_field_csv.hpp"
#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/positioner.hpp"
#include "pattern/summary.hpp"

using namespace ellipsa;
using Catch::Matchers::Contains;

namespace {

std::string layouts_dir() { return std::string(ELLIPSA_SOURCE_DIR) + "/tests/data/csv/layouts/"; }

FarFieldSet fixture(const std::string& name) {
    CsvReadOptions o;
    const std::string map = layouts_dir() + name + ".map";
    if (name != "reference")
        if (Status st = read_csv_map_file(map, o); !st) FAIL(st.error().format());
    auto r = read_far_field_csv(layouts_dir() + name + ".csv", o);
    if (!r) FAIL(r.error().format());
    return *r;
}

FarFieldSet parse(const std::string& text) {
    auto r = parse_far_field_csv(text, "t.csv");
    if (!r) FAIL(r.error().format());
    return *r;
}

Error refuse(const std::string& text) {
    auto r = parse_far_field_csv(text, "t.csv");
    REQUIRE_FALSE(r);
    return r.error();
}

double db(double x) { return 10 * std::log10(x); }

// A small closed-form field with elliptical polarisation: an x dipole and a z loop in quadrature
// (Balanis sec. 4.2, 5.2), as a Cartesian vector at direction r.
CVec3 field_at(Vec3 r) {
    const Vec3 d{1, 0, 0}, loop = cross(Vec3{0, 0, 1}, r);
    const Vec3 dp = d - dot(d, r) * r;
    return {cplx(dp.x, 0.5 * loop.x), cplx(dp.y, 0.5 * loop.y), cplx(dp.z, 0.5 * loop.z)};
}

// One complex-family row at (theta, phi) as written, in the formal unit vectors there (so a
// negative theta gives the opposite half-plane's components negated); `scale` spoils it.
std::string row(double t, double p, double scale = 1) {
    const CVec3 e = field_at(direction(t * deg, p * deg));
    const cplx et = scale * dot(e, theta_hat(t * deg, p * deg)), ep = scale * dot(e, phi_hat(p * deg));
    char b[200];
    std::snprintf(b, sizeof b, "%g,%g,%.17g,%.17g,%.17g,%.17g\n", t, p, et.real(), et.imag(), ep.real(), ep.imag());
    return b;
}

const std::string header = "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";

// theta t0..t1 and phi p0..p1 (inclusive) in steps of 30 deg.
std::string grid_text(int t0, int t1, int p0, int p1) {
    std::string s = header;
    for (int t = t0; t <= t1; t += 30)
        for (int p = p0; p <= p1; p += 30) s += row(t, p);
    return s;
}

// Every sample of a against b, to `tol` of 1.
void same_samples(const FarFieldSet& a, const FarFieldSet& b, double tol = 1e-12) {
    REQUIRE(same_grid(a.grid, b.grid));
    for (std::size_t k = 0; k < a.grid.size(); ++k) {
        CHECK(std::abs(a.frequencies[0].e_theta[k] - b.frequencies[0].e_theta[k]) < tol);
        CHECK(std::abs(a.frequencies[0].e_phi[k] - b.frequencies[0].e_phi[k]) < tol);
    }
}

double meg_db(const FarFieldSet& s, const char* env) {
    auto e = environment_preset(env);
    REQUIRE(e);
    auto m = mean_effective_gain(s, 0, *e);
    REQUIRE(m);
    return db(m->meg);
}

// The figures of `got` against those of `ref`, each within `tol_db` (dB figures) or `tol_deg`.
void same_figures(const FarFieldSet& got, const FarFieldSet& ref, double tol_db, double tol_deg) {
    const PatternSummary a = summarize(got, 0), b = summarize(ref, 0);
    CHECK(a.peak_db == Approx(b.peak_db).margin(tol_db));
    CHECK(a.peak.theta_deg == Approx(b.peak.theta_deg).margin(tol_deg));
    CHECK(a.peak.phi_deg == Approx(b.peak.phi_deg).margin(tol_deg));
    REQUIRE(a.directivity_dbi);
    CHECK(*a.directivity_dbi == Approx(*b.directivity_dbi).margin(tol_db));
    REQUIRE(a.axial_ratio_db);
    CHECK(*a.axial_ratio_db == Approx(*b.axial_ratio_db).margin(tol_db));
    CHECK(a.sense == b.sense);
    for (const char* env : {"uniform", "urban"}) CHECK(meg_db(got, env) == Approx(meg_db(ref, env)).margin(tol_db));
}

// The field at a few directions (poles, the peak's region, between samples), as a share of the
// largest field: the largest difference of the Cartesian vectors.
double largest_field_difference(const FarFieldSet& got, const FarFieldSet& ref) {
    const double dirs[][2] = {{0, 0}, {180, 0}, {45, 30}, {90, 120}, {135, 250}, {73.3, 240.8}, {47.5, 33.3}, {101, 11}, {162.5, 317.5}};
    double worst = 0;
    for (const auto& d : dirs) {
        auto x = interpolate(got, 0, d[0], d[1]), y = interpolate(ref, 0, d[0], d[1]);
        REQUIRE(x);
        REQUIRE(y);
        worst = std::max(worst, std::sqrt(std::norm(x->e_theta - y->e_theta) + std::norm(x->e_phi - y->e_phi)));
    }
    return worst / std::sqrt(summarize(ref, 0).peak.value);
}

}  // namespace

TEST_CASE("layouts: negative theta is the opposite half-plane with theta-hat and phi-hat negated", "[csv][layouts]") {
    // Derived from the Cartesian unit vectors (docs/conventions.md, Coordinates): at (-t, p)
    // r-hat = r-hat(t, p + 180), theta-hat = -theta-hat(t, p + 180), phi-hat = -phi-hat(p + 180);
    // so E_theta(-t, p) = -E_theta(t, p + 180) and E_phi(-t, p) = -E_phi(t, p + 180).
    std::mt19937 rng(14);
    std::uniform_real_distribution<double> t(0, pi), p(0, 2 * pi);
    for (int k = 0; k < 100; ++k) {
        const double tr = t(rng), pr = p(rng);
        const Vec3 r1 = direction(-tr, pr), r2 = direction(tr, pr + pi);
        const Vec3 t1 = theta_hat(-tr, pr), t2 = theta_hat(tr, pr + pi);
        const Vec3 p1 = phi_hat(pr), p2 = phi_hat(pr + pi);
        CHECK(norm(r1 - r2) < 1e-12);
        CHECK(norm(t1 + t2) < 1e-12);
        CHECK(norm(p1 + p2) < 1e-12);
    }
}

TEST_CASE("layouts: positioner grids, their directions and unit vectors", "[csv][layouts]") {
    // Masters & Gregson, AMTA 2007 (the az/el systems); the checks are the directions every
    // positioner description states: az-over-el el = 90 is +y and az = 90 (el 0) is +x;
    // el-over-az az = 90 is +x and el = 90 (az 0) is +y; (0, 0) is boresight +z in both.
    const auto aoe = PositionerGrid::az_over_el, eoa = PositionerGrid::el_over_az;
    CHECK(norm(positioner_frame(aoe, 0, 0).r - Vec3{0, 0, 1}) < 1e-12);
    CHECK(norm(positioner_frame(aoe, 0.3, 90 * deg).r - Vec3{0, 1, 0}) < 1e-12);
    CHECK(norm(positioner_frame(aoe, 90 * deg, 0).r - Vec3{1, 0, 0}) < 1e-12);
    CHECK(norm(positioner_frame(eoa, 90 * deg, 0.3).r - Vec3{1, 0, 0}) < 1e-12);
    CHECK(norm(positioner_frame(eoa, 0, 90 * deg).r - Vec3{0, 1, 0}) < 1e-12);
    std::mt19937 rng(7);
    std::uniform_real_distribution<double> a(-pi, pi), e(-pi / 2 + 0.01, pi / 2 - 0.01);
    for (auto g : {aoe, eoa})
        for (int k = 0; k < 100; ++k) {
            // The lower axis turns all the way round, the upper one within +-90 deg.
            const double az0 = g == aoe ? a(rng) : e(rng), el0 = g == aoe ? e(rng) : a(rng);
            const PositionerFrame f = positioner_frame(g, az0, el0);
            // An orthonormal right-handed triad: az-hat x el-hat = r-hat.
            CHECK(std::abs(norm(f.r) - 1) < 1e-12);
            CHECK(std::abs(dot(f.az_hat, f.el_hat)) < 1e-12);
            CHECK(norm(cross(f.az_hat, f.el_hat) - f.r) < 1e-12);
            // The unit vectors are the normalised derivatives of r (central differences).
            const double h = 1e-6;
            const Vec3 d_az = positioner_frame(g, az0 + h, el0).r - positioner_frame(g, az0 - h, el0).r;
            const Vec3 d_el = positioner_frame(g, az0, el0 + h).r - positioner_frame(g, az0, el0 - h).r;
            CHECK(norm(normalized(d_az) - f.az_hat) < 1e-6);
            CHECK(norm(normalized(d_el) - f.el_hat) < 1e-6);
            // The angles back from the direction.
            double az2, el2;
            positioner_angles(g, f.r, az2, el2);
            CHECK(norm(positioner_frame(g, az2 * deg, el2 * deg).r - f.r) < 1e-12);
        }
}

TEST_CASE("layouts: theta -180..180 (a range's polar sweeps) gives the schema's figures", "[csv][layouts]") {
    const FarFieldSet ref = fixture("reference"), s = fixture("range_theta_pm180");
    CHECK(same_grid(s.grid, ref.grid));
    // Exact placement: the only differences are the file's 5-decimal dB and 4-decimal phases
    // (amplitude 1.2e-6, phase 1.7e-6 rad relative): every sample agrees to 1e-5 of the peak field.
    double worst = 0;
    for (std::size_t k = 0; k < ref.grid.size(); ++k)
        worst = std::max(worst, std::abs(s.frequencies[0].e_theta[k] - ref.frequencies[0].e_theta[k]) +
                                    std::abs(s.frequencies[0].e_phi[k] - ref.frequencies[0].e_phi[k]));
    CHECK(worst < 1e-5);
    same_figures(s, ref, 1e-4, 1e-3);
    CHECK(largest_field_difference(s, ref) < 1e-5);
    REQUIRE(s.reading_notes.size() == 2);
    CHECK_THAT(s.reading_notes[1], Contains("opposite half-plane"));
}

TEST_CASE("layouts: azimuth over elevation, resampled on the Cartesian field", "[csv][layouts]") {
    const FarFieldSet ref = fixture("reference"), s = fixture("range_az_over_el");
    CHECK(same_grid(s.grid, ref.grid));
    CHECK_THAT(s.reading_notes.back(), Contains("azimuth over elevation") && Contains("resampled"));
    // Bilinear interpolation at 5 deg steps of a field of two dipoles: a second-order error,
    // about (5 deg)^2 / 8 of the field's curvature, 1e-3 relative. Measured (2026-12-02): peak
    // -0.006 dB, its direction 0.2 and 0.5 deg off (a flat beam, HPBW 98 deg), directivity
    // -0.0002 dB, axial ratio +0.005 dB, MEG -0.006 dB, field 0.07 % of the peak field.
    same_figures(s, ref, 0.03, 1.0);
    CHECK(largest_field_difference(s, ref) < 3e-3);
}

TEST_CASE("layouts: elevation over azimuth, resampled on the Cartesian field", "[csv][layouts]") {
    const FarFieldSet ref = fixture("reference"), s = fixture("range_el_over_az");
    CHECK(same_grid(s.grid, ref.grid));
    CHECK_THAT(s.reading_notes.back(), Contains("elevation over azimuth") && Contains("resampled"));
    // Measured (2026-12-02): peak -0.013 dB, its direction 0.2 and 0.7 deg off, directivity
    // -0.006 dB, axial ratio -0.006 dB, MEG -0.006 dB, field 0.14 % of the peak field.
    same_figures(s, ref, 0.03, 1.0);
    CHECK(largest_field_difference(s, ref) < 3e-3);
}

TEST_CASE("layouts: phi in any 360-degree window reads as the usual grid", "[csv][layouts]") {
    const FarFieldSet usual = parse(grid_text(0, 180, 0, 330));
    CHECK(usual.reading_notes.empty());  // the usual windows take the direct path
    for (auto [p0, p1] : {std::pair{90, 420}, {-180, 150}, {-330, 0}, {270, 600}, {90, 450}}) {
        CAPTURE(p0, p1);
        const FarFieldSet s = parse(grid_text(0, 180, p0, p1));
        same_samples(s, usual);
        if (p0 < -180 || p1 > 360) CHECK_THAT(s.reading_notes.at(0), Contains("phi read modulo 360"));
    }
    // theta -180..180 over a half circle of phi: the same sphere (poles and theta +-180 repeat).
    const FarFieldSet half = parse(grid_text(-180, 180, 0, 150));
    same_samples(half, usual);
    CHECK_THAT(half.reading_notes.at(0), Contains("(-theta, phi) is (theta, phi + 180)"));
    same_samples(parse(grid_text(-180, 180, -90, 60)), usual);
    // Both half-planes over the full circle: every direction twice, consistent.
    same_samples(parse(grid_text(-180, 180, 0, 330)), usual);
}

TEST_CASE("layouts: two principal cuts through the pole, theta -180..180", "[csv][layouts]") {
    std::string text = header;
    for (int p : {0, 90})
        for (int t = -180; t <= 180; t += 10) text += row(t, p);
    const FarFieldSet s = parse(text);
    CHECK(s.grid.phi.count == 4);  // phi 0, 90, 180, 270
    CHECK(s.grid.theta.count == 19);
    // Every sample is the closed form at its direction (the poles turned onto every phi).
    for (int it = 0; it < s.grid.theta.count; ++it)
        for (int ip = 0; ip < s.grid.phi.count; ++ip) {
            const double t = s.grid.theta.value_deg(it) * deg, p = s.grid.phi.value_deg(ip) * deg;
            const CVec3 e = field_at(direction(t, p));
            CHECK(std::abs(s.frequencies[0].e_theta[s.grid.index(it, ip)] - dot(e, theta_hat(t, p))) < 1e-12);
            CHECK(std::abs(s.frequencies[0].e_phi[s.grid.index(it, ip)] - dot(e, phi_hat(p))) < 1e-12);
        }
}

TEST_CASE("layouts: a direction given twice must agree", "[csv][layouts]") {
    // phi and phi + 360: the row at 390 repeats the one at 30.
    std::string text = grid_text(0, 180, 0, 390);
    CHECK(parse(text).grid.phi.count == 12);
    const std::string good = row(60, 390), bad = row(60, 390, 1.1);
    text.replace(text.find(good), good.size(), bad);
    Error e = refuse(text);
    CHECK(e.line == 1 + 3 * 14);  // header, 14 phi a theta: theta 60, phi 390 is the last row
    CHECK(e.column == 1);
    CHECK_THAT(e.message, Contains("one field per direction") && Contains("line 31") && Contains("theta 60, phi 30 deg"));
    // The same direction from both half-planes: (-60, 90) is (60, 270).
    text = grid_text(-180, 180, 0, 330);
    const std::string g2 = row(-60, 90), b2 = row(-60, 90, 0.9);
    text.replace(text.find(g2), g2.size(), b2);
    e = refuse(text);
    CHECK_THAT(e.message, Contains("theta 60, phi 270 deg"));
    // theta 0 at several phi: one Cartesian vector, turned onto each phi.
    text = grid_text(-90, 90, 0, 150);
    const std::string g3 = row(0, 60), b3 = row(0, 60, 2);
    text.replace(text.find(g3), g3.size(), b3);
    e = refuse(text);
    CHECK_THAT(e.message, Contains("theta 0, phi"));
    // A range's repeated samples differ by its noise: 3 % by default (a range's repeatability,
    // docs/far-field-csv.md "Tolerance"; common practice, values from memory) lets a 1 % repeat
    // through and refuses 5 %; duplicate-tolerance sets the share (the first row read is kept).
    text = grid_text(-180, 180, 0, 150);
    const std::string g4 = row(0, 60), b4 = row(0, 60, 1.05);
    text.replace(text.find(g4), g4.size(), row(0, 60, 1.01));
    same_samples(parse(text), parse(grid_text(-180, 180, 0, 150)));
    CsvReadOptions o;
    o.settings = {{"duplicate-tolerance", "0", {"range.map", 4}}};
    CHECK_FALSE(parse_far_field_csv(text, "t.csv", o));
    text.replace(text.find(row(0, 60, 1.01)), b4.size(), b4);
    refuse(text);
    o.settings = {{"duplicate-tolerance", "10 %", {"range.map", 4}}};
    auto r = parse_far_field_csv(text, "t.csv", o);
    REQUIRE(r);
    same_samples(*r, parse(grid_text(-180, 180, 0, 150)));
    text.replace(text.find(b4), b4.size(), row(0, 60, 1.2));
    CHECK_FALSE(parse_far_field_csv(text, "t.csv", o));
    o.settings = {{"duplicate-tolerance", "lots", {"range.map", 4}}};
    r = parse_far_field_csv(text, "t.csv", o);
    REQUIRE_FALSE(r);
    CHECK(r.error().format() == "range.map:4: duplicate-tolerance: expected a share of the field from 0 to 100 %, such as 2 % or 0.02, found \"lots\"");
}

TEST_CASE("layouts: refusals", "[csv][layouts]") {
    // Theta beyond 180 either way, phi beyond the bounded range.
    Error e = refuse(header + row(0, 0) + row(-181, 0));
    CHECK(e.line == 3);
    CHECK_THAT(e.message, Contains("expected theta in [-180, 180]") && Contains("-181"));
    e = refuse(header + row(0, 0) + row(0, 800));
    CHECK(e.column == 3);
    CHECK_THAT(e.message, Contains("expected phi in [-360, 720]"));
    // Negative theta whose opposite half-plane does not fill an even phi step.
    std::string text = header;
    for (int p : {0, 45})
        for (int t = -90; t <= 90; t += 30) text += row(t, p);
    e = refuse(text);
    CHECK_THAT(e.message, Contains("theta below 0") && Contains("after 45 expected 90, found 180"));
    // The angles key against the columns, and the field columns a positioner grid needs.
    e = refuse("# angles: az-over-el\n" + header + row(0, 0));
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("angles: expected theta-phi for theta and phi columns"));
    e = refuse("# angles: sideways\nazimuth,elevation,e_total_db\n0,0,0\n");
    CHECK_THAT(e.message, Contains("horizon, az-over-el or el-over-az"));
    e = refuse("azimuth,elevation,e_az_re,e_az_im,e_el_re,e_el_im\n0,0,1,0,0,0\n");
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("e_az_/e_el_ field columns only with"));
    e = refuse("# angles: el-over-az\nazimuth,elevation,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n0,0,1,0,0,0\n");
    CHECK_THAT(e.message, Contains("in its own unit vectors"));
    e = refuse("# angles: el-over-az\nazimuth,elevation,e_az_db,e_el_db\n0,0,1,0\n");
    CHECK_THAT(e.message, Contains("without phase the field cannot be turned"));
    // A positioner table with a hole, named by its own angles.
    e = refuse("# angles: el-over-az\nazimuth,elevation,e_total_db\n0,-10,0\n0,0,0\n10,-10,0\n");
    CHECK_THAT(e.message, Contains("found 1 missing: elevation 0, azimuth 10 deg"));
    // A positioner scan that misses boresight.
    text = "# angles: az-over-el\nazimuth,elevation,e_total_db\n";
    for (int el = 30; el <= 60; el += 10)
        for (int az = -20; az <= 20; az += 10) text += std::to_string(az) + "," + std::to_string(el) + ",0\n";
    e = refuse(text);
    CHECK_THAT(e.message, Contains("positioner scan around boresight"));
}

TEST_CASE("layouts: a positioner cut on a principal plane is placed exactly", "[csv][layouts]") {
    // Azimuth over elevation at el = 0 sweeps the xz-plane: r = (sin az, 0, cos az), theta = |az|,
    // phi 0 or 180, with az-hat = (cos az, 0, -sin az) = theta-hat there (phi 0) or -theta-hat
    // (phi 180), el-hat = y = phi-hat at phi 0, -phi-hat at phi 180.
    std::string text = "# angles: az-over-el\nazimuth,elevation,e_az_re,e_az_im,e_el_re,e_el_im\n";
    for (int az = -180; az < 180; az += 15) {
        const PositionerFrame f = positioner_frame(PositionerGrid::az_over_el, az * deg, 0);
        const CVec3 e = field_at(f.r);
        const cplx a = dot(e, f.az_hat), b = dot(e, f.el_hat);
        char line[200];
        std::snprintf(line, sizeof line, "%d,0,%.17g,%.17g,%.17g,%.17g\n", az, a.real(), a.imag(), b.real(), b.imag());
        text += line;
    }
    const FarFieldSet s = parse(text);
    CHECK_THAT(s.reading_notes.back(), Contains("placed exactly"));
    CHECK(s.grid.phi.count == 2);
    CHECK(s.grid.theta.count == 13);
    for (int it = 0; it < s.grid.theta.count; ++it)
        for (int ip = 0; ip < 2; ++ip) {
            const double t = s.grid.theta.value_deg(it) * deg, p = s.grid.phi.value_deg(ip) * deg;
            const CVec3 e = field_at(direction(t, p));
            CHECK(std::abs(s.frequencies[0].e_theta[s.grid.index(it, ip)] - dot(e, theta_hat(t, p))) < 1e-12);
            CHECK(std::abs(s.frequencies[0].e_phi[s.grid.index(it, ip)] - dot(e, phi_hat(p))) < 1e-12);
        }
}

TEST_CASE("layouts: an arc of phi across 0 is written as one run and reads back", "[csv][layouts]") {
    // The writer keeps the arc 330..390 in one piece (phi in [0, 360) would split it into
    // 0..30 and 330..350, which is no regular axis).
    const FarFieldSet s = parse(grid_text(0, 180, -30, 30));
    CHECK(s.grid.phi.start_deg == 330);
    CHECK(s.grid.phi.count == 3);
    auto text = format_far_field_csv(s);
    REQUIRE(text);
    CHECK_THAT(*text, Contains(",30,390,"));
    same_samples(parse(*text), s);
}

TEST_CASE("layouts: a positioner scan of a region reads as the widest cone about +z inside it", "[csv][layouts]") {
    // Azimuth over elevation, az -60..60, el -40..40 in 5-degree steps: a cone of half-angle t is
    // inside when el = asin(sin t sin p) <= 40 and az = atan2(sin t cos p, cos t) <= 60 for every
    // phi, so t <= 40 (common practice: the largest cap inside the scanned rectangle).
    std::string text = "# angles: az-over-el\nazimuth,elevation,e_az_re,e_az_im,e_el_re,e_el_im\n";
    for (int el = -40; el <= 40; el += 5)
        for (int az = -60; az <= 60; az += 5) {
            const PositionerFrame f = positioner_frame(PositionerGrid::az_over_el, az * deg, el * deg);
            const CVec3 e = field_at(f.r);
            const cplx a = dot(e, f.az_hat), b = dot(e, f.el_hat);
            char line[200];
            std::snprintf(line, sizeof line, "%d,%d,%.17g,%.17g,%.17g,%.17g\n", az, el, a.real(), a.imag(), b.real(), b.imag());
            text += line;
        }
    const FarFieldSet s = parse(text);
    CHECK(s.grid.theta.start_deg == 0);
    CHECK(s.grid.theta.last_deg() == Approx(40));
    CHECK(s.grid.phi.step_deg == Approx(5));
    CHECK_THAT(s.reading_notes.back(), Contains("theta 0..40") && Contains("no wider cone"));
    // The field between the scan's samples: bilinear on the Cartesian vector, second order in the
    // 5-degree step (below 0.5 % of |E| for this field of two dipoles).
    for (int it = 0; it < s.grid.theta.count; ++it)
        for (int ip = 0; ip < s.grid.phi.count; ++ip) {
            const double t = s.grid.theta.value_deg(it) * deg, p = s.grid.phi.value_deg(ip) * deg;
            const CVec3 e = field_at(direction(t, p));
            const std::size_t k = s.grid.index(it, ip);
            const double d = std::hypot(std::abs(s.frequencies[0].e_theta[k] - dot(e, theta_hat(t, p))),
                                        std::abs(s.frequencies[0].e_phi[k] - dot(e, phi_hat(p))));
            CHECK(d < 5e-3);
        }
}

namespace {
// A whole-sphere azimuth-over-elevation scan (az -180..180, el -90..90, 15-degree steps: not on a
// theta/phi grid, so resampled), complex in the positioner's unit vectors; the row at (az, el) of
// `spoil` scaled by `scale`.
std::string az_over_el_scan(int spoil_az, int spoil_el, double scale) {
    std::string text = "# angles: az-over-el\nazimuth,elevation,e_az_re,e_az_im,e_el_re,e_el_im\n";
    for (int el = -90; el <= 90; el += 15)
        for (int az = -180; az <= 180; az += 15) {
            const PositionerFrame f = positioner_frame(PositionerGrid::az_over_el, az * deg, el * deg);
            const CVec3 e = field_at(f.r);
            const double k = az == spoil_az && el == spoil_el ? scale : 1;
            const cplx a = k * dot(e, f.az_hat), b = k * dot(e, f.el_hat);
            char line[200];
            std::snprintf(line, sizeof line, "%d,%d,%.17g,%.17g,%.17g,%.17g\n", az, el, a.real(), a.imag(), b.real(), b.imag());
            text += line;
        }
    return text;
}
}  // namespace

TEST_CASE("layouts: a resampled positioner scan checks its own repeated directions", "[csv][layouts]") {
    // az -180 and 180 are one direction at every el, and el +-90 is one direction (+-y) at every
    // az (pattern/positioner.hpp): the rows must agree like any direction given twice.
    const FarFieldSet s = parse(az_over_el_scan(0, 0, 1));
    CHECK_THAT(s.reading_notes.back(), Contains("resampled"));
    // 1 % is within the default tolerance (3 %, docs/far-field-csv.md "Tolerance").
    CHECK(parse_far_field_csv(az_over_el_scan(180, 30, 1.01), "t.csv"));
    // az 180 repeats az -180 (written first, line 2 + 8 x 25 + 0 = 202 at el 30): 10 % is refused.
    Error e = refuse(az_over_el_scan(180, 30, 1.1));
    CHECK(e.line == 2 + 8 * 25 + 24 + 1);
    CHECK_THAT(e.message, Contains("one field per direction") && Contains("line 203"));
    // The pole el = 90 at az 45 against the same direction at az -180 (the first row of that el).
    e = refuse(az_over_el_scan(45, 90, 0.5));
    CHECK(e.line == 2 + 12 * 25 + 15 + 1);
    CHECK_THAT(e.message, Contains("line " + std::to_string(2 + 12 * 25 + 1)) && Contains("theta 90, phi 90 deg"));
    // The tolerance a range gives widens the test here too.
    CsvReadOptions o;
    o.settings = {{"duplicate-tolerance", "20 %", {"range.map", 4}}};
    CHECK(parse_far_field_csv(az_over_el_scan(180, 30, 1.1), "t.csv", o));
}

TEST_CASE("layouts: messages name a positioner's field columns as the file does", "[csv][layouts]") {
    // e_az_* and e_el_* stand in for the theta/phi columns: messages give the file's names.
    Error e = refuse("# angles: az-over-el\nazimuth,elevation,e_az_re,e_az_im,e_el_re\n0,0,1,0,0\n");
    CHECK_THAT(e.message, Contains("expected a column \"e_el_im\" beside \"e_az_re\""));
    e = refuse("# angles: az-over-el\nazimuth,elevation,e_az_re,e_az_im,e_el_re,e_el_im\n0,0,1,abc,0,0\n");
    CHECK(e.column == 7);
    CHECK_THAT(e.message, Contains("expected a number in column \"e_az_im\", found \"abc\""));
    // A column map: the file's own header text, then the role it was given.
    CsvReadOptions o;
    o.column_map = {{"Az", "azimuth", {}}, {"El", "elevation", {}}, {"Eaz r", "e_az_re", {}}, {"Eaz i", "e_az_im", {}},
                    {"Eel r", "e_el_re", {}}, {"Eel i", "e_el_im", {}}};
    auto r = parse_far_field_csv("# angles: az-over-el\nAz,El,Eaz r,Eaz i,Eel r,Eel i\n0,0,1,0,x,0\n", "t.csv", o);
    REQUIRE_FALSE(r);
    CHECK_THAT(r.error().message, Contains("expected a number in column \"Eel r\" (e_el_re), found \"x\""));
}
