// Reader options and tolerated spellings: metadata, units, delimiters, decimal commas, BOM,
// CRLF, foreign layouts. Expected values are worked out by hand from the schema rules
// (docs/far-field-csv.md) and conventions.md.
#include <catch2/catch.hpp>

#include <string>

#include "importers/far_field_csv.hpp"
#include "pattern/polarisation.hpp"

using namespace ellipsa;

namespace {

FarFieldSet load(const std::string& text, const CsvReadOptions& o = {}) {
    auto r = parse_far_field_csv(text, "o.csv", o);
    if (!r) FAIL(r.error().format());
    return *r;
}

cplx at(const FarFieldSet& s, double theta, double phi, bool phi_part = false, std::size_t f = 0) {
    const int i = int(std::lround((theta - s.grid.theta.start_deg) / s.grid.theta.step_deg));
    const int j = int(std::lround(wrap360(phi - s.grid.phi.start_deg) / s.grid.phi.step_deg)) % s.grid.phi.count;
    const std::size_t k = s.grid.index(i, j);
    return phi_part ? s.frequencies[f].e_phi[k] : s.frequencies[f].e_theta[k];
}

std::string grid_rows(const char* sep, const char* values) {
    std::string s;
    for (int t : {0, 90, 180})
        for (int p : {0, 90, 180, 270}) s += std::to_string(t) + sep + std::to_string(p) + sep + values + "\n";
    return s;
}

}  // namespace

TEST_CASE("metadata lines set quantity, names and frequency", "[csv][options]") {
    FarFieldSet s = load("# quantity: Relative\n# name: horn A\n# source: range 3\n# note: first\n# note: second\n"
                         "# Some comment: not metadata\n# frequency-unit: MHz\n# frequency: 915\n"
                         "theta,phi,e_total_db\n" + grid_rows(",", "0"));
    CHECK(s.quantity == Quantity::relative);
    CHECK(s.name == "horn A");
    CHECK(s.source == "range 3");
    CHECK(s.note == "first\nsecond");
    REQUIRE(s.frequencies.size() == 1);
    CHECK(s.frequencies[0].frequency_hz == Approx(915e6));
    s = load("# frequency: 2.4 GHz\ntheta,phi,e_total_db\n" + grid_rows(",", "0"));
    CHECK(s.frequencies[0].frequency_hz == Approx(2.4e9));
}

TEST_CASE("a time convention of -iwt conjugates every phase", "[csv][options]") {
    // conventions.md: a file declared exp(-i w t) has all phases negated on import.
    FarFieldSet s = load("# time-convention: -iwt\ntheta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n" +
                         grid_rows(",", "1,2,3,-4"));
    CHECK(s.time_convention_converted);
    CHECK(at(s, 90, 90) == cplx(1, -2));
    CHECK(at(s, 90, 90, true) == cplx(3, 4));
    s = load("# time-convention: -iwt\ntheta,phi,e_theta_db,e_theta_phase,e_phi_db,e_phi_phase\n" +
             grid_rows(",", "0,30,0,-45"));
    CHECK(std::arg(at(s, 90, 0)) == Approx(-30 * deg));
    CHECK(std::arg(at(s, 90, 0, true)) == Approx(45 * deg));
}

TEST_CASE("angle-unit rad applies to angles and phases; phase-unit overrides phases", "[csv][options]") {
    std::string rows;
    for (int t = 0; t <= 2; ++t)
        for (int p = 0; p < 4; ++p) {
            char b[128];
            std::snprintf(b, sizeof b, "%.17g,%.17g,0,%.17g,-6.0205999132796239,0\n", t * pi / 2, p * pi / 2, pi / 3);
            rows += b;
        }
    FarFieldSet s = load("# angle-unit: rad\ntheta,phi,e_theta_db,e_theta_phase,e_phi_db,e_phi_phase\n" + rows);
    CHECK(s.grid.theta.step_deg == Approx(90));
    CHECK(s.grid.phi.count == 4);
    CHECK(std::arg(at(s, 90, 180)) == Approx(pi / 3));
    CHECK(std::abs(at(s, 90, 180, true)) == Approx(0.5));  // -6.02 dB partial power = 1/4, amplitude 1/2
    CsvReadOptions o;
    o.settings.push_back({"phase-unit", "deg", {"--assume", 0}});
    s = load("# angle-unit: rad\ntheta,phi,e_theta_db,e_theta_phase,e_phi_db,e_phi_phase\n" + rows, o);
    CHECK(std::arg(at(s, 90, 180)) == Approx(pi / 3 * deg));
}

