// Metadata lines, header row and column map of the far-field CSV schema.
#include "importers/csv_layout.hpp"

#include <algorithm>
#include <cstring>

namespace ellipsa::csv {

namespace {

constexpr const char* names[c_count] = {
    "frequency",     "theta",        "phi",           "azimuth",      "elevation",
    "e_theta_re",    "e_theta_im",   "e_phi_re",      "e_phi_im",
    "e_theta_db",    "e_theta_phase", "e_phi_db",     "e_phi_phase",
    "e_rhcp_db",     "e_rhcp_phase", "e_lhcp_db",     "e_lhcp_phase",
    "e_co_db",       "e_co_phase",   "e_cross_db",    "e_cross_phase",
    "e_total_db"};

std::string_view trim(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '\r')) s.remove_suffix(1);
    return s;
}

std::string lower(std::string_view s) {
    std::string o(s);
    for (char& c : o)
        if (c >= 'A' && c <= 'Z') c = char(c - 'A' + 'a');
    return o;
}

struct Meta {
    std::string key, value;
    std::string origin;  // empty: the file itself
    std::size_t line_offset = 0;
    long column = 0;
    long origin_line = 0;
};

bool is_meta_key(std::string_view k) {
    static const char* keys[] = {"quantity", "time-convention", "angle-unit", "frequency-unit", "frequency",
                                 "ludwig3-reference", "name", "source", "note"};
    for (const char* x : keys)
        if (k == x) return true;
    return false;
}

bool parse_unit_hz(std::string_view u, double& hz) {
    std::string l = lower(trim(u));
    if (l == "hz") hz = 1;
    else if (l == "khz") hz = 1e3;
    else if (l == "mhz") hz = 1e6;
    else if (l == "ghz") hz = 1e9;
    else return false;
    return true;
}

}  // namespace

const char* column_name(int role) { return role >= 0 && role < c_count ? names[role] : "ignore"; }

int column_role(std::string_view n) {
    for (int k = 0; k < c_count; ++k)
        if (n == names[k]) return k;
    return -1;
}

std::string normalise_name(std::string_view s) {
    s = trim(s);
    if (s.size() >= 2 && s.front() == '"' && s.back() == '"') s = trim(s.substr(1, s.size() - 2));
    return lower(s);
}

std::string quote_found(std::string_view s) {
    std::string o = "\"";
    std::size_t n = 0;
    for (unsigned char c : s) {
        if (++n > 40) {
            o += "...";
            break;
        }
        if (c < 0x20 || c == 0x7f) {
            char b[8];
            std::snprintf(b, sizeof b, "\\x%02X", c);
            o += b;
        } else {
            o += char(c);
        }
    }
    return o + "\"";
}

long line_number_at(std::string_view text, std::size_t offset) {
    offset = std::min(offset, text.size());
    long n = 1;
    const char* p = text.data();
    const char* e = p + offset;
    while (p < e) {
        const void* q = std::memchr(p, '\n', std::size_t(e - p));
        if (!q) break;
        ++n;
        p = static_cast<const char*>(q) + 1;
    }
    return n;
}

Error to_error(std::string_view text, const std::string& file, const Failure& f) {
    if (f.line_offset == std::size_t(-1)) return Error{file, 0, 0, f.message};
    return Error{file, line_number_at(text, f.line_offset), f.column, f.message};
}

