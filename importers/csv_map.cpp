// Column-map files: a foreign layout described once, reused with a map file.
//
//   # comments and blank lines are skipped
//   column: Source Name = schema_name      (or = ignore)
//   scale: schema_name = factor
//   offset: schema_name = value
//   angle-unit: rad                          (any metadata key, and phase-unit)
//
// Every entry carries its file and line as its origin, so the reader's refusals (a repeated
// key, a source column the data file lacks) point here.
#include <algorithm>
#include <cmath>
#include <filesystem>

#include "importers/csv_layout.hpp"
#include "importers/csv_number.hpp"
#include "importers/far_field_csv.hpp"
#include "importers/text.hpp"
#include "importers/text_source.hpp"

namespace ellipsa {

namespace {

// "name = value" of a column, scale or offset line.
Status map_entry(const std::string& key, std::string_view line, std::string_view value, const CsvOrigin& at,
                 CsvReadOptions& o) {
    using text::quote_found;
    using text::trim;
    const long vcol = long(value.data() - line.data()) + 1;
    const std::size_t eq = value.rfind('=');
    if (eq == std::string_view::npos || trim(value.substr(0, eq)).empty() || trim(value.substr(eq + 1)).empty())
        return Error{at.name, at.line, vcol, "expected \"name = value\", found " + quote_found(value)};
    const std::string_view a = trim(value.substr(0, eq)), b = trim(value.substr(eq + 1));
    const long bcol = long(b.data() - line.data()) + 1;
    if (key == "column") {
        const std::string target = text::normalise_name(b);
        if (target != "ignore" && csv::column_role(target) < 0)
            return Error{at.name, at.line, bcol, "expected a schema column name or \"ignore\", found " + quote_found(b)};
        o.column_map.push_back({std::string(a), target, at});
        return Ok{};
    }
    if (csv::column_role(text::normalise_name(a)) < 0)
        return Error{at.name, at.line, vcol, "expected a schema column name, found " + quote_found(a)};
    double v;
    csv::NumberStatus st;
    const char* q = csv::parse_number_cell(b.data(), b.data() + b.size(), ';', false, v, st);
    if (st != csv::NumberStatus::ok || q != b.data() + b.size() || !std::isfinite(v))
        return Error{at.name, at.line, bcol, "expected a finite number, found " + quote_found(b)};
    (key == "scale" ? o.scale : o.offset).push_back({std::string(a), v, at});
    return Ok{};
}

}  // namespace

Status parse_csv_map_text(std::string_view text, const std::string& file, CsvReadOptions& o) {
    text::Lines lines(text);
    std::string_view line;
    long line_no = 0;
    while (lines.next(line, line_no)) {
        if (const std::size_t r = text::lone_cr(line); r != std::string_view::npos)
            return Error{file, line_no, long(r) + 1, text::lone_cr_message};
        const std::string_view t = text::trim(line);
        if (t.empty() || t.front() == '#') continue;
        const std::size_t colon = t.find(':');
        if (colon == std::string_view::npos)
            return Error{file, line_no, long(t.data() - line.data()) + 1,
                         "expected \"key: value\" (column, scale, offset or a metadata key), found " + text::quote_found(t)};
        const std::string key = text::normalise_name(t.substr(0, colon));
        const std::string_view value = text::trim(t.substr(colon + 1));
        const CsvOrigin at{file, line_no};
        if (key == "column" || key == "scale" || key == "offset") {
            if (Status st = map_entry(key, line, value, at, o); !st) return st;
            continue;
        }
        o.settings.push_back(CsvSetting{key, std::string(value), at});
    }
    return Ok{};
}

Status read_csv_map_file(const std::string& path, CsvReadOptions& o) {
    auto text = read_small_file(path, std::size_t(1) << 20, "a map file");
    if (!text) return text.error();
    return parse_csv_map_text(*text, path, o);
}

std::string find_csv_map_beside(const std::string& path) {
    namespace fs = std::filesystem;
    std::error_code ec;
    const fs::path p(path);
    fs::path same = p;
    same.replace_extension(".map");
    if (fs::is_regular_file(same, ec)) return same.string();
    const fs::path dir = p.has_parent_path() ? p.parent_path() : fs::path(".");
    const std::string name = p.filename().string();
    std::vector<std::string> maps;  // in name order, so the choice does not depend on the folder's order
    for (const auto& e : fs::directory_iterator(dir, ec))
        if (e.path().extension() == ".map" && e.is_regular_file(ec)) maps.push_back(e.path().string());
    std::sort(maps.begin(), maps.end());
    for (const std::string& m : maps) {
        auto text = read_small_file(m, std::size_t(64) << 10, "a map file");
        if (text && text->find(name) != std::string::npos) return m;
    }
    return "";
}

}  // namespace ellipsa
