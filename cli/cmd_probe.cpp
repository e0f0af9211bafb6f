// ellipsa probe: every polarisation figure at one direction, interpolated.
#include <cmath>
#include <cstdio>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/format.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "exports/figure_text.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa::cli {

namespace {

struct ProbeArgs {
    std::string file;
    double theta_deg = 0, phi_deg = 0;
    std::optional<double> frequency_hz;
    std::string ludwig3;
    bool json = false;
    LoadOptions load;
};

std::optional<double> db_or_null(double linear, bool available) {
    if (!available) return std::nullopt;
    double d = to_db(linear);
    if (!std::isfinite(d)) return std::nullopt;  // zero field: no finite dB value
    return d;
}

// What the set can give at this direction: parts (theta/phi) and phase-bound figures.
struct Available {
    bool ph, parts;
    std::optional<double> ar_db;
    const char* sense;
};

Available available(const FarFieldSet& s, const PolarisationState& p) {
    Available v{s.has_phase(), s.content != FieldContent::total_only, std::nullopt, nullptr};
    if (v.ph) v.ar_db = p.axial_ratio_db;  // as reported: none when linear (40 dB and up) or zero
    v.sense = v.ph && p.sense != Sense::none ? to_string(p.sense) : nullptr;
    return v;
}

void print_json(const ProbeArgs& a, const FarFieldSet& s, std::size_t fi, Ludwig3Reference ref,
                const PolarisationState& p) {
    const Available v = available(s, p);
    JsonWriter j;
    j.begin_object();
    j.field("frequency_hz", s.frequencies[fi].frequency_hz);
    j.field("theta_deg", a.theta_deg).field("phi_deg", a.phi_deg);
    j.field("quantity", to_string(s.quantity));
    mounting_json(j, s);
    j.field("total_db", db_or_null(p.total, true));
    j.field("theta_db", db_or_null(p.theta, v.parts)).field("phi_db", db_or_null(p.phi, v.parts));
    j.field("vertical_db", db_or_null(p.theta, v.parts)).field("horizontal_db", db_or_null(p.phi, v.parts));
    j.field("rhcp_db", db_or_null(p.rhcp, v.ph)).field("lhcp_db", db_or_null(p.lhcp, v.ph));
    j.field("co_db", db_or_null(p.co, v.ph)).field("cross_db", db_or_null(p.cross, v.ph));
    j.field("ludwig3_reference", ref == Ludwig3Reference::x ? "x" : "y");
    j.field("axial_ratio_db", v.ar_db);
    j.key("tilt_deg");
    if (v.ph && p.sense != Sense::none) j.value(p.tilt_deg); else j.null();  // NaN (near circular): null
    j.key("sense");
    if (v.sense) j.value(v.sense); else j.null();
    j.key("stokes").begin_array();
    j.value(p.stokes.i);
    if (v.parts) j.value(p.stokes.q); else j.null();
    if (v.ph) j.value(p.stokes.u).value(p.stokes.v); else j.null().null();
    j.end_array();
    j.end_object();
    std::cout << j.str() << "\n";
}

void print_text(const ProbeArgs& a, const FarFieldSet& s, std::size_t fi, Ludwig3Reference ref,
                const PolarisationState& p) {
    const Available v = available(s, p);
    const bool ph = v.ph;
    const char* u = db_unit(s.quantity, Component::total);
    const char* uc = db_unit(s.quantity, Component::rhcp);
    auto line = [](const char* label, const std::string& text) { std::printf("  %-22s %s\n", label, text.c_str()); };
    const char* np = "unavailable (needs phase)";
    std::printf("%s at theta %g, phi %g deg, %s\n", file_path(a.file).c_str(), a.theta_deg, a.phi_deg,
                format_frequency(s.frequencies[fi].frequency_hz).c_str());
    if (const std::string m = mounting_note(s); !m.empty()) std::printf("  %s (theta and phi in the world frame)\n", m.c_str());
    line("total", fmt(to_db(p.total), u));
    if (v.parts) {
        line("theta (vertical)", fmt(to_db(p.theta), u));
        line("phi (horizontal)", fmt(to_db(p.phi), u));
    }
    line("RHCP", ph ? fmt(to_db(p.rhcp), uc) : np);
    line("LHCP", ph ? fmt(to_db(p.lhcp), uc) : np);
    line(ref == Ludwig3Reference::x ? "co (Ludwig-3, x ref)" : "co (Ludwig-3, y ref)", ph ? fmt(to_db(p.co), u) : np);
    line("cross (Ludwig-3)", ph ? fmt(to_db(p.cross), u) : np);
    line("axial ratio", ph ? exports::axial_ratio_text(p.sense, p.axial_ratio_db) : np);
    line("tilt", ph ? exports::tilt_text(p.tilt_deg, p.sense, "deg") : np);
    line("sense", ph ? exports::sense_text(p.sense) : np);
    // Rounding residue (below 1e-12 of I) prints as 0, never as "-0" or "-1e-17".
    auto clean = [&](double x) { return std::abs(x) <= 1e-12 * p.stokes.i ? 0.0 : x; };
    char buf[160];
    std::snprintf(buf, sizeof buf, "I %.6g, Q %.6g, U %.6g, V %.6g", p.stokes.i, clean(p.stokes.q), clean(p.stokes.u),
                  clean(p.stokes.v));
    line("Stokes (linear)", ph ? std::string(buf) : np);
}

Registered add_probe(CLI::App& root) {
    auto a = std::make_shared<ProbeArgs>();
    CLI::App* sub = root.add_subcommand("probe", "Every component, axial ratio, tilt, sense and Stokes at one direction");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    sub->add_option("--theta", a->theta_deg, "Theta, deg from +z (0..180)")->required()->check(number_from_to(0.0, 180.0));
    sub->add_option("--phi", a->phi_deg, "Phi, deg from +x toward +y (-360..360)")->required()->check(number_from_to(-360.0, 360.0));
    add_frequency_option(sub, a->frequency_hz, "Frequency (nearest within 0.5 %; default the middle one of the file)");
    sub->add_option("--ludwig3", a->ludwig3, "Ludwig-3 reference for co/cross: x or y (default: the file's, else x)")
        ->check(one_of({"x", "y"}));
    sub->add_flag("--json", a->json, "Print one JSON object");
    add_load_options(sub, a->load);
    return {sub, [a]() -> int {
                auto s = load_pattern(a->file, a->load);
                if (!s) {
                    std::cerr << "ellipsa probe: " << s.error().format() << "\n";
                    return exit_bad_input;
                }
                auto fi = pick_frequency(*s, a->frequency_hz, file_path(a->file));
                if (!fi) {
                    std::cerr << "ellipsa probe: " << fi.error().format() << "\n";
                    return exit_bad_input;
                }
                auto f = interpolate(*s, *fi, a->theta_deg, a->phi_deg);
                if (!f) {
                    std::cerr << "ellipsa probe: " << file_path(a->file) << ": theta " << a->theta_deg << ", phi " << a->phi_deg
                              << " deg lies outside the sampled region\n";
                    return exit_bad_input;
                }
                Ludwig3Reference ref = s->ludwig3_reference;
                if (a->ludwig3 == "x") ref = Ludwig3Reference::x;
                if (a->ludwig3 == "y") ref = Ludwig3Reference::y;
                const PolarisationState p = decompose(f->e_theta, f->e_phi, a->phi_deg * deg, ref);
                if (a->json) print_json(*a, *s, *fi, ref, p);
                else print_text(*a, *s, *fi, ref, p);
                return exit_ok;
            }};
}
const CommandRegistration registration(30, add_probe);

}  // namespace

}  // namespace ellipsa::cli
