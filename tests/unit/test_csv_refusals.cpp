// Every refusal of the CSV reader: the message says what was expected, and names the line and
// column. (Schema rules: docs/far-field-csv.md; location format: common practice for compilers.)
#include <catch2/catch.hpp>

#include <cstdio>
#include <string>

#include "importers/far_field_csv.hpp"

using namespace ellipsa;
using Catch::Matchers::Contains;

namespace {

// A valid 2 x 4 grid (theta 0, 90; phi 0, 90, 180, 270), complex family.
std::string good_rows() {
    std::string s;
    for (int t : {0, 90})
        for (int p : {0, 90, 180, 270}) s += std::to_string(t) + "," + std::to_string(p) + ",1,0,0,0\n";
    return s;
}
const std::string header = "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";

Error refuse(const std::string& text, const CsvReadOptions& o = {}) {
    auto r = parse_far_field_csv(text, "t.csv", o);
    REQUIRE_FALSE(r.ok());
    INFO(r.error().format());
    CHECK(r.error().file == "t.csv");
    return r.error();
}

}  // namespace

TEST_CASE("the good file used by the refusal tests loads", "[csv][refuse]") {
    auto r = parse_far_field_csv(header + good_rows(), "t.csv");
    REQUIRE(r.ok());
    CHECK(r->grid.theta.count == 2);
    CHECK(r->grid.phi.count == 4);
}

