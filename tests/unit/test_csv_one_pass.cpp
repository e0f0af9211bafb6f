// A large regular file is read in one pass on a grid guessed from samples of the file
// (importers/far_field_csv_reader.cpp, one_pass_read); the guess is confirmed afterwards from
// every row, and anything the pass meets sends the file through the two passes again. The
// reference here is the two-pass read of the same text (the reader the other csv tests hold to
// docs/far-field-csv.md): the one-pass read must give the same set bit for bit, or the same
// refusal with the same file, line, column and message, on one worker and on two. Common
// practice for a speculative fast path: check it against the path it replaces, on inputs that
// confirm the guess and on inputs made to defeat it.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdio>
#include <cstring>
#include <string>

#include "importers/csv_passes.hpp"
#include "importers/far_field_csv.hpp"
#include "importers/text_source.hpp"

using namespace ellipsa;

namespace {

// Frequencies (GHz) x theta 0..180 step dt x phi from p0 step dp (n_phi columns), complex
// family, 8-digit values from a smooth invented field.
std::string grid_file(int n_freq, double dt, double p0, double dp, int n_phi) {
    std::string s = "# frequency-unit: GHz\nfrequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    char b[200];
    const int n_theta = int(std::lround(180 / dt)) + 1;
    for (int f = 0; f < n_freq; ++f)
        for (int i = 0; i < n_theta; ++i)
            for (int j = 0; j < n_phi; ++j) {
                const double t = i * dt, p = p0 + j * dp, tr = t * 0.017453292519943295, pr = p * 0.017453292519943295;
                // An x-directed short dipole: the same field at phi and phi + 360 (seam rows agree).
                const double et = std::cos(tr) * std::cos(pr) * (1 + 0.01 * f), ep = -std::sin(pr) * (1 + 0.01 * f);
                std::snprintf(b, sizeof b, "%.4g,%g,%g,%.8g,%.8g,%.8g,%.8g\n", 2.4 + 0.01 * f, t, p, et, 0.1 * et, ep, -0.2 * ep);
                s += b;
            }
    return s;
}

std::string describe(const Result<FarFieldSet>& r) {
    if (!r) return "refused: " + r.error().format();
    const FarFieldSet& s = *r;
    char b[300];
    std::snprintf(b, sizeof b, "theta %.17g %.17g %d phi %.17g %.17g %d sampling %d, %zu frequencies\n",
                  s.grid.theta.start_deg, s.grid.theta.step_deg, s.grid.theta.count, s.grid.phi.start_deg,
                  s.grid.phi.step_deg, s.grid.phi.count, int(s.grid.sampling), s.frequencies.size());
    std::string o = b;
    for (const FarField& f : s.frequencies) {
        std::snprintf(b, sizeof b, "%.17g Hz\n", f.frequency_hz);
        o += b;
    }
    return o;
}

bool same_bits(const std::vector<cplx>& a, const std::vector<cplx>& b) {
    return a.size() == b.size() && (a.empty() || std::memcmp(a.data(), b.data(), a.size() * sizeof(cplx)) == 0);
}

// Reads `text` both ways on one and two workers; returns how many of the two one-pass reads
// were confirmed in one pass.
std::size_t check_both_ways(const std::string& text) {
    std::size_t confirmed = 0;
    for (int threads : {1, 2}) {
        CsvReadOptions o;
        o.threads = threads;
        csv::one_pass_min_bytes = ~std::size_t(0);
        const auto two = parse_far_field_csv(text, "f.csv", o);
        csv::one_pass_min_bytes = 0;
        const std::size_t before = csv::one_pass_reads;
        const auto one = parse_far_field_csv(text, "f.csv", o);
        confirmed += csv::one_pass_reads - before;
        csv::one_pass_min_bytes = std::size_t(8) << 20;
        INFO("threads " << threads);
        REQUIRE(describe(one) == describe(two));
        if (!two) continue;
        for (std::size_t k = 0; k < two->frequencies.size(); ++k) {
            CHECK(same_bits(one->frequencies[k].e_theta, two->frequencies[k].e_theta));
            CHECK(same_bits(one->frequencies[k].e_phi, two->frequencies[k].e_phi));
        }
    }
    return confirmed;
}

// The line that starts first after `fraction` of the rows (after the header line).
struct Line {
    std::size_t begin, end;
};
Line line_at(const std::string& s, double fraction) {
    const std::size_t rows = s.find("e_phi_im\n") + 9;
    const std::size_t at = s.find('\n', rows + std::size_t(double(s.size() - rows) * fraction)) + 1;
    return {at, s.find('\n', at)};
}
// The fraction of the rows halfway between the k-th sample window (of those the guess is made
// from, csv::sample_ranges) and the next: a line there is not among the samples.
double between_samples(const std::string& s, std::size_t k) {
    const std::size_t rows = s.find("e_phi_im\n") + 9;
    const auto r = csv::sample_ranges(TextSource::memory(s), rows);
    REQUIRE(k + 1 < r.size());
    REQUIRE(r[k + 1].first > r[k].second + 2000);
    return (0.5 * double(r[k].second + r[k + 1].first) - double(rows)) / double(s.size() - rows);
}
std::string replaced(std::string s, double fraction, const std::string& line) {
    const Line l = line_at(s, fraction);
    return s.replace(l.begin, l.end - l.begin, line);
}
std::string text_of(const std::string& s, double fraction) {
    const Line l = line_at(s, fraction);
    return s.substr(l.begin, l.end - l.begin);
}

}  // namespace

