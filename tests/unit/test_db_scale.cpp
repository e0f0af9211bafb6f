// The one dB scale of every cut plot (pattern/db_scale.hpp): the viewer and the files share it.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/db_scale.hpp"

using namespace ellipsa;

TEST_CASE("dB scale: 1-2-5 steps giving at most six rings", "[plot]") {
    // Common practice: grid steps from the 1-2-5 series, a handful of rings.
    CHECK(db_grid_step(6) == 1);
    CHECK(db_grid_step(10) == 2);
    CHECK(db_grid_step(20) == 5);
    CHECK(db_grid_step(30) == 5);
    CHECK(db_grid_step(40) == 10);
    CHECK(db_grid_step(60) == 10);
    CHECK(db_grid_step(120) == 20);
    CHECK(db_grid_step(200) == 50);
    for (double r : {3.0, 7.0, 13.0, 25.0, 41.0, 77.0, 119.0, 200.0}) CHECK(r / db_grid_step(r) <= 6 + 1e-9);
}

TEST_CASE("dB scale: the top, the rings and where values fall", "[plot]") {
    // A half-wave dipole's 2.15 dBi on a 40 dB plot: top at 5 dBi (5 dB rounding for a 10 dB
    // step), rings at 0, -10, -20, -30, floor at -35.
    const DbScale s = db_scale(2.15, 40);
    CHECK(s.top_db == 5);
    CHECK(s.step_db == 10);
    CHECK(s.floor_db() == -35);
    CHECK(s.rings() == std::vector<double>{5, 0, -10, -20, -30});
    // A top on the step: no ring repeats the top.
    CHECK(db_scale(-3.2, 30).rings() == std::vector<double>{0, -5, -10, -15, -20, -25});
    // A fine scale rounds the top to its own step.
    CHECK(db_scale(1.3, 10).top_db == 2);
    CHECK(s.fraction(5) == 1);
    CHECK(s.fraction(-15) == Approx(0.5));
    CHECK(s.fraction(-100) == 0);
    CHECK(s.fraction(-INFINITY) == 0);
    CHECK(s.fraction(20) == 1);
    CHECK(std::isnan(s.fraction(NAN)));
}

TEST_CASE("dB scale: bounded for any top and range", "[plot]") {
    // A cut with no power once started the plot at -1e300, where `v -= 5` no longer changes v:
    // the loop never ended and grew without bound.
    CHECK(db_scale(-INFINITY, 30).top_db == 0);
    CHECK(db_scale(NAN, 30).top_db == 0);
    CHECK(db_scale_at(-1e300, 30).rings().size() <= std::size_t(DbScale::max_rings));
    CHECK(db_scale_at(1e300, 30).rings().size() <= std::size_t(DbScale::max_rings));
    CHECK(db_scale(0, NAN).range_db == 1);
    CHECK(db_scale(0, 0).range_db == 1);
    CHECK(db_scale(0, 1e300).range_db == 1000);
    CHECK(db_scale(0, 1e300).rings().size() <= std::size_t(DbScale::max_rings));
    CHECK(db_scale(0, 40).rings().size() == 4);
}
