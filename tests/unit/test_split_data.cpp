// Data split over files and cut-only data (issue 14), against the same pattern in one schema
// file. The fixtures in tests/data/csv/split/ (made by make_split.py there) hold one invented
// antenna: an x-polarised Huygens source with a weak cross-polar lobe, directivity 3 (4.77 dBi)
// and E-/H-plane HPBW 2 acos(2 sqrt(1/2) - 1) = 131.1 deg for its co-polar part (derived in
// make_split.py; the cardioid of docs/far-field-csv.md's worked example).
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "importers/far_field_csv.hpp"
#include "pattern/cut.hpp"
#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/merge.hpp"
#include "pattern/components.hpp"
#include "pattern/convention_hints.hpp"
#include "pattern/summary.hpp"

using namespace ellipsa;

namespace {

FarFieldSet split_file(const std::string& name) {
    auto r = read_far_field_csv(std::string(ELLIPSA_SOURCE_DIR) + "/tests/data/csv/split/" + name);
    if (!r) FAIL(r.error().format());
    return *r;
}

BeamFigures plane_beam(const FarFieldSet& s, std::size_t fi, double phi_deg) {
    auto c = compute_cut(s, fi, CutSpec::phi_cut(phi_deg), {Component::total}, 1.0);
    if (!c) FAIL(c.error().format());
    return c->beams[0];
}

// Largest difference of the complex fields of two sets on the same grid, over every frequency.
double largest_difference(const FarFieldSet& a, const FarFieldSet& b) {
    REQUIRE(a.frequencies.size() == b.frequencies.size());
    double d = 0;
    for (std::size_t k = 0; k < a.frequencies.size(); ++k) {
        CHECK(a.frequencies[k].frequency_hz == Approx(b.frequencies[k].frequency_hz));
        for (std::size_t i = 0; i < a.grid.size(); ++i) {
            d = std::max(d, std::abs(a.frequencies[k].e_theta[i] - b.frequencies[k].e_theta[i]));
            d = std::max(d, std::abs(a.frequencies[k].e_phi[i] - b.frequencies[k].e_phi[i]));
        }
    }
    return d;
}

Result<FarFieldSet> merged(const std::vector<std::string>& names) {
    std::vector<NamedSet> sets;
    for (const std::string& n : names) sets.push_back({n, split_file(n)});
    return merge_sets(std::move(sets));
}

}  // namespace

TEST_CASE("cut-only data: principal cuts are read as cuts, not as a coarse sphere", "[split][cuts]") {
    const FarFieldSet cuts = split_file("cuts.csv");
    CHECK(cuts.grid.sampling == Sampling::cuts);  // phi step 90 over theta step 2 (far_field.hpp rule)
    CHECK(coverage(cuts.grid) == 0);
    CHECK_FALSE(is_full_sphere(cuts.grid));
    CHECK(sphere_shortfall(cuts.grid) == "the data hold cuts only (phi 0, 90, 180, 270 deg)");
    const FarFieldSet az = split_file("azimuth_cut.csv");
    CHECK(az.grid.sampling == Sampling::cuts);
    CHECK(sphere_shortfall(az.grid) == "the data hold cuts only (theta 90 deg)");
    // The sphere at 10 degrees in both angles is a surface.
    CHECK(split_file("sphere.csv").grid.sampling == Sampling::surface);
}

TEST_CASE("cut-only data: nothing is blended between two cut planes", "[split][cuts]") {
    const FarFieldSet cuts = split_file("cuts.csv");
    CHECK(interpolate(cuts, 0, 40.0, 90.0));           // on a cut
    CHECK(interpolate(cuts, 0, 41.0, 270.0));          // between theta samples of a cut
    CHECK_FALSE(interpolate(cuts, 0, 40.0, 45.0));     // between the phi = 0 and phi = 90 planes
    CHECK(interpolate(cuts, 0, 0.0, 45.0));            // the pole belongs to every cut
    const FarFieldSet az = split_file("azimuth_cut.csv");
    CHECK(interpolate(az, 0, 90.0, 45.0));             // along the one azimuth cut
    CHECK_FALSE(interpolate(az, 0, 80.0, 45.0));
}

