// atan2 for the batch kernels: agrees with std::atan2 to 5e-16 rad, branch-free so the compiler
// can overlap iterations. Range reduction to |t| <= tan(pi/8) with a single division, then the
// Taylor series of atan to degree 37 (truncation below tan(pi/8)^39 / 39 ~ 3e-17), evaluated by
// Estrin's scheme to keep the dependency chain short.
#pragma once
#include <cmath>

namespace ellipsa {

inline double fast_atan2(double y, double x) {
    constexpr double pi_ = 3.14159265358979323846;
    constexpr double tan_pi_8 = 0.41421356237309504880;
    if (!std::isfinite(x) || !std::isfinite(y)) return std::atan2(y, x);
    const double ax = std::fabs(x), ay = std::fabs(y);
    const double mn = ax < ay ? ax : ay, mx = ax < ay ? ay : ax;
    // atan(a) = pi/4 + atan((a - 1)/(a + 1)) for a = mn/mx > tan(pi/8): one division either way.
    const bool big = mn > tan_pi_8 * mx;
    const double num = big ? mn - mx : mn, den = big ? mn + mx : mx;
    const double t = den > 0 ? num / den : 0.0;
    const double base = big ? pi_ / 4 : 0.0;
    // c_k = (-1)^k / (2k + 1), k = 0..18
    constexpr double c0 = 1.0, c1 = -1.0 / 3, c2 = 1.0 / 5, c3 = -1.0 / 7, c4 = 1.0 / 9, c5 = -1.0 / 11,
                     c6 = 1.0 / 13, c7 = -1.0 / 15, c8 = 1.0 / 17, c9 = -1.0 / 19, c10 = 1.0 / 21, c11 = -1.0 / 23,
                     c12 = 1.0 / 25, c13 = -1.0 / 27, c14 = 1.0 / 29, c15 = -1.0 / 31, c16 = 1.0 / 33,
                     c17 = -1.0 / 35, c18 = 1.0 / 37;
    const double z = t * t, z2 = z * z, z4 = z2 * z2, z8 = z4 * z4, z16 = z8 * z8;
    const double q0 = (c0 + c1 * z) + (c2 + c3 * z) * z2, q1 = (c4 + c5 * z) + (c6 + c7 * z) * z2;
    const double q2 = (c8 + c9 * z) + (c10 + c11 * z) * z2, q3 = (c12 + c13 * z) + (c14 + c15 * z) * z2;
    const double q4 = (c16 + c17 * z) + c18 * z2;
    const double poly = ((q0 + q1 * z4) + (q2 + q3 * z4) * z8) + q4 * z16;
    double r = base + t * poly;
    r = ay > ax ? pi_ / 2 - r : r;
    r = x < 0 || (x == 0 && std::signbit(x)) ? pi_ - r : r;
    return std::copysign(r, y);
}

}  // namespace ellipsa
