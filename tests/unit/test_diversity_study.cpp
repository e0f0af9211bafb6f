// The one diversity study (pattern/diversity_study.hpp): the same figures as the functions it
// calls, and the pairing of the two patterns' frequencies.
#include <catch2/catch.hpp>

#include "pattern/diversity_study.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {
// The set with a second frequency added (the same fields at f2).
FarFieldSet two_frequencies(FarFieldSet s, double f1, double f2) {
    s.frequencies[0].frequency_hz = f1;
    FarField g = s.frequencies[0];
    g.frequency_hz = f2;
    s.frequencies.push_back(g);
    return s;
}
}  // namespace

TEST_CASE("diversity study: figures, frequency pairing and errors", "[diversity][study]") {
    const Environment e = urbanish_environment();
    const FarFieldSet z = two_frequencies(diversity_fixture(ReferenceKind::dipole, {}, 2.0), 2.4e9, 2.5e9);
    const FarFieldSet c = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 0, 0), 2.0);
    DiversityOptions o;
    o.orientations = true;
    o.sweep.tilt_step_deg = 45;
    o.sweep.roll_step_deg = 90;
    auto st = study_diversity(e, o, {{&z, "z.csv", {}}, {&c, "c.csv", {}}});
    REQUIRE(st);
    REQUIRE(st->patterns.size() == 2);
    REQUIRE(st->patterns[0].size() == 2);  // every frequency of z
    REQUIRE(st->pairs.size() == 2);
    // The figures are the core functions' own (Taga 1990; Vaughan & Andersen 1987).
    const FrequencyStudy& f = st->patterns[0][1];
    CHECK(f.frequency_hz == 2.5e9);
    REQUIRE(f.meg);
    CHECK(f.meg->meg == mean_effective_gain(z, 1, e)->meg);
    REQUIRE(f.orientations);
    REQUIRE(*f.orientations);
    CHECK((*f.orientations)->min == orientation_robustness(z, 1, e, o.sweep)->min);
    // c holds one frequency (1 GHz, not 2.4 GHz): it pairs with each, taken as given and flagged.
    for (const PairStudy& q : st->pairs) {
        REQUIRE(q.correlation);
        CHECK(q.frequencies_differ);
        CHECK(q.correlation->ecc == envelope_correlation(z, q.index, c, 0, e)->ecc);
        REQUIRE(q.meg_ratio_db);
        CHECK(*q.meg_ratio_db == Approx(to_db(mean_effective_gain(z, q.index, e)->meg / mean_effective_gain(c, 0, e)->meg)));
    }
    // Two multi-frequency patterns pair by the nearest frequency within 0.5 %; none: an Error that lists them.
    const FarFieldSet c2 = two_frequencies(c, 2.5e9, 2.6e9);
    auto both = study_diversity(e, DiversityOptions{}, {{&z, "z.csv", {}}, {&c2, "c2.csv", {}}});
    REQUIRE(both);
    CHECK(!both->pairs[0].correlation);  // 2.4 GHz: c2 has 2.5 and 2.6
    CHECK(both->pairs[0].correlation.error().format().find("c2.csv") == 0);
    CHECK(both->pairs[0].correlation.error().message.find("2.6 GHz") != std::string::npos);
    REQUIRE(both->pairs[1].correlation);
    CHECK(both->pairs[1].index2 == std::size_t(0));
    CHECK(!both->pairs[1].frequencies_differ);
    // One frequency asked for: a pattern without it is an Error naming the file.
    DiversityOptions at;
    at.frequency_hz = 2.45e9;
    auto missing = study_diversity(e, at, {{&z, "z.csv", {}}});
    REQUIRE(!missing);
    CHECK(missing.error().file == "z.csv");
    at.frequency_hz = 2.501e9;
    auto one = study_diversity(e, at, {{&z, "z.csv", {}}});
    REQUIRE(one);
    CHECK(one->patterns[0].size() == 1);
    CHECK(one->patterns[0][0].index == 1);
}

TEST_CASE("a single phi cut says it is a cut, not that it is zero", "[diversity][study]") {
    // Issue 13 item 13: MEG integrates over directions (Taga 1990); a cut covers no solid angle.
    FarFieldSet s = diversity_fixture(ReferenceKind::dipole, {}, 2.0);
    FarFieldSet cut = s;
    cut.grid.phi = AngleAxis{90, 2, 1};
    for (FarField& f : cut.frequencies) {
        f.e_theta.clear();
        f.e_phi.clear();
        for (int i = 0; i < s.grid.theta.count; ++i) {
            f.e_theta.push_back(s.frequencies[0].e_theta[s.grid.index(i, 45)]);
            f.e_phi.push_back(s.frequencies[0].e_phi[s.grid.index(i, 45)]);
        }
    }
    auto st = study_diversity(Environment{}, DiversityOptions{}, {{&cut, "cut.csv", {}}, {&cut, "cut.csv", {}}});
    REQUIRE(st);
    const auto& m = st->patterns[0][0].meg;
    REQUIRE(!m);
    CHECK(m.error().message.find("single cut (only phi = 90 deg)") != std::string::npos);
    CHECK(m.error().message.find("zero") == std::string::npos);
    REQUIRE(!st->pairs[0].correlation);
    CHECK(st->pairs[0].correlation.error().message.find("single cut") != std::string::npos);
}