TEST_CASE("cut-only data: beam figures and polarisation match the whole pattern", "[split][cuts]") {
    const FarFieldSet cuts = split_file("cuts.csv"), sphere = split_file("sphere.csv");
    REQUIRE(cuts.frequencies.size() == 3);
    for (std::size_t fi = 0; fi < 3; ++fi) {
        const PatternSummary a = summarize(cuts, fi), b = summarize(sphere, fi);
        // Peak at boresight; a(f)^2 = 0.9, 0.95, 0.92 times 3 (make_split.py).
        CHECK(a.peak.theta_deg == Approx(0).margin(1e-9));
        CHECK(a.peak_db == Approx(b.peak_db).margin(1e-6));
        CHECK(a.peak_db == Approx(10 * std::log10(3 * (fi == 0 ? 0.9 : fi == 1 ? 0.95 : 0.92))).margin(1e-6));
        // E- and H-plane HPBW 131.1 deg (closed form, make_split.py), from the cuts as from the sphere.
        for (double phi : {0.0, 90.0}) {
            const BeamFigures ca = plane_beam(cuts, fi, phi), cb = plane_beam(sphere, fi, phi);
            REQUIRE(ca.hpbw_deg);
            REQUIRE(cb.hpbw_deg);
            // The cuts' 2-degree steps resolve the beam edge to 0.1 deg; the sphere's 10-degree
            // grid interpolates it to within 1 deg.
            CHECK(*ca.hpbw_deg == Approx(2 * std::acos(2 * std::sqrt(0.5) - 1) / deg).margin(0.1));
            CHECK(*ca.hpbw_deg == Approx(*cb.hpbw_deg).margin(1.0));
        }
        CHECK(a.front_to_back_above_db.has_value() == b.front_to_back_above_db.has_value());  // the back is a null
        REQUIRE(a.sense);
        CHECK(*a.sense == *b.sense);
        CHECK(a.axial_ratio_db.has_value() == b.axial_ratio_db.has_value());
    }
}

TEST_CASE("cut-only data: whole-sphere figures say they need a sphere", "[split][cuts]") {
    const FarFieldSet cuts = split_file("cuts.csv");
    const PatternSummary r = summarize(cuts, 1);
    CHECK_FALSE(r.directivity_dbi);
    CHECK_FALSE(r.power.directivity_sampled_only);  // never a number over no solid angle
    CHECK_FALSE(r.power.radiation_efficiency);
    auto meg = mean_effective_gain(cuts, 1, Environment{});
    REQUIRE_FALSE(meg);
    CHECK(meg.error().message == "MEG needs the whole sphere; the data hold cuts only (phi 0, 90, 180, 270 deg)");
}

TEST_CASE("cut-only data: the sampling survives writing and reading back", "[split][cuts]") {
    FarFieldSet cuts = split_file("cuts.csv");
    auto text = format_far_field_csv(cuts);
    REQUIRE(text);
    auto back = parse_far_field_csv(*text, "back.csv");
    REQUIRE(back);
    CHECK(back->grid.sampling == Sampling::cuts);
    // A coarse sphere declared as a surface stays one, though the grid looks like cuts.
    cuts.grid.sampling = Sampling::surface;
    text = format_far_field_csv(cuts);
    REQUIRE(text);
    CHECK(text->find("# sampling: surface\n") != std::string::npos);
    back = parse_far_field_csv(*text, "back.csv");
    REQUIRE(back);
    CHECK(back->grid.sampling == Sampling::surface);
    CHECK(coverage(back->grid) == Approx(1.0));
}

TEST_CASE("split data: one file per frequency merges into the multi-frequency set", "[split][merge]") {
    const FarFieldSet sphere = split_file("sphere.csv");
    auto m = merged({"f2500.csv", "f2400.csv", "f2450.csv"});  // any order: sorted by frequency
    REQUIRE(m);
    CHECK(m->part == FieldPart::whole);
    CHECK(m->frequencies[0].frequency_hz == Approx(2.40e9));
    CHECK(m->frequencies[2].frequency_hz == Approx(2.50e9));
    CHECK(largest_difference(*m, sphere) == 0);  // the same numbers in the same text
    CHECK(m->source == "f2500.csv + f2400.csv + f2450.csv");
    CHECK(m->reading_notes.back() == "merged frequencies from 3 files: f2500.csv + f2400.csv + f2450.csv");
    const PatternSummary a = summarize(*m, 1), b = summarize(sphere, 1);
    CHECK(*a.directivity_dbi == Approx(*b.directivity_dbi));
    // By hand (make_split.py): efficiency a^2 (1 + 0.003) = 0.95 * 1.003, to the 10-degree grid's 1 %.
    CHECK(*a.power.radiation_efficiency == Approx(0.95 * 1.003).epsilon(0.01));
}

