// The mounting frame (pattern/mounting.hpp, pattern/rotate.hpp, pattern/install.hpp) against
// closed-form antennas: conventions.md "The mounting frame" (a dipole along x read with up = +x is
// a vertical dipole) and E'(r) = R E(R^T r) for the rotation of a whole pattern.
#include <catch2/catch.hpp>

#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/install.hpp"
#include "pattern/mounting.hpp"
#include "pattern/reference.hpp"
#include "pattern/rotate.hpp"

using namespace ellipsa;

namespace {

FarFieldSet make(ReferenceKind k, Mat3 orientation = {}, double step = 2.0) {
    ReferenceAntenna a;
    a.kind = k;
    a.orientation = orientation;
    return synthesize(a, step, 2.45e9);
}

bool same_matrix(const Mat3& a, const Mat3& b, double tol) {
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            if (std::abs(a.m[i][j] - b.m[i][j]) > tol) return false;
    return true;
}

// Largest difference of two patterns' samples relative to the peak field.
double worst_difference(const FarFieldSet& a, const FarFieldSet& b) {
    double worst = 0, peak = 0;
    const FarField &fa = a.frequencies[0], &fb = b.frequencies[0];
    for (std::size_t k = 0; k < a.grid.size(); ++k) {
        peak = std::max(peak, std::sqrt(power(fb.e_theta[k], fb.e_phi[k])));
        worst = std::max({worst, std::abs(fa.e_theta[k] - fb.e_theta[k]), std::abs(fa.e_phi[k] - fb.e_phi[k])});
    }
    return worst / peak;
}

}  // namespace

TEST_CASE("up axis: the smallest rotation taking the file's direction to +z", "[mounting]") {
    // conventions.md "The mounting frame": up a = the smallest rotation taking a to +z; for a = -z,
    // 180 deg about x. Axis-aligned cases are exact (entries 0 and +-1).
    const Vec3 axes[6] = {{1, 0, 0}, {-1, 0, 0}, {0, 1, 0}, {0, -1, 0}, {0, 0, 1}, {0, 0, -1}};
    for (const Vec3& a : axes) {
        const Vec3 z = apply(up_rotation(a), a);
        CHECK(z.x == 0);
        CHECK(z.y == 0);
        CHECK(z.z == 1);
    }
    // -z: 180 deg about x maps (x, y, z) to (x, -y, -z).
    CHECK(same_matrix(up_rotation({0, 0, -1}), axis_rotation_deg(Axis::x, 180), 0));
    // +x: a quarter turn about -y, i.e. R_y(-90) (right-handed rotation, common practice).
    CHECK(same_matrix(up_rotation({1, 0, 0}), axis_rotation_deg(Axis::y, -90), 0));
    // A general direction: a goes to +z, and the axis a x z (perpendicular to both) stays put,
    // so the rotation is the one in the plane of a and z: the smallest.
    const Vec3 a = direction_deg(60, 30);
    const Mat3 r = up_rotation(a);
    const Vec3 to = apply(r, a);
    CHECK(to.z == Approx(1).margin(1e-15));
    const Vec3 k = normalized(cross(a, {0, 0, 1}));
    const Vec3 kk = apply(r, k);
    CHECK(norm(kk - k) < 1e-15);
}

TEST_CASE("turns about the world axes apply left to right", "[mounting]") {
    // --rotate z:90,x:90: first z, then x. R x = R_x(90) R_z(90) x = R_x(90) y = z.
    Mounting m;
    m.turns = {{Axis::z, 90}, {Axis::x, 90}};
    const Vec3 v = apply(mounting_matrix(m), Vec3{1, 0, 0});
    CHECK(v.x == 0);
    CHECK(v.y == 0);
    CHECK(v.z == 1);
    CHECK(is_identity(Mounting{}));
    CHECK(is_identity(Mounting{{0, 0, 1}, {{Axis::z, 360}}}));
    CHECK(!is_identity(m));
}

TEST_CASE("the command line's up axis replaces the file's mounting; its turns follow", "[mounting]") {
    Mounting file{{1, 0, 0}, {{Axis::z, 30}}};
    Mounting only_turns = resolve_mounting(file, std::nullopt, {{Axis::x, 10}});
    REQUIRE(only_turns.turns.size() == 2);
    CHECK(only_turns.up.x == 1);
    CHECK(only_turns.turns[1].axis == Axis::x);
    Mounting new_up = resolve_mounting(file, Vec3{0, 1, 0}, {{Axis::x, 10}});
    CHECK(new_up.up.y == 1);
    REQUIRE(new_up.turns.size() == 1);
    CHECK(new_up.turns[0].angle_deg == 10);
}