TEST_CASE("a frequency column in any unit, rows in any order", "[csv][options]") {
    std::string text = "# frequency-unit: GHz\nphi,e_total_db,theta,frequency\n";
    for (double f : {2.5, 1.0})
        for (int p : {270, 0, 90, 180})
            for (int t : {180, 0, 90}) {
                char b[96];
                std::snprintf(b, sizeof b, "%d,%g,%d,%g\n", p, f * 10 + t / 90.0, t, f);
                text += b;
            }
    FarFieldSet s = load(text);
    REQUIRE(s.frequencies.size() == 2);
    CHECK(s.frequencies[0].frequency_hz == Approx(1e9));
    CHECK(s.frequencies[1].frequency_hz == Approx(2.5e9));
    // e_total_db = 10 f + t/90: at 2.5 GHz, theta 90: 26 dB -> amplitude 10^(26/20).
    CHECK(std::abs(at(s, 90, 270, false, 1)) == Approx(std::pow(10.0, 26.0 / 20)));
}

TEST_CASE("semicolon and tab delimiters, decimal commas, CRLF, BOM, quotes, blanks, trailing delimiters",
          "[csv][options]") {
    std::string semi = "\xEF\xBB\xBF# quantity: gain\r\n\"Theta\" ; \"PHI\" ;E_Total_dB;\r\n\r\n";
    for (int t : {0, 90, 180})
        for (int p : {0, 90, 180, 270}) semi += std::to_string(t) + ",0;" + std::to_string(p) + ";-3,5;\r\n";
    FarFieldSet s = load(semi);
    CHECK(s.grid.theta.count == 3);
    CHECK(std::norm(at(s, 90, 90)) == Approx(std::pow(10.0, -0.35)));
    std::string tab = "theta\tphi\te_total_db\n";
    for (int t : {0, 90, 180})
        for (int p : {0, 90, 180, 270}) tab.append(" ").append(std::to_string(t) + "\t" + std::to_string(p) + "\t\"+1.5\"\t\n");
    s = load(tab);
    CHECK(std::norm(at(s, 180, 270)) == Approx(std::pow(10.0, 0.15)));
    // Decimal commas are not numbers when the delimiter is a comma.
    auto r = parse_far_field_csv("theta,phi,e_total_db\n0,0,\"1,5\"\n", "o.csv");
    CHECK_FALSE(r.ok());
}

TEST_CASE("minus infinity and very low dB read as zero field", "[csv][options]") {
    FarFieldSet s = load("theta,phi,e_theta_db,e_phi_db\n0,0,-inf,-1e30\n0,180,-INF,-3000\n90,0,0,-2999\n90,180,0,0\n");
    CHECK(s.content == FieldContent::magnitude_only);
    CHECK(at(s, 0, 0) == cplx(0, 0));
    CHECK(at(s, 0, 0, true) == cplx(0, 0));
    CHECK(at(s, 0, 180) == cplx(0, 0));
    CHECK(std::abs(at(s, 90, 0, true)) > 0);
}

TEST_CASE("azimuth/elevation: theta = 90 - elevation, phi = azimuth", "[csv][options]") {
    // conventions.md, azimuth/elevation input.
    std::string text = "azimuth,elevation,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    for (int el : {-90, -45, 0, 45, 90})
        for (int az : {-180, -90, 0, 90})
            text += std::to_string(az) + "," + std::to_string(el) + "," + std::to_string(el) + ",0," +
                    std::to_string(az) + ",0\n";
    FarFieldSet s = load(text);
    CHECK(s.grid.theta.start_deg == 0);
    CHECK(s.grid.theta.step_deg == 45);
    CHECK(s.grid.theta.count == 5);
    CHECK(s.grid.phi.start_deg == 0);
    CHECK(s.grid.phi.count == 4);
    // elevation 45 is theta 45; azimuth -90 is phi 270.
    CHECK(at(s, 45, 270) == cplx(45, 0));
    CHECK(at(s, 45, 270, true) == cplx(-90, 0));
    CHECK(at(s, 135, 180, true) == cplx(-180, 0));
}

