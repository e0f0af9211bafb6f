#include "cli/format.hpp"

#include <cmath>
#include <cstdio>

namespace ellipsa::cli {

std::string fmt(double v, const char* unit, int decimals) {
    char buf[64];
    if (std::isinf(v))
        std::snprintf(buf, sizeof buf, "%s%s%s", v < 0 ? "-inf" : "inf", *unit ? " " : "", unit);
    else if (std::isnan(v))
        std::snprintf(buf, sizeof buf, "n/a");
    else {
        if (std::abs(v) < 0.5 * std::pow(10.0, -decimals)) v = 0;  // no "-0.0"
        std::snprintf(buf, sizeof buf, "%.*f%s%s", decimals, v, *unit ? " " : "", unit);
    }
    return buf;
}

std::string fmt(const std::optional<double>& v, const char* unit, int decimals, const char* missing) {
    return v ? fmt(*v, unit, decimals) : std::string(missing);
}

}  // namespace ellipsa::cli