TEST_CASE("split data: one file per polarisation merges into the whole field", "[split][merge]") {
    const FarFieldSet sphere = split_file("sphere.csv");
    const FarFieldSet co = split_file("co.csv");
    CHECK(co.part == FieldPart::co);
    REQUIRE(polarisation_unavailable(co));
    CHECK(polarisation_unavailable(co)->find("co-polar part only") != std::string::npos);
    // Ludwig-3 co + cross (dB and phase to 12 digits) and E_theta + E_phi give the schema file's fields.
    for (auto names : {std::vector<std::string>{"co.csv", "cross.csv"}, {"cross.csv", "co.csv"}, {"e_theta.csv", "e_phi.csv"}}) {
        auto m = merged(names);
        REQUIRE(m);
        CHECK(m->part == FieldPart::whole);
        CHECK(largest_difference(*m, sphere) < 1e-9);
        const PatternSummary a = summarize(*m, 2), b = summarize(sphere, 2);
        CHECK(*a.directivity_dbi == Approx(*b.directivity_dbi).margin(1e-9));
        REQUIRE(a.axial_ratio_db.has_value() == b.axial_ratio_db.has_value());
        CHECK(*a.sense == *b.sense);
    }
    // The reading note says what was merged.
    auto both = merged({"co.csv", "cross.csv"});
    REQUIRE(both);
    CHECK(both->reading_notes.back() == "merged co-polar and cross-polar parts from 2 files: co.csv + cross.csv");
}

TEST_CASE("split data: what cannot be merged is refused naming both files", "[split][merge]") {
    auto twice = merged({"f2400.csv", "f2400.csv"});
    REQUIRE_FALSE(twice);
    CHECK(twice.error().message == "f2400.csv and f2400.csv: expected distinct frequencies, found 2.4 GHz in both");
    auto sampling = merged({"sphere.csv", "cuts.csv"});
    REQUIRE_FALSE(sampling);
    CHECK(sampling.error().message == "sphere.csv and cuts.csv: expected the same grid, found surface and cuts sampling");
    auto bases = merged({"co.csv", "e_phi.csv"});
    REQUIRE_FALSE(bases);
    CHECK(bases.error().message ==
          "co.csv and e_phi.csv: expected the two parts of one basis (E_theta and E_phi, RHCP and LHCP, co- and "
          "cross-polar), found co-polar and E_phi");
    // A grid that starts 5 degrees later in theta: the first direction one has and the other lacks.
    std::vector<NamedSet> sets{{"co.csv", split_file("co.csv")}, {"cross.csv", split_file("cross.csv")}};
    sets[1].set.grid.theta.start_deg = 5;
    auto grid = merge_sets(std::move(sets));
    REQUIRE_FALSE(grid);
    CHECK(grid.error().message ==
          "co.csv and cross.csv: expected the same grid; the first direction of co.csv that cross.csv lacks: theta 0, phi 0 deg");
    // A part without one of the other's frequencies.
    sets = {{"co.csv", split_file("co.csv")}, {"cross.csv", split_file("cross.csv")}};
    sets[1].set.frequencies.pop_back();
    auto missing = merge_sets(std::move(sets));
    REQUIRE_FALSE(missing);
    CHECK(missing.error().message == "cross.csv: expected 2.5 GHz as in co.csv (each part at every frequency), found none");
}

