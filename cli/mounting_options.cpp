#include "cli/mounting_options.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>

#include "exports/figure_text.hpp"
#include "pattern/mounting.hpp"

namespace ellipsa::cli {

namespace {

// "auto", or three finite numbers "X,Y,Z" (metres).
Result<InstallRequest> phase_reference(const std::string& text, InstallRequest q) {
    if (text.empty()) return q;
    if (text == "auto") {
        q.reference = PhaseReference::phase_centre;
        return q;
    }
    double v[3] = {};
    std::size_t pos = 0;
    for (int i = 0; i < 3; ++i) {
        std::size_t end = i < 2 ? text.find(',', pos) : text.size();
        if (end == std::string::npos) end = text.size();
        std::string cell = text.substr(pos, end - pos);
        cell.erase(0, cell.find_first_not_of(" \t+"));
        cell.erase(cell.find_last_not_of(" \t") + 1);
        auto [p, ec] = std::from_chars(cell.data(), cell.data() + cell.size(), v[i]);
        if (cell.empty() || ec != std::errc() || p != cell.data() + cell.size() || !std::isfinite(v[i]) ||
            (i < 2 && end == text.size()))
            return Error{"--phase-centre", 0, 0, "expected X,Y,Z in metres (three numbers) or auto, found \"" + text + "\""};
        pos = end + 1;
    }
    q.reference = PhaseReference::point;
    q.reference_point_m = {v[0], v[1], v[2]};
    return q;
}

double wavelength_m(const FarField& f) { return f.frequency_hz > 0 ? speed_of_light_m_per_s / f.frequency_hz : 0; }


void vector_json(JsonWriter& j, Vec3 v) { j.begin_array().value(v.x).value(v.y).value(v.z).end_array(); }

}  // namespace

void add_mounting_options(CLI::App* sub, MountingOptions& o) {
    auto check = [](auto parse) {
        return CLI::Validator(
            [parse](std::string& s) {
                auto r = parse(s);
                return r ? std::string() : r.error().message;
            },
            "");
    };
    sub->add_option("--up", o.up,
                    "The file's axis that points up when the antenna is installed: +x, -x, +y, -y, +z, -z, or "
                    "THETA,PHI in degrees (replaces the file's own mounting; docs/conventions.md)")
        ->check(check([](const std::string& s) { return parse_up(s); }));
    sub->add_option("--rotate", o.rotate,
                    "Then turn the installed antenna about the world axes, left to right: \"z:30,x:10\" "
                    "(after the file's mounting or --up)")
        ->check(check([](const std::string& s) { return parse_turns(s); }));
    sub->add_option("--phase-centre", o.phase_centre,
                    "Move the phase reference to X,Y,Z metres (world frame, after the mounting) or to the "
                    "estimated phase centre (auto); changes correlation between antennas")
        ->check(check([](const std::string& s) { return phase_reference(s, {}); }));
}

Result<InstallRequest> install_request(const MountingOptions& o) {
    InstallRequest q;
    q.turn_fields = o.turn_fields;
    if (!o.up.empty()) {
        auto up = parse_up(o.up);
        if (!up) return Error{"--up", 0, 0, up.error().message};
        q.up = *up;
    }
    auto turns = parse_turns(o.rotate);
    if (!turns) return Error{"--rotate", 0, 0, turns.error().message};
    q.turns = *turns;
    return phase_reference(o.phase_centre, q);
}

std::string mounting_note(const FarFieldSet& s) {
    if (is_identity(s.mounting) && is_identity(s.file_mounting)) return "";
    return "mounting: " + exports::mounting_text(s);
}

void mounting_json(JsonWriter& j, const FarFieldSet& s) {
    const Mat3 r = mounting_matrix(s.mounting);
    const bool identity = is_identity(r);
    j.key("mounting").begin_object();
    j.field("up", format_up(s.mounting.up));
    j.key("turns").begin_array();
    for (const AxisTurn& t : s.mounting.turns)
        j.begin_object().field("axis", to_string(t.axis)).field("angle_deg", t.angle_deg).end_object();
    j.end_array();
    j.key("matrix").begin_array();
    for (const auto& row : r.m) j.begin_array().value(row[0]).value(row[1]).value(row[2]).end_array();
    j.end_array();
    j.field("identity", identity);
    j.field("rotation", identity ? "none" : s.mounting_resampled ? "resampled" : "exact");
    j.field("from_file", !identity && exports::same_mounting(s.mounting, s.file_mounting));
    j.end_object();
}

void phase_centre_json(JsonWriter& j, const FarFieldSet& s, std::size_t k, const Result<PhaseCentre>& pc) {
    const FarField& f = s.frequencies[k];
    const double lambda = wavelength_m(f);
    j.key("phase_centre");
    if (pc) {
        j.begin_object();
        j.key("position_m");
        if (lambda > 0) vector_json(j, lambda * pc->centre_wl);
        else j.null();
        j.key("position_wavelengths");
        vector_json(j, pc->centre_wl);
        j.field("residual_deg", pc->residual_deg).field("samples", pc->samples);
        j.field("unresolved_axes", pc->unresolved_axes);
        j.end_object();
    } else {
        j.null();
        j.field("phase_centre_reason", pc.error().message);
    }
    phase_reference_json(j, s, k);
}

void phase_reference_json(JsonWriter& j, const FarFieldSet& s, std::size_t k) {
    const FarField& f = s.frequencies[k];
    const double lambda = wavelength_m(f);
    j.key("phase_reference_shift_m");
    if (norm(f.reference_shift_wl) == 0 || !(lambda > 0)) j.null();
    else vector_json(j, lambda * f.reference_shift_wl);
}

}  // namespace ellipsa::cli
