// Band plots and band CSV: the values written are the core's, every row has every column, and
// the figure renders in every format.
#include <catch2/catch.hpp>

#include <sstream>

#include "exports/band_figure.hpp"
#include "exports/render.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

namespace {
FarFieldSet drifting_turnstile() {
    FarFieldSet s;
    for (int k = -2; k <= 2; ++k) {
        ReferenceAntenna a;
        a.kind = ReferenceKind::crossed_dipoles;
        a.phase_deg = -90 + 10.0 * k;
        FarFieldSet one = synthesize(a, 5.0, 2.45e9 + 50e6 * k);
        if (s.frequencies.empty()) s = one;
        else s.frequencies.push_back(one.frequencies[0]);
    }
    s.name = "turnstile";
    return s;
}
std::vector<std::string> split(const std::string& line) {
    std::vector<std::string> out;
    std::stringstream ss(line);
    std::string cell;
    while (std::getline(ss, cell, ',')) out.push_back(cell);
    if (!line.empty() && line.back() == ',') out.emplace_back();
    return out;
}
}  // namespace

TEST_CASE("nice ticks step by 1, 2 or 5 times a power of ten", "[export][band]") {
    // Common practice for axis labels.
    CHECK(nice_ticks(0, 10, 5) == std::vector<double>{0, 2, 4, 6, 8, 10});
    const std::vector<double> t = nice_ticks(2.3, 2.6, 6), want{2.3, 2.35, 2.4, 2.45, 2.5, 2.55, 2.6};
    REQUIRE(t.size() == want.size());
    for (std::size_t k = 0; k < t.size(); ++k) CHECK(t[k] == Approx(want[k]).epsilon(1e-12));
    CHECK(nice_ticks(1, 1, 5).empty());
}

TEST_CASE("band CSV holds the core's figures, one full row per frequency and pair", "[export][band]") {
    const FarFieldSet s = drifting_turnstile();
    BandRequest r;
    r.options.environments = {*environment_preset("uniform")};
    r.options.direction_deg = std::make_pair(0.0, 0.0);
    const BandSet b = compute_band_set("", s, r.options);
    const BandPair p{"A–B", band_pair_figures(s, s, r.options.environments)};
    const std::string csv = band_csv({b}, {p}, r);
    std::stringstream in(csv);
    std::string line;
    std::getline(in, line);
    const auto header = split(line);
    CHECK(header[0] == "kind");
    CHECK(header.back() == "diversity_gain_uniform_db");
    int rows = 0, pairs = 0;
    while (std::getline(in, line)) {
        const auto cells = split(line);
        REQUIRE(cells.size() == header.size());
        if (cells[0] == "pair") {
            // A pattern against itself: rho_e = 1 (conventions.md check: identical patterns give 1).
            CHECK(std::stod(cells[cells.size() - 2]) == Approx(1.0).epsilon(1e-9));
            ++pairs;
            continue;
        }
        const FrequencyFigures& f = b.figures[std::size_t(rows)];
        CHECK(std::stod(cells[2]) == s.frequencies[f.freq_index].frequency_hz);
        CHECK(std::stod(cells[3]) == f.summary.peak_db);  // 17 digits: the same double
        CHECK(std::stod(cells[15]) == *f.ar_at_direction->ar_db);
        ++rows;
    }
    CHECK(rows == 5);
    CHECK(pairs == 5);
}

TEST_CASE("band figure: panels as asked, edges marked, renders as SVG, PDF and PNG", "[export][band]") {
    const FarFieldSet s = drifting_turnstile();
    BandRequest r;
    r.panels = {BandPanel::gain, BandPanel::axial_ratio, BandPanel::ar_beamwidth, BandPanel::correlation};
    r.options.direction_deg = std::make_pair(0.0, 0.0);
    const BandSet b = compute_band_set("", s, r.options);
    const XyFigure fig = make_band_figure({b}, {}, r);
    REQUIRE(fig.panels.size() == 4);
    CHECK(fig.x_unit == "GHz");
    // AR panel: the 3 dB reference line and the two interpolated AR band edges.
    REQUIRE(b.summary.ar);
    CHECK(fig.panels[1].y_references == std::vector<double>{3.0});
    REQUIRE(fig.panels[1].markers.size() == 2);
    CHECK(fig.panels[1].markers[0].x == b.summary.ar->lower_hz);
    // The correlation panel without a pair says why it is empty.
    CHECK(fig.panels[3].series.empty());
    CHECK(fig.panels[3].empty_text == "needs two patterns");
    for (FileFormat f : {FileFormat::svg, FileFormat::pdf, FileFormat::png}) {
        auto bytes = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, f, RenderSize{});
        REQUIRE(bytes);
        CHECK(bytes->size() > 1000);
    }
    auto png = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, FileFormat::png, RenderSize{});
    auto img = decode_png(*png);
    REQUIRE(img);
    CHECK(img->width == 1200);
}

TEST_CASE("band panels parse by name and refuse unknown ones", "[export][band]") {
    auto p = parse_band_panels("gain,ecc,diversity-gain");
    REQUIRE(p);
    CHECK(p->size() == 3);
    auto bad = parse_band_panels("gain,colour");
    REQUIRE(!bad);
    CHECK(bad.error().message.find("unknown panel \"colour\"") != std::string::npos);
}
