// Hostile input to the readers: a file that shrinks or changes while it is read, tiny files that
// imply huge grids, numbers that overflow, lines without end, repeated options, side files that
// are not regular files, old Mac line ends. Each must end in a clear refusal, never a signal, a
// hang or a large allocation. (Expected behaviour: docs/far-field-csv.md, "Refusals".)
#include <catch2/catch.hpp>

#include <cstdio>
#include <fcntl.h>
#include <string>
#include <sys/stat.h>
#include <unistd.h>

#include "importers/elevation_profile_csv.hpp"
#include "importers/far_field_csv.hpp"

using namespace ellipsa;
using Catch::Matchers::Contains;

namespace {

const std::string header = "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";

// A full 1-degree sphere in the complex family: 65 160 rows, about 1.1 MB.
std::string big_file_text() {
    std::string s = header;
    for (int t = 0; t <= 180; ++t)
        for (int p = 0; p < 360; ++p) s += std::to_string(t) + "," + std::to_string(p) + ",0.5,-0.25,0.125,0\n";
    return s;
}

void write_file(const std::string& path, const std::string& text) {
    std::FILE* f = std::fopen(path.c_str(), "wb");
    REQUIRE(f);
    REQUIRE(std::fwrite(text.data(), 1, text.size(), f) == text.size());
    std::fclose(f);
}

Error refuse_text(const std::string& text, const CsvReadOptions& o = {}) {
    auto r = parse_far_field_csv(text, "h.csv", o);
    REQUIRE_FALSE(r.ok());
    INFO(r.error().format());
    return r.error();
}

}  // namespace

TEST_CASE("a file truncated while it is read ends in an error, not a signal", "[csv][hostile]") {
    // Formerly the file was memory-mapped: touching a page past the new end raised SIGBUS.
    const std::string path = "ellipsa_test_shrinks.csv";
    write_file(path, big_file_text());
    CsvReadOptions o;
    o.threads = 1;
    bool truncated = false;
    o.progress = [&](double) {
        if (!truncated) REQUIRE(::truncate(path.c_str(), 4000) == 0);  // while pass 1 is under way
        truncated = true;
        return true;
    };
    auto r = read_far_field_csv(path, o);
    CHECK(truncated);
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().file == path);
    CHECK_THAT(r.error().message, Contains("shrank") && Contains("read it again"));
    std::remove(path.c_str());
}

TEST_CASE("a file rewritten while it is read is refused as changed", "[csv][hostile]") {
    const std::string path = "ellipsa_test_changes.csv";
    const std::string text = big_file_text();
    write_file(path, text);
    CsvReadOptions o;
    o.threads = 1;
    bool changed = false;
    o.progress = [&](double) {
        if (!changed) {
            // Same size, other content, a later modification time: what an editor saving in place does.
            const int fd = ::open(path.c_str(), O_WRONLY);
            REQUIRE(fd >= 0);
            REQUIRE(::pwrite(fd, "9", 1, off_t(text.size() - 2)) == 1);
            const timespec later[2] = {{0, UTIME_OMIT}, {2000000000, 0}};
            REQUIRE(::futimens(fd, later) == 0);
            ::close(fd);
        }
        changed = true;
        return true;
    };
    auto r = read_far_field_csv(path, o);
    REQUIRE_FALSE(r.ok());
    CHECK_THAT(r.error().message, Contains("changed"));
    std::remove(path.c_str());
}

TEST_CASE("a tiny file whose values imply a huge grid is refused before allocating it", "[csv][hostile]") {
    // 200 rows, each with its own theta, phi and frequency: the regular axes imply 200^3 = 8e6
    // points (264 MB of arrays) that 200 rows can never fill.
    std::string s = "frequency,theta,phi,e_total_db\n";
    const int n = 200;
    for (int i = 0; i < n; ++i) {
        char b[120];
        std::snprintf(b, sizeof b, "%.17g,%.17g,%.17g,0\n", 1e9 + 1e6 * i, 180.0 * i / (n - 1), 359.0 * i / (n - 1));
        s += b;
    }
    Error e = refuse_text(s);
    CHECK(e.line == 0);
    CHECK_THAT(e.message, Contains("8000000 points") && Contains("found only 200 data rows"));
    // Complete, but only at the poles: 200 rows, one per frequency at theta 0 or 180, each with
    // its own phi, would stand for 200 x 200 x 200 points.
    s = "frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    for (int i = 0; i < n; ++i)
        for (int pole : {0, 180}) {
            char b[160];
            std::snprintf(b, sizeof b, "%d,%d,%.17g,1,0,0,0\n", 1000 + i, pole, 359.0 * i / (n - 1));
            s += b;
        }
    e = refuse_text(s);
    CHECK_THAT(e.message, Contains("expected at most 4 grid points per data row") && Contains("from 400 rows"));
    // A small grid with a point missing is still allocated, so the missing point is named.
    e = refuse_text(header + "0,0,1,0,0,0\n0,90,1,0,0,0\n90,0,1,0,0,0\n");
    CHECK_THAT(e.message, Contains("found 1 missing: theta 90, phi 90 deg"));
}

