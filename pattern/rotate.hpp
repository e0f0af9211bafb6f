// Re-orienting an antenna: a rotation of the whole pattern, E'(r) = R E(R^T r), done on the
// Cartesian field vector and resampled onto the same grid.
#pragma once
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// Needs complex or total-only data on the full sphere (magnitude-only data cannot be rotated:
// the theta/phi split of the turned antenna depends on the phase between them).
Result<FarFieldSet> rotate_pattern(const FarFieldSet& s, const Mat3& r);

}  // namespace ellipsa
