// Small helpers for the cut plots (polar and rectangular), shared by the viewer and exports.
#pragma once
#include <vector>

namespace ellipsa::viewer {

// A readable grid step in dB for a dynamic range: 3, 5, 10 or 20 dB, giving 3 to 8 rings.
double db_grid_step(double range_db);

// Grid levels from the top down to top - range (inclusive of both when they fall on the step),
// at most max_db_grid_levels of them; none when top or range is not finite or range <= 0.
inline constexpr long max_db_grid_levels = 64;
std::vector<double> db_grid_levels(double top_db, double range_db);

// Normalised polar radius of a value: 1 at top_db, 0 at top_db - range_db and below; NaN stays NaN.
double polar_radius(double value_db, double top_db, double range_db);

// The top of the plot: the peak rounded up to a whole multiple of the grid step.
double plot_top_db(double peak_db, double range_db);

}  // namespace ellipsa::viewer
