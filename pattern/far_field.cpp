#include "pattern/far_field.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
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

const char* to_string(FieldPart p) {
    switch (p) {
        case FieldPart::whole: return "whole";
        case FieldPart::theta: return "E_theta";
        case FieldPart::phi: return "E_phi";
        case FieldPart::rhcp: return "RHCP";
        case FieldPart::lhcp: return "LHCP";
        case FieldPart::co: return "co-polar";
        case FieldPart::cross: return "cross-polar";
    }
    return "whole";
}

const char* to_string(Sampling s) { return s == Sampling::cuts ? "cuts" : "surface"; }

Sampling inferred_sampling(const Grid& g) {
    if (g.theta.count == 1 || g.phi.count == 1) return Sampling::cuts;
    const bool far_apart = g.phi.step_deg >= 45 - 1e-9 && g.phi.step_deg >= 5 * g.theta.step_deg - 1e-9;
    return far_apart ? Sampling::cuts : Sampling::surface;
}

bool Grid::phi_wraps() const { return std::abs(phi.count * phi.step_deg - 360.0) < 1e-6 * 360.0; }
bool Grid::has_north_pole() const { return std::abs(theta.start_deg) < 1e-9; }
bool Grid::has_south_pole() const { return std::abs(theta.last_deg() - 180.0) < 1e-9; }

bool same_grid(const Grid& a, const Grid& b) {
    auto eq = [](double x, double y) { return std::abs(x - y) <= 1e-9 * std::max(1.0, std::abs(x)); };
    return a.sampling == b.sampling && a.theta.count == b.theta.count && a.phi.count == b.phi.count && eq(a.theta.start_deg, b.theta.start_deg) &&
           eq(a.theta.step_deg, b.theta.step_deg) && eq(a.phi.start_deg, b.phi.start_deg) &&
           eq(a.phi.step_deg, b.phi.step_deg);
}

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

Result<std::size_t> find_frequency(const FarFieldSet& s, double f_hz, const std::string& path) {
    if (s.frequencies.empty()) return Error{path, 0, 0, "holds no frequency"};
    const std::size_t k = s.nearest_frequency(f_hz);
    if (std::abs(s.frequencies[k].frequency_hz - f_hz) <= 0.005 * std::abs(f_hz)) return k;
    std::string list;
    for (const FarField& f : s.frequencies) list += (list.empty() ? "" : ", ") + format_frequency(f.frequency_hz);
    return Error{path, 0, 0, "has no data at " + format_frequency(f_hz) + "; it holds " + list};
}

std::string format_frequency(double hz) {
    if (!(hz > 0)) return "unknown frequency";
    char buf[64];
    if (hz >= 1e9)
        std::snprintf(buf, sizeof buf, "%g GHz", hz / 1e9);
    else if (hz >= 1e6)
        std::snprintf(buf, sizeof buf, "%g MHz", hz / 1e6);
    else if (hz >= 1e3)
        std::snprintf(buf, sizeof buf, "%g kHz", hz / 1e3);
    else
        std::snprintf(buf, sizeof buf, "%g Hz", hz);
    return buf;
}

double to_db(double linear) {
    if (linear <= 0) return -std::numeric_limits<double>::infinity();
    return 10.0 * std::log10(linear);
}

}  // namespace ellipsa
