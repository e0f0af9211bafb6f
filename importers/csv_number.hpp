// Internal to the CSV reader and the side-file readers: the number parser of the data rows
// (Clinger's fast path with eight digits at a time, fast_float for everything else).
#pragma once
#include <cmath>
#include <cstdint>
#include <cstring>

#include <fast_float/fast_float.h>

namespace ellipsa::csv {

// ok; not a number (or an empty cell); NaN; a number beyond the double range (about 1.8e308)
// written as digits, which would otherwise read as infinity.
enum class NumberStatus { ok, not_a_number, nan, overflow };

// The common short decimal ("-12.5", "0.12345678", "1.5e-3") by Clinger's fast path: when the
// decimal significand fits in 53 bits and the power of ten is within 10^+-22, one IEEE multiply
// or divide of two exact doubles is correctly rounded, so the result equals fast_float's. Returns
// false (and leaves p) for anything else; the caller then uses fast_float.
// Padded: the caller guarantees that the byte at e is a line end ('\n' or '\r') and that the 16
// bytes from e on may be read, so the digit loops stop at e by themselves and need no bounds
// check (the same result as unpadded: every byte the checks would stop at is no digit, sign,
// point or exponent mark).
// The value of eight decimal digits, one a byte (0-9, the first in the lowest byte), by three
// multiplies (as in fast_float's parse_eight_digits_unrolled).
[[gnu::always_inline]] inline std::uint32_t eight_digits(std::uint64_t w) {
    w = (w * 10) + (w >> 8);
    return std::uint32_t((((w & 0x000000FF000000FFull) * 0x000F424000000064ull) +
                          (((w >> 16) & 0x000000FF000000FFull) * 0x0000271000000001ull)) >> 32);
}

inline constexpr std::uint64_t pow10_u64[9] = {1, 10, 100, 1000, 10000, 100000, 1000000, 10000000, 100000000};

template <bool Padded>
[[gnu::always_inline]] inline bool fast_decimal_at(const char*& p, const char* e, bool decimal_comma, double& v) {
    static constexpr double pow10[23] = {1e0,  1e1,  1e2,  1e3,  1e4,  1e5,  1e6,  1e7,  1e8,  1e9,  1e10, 1e11,
                                         1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};
    const auto in = [e](const char* at) { return Padded || at < e; };
    const char* q = p;
    bool neg = false;
    if (in(q) && *q == '-') {
        neg = true;
        ++q;
    }
    std::uint64_t m = 0;
    int digits = 0, frac = 0;
    while (in(q) && unsigned(*q - '0') < 10u) {
        m = m * 10 + unsigned(*q - '0');
        ++digits;
        ++q;
    }
    if (in(q) && (*q == '.' || (decimal_comma && *q == ','))) {
        ++q;
        const char* fb = q;
        if constexpr (Padded) {
            // Eight bytes at a time: all digits, or the digits before the first other byte taken
            // at once (no loop over single digits, whose count changes from cell to cell).
            for (;;) {
                std::uint64_t w;
                std::memcpy(&w, q, 8);
                w -= 0x3030303030303030ull;
                // The top bit of each byte that is no digit; exact up to the first such byte (a
                // borrow or carry only ever reaches the bytes after it).
                const std::uint64_t other = ((w + 0x7676767676767676ull) | w) & 0x8080808080808080ull;
                if (other == 0) {
                    if (digits > 11) break;  // the loop below takes the rest (more than 19 digits: refused)
                    m = m * 100000000ull + eight_digits(w);
                    digits += 8;
                    q += 8;
                    continue;
                }
                // No more digits (a branch: the next cell then need not wait for the mask).
                if (other & 0x80) break;
                const unsigned n = unsigned(__builtin_ctzll(other)) >> 3;  // digits before the other byte
                w = (w << (63 - 8 * n)) << 1;  // those digits in the top bytes, zeros before them
                m = m * pow10_u64[n] + eight_digits(w);
                digits += int(n);
                q += n;
                break;
            }
        } else {
            // Eight digits at a time (SWAR, as in fast_float) while they last.
            while (e - q >= 8 && digits <= 11) {
                std::uint64_t w;
                std::memcpy(&w, q, 8);
                if ((((w & 0xF0F0F0F0F0F0F0F0ull) | (((w + 0x0606060606060606ull) & 0xF0F0F0F0F0F0F0F0ull) >> 4)) !=
                     0x3333333333333333ull))
                    break;
                m = m * 100000000ull + eight_digits(w - 0x3030303030303030ull);
                digits += 8;
                q += 8;
            }
        }
        while (in(q) && unsigned(*q - '0') < 10u) {
            m = m * 10 + unsigned(*q - '0');
            ++digits;
            ++q;
        }
        frac = int(q - fb);
    }
    if (digits == 0 || digits > 19) return false;
    int e10 = 0;
    if (in(q) && (*q == 'e' || *q == 'E')) {
        ++q;
        bool eneg = false;
        if (in(q) && (*q == '+' || *q == '-')) {
            eneg = *q == '-';
            ++q;
        }
        const char* eb = q;
        while (in(q) && unsigned(*q - '0') < 10u && e10 < 1000) {
            e10 = e10 * 10 + (*q - '0');
            ++q;
        }
        if (q == eb || (in(q) && unsigned(*q - '0') < 10u)) return false;
        if (eneg) e10 = -e10;
    }
    e10 -= frac;
    if (m > (std::uint64_t(1) << 53) || e10 < -22 || e10 > 22) return false;
    const double d = double(m);
    v = e10 < 0 ? d / pow10[-e10] : d * pow10[e10];
    if (neg) v = -v;
    p = q;
    return true;
}

[[gnu::always_inline]] inline bool fast_decimal(const char*& p, const char* e, bool decimal_comma, double& v) {
    return fast_decimal_at<false>(p, e, decimal_comma, v);
}

// Parse the number cell that starts at p (cell content runs to the delimiter or e). Leading
// and trailing spaces, a leading '+', surrounding double quotes and (when allowed) a decimal
// comma are accepted. On success returns the pointer at the delimiter or e.
[[gnu::always_inline]] inline const char* parse_number_cell(const char* p, const char* e, char delim, bool decimal_comma, double& v,
                                     NumberStatus& st) {
    while (p < e && (*p == ' ' || (*p == '\t' && delim != '\t'))) ++p;
    bool quoted = false;
    if (p < e && *p == '"') {
        quoted = true;
        ++p;
        while (p < e && *p == ' ') ++p;
    }
    if (p < e && *p == '+') ++p;
    const char* fp = p;
    if (fast_decimal(fp, e, decimal_comma, v)) {
        const char* q = fp;
        if (q < e && *q != delim) {
            while (q < e && (*q == ' ' || (*q == '\t' && delim != '\t'))) ++q;
            if (quoted && q < e && *q == '"') {
                ++q;
                while (q < e && (*q == ' ' || (*q == '\t' && delim != '\t'))) ++q;
                quoted = false;
            }
        }
        if (!quoted && (q == e || *q == delim)) {
            st = NumberStatus::ok;
            return q;
        }
    }
    auto r = fast_float::from_chars(p, e, v);
    if (r.ec != std::errc()) {
        st = NumberStatus::not_a_number;
        return p;
    }
    if (decimal_comma && r.ptr < e && *r.ptr == ',') {
        r = fast_float::from_chars_advanced(p, e, v, fast_float::parse_options{fast_float::chars_format::general, ','});
        if (r.ec != std::errc()) {
            st = NumberStatus::not_a_number;
            return p;
        }
    }
    const char* q = r.ptr;
    while (q < e && (*q == ' ' || (*q == '\t' && delim != '\t'))) ++q;
    if (quoted) {
        if (q < e && *q == '"')
            ++q;
        else {
            st = NumberStatus::not_a_number;
            return p;
        }
        while (q < e && (*q == ' ' || (*q == '\t' && delim != '\t'))) ++q;
    }
    if (q < e && *q != delim) {
        st = NumberStatus::not_a_number;
        return p;
    }
    st = std::isnan(v) ? NumberStatus::nan : NumberStatus::ok;
    // Infinity is accepted only when it is spelled so ("inf", "-Infinity"); digits that
    // overflow are refused.
    if (std::isinf(v)) {
        const char first = *p == '-' ? p[1] : *p;
        if (first != 'i' && first != 'I') st = NumberStatus::overflow;
    }
    return q;
}

}  // namespace ellipsa::csv
