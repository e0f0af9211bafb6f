// The corpus of tricky but valid files in tests/data/csv (made by make_corpus.py there) loads
// to the expected grids and values. Most hold a short dipole along z, E_theta = sqrt(1.5) sin t
// (Balanis sec. 4.2: D = 1.5).
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "importers/far_field_csv.hpp"
#include "pattern/integrate.hpp"
#include "pattern/polarisation.hpp"

using namespace ellipsa;

namespace {

FarFieldSet corpus(const char* name) {
    auto r = read_far_field_csv(std::string(ELLIPSA_SOURCE_DIR) + "/tests/data/csv/" + name);
    if (!r) FAIL(r.error().format());
    return *r;
}

cplx at(const FarFieldSet& s, double theta, double phi, bool phi_part = false) {
    const int i = int(std::lround((theta - s.grid.theta.start_deg) / s.grid.theta.step_deg));
    const int j = int(std::lround(wrap360(phi - s.grid.phi.start_deg) / s.grid.phi.step_deg)) % s.grid.phi.count;
    const std::size_t k = s.grid.index(i, j);
    return phi_part ? s.frequencies[0].e_phi[k] : s.frequencies[0].e_theta[k];
}

const double a_dipole = std::sqrt(1.5);

}  // namespace

TEST_CASE("corpus: the phi = 360 seam duplicate merges", "[csv][corpus]") {
    FarFieldSet s = corpus("seam_0_360.csv");
    CHECK(s.name == "seam 0-360");
    CHECK(s.grid.phi.start_deg == 0);
    CHECK(s.grid.phi.count == 12);
    CHECK(s.grid.phi.step_deg == 30);
    CHECK(s.grid.phi_wraps());
    CHECK(at(s, 60, 330).real() == Approx(a_dipole * std::sin(60 * deg)));
}

TEST_CASE("corpus: phi -180..180, rows descending, polar family", "[csv][corpus]") {
    FarFieldSet s = corpus("phi_pm180_descending.csv");
    CHECK(s.grid.phi.start_deg == 0);  // stored in [0, 360), starting at the smallest sample
    CHECK(s.grid.phi.count == 8);
    CHECK(s.grid.theta.count == 5);
    // The phase column holds phi as written: phi = -90 is stored at 270 with phase -90 deg.
    CHECK(std::arg(at(s, 45, 270)) == Approx(-90 * deg));
    CHECK(std::abs(at(s, 45, 270)) == Approx(a_dipole * std::sin(45 * deg)));
    CHECK(at(s, 90, 0, true) == cplx(0, 0));
}

TEST_CASE("corpus: a single pole sample is turned to every phi", "[csv][corpus]") {
    // A field along x-hat: E_theta = cos t cos p, E_phi = -sin p (conventions.md unit vectors);
    // at the poles the basis turns with phi, so the one sample fixes the whole ring.
    FarFieldSet s = corpus("single_pole_samples.csv");
    CHECK(s.grid.phi.count == 12);
    for (double p : {0.0, 30.0, 90.0, 210.0}) {
        CHECK(at(s, 0, p).real() == Approx(std::cos(p * deg)).margin(1e-15));
        CHECK(at(s, 0, p, true).real() == Approx(-std::sin(p * deg)).margin(1e-15));
        CHECK(at(s, 180, p).real() == Approx(-std::cos(p * deg)).margin(1e-15));
        CHECK(at(s, 180, p, true).real() == Approx(-std::sin(p * deg)).margin(1e-15));
    }
}

TEST_CASE("corpus: a hemisphere keeps its coverage", "[csv][corpus]") {
    FarFieldSet s = corpus("upper_hemisphere.csv");
    CHECK(s.content == FieldContent::magnitude_only);
    CHECK(s.quantity == Quantity::directivity);
    CHECK(s.grid.theta.last_deg() == 90);
    // Cells clipped to the sampled theta range [0, 90]: half the sphere (integrate.hpp).
    CHECK(coverage(s.grid) == Approx(0.5).epsilon(1e-9));
    CHECK(at(s, 90, 45).real() == Approx(a_dipole));
}

TEST_CASE("corpus: decimal commas, semicolons, CRLF and a BOM", "[csv][corpus]") {
    FarFieldSet s = corpus("decimal_comma_crlf.csv");
    CHECK(s.content == FieldContent::total_only);
    CHECK(s.frequencies[0].frequency_hz == Approx(2.45e9));
    CHECK(s.grid.theta.step_deg == 45);
    CHECK(std::abs(at(s, 45, 180)) == Approx(a_dipole * std::sin(45 * deg)));
    CHECK(at(s, 0, 0) == cplx(0, 0));
}

