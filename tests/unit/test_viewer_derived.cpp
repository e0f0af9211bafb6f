// Derived data: rebuilt exactly when its inputs change, so nothing shown is stale. The Unpin
// button once reset only the pin and left the cut through it on screen; with one state channel
// and keyed derived data, every way of unpinning recomputes the cut.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/reference.hpp"
#include "viewer/state/apply.hpp"
#include "viewer/state/derived.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
FarFieldSet dipole(const std::string& name, double scale = 1) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, 5, 1e9);
    s.name = name;
    for (cplx& v : s.frequencies[0].e_theta) v *= scale;
    return s;
}

template <class... I>
void run(AppState& s, I... intents) {
    Intents in;
    (in.push_back(std::move(intents)), ...);
    apply(s, std::move(in));
}

// A state showing a short dipole, cut through a pin at (60, 0).
AppState pinned_cut() {
    AppState s;
    ViewerSettings st;
    st.cut_kind = 2;
    run(s, intent::AddPatterns{{dipole("a"), dipole("b", 2)}, ""}, intent::ChangeSettings{st}, intent::Pin{Direction{60, 0}});
    return s;
}
}  // namespace

TEST_CASE("nothing is rebuilt when nothing changed", "[viewer][derived]") {
    AppState s = pinned_cut();
    Derived d;
    const DerivedChanges first = refresh(d, s);
    CHECK(first.surface);
    CHECK(first.ring);
    const DerivedChanges again = refresh(d, s);
    CHECK_FALSE(again.surface);
    CHECK_FALSE(again.glyphs);
    CHECK_FALSE(again.ring);
}

TEST_CASE("every way of unpinning recomputes the cut through the pin", "[viewer][derived]") {
    for (int way = 0; way < 2; ++way) {
        AppState s = pinned_cut();
        Derived d;
        refresh(d, s);
        REQUIRE(d.cut.value().valid);
        REQUIRE(d.pinned.value());
        if (way == 0) run(s, intent::Unpin{});  // the probe panel's button
        else run(s, intent::Escape{});          // the key
        const DerivedChanges c = refresh(d, s);
        CHECK_FALSE(d.cut.value().valid);  // "Pin a direction to cut through it."
        CHECK(c.ring);                     // and its ring leaves the surface
        CHECK(d.ring.value().vertices.empty());
        CHECK_FALSE(d.pinned.value());
    }
}

TEST_CASE("the derived data follows A, B, the frequency and the component", "[viewer][derived]") {
    AppState s = pinned_cut();
    Derived d;
    refresh(d, s);
    const double peak_a = d.surface.value().mesh.peak_db;
    CHECK(peak_a == Approx(1.76).margin(0.01));  // short dipole, D = 1.5 (Balanis sec. 4.2)
    // B (twice the field: +6.02 dB, 20 log10 2) only changes the surface with the difference colouring.
    run(s, intent::SetCompare{1});
    DerivedChanges c = refresh(d, s);
    CHECK_FALSE(c.surface);
    REQUIRE(d.cut.value().curves.size() == 2);  // but the cut overlays B at once
    CHECK(*d.cut.value().peak_db == Approx(peak_a + 6.02).margin(0.02));
    // Selecting the other pattern as A rebuilds; closing a pattern that is not A does not.
    run(s, intent::SelectPattern{1});
    c = refresh(d, s);
    CHECK(c.surface);
    CHECK(d.surface.value().mesh.peak_db == Approx(peak_a + 6.02).margin(0.02));
    run(s, intent::ClosePattern{0});
    CHECK_FALSE(refresh(d, s).surface);
    // Another component rebuilds the surface.
    ViewerSettings st = s.settings;
    st.component = Component::theta;
    run(s, intent::ChangeSettings{st});
    CHECK(refresh(d, s).surface);
    // The probe follows the hover.
    run(s, intent::Hover{Direction{90, 0}, false});
    refresh(d, s);
    REQUIRE(d.hover.value());
    CHECK(*d.hover.value()->a.db_of(Component::total) == Approx(peak_a + 6.02).margin(0.02));
}

