// log10 and atan2 for quantities that only become a colour (the 3D view's axial-ratio, RHCP minus
// LHCP and tilt colourings): single-precision polynomials with no calls and no branches the
// compiler cannot turn into selects, about 1e-7 relative. Numbers a user reads (probe, hover,
// info, exports) never come from here: they use the C library or fast_atan2 (double).
#pragma once
#include <cmath>
#include <cstdint>
#include <cstring>

namespace ellipsa {

// log10(x) for finite x > 0 (other inputs: what std::log10 gives). The double's exponent is taken
// exactly; the mantissa, reduced to [sqrt(1/2), sqrt(2)), goes through log(m) = 2 atanh(s),
// s = (m - 1) / (m + 1), |s| < 0.172, whose series to s^9 leaves 2 s^11 / 11 < 7e-10.
inline float colour_log10(double x) {
    if (!(x >= 2.2250738585072014e-308) || !(x <= 1.7976931348623157e308)) return float(std::log10(x));
    std::uint64_t bits;
    std::memcpy(&bits, &x, sizeof bits);
    int e = int((bits >> 52) & 0x7ff) - 1023;
    bits = (bits & 0x000fffffffffffffull) | 0x3ff0000000000000ull;
    double md;
    std::memcpy(&md, &bits, sizeof md);
    float m = float(md);  // [1, 2)
    const bool high = m > 1.41421356f;
    m = high ? 0.5f * m : m;
    e += high ? 1 : 0;
    const float s = (m - 1.f) / (m + 1.f), s2 = s * s;
    const float ln_m = 2.f * s * (1.f + s2 * (1.f / 3 + s2 * (1.f / 5 + s2 * (1.f / 7 + s2 * (1.f / 9)))));
    constexpr float log10_2 = 0.30102999566f, log10_e = 0.43429448190f;
    return float(e) * log10_2 + ln_m * log10_e;
}

// atan2(y, x) in radians for finite y, x (both zero gives 0; other inputs: std::atan2). The ratio
// is formed in double (no overflow or underflow), then reduced to |t| <= tan(pi/8) as fast_atan2
// does; the Taylor series of atan to t^13 leaves tan(pi/8)^15 / 15 < 1.2e-7 rad.
inline float colour_atan2(double y, double x) {
    if (!std::isfinite(x) || !std::isfinite(y)) return float(std::atan2(y, x));
    constexpr float pi_ = 3.14159265358979f;
    const double ax = std::fabs(x), ay = std::fabs(y);
    const double mn = ax < ay ? ax : ay, mx = ax < ay ? ay : ax;
    const bool big = mn > 0.41421356237309504880 * mx;
    const double num = big ? mn - mx : mn, den = big ? mn + mx : mx;
    const float t = den > 0 ? float(num / den) : 0.f, z = t * t;
    const float poly = 1.f + z * (-1.f / 3 + z * (1.f / 5 + z * (-1.f / 7 + z * (1.f / 9 + z * (-1.f / 11 + z * (1.f / 13))))));
    float r = (big ? pi_ / 4 : 0.f) + t * poly;
    r = ay > ax ? pi_ / 2 - r : r;
    r = x < 0 || (x == 0 && std::signbit(x)) ? pi_ - r : r;
    return std::copysign(r, float(y));
}

}  // namespace ellipsa