TEST_CASE("which rotations map a grid onto itself", "[mounting][rotate]") {
    // The samples of a regular theta/phi grid are symmetric under turns about z by multiples of
    // the phi step and under half turns about horizontal axes at multiples of half the phi step
    // (theta -> 180 - theta); nothing else maps them onto themselves. A quarter turn about x takes
    // the z axis, where the meridians meet, to the y axis, where they do not: it must resample.
    const Grid g2 = full_sphere_grid(2, 2);
    CHECK(rotation_is_exact(g2, axis_rotation_deg(Axis::z, 30)));
    CHECK(rotation_is_exact(g2, axis_rotation_deg(Axis::z, -90)));
    CHECK(rotation_is_exact(g2, axis_rotation_deg(Axis::x, 180)));
    CHECK(rotation_is_exact(g2, axis_rotation_deg(Axis::y, 180)));
    CHECK(rotation_is_exact(g2, up_rotation({0, 0, -1})));
    CHECK(rotation_is_exact(g2, axis_rotation_deg(Axis::z, 45) * axis_rotation_deg(Axis::x, 180) *
                                    axis_rotation_deg(Axis::z, -45)));
    CHECK(!rotation_is_exact(g2, axis_rotation_deg(Axis::z, 31)));
    CHECK(!rotation_is_exact(g2, axis_rotation_deg(Axis::x, 90)));
    CHECK(!rotation_is_exact(g2, axis_rotation_deg(Axis::x, 10)));
    CHECK(!rotation_is_exact(g2, up_rotation({1, 0, 0})));
    CHECK(!rotation_is_exact(g2, up_rotation(direction_deg(60, 30))));
    CHECK(!rotation_is_exact(full_sphere_grid(7.5, 7.5), axis_rotation_deg(Axis::z, 10)));
    CHECK(rotation_is_exact(full_sphere_grid(7.5, 7.5), axis_rotation_deg(Axis::z, 15)));
}

TEST_CASE("exact rotations equal the closed form turned, to rounding", "[mounting][rotate]") {
    // E'(r) = R E(R^T r) (conventions.md); crossed dipoles are circular along z and linear in the
    // xy-plane, so both the basis change and the poles are exercised.
    const FarFieldSet s = make(ReferenceKind::crossed_dipoles, axis_rotation_deg(Axis::y, 90));
    for (const Mat3& r : {axis_rotation_deg(Axis::z, 30), up_rotation({0, 0, -1}), axis_rotation_deg(Axis::y, 180),
                          axis_rotation_deg(Axis::z, 90) * axis_rotation_deg(Axis::x, 180)}) {
        REQUIRE(rotation_is_exact(s.grid, r));
        auto turned = rotate_pattern(s, r);
        REQUIRE(turned);
        CHECK(worst_difference(*turned, make(ReferenceKind::crossed_dipoles, r * axis_rotation_deg(Axis::y, 90))) < 1e-13);
    }
}

TEST_CASE("a dipole along -z read with up = -z, or along x turned z:90, exactly", "[mounting][diversity]") {
    // Exact mountings (the grid maps onto itself): the same closed form to rounding, so the same
    // MEG (Taga 1990, via pattern/diversity) in every environment.
    const FarFieldSet z = make(ReferenceKind::dipole);
    InstallRequest down;
    down.up = Vec3{0, 0, -1};
    auto flipped = install_pattern(make(ReferenceKind::dipole, axis_rotation_deg(Axis::x, 180)), down);
    REQUIRE(flipped);
    CHECK(!flipped->mounting_resampled);
    CHECK(worst_difference(*flipped, z) < 1e-13);
    InstallRequest turn;
    turn.turns = {{Axis::z, 90}};
    const Mat3 to_x = axis_rotation_deg(Axis::y, 90), to_y = axis_rotation_deg(Axis::x, -90);
    auto y = install_pattern(make(ReferenceKind::dipole, to_x), turn);
    REQUIRE(y);
    CHECK(!y->mounting_resampled);
    CHECK(worst_difference(*y, make(ReferenceKind::dipole, to_y)) < 1e-13);
    for (const EnvironmentPreset& preset : environment_presets()) {
        const Environment env = *environment_preset(preset.name);
        auto mz = mean_effective_gain(z, 0, env), mf = mean_effective_gain(*flipped, 0, env);
        CHECK(to_db(mf->meg) == Approx(to_db(mz->meg)).margin(1e-12));
    }
}