TEST_CASE("numbers that overflow are refused at their line and column", "[csv][hostile]") {
    Error e = refuse_text("# frequency: 1e300 GHz\ntheta,phi,e_total_db\n0,0,0\n");
    CHECK(e.line == 1);
    CHECK(e.column == 14);
    CHECK_THAT(e.message, Contains("frequency") && Contains("overflows"));
    e = refuse_text("# frequency: 1e400\ntheta,phi,e_total_db\n0,0,0\n");
    CHECK(e.line == 1);
    CHECK_THAT(e.message, Contains("overflows"));
    e = refuse_text("# frequency-unit: GHz\nfrequency,theta,phi,e_total_db\n1e300,0,0,0\n");
    CHECK(e.line == 3);
    CHECK(e.column == 1);
    CHECK_THAT(e.message, Contains("overflows"));
    e = refuse_text("theta,phi,e_total_db\n0,0,1e999\n");
    CHECK(e.line == 2);
    CHECK(e.column == 5);
    CHECK_THAT(e.message, Contains("\"1e999\"") && Contains("beyond the range of numbers"));
    e = refuse_text("theta,phi,e_total_db\n-1e400,0,0\n");
    CHECK(e.column == 1);
    CHECK_THAT(e.message, Contains("column \"theta\"") && Contains("beyond the range"));
    // Infinity spelled out stays what it was: zero field in a dB column.
    CHECK(parse_far_field_csv("theta,phi,e_total_db\n0,0,-inf\n", "h.csv").ok());
}

