// Internal to the CSV reader: angle layouts that are not yet the stored theta/phi grid
// (docs/far-field-csv.md, "Angle layouts"). The passes read such a file as a regular table of
// its angles as written (GridPlan::raw); this stage turns every sample into its direction and
// its Cartesian field vector and puts it on the stored grid:
//   - theta below 0 is the opposite half-plane: (-t, p) is the direction (t, p + 180), where
//     theta-hat and phi-hat are the negatives of those at (-t, p), so E_theta and E_phi change
//     sign; phi in any window is taken modulo 360;
//   - positioner grids (pattern/positioner.hpp): E = E_az az-hat + E_el el-hat, projected onto
//     theta-hat and phi-hat of the direction.
// When the directions fall on a regular theta/phi grid they are placed exactly; a direction given
// twice (phi and phi + 360, a pole at several phi, both half-planes) must agree
// (same_direction_values, csv_passes.hpp), else the later row is refused naming the first; so must a
// resampled positioner table's own repeats. A positioner
// grid whose directions do not fall on a theta/phi grid is resampled: the Cartesian complex field
// is interpolated bilinearly in the positioner's angles onto theta 0..T, phi 0..360 at the
// positioner's finer step, T the widest cone about +z that the scan covers (a reading note says
// so). Cost: one pass over the table per frequency (four samples per resampled point).
#pragma once
#include <string>
#include <vector>

#include "importers/csv_grid.hpp"

namespace ellipsa::csv {

// `table` holds the table as written (grid = the angle columns as written, `lines` the line offset
// of each point's row); returns the set on the stored grid, with its reading notes.
Result<FarFieldSet> place_directions(FarFieldSet table, const std::vector<std::vector<std::size_t>>& lines, const Layout& L,
                                     const TextSource& src, const std::string& file);

}  // namespace ellipsa::csv