TEST_CASE("a dipole along x read with up = +x is the vertical dipole", "[mounting][diversity]") {
    // conventions.md "The mounting frame", the check a user can repeat: same vertical gain, MEG in
    // every environment and orientation curve as the dipole along z read as it is (MEG: Taga 1990
    // via pattern/diversity). A quarter turn about y does not map the grid onto itself, so the
    // pattern is resampled (bilinear on the Cartesian field, error of order step^2: common
    // practice); the bounds are those of a 2-deg grid.
    for (ReferenceKind kind : {ReferenceKind::dipole, ReferenceKind::short_dipole}) {
        const FarFieldSet z = make(kind);
        const FarFieldSet x = make(kind, axis_rotation_deg(Axis::y, 90));  // z turned onto x: along x
        InstallRequest q;
        q.up = Vec3{1, 0, 0};
        auto up = install_pattern(x, q);
        REQUIRE(up);
        CHECK(up->mounting_resampled);
        CHECK(up->mounting.up.x == 1);
        const FarField &fz = z.frequencies[0], &fu = up->frequencies[0];
        double worst_db = 0, worst_h = 0;
        for (std::size_t k = 0; k < z.grid.size(); ++k) {
            const double gz = std::norm(fz.e_theta[k]), gu = std::norm(fu.e_theta[k]);  // vertical gain
            if (gz > 0.015) worst_db = std::max(worst_db, std::abs(to_db(gu) - to_db(gz)));  // within 20 dB
            worst_h = std::max(worst_h, std::norm(fu.e_phi[k]));
        }
        CHECK(worst_db < 0.01);
        CHECK(worst_h < 1e-6);  // horizontal part below -60 dB: resampling residue only
        for (const EnvironmentPreset& preset : environment_presets()) {
            const Environment env = *environment_preset(preset.name);
            auto mz = mean_effective_gain(z, 0, env), mu = mean_effective_gain(*up, 0, env);
            REQUIRE(mz);
            REQUIRE(mu);
            CHECK(to_db(mu->meg) == Approx(to_db(mz->meg)).margin(0.002));
            auto oz = orientation_robustness(z, 0, env, OrientationSweep{});
            auto ou = orientation_robustness(*up, 0, env, OrientationSweep{});
            REQUIRE(oz);
            REQUIRE(ou);
            REQUIRE(oz->samples.size() == ou->samples.size());
            for (std::size_t k = 0; k < oz->samples.size(); ++k)
                CHECK(to_db(ou->samples[k].meg) == Approx(to_db(oz->samples[k].meg)).margin(0.002));
        }
        // Read as it is, the x dipole is horizontal in the world: its MEG differs.
        auto indoor = environment_preset("indoor");
        REQUIRE(indoor);
        auto as_is = mean_effective_gain(x, 0, *indoor), vertical = mean_effective_gain(z, 0, *indoor);
        CHECK(std::abs(to_db(as_is->meg) - to_db(vertical->meg)) > 0.5);
    }
}

TEST_CASE("a mounting that misses the grid resamples by interpolation", "[mounting][rotate]") {
    // A dipole along (theta 60, phi 30) read with that direction up is the vertical dipole; the
    // rotation does not map the 2-deg grid onto itself, so the samples are interpolated (bilinear
    // on the Cartesian field: errors of order step^2, common practice).
    const Vec3 a = direction_deg(60, 30);
    const FarFieldSet tilted = make(ReferenceKind::dipole, transposed(up_rotation(a)));
    InstallRequest q;
    q.up = a;
    auto up = install_pattern(tilted, q);
    REQUIRE(up);
    CHECK(up->mounting_resampled);
    const FarFieldSet z = make(ReferenceKind::dipole);
    CHECK(worst_difference(*up, z) < 2e-3);
    for (const EnvironmentPreset& preset : environment_presets()) {
        const Environment env = *environment_preset(preset.name);
        auto mz = mean_effective_gain(z, 0, env), mu = mean_effective_gain(*up, 0, env);
        CHECK(to_db(mu->meg) == Approx(to_db(mz->meg)).margin(0.01));
    }
}

