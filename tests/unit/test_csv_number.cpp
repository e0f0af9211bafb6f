// The CSV reader's number parser (importers/csv_number.hpp): its fast path for plain decimals
// must give exactly fast_float's double (correctly rounded, IEEE 754 round to nearest even), bit
// for bit, and its refusals must stay as they are. Sources: Clinger, "How to read floating point
// numbers accurately" (PLDI 1990), the fast path's conditions (significand below 2^53, power of
// ten within 10^+-22); fast_float (Lemire, "Number parsing at a gigabyte per second", 2021) as the
// reference parser.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <cstring>
#include <random>
#include <string>

#include "importers/csv_number.hpp"
#include "importers/far_field_csv.hpp"

using namespace ellipsa::csv;
using ellipsa::parse_far_field_csv;

namespace {

std::uint64_t bits(double v) {
    std::uint64_t b;
    std::memcpy(&b, &v, sizeof b);
    return b;
}

// The cell as the reader parses it, inside a row (a cell follows, so the parser may look past it).
struct Parsed {
    NumberStatus st;
    double v = 0;
    std::size_t used = 0;
};
Parsed parse_cell(const std::string& cell) {
    const std::string row = cell + ",7\n";
    Parsed r;
    const char* e = row.data() + row.size() - 1;
    const char* q = parse_number_cell(row.data(), e, ',', false, r.v, r.st);
    r.used = std::size_t(q - row.data());
    return r;
}

// fast_float's reading of the whole text (the reference).
bool reference(const std::string& t, double& v) {
    const auto r = fast_float::from_chars(t.data(), t.data() + t.size(), v);
    return r.ec == std::errc() && r.ptr == t.data() + t.size();
}

void check_same_as_fast_float(const std::string& t) {
    INFO("cell \"" << t << "\"");
    double want = 0;
    REQUIRE(reference(t, want));
    const Parsed got = parse_cell(t);
    REQUIRE(got.st == NumberStatus::ok);
    REQUIRE(got.used == t.size());
    REQUIRE(bits(got.v) == bits(want));
    // The fast path alone, where it takes the text: the same double.
    const char* p = t.data();
    double fast = 0;
    if (t[0] != '+' && fast_decimal(p, t.data() + t.size(), false, fast)) REQUIRE(bits(fast) == bits(want));
    // The padded fast path (a line end after the text, digits beyond it): the same double,
    // ending at the line end.
    for (const char* end : {"\n", "\r\n"}) {
        const std::string row = t + end + "9999999999999999";
        const char* q = row.data();
        double padded = 0;
        if (t[0] != '+' && fast_decimal_at<true>(q, row.data() + t.size(), false, padded)) {
            REQUIRE(bits(padded) == bits(want));
            REQUIRE(q == row.data() + t.size());
        }
    }
}

// The fast path with and without bounds checks (fast_decimal_at<true>, for rows followed by a
// line end and 16 readable bytes) on a text at the end of a row: the same answer, the same end.
void check_padded_as_checked(const std::string& t, const char* line_end) {
    INFO("cell \"" << t << "\" then " << (line_end[0] == '\r' ? "CR LF" : "LF"));
    const std::string row = t + line_end + "1234567890123456e5";
    const char* e = row.data() + t.size();
    const char *a = row.data(), *b = row.data();
    double va = 0, vb = 0;
    const bool ok_a = fast_decimal_at<false>(a, e, false, va), ok_b = fast_decimal_at<true>(b, e, false, vb);
    REQUIRE(ok_a == ok_b);
    REQUIRE(a == b);
    if (ok_a) REQUIRE(bits(va) == bits(vb));
}

// A random plain decimal: sign, 0-20 integer digits (leading zeros too), an optional point with
// 0-20 digits, an optional exponent of -40..40.
std::string random_decimal(std::mt19937_64& rng) {
    auto pick = [&](int n) { return int(rng() % std::uint64_t(n)); };
    std::string t;
    if (pick(2)) t += '-';
    const int ni = pick(4) == 0 ? pick(21) : pick(4);
    const int nf = pick(21);
    for (int i = 0; i < ni; ++i) t += char('0' + pick(10));
    if (ni == 0 || pick(4)) {
        t += '.';
        for (int i = 0; i < nf; ++i) t += char('0' + pick(10));
    }
    if (ni == 0 && (t.empty() || t.back() == '.' || t.back() == '-')) t += char('0' + pick(10));
    if (pick(3) == 0) {
        t += pick(2) ? 'e' : 'E';
        const int x = pick(81) - 40;
        if (x >= 0 && pick(2)) t += '+';
        t += std::to_string(x);
    }
    return t;
}

}  // namespace

