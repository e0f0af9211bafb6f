// fast_atan2 against the C library's atan2 (the reference), over all quadrants and the edges.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "pattern/fast_atan2.hpp"

using namespace ellipsa;

TEST_CASE("fast_atan2 matches std::atan2 to 1e-15 rad", "[fastmath]") {
    double worst = 0;
    for (int i = 0; i < 200000; ++i) {
        const double ang = -3.2 + 6.4 * i / 200000.0;
        for (double r : {1e-300, 1e-8, 1.0, 3.7e5, 1e300}) {
            const double y = r * std::sin(ang), x = r * std::cos(ang);
            worst = std::max(worst, std::abs(fast_atan2(y, x) - std::atan2(y, x)));
        }
    }
    CHECK(worst < 1e-15);  // a few ulps of pi
    for (double y : {0.0, -0.0, 1.0, -1.0})
        for (double x : {0.0, -0.0, 1.0, -1.0}) CHECK(fast_atan2(y, x) == Approx(std::atan2(y, x)).margin(1e-15));
    CHECK(std::isnan(fast_atan2(std::numeric_limits<double>::quiet_NaN(), 1.0)));
}
