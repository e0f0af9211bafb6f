// Metadata lines, header row, column map, family and settings of the far-field CSV schema, as
// named stages: head (metadata lines and the header line), delimiter, header cells, column
// map, angles, family, settings, metadata values, scale and offset.
#include "importers/csv_layout.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <utility>

#include "importers/csv_number.hpp"
#include "importers/frequency_text.hpp"
#include "importers/text.hpp"

namespace ellipsa::csv {

namespace {

constexpr const char* names[c_count] = {
    "frequency",     "theta",        "phi",           "azimuth",      "elevation",
    "e_theta_re",    "e_theta_im",   "e_phi_re",      "e_phi_im",
    "e_theta_db",    "e_theta_phase", "e_phi_db",     "e_phi_phase",
    "e_rhcp_db",     "e_rhcp_phase", "e_lhcp_db",     "e_lhcp_phase",
    "e_co_db",       "e_co_phase",   "e_cross_db",    "e_cross_phase",
    "e_total_db"};

// The file's metadata keys, then the ones only settings may give.
constexpr const char* meta_keys[] = {"quantity", "time-convention", "angle-unit",   "frequency-unit", "frequency",
                                     "ludwig3-reference", "name",   "source",       "note",
                                     "mounting-up",       "mounting-turns",         "angles",         "sampling",
                                     "part",              "phase-unit",             "skip-lines",     "duplicate-tolerance"};
constexpr int n_file_keys = 14;
constexpr int n_keys = 17;
// The field columns of a positioner grid, in its own unit vectors: the same roles as the
// theta/phi columns (az-hat takes theta-hat's place, el-hat phi-hat's; pattern/positioner.hpp).
constexpr std::pair<const char*, int> positioner_names[] = {
    {"e_az_re", c_e_theta_re}, {"e_az_im", c_e_theta_im}, {"e_el_re", c_e_phi_re}, {"e_el_im", c_e_phi_im},
    {"e_az_db", c_e_theta_db}, {"e_az_phase", c_e_theta_phase}, {"e_el_db", c_e_phi_db}, {"e_el_phase", c_e_phi_phase}};
// Lines of free text looked through for a header row that names the mapped columns.
constexpr long preamble_search_lines = 1000;
constexpr const char* binary_message = "expected text, found a NUL byte (a binary file?)";

// One metadata value: from a line of the file (at line_offset, column) or from a setting.
struct Meta {
    int key = -1;
    std::string value;
    bool from_file = true;
    std::size_t line_offset = 0;
    long column = 0;
    CsvOrigin origin;
};

// Metadata lines and the header line.
struct Head {
    std::vector<Meta> meta;
    std::string header;
    std::size_t header_offset = 0, data_offset = 0;
    std::size_t note_index = 0;  // the one entry that holds every note line, joined
    long skipped = 0;            // lines of free text before the header (skip-lines included)
};

// How the header row is found: after `skip` lines that are not read at all, the first line that
// is not blank, a comment or metadata; with a column map, the first such line that names every
// mapped source column (a free-text preamble before it is skipped), within preamble_search_lines.
struct HeaderSearch {
    long skip = 0;
    std::vector<std::string> mapped;  // normalised source names of the column map
};

std::string origin_text(const CsvOrigin& o, const char* unnamed) {
    if (o.name.empty()) return unnamed;
    return o.line > 0 ? o.name + ":" + std::to_string(o.line) : o.name;
}

// An Error about an option given outside the file, placed at its origin.
Error at_origin(const CsvOrigin& o, const char* unnamed, std::string msg) {
    if (o.name.empty()) return Error{"", 0, 0, std::string(unnamed) + ": " + msg};
    return Error{o.name, o.line, 0, std::move(msg)};
}

// ---- Stage: head (metadata lines up to the header line) ----

// The first window, before any line is looked for: binary data is refused at once, so a huge
// file that starts with a NUL byte costs one window, not a scan of the whole file.
std::optional<Error> first_bytes_problem(const TextSource& src, const std::string& file) {
    std::vector<char> buffer;
    auto w = src.view(0, window_bytes, buffer);
    if (!w) return w.error();
    const std::size_t z = w->find('\0');
    if (z == std::string_view::npos) return std::nullopt;
    const std::size_t nl = z == 0 ? std::string_view::npos : w->rfind('\n', z - 1);
    const std::size_t start = nl == std::string_view::npos ? 0 : nl + 1;
    return Error{file, long(std::count(w->begin(), w->begin() + long(start), '\n')) + 1, long(z - start) + 1,
                 binary_message};
}

enum class HeadLine { skip, header, failed };

// One line before the data: blank, comment, metadata (checked for repeats in constant time per
// line through `first_at`), or the header.
HeadLine head_line(const TextSource& src, std::string_view line, std::size_t start, Head& h,
                   std::array<std::size_t, n_keys>& first_at, Failure& f) {
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    if (const std::size_t z = line.find('\0'); z != std::string_view::npos) {
        f = {true, start, long(z) + 1, binary_message};
        return HeadLine::failed;
    }
    if (const std::size_t r = text::lone_cr(line); r != std::string_view::npos) {
        f = {true, start, long(r) + 1, text::lone_cr_message};
        return HeadLine::failed;
    }
    const std::size_t first = line.find_first_not_of(" \t,;");
    if (first == std::string_view::npos) return HeadLine::skip;  // blank
    if (line[first] != '#') return HeadLine::header;
    const std::string_view body = line.substr(first + 1);
    const std::size_t colon = body.find(':');
    if (colon == std::string_view::npos) return HeadLine::skip;
    const int key = metadata_key(text::lower(text::trim(body.substr(0, colon))));
    if (key < 0) return HeadLine::skip;  // a comment
    if (first_at[std::size_t(key)] != std::string::npos && std::string_view(meta_keys[key]) != "note") {
        f = {true, start, 1,
             std::string("expected metadata \"") + meta_keys[key] + "\" once, found it again (first on line " +
                 std::to_string(src.line_number_at(first_at[std::size_t(key)])) + ")"};
        return HeadLine::failed;
    }
    const std::string_view v = body.substr(colon + 1);
    if (first_at[std::size_t(key)] != std::string::npos) {  // a further note: joined to the first
        h.meta[h.note_index].value.append("\n").append(text::trim(v));
        return HeadLine::skip;
    }
    first_at[std::size_t(key)] = start;
    if (std::string_view(meta_keys[key]) == "note") h.note_index = h.meta.size();
    const std::size_t lead = std::min(v.size(), v.find_first_not_of(" \t"));
    const long col = long(first + 1 + colon + 1 + lead) + 1;
    h.meta.push_back(Meta{key, std::string(text::trim(v)), true, start, col, {}});
    return HeadLine::skip;
}

bool names_every_mapped_column(std::string_view line, const std::vector<std::string>& mapped);

// One line of the head: skipped (skip-lines), metadata or comment, free text before the header
// (with a column map), or the header. Returns false once the header is found or on a failure.
struct HeadWalk {
    const TextSource& src;
    const HeaderSearch& search;
    Head& h;
    Failure& f;
    std::array<std::size_t, n_keys> first_at;
    long to_skip, candidates = 0, free_text = 0;
    std::optional<std::pair<std::size_t, std::size_t>> first_candidate;  // (offset, next) of the first header-like line
    bool found = false;

