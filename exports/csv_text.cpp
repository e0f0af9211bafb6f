#include "exports/csv_text.hpp"

#include <cmath>
#include <cstdio>

namespace ellipsa::exports {

void append_csv_number(std::string& out, double v) {
    if (std::isnan(v)) return;
    if (std::isinf(v)) {
        out += v < 0 ? "-inf" : "inf";
        return;
    }
    char buf[40];
    std::snprintf(buf, sizeof buf, "%.17g", v);
    out += buf;
}

}  // namespace ellipsa::exports