TEST_CASE("a file that starts with a NUL byte is refused after one window, and lines are bounded", "[csv][hostile]") {
    // An 8 GB sparse file of zero bytes: the old reader scanned all of it for a line end.
    const std::string path = "ellipsa_test_sparse.csv";
    {
        const int fd = ::open(path.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
        REQUIRE(fd >= 0);
        REQUIRE(::ftruncate(fd, off_t(8) << 30) == 0);
        ::close(fd);
    }
    CsvReadOptions o;
    o.memory_limit_bytes = std::size_t(4) << 30;
    auto r = read_far_field_csv(path, o);
    std::remove(path.c_str());
    REQUIRE_FALSE(r.ok());
    CHECK(r.error().line == 1);
    CHECK(r.error().column == 1);
    CHECK_THAT(r.error().message, Contains("NUL byte"));
    // A header line longer than the reader's bound: refused as such, not read to its end.
    Error e = refuse_text(std::string(std::size_t(3) << 20, 'a') + ",theta\n");
    CHECK_THAT(e.message, Contains("expected lines of at most 1048576 bytes"));
    e = refuse_text(header + "0,0,1,0,0," + std::string(std::size_t(2) << 20, '0') + "\n");
    CHECK(e.line == 2);
    CHECK_THAT(e.message, Contains("expected lines of at most"));
}

TEST_CASE("metadata lines cost linear time", "[csv][hostile]") {
    // The duplicate check once compared each line with all earlier ones: 80 000 lines took 6 s
    // and 2 million would take an hour (the test then times out). Now one table lookup a line.
    std::string s;
    const int n = 2000000;
    s.reserve(std::size_t(n) * 12 + 200);
    for (int i = 0; i < n; ++i) s += "# note: n\n";
    s += "# quantity: gain\ntheta,phi,e_total_db\n0,0,0\n";
    auto r = parse_far_field_csv(s, "h.csv");
    REQUIRE(r.ok());
    CHECK(r->note.size() == std::size_t(n) * 2 - 1);
}

TEST_CASE("old Mac line ends are refused with that name", "[csv][hostile]") {
    Error e = refuse_text("theta,phi,e_total_db\r0,0,0\r0,180,0\r");
    CHECK(e.line == 1);
    CHECK(e.column == 21);
    CHECK_THAT(e.message, Contains("old Mac line ends"));
    e = refuse_text("# quantity: gain\rtheta,phi,e_total_db\r0,0,0\r");
    CHECK_THAT(e.message, Contains("old Mac line ends"));
    // CR LF stays fine.
    CHECK(parse_far_field_csv("theta,phi,e_total_db\r\n0,0,0\r\n", "h.csv").ok());
}

TEST_CASE("repeated options are refused, naming both places", "[csv][hostile]") {
    const std::string text = "A,B,e_total_db\n0,0,0\n";
    CsvReadOptions o;
    o.column_map = {{"A", "theta", {"--map", 0}}, {"a", "phi", {"--map", 0}}};
    Error e = refuse_text(text, o);
    CHECK(e.file == "--map");
    CHECK_THAT(e.message, Contains("expected each source column once") && Contains("\"a\" again") &&
                              Contains("as \"theta\"") && Contains("then as \"phi\""));
    o.column_map = {{"A", "theta"}, {"B", "phi"}};
    o.settings = {{"angle-unit", "deg", {"--assume", 0}}, {"Angle-Unit", "rad", {"--assume", 0}}};
    e = refuse_text(text, o);
    CHECK(e.file == "--assume");
    CHECK_THAT(e.message, Contains("\"angle-unit\" once") && Contains("first from --assume"));
    o.settings = {{"angle-unit", "deg", {"x.map", 3}}, {"angle-unit", "rad", {"--assume", 0}}};
    e = refuse_text(text, o);
    CHECK_THAT(e.message, Contains("first from x.map:3"));
    o.settings.clear();
    o.scale = {{"e_total_db", 2, {"--scale", 0}}, {"e_total_db", 3, {"--scale", 0}}};
    e = refuse_text(text, o);
    CHECK(e.file == "--scale");
    CHECK_THAT(e.message, Contains("expected each column once") && Contains("e_total_db"));
    o.scale.clear();
    o.offset = {{"theta", 1}, {"THETA", 1}};
    e = refuse_text(text, o);
    CHECK_THAT(e.message, Contains("the offset: expected each column once"));
}

TEST_CASE("a map file with a repeated key is refused at its line", "[csv][hostile]") {
    CsvReadOptions o;
    REQUIRE(parse_csv_map_text("column: A = theta\ncolumn: B = phi\nangle-unit: deg\n# x\nangle-unit: rad\n", "r.map", o)
                .ok());
    Error e = refuse_text("A,B,e_total_db\n0,0,0\n", o);
    CHECK(e.file == "r.map");
    CHECK(e.line == 5);
    CHECK_THAT(e.message, Contains("first from r.map:3"));
    o = {};
    REQUIRE(parse_csv_map_text("column: A = theta\ncolumn: B = phi\noffset: phi = 1\noffset: phi = 2\n", "r.map", o).ok());
    e = refuse_text("A,B,e_total_db\n0,0,0\n", o);
    CHECK(e.line == 4);
    auto cr = parse_csv_map_text("column: A = theta\rcolumn: B = phi\r", "r.map", o);
    REQUIRE_FALSE(cr.ok());
    CHECK_THAT(cr.error().message, Contains("old Mac line ends"));
}

TEST_CASE("side files must be small regular files", "[csv][hostile]") {
    CsvReadOptions o;
    auto st = read_csv_map_file("/dev/zero", o);  // formerly read until memory ran out
    REQUIRE_FALSE(st.ok());
    CHECK_THAT(st.error().message, Contains("expected a map file (a regular file)"));
    st = read_csv_map_file(".", o);  // formerly read as an empty map
    REQUIRE_FALSE(st.ok());
    CHECK_THAT(st.error().message, Contains("found a folder"));
    const std::string fifo = "ellipsa_test_fifo.map";
    std::remove(fifo.c_str());
    REQUIRE(::mkfifo(fifo.c_str(), 0600) == 0);
    st = read_csv_map_file(fifo, o);  // formerly blocked for ever
    CHECK_FALSE(st.ok());
    auto p = read_elevation_profile(fifo);
    CHECK_FALSE(p.ok());
    std::remove(fifo.c_str());
    p = read_elevation_profile("/dev/zero");
    REQUIRE_FALSE(p.ok());
    CHECK_THAT(p.error().message, Contains("regular file"));
    const std::string big = "ellipsa_test_big.map";
    write_file(big, std::string((std::size_t(1) << 20) + 1, '#'));
    st = read_csv_map_file(big, o);
    std::remove(big.c_str());
    REQUIRE_FALSE(st.ok());
    CHECK_THAT(st.error().message, Contains("at most 1048576 bytes"));
}

TEST_CASE("a NUL byte in an elevation profile is shown escaped", "[csv][hostile]") {
    std::string text = "elevation_deg,p_v,p_h\n0,1";
    text += '\0';
    text += ",1\n10,1,1\n";
    auto p = parse_elevation_profile(text, "p.csv");
    REQUIRE_FALSE(p.ok());
    CHECK(p.error().line == 2);
    CHECK_THAT(p.error().message, Contains("\"1\\x00\""));
    CHECK(p.error().message.find('\0') == std::string::npos);
}
