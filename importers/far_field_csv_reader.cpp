// Reader for the neutral far-field CSV schema (first cut: complex family, theta/phi angles).
#include <algorithm>
#include <charconv>
#include <cmath>
#include <fstream>
#include <map>
#include <sstream>

#include "importers/far_field_csv.hpp"

namespace ellipsa {

namespace {

std::string lower_trim(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t' || s.front() == '"')) s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '"' || s.back() == '\r')) s.remove_suffix(1);
    std::string o(s);
    for (char& c : o) c = char(std::tolower(static_cast<unsigned char>(c)));
    return o;
}

bool parse_double(std::string_view s, double& v) {
    while (!s.empty() && s.front() == ' ') s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\r')) s.remove_suffix(1);
    if (!s.empty() && s.front() == '+') s.remove_prefix(1);
    auto r = std::from_chars(s.data(), s.data() + s.size(), v);
    return r.ec == std::errc() && r.ptr == s.data() + s.size() && std::isfinite(v);
}

}  // namespace

Result<FarFieldSet> parse_far_field_csv(std::string_view text, const std::string& name, const CsvReadOptions&) {
    FarFieldSet s;
    s.source = name;
    long line_no = 0;
    std::size_t pos = 0;
    std::vector<std::string> header;
    struct Row {
        double f, t, p;
        cplx et, ep;
        long line;
    };
    std::vector<Row> rows;
    int ci[7] = {-1, -1, -1, -1, -1, -1, -1};
    const char* names[7] = {"frequency", "theta", "phi", "e_theta_re", "e_theta_im", "e_phi_re", "e_phi_im"};
    while (pos < text.size()) {
        std::size_t eol = text.find('\n', pos);
        std::string_view line = text.substr(pos, eol == std::string_view::npos ? std::string_view::npos : eol - pos);
        pos = eol == std::string_view::npos ? text.size() : eol + 1;
        ++line_no;
        if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
        if (line.empty()) continue;
        if (line[0] == '#') {
            std::string_view body = line.substr(1);
            std::size_t colon = body.find(':');
            if (colon == std::string_view::npos) continue;
            std::string key = lower_trim(body.substr(0, colon));
            std::string val(body.substr(colon + 1));
            val = val.substr(std::min(val.find_first_not_of(' '), val.size()));
            if (key == "quantity") {
                if (val == "gain") s.quantity = Quantity::gain;
                else if (val == "directivity") s.quantity = Quantity::directivity;
                else if (val == "relative") s.quantity = Quantity::relative;
                else return Error{name, line_no, 1, "quantity: expected gain, directivity or relative, found \"" + val + "\""};
            } else if (key == "name") s.name = val;
            else if (key == "source") s.source = val;
            else if (key == "note") s.note = val;
            continue;
        }
        std::vector<std::string_view> cells;
        std::size_t a = 0;
        while (true) {
            std::size_t c = line.find(',', a);
            cells.push_back(line.substr(a, c == std::string_view::npos ? std::string_view::npos : c - a));
            if (c == std::string_view::npos) break;
            a = c + 1;
        }
        if (header.empty()) {
            for (std::size_t k = 0; k < cells.size(); ++k) {
                header.push_back(lower_trim(cells[k]));
                for (int n = 0; n < 7; ++n)
                    if (header.back() == names[n]) ci[n] = int(k);
            }
            for (int n = 1; n < 7; ++n)
                if (ci[n] < 0) return Error{name, line_no, 1, std::string("header: expected a column \"") + names[n] + "\""};
            continue;
        }
        if (cells.size() != header.size())
            return Error{name, line_no, 1, "expected " + std::to_string(header.size()) + " cells, found " + std::to_string(cells.size())};
        double v[7] = {0, 0, 0, 0, 0, 0, 0};
        for (int n = 0; n < 7; ++n) {
            if (ci[n] < 0) continue;
            if (!parse_double(cells[std::size_t(ci[n])], v[n])) {
                long col = 1;
                for (int k = 0; k < ci[n]; ++k) col += long(cells[std::size_t(k)].size()) + 1;
                return Error{name, line_no, col, std::string("expected a number in column ") + names[n] + ", found \"" +
                                                     std::string(cells[std::size_t(ci[n])]) + "\""};
            }
        }
        if (v[1] < -1e-9 || v[1] > 180 + 1e-9) return Error{name, line_no, 1, "theta out of range [0, 180]"};
        rows.push_back({v[0], v[1], wrap360(v[2]), cplx(v[3], v[4]), cplx(v[5], v[6]), line_no});
    }
    if (header.empty()) return Error{name, 0, 0, "empty file: expected a header row"};
    if (rows.empty()) return Error{name, 0, 0, "no data rows"};
    std::vector<double> fs, ts, ps;
    for (const Row& r : rows) {
        fs.push_back(r.f);
        ts.push_back(r.t);
        ps.push_back(r.p);
    }
    auto uniq = [](std::vector<double>& x) {
        std::sort(x.begin(), x.end());
        x.erase(std::unique(x.begin(), x.end(), [](double a, double b) { return std::abs(a - b) < 1e-9; }), x.end());
    };
    uniq(fs);
    uniq(ts);
    uniq(ps);
    auto regular = [](const std::vector<double>& x, AngleAxis& ax) {
        ax.start_deg = x.front();
        ax.count = int(x.size());
        ax.step_deg = x.size() > 1 ? (x.back() - x.front()) / double(x.size() - 1) : 1.0;
        for (std::size_t k = 0; k < x.size(); ++k)
            if (std::abs(x[k] - (ax.start_deg + double(k) * ax.step_deg)) > 1e-6) return false;
        return true;
    };
    if (!regular(ts, s.grid.theta)) return Error{name, 0, 0, "theta values do not form a regular grid"};
    if (!regular(ps, s.grid.phi)) return Error{name, 0, 0, "phi values do not form a regular grid"};
    if (s.grid.phi.count > 1 && std::abs(s.grid.phi.count * s.grid.phi.step_deg - 360) > 1e-6 &&
        s.grid.phi.last_deg() + s.grid.phi.step_deg > 360 - 1e-6)
        return Error{name, 0, 0, "phi values do not form a regular grid"};
    if (s.grid.phi.count == 1) s.grid.phi.step_deg = 360;
    s.frequencies.resize(fs.size());
    std::vector<std::vector<char>> seen(fs.size(), std::vector<char>(s.grid.size(), 0));
    for (std::size_t k = 0; k < fs.size(); ++k) {
        s.frequencies[k].frequency_hz = fs[k];
        s.frequencies[k].e_theta.assign(s.grid.size(), 0);
        s.frequencies[k].e_phi.assign(s.grid.size(), 0);
    }
    for (const Row& r : rows) {
        std::size_t fk = std::size_t(std::lower_bound(fs.begin(), fs.end(), r.f - 1e-9) - fs.begin());
        int it = int(std::lround((r.t - s.grid.theta.start_deg) / s.grid.theta.step_deg));
        int ip = int(std::lround((r.p - s.grid.phi.start_deg) / s.grid.phi.step_deg));
        std::size_t k = s.grid.index(it, ip);
        if (seen[fk][k]) return Error{name, r.line, 1, "duplicate grid point"};
        seen[fk][k] = 1;
        s.frequencies[fk].e_theta[k] = r.et;
        s.frequencies[fk].e_phi[k] = r.ep;
    }
    for (std::size_t fk = 0; fk < fs.size(); ++fk)
        for (std::size_t k = 0; k < s.grid.size(); ++k)
            if (!seen[fk][k]) return Error{name, 0, 0, "missing grid point"};
    if (s.name.empty()) s.name = name;
    return s;
}

Result<FarFieldSet> read_far_field_csv(const std::string& path, const CsvReadOptions& o) {
    std::ifstream in(path, std::ios::binary);
    if (!in) return Error{path, 0, 0, "cannot open the file"};
    std::stringstream ss;
    ss << in.rdbuf();
    return parse_far_field_csv(ss.str(), path, o);
}

}  // namespace ellipsa
