// Polarisation decomposition against IEEE Std 145-2013 definitions and Balanis sec. 2.12.
#include <catch2/catch.hpp>

#include <algorithm>

#include "pattern/components.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;

TEST_CASE("circular components follow the IEEE sense with exp(+jwt)", "[polarisation]") {
    // IEEE Std 145-2013 / conventions.md: E_R = (Et + j Ep)/sqrt2. A field Et = 1, Ep = -j turns
    // clockwise seen along propagation: right-hand.
    PolarisationState r = decompose(1.0, cplx(0, -1), 0.0, Ludwig3Reference::x);
    CHECK(r.rhcp == Approx(2.0));
    CHECK(r.lhcp == Approx(0.0).margin(1e-15));
    CHECK(r.sense == Sense::right);
    CHECK(r.stokes.v > 0);  // V > 0 means right-hand (IEEE sign, conventions.md)
    CHECK(r.axial_ratio == Approx(1.0));
    PolarisationState l = decompose(1.0, cplx(0, 1), 0.0, Ludwig3Reference::x);
    CHECK(l.sense == Sense::left);
    CHECK(l.lhcp == Approx(2.0));
}

TEST_CASE("a current x + j y radiates left-hand circular toward +z", "[polarisation]") {
    // conventions.md check, from IEEE Std 145 sense and exp(+jwt).
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = 90;  // I_y = j I_x
    CVec3 e = local_field(a, Vec3{0, 0, 1});
    cplx et = dot(e, theta_hat(0, 0)), ep = dot(e, phi_hat(0));
    PolarisationState s = decompose(et, ep, 0.0, Ludwig3Reference::x);
    CHECK(s.sense == Sense::left);
    CHECK(s.rhcp == Approx(0.0).margin(1e-15));
    // and right-hand toward -z (the rotation looks reversed from the other side)
    const double t = pi, p = 0;
    e = local_field(a, Vec3{0, 0, -1});
    s = decompose(dot(e, theta_hat(t, p)), dot(e, phi_hat(p)), p, Ludwig3Reference::x);
    CHECK(s.sense == Sense::right);
}

TEST_CASE("power identities hold in every basis", "[polarisation]") {
    // |E_R|^2 + |E_L|^2 = |Et|^2 + |Ep|^2 = |co|^2 + |cross|^2 and I^2 = Q^2 + U^2 + V^2
    // (Balanis sec. 2.12; Stokes: Born & Wolf, Principles of Optics, sec. 10.8; common practice).
    const cplx ets[] = {cplx(1, 0), cplx(0.3, -0.7), cplx(-2, 0.1), cplx(0, 0)};
    const cplx eps[] = {cplx(0, 0), cplx(0.9, 0.2), cplx(0.5, -1.5), cplx(0, 3)};
    for (cplx et : ets)
        for (cplx ep : eps)
            for (double phi_deg : {0.0, 33.0, 90.0, 251.0})
                for (auto ref : {Ludwig3Reference::x, Ludwig3Reference::y}) {
                    PolarisationState s = decompose(et, ep, phi_deg * deg, ref);
                    CHECK(s.rhcp + s.lhcp == Approx(s.total).margin(1e-12));
                    CHECK(s.co + s.cross == Approx(s.total).margin(1e-12));
                    const Stokes& k = s.stokes;
                    CHECK(k.i * k.i == Approx(k.q * k.q + k.u * k.u + k.v * k.v).margin(1e-12));
                    CHECK(k.v == Approx(s.rhcp - s.lhcp).margin(1e-12));
                }
}

