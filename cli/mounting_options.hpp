// The mounting frame and the phase reference on the command line: --up, --rotate and
// --phase-centre, added to every command that reads patterns through add_load_options
// (cli/load.hpp), and how a command tells which mounting it applied (text and JSON).
#pragma once
#include <string>

#include <CLI/CLI.hpp>

#include "cli/json.hpp"
#include "exports/figure_text.hpp"
#include "pattern/far_field.hpp"
#include "pattern/install.hpp"
#include "pattern/phase_centre.hpp"

namespace ellipsa::cli {

struct MountingOptions {
    std::string up;            // --up: +x ... -z or THETA,PHI (pattern/mounting.hpp, parse_up)
    std::string rotate;        // --rotate: AXIS:DEG,... about the world axes (parse_turns)
    std::string phase_centre;  // --phase-centre: X,Y,Z in metres (world frame) or "auto"
    bool turn_fields = true;   // false: keep the file's frame, record the mounting (convert)
};

// Adds the three options; bad text is refused while parsing (bad usage, exit 2) with what was
// expected.
void add_mounting_options(CLI::App* sub, MountingOptions& o);

// The install request the options describe (they were checked while parsing; an Error names the
// option all the same).
Result<InstallRequest> install_request(const MountingOptions& o);

// "mounting: " + exports::mounting_text(s) when a mounting was applied or the file declared one that the
// options replaced, else "" (the commands other than info print it only then).
std::string mounting_note(const FarFieldSet& s);

// The "mounting" object of a command's --json output (docs/guide.md, "The mounting frame"):
// up, turns, matrix (rows, file frame to world), identity, rotation ("none", "exact",
// "resampled") and from_file (the mounting is the one the file declares).
void mounting_json(JsonWriter& j, const FarFieldSet& s);

// The phase centre at one frequency in metres (null without a frequency) and wavelengths, with
// the fit's residual and sample count, and the phase reference's shift when it was moved:
// the "phase_centre" and "phase_reference_shift_m" fields of info --json. `pc` is
// estimate_phase_centre(s, freq_index), computed by the caller (info does all frequencies at once).
void phase_centre_json(JsonWriter& j, const FarFieldSet& s, std::size_t freq_index, const Result<PhaseCentre>& pc);
// The "phase_reference_shift_m" field: where the phase reference was moved from the file's
// origin (metres, world frame), null when it was not moved (or the frequency is unknown).
void phase_reference_json(JsonWriter& j, const FarFieldSet& s, std::size_t freq_index);
// The texts of the phase centre and of a moved reference (one wording: exports/figure_text.hpp).
using exports::phase_centre_text;
using exports::reference_shift_text;

}  // namespace ellipsa::cli