Result<Layout> read_layout(std::string_view text, const std::string& file, const CsvReadOptions& o) {
    Layout L;
    auto fail = [&](std::size_t off, long col, std::string msg) -> Error {
        return Error{file, line_number_at(text, off), col, std::move(msg)};
    };
    std::size_t pos = 0;
    if (text.size() >= 3 && std::memcmp(text.data(), "\xEF\xBB\xBF", 3) == 0) pos = 3;
    std::vector<Meta> meta;
    bool have_header = false;
    std::string_view header;
    while (pos < text.size()) {
        const std::size_t start = pos;
        std::size_t nl = text.find('\n', pos);
        std::string_view line = text.substr(pos, nl == std::string_view::npos ? std::string_view::npos : nl - pos);
        pos = nl == std::string_view::npos ? text.size() : nl + 1;
        if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
        if (const std::size_t z = line.find('\0'); z != std::string_view::npos)
            return fail(start, long(z) + 1, "expected text, found a NUL byte (a binary file?)");
        const std::size_t first = line.find_first_not_of(" \t,;");
        if (first == std::string_view::npos) continue;  // blank
        if (line[first] == '#') {
            std::string_view body = line.substr(first + 1);
            std::size_t colon = body.find(':');
            if (colon == std::string_view::npos) continue;
            std::string key = lower(trim(body.substr(0, colon)));
            if (!is_meta_key(key)) continue;  // a comment
            std::string_view v = body.substr(colon + 1);
            std::size_t lead = 0;
            while (lead < v.size() && (v[lead] == ' ' || v[lead] == '\t')) ++lead;
            const long col = long(line.data() + (first + 1 + colon + 1 + lead) - text.data() - start) + 1;
            Meta m{key, std::string(trim(v)), "", start, col, 0};
            for (const Meta& x : meta)
                if (x.key == key && key != "note")
                    return fail(start, 1, "expected metadata \"" + key + "\" once, found it again (first on line " +
                                              std::to_string(line_number_at(text, x.line_offset)) + ")");
            meta.push_back(std::move(m));
            continue;
        }
        L.header_offset = start;
        L.data_offset = pos;
        header = line;
        have_header = true;
        break;
    }
    if (!have_header) {
        // Never guess at binary garbage: say what we saw.
        if (text.empty()) return Error{file, 0, 0, "expected a header row, found an empty file"};
        return Error{file, 0, 0, "expected a header row, found only blank, comment or metadata lines"};
    }
    const long header_line = line_number_at(text, L.header_offset);
    auto hfail = [&](long col, std::string msg) { return Error{file, header_line, col, std::move(msg)}; };

    // Delimiter: the most frequent of tab, semicolon, comma outside quotes.
    {
        std::size_t n_comma = 0, n_semi = 0, n_tab = 0;
        bool q = false;
        for (char c : header) {
            if (c == '"') q = !q;
            else if (!q) {
                if (c == ',') ++n_comma;
                else if (c == ';') ++n_semi;
                else if (c == '\t') ++n_tab;
            }
        }
        if (n_comma == 0 && n_semi == 0 && n_tab == 0) {
            for (unsigned char c : header)
                if (c < 0x20 && c != '\t') return hfail(1, "expected a text header row, found binary data " + quote_found(header));
            return hfail(1, "expected a header row with columns separated by comma, semicolon or tab, found " +
                                quote_found(header));
        }
        L.delimiter = n_tab >= n_semi && n_tab >= n_comma ? '\t' : n_semi >= n_comma ? ';' : ',';
        L.decimal_comma = L.delimiter != ',';
    }
    // Split the header (quotes may hold a delimiter).
    std::vector<std::string_view> cells;
    std::vector<long> cols;
    {
        std::size_t a = 0;
        bool q = false;
        for (std::size_t k = 0; k <= header.size(); ++k) {
            if (k < header.size() && header[k] == '"') q = !q;
            if (k == header.size() || (!q && header[k] == L.delimiter)) {
                cells.push_back(header.substr(a, k - a));
                cols.push_back(long(a) + 1);
                a = k + 1;
            }
        }
        while (!cells.empty() && normalise_name(cells.back()).empty()) {
            cells.pop_back();
            cols.pop_back();
        }
    }
    if (cells.empty()) return hfail(1, "expected a header row naming the columns, found only empty cells");
    {
        // A header that is a row of numbers: the header was forgotten.
        double v;
        NumberStatus st;
        std::string_view c0 = cells.front();
        parse_number_cell(c0.data(), c0.data() + c0.size(), L.delimiter, L.decimal_comma, v, st);
        if (st == NumberStatus::ok)
            return hfail(cols[0], "expected a header row naming the columns, found a row of numbers");
    }
    // Column map: normalised source -> target.
    std::vector<std::pair<std::string, std::string>> map;
    std::vector<bool> map_used;
    for (const auto& [src, dst] : o.column_map) {
        std::string t = normalise_name(dst);
        if (t != "ignore" && column_role(t) < 0)
            return Error{"--map", 0, 0, "expected a schema column name or \"ignore\" after \"" + src + "=\", found \"" +
                                            dst + "\""};
        map.emplace_back(normalise_name(src), t);
        map_used.push_back(false);
    }
    L.cells = int(cells.size());
    L.role.assign(cells.size(), c_ignore);
    L.header_column = cols;
    L.column_of.fill(-1);
    for (std::size_t k = 0; k < cells.size(); ++k) {
        std::string n = normalise_name(cells[k]);
        if (n.empty()) return hfail(cols[k], "expected a column name, found an empty cell");
        bool mapped = false;
        for (std::size_t m = 0; m < map.size(); ++m)
            if (map[m].first == n) {
                map_used[m] = true;
                n = map[m].second;
                mapped = true;
                break;
            }
        if (n == "ignore" && mapped) continue;
        const int r = column_role(n);
        if (r < 0) {
            std::string list;
            for (int j = 0; j < c_count; ++j) list += std::string(j ? ", " : "") + names[j];
            return hfail(cols[k], "expected a schema column name (" + list +
                                      ") or a --map entry for it, found unknown column " + quote_found(cells[k]));
        }
        if (L.column_of[std::size_t(r)] >= 0)
            return hfail(cols[k], std::string("expected each column once, found \"") + names[r] +
                                      "\" again (first in column " +
                                      std::to_string(cols[std::size_t(L.column_of[std::size_t(r)])]) + ")");
        L.column_of[std::size_t(r)] = int(k);
        L.role[k] = r;
    }
    for (std::size_t m = 0; m < map.size(); ++m)
        if (!map_used[m])
            return Error{file, header_line, 0, "--map: expected a column named \"" + o.column_map[m].first +
                                                   "\" in the header row, found none"};
    auto has = [&](int r) { return L.column_of[std::size_t(r)] >= 0; };
    auto col_of = [&](int r) { return cols[std::size_t(L.column_of[std::size_t(r)])]; };

    // Angles.
    const bool tp = has(c_theta) || has(c_phi), ae = has(c_azimuth) || has(c_elevation);
    if (tp && ae)
        return hfail(col_of(has(c_azimuth) ? c_azimuth : c_elevation),
                     "expected theta/phi or azimuth/elevation angle columns, found both kinds");
    if (!tp && !ae) return hfail(1, "expected angle columns theta and phi (or azimuth and elevation), found neither");
    L.az_el = ae;
    const int a1 = ae ? c_azimuth : c_theta, a2 = ae ? c_elevation : c_phi;
    if (!has(a1) || !has(a2))
        return hfail(1, std::string("expected a column \"") + names[has(a1) ? a2 : a1] + "\" beside \"" +
                            names[has(a1) ? a1 : a2] + "\", found none");
    L.frequency_column = has(c_frequency);
    L.last_angle_cell = std::max(L.column_of[std::size_t(a1)], L.column_of[std::size_t(a2)]);
    if (L.frequency_column) L.last_angle_cell = std::max(L.last_angle_cell, L.column_of[c_frequency]);

    // Field family: exactly one.
    struct Group {
        CsvFamily family;
        int cols[4];
        int n;
    };
    const Group groups[] = {
        {CsvFamily::complex, {c_e_theta_re, c_e_theta_im, c_e_phi_re, c_e_phi_im}, 4},
        {CsvFamily::theta_phi_polar, {c_e_theta_db, c_e_theta_phase, c_e_phi_db, c_e_phi_phase}, 4},
        {CsvFamily::circular_polar, {c_e_rhcp_db, c_e_rhcp_phase, c_e_lhcp_db, c_e_lhcp_phase}, 4},
        {CsvFamily::ludwig3_polar, {c_e_co_db, c_e_co_phase, c_e_cross_db, c_e_cross_phase}, 4},
        {CsvFamily::total_db, {c_e_total_db, 0, 0, 0}, 1},
    };
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
            const int shown = later ? first : found_first;
            return hfail(cols[std::size_t(L.column_of[std::size_t(shown)])],
                         std::string("expected one field family per file, found two: \"") + names[found_first] +
                             "\" and \"" + names[first] + "\"");
        }
        found = &g;
        found_first = first;
    }
    if (!found)
        return hfail(1,
                     "expected field columns of one family (e_theta_re/e_theta_im/e_phi_re/e_phi_im, "
                     "e_theta_db/e_theta_phase/e_phi_db/e_phi_phase, e_rhcp_..., e_co_..., e_theta_db/e_phi_db "
                     "or e_total_db), found none");
    L.family = found->family;
    if (L.family == CsvFamily::theta_phi_polar && !has(c_e_theta_phase) && !has(c_e_phi_phase) && has(c_e_theta_db) &&
        has(c_e_phi_db))
        L.family = CsvFamily::magnitude_db;
    if (L.family != CsvFamily::magnitude_db)
        for (int j = 0; j < found->n; ++j)
            if (!has(found->cols[j]))
                return hfail(1, std::string("expected a column \"") + names[found->cols[j]] + "\" beside \"" +
                                    names[found_first] + "\", found none");

    // Metadata: the file's, then settings given outside it.
    for (const CsvSetting& s : o.settings) {
        std::string k = lower(trim(s.key));
        if (!is_meta_key(k) && k != "phase-unit")
            return Error{s.origin, s.line, 0, "expected a metadata key (quantity, time-convention, angle-unit, "
                                              "phase-unit, frequency-unit, frequency, ludwig3-reference, name, "
                                              "source, note), found \"" + s.key + "\""};
        meta.erase(std::remove_if(meta.begin(), meta.end(), [&](const Meta& m) { return m.key == k; }), meta.end());
        meta.push_back(Meta{k, std::string(trim(s.value)), s.origin.empty() ? "--assume" : s.origin, 0, 0, s.line});
    }
    std::optional<double> phase_unit;
    std::string freq_text;
    const Meta* freq_meta = nullptr;
    for (const Meta& m : meta) {
        auto bad = [&](const std::string& expected) -> Error {
            std::string msg = m.key + ": expected " + expected + ", found " + quote_found(m.value);
            if (!m.origin.empty()) return Error{m.origin, m.origin_line, 0, msg};
            return fail(m.line_offset, m.column, msg);
        };
        const std::string v = lower(m.value);
        if (m.key == "quantity") {
            if (v == "gain") L.quantity = Quantity::gain;
            else if (v == "directivity") L.quantity = Quantity::directivity;
            else if (v == "relative") L.quantity = Quantity::relative;
            else return bad("gain, directivity or relative");
        } else if (m.key == "time-convention") {
            if (v == "+jwt") L.minus_iwt = false;
            else if (v == "-iwt") L.minus_iwt = true;
            else return bad("+jwt or -iwt");
        } else if (m.key == "angle-unit" || m.key == "phase-unit") {
            double f;
            if (v == "deg") f = 1.0;
            else if (v == "rad") f = 180.0 / pi;
            else return bad("deg or rad");
            if (m.key == "angle-unit") L.angle_to_deg = f;
            else phase_unit = f;
        } else if (m.key == "frequency-unit") {
            if (!parse_unit_hz(m.value, L.hz_per_unit)) return bad("Hz, kHz, MHz or GHz");
        } else if (m.key == "frequency") {
            freq_meta = &m;
            freq_text = m.value;
        } else if (m.key == "ludwig3-reference") {
            if (v == "x") L.ludwig3_reference = Ludwig3Reference::x;
            else if (v == "y") L.ludwig3_reference = Ludwig3Reference::y;
            else return bad("x or y");
        } else if (m.key == "name") L.name = m.value;
        else if (m.key == "source") L.source = m.value;
        else if (m.key == "note") L.note += (L.note.empty() ? "" : "\n") + m.value;
    }
    L.phase_to_rad = (phase_unit ? *phase_unit : L.angle_to_deg) * (pi / 180.0);
    if (freq_meta) {
        const Meta& m = *freq_meta;
        auto bad = [&](const std::string& msg) -> Error {
            if (!m.origin.empty()) return Error{m.origin, m.origin_line, 0, msg};
            return fail(m.line_offset, m.column, msg);
        };
        if (L.frequency_column)
            return bad("frequency: expected either a frequency column or a frequency metadata line, found both "
                       "(column " + std::to_string(col_of(c_frequency)) + " of line " + std::to_string(header_line) + ")");
        // "2.45e9", or with a unit: "2.45 GHz".
        std::string_view t = freq_text;
        std::size_t end = t.find_first_of(" \t");
        std::string_view num = t.substr(0, end), unit = end == std::string_view::npos ? "" : trim(t.substr(end));
        double f = 0, hz = L.hz_per_unit;
        NumberStatus st;
        const char* q = parse_number_cell(num.data(), num.data() + num.size(), ';', true, f, st);
        if (st != NumberStatus::ok || q != num.data() + num.size() || !std::isfinite(f) || f < 0 ||
            (!unit.empty() && !parse_unit_hz(unit, hz)))
            return bad("frequency: expected a number >= 0, optionally with Hz, kHz, MHz or GHz, found " +
                       quote_found(freq_text));
        L.frequency_hz = f * hz;
    }
    if (L.family == CsvFamily::ludwig3_polar && !L.ludwig3_reference)
        return hfail(col_of(c_e_co_db), "the e_co/e_cross family: expected a metadata line "
                                         "\"# ludwig3-reference: x\" (or y) before the header, found none");

    // Scale and offset.
    L.scale.fill(1.0);
    L.offset.fill(0.0);
    for (int pass = 0; pass < 2; ++pass)
        for (const auto& [n, v] : pass == 0 ? o.scale : o.offset) {
            const int r = column_role(normalise_name(n));
            const char* opt = pass == 0 ? "--scale" : "--offset";
            if (r < 0) return Error{opt, 0, 0, "expected a schema column name, found \"" + n + "\""};
            if (!std::isfinite(v)) return Error{opt, 0, 0, "expected a finite number for \"" + n + "\""};
            if (pass == 0) L.scale[std::size_t(r)] = v;
            else L.offset[std::size_t(r)] = v;
            L.transform = true;
        }
    return L;
}

}  // namespace ellipsa::csv
