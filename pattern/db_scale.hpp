// The dB scale of every cut plot, on screen and in files: where its top sits, how far apart its
// grid rings (polar) or lines (rectangular) are, and where a value falls between floor and top.
// One rule, so that the same cut shows the same rings in the viewer and in an exported figure.
#pragma once
#include <vector>

namespace ellipsa {

struct DbScale {
    double top_db = 0;     // the rim of a polar plot, the top of a rectangular one
    double range_db = 40;  // top - range is the centre / bottom
    double step_db = 10;   // between grid rings
    double floor_db() const { return top_db - range_db; }
    // 0 at the floor, 1 at the top; values outside sit on the nearer end (-inf on the floor);
    // NaN (no data) stays NaN.
    double fraction(double value_db) const;
    // The grid: the top first, then every whole multiple of the step strictly between top and
    // floor, leaving out one closer to the top than a quarter step. Counted, not stepped (at a
    // huge |top| subtracting a step no longer changes the value): at most max_rings values.
    std::vector<double> rings() const;
    static constexpr long max_rings = 64;
};

// The grid step for a dynamic range: the smallest of 1, 2, 5, 10, 20, 50, 100 dB that gives at
// most six steps (40 dB: 10 dB, 30 dB: 5 dB, 10 dB: 2 dB). Common practice for readable axes.
double db_grid_step(double range_db);

// The scale for a highest value and a dynamic range. The top is the highest value rounded up
// to a whole multiple of the step, or of 5 dB when the step is coarser (a 40 dB plot of a 2.15 dBi
// peak tops at 5 dBi, not 10). A range that is not finite or below 1 dB becomes 1 dB, above
// 1000 dB 1000 dB; a highest value that is not finite (a cut with no power) puts the top at 0.
DbScale db_scale(double highest_db, double range_db);
// The same with the top given by the caller (not finite: 0).
DbScale db_scale_at(double top_db, double range_db);

}  // namespace ellipsa
