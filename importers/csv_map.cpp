// Column-map files: a foreign layout described once, reused with --map-file.
//
//   # comments and blank lines are skipped
//   column: Source Name = schema_name      (or = ignore)
//   scale: schema_name = factor
//   offset: schema_name = value
//   angle-unit: rad                          (any metadata key, and phase-unit)
#include <cstdio>
#include <fstream>
#include <sstream>

#include "importers/csv_layout.hpp"
#include "importers/far_field_csv.hpp"

namespace ellipsa {

namespace {
std::string_view trim(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '\r')) s.remove_suffix(1);
    return s;
}
}  // namespace

Status parse_csv_map_text(std::string_view text, const std::string& file, CsvReadOptions& o) {
    long line_no = 0;
    std::size_t pos = 0;
    if (text.size() >= 3 && text.substr(0, 3) == "\xEF\xBB\xBF") pos = 3;
    while (pos < text.size()) {
        std::size_t nl = text.find('\n', pos);
        std::string_view line = text.substr(pos, nl == std::string_view::npos ? std::string_view::npos : nl - pos);
        pos = nl == std::string_view::npos ? text.size() : nl + 1;
        ++line_no;
        std::string_view t = trim(line);
        if (t.empty() || t.front() == '#') continue;
        const std::size_t colon = t.find(':');
        if (colon == std::string_view::npos)
            return Error{file, line_no, 1, "expected \"key: value\" (column, scale, offset or a metadata key), found " +
                                               csv::quote_found(t)};
        const std::string key = csv::normalise_name(t.substr(0, colon));
        const std::string_view value = trim(t.substr(colon + 1));
        const long vcol = long(value.data() - line.data()) + 1;
        if (key == "column" || key == "scale" || key == "offset") {
            const std::size_t eq = value.rfind('=');
            if (eq == std::string_view::npos || trim(value.substr(0, eq)).empty() || trim(value.substr(eq + 1)).empty())
                return Error{file, line_no, vcol, "expected \"name = value\", found " + csv::quote_found(value)};
            const std::string_view a = trim(value.substr(0, eq)), b = trim(value.substr(eq + 1));
            if (key == "column") {
                const std::string target = csv::normalise_name(b);
                if (target != "ignore" && csv::column_role(target) < 0)
                    return Error{file, line_no, long(b.data() - line.data()) + 1,
                                 "expected a schema column name or \"ignore\", found " + csv::quote_found(b)};
                o.column_map.emplace_back(std::string(a), target);
            } else {
                if (csv::column_role(csv::normalise_name(a)) < 0)
                    return Error{file, line_no, vcol, "expected a schema column name, found " + csv::quote_found(a)};
                double v;
                csv::NumberStatus st;
                const char* q = csv::parse_number_cell(b.data(), b.data() + b.size(), ';', false, v, st);
                if (st != csv::NumberStatus::ok || q != b.data() + b.size() || !std::isfinite(v))
                    return Error{file, line_no, long(b.data() - line.data()) + 1,
                                 "expected a finite number, found " + csv::quote_found(b)};
                (key == "scale" ? o.scale : o.offset).emplace_back(std::string(a), v);
            }
            continue;
        }
        o.settings.push_back(CsvSetting{key, std::string(value), file, line_no});
    }
    return Ok{};
}

Status read_csv_map_file(const std::string& path, CsvReadOptions& o) {
    std::ifstream in(path, std::ios::binary);
    if (!in) return Error{path, 0, 0, "cannot open the map file"};
    std::ostringstream ss;
    ss << in.rdbuf();
    const std::string text = ss.str();
    if (text.size() > (1u << 20)) return Error{path, 0, 0, "expected a small map file (under 1 MB)"};
    return parse_csv_map_text(text, path, o);
}

}  // namespace ellipsa
