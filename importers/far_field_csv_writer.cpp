// Writer for the neutral far-field CSV schema.
#include <charconv>
#include <cmath>
#include <cstring>

#include "importers/atomic_write.hpp"
#include "importers/far_field_csv.hpp"

namespace ellipsa {

const char* to_string(CsvFamily f) {
    switch (f) {
        case CsvFamily::complex: return "complex";
        case CsvFamily::theta_phi_polar: return "theta-phi-db-phase";
        case CsvFamily::circular_polar: return "circular-db-phase";
        case CsvFamily::ludwig3_polar: return "ludwig3-db-phase";
        case CsvFamily::magnitude_db: return "theta-phi-db";
        case CsvFamily::total_db: return "total-db";
    }
    return "complex";
}

bool parse_csv_family(std::string_view name, CsvFamily& out) {
    for (CsvFamily f : {CsvFamily::complex, CsvFamily::theta_phi_polar, CsvFamily::circular_polar,
                        CsvFamily::ludwig3_polar, CsvFamily::magnitude_db, CsvFamily::total_db})
        if (name == to_string(f)) {
            out = f;
            return true;
        }
    return false;
}

namespace {

// Shortest representation that reads back to the same double.
void put_number(std::string& out, double v) {
    char buf[32];
    auto r = std::to_chars(buf, buf + sizeof buf, v);
    out.append(buf, r.ptr);
}

}  // namespace

Result<std::string> format_far_field_csv(const FarFieldSet& s, const CsvWriteOptions& o) {
    if (o.family != CsvFamily::complex)
        return Error{"", 0, 0, std::string("writing the ") + to_string(o.family) + " family is not supported yet"};
    if (!s.has_phase())
        return Error{"", 0, 0, "the complex family needs phase; this set has " + std::string(to_string(s.content)) +
                                   " data"};
    std::string out;
    out.reserve(s.grid.size() * s.frequencies.size() * 90 + 256);
    out += "# ellipsa far-field CSV, schema version 1\n";
    out += std::string("# quantity: ") + to_string(s.quantity) + "\n";
    out += "# time-convention: +jwt\n";
    out += "# angle-unit: deg\n";
    out += "# frequency-unit: Hz\n";
    if (!s.name.empty()) out += "# name: " + s.name + "\n";
    if (!s.source.empty()) out += "# source: " + s.source + "\n";
    if (!s.note.empty()) out += "# note: " + s.note + "\n";
    out += "frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n";
    const Grid& g = s.grid;
    for (const FarField& f : s.frequencies)
        for (int i = 0; i < g.theta.count; ++i)
            for (int j = 0; j < g.phi.count; ++j) {
                const std::size_t k = g.index(i, j);
                put_number(out, f.frequency_hz);
                out += ',';
                put_number(out, g.theta.value_deg(i));
                out += ',';
                put_number(out, wrap360(g.phi.value_deg(j)));
                out += ',';
                put_number(out, f.e_theta[k].real());
                out += ',';
                put_number(out, f.e_theta[k].imag());
                out += ',';
                put_number(out, f.e_phi[k].real());
                out += ',';
                put_number(out, f.e_phi[k].imag());
                out += '\n';
            }
    return out;
}

Status write_far_field_csv(const FarFieldSet& s, const std::string& path, const CsvWriteOptions& o) {
    auto text = format_far_field_csv(s, o);
    if (!text) return Error{path, 0, 0, text.error().message};
    return write_file_atomically(path, *text, true);
}

}  // namespace ellipsa