TEST_CASE("one pass on a guessed grid: regular files read as two passes read them", "[csv][one-pass]") {
    // 1-degree grid over 4 frequencies (about 17 MB, so the samples are a small part of it).
    const std::string big = grid_file(4, 1, 0, 1, 360);
    CHECK(check_both_ways(big) == 2);
    // The phi seam written twice (0..360), phi in -180..180 (stored from 0), a coarse grid of
    // many frequencies, and the Windows line ends.
    CHECK(check_both_ways(grid_file(3, 2, 0, 2, 181)) == 2);
    CHECK(check_both_ways(grid_file(2, 1, -180, 1, 360)) == 2);
    CHECK(check_both_ways(grid_file(40, 5, 0, 5, 72)) == 2);
    std::string crlf;
    for (char c : grid_file(2, 2, 0, 2, 180)) {
        if (c == '\n') crlf += '\r';
        crlf += c;
    }
    CHECK(check_both_ways(crlf) == 2);
}

TEST_CASE("one pass on a guessed grid: what defeats the guess is read in two passes, same result", "[csv][one-pass]") {
    const std::string base = grid_file(3, 2, 0, 2, 180);  // about 3 MB
    REQUIRE(base.size() > (std::size_t(2) << 20));
    const double mid = between_samples(base, 20), late = between_samples(base, 35);
    const std::string row = text_of(base, mid);  // "2.41,..."
    REQUIRE(row.rfind("2.41,", 0) == 0);
    auto with_cells = [&](const std::string& angles_and_fields) { return replaced(base, mid, angles_and_fields); };
    const std::string angles = row.substr(0, row.find(',', row.find(',', 5) + 1) + 1);  // "2.41,T,P,"
    const std::string fields = row.substr(angles.size());
    // A frequency met only between the samples: the guess lacks it (then two passes find its
    // missing points). A theta or phi off the regular step, a theta out of range.
    CHECK(check_both_ways(with_cells("2.415" + row.substr(4))) == 0);
    CHECK(check_both_ways(with_cells("2.41,91,2," + fields)) == 0);
    CHECK(check_both_ways(with_cells("2.41,90,2.5," + fields)) == 0);
    CHECK(check_both_ways(with_cells("2.41,190,2," + fields)) == 0);
    // Cells: too few, too many, not a number, a field beyond 1e150; a NUL byte; metadata after
    // the header; a second row for a point that differs from the first.
    CHECK(check_both_ways(with_cells(angles + "0.5,0")) == 0);
    CHECK(check_both_ways(with_cells(row + ",7")) == 0);
    CHECK(check_both_ways(with_cells(angles + "x,0,0,0")) == 0);
    CHECK(check_both_ways(with_cells(angles + "1e200,0,0,0")) == 0);
    CHECK(check_both_ways(with_cells(row + std::string(1, '\0'))) == 0);
    CHECK(check_both_ways(with_cells("# quantity: directivity")) == 0);
    const Line a = line_at(base, mid);
    const std::string next = base.substr(a.end + 1, base.find('\n', a.end + 1) - a.end - 1);
    CHECK(check_both_ways(with_cells(next.substr(0, angles.size()) + "0.9,0.9,0.9,0.9")) == 0);
    // Two faults: a field cell early, an angle cell later; pass 1 reports the angle.
    CHECK(check_both_ways(replaced(with_cells(angles + "x,0,0,0"), late, "2.42,170,3x,0,0,0,0")) == 0);
    // The grid confirmed, then a later stage refuses or accepts as it does after two passes: a
    // missing row, a row given twice (agreeing), two rows in another order.
    CHECK(check_both_ways(with_cells("# left out")) == 2);
    CHECK(check_both_ways(with_cells(row + "\n" + row)) == 2);
    std::string swapped = base;
    swapped.replace(a.begin, row.size() + 1 + next.size(), next + "\n" + row);
    CHECK(check_both_ways(swapped) == 2);
}

