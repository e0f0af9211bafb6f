// Internal to the CSV reader: the grid between the two passes and after them, as named stages.
//   plan_grid        regular theta, phi and frequency axes from the distinct values of pass 1
//   guess_plan       the same from samples of the file, for a single pass (same_plan confirms it)
//   check_grid_size  before any allocation: the grid against the rows that could fill it, and
//                    its arrays against the memory there is
//   allocate         the set's arrays, zeroed, and one "seen" byte per point
//   merge_seam       the phi seam duplicates (phi 360 beside 0) merged or put in place
//   fill_poles       one sample at a pole stands for its whole ring
//   check_complete   every point present, or the first five missing named
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "importers/csv_passes.hpp"

namespace ellipsa::csv {

using SeenPoints = std::vector<std::vector<unsigned char>>;  // per frequency, per point

// An angle value and the offset of the first line that holds it.
struct Value {
    double v;
    std::size_t line_offset;
};
// A regular axis from sorted distinct values (equal steps to 1e-4 of a step); on failure sets
// `f` at the first value off ("after A expected B, found C"). `what` names the angle.
bool regular_axis(const std::vector<Value>& v, const char* what, double& start, double& step, Failure& f);

// Cost: sorting the distinct values. Errors name the first value off the regular step.
Result<GridPlan> plan_grid(const std::vector<Chunk>& chunks, const Layout& L, const TextSource& src,
                           const std::string& file);

// A plan guessed from pass 1 over samples of the file (its first and last lines and windows in
// between): theta and phi filled in as regular axes from their ends and smallest step, the
// frequencies as met. None when the samples do not make a usual (not raw) grid. Pass 2 on the
// guess (one_pass) then proves it: plan_grid on what that pass saw must give the same plan.
std::optional<GridPlan> guess_plan(const std::vector<Chunk>& samples, const Layout& L, const TextSource& src);
bool same_plan(const GridPlan& a, const GridPlan& b);

// Before allocation: refuses more than 4 points a row (plus 4096) when `rows` data rows cannot
// fill the grid (a small file with N distinct values of each angle and frequency implies N^3
// points) or when only pole rows stand for many phi; refuses arrays larger than
// options.memory_limit_bytes (or the memory available). So the heap a read takes is bounded by
// its input. Cost: none.
Status check_grid_size(const GridPlan& g, std::size_t rows, FieldContent content, const CsvReadOptions& o,
                       const std::string& file);

// The set's frequencies with zeroed arrays, and every point marked absent; on up to `threads`
// threads (the read's workers) when the arrays are large.
void allocate(const GridPlan& g, FarFieldSet& s, SeenPoints& seen, int threads);

// Seam duplicates (collected by pass 2 in every chunk): merged when they agree with the canonical
// column (the test of duplicate rows), put in place when it is absent, refused otherwise.
Status merge_seam(const std::vector<Chunk>& chunks, FarFieldSet& s, SeenPoints& seen, const Layout& L,
                  const TextSource& src, const std::string& file);

// A single sample at theta 0 or 180 stands for the ring: its Cartesian vector (no z part at a
// pole) is turned onto the theta/phi basis of every other phi. Magnitude-only data cannot be
// turned; returns true when such data has a lone pole sample (the completeness check says why).
bool fill_poles(FarFieldSet& s, SeenPoints& seen);

// Every point present, or an Error naming the first five missing and how many there are.
Status check_complete(const FarFieldSet& s, const SeenPoints& seen, const Layout& L, bool lone_pole_without_phase,
                      const std::string& file);

}  // namespace ellipsa::csv