TEST_CASE("tilt and axial ratio of known fields", "[polarisation]") {
    // Linear along theta-hat: tilt 0; along phi-hat: 90; at 45 deg: 45 (conventions.md tilt definition).
    CHECK(decompose(1.0, 0.0, 0, Ludwig3Reference::x).tilt_deg == Approx(0.0));
    CHECK(decompose(0.0, 1.0, 0, Ludwig3Reference::x).tilt_deg == Approx(90.0));
    CHECK(decompose(1.0, 1.0, 0, Ludwig3Reference::x).tilt_deg == Approx(45.0));
    CHECK(decompose(1.0, -1.0, 0, Ludwig3Reference::x).tilt_deg == Approx(-45.0));
    // Linear fields: infinite AR, sense linear; never a made-up large number.
    PolarisationState lin = decompose(cplx(0.6, 0.8), cplx(1.2, 1.6), 0, Ludwig3Reference::x);
    CHECK(std::isinf(lin.axial_ratio));
    CHECK(lin.sense == Sense::linear);
    // Ellipse with semi-axes 2 (along theta) and 1 (along phi), right-hand: Et = 2, Ep = -j.
    PolarisationState el = decompose(2.0, cplx(0, -1), 0, Ludwig3Reference::x);
    CHECK(el.axial_ratio == Approx(2.0));
    CHECK(el.tilt_deg == Approx(0.0).margin(1e-12));
    CHECK(el.sense == Sense::right);
    // Same ellipse turned by 30 deg from theta toward phi.
    const double c = std::cos(30 * deg), s = std::sin(30 * deg);
    cplx et = 2.0 * c - cplx(0, -1) * s, ep = 2.0 * s + cplx(0, -1) * c;
    PolarisationState el30 = decompose(et, ep, 0, Ludwig3Reference::x);
    CHECK(el30.tilt_deg == Approx(30.0));
    CHECK(el30.axial_ratio == Approx(2.0));
}

TEST_CASE("Ludwig-3 co-polar of an x-polarised aperture field is the x component", "[polarisation]") {
    // Ludwig 1973, third definition: for a field E = x-hat everywhere on the forward hemisphere the
    // x-reference co-polar component carries all of it and the cross-polar none.
    for (double t_deg : {0.0, 20.0, 45.0})
        for (double p_deg : {0.0, 30.0, 90.0, 200.0}) {
            const double t = t_deg * deg, p = p_deg * deg;
            // project x-hat on the transverse basis (its transverse part)
            Vec3 x{1, 0, 0};
            cplx et = dot(x, theta_hat(t, p)), ep = dot(x, phi_hat(p));
            PolarisationState sx = decompose(et, ep, p, Ludwig3Reference::x);
            if (t_deg == 0) {
                CHECK(sx.cross == Approx(0).margin(1e-15));
                CHECK(sx.co == Approx(1));
            }
            PolarisationState sy = decompose(et, ep, p, Ludwig3Reference::y);
            CHECK(sy.co == Approx(sx.cross).margin(1e-15));
            // round trip co/cross -> theta/phi
            cplx et2, ep2;
            from_ludwig3(sx.e_co, sx.e_cross, std::cos(p), std::sin(p), Ludwig3Reference::x, et2, ep2);
            CHECK(std::abs(et2 - et) < 1e-14);
            CHECK(std::abs(ep2 - ep) < 1e-14);
            from_ludwig3(sy.e_co, sy.e_cross, std::cos(p), std::sin(p), Ludwig3Reference::y, et2, ep2);
            CHECK(std::abs(et2 - et) < 1e-14);
            CHECK(std::abs(ep2 - ep) < 1e-14);
        }
}

