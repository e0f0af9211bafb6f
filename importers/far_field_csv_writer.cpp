// Writer for the neutral far-field CSV schema, every family.
//
// Numbers use the shortest form that reads back to the same double (std::to_chars), so the
// complex family round-trips exactly; the dB/phase families round-trip to a few ulps.
#include <charconv>
#include <cmath>
#include <cstring>
#include <optional>
#include <string_view>

#include "io/atomic_write.hpp"
#include "importers/far_field_csv.hpp"
#include "pattern/polarisation.hpp"

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

const char* csv_part_name(FieldPart p) {
    switch (p) {
        case FieldPart::theta: return "theta";
        case FieldPart::phi: return "phi";
        case FieldPart::rhcp: return "rhcp";
        case FieldPart::lhcp: return "lhcp";
        case FieldPart::co: return "co";
        case FieldPart::cross: return "cross";
        case FieldPart::whole: break;
    }
    return "whole";
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

CsvFamily natural_family(const FarFieldSet& s) {
    switch (s.content) {
        case FieldContent::complex: return CsvFamily::complex;
        case FieldContent::magnitude_only: return CsvFamily::magnitude_db;
        case FieldContent::total_only: return CsvFamily::total_db;
    }
    return CsvFamily::complex;
}

namespace {

// Shortest representation that reads back to the same double; "-inf" for zero power in dB.
inline void put_number(std::string& out, double v) {
    char buf[32];
    auto r = std::to_chars(buf, buf + sizeof buf, v);
    out.append(buf, r.ptr);
}

inline void put_db(std::string& out, double power) {
    if (!(power > 0)) {
        out += "-inf";
        return;
    }
    put_number(out, 10.0 * std::log10(power));
}

inline void put_phase_deg(std::string& out, cplx c) {
    double a = std::arg(c) / deg;
    if (a == 0) a = 0;  // no "-0"
    put_number(out, a);
}

// One metadata line with newlines in the value kept as more lines of the same key.
void put_meta(std::string& out, const char* key, const std::string& value) {
    std::size_t a = 0;
    while (a <= value.size()) {
        std::size_t nl = value.find('\n', a);
        std::string part = value.substr(a, nl == std::string::npos ? std::string::npos : nl - a);
        for (char& c : part)
            if (c == '\r') c = ' ';
        out += std::string("# ") + key + ": " + part + "\n";
        if (nl == std::string::npos || std::strcmp(key, "note") != 0) break;
        a = nl + 1;
    }
}

}  // namespace

namespace {

std::optional<Error> write_refusal(const FarFieldSet& s, CsvFamily fam) {
    const bool needs_phase = fam == CsvFamily::complex || fam == CsvFamily::theta_phi_polar ||
                             fam == CsvFamily::circular_polar || fam == CsvFamily::ludwig3_polar;
    if (needs_phase && !s.has_phase())
        return Error{"", 0, 0, std::string("expected complex data for the ") + to_string(fam) + " family, found " +
                                   to_string(s.content) + " data (write theta-phi-db or total-db instead)"};
    if (fam == CsvFamily::magnitude_db && s.content == FieldContent::total_only)
        return Error{"", 0, 0, "expected theta and phi parts for the theta-phi-db family, found total-only data "
                               "(write total-db instead)"};
    for (const FarField& f : s.frequencies)
        if (f.e_theta.size() != s.grid.size() || f.e_phi.size() != s.grid.size())
            return Error{"", 0, 0, "expected field arrays of the grid's size"};
    return std::nullopt;
}

// The metadata lines and the header line.
void put_head(std::string& out, const FarFieldSet& s, CsvFamily fam, Ludwig3Reference ref) {
    out += "# ellipsa far-field CSV, schema version 1\n";
    out += std::string("# quantity: ") + to_string(s.quantity) + "\n";
    out += "# time-convention: +jwt\n";
    out += "# angle-unit: deg\n";
    out += "# frequency-unit: Hz\n";
    if (fam == CsvFamily::ludwig3_polar) out += ref == Ludwig3Reference::x ? "# ludwig3-reference: x\n" : "# ludwig3-reference: y\n";
    if (!s.name.empty()) put_meta(out, "name", s.name);
    if (!s.source.empty()) put_meta(out, "source", s.source);
    if (!s.note.empty()) put_meta(out, "note", s.note);
    // The file's own mounting, when the fields are still in the file's frame (a pattern already
    // turned by its mounting is written as the installed antenna, with none).
    if (s.part != FieldPart::whole) out += std::string("# part: ") + csv_part_name(s.part) + "\n";
    // How the samples stand for the sphere, when a reader would not infer it from the grid.
    Grid plain = s.grid;
    plain.sampling = inferred_sampling(s.grid);
    if (plain.sampling != s.grid.sampling) out += std::string("# sampling: ") + to_string(s.grid.sampling) + "\n";
    if (is_identity(s.mounting) && !is_identity(s.file_mounting)) {
        out += "# mounting-up: " + format_up(s.file_mounting.up) + "\n";
        if (!s.file_mounting.turns.empty()) out += "# mounting-turns: " + format_turns(s.file_mounting.turns) + "\n";
    }
    out += "frequency,theta,phi,";
    switch (fam) {
        case CsvFamily::complex: out += "e_theta_re,e_theta_im,e_phi_re,e_phi_im\n"; break;
        case CsvFamily::theta_phi_polar: out += "e_theta_db,e_theta_phase,e_phi_db,e_phi_phase\n"; break;
        case CsvFamily::circular_polar: out += "e_rhcp_db,e_rhcp_phase,e_lhcp_db,e_lhcp_phase\n"; break;
        case CsvFamily::ludwig3_polar: out += "e_co_db,e_co_phase,e_cross_db,e_cross_phase\n"; break;
        case CsvFamily::magnitude_db: out += "e_theta_db,e_phi_db\n"; break;
        case CsvFamily::total_db: out += "e_total_db\n"; break;
    }
}

// Two fields as dB and phase: "a_db,a_phase,b_db,b_phase".
void put_polar_pair(std::string& out, cplx a, cplx b) {
    put_db(out, std::norm(a));
    out += ',';
    put_phase_deg(out, a);
    out += ',';
    put_db(out, std::norm(b));
    out += ',';
    put_phase_deg(out, b);
}

// The value cells of one sample in the family's columns.
void put_values(std::string& out, CsvFamily fam, cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref) {
    switch (fam) {
        case CsvFamily::complex:
            put_number(out, et.real());
            out += ',';
            put_number(out, et.imag());
            out += ',';
            put_number(out, ep.real());
            out += ',';
            put_number(out, ep.imag());
            break;
        case CsvFamily::theta_phi_polar: put_polar_pair(out, et, ep); break;
        case CsvFamily::circular_polar: put_polar_pair(out, rhcp(et, ep), lhcp(et, ep)); break;
        case CsvFamily::ludwig3_polar: {
            const CoCross cc = ludwig3(et, ep, cos_phi, sin_phi, ref);
            put_polar_pair(out, cc.co, cc.cross);
            break;
        }
        case CsvFamily::magnitude_db:
            put_db(out, std::norm(et));
            out += ',';
            put_db(out, std::norm(ep));
            break;
        case CsvFamily::total_db: put_db(out, std::norm(et) + std::norm(ep)); break;
    }
}

std::string_view number_text(char (&buf)[32], double v) {
    auto r = std::to_chars(buf, buf + sizeof buf, v);
    return std::string_view(buf, std::size_t(r.ptr - buf));
}

}  // namespace

Result<std::string> format_far_field_csv(const FarFieldSet& s, const CsvWriteOptions& o) {
    const CsvFamily fam = o.family;
    if (auto refused = write_refusal(s, fam)) return *refused;
    const Grid& g = s.grid;
    const Ludwig3Reference ref = o.ludwig3_reference ? *o.ludwig3_reference : s.ludwig3_reference;
    std::string out;
    out.reserve(g.size() * s.frequencies.size() * (fam == CsvFamily::total_db ? 40 : 100) + 512);
    put_head(out, s, fam, ref);
    std::vector<double> cos_phi(std::size_t(g.phi.count)), sin_phi(std::size_t(g.phi.count)), phi_deg(std::size_t(g.phi.count));
    for (int j = 0; j < g.phi.count; ++j) {
        // An arc across phi = 0 (330..390) stays one regular run, which reads back (any window
        // within [-360, 720] reads); a full circle is written in [0, 360).
        phi_deg[std::size_t(j)] = g.phi_wraps() ? wrap360(g.phi.value_deg(j)) : g.phi.value_deg(j);
        cos_phi[std::size_t(j)] = std::cos(phi_deg[std::size_t(j)] * deg);
        sin_phi[std::size_t(j)] = std::sin(phi_deg[std::size_t(j)] * deg);
    }
    for (const FarField& f : s.frequencies) {
        char fbuf[32], tbuf[32];
        const std::string_view ftext = number_text(fbuf, f.frequency_hz);
        for (int i = 0; i < g.theta.count; ++i) {
            const std::string_view ttext = number_text(tbuf, g.theta.value_deg(i));
            for (int j = 0; j < g.phi.count; ++j) {
                const std::size_t k = g.index(i, j), jj = std::size_t(j);
                out += ftext;
                out += ',';
                out += ttext;
                out += ',';
                put_number(out, phi_deg[jj]);
                out += ',';
                put_values(out, fam, f.e_theta[k], f.e_phi[k], cos_phi[jj], sin_phi[jj], ref);
                out += '\n';
            }
        }
    }
    return out;
}

Status write_far_field_csv(const FarFieldSet& s, const std::string& path, const CsvWriteOptions& o) {
    auto text = format_far_field_csv(s, o);
    if (!text) return Error{path, 0, 0, text.error().message};
    return io::write_file_atomically(path, *text, o.overwrite);
}

}  // namespace ellipsa
