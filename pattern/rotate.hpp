// Re-orienting an antenna: a rotation of the whole pattern, E'(r) = R E(R^T r), done on the
// Cartesian field vector and projected back on the world's theta-hat and phi-hat (conventions.md).
//
// When R maps every grid direction onto a grid direction (quarter turns about the axes on grids
// whose steps divide 90 deg, turns about z by multiples of the phi step, half turns), the result
// is exact: each sample is another sample's field turned by R (a permutation plus the basis
// change), with no interpolation. Otherwise the field is resampled at R^T r by interpolation
// (pattern/interpolate.hpp, on the Cartesian vector with the phase centre's linear phase removed).
#pragma once
#include <cstddef>
#include <optional>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// For each grid sample k, the sample whose direction R brings to sample k's direction (within
// 1e-7 deg), or nullopt when some direction has no sample there. At a pole, where every phi
// column is the same direction, the column whose theta-hat R turns onto the destination's is
// chosen when it exists (then the basis change is diagonal). One pass over the grid.
std::optional<std::vector<std::size_t>> grid_permutation(const Grid& g, const Mat3& r);

// The turned pattern on the same grid, at every frequency.
// Complex data: any rotation (resampling needs the full sphere). Total-only data: the power
// moves with the direction. Magnitude-only data: only exact rotations whose basis change keeps
// theta and phi apart (turns about z, the half turn for up = -z), since the split of a turned
// field between theta and phi depends on the phase between them. Errors say which case failed.
// Costs one pass over the grid per frequency (plus a bilinear interpolation per sample when
// resampling).
Result<FarFieldSet> rotate_pattern(const FarFieldSet& s, const Mat3& r);

// True when rotate_pattern(s-on-g, r) is exact (a permutation of samples).
inline bool rotation_is_exact(const Grid& g, const Mat3& r) { return grid_permutation(g, r).has_value(); }

}  // namespace ellipsa