TEST_CASE("corpus: azimuth/elevation with the -180/180 seam", "[csv][corpus]") {
    FarFieldSet s = corpus("azimuth_elevation.csv");
    CHECK(s.grid.theta.count == 7);
    CHECK(s.grid.theta.step_deg == 30);
    CHECK(s.grid.phi.count == 6);
    // elevation 30 -> theta 60 (conventions.md)
    CHECK(at(s, 60, 120).real() == Approx(a_dipole * std::sin(60 * deg)));
    // Directivity from the coarse grid is near the short dipole's 1.5 (Balanis sec. 4.2).
    CHECK(radiated_power(s.grid, s.frequencies[0]) / (4 * pi) == Approx(1.0).epsilon(0.05));
}

TEST_CASE("corpus: exp(-iwt) circular data in radians", "[csv][corpus]") {
    // E_R = 1 at phase +30 deg under -iwt is phase -30 deg under +jwt (conventions.md); then
    // E_theta = E_R / sqrt2, E_phi = -j E_R / sqrt2, right-hand: Stokes V > 0.
    FarFieldSet s = corpus("minus_iwt_circular_rad.csv");
    CHECK(s.time_convention_converted);
    CHECK(s.grid.theta.step_deg == Approx(30));
    CHECK(s.grid.theta.last_deg() == Approx(90));
    const cplx et = at(s, 60, 90), ep = at(s, 60, 90, true);
    CHECK(std::abs(rhcp(et, ep)) == Approx(1.0));
    CHECK(std::abs(lhcp(et, ep)) < 1e-15);
    CHECK(std::arg(rhcp(et, ep)) == Approx(-30 * deg));
    CHECK(stokes(et, ep).v > 0);
    CHECK(sense_of(stokes(et, ep)) == Sense::right);
}

TEST_CASE("corpus: a single phi cut in Ludwig-3 (y reference), tab separated", "[csv][corpus]") {
    FarFieldSet s = corpus("phi_cut_ludwig3_tabs.csv");
    CHECK(s.grid.phi.count == 1);
    CHECK(s.grid.phi.start_deg == 90);
    CHECK(s.ludwig3_reference == Ludwig3Reference::y);
    // y reference at phi = 90: co = E_theta (Ludwig 1973, third definition).
    CHECK(at(s, 40, 90).real() == Approx(a_dipole * std::sin(40 * deg)));
    CHECK(std::abs(at(s, 40, 90, true)) < 1e-15);
}

TEST_CASE("corpus: the worked foreign-layout example of docs/far-field-csv.md", "[csv][corpus]") {
    // An invented lossless cardioid toward +z, G = 3 ((1 + cos t)/2)^2: the integral of
    // ((1 + cos t)/2)^2 over the sphere is 4 pi / 3 (by hand), so D = 3 and P / 4 pi = 1.
    const std::string dir = std::string(ELLIPSA_SOURCE_DIR) + "/tests/data/csv/foreign/";
    CsvReadOptions o;
    REQUIRE(read_csv_map_file(dir + "range3.map", o).ok());
    auto r = read_far_field_csv(dir + "range3.csv", o);
    if (!r) FAIL(r.error().format());
    const FarFieldSet& s = *r;
    CHECK(s.content == FieldContent::total_only);
    CHECK(s.quantity == Quantity::gain);
    CHECK(s.frequencies[0].frequency_hz == Approx(5.8e9));
    CHECK(s.grid.theta.count == 19);
    CHECK(s.grid.phi.count == 36);
    // Elevation 90 is theta 0, the peak: 4.7712 dB - 7.5 dB in the file + 7.5 dB offset (4 decimals written).
    CHECK(std::norm(at(s, 0, 0)) == Approx(3.0).epsilon(1e-4));
    CHECK(std::norm(at(s, 180, 0)) == 0.0);
    // 10-degree cells: the exact-cell integral is within 0.5 % of the closed form.
    CHECK(radiated_power(s.grid, s.frequencies[0]) / (4 * pi) == Approx(1.0).epsilon(5e-3));
    // Without the map the header is refused at its first unknown column.
    auto bare = read_far_field_csv(dir + "range3.csv");
    REQUIRE_FALSE(bare.ok());
    CHECK(bare.error().line == 1);
    CHECK(bare.error().column == 1);
}
