// The viewer's mounting control through its state path (viewer/state/apply.hpp SetMounting, the
// derived diversity figures): the check a user can repeat from issue 12 and conventions.md
// "The mounting frame": a dipole along x read with up = +x has the same vertical/horizontal MEG
// in every environment and the same orientation curve as the same dipole along z read as it is.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/mounting.hpp"
#include "pattern/reference.hpp"
#include "viewer/state/apply.hpp"
#include "viewer/state/derived.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
// A half-wave dipole (pattern/reference.hpp) along z, or turned so that its axis lies along x.
FarFieldSet dipole(const std::string& name, bool along_x, double step_deg = 5) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    if (along_x) a.orientation = axis_rotation_deg(Axis::y, 90);  // R_y(90) takes +z to +x
    FarFieldSet s = synthesize(a, step_deg, 1e9);
    s.name = name;
    return s;
}

template <class... I>
void run(AppState& s, I... intents) {
    Intents in;
    (in.push_back(std::move(intents)), ...);
    apply(s, std::move(in));
}

// A's MEG figures in the diversity panel's environment `preset`, after refreshing the derived data.
MegFigures meg_of_a(AppState& s, Derived& d, const std::string& preset) {
    DiversityChoice c = choice_from_preset(preset);
    c.orientations = true;
    run(s, intent::ChangeDiversity{c});
    refresh(d, s);
    REQUIRE(d.diversity.value().figures.a.meg);
    return *d.diversity.value().figures.a.meg;
}
}  // namespace

TEST_CASE("viewer: a dipole along x with up +x has the z dipole's MEG and orientation curve", "[viewer][mounting]") {
    AppState s;
    run(s, intent::AddPatterns{{dipole("x dipole", true), dipole("z dipole", false)}, ""}, intent::ShowDiversity{true});
    REQUIRE(s.patterns.size() == 2);
    const int first_id = s.patterns[0].id;
    run(s, intent::SetMounting{0, Vec3{1, 0, 0}, {}});
    CHECK(s.mounting_error.empty());
    CHECK(s.patterns[0].id != first_id);  // a new id: every derived view is rebuilt once
    REQUIRE(s.patterns[0].as_read);      // kept for the next change of mounting
    CHECK(format_up(s.patterns[0].set.mounting.up) == "+x");
    Derived d;
    for (const std::string env : {"uniform", "indoor", "urban", "rural"}) {
        run(s, intent::SelectPattern{0});
        const MegFigures x = meg_of_a(s, d, env);
        const auto curve_x = d.diversity.value().figures.a.orientations;
        run(s, intent::SelectPattern{1});
        const MegFigures z = meg_of_a(s, d, env);
        const auto curve_z = d.diversity.value().figures.a.orientations;
        INFO(env);
        // Up +x is a quarter turn about y: it resamples a 5-degree grid, so the two agree to the
        // interpolation's accuracy on a smooth pattern, not bit for bit.
        CHECK(10 * std::log10(x.meg) == Approx(10 * std::log10(z.meg)).margin(0.01));
        REQUIRE(x.vertical_share);
        CHECK(*x.vertical_share == Approx(*z.vertical_share).margin(1e-3));
        REQUIRE(curve_x);
        REQUIRE(curve_z);
        REQUIRE(curve_x->samples.size() == curve_z->samples.size());
        CHECK(10 * std::log10(curve_x->min) == Approx(10 * std::log10(curve_z->min)).margin(0.02));
        CHECK(10 * std::log10(curve_x->max) == Approx(10 * std::log10(curve_z->max)).margin(0.02));
    }
    // Unmounted, the x dipole is horizontal: almost no vertical share in the uniform environment
    // with XPR 0 dB (a z dipole has all of its power vertical).
    run(s, intent::SetMounting{0, std::nullopt, {}}, intent::SelectPattern{0});
    CHECK(is_identity(s.patterns[0].set.mounting));
    CHECK_FALSE(s.patterns[0].as_read);  // the set is the pattern as read again
    const MegFigures flat = meg_of_a(s, d, "uniform");
    REQUIRE(flat.vertical_share);
    CHECK(*flat.vertical_share < 0.5);
}

TEST_CASE("viewer: a new mounting installs the pattern as read, never the turned one again", "[viewer][mounting]") {
    AppState s;
    run(s, intent::AddPatterns{{dipole("z dipole", false, 2)}, ""});
    const FarFieldSet original = s.patterns[0].set;
    // Two quarter turns about z, then back to none: the samples are exactly those read
    // (quarter turns about z map a 2-degree grid onto itself).
    run(s, intent::SetMounting{0, std::nullopt, {{Axis::z, 90}}});
    CHECK(s.patterns[0].set.mounting.turns.size() == 1);
    run(s, intent::SetMounting{0, std::nullopt, {{Axis::z, 90}, {Axis::z, 90}}});
    CHECK(s.patterns[0].set.mounting.turns.size() == 2);  // not three: from the pattern as read
    CHECK_FALSE(s.patterns[0].set.mounting_resampled);
    run(s, intent::SetMounting{0, std::nullopt, {}});
    CHECK(s.patterns[0].set.frequencies[0].e_theta == original.frequencies[0].e_theta);
    CHECK(s.patterns[0].set.frequencies[0].e_phi == original.frequencies[0].e_phi);
}