    bool line(std::string_view line, std::size_t at, std::size_t next) {
        if (to_skip > 0) {
            --to_skip;
            return true;
        }
        const HeadLine kind = head_line(src, line, at, h, first_at, f);
        if (kind == HeadLine::failed) return false;
        if (kind == HeadLine::skip) return true;
        if (!search.mapped.empty() && !names_every_mapped_column(line, search.mapped)) {
            if (!first_candidate) first_candidate = {at, next};
            ++free_text;
            return ++candidates < preamble_search_lines;
        }
        take(line, at, next);
        h.skipped = search.skip + free_text;
        return false;
    }
    void take(std::string_view line, std::size_t at, std::size_t next) {
        h.header.assign(line);
        if (!h.header.empty() && h.header.back() == '\r') h.header.pop_back();
        h.header_offset = at;
        h.data_offset = next;
        found = true;
    }
};

Result<Head> read_head(const TextSource& src, const std::string& file, const HeaderSearch& search) {
    if (auto e = first_bytes_problem(src, file)) return *e;
    Head h;
    std::vector<char> buffer;
    std::size_t begin = 0;
    if (auto bom = src.view(0, 3, buffer); bom && *bom == "\xEF\xBB\xBF") begin = 3;
    Failure f;
    HeadWalk walk{src, search, h, f, {}, search.skip, 0, 0, std::nullopt, false};
    walk.first_at.fill(std::string::npos);
    for_each_window(src, begin, src.size(), buffer, f, [&](std::string_view w, std::size_t at) {
        for (std::size_t pos = 0; pos < w.size();) {
            const std::size_t nl = w.find('\n', pos);
            const std::size_t end = nl == std::string_view::npos ? w.size() : nl;
            const std::size_t next = nl == std::string_view::npos ? w.size() : nl + 1;
            if (!walk.line(w.substr(pos, end - pos), at + pos, at + next)) return false;
            pos = next;
        }
        return true;
    });
    if (f.set) return to_error(src, file, f);
    if (!walk.found && walk.first_candidate) {
        // No line names every mapped column: the first header-like line is the header, and the
        // column map's refusal says which name it lacks.
        auto [at, next] = *walk.first_candidate;
        std::vector<char> b2;
        auto w = src.view(at, next - at, b2);
        if (!w) return w.error();
        std::string_view line = *w;
        if (!line.empty() && line.back() == '\n') line.remove_suffix(1);
        walk.take(line, at, next);
        h.skipped = search.skip;
    }
    if (!walk.found) {
        // Never guess at binary garbage: say what we saw.
        if (src.size() == 0) return Error{file, 0, 0, "expected a header row, found an empty file"};
        if (search.skip > 0)
            return Error{file, 0, 0, "expected a header row after the " + std::to_string(search.skip) +
                                         " lines skipped (skip-lines), found none"};
        return Error{file, 0, 0, "expected a header row, found only blank, comment or metadata lines"};
    }
    return h;
}

// ---- Stage: delimiter ----

// The most frequent of tab, semicolon, comma outside quotes.
Result<char> detect_delimiter(std::string_view header, const std::string& file, long line) {
    std::size_t n_comma = 0, n_semi = 0, n_tab = 0;
    bool q = false;
    for (char c : header) {
        if (c == '"') q = !q;
        else if (!q) {
            n_comma += c == ',';
            n_semi += c == ';';
            n_tab += c == '\t';
        }
    }
    if (n_comma == 0 && n_semi == 0 && n_tab == 0) {
        for (unsigned char c : header)
            if (c < 0x20 && c != '\t')
                return Error{file, line, 1, "expected a text header row, found binary data " + text::quote_found(header)};
        return Error{file, line, 1,
                     "expected a header row with columns separated by comma, semicolon or tab, found " +
                         text::quote_found(header)};
    }
    return n_tab >= n_semi && n_tab >= n_comma ? '\t' : n_semi >= n_comma ? ';' : ',';
}

// ---- Stage: header cells ----

struct HeaderCells {
    std::vector<std::string_view> text;
    std::vector<long> column;  // 1-based byte column
};

// Split the header (quotes may hold a delimiter); trailing empty cells are dropped.
Result<HeaderCells> split_header(std::string_view header, const Layout& L, const std::string& file) {
    HeaderCells h;
    std::size_t a = 0;
    bool q = false;
    for (std::size_t k = 0; k <= header.size(); ++k) {
        if (k < header.size() && header[k] == '"') q = !q;
        if (k == header.size() || (!q && header[k] == L.delimiter)) {
            h.text.push_back(header.substr(a, k - a));
            h.column.push_back(long(a) + 1);
            a = k + 1;
        }
    }
    while (!h.text.empty() && text::normalise_name(h.text.back()).empty()) {
        h.text.pop_back();
        h.column.pop_back();
    }
    if (h.text.empty()) return Error{file, L.header_line, 1, "expected a header row naming the columns, found only empty cells"};
    // A header that is a row of numbers: the header was forgotten.
    double v;
    NumberStatus st;
    const std::string_view c0 = h.text.front();
    parse_number_cell(c0.data(), c0.data() + c0.size(), L.delimiter, L.decimal_comma, v, st);
    if (st == NumberStatus::ok)
        return Error{file, L.header_line, h.column[0], "expected a header row naming the columns, found a row of numbers"};
    return h;
}

// A header-like line that names every mapped source column (its own delimiter, quotes allowed).
bool names_every_mapped_column(std::string_view line, const std::vector<std::string>& mapped) {
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    auto d = detect_delimiter(line, "", 0);
    if (!d) return false;
    Layout L;
    L.delimiter = *d;
    L.decimal_comma = *d != ',';
    auto cells = split_header(line, L, "");
    if (!cells) return false;
    for (const std::string& m : mapped) {
        bool has = false;
        for (std::string_view c : cells->text) has = has || text::normalise_name(c) == m;
        if (!has) return false;
    }
    return true;
}

// How to find the header: skip-lines from the settings, the mapped source names.
Result<HeaderSearch> header_search(const CsvReadOptions& o) {
    HeaderSearch hs;
    for (const CsvColumnMapping& m : o.column_map) hs.mapped.push_back(text::normalise_name(m.source));
    for (const CsvSetting& x : o.settings) {
        if (text::lower(text::trim(x.key)) != "skip-lines") continue;
        const std::string v(text::trim(x.value));
        long n = -1;
        const auto r = std::from_chars(v.data(), v.data() + v.size(), n);
        if (r.ec != std::errc() || r.ptr != v.data() + v.size() || n < 0 || n > 100000000)
            return at_origin(x.origin, "the assumed metadata",
                             "skip-lines: expected a whole number of lines from 0 to 100000000, found " + text::quote_found(v));
        hs.skip = n;
    }
    return hs;
}

// ---- Stage: column map ----

// The map as normalised (source, target) pairs; a target that is no schema column, or a source
// named twice, is refused at its origin.
Result<std::vector<std::pair<std::string, std::string>>> normalised_map(const std::vector<CsvColumnMapping>& map) {
    std::vector<std::pair<std::string, std::string>> out;
    for (std::size_t m = 0; m < map.size(); ++m) {
        const CsvColumnMapping& e = map[m];
        std::string src = text::normalise_name(e.source), dst = text::normalise_name(e.target);
        if (dst != "ignore" && column_role(dst) < 0)
            return at_origin(e.origin, "the column map",
                             "expected a schema column name or \"ignore\" after \"" + e.source + "=\", found " +
                                 text::quote_found(e.target));
        for (std::size_t j = 0; j < out.size(); ++j)
            if (out[j].first == src)
                return at_origin(e.origin, "the column map",
                                 "expected each source column once, found " + text::quote_found(e.source) +
                                     " again (as \"" + out[j].second + "\" from " +
                                     origin_text(map[j].origin, "the column map") + ", then as \"" + dst + "\")");
        out.emplace_back(std::move(src), std::move(dst));
    }
    return out;
}

// Roles of the header cells through the column map; unknown, empty and repeated names are
// refused at their column, map entries that match no column at their origin.
Status map_columns(const HeaderCells& h, const CsvReadOptions& o, Layout& L, const std::string& file) {
    auto map = normalised_map(o.column_map);
    if (!map) return map.error();
    std::vector<bool> used(map->size(), false);
    L.cells = int(h.text.size());
    L.role.assign(h.text.size(), c_ignore);
    L.header_column = h.column;
    L.header_text.clear();
    for (std::string_view t : h.text) L.header_text.emplace_back(text::trim(t));
    L.column_of.fill(-1);
    for (std::size_t k = 0; k < h.text.size(); ++k) {
        std::string n = text::normalise_name(h.text[k]);
        if (n.empty()) return Error{file, L.header_line, h.column[k], "expected a column name, found an empty cell"};
        bool mapped = false;
        for (std::size_t m = 0; m < map->size() && !mapped; ++m)
            if ((*map)[m].first == n) {
                used[m] = true;
                n = (*map)[m].second;
                mapped = true;
            }
        if (n == "ignore" && mapped) continue;
        const int r = column_role(n);
        if (r < 0) {
            std::string list;
            for (int j = 0; j < c_count; ++j) list += std::string(j ? ", " : "") + names[j];
            return Error{file, L.header_line, h.column[k],
                         "expected a schema column name (" + list + ") or a column map entry for it, found unknown column " +
                             text::quote_found(h.text[k])};
        }
        if (L.column_of[std::size_t(r)] >= 0)
            return Error{file, L.header_line, h.column[k],
                         std::string("expected each column once, found \"") + names[r] + "\" again (first in column " +
                             std::to_string(h.column[std::size_t(L.column_of[std::size_t(r)])]) + ")"};
        L.column_of[std::size_t(r)] = int(k);
        L.role[k] = r;
        if (n.rfind("e_az_", 0) == 0 || n.rfind("e_el_", 0) == 0) L.positioner_components = true;
    }
    for (std::size_t m = 0; m < map->size(); ++m)
        if (!used[m])
            return Error{file, L.header_line, 0,
                         origin_text(o.column_map[m].origin, "the column map") + ": expected a column named \"" +
                             o.column_map[m].source + "\" in the header row, found none"};
    return Ok{};
}

// ---- Stage: angles ----

Status choose_angles(Layout& L, const std::string& file) {
    auto has = [&](int r) { return L.column_of[std::size_t(r)] >= 0; };
    const bool tp = has(c_theta) || has(c_phi), ae = has(c_azimuth) || has(c_elevation);
    if (tp && ae)
        return Error{file, L.header_line, L.header_column[std::size_t(L.column_of[has(c_azimuth) ? c_azimuth : c_elevation])],
                     "expected theta/phi or azimuth/elevation angle columns, found both kinds"};
    if (!tp && !ae)
        return Error{file, L.header_line, 1, "expected angle columns theta and phi (or azimuth and elevation), found neither"};
    L.az_el = ae;
    L.angles = ae ? AngleSystem::horizon : AngleSystem::theta_phi;
    const int a1 = ae ? c_azimuth : c_theta, a2 = ae ? c_elevation : c_phi;
    if (!has(a1) || !has(a2))
        return Error{file, L.header_line, 1,
                     std::string("expected a column \"") + names[has(a1) ? a2 : a1] + "\" beside \"" +
                         names[has(a1) ? a1 : a2] + "\", found none"};
    L.frequency_column = has(c_frequency);
    L.last_angle_cell = std::max(L.column_of[std::size_t(a1)], L.column_of[std::size_t(a2)]);
    if (L.frequency_column) L.last_angle_cell = std::max(L.last_angle_cell, L.column_of[c_frequency]);
    return Ok{};
}

// ---- Stage: family ----

struct Group {
    CsvFamily family;
    int cols[4];
    int n;
};
constexpr Group groups[] = {
    {CsvFamily::complex, {c_e_theta_re, c_e_theta_im, c_e_phi_re, c_e_phi_im}, 4},
    {CsvFamily::theta_phi_polar, {c_e_theta_db, c_e_theta_phase, c_e_phi_db, c_e_phi_phase}, 4},
    {CsvFamily::circular_polar, {c_e_rhcp_db, c_e_rhcp_phase, c_e_lhcp_db, c_e_lhcp_phase}, 4},
    {CsvFamily::ludwig3_polar, {c_e_co_db, c_e_co_phase, c_e_cross_db, c_e_cross_phase}, 4},
    {CsvFamily::total_db, {c_e_total_db, 0, 0, 0}, 1},
};

// The part of a family's basis that its first (or second) component alone is.
FieldPart part_of(CsvFamily f, bool first) {
    switch (f) {
        case CsvFamily::circular_polar: return first ? FieldPart::rhcp : FieldPart::lhcp;
        case CsvFamily::ludwig3_polar: return first ? FieldPart::co : FieldPart::cross;
        default: return first ? FieldPart::theta : FieldPart::phi;
    }
}

// Exactly one family of field columns, complete (e_theta_db with e_phi_db alone is magnitudes).
Status choose_family(Layout& L, const std::string& file) {
    auto has = [&](int r) { return L.column_of[std::size_t(r)] >= 0; };
    auto col_of = [&](int r) { return L.header_column[std::size_t(L.column_of[std::size_t(r)])]; };
    const Group* found = nullptr;
    int found_first = -1;
    for (const Group& g : groups) {
        int first = -1;
        for (int j = 0; j < g.n; ++j)
            if (has(g.cols[j]) && (first < 0 || L.column_of[std::size_t(g.cols[j])] < L.column_of[std::size_t(first)]))
                first = g.cols[j];
        if (first < 0) continue;
        if (found) {
            const bool later = L.column_of[std::size_t(first)] > L.column_of[std::size_t(found_first)];
            return Error{file, L.header_line, col_of(later ? first : found_first),
                         "expected one field family per file, found two: " + column_label(L, found_first) + " and " +
                             column_label(L, first)};
        }
        found = &g;
        found_first = first;
    }
    if (!found)
        return Error{file, L.header_line, 1,
                     "expected field columns of one family (e_theta_re/e_theta_im/e_phi_re/e_phi_im, "
                     "e_theta_db/e_theta_phase/e_phi_db/e_phi_phase, e_rhcp_..., e_co_..., e_theta_db/e_phi_db "
                     "or e_total_db), found none"};
    L.family = found->family;
    const bool magnitudes = L.family == CsvFamily::theta_phi_polar && !has(c_e_theta_phase) && !has(c_e_phi_phase);
    if (magnitudes) L.family = CsvFamily::magnitude_db;
    if (found->n == 4) {
        // Each component is a pair of columns (re/im, dB/phase; a dB column alone for
        // magnitudes). One component alone is one polarisation part of a split field.
        auto present = [&](int j) { return has(found->cols[j]) || (!magnitudes && has(found->cols[j + 1])); };
        const bool first = present(0), second = present(2);
        if (first != second) L.part = part_of(L.family, first);
        for (int j = 0; j < 4; ++j)
            if (!has(found->cols[j]) && present(j & 2) && !(magnitudes && (j & 1)))
                return Error{file, L.header_line, 1,
                             "expected a column " + column_label(L, found->cols[j]) + " beside " +
                                 column_label(L, found_first) + ", found none"};
    }
    return Ok{};
}

// ---- Stage: settings (metadata given outside the file replaces the file's) ----

Status apply_settings(const std::vector<CsvSetting>& settings, std::vector<Meta>& meta) {
    std::array<int, n_keys> given;
    given.fill(-1);
    for (std::size_t s = 0; s < settings.size(); ++s) {
        const CsvSetting& x = settings[s];
        const int k = metadata_key(text::lower(text::trim(x.key)), true);
        if (k < 0)
            return at_origin(x.origin, "the assumed metadata",
                             "expected a metadata key (quantity, time-convention, angle-unit, phase-unit, "
                             "frequency-unit, frequency, ludwig3-reference, name, source, note, mounting-up, mounting-turns, angles, sampling, part, skip-lines, duplicate-tolerance), found " +
                                 text::quote_found(x.key));
        if (given[std::size_t(k)] >= 0)
            return at_origin(x.origin, "the assumed metadata",
                             std::string("expected metadata \"") + meta_keys[k] + "\" once, found it again (first from " +
                                 origin_text(settings[std::size_t(given[std::size_t(k)])].origin, "the assumed metadata") +
                                 ")");
        given[std::size_t(k)] = int(s);
    }
    meta.erase(std::remove_if(meta.begin(), meta.end(), [&](const Meta& m) { return given[std::size_t(m.key)] >= 0; }),
               meta.end());
    for (const CsvSetting& x : settings) {
        CsvOrigin o = x.origin;
        if (o.name.empty()) o.name = "the assumed metadata";
        meta.push_back(Meta{metadata_key(text::lower(text::trim(x.key)), true), std::string(text::trim(x.value)), false, 0,
                            0, std::move(o)});
    }
    return Ok{};
}

// ---- Stage: metadata values ----

Error bad_meta(const TextSource& src, const std::string& file, const Meta& m, const std::string& msg) {
    if (!m.from_file) return Error{m.origin.name, m.origin.line, 0, msg};
    return Error{file, src.line_number_at(m.line_offset), m.column, msg};
}

// The frequency metadata: "2.45e9", or with a unit: "2.45 GHz".
Status frequency_value(const TextSource& src, const std::string& file, const Meta& m, Layout& L) {
    auto bad = [&](const std::string& msg) { return bad_meta(src, file, m, msg); };
    if (L.frequency_column)
        return bad("frequency: expected either a frequency column or a frequency metadata line, found both (column " +
                   std::to_string(L.header_column[std::size_t(L.column_of[c_frequency])]) + " of line " +
                   std::to_string(L.header_line) + ")");
    auto f = parse_frequency_text(m.value, L.hz_per_unit, true);
    if (!f) return bad("frequency: " + f.error().message);
    L.frequency_hz = *f;
    return Ok{};
}

// The file's own mounting (pattern/mounting.hpp): "mounting-up: +x", "mounting-turns: z:30,x:10".
Status mounting_value(const TextSource& src, const std::string& file, const Meta& m, const std::string& key, Layout& L) {
    if (key == "mounting-up") {
        auto up = parse_up(m.value);
        if (!up) return bad_meta(src, file, m, key + ": " + up.error().message);
        L.mounting.up = *up;
    } else if (key == "mounting-turns") {
        auto turns = parse_turns(m.value);
        if (!turns) return bad_meta(src, file, m, key + ": " + turns.error().message);
        L.mounting.turns = *turns;
    }
    return Ok{};
}

// duplicate-tolerance: "2 %", "2%" or "0.02" (a share of the larger field vector, 0..1).
bool tolerance_value(const std::string& text, double& out) {
    std::string_view t = text::trim(text);
    const bool percent = !t.empty() && t.back() == '%';
    if (percent) t = text::trim(t.substr(0, t.size() - 1));
    double v = 0;
    const auto r = std::from_chars(t.data(), t.data() + t.size(), v);
    if (r.ec != std::errc() || r.ptr != t.data() + t.size() || !std::isfinite(v)) return false;
    if (percent) v /= 100;
    if (!(v >= 0 && v <= 1)) return false;
    out = v;
    return true;
}

// The angle system (docs/far-field-csv.md, "Angle layouts"): theta-phi for theta/phi columns;
// horizon, az-over-el or el-over-az for azimuth/elevation columns.
template <class Bad>
Status angle_system(Layout& L, const std::string& v, Bad&& bad) {
    if (!L.az_el) {
        if (v != "theta-phi") return bad("theta-phi for theta and phi columns (az-over-el, el-over-az and horizon need azimuth and elevation columns)");
        L.angles = AngleSystem::theta_phi;
    } else if (v == "horizon") L.angles = AngleSystem::horizon;
    else if (v == "az-over-el") L.angles = AngleSystem::az_over_el;
    else if (v == "el-over-az") L.angles = AngleSystem::el_over_az;
    else return bad("horizon, az-over-el or el-over-az for azimuth and elevation columns (theta-phi needs theta and phi columns)");
    return Ok{};
}

// The field columns a positioner grid needs: in its own unit vectors (e_az_*, e_el_*), or the
// circular or total families, which need no basis of their own; e_az/e_el only there.
Status positioner_fields(const Layout& L, const std::string& file) {
    const bool positioner = L.angles == AngleSystem::az_over_el || L.angles == AngleSystem::el_over_az;
    const long col = L.header_column.empty() ? 1 : L.header_column[0];
    if (!positioner && L.positioner_components)
        return Error{file, L.header_line, col,
                     "expected e_az_/e_el_ field columns only with \"angles: az-over-el\" or \"angles: el-over-az\", found them "
                     "without"};
    if (positioner && L.part != FieldPart::whole && L.family != CsvFamily::circular_polar)
        return Error{file, L.header_line, col,
                     "expected both field components of a positioner grid (a part in its own unit vectors is not a "
                     "part of the theta/phi basis), found one component only"};
    if (!positioner || L.family == CsvFamily::circular_polar || L.family == CsvFamily::total_db) return Ok{};
    if (L.family == CsvFamily::magnitude_db || L.family == CsvFamily::ludwig3_polar)
        return Error{file, L.header_line, col,
                     std::string("expected complex, dB/phase (e_az_*, e_el_*), circular or total field columns for a positioner "
                                 "grid, found the ") + to_string(L.family) +
                         " family (" + (L.family == CsvFamily::magnitude_db ? "without phase the field cannot be turned onto theta/phi"
                                                                             : "convert it to theta/phi first") + ")"};
    if (!L.positioner_components)
        return Error{file, L.header_line, col,
                     "expected the field of a positioner grid in its own unit vectors (e_az_re, e_az_im, e_el_re, e_el_im or "
                     "e_az_db, e_az_phase, e_el_db, e_el_phase), found theta/phi field columns"};
    return Ok{};
}

// "part: co": the file holds one polarisation part, the other columns zero (far_field.hpp,
// FieldPart). Columns of one part only must name the same part.
Status part_value(const TextSource& src, const std::string& file, const Meta& m, Layout& L) {
    const std::string v = text::lower(m.value);
    FieldPart p = FieldPart::whole;
    for (FieldPart q : {FieldPart::theta, FieldPart::phi, FieldPart::rhcp, FieldPart::lhcp, FieldPart::co, FieldPart::cross})
        if (v == csv_part_name(q)) p = q;
    if (p == FieldPart::whole)
        return bad_meta(src, file, m, "part: expected theta, phi, rhcp, lhcp, co or cross, found " + text::quote_found(m.value));
    if (L.part != FieldPart::whole && L.part != p)
        return bad_meta(src, file, m,
                        std::string("part: expected ") + csv_part_name(L.part) + " (the columns hold the " + to_string(L.part) +
                            " part only), found " + text::quote_found(m.value));
    L.part = p;
    return Ok{};
}

Status metadata_values(const TextSource& src, const std::string& file, const std::vector<Meta>& meta, Layout& L) {
    std::optional<double> phase_unit;
    const Meta* freq = nullptr;
    for (const Meta& m : meta) {
        const std::string key = meta_keys[m.key];
        auto bad = [&](const std::string& expected) {
            return bad_meta(src, file, m, key + ": expected " + expected + ", found " + text::quote_found(m.value));
        };
        const std::string v = text::lower(m.value);
        if (key == "quantity") {
            if (v == "gain") L.quantity = Quantity::gain;
            else if (v == "directivity") L.quantity = Quantity::directivity;
            else if (v == "relative") L.quantity = Quantity::relative;
            else return bad("gain, directivity or relative");
        } else if (key == "time-convention") {
            if (v != "+jwt" && v != "-iwt") return bad("+jwt or -iwt");
            L.minus_iwt = v == "-iwt";
        } else if (key == "angle-unit" || key == "phase-unit") {
            if (v != "deg" && v != "rad") return bad("deg or rad");
            const double deg_per_unit = v == "deg" ? 1.0 : 180.0 / pi;
            if (key == "angle-unit") L.angle_to_deg = deg_per_unit;
            else phase_unit = deg_per_unit;
        } else if (key == "frequency-unit") {
            auto hz = frequency_unit_hz(m.value);
            if (!hz) return bad(frequency_units_text);
            L.hz_per_unit = *hz;
        } else if (key == "frequency") {
            freq = &m;
        } else if (key == "ludwig3-reference") {
            if (v != "x" && v != "y") return bad("x or y");
            L.ludwig3_reference = v == "x" ? Ludwig3Reference::x : Ludwig3Reference::y;
        } else if (key == "name") L.name = m.value;
        else if (key == "source") L.source = m.value;
        else if (key == "note") L.note += (L.note.empty() ? "" : "\n") + m.value;
        else if (key == "angles") {
            if (Status st = angle_system(L, v, bad); !st) return st;
        } else if (key == "duplicate-tolerance") {
            if (!tolerance_value(m.value, L.duplicate_tolerance)) return bad("a share of the field from 0 to 100 %, such as 2 % or 0.02");
        } else if (key == "part") {
            if (Status st = part_value(src, file, m, L); !st) return st;
        } else if (key == "sampling") {
            if (v != "surface" && v != "cuts") return bad("surface or cuts");
            L.sampling = v == "cuts" ? Sampling::cuts : Sampling::surface;
        } else if (Status st = mounting_value(src, file, m, key, L); !st) return st;
    }
    L.phase_to_rad = (phase_unit ? *phase_unit : L.angle_to_deg) * (pi / 180.0);
    if (freq)
        if (Status st = frequency_value(src, file, *freq, L); !st) return st;
    if (Status st = positioner_fields(L, file); !st) return st;
    if (L.family == CsvFamily::ludwig3_polar && !L.ludwig3_reference) {
        // The family's first column in the file (a file of the cross-polar part alone has no e_co_db).
        const int col = L.column_of[c_e_co_db] >= 0 ? L.column_of[c_e_co_db] : L.column_of[c_e_cross_db];
        return Error{file, L.header_line, col >= 0 ? L.header_column[std::size_t(col)] : 1,
                     "the e_co/e_cross family: expected a metadata line \"# ludwig3-reference: x\" (or y) before the "
                     "header, found none"};
    }
    return Ok{};
}

// ---- Stage: scale and offset ----

Status adjustments(const std::vector<CsvAdjustment>& list, const char* unnamed, std::array<double, c_count>& out,
                   bool& any) {
    std::array<int, c_count> given;
    given.fill(-1);
    for (std::size_t k = 0; k < list.size(); ++k) {
        const CsvAdjustment& a = list[k];
        const int r = column_role(text::normalise_name(a.column));
        if (r < 0) return at_origin(a.origin, unnamed, "expected a schema column name, found " + text::quote_found(a.column));
        if (!std::isfinite(a.value))
            return at_origin(a.origin, unnamed, "expected a finite number for " + text::quote_found(a.column));
        if (given[std::size_t(r)] >= 0)
            return at_origin(a.origin, unnamed,
                             std::string("expected each column once, found \"") + names[r] + "\" again (first from " +
                                 origin_text(list[std::size_t(given[std::size_t(r)])].origin, unnamed) + ")");
        given[std::size_t(r)] = int(k);
        out[std::size_t(r)] = a.value;
        any = true;
    }
    return Ok{};
}

}  // namespace

const char* column_name(int role) { return role >= 0 && role < c_count ? names[role] : "ignore"; }

std::string column_label(const Layout& L, int role) {
    std::string schema = column_name(role);
    if (L.positioner_components)
        for (const auto& [name, r] : positioner_names)
            if (r == role) schema = name;
    const int cell = role >= 0 && role < c_count ? L.column_of[std::size_t(role)] : -1;
    const std::string written = cell >= 0 && std::size_t(cell) < L.header_text.size() ? L.header_text[std::size_t(cell)] : "";
    if (written.empty() || text::normalise_name(written) == schema) return "\"" + schema + "\"";
    return text::quote_found(written) + " (" + schema + ")";
}

int column_role(std::string_view n) {
    for (int k = 0; k < c_count; ++k)
        if (n == names[k]) return k;
    for (const auto& [name, role] : positioner_names)
        if (n == name) return role;
    return -1;
}

int metadata_key(std::string_view k, bool settings_too) {
    for (int i = 0; i < (settings_too ? n_keys : n_file_keys); ++i)
        if (k == meta_keys[i]) return i;
    return -1;
}

Error to_error(const TextSource& src, const std::string& file, const Failure& f) {
    if (f.io) return Error{file, 0, 0, f.message};
    return Error{file, src.line_number_at(f.line_offset), f.column, f.message};
}

Result<Layout> read_layout(const TextSource& src, const std::string& file, const CsvReadOptions& o) {
    auto search = header_search(o);
    if (!search) return search.error();
    auto head = read_head(src, file, *search);
    if (!head) return head.error();
    Layout L;
    L.skipped_lines = head->skipped;
    L.header_offset = head->header_offset;
    L.data_offset = head->data_offset;
    L.header_line = src.line_number_at(L.header_offset);
    auto delimiter = detect_delimiter(head->header, file, L.header_line);
    if (!delimiter) return delimiter.error();
    L.delimiter = *delimiter;
    L.decimal_comma = L.delimiter != ',';
    auto cells = split_header(head->header, L, file);
    if (!cells) return cells.error();
    if (Status st = map_columns(*cells, o, L, file); !st) return st.error();
    if (Status st = choose_angles(L, file); !st) return st.error();
    if (Status st = choose_family(L, file); !st) return st.error();
    if (Status st = apply_settings(o.settings, head->meta); !st) return st.error();
    if (Status st = metadata_values(src, file, head->meta, L); !st) return st.error();
    L.scale.fill(1.0);
    L.offset.fill(0.0);
    if (Status st = adjustments(o.scale, "the scale", L.scale, L.transform); !st) return st.error();
    if (Status st = adjustments(o.offset, "the offset", L.offset, L.transform); !st) return st.error();
    return L;
}

}  // namespace ellipsa::csv
