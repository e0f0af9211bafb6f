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

void append_csv_text(std::string& out, const std::string& s) {
    if (s.find_first_of(",\"\r\n") == std::string::npos) {
        out += s;
        return;
    }
    out += '"';
    for (char c : s) out += c == '"' ? std::string("\"\"") : std::string(1, c);
    out += '"';
}

}  // namespace ellipsa::exports
