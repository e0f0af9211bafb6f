#include "cli/load.hpp"

#include <cmath>
#include <cstdio>

namespace ellipsa::cli {

void add_load_options(CLI::App* sub, LoadOptions& o) {
    sub->add_option("--map", o.map,
                    "Read a foreign column layout: \"SourceName=schema_name,...\" (see docs/far-field-csv.md)");
}

Result<FarFieldSet> load_pattern(const std::string& path, const LoadOptions& o) {
    CsvReadOptions ro;
    if (!o.map.empty()) {
        // "A=b,C=d"
        std::size_t pos = 0;
        while (pos <= o.map.size()) {
            std::size_t comma = o.map.find(',', pos);
            std::string item = o.map.substr(pos, comma == std::string::npos ? std::string::npos : comma - pos);
            std::size_t eq = item.find('=');
            if (eq == std::string::npos || eq == 0 || eq + 1 == item.size())
                return Error{"--map", 0, 0, "expected SourceName=schema_name, found \"" + item + "\""};
            ro.column_map.emplace_back(item.substr(0, eq), item.substr(eq + 1));
            if (comma == std::string::npos) break;
            pos = comma + 1;
        }
    }
    return read_far_field_csv(path, ro);
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

Result<std::size_t> pick_frequency(const FarFieldSet& s, const std::optional<double>& f, const std::string& path) {
    if (s.frequencies.empty()) return Error{path, 0, 0, "holds no frequency"};
    if (!f) {
        if (s.frequencies.size() == 1) return std::size_t(0);
        return std::size_t(0);  // callers that handle every frequency ignore this
    }
    std::size_t k = s.nearest_frequency(*f);
    const double have = s.frequencies[k].frequency_hz;
    if (std::abs(have - *f) <= 0.005 * std::abs(*f)) return k;
    std::string list;
    for (const auto& ff : s.frequencies) list += (list.empty() ? "" : ", ") + format_frequency(ff.frequency_hz);
    return Error{path, 0, 0, "has no data at " + format_frequency(*f) + "; it holds " + list};
}

}  // namespace ellipsa::cli