TEST_CASE("two workers give the refusal one worker gives: the first finding in the file, on every run", "[csv][one-pass]") {
    // A point given twice with different values, its first row early in the second half of the
    // file and its second row (in the file's order) late in the first half: with two workers the
    // second half's row is usually written first, so the first half's row looks like the second
    // one, and which is found depends on timing. The reader settles any refusal of a read by
    // several workers by reading again with one, so the message names the first finding in the
    // file's order (the one-worker read, the reference here) on every run. Common practice:
    // deterministic messages from a parallel parser.
    std::string s = grid_file(1, 5, 0, 30, 12);
    const std::size_t half = s.size() / 2;
    const std::size_t after = s.find('\n', half) + 1;      // the second half's first row
    const std::string original = s.substr(after, s.find('\n', after) - after + 1);
    std::string copy = original;
    copy.replace(copy.rfind(',') + 1, std::string::npos, "0.5\n");
    const std::size_t before = s.rfind('\n', half - 200) + 1;  // a row late in the first half
    s.insert(before, copy);
    CsvReadOptions one;
    one.threads = 1;
    const std::string reference = describe(parse_far_field_csv(s, "two.csv", one));
    REQUIRE(reference.rfind("refused: ", 0) == 0);
    CsvReadOptions two;
    two.threads = 2;
    for (int run = 0; run < 40; ++run) {
        csv::one_pass_min_bytes = run % 2 ? std::size_t(0) : ~std::size_t(0);
        CHECK(describe(parse_far_field_csv(s, "two.csv", two)) == reference);
    }
    csv::one_pass_min_bytes = std::size_t(8) << 20;
}

TEST_CASE("one pass on a guessed grid: progress goes on across a guess that fails, never back", "[csv][one-pass]") {
    // A frequency met only between the samples: the one pass reads every row, the guess is not
    // confirmed, and two passes read the file again. The progress the caller sees must never go
    // back (it went back to 0 when the two passes began) and must still move during them.
    // Common practice for a progress report.
    std::string s = grid_file(3, 2, 0, 2, 180);
    const double mid = between_samples(s, 20);
    s = replaced(s, mid, "2.415" + text_of(s, mid).substr(4));
    for (int threads : {1, 2}) {
        std::vector<double> seen;
        CsvReadOptions o;
        o.threads = threads;
        o.progress = [&](double f) {
            seen.push_back(f);
            return true;
        };
        csv::one_pass_min_bytes = 0;
        const std::size_t before = csv::one_pass_reads;
        const auto r = parse_far_field_csv(s, "f.csv", o);
        csv::one_pass_min_bytes = std::size_t(8) << 20;
        INFO("threads " << threads);
        CHECK(csv::one_pass_reads == before);  // the guess failed: two passes read the file
        CHECK_FALSE(r.ok());                   // (the new frequency lacks most of its points)
        REQUIRE(seen.size() > 4);
        for (std::size_t i = 1; i < seen.size(); ++i) CHECK(seen[i] >= seen[i - 1]);
        const double at_fallback = seen[seen.size() / 3];
        CHECK(seen.back() > at_fallback);
        CHECK(seen.back() <= 1.0);
    }
}
