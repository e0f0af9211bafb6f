#include "viewer/scene/plot_math.hpp"

#include <algorithm>
#include <cmath>

namespace ellipsa::viewer {

double db_grid_step(double range_db) {
    for (double s : {3.0, 5.0, 10.0, 20.0})
        if (range_db / s <= 8) return s;
    return 50;
}

std::vector<double> db_grid_levels(double top_db, double range_db) {
    std::vector<double> out;
    if (!std::isfinite(top_db) || !std::isfinite(range_db) || !(range_db > 0)) return out;
    const double step = db_grid_step(range_db);
    // Counted, not stepped: at a huge |top| subtracting the step no longer changes the value.
    const long n = std::min(max_db_grid_levels - 1, long(std::floor(range_db / step + 1e-9)));
    for (long k = 0; k <= n; ++k) out.push_back(top_db - double(k) * step);
    return out;
}

double polar_radius(double value_db, double top_db, double range_db) {
    if (std::isnan(value_db)) return value_db;
    const double r = (value_db - (top_db - range_db)) / range_db;
    return r < 0 ? 0 : (r > 1 ? 1 : r);
}

double plot_top_db(double peak_db, double range_db) {
    if (!std::isfinite(peak_db)) return 0;
    const double step = db_grid_step(range_db);
    return step * std::ceil(peak_db / step - 1e-9);
}

}  // namespace ellipsa::viewer
