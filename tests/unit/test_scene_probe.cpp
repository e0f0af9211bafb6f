// The probe's values against closed-form antennas: numbers, which the panel formats.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/reference.hpp"
#include "viewer/scene/probe.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

TEST_CASE("probe of a short dipole broadside: 1.76 dBi, linear, theta-polarised", "[scene][probe]") {
    // Balanis sec. 4.2: D = 1.5 (1.76 dBi) at theta = 90 deg, E along theta-hat only.
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, 2, 1e9);
    const ProbeValues p = probe(s, 0, 90, 30);
    REQUIRE(p.inside);
    CHECK(*p.db_of(Component::total) == Approx(1.761).margin(0.005));
    CHECK(*p.db_of(Component::theta) == Approx(1.761).margin(0.005));
    CHECK(std::isinf(*p.db_of(Component::phi)));  // no field: -inf, never a made-up floor
    CHECK(*p.db_of(Component::phi) < 0);
    // Linear: AR infinite (conventions.md), sense linear.
    REQUIRE(p.polarisation);
    CHECK(std::isinf(p.polarisation->axial_ratio));
    CHECK(p.polarisation->sense == Sense::linear);
    // RHCP and LHCP each carry half: 1.76 - 3.01 = -1.25 dBic.
    CHECK(*p.db_of(Component::rhcp) == Approx(-1.249).margin(0.005));
    const Stokes& st = p.polarisation->stokes;
    CHECK(st.q / st.i == Approx(1));
    CHECK(st.v / st.i == Approx(0).margin(1e-12));
}

TEST_CASE("probe of crossed dipoles: circular on the axis, AR 1/|cos t| off it", "[scene][probe]") {
    // conventions.md: crossed short dipoles in quadrature, AR = 1/|cos t| at t from the normal.
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -90;  // right-hand toward +z
    FarFieldSet s = synthesize(a, 2, 1e9);
    const ProbeValues on_axis = probe(s, 0, 0, 0);
    REQUIRE(on_axis.polarisation);
    CHECK(20 * std::log10(on_axis.polarisation->axial_ratio) == Approx(0).margin(0.005));
    CHECK(on_axis.polarisation->sense == Sense::right);
    const ProbeValues at60 = probe(s, 0, 60, 20);
    CHECK(20 * std::log10(at60.polarisation->axial_ratio) == Approx(6.02).margin(0.005));  // 20 log10(2)
    CHECK(probe(s, 0, 180, 0).polarisation->sense == Sense::left);
    // The phases beside the gains (IEEE Std 145, Balanis sec. 2.12, by hand at theta 60, phi 20):
    // Et = -cos t exp(-j p) (160 deg), Ep = j exp(-j p) (70), E_R = -(1 + cos t) exp(-j p)/sqrt2 (160),
    // E_L = (1 - cos t) exp(-j p)/sqrt2 (-20); the total has none. 0.01 deg: interpolated at a grid node.
    auto phase_of = [](const ProbeValues& p, Component c) -> double {
        for (const ComponentValue& v : p.components)
            if (v.component == c) return v.phase_deg;
        return NAN;
    };
    CHECK(phase_of(at60, Component::theta) == Approx(160).margin(0.01));
    CHECK(phase_of(at60, Component::phi) == Approx(70).margin(0.01));
    CHECK(phase_of(at60, Component::rhcp) == Approx(160).margin(0.01));
    CHECK(phase_of(at60, Component::lhcp) == Approx(-20).margin(0.01));
    CHECK(std::isnan(phase_of(at60, Component::total)));
    CHECK(std::isnan(phase_of(on_axis, Component::lhcp)));  // pure right-hand: E_L zero, no phase
}

TEST_CASE("probe without phase gives powers and no polarisation", "[scene][probe]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    FarFieldSet s = synthesize(a, 5, 1e9);
    s.content = FieldContent::magnitude_only;
    const ProbeValues p = probe(s, 0, 90, 0);
    CHECK(*p.db_of(Component::total) == Approx(2.15).margin(0.005));  // half-wave dipole, Balanis sec. 4.5: D = 1.64
    CHECK_FALSE(p.db_of(Component::rhcp));
    CHECK_FALSE(p.polarisation);
    for (const ComponentValue& v : p.components) CHECK(std::isnan(v.phase_deg));  // no phase in the data: none shown
}
