// Writer and reader together: every family and every option round-trips.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "importers/far_field_csv.hpp"
#include "pattern/integrate.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;

namespace {

// A tilted, elliptically polarised test pattern with two frequencies: crossed dipoles fed
// 60 deg apart (neither linear nor circular), turned so no component vanishes identically.
FarFieldSet sample_set(double step) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -60;
    a.orientation = rotation_xyz_deg(20, 35, 10);
    FarFieldSet s = synthesize(a, step, 1.5e9);
    FarFieldSet s2 = synthesize(a, step, 1.5e9);
    s.frequencies.push_back(s2.frequencies[0]);
    s.frequencies[1].frequency_hz = 2.25e9;
    for (auto& v : s.frequencies[1].e_theta) v *= cplx(0.5, 0.25);
    s.name = "round trip";
    s.note = "line one\nline two";
    s.quantity = Quantity::directivity;
    return s;
}

double max_rel_error(const FarFieldSet& a, const FarFieldSet& b) {
    double peak = 0, err = 0;
    for (std::size_t f = 0; f < a.frequencies.size(); ++f)
        for (std::size_t k = 0; k < a.grid.size(); ++k) {
            peak = std::max(peak, std::sqrt(power(a.frequencies[f].e_theta[k], a.frequencies[f].e_phi[k])));
            err = std::max(err, std::abs(a.frequencies[f].e_theta[k] - b.frequencies[f].e_theta[k]));
            err = std::max(err, std::abs(a.frequencies[f].e_phi[k] - b.frequencies[f].e_phi[k]));
        }
    return err / peak;
}

void same_grid(const FarFieldSet& a, const FarFieldSet& b) {
    CHECK(a.grid.theta.count == b.grid.theta.count);
    CHECK(a.grid.phi.count == b.grid.phi.count);
    CHECK(a.grid.theta.start_deg == Approx(b.grid.theta.start_deg));
    CHECK(a.grid.theta.step_deg == Approx(b.grid.theta.step_deg));
    CHECK(a.grid.phi.start_deg == Approx(b.grid.phi.start_deg).margin(1e-12));
    CHECK(a.grid.phi.step_deg == Approx(b.grid.phi.step_deg));
    REQUIRE(a.frequencies.size() == b.frequencies.size());
    for (std::size_t f = 0; f < a.frequencies.size(); ++f)
        CHECK(a.frequencies[f].frequency_hz == b.frequencies[f].frequency_hz);
}

FarFieldSet round_trip(const FarFieldSet& s, CsvFamily fam) {
    CsvWriteOptions w;
    w.family = fam;
    auto text = format_far_field_csv(s, w);
    REQUIRE(text.ok());
    auto r = parse_far_field_csv(*text, "rt.csv");
    INFO(to_string(fam));
    if (!r) FAIL(r.error().format());
    return *r;
}

}  // namespace

TEST_CASE("the complex family round-trips exactly", "[csv][roundtrip]") {
    // Shortest round-trip formatting (std::to_chars) reads back bit for bit: common practice.
    FarFieldSet s = sample_set(5);
    FarFieldSet r = round_trip(s, CsvFamily::complex);
    same_grid(s, r);
    CHECK(max_rel_error(s, r) == 0.0);
    CHECK(r.name == "round trip");
    CHECK(r.note == "line one\nline two");
    CHECK(r.quantity == Quantity::directivity);
    CHECK(r.content == FieldContent::complex);
}

TEST_CASE("every family with phase round-trips to 1e-12", "[csv][roundtrip]") {
    FarFieldSet s = sample_set(5);
    for (CsvFamily fam : {CsvFamily::theta_phi_polar, CsvFamily::circular_polar, CsvFamily::ludwig3_polar}) {
        for (Ludwig3Reference ref : {Ludwig3Reference::x, Ludwig3Reference::y}) {
            s.ludwig3_reference = ref;
            FarFieldSet r = round_trip(s, fam);
            INFO(to_string(fam));
            same_grid(s, r);
            CHECK(max_rel_error(s, r) < 1e-12);
            CHECK(r.content == FieldContent::complex);
            if (fam == CsvFamily::ludwig3_polar) CHECK(r.ludwig3_reference == ref);
        }
    }
}