TEST_CASE("a closed pattern is never shown from the cache", "[viewer][derived]") {
    AppState s = pinned_cut();
    Derived d;
    refresh(d, s);
    run(s, intent::ClosePattern{0}, intent::ClosePattern{0});
    const DerivedChanges c = refresh(d, s);
    CHECK(c.surface);
    CHECK(d.surface.value().mesh.vertices.empty());
    CHECK_FALSE(d.cut.value().valid);
    CHECK_FALSE(d.summary.value());
}

TEST_CASE("figures against frequency: only while the panel is open, once per pattern", "[viewer][derived]") {
    AppState s;
    FarFieldSet two = dipole("two");
    two.frequencies.push_back(two.frequencies[0]);
    two.frequencies[1].frequency_hz = 2e9;
    run(s, intent::AddPatterns{{two}, ""});
    Derived d;
    refresh(d, s);
    CHECK(d.band.value().figures.empty());  // closed: nothing computed
    run(s, intent::ShowBand{true});
    refresh(d, s);
    REQUIRE(d.band.value().figures.size() == 2);
    CHECK(d.band.value().frequency_hz == std::vector<double>{1e9, 2e9});
    // The same figures as summarize() (pattern/band.hpp builds on it) and the band value table.
    CHECK(band_value(d.band.value().figures[0], 0) == summarize(s.patterns[0].set, 0).peak_db);
    const double ms = d.band.value().compute_ms;
    run(s, intent::SetFrequency{1});  // the frequency moves the cursor, not the figures
    refresh(d, s);
    CHECK(d.band.value().compute_ms == ms);
}

TEST_CASE("fading curves: only while a panel needs them, Rayleigh from MEG, combination below A", "[viewer][derived]") {
    AppState s;
    run(s, intent::AddPatterns{{dipole("a"), dipole("b")}, ""}, intent::SetCompare{1});
    Derived d;
    refresh(d, s);
    CHECK(d.diversity.value().fading.level_db.empty());  // closed: nothing computed
    run(s, intent::ShowFading{true});
    refresh(d, s);
    const FadingCurves& c = d.diversity.value().fading;
    REQUIRE(!c.level_db.empty());
    REQUIRE(d.diversity.value().figures.a.meg);
    // One Rayleigh branch: P(power <= mean) = 1 - 1/e (conventions.md, "Fading and combining").
    const double meg_db = to_db(d.diversity.value().figures.a.meg->meg);
    for (std::size_t k = 0; k + 1 < c.level_db.size(); ++k)
        if (c.level_db[k] <= meg_db && meg_db < c.level_db[k + 1]) {
            const double t = (meg_db - c.level_db[k]) / (c.level_db[k + 1] - c.level_db[k]);
            CHECK(c.a[k] + t * (c.a[k + 1] - c.a[k]) == Approx(std::log10(1 - std::exp(-1.0))).margin(0.01));
        }
    // Identical patterns (ECC 1): selection is the single branch; maximal ratio gains 3 dB at most.
    for (std::size_t k = 0; k < c.level_db.size(); ++k)
        if (std::isfinite(c.selection[k])) CHECK(c.selection[k] == Approx(c.a[k]).margin(1e-6));
    CHECK_FALSE(d.diversity.value().figures.a.orientations);  // no sweep for the fading panel alone
}

TEST_CASE("the caption's peak is the refined peak of the shown component, none for a zero pattern", "[viewer][derived]") {
    AppState s;
    run(s, intent::AddPatterns{{dipole("a"), dipole("zero", 0)}, ""});
    Derived d;
    refresh(d, s);
    REQUIRE(d.peak_db.value());
    // The same number the headline figures give (summarize() refines the same peak), so the
    // caption and the Patterns panel round it alike.
    REQUIRE(d.summary.value());
    CHECK(*d.peak_db.value() == Approx(d.summary.value()->peak_db).margin(1e-12));
    // Short dipole directivity 1.5 = 1.76 dBi (Balanis, Antenna Theory, 4th ed., sec. 4.2); the
    // 5-degree grid holds the peak at theta = 90 exactly.
    CHECK(*d.peak_db.value() == Approx(10 * std::log10(1.5)).margin(0.01));
    run(s, intent::SelectPattern{1});
    refresh(d, s);
    CHECK_FALSE(d.peak_db.value());
}
