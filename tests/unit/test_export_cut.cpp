// Cut exports: the CSV holds exactly the core's cut values, components that need phase are refused
// on magnitude-only data, and the beam figures shown in the legend are the core's.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <sstream>
#include <string>
#include <vector>

#include "exports/cut_figure.hpp"
#include "exports/cut_phase.hpp"
#include "exports/figure_text.hpp"
#include "pattern/cut.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

namespace {

FarFieldSet crossed_dipoles() {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -90;
    return synthesize(a, 2.0, 2.45e9);
}

// Parse the CSV back: header names and rows of doubles (NaN for empty fields).
struct Table {
    std::vector<std::string> header;
    std::vector<std::vector<double>> rows;
};
Table parse_csv(const std::string& text) {
    Table t;
    std::istringstream in(text);
    std::string line;
    std::getline(in, line);
    std::stringstream h(line);
    for (std::string cell; std::getline(h, cell, ',');) t.header.push_back(cell);
    while (std::getline(in, line)) {
        std::vector<double> row;
        std::size_t pos = 0;
        while (true) {
            std::size_t comma = line.find(',', pos);
            std::string cell = line.substr(pos, comma == std::string::npos ? std::string::npos : comma - pos);
            row.push_back(cell.empty() ? NAN : std::strtod(cell.c_str(), nullptr));
            if (comma == std::string::npos) break;
            pos = comma + 1;
        }
        t.rows.push_back(row);
    }
    return t;
}

}  // namespace

TEST_CASE("cut CSV holds the core's cut values exactly", "[export]") {
    const FarFieldSet s = crossed_dipoles();
    const std::vector<Component> comps{Component::total, Component::rhcp, Component::lhcp, Component::theta};
    const CutSpec spec = CutSpec::phi_cut(30);
    auto cut = compute_cut(s, 0, spec, comps, 1.0);
    REQUIRE(cut.ok());
    const Table t = parse_csv(cut_csv(s, *cut));
    REQUIRE(t.header == std::vector<std::string>{"angle_deg", "theta_deg", "phi_deg", "total_dbi", "rhcp_dbic", "lhcp_dbic",
                                                 "theta_dbi"});
    // The reference: the core called directly (pattern/cut.hpp), independently of the export code.
    const CutSamples ref = sample_cut(s, 0, spec, 1.0);
    REQUIRE(t.rows.size() == ref.angle_deg.size());
    for (std::size_t i = 0; i < comps.size(); ++i) {
        const std::vector<double> p = cut_power(s, ref, comps[i]);
        for (std::size_t k = 0; k < p.size(); ++k) {
            const double want = to_db(p[k]);
            const double got = t.rows[k][3 + i];
            if (std::isinf(want))
                CHECK(got == want);
            else
                CHECK(got == want);  // 17 significant digits read back as the same double
        }
    }
    for (std::size_t k = 0; k < ref.angle_deg.size(); ++k) {
        CHECK(t.rows[k][0] == ref.angle_deg[k]);
        CHECK(t.rows[k][1] == ref.theta_deg[k]);
        CHECK(t.rows[k][2] == ref.phi_deg[k]);
    }
}

TEST_CASE("cut values on a crossed-dipole pair follow the closed form", "[export]") {
    // Two short dipoles along x and y fed in quadrature (conventions.md, reference antennas): on
    // any phi cut the RHCP power goes as (1 + cos theta)^2 / 4 relative to its peak toward +z
    // (from the field E = -(p - (p.r) r) with p = x + j y; derived by hand, common practice).
    const FarFieldSet s = crossed_dipoles();
    auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::rhcp}, 1.0);
    REQUIRE(cut.ok());
    const double peak = cut->power[0][180];  // angle 0 = theta 0
    // Every 10 deg: the samples fall on grid nodes, so no interpolation error enters the check.
    for (std::size_t k = 0; k < cut->samples.angle_deg.size(); k += 10) {
        const double t = std::abs(cut->samples.angle_deg[k]) * deg;
        const double want = 0.25 * (1 + std::cos(t)) * (1 + std::cos(t));
        CHECK(cut->power[0][k] / peak == Approx(want).margin(1e-9));
    }
    // HPBW: (1 + cos t)/2 = 1/sqrt2  ->  t = acos(sqrt2 - 1) = 65.53 deg, width 131.06 deg.
    REQUIRE(cut->beams[0].hpbw_deg);
    CHECK(*cut->beams[0].hpbw_deg == Approx(2 * std::acos(std::sqrt(2.0) - 1) / deg).margin(0.2));
}