TEST_CASE("magnitude-only and total-only families keep what they can", "[csv][roundtrip]") {
    FarFieldSet s = sample_set(10);
    FarFieldSet m = round_trip(s, CsvFamily::magnitude_db);
    CHECK(m.content == FieldContent::magnitude_only);
    FarFieldSet t = round_trip(s, CsvFamily::total_db);
    CHECK(t.content == FieldContent::total_only);
    double worst_m = 0, worst_t = 0;
    for (std::size_t f = 0; f < s.frequencies.size(); ++f)
        for (std::size_t k = 0; k < s.grid.size(); ++k) {
            const cplx et = s.frequencies[f].e_theta[k], ep = s.frequencies[f].e_phi[k];
            worst_m = std::max(worst_m, std::abs(std::abs(et) - m.frequencies[f].e_theta[k].real()));
            worst_m = std::max(worst_m, std::abs(std::abs(ep) - m.frequencies[f].e_phi[k].real()));
            CHECK(m.frequencies[f].e_theta[k].imag() == 0);
            // total-only: E_theta = sqrt(total), E_phi = 0 (far_field.hpp).
            worst_t = std::max(worst_t, std::abs(std::sqrt(power(et, ep)) - t.frequencies[f].e_theta[k].real()));
            CHECK(t.frequencies[f].e_phi[k] == cplx(0, 0));
        }
    CHECK(worst_m < 1e-12);
    CHECK(worst_t < 1e-12);
    // Magnitude data write as magnitude or total, never as a phase family.
    CsvWriteOptions w;
    w.family = CsvFamily::complex;
    CHECK_FALSE(format_far_field_csv(m, w).ok());
    w.family = CsvFamily::total_db;
    CHECK(format_far_field_csv(m, w).ok());
    w.family = CsvFamily::magnitude_db;
    CHECK_FALSE(format_far_field_csv(t, w).ok());
    CHECK(natural_family(m) == CsvFamily::magnitude_db);
    CHECK(natural_family(t) == CsvFamily::total_db);
}

TEST_CASE("radiated power survives every family", "[csv][roundtrip]") {
    // Short dipole: D = 1.5 (Balanis sec. 4.2); the integral is the same whatever the columns.
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, 2, 1e9);
    for (CsvFamily fam : {CsvFamily::complex, CsvFamily::theta_phi_polar, CsvFamily::circular_polar,
                          CsvFamily::ludwig3_polar, CsvFamily::magnitude_db, CsvFamily::total_db}) {
        FarFieldSet r = round_trip(s, fam);
        CHECK(radiated_power(r.grid, r.frequencies[0]) / (4 * pi) == Approx(1.0).epsilon(1e-3));
    }
}

TEST_CASE("file writes go through the atomic writer and read back", "[csv][roundtrip]") {
    FarFieldSet s = sample_set(15);
    const std::string path = "ellipsa_test_roundtrip.csv";
    REQUIRE(write_far_field_csv(s, path).ok());
    auto r = read_far_field_csv(path);
    REQUIRE(r.ok());
    CHECK(max_rel_error(s, *r) == 0.0);
    CsvWriteOptions w;
    w.overwrite = false;
    auto st = write_far_field_csv(s, path, w);
    REQUIRE_FALSE(st.ok());
    CHECK(st.error().message.find("exists") != std::string::npos);
    std::remove(path.c_str());
}

TEST_CASE("a file carries its own mounting: mounting-up and mounting-turns", "[csv][roundtrip][mounting]") {
    // docs/far-field-csv.md "Mounting": the writer records the mounting while the fields are in
    // the file's frame; the reader gives it back as the file's mounting, untouched fields.
    FarFieldSet s = sample_set(15);
    s.file_mounting.up = direction_deg(60, 30);
    s.file_mounting.turns = {{Axis::z, 30}, {Axis::x, -10}};
    auto text = format_far_field_csv(s, CsvWriteOptions{});
    REQUIRE(text.ok());
    CHECK(text->find("# mounting-up: 60,30\n") != std::string::npos);
    CHECK(text->find("# mounting-turns: z:30,x:-10\n") != std::string::npos);
    auto r = parse_far_field_csv(*text, "rt.csv");
    REQUIRE(r);
    CHECK(r->file_mounting.up.x == Approx(s.file_mounting.up.x).margin(1e-12));
    CHECK(r->file_mounting.up.y == Approx(s.file_mounting.up.y).margin(1e-12));
    CHECK(r->file_mounting.up.z == Approx(s.file_mounting.up.z).margin(1e-12));
    REQUIRE(r->file_mounting.turns.size() == 2);
    CHECK(r->file_mounting.turns[1].angle_deg == -10);
    CHECK(is_identity(r->mounting));  // read, not applied: install_pattern applies it
    CHECK(max_rel_error(s, *r) == 0.0);

    // A pattern already turned by its mounting is written as the installed antenna, with none.
    s.mounting = s.file_mounting;
    auto turned = format_far_field_csv(s, CsvWriteOptions{});
    REQUIRE(turned.ok());
    CHECK(turned->find("mounting-") == std::string::npos);

    // Bad values are refused at their line and column, saying what was expected.
    auto bad = parse_far_field_csv("# mounting-up: sideways\ntheta,phi,e_total_db\n0,0,1\n", "bad.csv");
    REQUIRE(!bad);
    CHECK(bad.error().line == 1);
    CHECK(bad.error().message.find("mounting-up: expected an axis") == 0);
    auto bad_turns = parse_far_field_csv("# mounting-turns: z30\ntheta,phi,e_total_db\n0,0,1\n", "bad.csv");
    REQUIRE(!bad_turns);
    CHECK(bad_turns.error().message.find("mounting-turns: expected turns AXIS:DEG") == 0);
}
