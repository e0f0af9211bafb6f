// colour_log10 and colour_atan2 (single precision, for values that only become a colour) against
// the C library's log10 and atan2 (the reference), over the whole double range and all quadrants.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "pattern/colour_math.hpp"

using namespace ellipsa;

TEST_CASE("colour_log10 matches std::log10 to single precision", "[fastmath]") {
    double worst = 0;
    for (int e = -307; e <= 307; ++e)
        for (int i = 0; i < 400; ++i) {
            const double x = std::pow(10.0, e + i / 400.0);
            const double want = std::log10(x);
            // Float's 24 bits: relative 6e-8 of the result, and at least 2e-7 absolute near 0.
            worst = std::max(worst, std::abs(colour_log10(x) - want) / std::max(std::abs(want), 1.0));
        }
    CHECK(worst < 3e-7);
    CHECK(colour_log10(1.0) == Approx(0).margin(1e-7));
    CHECK(colour_log10(100.0) == Approx(2).margin(1e-6));
    // Outside the normal range: what the C library gives.
    CHECK(std::isinf(colour_log10(0.0)));
    CHECK(colour_log10(0.0) < 0);
    CHECK(std::isinf(colour_log10(std::numeric_limits<double>::infinity())));
    CHECK(std::isnan(colour_log10(std::numeric_limits<double>::quiet_NaN())));
    CHECK(std::isnan(colour_log10(-1.0)));
    CHECK(colour_log10(1e-310) == Approx(-310).epsilon(1e-6));  // subnormal
}

TEST_CASE("colour_atan2 matches std::atan2 to 4e-7 rad", "[fastmath]") {
    double worst = 0;
    for (int i = 0; i < 200000; ++i) {
        const double ang = -3.2 + 6.4 * i / 200000.0;
        for (double r : {1e-300, 1e-8, 1.0, 3.7e5, 1e300}) {
            const double y = r * std::sin(ang), x = r * std::cos(ang);
            worst = std::max(worst, std::abs(colour_atan2(y, x) - std::atan2(y, x)));
        }
    }
    CHECK(worst < 4e-7);  // under two float ulps of pi (2.4e-7)
    for (double y : {0.0, -0.0, 1.0, -1.0})
        for (double x : {0.0, -0.0, 1.0, -1.0}) CHECK(colour_atan2(y, x) == Approx(std::atan2(y, x)).margin(3e-7));
    CHECK(std::isnan(colour_atan2(std::numeric_limits<double>::quiet_NaN(), 1.0)));
}