TEST_CASE("non-numeric values are refused with line and column", "[csv][refuse]") {
    Error e = refuse(header + "0,0,1,0,0,0\n0,90,abc,0,0,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 6);
    CHECK_THAT(e.message, Contains("expected a number in column \"e_theta_re\"") && Contains("\"abc\""));
    e = refuse(header + "0,0,1,0,0,0\n0,90,1,0,,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 10);
    CHECK_THAT(e.message, Contains("an empty cell"));
    e = refuse(header + "0,0,1,0,0,0\n0,90,1.5x,0,0,0\n");
    CHECK(e.line == 3);
    CHECK_THAT(e.message, Contains("1.5x"));
}

TEST_CASE("NaN is refused", "[csv][refuse]") {
    Error e = refuse(header + "0,0,1,0,0,0\n0,90,1,NaN,0,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 8);
    CHECK_THAT(e.message, Contains("expected a number") && Contains("NaN"));
    e = refuse(header + "0,0,1,0,0,0\n0,90,1,0,0,inf\n");
    CHECK(e.line == 3);
    CHECK_THAT(e.message, Contains("finite"));
}

TEST_CASE("short and long rows are refused", "[csv][refuse]") {
    Error e = refuse(header + "0,0,1,0,0,0\n0,90,1,0,0\n");
    CHECK(e.line == 3);
    CHECK_THAT(e.message, Contains("expected 6 cells") && Contains("found 5"));
    e = refuse(header + "0,0,1,0,0,0\n0,90,1,0,0,0,7\n");
    CHECK(e.line == 3);
    CHECK_THAT(e.message, Contains("expected 6 cells") && Contains("found 7"));
}

TEST_CASE("unknown and duplicated columns are refused at their header column", "[csv][refuse]") {
    Error e = refuse("theta,phi,gain,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n0,0,1,1,0,0,0\n");
    CHECK(e.line == 1);
    CHECK(e.column == 11);
    CHECK_THAT(e.message, Contains("unknown column \"gain\""));
    e = refuse("theta,phi,theta,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n0,0,0,1,0,0,0\n");
    CHECK(e.line == 1);
    CHECK(e.column == 11);
    CHECK_THAT(e.message, Contains("expected each column once") && Contains("theta"));
}

TEST_CASE("two field families, or none, are refused", "[csv][refuse]") {
    Error e = refuse("theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im,e_total_db\n0,0,1,0,0,0,0\n");
    CHECK(e.line == 1);
    CHECK(e.column == 51);
    CHECK_THAT(e.message, Contains("one field family") && Contains("e_total_db"));
    e = refuse("theta,phi\n0,0\n");
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("expected field columns of one family"));
    e = refuse("theta,phi,e_theta_re,e_theta_im,e_phi_re\n0,0,1,0,0\n");
    CHECK_THAT(e.message, Contains("e_phi_im"));
    e = refuse("# name: x\ntheta,phi,e_co_db,e_co_phase,e_cross_db,e_cross_phase\n0,0,0,0,0,0\n");
    CHECK(e.line == 2);
    CHECK_THAT(e.message, Contains("ludwig3-reference"));
}

TEST_CASE("angles out of range are refused", "[csv][refuse]") {
    Error e = refuse(header + "0,0,1,0,0,0\n181,90,1,0,0,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 1);
    CHECK_THAT(e.message, Contains("expected theta in [-180, 180]") && Contains("181"));
    e = refuse(header + "0,0,1,0,0,0\n0,800,1,0,0,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 3);
    CHECK_THAT(e.message, Contains("expected phi"));
    e = refuse("azimuth,elevation,e_total_db\n0,0,0\n0,95,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 3);
    CHECK_THAT(e.message, Contains("elevation in [-90, 90]"));
    // -90 and 270 are one direction (any 360-degree window of phi reads, test_csv_layouts.cpp):
    // their two values must agree.
    e = refuse(header + "0,-90,1,0,0,0\n0,270,2,0,0,0\n");
    CHECK(e.line == 3);
    CHECK_THAT(e.message, Contains("one field per direction"));
}

TEST_CASE("a missing grid point is named", "[csv][refuse]") {
    std::string rows = good_rows();
    rows.erase(rows.find("90,180,1,0,0,0\n"), 15);  // theta 90, phi 180
    Error e = refuse(header + rows);
    CHECK(e.line == 0);
    CHECK_THAT(e.message, Contains("found 1 missing") && Contains("theta 90, phi 180 deg"));
    // Frequencies name themselves.
    std::string f = "frequency,theta,phi,e_total_db\n";
    for (int fr : {1, 2})
        for (int t : {0, 90})
            for (int p : {0, 180})
                if (!(fr == 2 && t == 90 && p == 180)) f += std::to_string(fr) + "e9," + std::to_string(t) + "," + std::to_string(p) + ",0\n";
    e = refuse(f);
    CHECK_THAT(e.message, Contains("theta 90, phi 180 deg, 2 GHz"));
}

TEST_CASE("conflicting duplicate points are refused; identical ones merge", "[csv][refuse]") {
    Error e = refuse(header + good_rows() + "90,90,2,0,0,0\n");
    CHECK(e.line == 10);
    CHECK_THAT(e.message, Contains("at most one value per grid point") && Contains("theta 90, phi 90"));
    auto ok = parse_far_field_csv(header + good_rows() + "90,90,1,0,0,0\n", "t.csv");
    CHECK(ok.ok());
}

TEST_CASE("an inconsistent seam duplicate is refused", "[csv][refuse]") {
    Error e = refuse(header + good_rows() + "0,360,1,0,0,0\n90,360,0.5,0,0,0\n");
    CHECK(e.line == 11);
    CHECK_THAT(e.message, Contains("seam duplicate") && Contains("phi 0 deg") && Contains("theta 90"));
}

TEST_CASE("irregular steps are refused", "[csv][refuse]") {
    std::string s = header;
    for (int t : {0, 10, 20, 35})
        for (int p : {0, 180}) s += std::to_string(t) + "," + std::to_string(p) + ",1,0,0,0\n";
    Error e = refuse(s);
    CHECK(e.line == 8);  // first row with theta 35
    CHECK_THAT(e.message, Contains("evenly spaced theta") && Contains("after 20 expected 30, found 35"));
    s = header;
    for (int t : {0, 90})
        for (int p : {0, 90, 270}) s += std::to_string(t) + "," + std::to_string(p) + ",1,0,0,0\n";
    e = refuse(s);
    CHECK(e.line == 4);
    CHECK_THAT(e.message, Contains("evenly spaced phi") && Contains("after 90 expected 180, found 270"));
}

TEST_CASE("an empty file, or one without data, is refused", "[csv][refuse]") {
    Error e = refuse("");
    CHECK_THAT(e.message, Contains("empty file"));
    e = refuse("\n\n# just a comment\n");
    CHECK_THAT(e.message, Contains("expected a header row"));
    e = refuse("# quantity: gain\n" + header);
    CHECK(e.line == 2);
    CHECK_THAT(e.message, Contains("expected data rows"));
    e = refuse("0,0,1,0,0,0\n");
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("found a row of numbers"));
}

TEST_CASE("binary garbage is refused", "[csv][refuse]") {
    std::string bin = header + "0,0,1,0,";
    bin += '\0';
    bin += "\x01\xff";
    Error e = refuse(bin);
    CHECK(e.line == 2);
    CHECK(e.column == 9);
    CHECK_THAT(e.message, Contains("NUL byte"));
    e = refuse("\x7f" "ELF\x02\x01\x01\x03\x04");
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("expected a text header row"));
}

TEST_CASE("a file larger than memory allows is refused", "[csv][refuse]") {
    CsvReadOptions o;
    o.memory_limit_bytes = 100;  // 8 points need 8 * 33 bytes
    Error e = refuse(header + good_rows(), o);
    CHECK_THAT(e.message, Contains("fits in memory") && Contains("MB"));
}

TEST_CASE("bad metadata values are refused at the value", "[csv][refuse]") {
    Error e = refuse("# quantity: power\n" + header + good_rows());
    CHECK(e.line == 1);
    CHECK(e.column == 13);
    CHECK_THAT(e.message, Contains("quantity: expected gain, directivity or relative, found \"power\""));
    e = refuse("# angle-unit: grad\n" + header + good_rows());
    CHECK_THAT(e.message, Contains("deg or rad"));
    e = refuse("# time-convention: exp\n" + header + good_rows());
    CHECK_THAT(e.message, Contains("+jwt or -iwt"));
    e = refuse("# frequency-unit: THz\n" + header + good_rows());
    CHECK_THAT(e.message, Contains("Hz, kHz, MHz or GHz"));
    e = refuse("# frequency: fast\n" + header + good_rows());
    CHECK_THAT(e.message, Contains("frequency: expected a number"));
    e = refuse("# quantity: gain\n# quantity: gain\n" + header + good_rows());
    CHECK(e.line == 2);
    CHECK_THAT(e.message, Contains("once"));
    e = refuse(header + "# frequency: 1e9\n" + good_rows());
    CHECK(e.line == 2);
    CHECK_THAT(e.message, Contains("before the header row"));
    e = refuse("# frequency: 1e9\nfrequency,theta,phi,e_total_db\n1e9,0,0,0\n");
    CHECK_THAT(e.message, Contains("found both"));
}

TEST_CASE("angle columns must be complete and of one kind", "[csv][refuse]") {
    Error e = refuse("theta,e_total_db\n0,0\n");
    CHECK_THAT(e.message, Contains("\"phi\""));
    e = refuse("theta,phi,azimuth,e_total_db\n0,0,0,0\n");
    CHECK(e.column == 11);
    CHECK_THAT(e.message, Contains("found both kinds"));
}

TEST_CASE("dB values out of range are refused", "[csv][refuse]") {
    Error e = refuse("theta,phi,e_total_db\n0,0,0\n0,180,5000\n");
    CHECK(e.line == 3);
    CHECK(e.column == 7);
    CHECK_THAT(e.message, Contains("dB value below 3000"));
    e = refuse("theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n0,0,1e200,0,0,0\n");
    CHECK_THAT(e.message, Contains("below 1e150"));
}

TEST_CASE("map entries that match nothing, or name no schema column, are refused", "[csv][refuse]") {
    CsvReadOptions o;
    // The reader names the origin it was told (the command line says "--map"), else "the column map".
    o.column_map = {{"Gain", "e_total_db", {"--map", 0}}};
    Error e = refuse("theta,phi,e_total_db\n0,0,0\n", o);
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("--map: expected a column named \"Gain\""));
    o.column_map = {{"Gain", "e_total_db"}};
    e = refuse("theta,phi,e_total_db\n0,0,0\n", o);
    CHECK_THAT(e.message, Contains("the column map: expected a column named \"Gain\""));
    o.column_map = {{"Gain", "power"}};
    auto r = parse_far_field_csv("theta,phi,Gain\n0,0,0\n", "t.csv", o);
    REQUIRE_FALSE(r.ok());
    CHECK_THAT(r.error().message, Contains("schema column name"));
}

TEST_CASE("a file far larger than memory is refused before it is mapped", "[csv][refuse]") {
    const std::string path = "ellipsa_test_big.csv";
    {
        std::FILE* f = std::fopen(path.c_str(), "wb");
        REQUIRE(f);
        const std::string text = header + good_rows();
        std::fwrite(text.data(), 1, text.size(), f);
        std::fclose(f);
    }
    CsvReadOptions o;
    o.memory_limit_bytes = 10;
    auto r = read_far_field_csv(path, o);
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().file == path);
    CHECK(r.error().line == 0);
    CHECK_THAT(r.error().message, Contains("fits in memory") && Contains("it holds"));
    std::remove(path.c_str());
}

TEST_CASE("devices, directories and missing files are refused without blocking", "[csv][refuse]") {
    auto r = read_far_field_csv("/dev/zero");
    REQUIRE_FALSE(r.ok());
    CHECK_THAT(r.error().message, Contains("regular file"));
    r = read_far_field_csv(".");
    REQUIRE_FALSE(r.ok());
    CHECK_THAT(r.error().message, Contains("directory"));
    r = read_far_field_csv("no-such-file.csv");
    REQUIRE_FALSE(r.ok());
    CHECK_THAT(r.error().message, Contains("cannot open"));
}

TEST_CASE("a lone pole sample without phase is refused with the reason", "[csv][refuse]") {
    // With phase the one sample is turned to every phi (test_csv_corpus); magnitudes cannot be.
    Error e = refuse("theta,phi,e_theta_db,e_phi_db\n0,0,0,0\n90,0,0,0\n90,180,0,0\n180,0,0,0\n180,180,0,0\n");
    CHECK_THAT(e.message, Contains("theta 0, phi 180 deg") && Contains("only with phase"));
}