TEST_CASE("components that need phase are refused on magnitude-only data", "[export]") {
    FarFieldSet s = crossed_dipoles();
    s.content = FieldContent::magnitude_only;
    for (Component c : {Component::rhcp, Component::lhcp, Component::co, Component::cross}) {
        auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total, c});
        REQUIRE_FALSE(cut.ok());
        CHECK(cut.error().message.find("needs the phase") != std::string::npos);
        CHECK(cut.error().message.find(to_string(c)) != std::string::npos);
    }
    CHECK(compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total, Component::theta, Component::phi}).ok());
    s.content = FieldContent::total_only;
    CHECK_FALSE(compute_cut(s, 0, CutSpec::phi_cut(0), {Component::theta}).ok());
    CHECK(compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total}).ok());
}

TEST_CASE("component lists parse and reject unknown names", "[export]") {
    auto ok = parse_component_list("total, rhcp,lhcp");
    REQUIRE(ok.ok());
    CHECK(ok->size() == 3);
    auto bad = parse_component_list("total,circular");
    REQUIRE_FALSE(bad.ok());
    CHECK(bad.error().message.find("circular") != std::string::npos);
    CHECK_FALSE(parse_component_list("total,total").ok());
    CHECK_FALSE(parse_component_list("").ok());
}

TEST_CASE("plot curves carry the core's beam figures", "[export]") {
    // Half-wave dipole: HPBW 78 deg (Balanis sec. 4.6), F/B 0 dB on an elevation cut (symmetry).
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    a.length_wl = 0.5;
    const FarFieldSet s = synthesize(a, 1.0, 1e9);
    auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total, Component::phi});
    REQUIRE(cut.ok());
    const CutPlot p = make_cut_plot(s, *cut, {});
    REQUIRE(p.curves.size() == 2);
    REQUIRE(p.curves[0].beam);
    CHECK(*p.curves[0].beam->hpbw_deg == Approx(78.0).margin(0.3));
    CHECK(*p.curves[0].beam->front_to_back_db == Approx(0.0).margin(1e-6));
    CHECK_FALSE(p.curves[1].beam);  // no phi component on a z dipole: no peak to read
    // Equal maxima at theta = +-90: the readout names the cut's own half-plane (angle >= 0).
    CHECK(p.curves[0].beam->peak_angle_deg == Approx(90.0).margin(0.01));
    CHECK(p.marked_curve == 0);
    CHECK(p.layout == AngleLayout::signed_half);
    CHECK(p.subtitle.find("1 GHz") != std::string::npos);
}

TEST_CASE("every cut says what its angle means and which way is positive", "[export]") {
    // Issue 17: the axis of every cut, on screen and in files (the viewer shows axis_note too).
    CHECK(cut_axis_text(CutSpec::phi_cut(30)).find("positive in the half-plane \u03c6 = 30\u00b0") != std::string::npos);
    CHECK(cut_axis_text(CutSpec::phi_cut(30)).find("negative in \u03c6 = 210\u00b0") != std::string::npos);
    CHECK(cut_axis_text(CutSpec::theta_cut(90)).find("toward +y") != std::string::npos);
    // The viewer's cut through a pin runs along theta-hat (the meridian): positive toward larger theta.
    const std::string through = cut_axis_text(CutSpec::through(60, 30, false));
    CHECK(through.find("\u03b8-hat (the meridian): positive toward larger \u03b8") != std::string::npos);
    CHECK(cut_axis_text(CutSpec::through(60, 30, true)).find("\u03c6-hat: positive toward larger \u03c6") != std::string::npos);
    // Positive really is toward larger theta: a sample at +10 deg lies at theta 70 deg.
    FarFieldSet s = synthesize(ReferenceAntenna{}, 5, 1e9);
    const CutSamples c = sample_cut(s, 0, CutSpec::through(60, 30, false), 10);
    for (std::size_t k = 0; k < c.angle_deg.size(); ++k)
        if (std::abs(c.angle_deg[k] - 10) < 1e-9) CHECK(c.theta_deg[k] == Approx(70).margin(1e-6));
}