TEST_CASE("magnitude-only data take the rotations that keep theta and phi apart", "[mounting][rotate]") {
    FarFieldSet s = make(ReferenceKind::crossed_dipoles);
    FarFieldSet mag = s;
    mag.content = FieldContent::magnitude_only;
    for (std::size_t k = 0; k < s.grid.size(); ++k) {
        mag.frequencies[0].e_theta[k] = std::abs(s.frequencies[0].e_theta[k]);
        mag.frequencies[0].e_phi[k] = std::abs(s.frequencies[0].e_phi[k]);
    }
    // A turn about z and the half turn of up = -z keep theta-hat and phi-hat (up to sign).
    for (const Mat3& r : {axis_rotation_deg(Axis::z, 30), up_rotation({0, 0, -1})}) {
        auto m = rotate_pattern(mag, r);
        REQUIRE(m);
        auto c = rotate_pattern(s, r);
        REQUIRE(c);
        for (std::size_t k = 0; k < s.grid.size(); ++k) {
            CHECK(std::abs(m->frequencies[0].e_theta[k]) == Approx(std::abs(c->frequencies[0].e_theta[k])).margin(1e-13));
            CHECK(std::abs(m->frequencies[0].e_phi[k]) == Approx(std::abs(c->frequencies[0].e_phi[k])).margin(1e-13));
        }
    }
    auto refused = rotate_pattern(mag, axis_rotation_deg(Axis::x, 90));
    REQUIRE(!refused);
    CHECK(refused.error().message.find("magnitudes only") != std::string::npos);
}

TEST_CASE("the file's own mounting applies, and the request can only record it", "[mounting]") {
    FarFieldSet x = make(ReferenceKind::dipole, axis_rotation_deg(Axis::y, 90));
    x.file_mounting.up = {1, 0, 0};
    auto installed = install_pattern(x, InstallRequest{});
    REQUIRE(installed);
    CHECK(worst_difference(*installed, make(ReferenceKind::dipole)) < 2e-3);
    InstallRequest keep;
    keep.turn_fields = false;
    keep.turns = {{Axis::z, 30}};
    auto recorded = install_pattern(x, keep);
    REQUIRE(recorded);
    CHECK(is_identity(recorded->mounting));
    CHECK(recorded->file_mounting.up.x == 1);
    REQUIRE(recorded->file_mounting.turns.size() == 1);
    CHECK(worst_difference(*recorded, x) == 0);
}

TEST_CASE("mounting text: up axes, directions and turns read and written back", "[mounting]") {
    // The text forms of docs/far-field-csv.md (mounting-up, mounting-turns) and of --up/--rotate.
    auto x = parse_up("+x");
    REQUIRE(x);
    CHECK((x->x == 1 && x->y == 0 && x->z == 0));
    auto mz = parse_up(" -z ");
    REQUIRE(mz);
    CHECK(mz->z == -1);
    auto y = parse_up("y");  // the sign may be left out for +
    REQUIRE(y);
    CHECK(y->y == 1);
    // THETA,PHI: 90,90 is exactly +y (direction_deg is exact at quarter turns).
    auto d = parse_up("90,90");
    REQUIRE(d);
    CHECK((d->x == 0 && d->y == 1 && d->z == 0));
    CHECK(format_up(*d) == "+y");
    CHECK(format_up(*parse_up("60,30")) == "60,30");
    CHECK(format_up({0, 0, -1}) == "-z");
    for (const char* bad : {"", "w", "+xy", "90", "90,", "200,0", "nan,0", "1e999,0"}) {
        auto r = parse_up(bad);
        CHECK(!r);
        if (!r) CHECK(r.error().message.find("expected") == 0);
    }
    auto t = parse_turns("z:30, x:-10.5");
    REQUIRE(t);
    REQUIRE(t->size() == 2);
    CHECK((*t)[0].axis == Axis::z);
    CHECK((*t)[0].angle_deg == 30);
    CHECK((*t)[1].axis == Axis::x);
    CHECK((*t)[1].angle_deg == -10.5);
    CHECK(format_turns(*t) == "z:30,x:-10.5");
    CHECK(parse_turns("")->empty());
    for (const char* bad : {"z30", "w:10", "z:", "z:10,", "z:inf", ":5"}) CHECK(!parse_turns(bad));
}

TEST_CASE("turns apply left to right about the world axes", "[mounting]") {
    // conventions.md: further rotations about the world axes follow in the order given, so
    // R = T_2 T_1 U. z:90 then x:90 takes the file's +x first to +y, then to +z.
    Mounting m{{0, 0, 1}, *parse_turns("z:90,x:90")};
    const Vec3 v = apply(mounting_matrix(m), Vec3{1, 0, 0});
    CHECK(v.x == Approx(0).margin(1e-15));
    CHECK(v.y == Approx(0).margin(1e-15));
    CHECK(v.z == Approx(1));
}
