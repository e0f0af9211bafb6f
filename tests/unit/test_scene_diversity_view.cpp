// The viewer's diversity figures (viewer/scene/diversity_view.hpp) are the core's figures for the
// environment the user picked; no UI involved.
#include <catch2/catch.hpp>

#include "pattern/reference.hpp"
#include "viewer/scene/diversity_view.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

TEST_CASE("diversity view: presets, custom angles and the figures of A and B", "[diversity][viewer]") {
    // Every name offered gives a valid environment; a preset keeps its source text.
    for (const std::string& n : diversity_choice_names()) {
        auto e = make_environment(choice_from_preset(n));
        REQUIRE(e);
        CHECK(!e->source.empty());
    }
    DiversityChoice c = choice_from_preset("urban");
    auto urban = make_environment(c);
    REQUIRE(urban);
    CHECK(urban->name == "urban");
    c.v_spread_deg = 25;
    auto changed = make_environment(c);
    REQUIRE(changed);
    CHECK(changed->name == "urban (modified)");
    c.v_spread_deg = 0;
    CHECK(!make_environment(c));  // a zero spread is refused, as in the CLI

    ReferenceAntenna z, x;
    z.kind = x.kind = ReferenceKind::dipole;
    x.orientation = rotation_y(90 * deg);
    FarFieldSet a = synthesize(z, 2.0, 1e9), b = synthesize(x, 2.0, 1e9);
    DiversityChoice u = choice_from_preset("uniform");
    u.sweep.tilt_step_deg = 45;
    u.sweep.roll_step_deg = 90;
    DiversityFigures d = compute_diversity(u, &a, 0, &b, 0);
    REQUIRE(d.a.meg);
    REQUIRE(d.b.meg);
    // Taga 1990: uniform environment, MEG = efficiency / 2 for both (-3.01 dB lossless).
    CHECK(to_db(d.a.meg->meg) == Approx(-3.0103).margin(0.01));
    CHECK(to_db(d.b.meg->meg) == Approx(-3.0103).margin(0.01));
    // conventions.md: a z and an x dipole are uncorrelated in the uniform environment.
    REQUIRE(d.correlation);
    CHECK(d.correlation->ecc == Approx(0.0).margin(1e-12));
    REQUIRE(d.a.orientations);
    CHECK(d.a.orientations->max - d.a.orientations->min == Approx(0.0).margin(1e-9));
    CHECK(d.curve.elevation_deg.size() == 181);
    // Without B: no correlation.
    DiversityFigures one = compute_diversity(u, &a, 0, nullptr, 0);
    CHECK(!one.has_b);
    CHECK(!one.correlation);
}