TEST_CASE("the component power kernels agree with the per-sample decomposition", "[polarisation][components]") {
    // The batch kernel and the grid form against decompose() (the definitions in conventions.md).
    const std::size_t n = 64;
    std::vector<cplx> et(n), ep(n);
    std::vector<double> ph(n), cph(n), sph(n), out(n);
    for (std::size_t k = 0; k < n; ++k) {
        et[k] = std::polar(1.0 + 0.1 * double(k % 7), 0.3 * double(k));
        ep[k] = std::polar(0.5 + 0.05 * double(k % 5), -0.17 * double(k));
        ph[k] = 0.1 * double(k);
        cph[k] = std::cos(ph[k]);
        sph[k] = std::sin(ph[k]);
    }
    for (auto ref : {Ludwig3Reference::x, Ludwig3Reference::y})
        for (Component c : all_components) {
            component_power_many(n, et.data(), ep.data(), cph.data(), sph.data(), ref, c, out.data());
            for (std::size_t k = 0; k < n; ++k) {
                const double want = component_power(decompose(et[k], ep[k], ph[k], ref), c);
                CHECK(out[k] == Approx(want).margin(1e-12));
                CHECK(component_power(et[k], ep[k], cph[k], sph[k], ref, c) == Approx(want).margin(1e-12));
            }
        }
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = 60;
    FarFieldSet s = synthesize(a, 15, 1e9);
    s.ludwig3_reference = Ludwig3Reference::y;
    std::vector<double> grid(s.grid.size(), -1.0);
    for (Component c : all_components) {
        component_power_grid(s, 0, c, grid.data());
        for (int i = 0; i < s.grid.theta.count; ++i)
            for (int j = 0; j < s.grid.phi.count; ++j) {
                const std::size_t k = s.grid.index(i, j);
                const double want = component_power(
                    decompose(s.frequencies[0].e_theta[k], s.frequencies[0].e_phi[k], s.grid.phi.value_deg(j) * deg,
                              s.ludwig3_reference), c);
                CHECK(grid[k] == Approx(want).margin(1e-12));
            }
    }
    // A row range writes those rows only.
    std::fill(grid.begin(), grid.end(), -1.0);
    component_power_grid(s, 0, Component::co, grid.data(), 2, 4);
    CHECK(grid[s.grid.index(1, 3)] == -1.0);
    CHECK(grid[s.grid.index(2, 3)] >= 0);
    CHECK(grid[s.grid.index(3, 0)] >= 0);
    CHECK(grid[s.grid.index(4, 0)] == -1.0);
}

TEST_CASE("component facts: names, labels, units and availability", "[components]") {
    for (Component c : all_components) {
        Component back;
        REQUIRE(parse_component(to_string(c), back));
        CHECK(back == c);
        CHECK(std::string(short_label(c)).size() > 0);
    }
    // conventions.md: partial gains in dBi, circular ones in dBic; relative data has no isotropic reference.
    CHECK(std::string(db_unit(Quantity::gain, Component::rhcp)) == "dBic");
    CHECK(std::string(db_unit(Quantity::directivity, Component::co)) == "dBi");
    CHECK(std::string(db_unit(Quantity::relative, Component::lhcp)) == "dB");
    CHECK(long_label(Component::co, Ludwig3Reference::y) == "Co-polar (Ludwig-3, y ref.)");
    FarFieldSet s = synthesize(ReferenceAntenna{}, 30, 1e9);
    for (Component c : all_components) CHECK_FALSE(component_unavailable(s, c));
    CHECK_FALSE(polarisation_unavailable(s));
    s.content = FieldContent::magnitude_only;
    CHECK(component_unavailable(s, Component::rhcp)->find("phase") != std::string::npos);
    CHECK_FALSE(component_unavailable(s, Component::vertical));
    CHECK(polarisation_unavailable(s));
    s.content = FieldContent::total_only;
    CHECK(component_unavailable(s, Component::theta)->find("total power") != std::string::npos);
    CHECK_FALSE(component_unavailable(s, Component::total));
    s.frequencies.clear();
    CHECK(component_unavailable(s, Component::total));
}

TEST_CASE("grid equality forgives the last bits of text-read angles", "[components]") {
    Grid a = full_sphere_grid(0.1, 0.1), b = a;
    b.theta.step_deg = 180.0 / 1800 * (1 + 1e-13);  // a step summed from text
    CHECK(same_grid(a, b));
    b.theta.step_deg = 0.1001;
    CHECK_FALSE(same_grid(a, b));
    b = a;
    b.phi.count -= 1;
    CHECK_FALSE(same_grid(a, b));
}
