// From the file's pattern to the installed antenna: the one step every reader of patterns takes
// after importing and before any figure is computed (the command line's load, the viewer's).
//
// In order:
//  1. the mounting that applies: the file's own, replaced or extended by the request
//     (resolve_mounting, pattern/mounting.hpp);
//  2. every frequency's phase centre is estimated and kept as its interpolation centre, so that
//     interpolation (and a resampling rotation) keeps the level between samples
//     (pattern/phase_centre.hpp);
//  3. when asked, the phase reference moves to a point (or to the estimated phase centre): the
//     fields are multiplied by exp(-j k r.c), exactly. Correlation between two antennas depends on
//     their common phase reference, so this never happens unless asked;
//  4. the pattern turns by the mounting (pattern/rotate.hpp: exact when the grid maps onto itself).
// Coordinates in the request are in the world frame (after the mounting).
#pragma once
#include <optional>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/mounting.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

enum class PhaseReference { keep, phase_centre, point };

struct InstallRequest {
    std::optional<Vec3> up;        // replaces the file's mounting (pattern/mounting.hpp)
    std::vector<AxisTurn> turns;   // follow the mounting that stands
    PhaseReference reference = PhaseReference::keep;
    Vec3 reference_point_m{};      // PhaseReference::point: world frame, metres
    // false: leave the fields in the file's frame and only record the resolved mounting in
    // file_mounting (a writer then stores it as metadata; used by `ellipsa convert`).
    bool turn_fields = true;
};

// The installed pattern. Errors: a moved reference without phase, or in metres without a
// frequency; a mounting the data cannot take (pattern/rotate.hpp). Costs a phase-centre estimate
// per frequency and, when the mounting is not the identity, one rotation of the pattern.
Result<FarFieldSet> install_pattern(FarFieldSet raw, const InstallRequest& request);

}  // namespace ellipsa