TEST_CASE("convention hints: a sense that flips between neighbouring frequencies", "[split][hints]") {
    // make_split.py: a right-hand circular pattern whose middle scan has its phases conjugated,
    // as exp(-i w t) data read as exp(+j w t) would (conventions.md: conjugation flips the sense).
    const FarFieldSet s = split_file("flipping_sense.csv");
    const std::vector<std::size_t> all{0, 1, 2};
    const std::vector<std::string> hints = convention_hints(s, all, summarize_each(s, all));
    REQUIRE(hints.size() == 1);
    CHECK(hints[0].rfind("hint: ", 0) == 0);
    CHECK(hints[0].find("(right-hand at 2.4 GHz, left-hand at 2.45 GHz, right-hand at 2.5 GHz)") != std::string::npos);
    CHECK(hints[0].find("time-convention: -iwt") != std::string::npos);
    // The outer scans alone keep their sense: no hint.
    const std::vector<std::size_t> outer{0, 2};
    CHECK(convention_hints(s, outer, summarize_each(s, outer)).empty());
    // A linear pattern never triggers it.
    const FarFieldSet sphere = split_file("sphere.csv");
    CHECK(convention_hints(sphere, all, summarize_each(sphere, all)).empty());
}

TEST_CASE("convention hints: co- and cross-polar columns that look exchanged", "[split][hints]") {
    const std::vector<std::size_t> all{0, 1, 2};
    const FarFieldSet swapped = split_file("swapped_pair.csv");
    CHECK(swapped.ludwig3_declared);
    const std::vector<std::string> hints = convention_hints(swapped, all, summarize_each(swapped, all));
    REQUIRE(hints.size() == 1);
    CHECK(hints[0] ==
          "hint: at the peak the cross-polar level exceeds the co-polar one (Ludwig-3, x reference) at 2.4 GHz "
          "(co-polar zero), 2.45 GHz (co-polar zero), 2.5 GHz (co-polar zero); the co- and cross-polar columns may "
          "be exchanged, or the antenna is polarised along the other reference");
    // The same antenna with its columns in place: no hint.
    auto m = merged({"co.csv", "cross.csv"});
    REQUIRE(m);
    CHECK(m->ludwig3_declared);
    CHECK(convention_hints(*m, all, summarize_each(*m, all)).empty());
}

TEST_CASE("cut-only data: principal planes over theta -180..180 read as the same cuts", "[split][cuts]") {
    // A range's usual cut file: the phi = 0 and phi = 90 planes, theta -180..180 (negative theta
    // is the opposite half-plane, docs/far-field-csv.md "Angle layouts"), written here from cuts.csv.
    const FarFieldSet cuts = split_file("cuts.csv");
    std::string text = "# quantity: gain\n# frequency: 2.45 GHz\ntheta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    char row[256];
    for (int plane : {0, 90})
        for (int t = -180; t <= 180; t += 2) {
            const int phi = t < 0 ? plane + 180 : plane;
            auto v = interpolate(cuts, 1, std::abs(t), phi);
            REQUIRE(v);
            // Negative theta: the opposite half-plane's unit vectors, so both components change sign.
            const double sign = t < 0 ? -1 : 1;
            std::snprintf(row, sizeof row, "%d,%d,%.17g,%.17g,%.17g,%.17g\n", t, plane, sign * v->e_theta.real(),
                          sign * v->e_theta.imag(), sign * v->e_phi.real(), sign * v->e_phi.imag());
            text += row;
        }
    auto s = parse_far_field_csv(text, "planes.csv");
    if (!s) FAIL(s.error().format());
    CHECK(s->grid.sampling == Sampling::cuts);
    CHECK(s->grid.phi.count == 4);
    const PatternSummary a = summarize(*s, 0), b = summarize(cuts, 1);
    CHECK(a.peak_db == Approx(b.peak_db).margin(1e-9));
    CHECK(*a.elevation.hpbw_deg == Approx(*b.elevation.hpbw_deg).margin(1e-6));
    CHECK(*a.azimuth.hpbw_deg == Approx(*b.azimuth.hpbw_deg).margin(1e-6));
}

TEST_CASE("split data: a positioner grid's field needs both of its components", "[split][merge]") {
    const std::string text = "# angles: az-over-el\nazimuth,elevation,e_az_db,e_az_phase\n0,0,0,0\n10,0,0,0\n0,10,0,0\n10,10,0,0\n";
    auto s = parse_far_field_csv(text, "az_only.csv");
    REQUIRE_FALSE(s);
    CHECK(s.error().message.find("expected both field components of a positioner grid") != std::string::npos);
}