TEST_CASE("the figure's table names each curve and gives its figures", "[export]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    a.length_wl = 0.5;
    const FarFieldSet s = synthesize(a, 1, 1e9);
    auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total, Component::phi});
    REQUIRE(cut.ok());
    CutPlot p = make_cut_plot(s, *cut, {});
    add_curves(p, s, *cut, "B: other, ", "B ");
    const CutTable t = cut_table(p);
    REQUIRE(t.rows.size() == 4);
    CHECK(t.header[2] == "at \u03b8");
    CHECK(t.rows[0][0] == "Total");
    CHECK(t.rows[0][1] == "2.15 dBi");  // half-wave dipole, D = 1.64 (Balanis sec. 4.6)
    CHECK(t.rows[0][3] == "78.1\u00b0");  // HPBW 78 deg (Balanis sec. 4.6)
    CHECK(t.rows[1][1] == "no power");    // E-phi of a z dipole
    CHECK(t.rows[2][0] == "B: other, Total");
    CHECK(p.curves[2].tag == "B Total");
    // The key tells the axis and the scale.
    const std::vector<std::string> key = cut_key_notes(p);
    CHECK(key.front() == p.axis_note);
    CHECK(std::any_of(key.begin(), key.end(), [](const std::string& n) { return n.find("dB per ring") != std::string::npos; }));
}

TEST_CASE("the table shows a peak at the nadir of a phi cut as 180, not -180", "[export]") {
    // pattern/cut.hpp: theta runs -180..180 round a closed loop; -180 and +180 are one direction.
    CutPlot p;
    p.layout = AngleLayout::signed_half;
    PlotCurve c;
    c.label = "LHCP";
    c.unit = "dBic";
    BeamFigures b;
    b.shape = BeamShape::beam;
    b.peak_angle_deg = -180.0;
    b.peak_db = 1.76;
    b.hpbw_deg = 131.0;
    c.beam = b;
    p.curves.push_back(c);
    CHECK(cut_table(p).rows[0][2] == "180.0\u00b0");
    p.layout = AngleLayout::full_turn;
    p.curves[0].beam->peak_angle_deg = 359.99;  // a conical cut: 360 is 0
    CHECK(cut_table(p).rows[0][2] == "0.0\u00b0");
}

TEST_CASE("a phase comparison figure holds A's and B's phases, each labelled and with its reference", "[export]") {
    // The viewer's phase view with a comparison exports what it draws: B's lines after A's. The
    // values are the core's cut phases (pattern/component_phase.hpp) of each antenna, unchanged.
    FarFieldSet a = crossed_dipoles();
    a.name = "turnstile";
    ReferenceAntenna d;
    d.kind = ReferenceKind::dipole;
    FarFieldSet b = synthesize(d, 2.0, 2.45e9);
    b.name = "half-wave";
    const CutSpec spec = CutSpec::phi_cut(30);
    auto ca = compute_cut(a, 0, spec, {Component::rhcp, Component::lhcp}, 1.0);
    auto cb = compute_cut(b, 0, spec, {Component::theta}, 1.0);
    REQUIRE(ca.ok());
    REQUIRE(cb.ok());
    const auto pa = cut_phases(a, *ca), pb = cut_phases(b, *cb);
    const XyFigure f = make_cut_phase_comparison(a, *ca, pa, b, *cb, pb);
    REQUIRE(f.panels.size() == 1);
    const std::vector<XySeries>& s = f.panels[0].series;
    REQUIRE(s.size() == 3);
    CHECK(s[0].label.rfind("A: turnstile, ", 0) == 0);
    CHECK(s[1].label.rfind("A: turnstile, ", 0) == 0);
    CHECK(s[2].label.rfind("B: half-wave, ", 0) == 0);
    CHECK(s[0].style != s[2].style);
    CHECK(s[1].style != s[2].style);
    std::vector<double> x, y;
    break_at_wraps(cb->samples.angle_deg, pb[0], x, y);
    REQUIRE(s[2].y.size() == y.size());
    for (std::size_t k = 0; k < y.size(); ++k) CHECK((s[2].y[k] == y[k] || (std::isnan(s[2].y[k]) && std::isnan(y[k]))));
    CHECK(f.title == "turnstile (A) and half-wave (B)");
    const std::string notes = f.notes[0] + "\n" + f.notes[1];
    CHECK(notes.find("A: Phase relative to") != std::string::npos);
    CHECK(notes.find("B: Phase relative to") != std::string::npos);
}