TEST_CASE("a column map, scale and offset read a foreign layout", "[csv][options]") {
    std::string text = "Freq [GHz];Theta [rad];Phi [deg];Re Et [mV];Im Et [mV];Re Ep [mV];Im Ep [mV];Comment\n";
    for (int t : {0, 1, 2})
        for (int p : {0, 90, 180, 270}) {
            char b[160];
            std::snprintf(b, sizeof b, "2,4;%.17g;%d;1000;0;0;-2000;ok\n", t * pi / 2, p);
            text += b;
        }
    CsvReadOptions o;
    o.column_map = {{"Freq [GHz]", "frequency"}, {"theta [RAD]", "theta"},  {"Phi [deg]", "phi"},
                    {"Re Et [mV]", "e_theta_re"}, {"Im Et [mV]", "e_theta_im"}, {"Re Ep [mV]", "e_phi_re"},
                    {"Im Ep [mV]", "e_phi_im"}, {"Comment", "ignore"}};
    o.settings = {{"frequency-unit", "GHz", {"--assume", 0}}};
    o.scale = {{"e_theta_re", 1e-3}, {"e_theta_im", 1e-3}, {"e_phi_re", 1e-3}, {"e_phi_im", 1e-3},
               {"theta", 180 / pi}};
    // theta arrives in rad; scaling by 180/pi makes it deg (angle-unit stays deg)
    FarFieldSet s = load(text, o);
    CHECK(s.frequencies[0].frequency_hz == Approx(2.4e9));
    CHECK(s.grid.theta.step_deg == Approx(90));
    CHECK(at(s, 90, 90) == cplx(1, 0));
    CHECK(at(s, 90, 90, true) == cplx(0, -2));
    o.offset = {{"e_phi_im", 2}};
    s = load(text, o);
    CHECK(std::abs(at(s, 90, 90, true)) < 1e-15);
}

TEST_CASE("a map file describes a foreign layout once", "[csv][options]") {
    CsvReadOptions o;
    auto st = parse_csv_map_text("# layout of range 3 exports\ncolumn: Elev = elevation\ncolumn: Azim = azimuth\n"
                                 "column: Level = e_total_db\ncolumn: Index = ignore\noffset: e_total_db = -10\n"
                                 "quantity: relative\n",
                                 "range3.map", o);
    REQUIRE(st.ok());
    std::string text = "Index,Azim,Elev,Level\n";
    int n = 0;
    for (int el : {-90, 0, 90})
        for (int az : {0, 120, 240}) text += std::to_string(n++) + "," + std::to_string(az) + "," + std::to_string(el) + ",10\n";
    FarFieldSet s = load(text, o);
    CHECK(s.quantity == Quantity::relative);
    CHECK(s.content == FieldContent::total_only);
    CHECK(std::abs(at(s, 90, 120)) == Approx(1.0));  // 10 dB - 10 dB offset = 0 dB
    CsvReadOptions bad;
    auto e = parse_csv_map_text("column: A = nonsense\n", "x.map", bad);
    REQUIRE_FALSE(e.ok());
    CHECK(e.error().line == 1);
    CHECK(e.error().column == 13);
    e = parse_csv_map_text("\nscale e_theta_re 2\n", "x.map", bad);
    REQUIRE_FALSE(e.ok());
    CHECK(e.error().line == 2);
    bad = {};
    REQUIRE(parse_csv_map_text("angle-unit: grad\n", "y.map", bad).ok());
    auto r = parse_far_field_csv("theta,phi,e_total_db\n0,0,0\n", "o.csv", bad);
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().file == "y.map");
    CHECK(r.error().line == 1);
}

TEST_CASE("several threads read the same as one", "[csv][options]") {
    std::string text = "frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    for (int f = 1; f <= 3; ++f)
        for (int t = 0; t <= 180; t += 2)
            for (int p = 0; p < 360; p += 2) {
                char b[160];
                std::snprintf(b, sizeof b, "%de9,%d,%d,%.17g,%.17g,%.17g,0.125\n", f, t, p, std::sin(t * deg) * f,
                              std::cos(p * deg), 1e-3 * (t + p));
                text += b;
            }
    CsvReadOptions one, four;
    one.threads = 1;
    four.threads = 4;
    FarFieldSet a = load(text, one), b = load(text, four);
    REQUIRE(a.frequencies.size() == 3);
    for (std::size_t f = 0; f < 3; ++f) {
        CHECK(a.frequencies[f].e_theta == b.frequencies[f].e_theta);
        CHECK(a.frequencies[f].e_phi == b.frequencies[f].e_phi);
    }
    // Errors name the same line whichever thread met them.
    std::string bad = text;
    bad.insert(bad.rfind("3e9,90,0,"), "3e9,90,0,x,0,0,0\n");
    auto r1 = parse_far_field_csv(bad, "o.csv", one), r4 = parse_far_field_csv(bad, "o.csv", four);
    REQUIRE_FALSE(r1.ok());
    REQUIRE_FALSE(r4.ok());
    CHECK(r1.error().line == r4.error().line);
    CHECK(r1.error().line > 40000);
    // Progress reaches 1; returning false cancels.
    double last = 0;
    four.progress = [&](double f) {
        last = f;
        return true;
    };
    load(text, four);
    CHECK(last == 1.0);
    four.progress = [](double) { return false; };
    auto c = parse_far_field_csv(text, "o.csv", four);
    REQUIRE_FALSE(c.ok());
    CHECK(c.error().message == "reading cancelled");
}
