#include "cli/format.hpp"

#include "exports/figure_text.hpp"

#include <cmath>
#include <cstdio>

namespace ellipsa::cli {

std::string fmt(double v, const char* unit, int decimals) {
    if (std::isnan(v)) return "n/a";
    // An exactly zero power (-inf dB) in the core's words, never "-inf dBi".
    if (std::isinf(v) && v < 0) return exports::level_text(v, decimals, unit);
    return exports::fixed(v, decimals) + (*unit ? " " : "") + unit;
}

std::string fmt(const std::optional<double>& v, const char* unit, int decimals, const char* missing) {
    return v ? fmt(*v, unit, decimals) : std::string(missing);
}

}  // namespace ellipsa::cli
