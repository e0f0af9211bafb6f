// Real range files as they are (issue 14): a free-text preamble before the header row, found
// by the mapped column names or skipped by count. The fixtures are invented range exports in
// tests/data/csv/foreign/ (made by make_corpus.py there); the expected figures are those of the
// same pattern read without the preamble (docs/far-field-csv.md, "A preamble before the header").
#include <catch2/catch.hpp>

#include <string>

#include "importers/far_field_csv.hpp"

using namespace ellipsa;

namespace {

const std::string foreign = std::string(ELLIPSA_SOURCE_DIR) + "/tests/data/csv/foreign/";

FarFieldSet read(const std::string& path, const CsvReadOptions& o) {
    auto r = read_far_field_csv(path, o);
    if (!r) FAIL(r.error().format());
    return *r;
}

CsvReadOptions range3_map() {
    CsvReadOptions o;
    REQUIRE(read_csv_map_file(foreign + "range3.map", o).ok());
    return o;
}

std::string schema_rows() {  // a short dipole on a 90-degree grid (Balanis sec. 4.2), as in the schema page
    std::string s = "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    for (int t : {0, 90, 180})
        for (int p : {0, 90, 180, 270}) s += std::to_string(t) + "," + std::to_string(p) + (t == 90 ? ",1.2247,0,0,0\n" : ",0,0,0,0\n");
    return s;
}

}  // namespace

TEST_CASE("a free-text preamble is skipped up to the line that names the mapped columns", "[csv][ranges]") {
    const FarFieldSet plain = read(foreign + "range3.csv", range3_map());
    const FarFieldSet pre = read(foreign + "range3_preamble.csv", range3_map());
    // The same pattern, sample for sample (the preamble changes nothing but where the header is).
    REQUIRE(same_grid(plain.grid, pre.grid));
    REQUIRE(pre.frequencies.size() == 1);
    CHECK(pre.frequencies[0].frequency_hz == plain.frequencies[0].frequency_hz);
    CHECK(pre.frequencies[0].e_theta == plain.frequencies[0].e_theta);
    CHECK(pre.frequencies[0].e_phi == plain.frequencies[0].e_phi);
    // Seven lines before the header, one of them blank: six lines of free text, header on line 8.
    REQUIRE(pre.reading_notes.size() == 1);
    CHECK(pre.reading_notes[0] == "skipped 6 lines of free text before the header row (line 8)");
    CHECK(plain.reading_notes.empty());
}

TEST_CASE("errors after a preamble keep the file's own line numbers", "[csv][ranges]") {
    std::string text = "Lab export\nOperator;someone\nSample;Az/deg;El/deg;Level re horn/dB;Remark\n1;0;-90;abc;\n";
    auto r = parse_far_field_csv(text, "p.csv", range3_map());
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().line == 4);
    CHECK(r.error().column == 9);  // "1;0;-90;" is 8 bytes
}

TEST_CASE("when no line names every mapped column, the first line is taken for the header and refused", "[csv][ranges]") {
    CsvReadOptions o = range3_map();
    o.column_map.push_back({"Nope", "ignore", {"--map", 0}});
    auto r = read_far_field_csv(foreign + "range3_preamble.csv", o);
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().format() == foreign + "range3_preamble.csv:1:1: expected a header row with columns separated by comma, "
                                          "semicolon or tab, found \"Antenna range 3 - far-field export\"");
}

TEST_CASE("skip-lines skips a given number of lines before the header, whatever they hold", "[csv][ranges]") {
    const std::string text = "Exported by a range controller\n# not metadata: skipped unread\nquantity: gain\n" + schema_rows();
    CsvReadOptions o;
    o.settings.push_back({"skip-lines", "3", {"--assume", 0}});
    auto r = parse_far_field_csv(text, "s.csv", o);
    if (!r) FAIL(r.error().format());
    CHECK(r->grid.theta.count == 3);
    REQUIRE(r->reading_notes.size() == 1);
    CHECK(r->reading_notes[0] == "skipped 3 lines of free text before the header row (line 4)");
    // Without it the first line is taken for the header and refused at its first cell.
    auto bare = parse_far_field_csv(text, "s.csv");
    REQUIRE_FALSE(bare.ok());
    CHECK(bare.error().line == 1);
}

TEST_CASE("skip-lines refuses what is not a count, and a file that ends within the skipped lines", "[csv][ranges]") {
    CsvReadOptions o;
    o.settings.push_back({"skip-lines", "three", {"--assume", 0}});
    auto r = parse_far_field_csv(schema_rows(), "s.csv", o);
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().format() == "--assume: skip-lines: expected a whole number of lines from 0 to 100000000, found \"three\"");
    CsvReadOptions far;
    far.settings.push_back({"skip-lines", "40", {"--assume", 0}});
    auto e = parse_far_field_csv(schema_rows(), "s.csv", far);
    REQUIRE_FALSE(e.ok());
    CHECK(e.error().message == "expected a header row after the 40 lines skipped (skip-lines), found none");
}
