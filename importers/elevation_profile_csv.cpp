#include "importers/elevation_profile_csv.hpp"

#include <charconv>
#include <cmath>

#include "importers/text.hpp"
#include "importers/text_source.hpp"

namespace ellipsa {

namespace {

using text::quote_found;
using text::trim;

struct Cell {
    std::string_view text;
    long column;  // 1-based character position of the cell
};

std::vector<Cell> split(std::string_view line) {
    std::vector<Cell> cells;
    std::size_t a = 0;
    while (true) {
        std::size_t c = line.find(',', a);
        std::string_view raw = line.substr(a, c == std::string_view::npos ? std::string_view::npos : c - a);
        std::size_t lead = 0;
        while (lead < raw.size() && (raw[lead] == ' ' || raw[lead] == '\t')) ++lead;
        cells.push_back({trim(raw), long(a + lead + 1)});
        if (c == std::string_view::npos) break;
        a = c + 1;
    }
    return cells;
}

}  // namespace

Result<std::vector<ProfilePoint>> parse_elevation_profile(std::string_view content, const std::string& name) {
    std::vector<ProfilePoint> out;
    int col_el = -1, col_v = -1, col_h = -1;
    bool have_header = false;
    long line_no = 0, last_line = 0;
    text::Lines lines(content);
    std::string_view line;
    while (lines.next(line, line_no)) {
        if (const std::size_t r = text::lone_cr(line); r != std::string_view::npos)
            return Error{name, line_no, long(r) + 1, text::lone_cr_message};
        if (trim(line).empty() || trim(line).front() == '#') continue;
        std::vector<Cell> cells = split(line);
        if (!have_header) {
            for (std::size_t k = 0; k < cells.size(); ++k) {
                const std::string c = text::lower(cells[k].text);
                int* slot = c == "elevation_deg" ? &col_el : c == "p_v" ? &col_v : c == "p_h" ? &col_h : nullptr;
                if (!slot)
                    return Error{name, line_no, cells[k].column,
                                 "expected a header naming elevation_deg, p_v and p_h, found column " +
                                     quote_found(cells[k].text)};
                if (*slot >= 0)
                    return Error{name, line_no, cells[k].column, "expected each column once, found " + quote_found(c) + " again"};
                *slot = int(k);
            }
            const char* missing = col_el < 0 ? "elevation_deg" : col_v < 0 ? "p_v" : col_h < 0 ? "p_h" : nullptr;
            if (missing)
                return Error{name, line_no, 1, std::string("the header lacks the column ") + missing +
                                                   " (expected elevation_deg, p_v, p_h)"};
            have_header = true;
            continue;
        }
        if (cells.size() != 3)
            return Error{name, line_no, 1,
                         "expected 3 values (elevation_deg, p_v, p_h), found " + std::to_string(cells.size())};
        double v[3];
        const int cols[3] = {col_el, col_v, col_h};
        const char* what[3] = {"an elevation in degrees", "a vertical power value", "a horizontal power value"};
        for (int q = 0; q < 3; ++q) {
            const Cell& c = cells[std::size_t(cols[q])];
            std::string_view t = c.text;
            if (!t.empty() && t.front() == '+') t.remove_prefix(1);
            auto r = std::from_chars(t.data(), t.data() + t.size(), v[q]);
            if (t.empty() || r.ec != std::errc() || r.ptr != t.data() + t.size() || !std::isfinite(v[q]))
                return Error{name, line_no, c.column,
                             std::string("expected ") + what[q] + ", found " + quote_found(c.text)};
        }
        const Cell& ce = cells[std::size_t(col_el)];
        if (v[0] < -90 || v[0] > 90)
            return Error{name, line_no, ce.column, "expected an elevation in [-90, 90] deg, found " + quote_found(ce.text)};
        if (!out.empty() && !(v[0] > out.back().elevation_deg))
            return Error{name, line_no, ce.column,
                         "elevations must increase strictly; this one does not exceed the one on line " +
                             std::to_string(last_line)};
        for (int q = 1; q < 3; ++q)
            if (v[q] < 0) {
                const Cell& c = cells[std::size_t(cols[q])];
                return Error{name, line_no, c.column,
                             std::string("expected ") + what[q] + " >= 0, found " + quote_found(c.text)};
            }
        out.push_back({v[0], v[1], v[2]});
        last_line = line_no;
    }
    if (!have_header) return Error{name, 0, 0, "no header line (expected elevation_deg,p_v,p_h)"};
    if (out.size() < 2)
        return Error{name, line_no, 0, "an elevation profile needs at least two rows, found " + std::to_string(out.size())};
    double sv = 0, sh = 0;
    for (const ProfilePoint& p : out) sv += p.p_v, sh += p.p_h;
    if (!(sv > 0) && !(sh > 0)) return Error{name, 0, 0, "every p_v and p_h is zero: no incoming power at all"};
    return out;
}

Result<std::vector<ProfilePoint>> read_elevation_profile(const std::string& path) {
    auto text = read_small_file(path, std::size_t(1) << 20, "an elevation profile file (elevation_deg,p_v,p_h)");
    if (!text) return text.error();
    return parse_elevation_profile(*text, path);
}

}  // namespace ellipsa
