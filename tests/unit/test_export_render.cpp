// Rendering: one drawing path gives well-formed SVG with one stroked path per curve (plus its
// legend swatch), a PDF, and a PNG of the asked-for size with the curves' colours in it; the
// bundled font is embedded and loads without the system font path.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdio>
#include <string>

#include "exports/cut_figure.hpp"
#include "exports/fonts.hpp"
#include "exports/palette.hpp"
#include "exports/render.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

namespace {

CutPlot dipole_plot(PlotStyle style, std::vector<Component> comps) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    const FarFieldSet s = synthesize(a, 2.0, 2.45e9);
    auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), comps);
    REQUIRE(cut.ok());
    FigureOptions o;
    o.style = style;
    return make_cut_plot(s, *cut, o);
}

std::string render(const CutPlot& p, FileFormat f, RenderSize size = {}) {
    auto bytes = render_image([&](cairo_t* cr, double w, double h) { draw_cut_plot(cr, p, w, h); }, f, size, p.title);
    REQUIRE(bytes.ok());
    return *bytes;
}

std::size_t count(const std::string& hay, const std::string& needle) {
    std::size_t n = 0;
    for (std::size_t pos = hay.find(needle); pos != std::string::npos; pos = hay.find(needle, pos + 1)) ++n;
    return n;
}

// Cairo writes colours as percentages: "stroke:rgb(0%,44.705882%,69.803922%)".
std::string stroke_of(Rgb c) {
    auto pct = [](double v) {
        char b[32];
        std::snprintf(b, sizeof b, "%f", 100 * v);
        std::string s = b;
        while (s.back() == '0') s.pop_back();
        if (s.back() == '.') s.pop_back();
        return s + "%";
    };
    return "stroke:rgb(" + pct(c.r) + "," + pct(c.g) + "," + pct(c.b) + ")";
}

}  // namespace

TEST_CASE("bundled font is embedded TrueType and loads through FreeType", "[export]") {
    for (FontWeight w : {FontWeight::regular, FontWeight::bold}) {
        const FontBytes b = bundled_font_bytes(w);
        REQUIRE(b.size > 100000);  // DejaVu Sans is several hundred kB
        // TrueType sfnt version 0x00010000 (OpenType spec, table directory).
        CHECK(b.data[0] == 0);
        CHECK(b.data[1] == 1);
        CHECK(b.data[2] == 0);
        CHECK(b.data[3] == 0);
        CHECK(font_face(w) != nullptr);
    }
}

TEST_CASE("SVG export: one stroked path per curve and one per legend swatch", "[export]") {
    for (PlotStyle style : {PlotStyle::polar, PlotStyle::rect}) {
        const CutPlot p = dipole_plot(style, {Component::total, Component::rhcp, Component::lhcp});
        const std::string svg = render(p, FileFormat::svg);
        CHECK(svg.rfind("<?xml", 0) == 0);
        CHECK(svg.find("<svg") != std::string::npos);
        CHECK(svg.find("</svg>") != std::string::npos);
        for (std::size_t i = 0; i < 3; ++i) CHECK(count(svg, stroke_of(curve_colour(i))) == 2);
        CHECK(count(svg, stroke_of(curve_colour(3))) == 0);
        CHECK(svg.find("width=\"576pt\"") != std::string::npos);  // 1200 px at 150 dpi = 8 in
    }
}

TEST_CASE("SVG export: a component with no power on the cut draws no curve", "[export]") {
    // z dipole on an elevation cut: the phi component is zero everywhere (Balanis sec. 4.2).
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    const FarFieldSet s = synthesize(a, 2.0, 1e9);
    auto cut = compute_cut(s, 0, CutSpec::phi_cut(0), {Component::total, Component::phi});
    REQUIRE(cut.ok());
    for (PlotStyle style : {PlotStyle::polar, PlotStyle::rect}) {
        FigureOptions o;
        o.style = style;
        const std::string svg = render(make_cut_plot(s, *cut, o), FileFormat::svg);
        CHECK(count(svg, stroke_of(curve_colour(0))) == 2);  // total: curve + swatch
        CHECK(count(svg, stroke_of(curve_colour(1))) == 1);  // phi: swatch only
    }
}

TEST_CASE("PDF export starts and ends like a PDF file", "[export]") {
    const std::string pdf = render(dipole_plot(PlotStyle::polar, {Component::total}), FileFormat::pdf);
    CHECK(pdf.rfind("%PDF-", 0) == 0);
    CHECK(pdf.find("%%EOF") != std::string::npos);
    // Reproducible: the same figure gives the same bytes (fixed creation date).
    CHECK(render(dipole_plot(PlotStyle::polar, {Component::total}), FileFormat::pdf) == pdf);
}

