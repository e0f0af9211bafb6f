// Patterns split over files, merged into one set (docs/far-field-csv.md, "Data split over files").
//
// A range often writes one file per frequency, or one per polarisation (a co-polar and a
// cross-polar scan; an E_theta and an E_phi scan, each with magnitude and phase). Read one by
// one, each file is a FarFieldSet; merge_sets() makes the one pattern they describe:
//   - by frequency: sets holding the same part (usually the whole field) and distinct
//     frequencies become one multi-frequency set, sorted by frequency;
//   - by polarisation: the two parts of one basis (E_theta and E_phi, RHCP and LHCP, Ludwig-3
//     co and cross) are added sample by sample. Each part file stores its own component and a
//     zero for the other (importers/), so the sum is the whole field: E = E_part1 + E_part2 in
//     the theta/phi basis, because the basis change is linear.
// Both at once too: co and cross files at several frequencies each.
#pragma once
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// One set and the name it came from (the file), for messages.
struct NamedSet {
    std::string name;
    FarFieldSet set;
};

// Checks, each refused with an Error naming both files: the same grid (the first direction one
// samples and the other does not), the same quantity, content, sampling and Ludwig-3 reference;
// frequencies distinct within a part (two files at 2.45 GHz); every part at every frequency;
// the parts of one basis, each once. The result takes the first set's name, metadata and
// mounting; its source lists the files and a reading note says what was merged.
// Cost: one pass over every array; the sets are moved from.
Result<FarFieldSet> merge_sets(std::vector<NamedSet> sets);

}  // namespace ellipsa