TEST_CASE("viewer: the mounting control's turns text, its error and a pattern's own request", "[viewer][mounting]") {
    AppState s;
    run(s, intent::AddPatterns{{dipole("a", false), dipole("b", true)}, ""});
    run(s, intent::EditTurns{"z:3"});
    REQUIRE(s.turns_input);
    CHECK(*s.turns_input == "z:3");
    run(s, intent::SetMounting{0, std::nullopt, {{Axis::z, 30}}});
    CHECK_FALSE(s.turns_input);  // applied: the field shows A's turns again
    run(s, intent::EditTurns{"x:1"}, intent::SelectPattern{1});
    CHECK_FALSE(s.turns_input);  // another A: its own turns
    CHECK(s.patterns[0].install.turns.size() == 1);
    CHECK(s.patterns[1].install.turns.empty());
    // A mounting the data cannot take is refused with the reason and leaves the pattern as it was.
    FarFieldSet partial = dipole("partial", false);
    partial.grid.theta.count = partial.grid.theta.count / 2;  // the upper half: resampling needs the whole sphere
    for (FarField& f : partial.frequencies) {
        f.e_theta.resize(partial.grid.size());
        f.e_phi.resize(partial.grid.size());
    }
    run(s, intent::AddPatterns{{partial}, ""});
    const int id = s.patterns.back().id;
    run(s, intent::SetMounting{2, Vec3{1, 0, 0}, {}});
    CHECK(s.patterns.back().id == id);
    CHECK_FALSE(s.mounting_error.empty());
    CHECK(is_identity(s.patterns.back().set.mounting));
}

TEST_CASE("viewer: a file's mounting from the command line comes with its LoadFinished", "[viewer][mounting]") {
    AppState s;
    InstallRequest q;
    q.up = Vec3{1, 0, 0};
    run(s, intent::LoadFinished{"x.csv", "/tmp/x.csv", dipole("x", true), q});
    REQUIRE(s.patterns.size() == 1);
    CHECK(format_up(s.patterns[0].set.mounting.up) == "+x");
    CHECK(s.patterns[0].install.up);
    REQUIRE(s.patterns[0].as_read);
    CHECK(is_identity(s.patterns[0].as_read->mounting));
}

namespace {
// Two identical short dipoles (E_theta = sin theta, Balanis sec. 4.2) as A and B, the diversity
// panel open in the uniform environment; the ECC after refreshing.
double ecc_of(AppState& s, Derived& d) {
    refresh(d, s);
    REQUIRE(d.diversity.value().figures.correlation);
    return d.diversity.value().figures.correlation->ecc;
}
FarFieldSet short_dipole(const std::string& name) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, 2, 1e9);
    s.name = name;
    return s;
}
}  // namespace

TEST_CASE("viewer: moving the phase reference in the window gives the correlation of spaced dipoles", "[viewer][mounting]") {
    AppState s;
    run(s, intent::AddPatterns{{short_dipole("A"), short_dipole("B")}, ""}, intent::ShowDiversity{true},
        intent::SetCompare{1}, intent::ChangeDiversity{choice_from_preset("uniform")});
    Derived d;
    CHECK(ecc_of(s, d) == Approx(1).margin(1e-9));  // identical patterns (conventions.md)
    const int id = s.patterns[1].id;
    const double lambda = 299792458.0 / 1e9;
    const double dx = 0.4 * lambda;
    run(s, intent::SetPhaseReference{1, PhaseReference::point, Vec3{dx, 0, 0}});
    CHECK(s.reference_error.empty());
    CHECK(s.patterns[1].id == id);  // magnitudes and polarisation unchanged: the surface and cut stay
    // Moving B's reference by c is B displaced by -c: two parallel z dipoles kd apart in a uniform
    // field, whose complex correlation is (3/4) int sin^3 t J0(kd sin t) dt
    // = 3/2 (sin x/x + cos x/x^2 - sin x/x^3), x = kd (the integral in closed form, checked
    // against scipy quadrature; the Vaughan-Andersen ECC is its square, conventions.md).
    const double x = 2 * M_PI * dx / lambda;
    const double rho = 1.5 * (std::sin(x) / x + std::cos(x) / (x * x) - std::sin(x) / (x * x * x));
    CHECK(ecc_of(s, d) == Approx(rho * rho).margin(2e-3));
    // The same request at start-up (what `view "b.csv::phase-centre=X,0,0"` and every command
    // install through install_pattern): the same ECC, to the last bit.
    AppState t;
    InstallRequest q;
    q.reference = PhaseReference::point;
    q.reference_point_m = {dx, 0, 0};
    run(t, intent::AddPatterns{{short_dipole("A")}, ""}, intent::LoadFinished{"b.csv", "/b.csv", short_dipole("B"), q},
        intent::SelectPattern{0}, intent::ShowDiversity{true}, intent::SetCompare{1}, intent::ChangeDiversity{choice_from_preset("uniform")});
    Derived dt;
    CHECK(ecc_of(t, dt) == ecc_of(s, d));
    // Moving both references by the same point leaves the ECC as it was (a common factor).
    run(s, intent::SetPhaseReference{0, PhaseReference::point, Vec3{dx, 0, 0}});
    CHECK(ecc_of(s, d) == Approx(1).margin(1e-9));
    // Back to the file's origin, and the estimated phase centre (the origin for a dipole there).
    run(s, intent::SetPhaseReference{0, PhaseReference::keep, {}});
    CHECK(ecc_of(s, d) == Approx(rho * rho).margin(2e-3));
    run(s, intent::SetPhaseReference{1, PhaseReference::phase_centre, {}});
    CHECK(s.patterns[1].install.reference == PhaseReference::phase_centre);
    CHECK(ecc_of(s, d) == Approx(1).margin(1e-6));
    // A reference the core refuses (beyond max_reference_shift_wl) is named and changes nothing.
    const int ref = s.patterns[1].reference_id;
    run(s, intent::SetPhaseReference{1, PhaseReference::point, Vec3{1e9, 0, 0}});
    CHECK_FALSE(s.reference_error.empty());
    CHECK(s.patterns[1].reference_id == ref);
}
