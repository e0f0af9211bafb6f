#include "cli/number_list.hpp"

#include <cmath>
#include <cstdlib>

namespace ellipsa::cli {

std::optional<std::vector<double>> parse_number_list(const std::string& text, bool allow_none) {
    std::vector<double> out;
    if (allow_none && text == "none") return out;
    std::size_t pos = 0;
    while (pos <= text.size()) {
        const std::size_t c = text.find(',', pos);
        const std::string item = text.substr(pos, c == std::string::npos ? std::string::npos : c - pos);
        char* end = nullptr;
        const double v = std::strtod(item.c_str(), &end);
        if (item.empty() || *end != '\0' || !std::isfinite(v)) return std::nullopt;
        out.push_back(v);
        if (c == std::string::npos) break;
        pos = c + 1;
    }
    return out;
}

}  // namespace ellipsa::cli
