#include "pattern/far_field.hpp"

#include <cmath>
#include <limits>

namespace ellipsa {

const char* to_string(Quantity q) {
    switch (q) {
        case Quantity::gain: return "gain";
        case Quantity::directivity: return "directivity";
        case Quantity::relative: return "relative";
    }
    return "gain";
}

const char* to_string(FieldContent c) {
    switch (c) {
        case FieldContent::complex: return "complex";
        case FieldContent::magnitude_only: return "magnitude-only";
        case FieldContent::total_only: return "total-only";
    }
    return "complex";
}

bool Grid::phi_wraps() const { return std::abs(phi.count * phi.step_deg - 360.0) < 1e-6 * 360.0; }
bool Grid::has_north_pole() const { return std::abs(theta.start_deg) < 1e-9; }
bool Grid::has_south_pole() const { return std::abs(theta.last_deg() - 180.0) < 1e-9; }

Grid full_sphere_grid(double theta_step_deg, double phi_step_deg) {
    Grid g;
    g.theta.start_deg = 0;
    g.theta.count = int(std::lround(180.0 / theta_step_deg)) + 1;
    g.theta.step_deg = 180.0 / (g.theta.count - 1);
    g.phi.start_deg = 0;
    g.phi.count = int(std::lround(360.0 / phi_step_deg));
    g.phi.step_deg = 360.0 / g.phi.count;
    return g;
}

std::size_t FarFieldSet::nearest_frequency(double f_hz) const {
    std::size_t best = 0;
    double best_d = std::numeric_limits<double>::infinity();
    for (std::size_t i = 0; i < frequencies.size(); ++i) {
        double d = std::abs(frequencies[i].frequency_hz - f_hz);
        if (d < best_d) {
            best_d = d;
            best = i;
        }
    }
    return best;
}

double to_db(double linear) {
    if (linear <= 0) return -std::numeric_limits<double>::infinity();
    return 10.0 * std::log10(linear);
}

}  // namespace ellipsa
