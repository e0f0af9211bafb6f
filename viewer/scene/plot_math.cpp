#include "viewer/scene/plot_math.hpp"

#include <cmath>

namespace ellipsa::viewer {

double db_grid_step(double range_db) {
    for (double s : {3.0, 5.0, 10.0, 20.0})
        if (range_db / s <= 8) return s;
    return 50;
}

std::vector<double> db_grid_levels(double top_db, double range_db) {
    std::vector<double> out;
    const double step = db_grid_step(range_db);
    for (double v = top_db; v >= top_db - range_db - 1e-9; v -= step) out.push_back(v);
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