TEST_CASE("number cells: edge cases read exactly as fast_float reads them", "[csv][number]") {
    for (const char* t : {"0", "-0", "0.0", "-0.000", "00012.5000", "1", "-1", "12.5", "-12.5", "0.12345678",
                          "-0.012345678", "1.2345678e-05", "1.5e-3", "1.5E+3", "2450000000", "2.45e9", ".5", "5.",
                          "-.25", "9007199254740992", "9007199254740993", "9007199254740991", "18014398509481984",
                          "1e22", "1e23", "-1e-22", "1e-23", "123456789012345678", "1234567890123456789",
                          "12345678901234567890", "0.30000000000000004", "0.1", "0.2", "0.3", "1.7976931348623157e308",
                          "2.2250738585072014e-308", "4.9406564584124654e-324", "5e-324", "1e-400", "0.000000000000000000001",
                          "1234567.1234567", "99999999.99999999", "0.99999999999999999", "1.00000000000000011102230246251565",
                          "3.14159265358979323846264338327950288", "12345678", "123456789", "0.00000001", "1e0",
                          "1e-0", "100000000000000000000000", "4503599627370496.5", "4503599627370497.5"})
        check_same_as_fast_float(t);
}

TEST_CASE("number cells: 400 000 random decimals read exactly as fast_float reads them", "[csv][number]") {
    std::mt19937_64 rng(20261202);
    for (int i = 0; i < 400000; ++i) check_same_as_fast_float(random_decimal(rng));
}

TEST_CASE("number cells: the fast path without bounds checks ends where the checked one ends", "[csv][number]") {
    // Texts of digits, points, signs, exponent marks and delimiters, cut at every length: each
    // stops at the line end however many digits follow it (common practice: a padded parser
    // compared with its checked form).
    std::mt19937_64 rng(20261203);
    const std::string alphabet = "0123456789012345678901234567890123456789..--+eE,";
    for (int i = 0; i < 200000; ++i) {
        std::string t;
        const int n = int(rng() % 25);
        for (int k = 0; k < n; ++k) t += alphabet[rng() % alphabet.size()];
        check_padded_as_checked(t, i % 2 ? "\n" : "\r\n");
    }
    for (int i = 0; i < 20000; ++i) check_padded_as_checked(random_decimal(rng), "\n");
    // Every count of integer and fraction digits around the eight-digit blocks (0-20 and 0-24),
    // signed or not, with an exponent or not: the padded path takes the digits before the first
    // other byte of a block at once.
    for (int ni = 0; ni <= 20; ++ni)
        for (int nf = 0; nf <= 24; ++nf)
            for (const char* tail : {"", "e-5", "E+12"}) {
                std::string t = ni % 3 == 1 ? "-" : "";
                for (int k = 0; k < ni; ++k) t += char('1' + (k * 7 + nf) % 9);
                if (nf > 0 || ni == 0) t += '.';
                for (int k = 0; k < nf; ++k) t += char('0' + (k * 3 + ni) % 10);
                if (ni + nf == 0) t += '0';
                t += tail;
                check_padded_as_checked(t, "\n");
                check_padded_as_checked(t, "\r\n");
                check_same_as_fast_float(t);
            }
}

