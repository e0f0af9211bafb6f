// The hover probe's figures against closed-form antennas.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "pattern/reference.hpp"
#include "viewer/scene/probe.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
std::string value_of(const std::vector<ProbeRow>& rows, const std::string& label) {
    for (const ProbeRow& r : rows)
        if (r.label == label) return r.value;
    return "(missing)";
}
}  // namespace

TEST_CASE("probe of a short dipole broadside: 1.76 dBi, linear, theta-polarised", "[scene][probe]") {
    // Balanis sec. 4.2: D = 1.5 (1.76 dBi) at theta = 90 deg, E along theta-hat only.
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, 2, 1e9);
    auto rows = probe_rows(s, 0, 90, 30);
    CHECK(value_of(rows, "Total") == "1.76 dBi");
    CHECK(value_of(rows, "E-theta") == "1.76 dBi");
    CHECK(value_of(rows, "E-phi").find("no field") != std::string::npos);
    // Linear: AR infinite, said in words, never a made-up number (conventions.md).
    CHECK(value_of(rows, "Axial ratio") == "infinite (linear)");
    CHECK(value_of(rows, "Sense") == "linear");
    // RHCP and LHCP each carry half: 1.76 - 3.01 = -1.25 dBic.
    CHECK(value_of(rows, "RHCP") == "-1.25 dBic");
    CHECK(value_of(rows, "Q/I U/I V/I") == "+1.00 +0.00 +0.00");
}

TEST_CASE("probe of crossed dipoles: circular on the axis, AR 1/|cos t| off it", "[scene][probe]") {
    // conventions.md: crossed short dipoles in quadrature, AR = 1/|cos t| at t from the normal.
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -90;  // right-hand toward +z
    FarFieldSet s = synthesize(a, 2, 1e9);
    auto on_axis = probe_rows(s, 0, 0, 0);
    CHECK(value_of(on_axis, "Axial ratio") == "0.00 dB");
    CHECK(value_of(on_axis, "Sense") == "right-hand");
    auto at60 = probe_rows(s, 0, 60, 20);
    CHECK(value_of(at60, "Axial ratio") == "6.02 dB");  // 20 log10(2)
    auto below = probe_rows(s, 0, 180, 0);
    CHECK(value_of(below, "Sense") == "left-hand");
}

TEST_CASE("probe without phase gives powers and says why polarisation is missing", "[scene][probe]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    FarFieldSet s = synthesize(a, 5, 1e9);
    s.content = FieldContent::magnitude_only;
    auto rows = probe_rows(s, 0, 90, 0);
    CHECK(value_of(rows, "Total") == "2.15 dBi");  // half-wave dipole, Balanis sec. 4.5: D = 1.64
    CHECK(value_of(rows, "RHCP") == "(missing)");
    CHECK(value_of(rows, "Polarisation").find("needs phase") != std::string::npos);
}
