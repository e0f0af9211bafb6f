// What `ellipsa render` makes of its options and how it writes its file, shared with the Python
// module (Pattern.write_view), so both refuse the same values with the same words and write the
// same bytes. The ranges, choices and defaults live here and in viewer::SnapshotOptions (the
// defaults); the command adds the checks to its options (they show in --help), and
// render_options() applies them to values that come from elsewhere.
#pragma once
#include <optional>
#include <string>

#include <CLI/CLI.hpp>

#include "exports/render.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "viewer/snapshot.hpp"

namespace ellipsa::cli {

// The headless renderer's image limits (--size; exports::parse_pixel_size reads it).
inline constexpr exports::PixelLimits render_limits{64, 64, 8192};

// One check per option, each the one statement of its range or choices.
struct RenderChecks {
    CLI::Validator component, color_by, colormap, view, size, range;
};
const RenderChecks& render_checks();

// The options as the command line gives them: names and texts ("35,22", "1200x900"); what is not
// given is the default (viewer::SnapshotOptions).
struct RenderChoices {
    std::optional<std::string> component, color_by, colormap, view, size;
    std::optional<double> range_db;
    bool glyphs = false, software = false;
};

// The snapshot options the choices describe (frequency index 0: the caller picks it), or an Error
// whose message is the command's usage message, naming its option ("--range: expected a number
// from 1 to 200, found \"500\"").
Result<viewer::SnapshotOptions> render_options(const RenderChoices& c);

// The text the command line takes for a pair of numbers, written shortest: "35,22" (--view) with
// sep ',', "640x480" (--size) with sep 'x'.
std::string pair_text(double a, double b, char sep);

// Before any work: an --out name the command cannot write is a usage Error ("--out: expected a
// file name ending in .png, .glb or .ply, found ..."). What is at the path is checked by
// io::check_destination (an Error, not a usage one).
Status check_render_out(const std::string& out);

// Writes `out` by its extension: .png the snapshot (headless EGL), .glb/.ply the surface itself
// (no GL). Returns what the command prints after "wrote OUT ": the image size, or what the
// surface file holds. Takes the process's one turn at the 3D renderer (viewer::snapshot_turn).
Result<std::string> write_render(const FarFieldSet& s, const viewer::SnapshotOptions& o, const std::string& out, bool force);

}  // namespace ellipsa::cli
