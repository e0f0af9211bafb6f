// ellipsa probe: every polarisation figure at one direction, interpolated.
#include <cmath>
#include <cstdio>
#include <iterator>
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
#include "pattern/component_phase.hpp"
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

// The phase of each component that has one (pattern/component_phase.hpp), NaN where it has none
// or the data carry no phase; indexed by Component.
struct Phases {
    double deg[std::size(all_components)];
    double operator[](Component c) const { return deg[std::size_t(c)]; }
};

Phases phases(const FarFieldSet& s, cplx et, cplx ep, double phi_deg, Ludwig3Reference ref) {
    Phases p{};
    const double cp = std::cos(phi_deg * deg), sp = std::sin(phi_deg * deg);
    for (Component c : all_components)
        p.deg[std::size_t(c)] = phase_unavailable(s, c) ? NAN : component_phase_deg(et, ep, cp, sp, ref, c);
    return p;
}

std::optional<double> phase_or_null(double phase_deg) {
    if (std::isnan(phase_deg)) return std::nullopt;
    return phase_deg;
}

void print_json(const ProbeArgs& a, const FarFieldSet& s, std::size_t fi, Ludwig3Reference ref,
                const PolarisationState& p, const Phases& ph) {
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
    // The phase of each component, deg in (-180, 180], null where undefined (no field, no phase in the data).
    for (Component c : all_components)
        if (has_phase(c)) j.field(std::string(to_string(c)) + "_phase_deg", phase_or_null(ph[c]));
    phase_reference_json(j, s, fi);
    j.key("stokes").begin_array();
    j.value(p.stokes.i);
    if (v.parts) j.value(p.stokes.q); else j.null();
    if (v.ph) j.value(p.stokes.u).value(p.stokes.v); else j.null().null();
    j.end_array();
    j.end_object();
    std::cout << j.str() << "\n";
}

void print_text(const ProbeArgs& a, const FarFieldSet& s, std::size_t fi, Ludwig3Reference ref,
                const PolarisationState& p, const Phases& phs) {
    const Available v = available(s, p);
    const bool ph = v.ph;
    const char* u = db_unit(s.quantity, Component::total);
    const char* uc = db_unit(s.quantity, Component::rhcp);
    // A level, and its phase beside it when the data have phase.
    auto line = [&](const char* label, const std::string& text, Component c = Component::total) {
        if (!ph || !has_phase(c) || text == "unavailable (needs phase)") std::printf("  %-22s %s\n", label, text.c_str());
        else std::printf("  %-22s %-18s phase %s\n", label, text.c_str(), exports::phase_text(phs[c], "deg").c_str());
    };
    const char* np = "unavailable (needs phase)";
    std::printf("%s at theta %g, phi %g deg, %s\n", file_path(a.file).c_str(), a.theta_deg, a.phi_deg,
                format_frequency(s.frequencies[fi].frequency_hz).c_str());
    if (const std::string m = mounting_note(s); !m.empty()) std::printf("  %s (theta and phi in the world frame)\n", m.c_str());
    line("total", fmt(to_db(p.total), u));
    if (v.parts) {
        line("theta (vertical)", fmt(to_db(p.theta), u), Component::theta);
        line("phi (horizontal)", fmt(to_db(p.phi), u), Component::phi);
    }
    line("RHCP", ph ? fmt(to_db(p.rhcp), uc) : np, Component::rhcp);
    line("LHCP", ph ? fmt(to_db(p.lhcp), uc) : np, Component::lhcp);
    line(ref == Ludwig3Reference::x ? "co (Ludwig-3, x ref)" : "co (Ludwig-3, y ref)", ph ? fmt(to_db(p.co), u) : np,
         Component::co);
    line("cross (Ludwig-3)", ph ? fmt(to_db(p.cross), u) : np, Component::cross);
    line("axial ratio", ph ? exports::axial_ratio_text(p.sense, p.axial_ratio_db) : np);
    line("tilt", ph ? exports::tilt_text(p.tilt_deg, p.sense, "deg") : np);
    line("sense", ph ? exports::sense_text(p.sense) : np);
    // Rounding residue (below 1e-12 of I) prints as 0, never as "-0" or "-1e-17".
    auto clean = [&](double x) { return std::abs(x) <= 1e-12 * p.stokes.i ? 0.0 : x; };
    char buf[160];
    std::snprintf(buf, sizeof buf, "I %.6g, Q %.6g, U %.6g, V %.6g", p.stokes.i, clean(p.stokes.q), clean(p.stokes.u),
                  clean(p.stokes.v));
    line("Stokes (linear)", ph ? std::string(buf) : np);
    if (ph) line("phase relative to", exports::phase_reference_text(s, fi));
    else line("phase", std::string("none: the data are ") + to_string(s.content) + " (no phase)");
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
                const Phases ph = phases(*s, f->e_theta, f->e_phi, a->phi_deg, ref);
                if (a->json) print_json(*a, *s, *fi, ref, p, ph);
                else print_text(*a, *s, *fi, ref, p, ph);
                return exit_ok;
            }};
}
const CommandRegistration registration(30, add_probe);

}  // namespace

}  // namespace ellipsa::cli
