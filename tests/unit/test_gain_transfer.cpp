// Gain transfer by the gain-comparison method (IEEE Std 149-1979, sec. 12):
// G_AUT = G_ref + P_AUT - P_ref per frequency. The "range" here is invented: closed-form
// lossless antennas (pattern/reference.hpp) measured with an unknown range loss, so the
// transferred gain must come back to the handbook values (Balanis sec. 4.2 and 4.5:
// short dipole 1.76 dBi, half-wave dipole 2.15 dBi).
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/gain_transfer.hpp"
#include "pattern/peak.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;

namespace {

// The antenna as a range sees it: relative levels, `loss_db` below its gain.
FarFieldSet measured(ReferenceKind kind, double loss_db, double f_hz) {
    ReferenceAntenna a;
    a.kind = kind;
    FarFieldSet s = synthesize(a, 2.0, f_hz);
    const double k = std::pow(10.0, -loss_db / 20);
    for (FarField& f : s.frequencies) {
        for (cplx& e : f.e_theta) e *= k;
        for (cplx& e : f.e_phi) e *= k;
    }
    s.quantity = Quantity::relative;
    return s;
}

double peak_db(const FarFieldSet& s) { return to_db(find_peak(s, 0).value); }

}  // namespace

TEST_CASE("gain transfer with a reference pattern gives the handbook gain back", "[gain-transfer]") {
    // The same unknown range loss (31.7 dB) for both antennas, as in one set-up.
    const FarFieldSet aut = measured(ReferenceKind::dipole, 31.7, 2.45e9);
    const FarFieldSet ref = measured(ReferenceKind::short_dipole, 31.7, 2.45e9);
    // The reference's known gain: the short dipole's 1.5 (1.761 dBi), Balanis sec. 4.2.
    const double g_ref = 10 * std::log10(1.5);
    const std::vector<GainReference> refs{{2.45e9, g_ref, reference_level_db(ref, 0)}};
    auto g = transfer_gain(aut, refs, "the short dipole");
    REQUIRE(g.ok());
    CHECK(g->quantity == Quantity::gain);
    // Half-wave dipole: 2.15 dBi (Balanis sec. 4.5; D = 1.64 to the handbook's 3 digits).
    CHECK(peak_db(*g) == Approx(2.15).margin(0.01));
    CHECK(g->note.find("gain by comparison with the short dipole (IEEE Std 149 sec. 12)") != std::string::npos);
    CHECK(g->note.find("1.76 dBi against -29.94 dB measured") != std::string::npos);
}

TEST_CASE("gain transfer with a known reference level: G = G_ref + P - P_ref", "[gain-transfer]") {
    const FarFieldSet aut = measured(ReferenceKind::short_dipole, 20.0, 5.8e9);
    // The reference read -12.5 dB in the set-up and has 7.5 dBi: 20 dB added to every level.
    auto g = transfer_gain(aut, {{5.8e9, 7.5, -12.5}}, "a horn");
    REQUIRE(g.ok());
    CHECK(peak_db(*g) == Approx(10 * std::log10(1.5) - 20.0 + 20.0).margin(1e-9));
}

TEST_CASE("gain transfer refuses gain data, a frequency without reference and a zero reference", "[gain-transfer]") {
    FarFieldSet already = measured(ReferenceKind::short_dipole, 0, 1e9);
    already.quantity = Quantity::gain;
    auto a = transfer_gain(already, {{1e9, 0, 0}}, "r");
    REQUIRE_FALSE(a.ok());
    CHECK(a.error().message.find("expected relative levels (quantity relative), found gain") != std::string::npos);
    auto b = transfer_gain(measured(ReferenceKind::short_dipole, 0, 1e9), {{2e9, 0, 0}}, "r");
    REQUIRE_FALSE(b.ok());
    CHECK(b.error().message == "gain transfer: expected a reference at 1 GHz, found none");
    auto c = transfer_gain(measured(ReferenceKind::short_dipole, 0, 1e9), {{1e9, 0, -INFINITY}}, "r");
    REQUIRE_FALSE(c.ok());
}