TEST_CASE("PNG export: requested size, opaque white page, curves in their colours", "[export]") {
    RenderSize size;
    size.width_px = 640;
    size.height_px = 480;
    size.dpi = 80;
    const CutPlot p = dipole_plot(PlotStyle::rect, {Component::total, Component::rhcp});
    auto img = decode_png(render(p, FileFormat::png, size));
    REQUIRE(img.ok());
    CHECK(img->width == 640);
    CHECK(img->height == 480);
    std::size_t white = 0, ink = 0, in_colour[2] = {0, 0};
    for (std::size_t k = 0; k < img->rgb.size(); k += 3) {
        const int r = (unsigned char)img->rgb[k], g = (unsigned char)img->rgb[k + 1], b = (unsigned char)img->rgb[k + 2];
        if (r == 255 && g == 255 && b == 255) ++white;
        if (r + g + b < 200) ++ink;
        for (int i = 0; i < 2; ++i) {
            const Rgb c = curve_colour(std::size_t(i));
            if (std::abs(r - int(c.r * 255)) < 20 && std::abs(g - int(c.g * 255)) < 20 && std::abs(b - int(c.b * 255)) < 20)
                ++in_colour[i];
        }
    }
    const double n = 640.0 * 480.0;
    CHECK(white / n > 0.6);   // mostly paper
    CHECK(white / n < 0.99);  // but not blank
    CHECK(ink > 500);         // text and frame
    CHECK(in_colour[0] > 150);  // antialiased 1.7-pixel lines: only their cores hit the colour exactly
    CHECK(in_colour[1] > 150);
}

TEST_CASE("sizes and formats are parsed strictly", "[export]") {
    auto s = parse_size("1200x900", 150);
    REQUIRE(s.ok());
    CHECK(s->width_pt() == Approx(576));
    CHECK(s->height_pt() == Approx(432));
    CHECK_FALSE(parse_size("1200", 150).ok());
    CHECK_FALSE(parse_size("0x10", 150).ok());
    CHECK_FALSE(parse_size("12ax10", 150).ok());
    CHECK_FALSE(parse_size("800x600", 5).ok());
    // The limits in the message are the constants the check uses (min_dpi, max_dpi).
    CHECK(parse_size("800x600", max_dpi + 1).error().message == "expected a number of dots per inch from 36 to 2400");
    CHECK(parse_size("800x600", min_dpi).ok());
    CHECK(parse_size("800x600", max_dpi).ok());
    CHECK(format_from_path("a/b.SVG") == FileFormat::svg);
    CHECK(format_from_path("x.pdf") == FileFormat::pdf);
    CHECK(format_from_path("x.png") == FileFormat::png);
    CHECK(format_from_path("x.csv") == FileFormat::csv);
    CHECK_FALSE(format_from_path("x.jpg"));
    CHECK_FALSE(format_from_path("dir.svg/file"));
}

TEST_CASE("the unsampled part of a cut is shaded and said so", "[export]") {
    // Upper hemisphere only (theta 0..90), as a range measurement above a ground plane gives.
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    FarFieldSet full = synthesize(a, 2.0, 1e9);
    FarFieldSet half = full;
    half.grid.theta.count = 46;
    for (FarField& f : half.frequencies) {
        f.e_theta.resize(half.grid.size());
        f.e_phi.resize(half.grid.size());
    }
    const std::string grey = "fill:rgb(93%,93%,93%)";
    for (PlotStyle style : {PlotStyle::polar, PlotStyle::rect}) {
        FigureOptions o;
        o.style = style;
        auto cut_half = compute_cut(half, 0, CutSpec::phi_cut(0), {Component::total});
        auto cut_full = compute_cut(full, 0, CutSpec::phi_cut(0), {Component::total});
        REQUIRE(cut_half.ok());
        REQUIRE(cut_full.ok());
        const CutPlot ph = make_cut_plot(half, *cut_half, o), pf = make_cut_plot(full, *cut_full, o);
        CHECK(render(ph, FileFormat::svg).find(grey) != std::string::npos);
        CHECK(render(pf, FileFormat::svg).find(grey) == std::string::npos);
        // The cut's lower half (|theta| > 90) has no data: the curve holds NaN there.
        std::size_t nan = 0;
        for (double v : ph.curves[0].value_db) nan += std::isnan(v);
        CHECK(nan > ph.curves[0].value_db.size() / 3);
    }
}