TEST_CASE("number cells: the refusals and special values as before", "[csv][number]") {
    CHECK(parse_cell("nan").st == NumberStatus::nan);
    CHECK(parse_cell("NaN").st == NumberStatus::nan);
    const Parsed inf = parse_cell("-inf");
    CHECK(inf.st == NumberStatus::ok);
    CHECK((std::isinf(inf.v) && inf.v < 0));
    CHECK(parse_cell("Infinity").st == NumberStatus::ok);
    CHECK(parse_cell("1e400").st == NumberStatus::overflow);  // digits beyond the range: refused
    CHECK(parse_cell("-2e308").st == NumberStatus::overflow);
    for (const char* t : {"", "abc", "1.2.3", "1e", "1e+", "--1", "1 2", "0x10", "1e5e", "1.5-"})
    {
        INFO("cell \"" << t << "\"");
        CHECK(parse_cell(t).st == NumberStatus::not_a_number);
    }
    // Spaces, a leading '+' and quotes around the number are accepted; the value is unchanged.
    const Parsed spaced = parse_cell("  +1.25 ");
    CHECK(spaced.st == NumberStatus::ok);
    CHECK(bits(spaced.v) == bits(1.25));
    const Parsed quoted = parse_cell("\" -0.5 \"");
    CHECK(quoted.st == NumberStatus::ok);
    CHECK(bits(quoted.v) == bits(-0.5));
    CHECK(bits(parse_cell("-0").v) == bits(-0.0));  // the sign of zero is kept
}

TEST_CASE("number cells: digits at the end of a row, with no cell after them", "[csv][number]") {
    // The last cell of a row: the parser must not read digits past the row's end.
    for (const std::string t : {"0.12345678", "-0.0123", "7", "12345678901", "1.2345678e-05"}) {
        const std::string row = t + "99999999";
        double v = 0;
        NumberStatus st;
        const char* q = parse_number_cell(row.data(), row.data() + t.size(), ',', false, v, st);
        double want = 0;
        REQUIRE(reference(t, want));
        CHECK(st == NumberStatus::ok);
        CHECK(q == row.data() + t.size());
        CHECK(bits(v) == bits(want));
    }
}

// The reader finds an angle or frequency text again when the row before had it (one compare of
// the text and its delimiter): texts that only begin alike ("1" then "10", "10" then "100") or
// spell one value in other ways ("10", "10.0", "1e1", "010") must each read as themselves. The
// same field written with plain texts in the usual column order is the reference (values
// compared bit for bit).
TEST_CASE("angle cells: texts alike at the start, or one value spelled several ways, read as themselves", "[csv][number]") {
    auto field = [](int t, int p, int f) { return std::sin(0.1 * t + 0.01 * p) + 0.001 * (t * 37 + p) + f; };
    auto spell = [](int v, std::mt19937_64& rng) {
        static const char* const forms[5] = {"%d.0", "%.1fe1", "0%d", "%d", "%d"};
        const int which = int(rng() % 5);
        char t[32];
        if (which == 1) std::snprintf(t, sizeof t, forms[1], v / 10.0);
        else std::snprintf(t, sizeof t, forms[which], v);
        return std::string(t);
    };
    std::mt19937_64 rng(7);
    std::string plain = "frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    std::string varied = "frequency,e_theta_re,e_theta_im,phi,e_phi_re,e_phi_im,theta\n";
    char b[300];
    for (int f = 1; f <= 2; ++f)
        for (int p = 0; p < 360; p += 10)
            for (int t = 0; t <= 180; t += 10) {
                const double v = field(t, p, f);
                std::snprintf(b, sizeof b, "%d,%d,%d,%.17g,0,%.17g,0\n", f, t, p, v, -v);
                plain += b;
                const std::string fs = f == 1 ? (rng() % 2 ? "1" : "1.0") : "2";
                std::snprintf(b, sizeof b, "%s,%.17g,0,%s,%.17g,0,%s\n", fs.c_str(), v, spell(p, rng).c_str(), -v,
                              spell(t, rng).c_str());
                varied += b;
            }
    const auto a = parse_far_field_csv(plain, "plain.csv"), c = parse_far_field_csv(varied, "varied.csv");
    REQUIRE(a);
    REQUIRE(c);
    REQUIRE(a->frequencies.size() == 2);
    REQUIRE(c->frequencies.size() == 2);
    REQUIRE(c->grid.size() == a->grid.size());
    for (std::size_t k = 0; k < 2; ++k)
        for (std::size_t i = 0; i < a->grid.size(); ++i) {
            REQUIRE(bits(c->frequencies[k].e_theta[i].real()) == bits(a->frequencies[k].e_theta[i].real()));
            REQUIRE(bits(c->frequencies[k].e_phi[i].real()) == bits(a->frequencies[k].e_phi[i].real()));
        }
}
