// The viewer's cut: which cut the settings ask for, its curves, and a cut with no power on it.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/reference.hpp"
#include "viewer/scene/cut_view.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
FarFieldSet z_dipole() {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;  // along z: E_theta ~ sin(theta), no E_phi (Balanis sec. 4.2)
    return synthesize(a, 5, 1e9);
}
unsigned bit(Component c) { return 1u << unsigned(c); }
}  // namespace

TEST_CASE("an elevation cut of a short dipole: 1.76 dBi peak, 90 deg HPBW", "[scene][cut]") {
    const FarFieldSet s = z_dipole();
    ViewerSettings st;  // phi = 0 cut, total
    const auto spec = cut_spec_for(st, std::nullopt, std::nullopt);
    REQUIRE(spec);
    const CutData cd = build_cut_data(s, 0, nullptr, 0, *spec, st.cut_components);
    REQUIRE(cd.valid);
    REQUIRE(cd.peak_db);
    CHECK(*cd.peak_db == Approx(1.76).margin(0.01));  // D = 1.5 (Balanis sec. 4.2)
    REQUIRE(cd.figures());
    REQUIRE(cd.figures()->hpbw_deg);
    CHECK(*cd.figures()->hpbw_deg == Approx(90).margin(0.5));  // Balanis sec. 4.2
    CHECK(cd.unit == "dBi");
}

TEST_CASE("a cut with no power says so instead of a plot", "[scene][cut]") {
    const FarFieldSet s = z_dipole();
    SECTION("the theta = 0 cone of a z dipole is one null direction") {
        ViewerSettings st;
        st.cut_kind = 1;
        st.cut_angle_deg = 0;
        const CutData cd = build_cut_data(s, 0, nullptr, 0, *cut_spec_for(st, std::nullopt, std::nullopt), bit(Component::total));
        CHECK(cd.valid);
        CHECK_FALSE(cd.peak_db);
        CHECK_FALSE(cd.figures());
    }
    SECTION("E-phi of a z dipole is zero everywhere") {
        const CutData cd = build_cut_data(s, 0, nullptr, 0, CutSpec::phi_cut(0), bit(Component::phi));
        CHECK(cd.valid);
        CHECK_FALSE(cd.peak_db);
    }
    SECTION("a zero first curve gives no beam figures; the other curve still sets the peak") {
        // RHCP of a linear field carries half the power: 1.76 - 3.01 = -1.25 dBic (conventions.md).
        const CutData cd = build_cut_data(s, 0, nullptr, 0, CutSpec::phi_cut(0), bit(Component::rhcp) | bit(Component::phi));
        REQUIRE(cd.curves.size() == 2);
        CHECK(cd.curves[0].component == Component::phi);  // curves in component order
        CHECK_FALSE(cd.figures());
        REQUIRE(cd.peak_db);
        CHECK(*cd.peak_db == Approx(-1.25).margin(0.01));
    }
}

TEST_CASE("the cut through the pin needs a finite pin", "[scene][cut]") {
    ViewerSettings st;
    st.cut_kind = 2;
    CHECK_FALSE(cut_spec_for(st, std::nullopt, std::nullopt));
    CHECK_FALSE(cut_spec_for(st, NAN, NAN));
    CHECK_FALSE(cut_spec_for(st, 45.0, INFINITY));
    CHECK(cut_spec_for(st, 45.0, 30.0));
    st.cut_kind = 0;
    st.cut_angle_deg = NAN;
    CHECK_FALSE(cut_spec_for(st, std::nullopt, std::nullopt));
}

TEST_CASE("the viewer's cut is the core's one cut value, the one its export writes", "[scene][cut]") {
    // Issue 11: screen and file once computed the cut twice, with different starting points for
    // the main lobe; a symmetric pattern then showed its peak at -90 deg on screen, +90 in files.
    const FarFieldSet s = z_dipole();
    const CutData cd = build_cut_data(s, 0, nullptr, 0, CutSpec::phi_cut(0), bit(Component::total));
    REQUIRE(cd.a);
    auto core = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total}, cd.a->samples.step_deg);
    REQUIRE(core.ok());
    CHECK(core->power[0] == cd.a->power[0]);
    REQUIRE(cd.figures());
    CHECK(cd.figures()->peak_angle_deg == core->beams[0].peak_angle_deg);
    // Equal maxima at theta = +-90: the cut's own half-plane (common practice).
    CHECK(cd.figures()->peak_angle_deg == Approx(90).margin(1e-9));
}

TEST_CASE("a cut the core refuses says why", "[scene][cut]") {
    FarFieldSet s = z_dipole();
    const CutData cd = build_cut_data(s, 0, nullptr, 0, CutSpec::phi_cut(0), 0);
    CHECK_FALSE(cd.valid);
    CHECK(cd.why.empty());  // no component chosen: nothing to say beyond that
    const CutData out = build_cut_data(s, 7, nullptr, 0, CutSpec::phi_cut(0), bit(Component::total));
    CHECK_FALSE(out.valid);
    CHECK(out.why.find("frequency") != std::string::npos);
}
