#include "pattern/db_scale.hpp"

#include <algorithm>
#include <cmath>

namespace ellipsa {

namespace {
double sane_range(double range_db) {
    if (!(range_db >= 1)) return 1;  // NaN too
    return std::min(range_db, 1000.0);
}
}  // namespace

double db_grid_step(double range_db) {
    const double r = sane_range(range_db);
    for (double s : {1.0, 2.0, 5.0, 10.0, 20.0, 50.0})
        if (r / s <= 6 + 1e-9) return s;
    return 100;
}

double DbScale::fraction(double value_db) const {
    if (std::isnan(value_db)) return value_db;
    const double v = std::clamp(value_db, floor_db(), top_db);
    return (v - floor_db()) / range_db;
}

std::vector<double> DbScale::rings() const {
    std::vector<double> out{top_db};
    const double first = std::floor((top_db - 1e-9) / step_db), last = std::ceil((floor_db() + 1e-9) / step_db);
    const double count = std::min(double(max_rings - 1), first - last + 1);
    for (long k = 0; k < long(count); ++k) {
        const double x = (first - double(k)) * step_db;
        if (top_db - x > 0.25 * step_db) out.push_back(x);
    }
    return out;
}

DbScale db_scale_at(double top_db, double range_db) {
    DbScale s;
    s.range_db = sane_range(range_db);
    s.step_db = db_grid_step(s.range_db);
    s.top_db = std::isfinite(top_db) ? top_db : 0;
    return s;
}

DbScale db_scale(double highest_db, double range_db) {
    DbScale s = db_scale_at(0, range_db);
    if (!std::isfinite(highest_db)) return s;
    const double round = std::min(s.step_db, 5.0);
    s.top_db = round * std::ceil(highest_db / round - 1e-9);
    return s;
}

}  // namespace ellipsa
