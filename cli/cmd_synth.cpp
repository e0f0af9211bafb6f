// ellipsa synth: write a closed-form reference antenna in the far-field CSV schema.
#include <cmath>
#include <iostream>
#include <memory>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "importers/far_field_csv.hpp"
#include "pattern/reference.hpp"

namespace ellipsa::cli {

namespace {
struct SynthArgs {
    std::string kind;
    double length_wl = 0.5;
    double circumference_wl = 1.0;
    double phase_deg = -90;
    double rx = 0, ry = 0, rz = 0;
    double step_deg = 1;
    double frequency_hz = 2.45e9;
    std::string name;
    std::string out;
    bool force = false;
};
}  // namespace

namespace {
Registered add_synth(CLI::App& root) {
    auto a = std::make_shared<SynthArgs>();
    CLI::App* sub = root.add_subcommand(
        "synth", "Write a closed-form reference antenna (Balanis ch. 4-5 formulas) as a far-field CSV");
    sub->add_option("KIND", a->kind, "short-dipole | dipole | small-loop | loop | crossed-dipoles")
        ->required()
        ->check(one_of({"short-dipole", "dipole", "small-loop", "loop", "crossed-dipoles"}));
    sub->add_option("--length", a->length_wl, "Dipole length in wavelengths (dipole; default 0.5)")
        ->check(number_from_to(1e-6, 50.0));
    sub->add_option("--circumference", a->circumference_wl, "Loop circumference in wavelengths (loop; default 1)")
        ->check(number_from_to(1e-6, 100.0));
    sub->add_option("--phase", a->phase_deg,
                    "Crossed dipoles: phase of the y current against the x current, deg "
                    "(default -90: right-hand circular toward +z)")
        ->check(number_from_to(-360, 360));
    sub->add_option("--rotate-x", a->rx, "Turn the antenna about x, deg (applied first)")->check(number_from_to(-360, 360));
    sub->add_option("--rotate-y", a->ry, "Then about y, deg")->check(number_from_to(-360, 360));
    sub->add_option("--rotate-z", a->rz, "Then about z, deg")->check(number_from_to(-360, 360));
    sub->add_option("--step", a->step_deg, "Grid step in theta and phi, deg; must divide 180 (default 1)")
        ->check(number_from_to(0.05, 90.0));
    add_frequency_option(sub, a->frequency_hz, "Frequency written to the file (default 2.45 GHz)")
        ->check(positive_number());
    sub->add_option("--name", a->name, "Name stored in the file (default: the kind)");
    sub->add_option("--out", a->out, "Output CSV file")->required()->type_name("FILE");
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    return {sub, [a]() -> int {
                const double n = 180.0 / a->step_deg;
                if (std::abs(n - std::round(n)) > 1e-9) {
                    std::cerr << "ellipsa synth: --step " << a->step_deg << " does not divide 180 deg evenly\n";
                    return exit_usage;
                }
                ReferenceAntenna ant;
                parse_reference_kind(a->kind, ant.kind);
                ant.length_wl = a->length_wl;
                ant.circumference_wl = a->circumference_wl;
                ant.phase_deg = a->phase_deg;
                ant.orientation = rotation_xyz_deg(a->rx, a->ry, a->rz);
                FarFieldSet s = synthesize(ant, a->step_deg, a->frequency_hz);
                if (!a->name.empty()) s.name = a->name;
                if (a->rx != 0 || a->ry != 0 || a->rz != 0)
                    s.source += ", turned " + std::to_string(a->rx) + "/" + std::to_string(a->ry) + "/" +
                                std::to_string(a->rz) + " deg about x/y/z";
                CsvWriteOptions w;
                w.overwrite = a->force;
                Status st = write_far_field_csv(s, a->out, w);
                if (!st) {
                    std::cerr << "ellipsa synth: " << st.error().format() << "\n";
                    return exit_bad_input;
                }
                return exit_ok;
            }};
}
const CommandRegistration registration(10, add_synth);
}  // namespace

}  // namespace ellipsa::cli
