// Ranking benchmark (issue 18 wants many candidates ranked fast): prints figures, never fails.
//   20 candidates (closed-form antennas in several mountings) in the four presets on a 1-degree
//   and a 2-degree grid, with the default sweep over every orientation (15-degree steps, 325
//   orientations) and without it; one thread and up to four.
#include <cstdio>
#include <vector>

#include "pattern/rank.hpp"
#include "tests/bench/best_time.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {

// Issue 18's figure: 10 candidates in three environments on a 1-degree grid with the orientation
// sweep, target under 3 s; CPU time (every thread) beside the wall time, medians of three runs.
void ten_by_three() {
    std::vector<Environment> envs;
    for (const char* name : {"uniform", "indoor", "urban"}) envs.push_back(*environment_preset(name));
    const ReferenceKind kinds[] = {ReferenceKind::dipole, ReferenceKind::short_dipole, ReferenceKind::small_loop,
                                   ReferenceKind::crossed_dipoles};
    std::vector<FarFieldSet> sets;
    for (int k = 0; k < 10; ++k) sets.push_back(diversity_fixture(kinds[k % 4], rotation_xyz_deg(10.0 * k, 7.0 * k, 0), 1.0));
    std::vector<RankCandidate> cands;
    for (const FarFieldSet& s : sets) cands.push_back({&s, "c", 0});
    const FarFieldSet ref = reference_dipole(sets.front().grid, 1e9);
    for (int threads : {1, 2}) {
        RankOptions o;
        o.orientations = true;
        o.threads = threads;
        const CpuWall t = median_cpu_wall_ms(3, [&] { (void)rank_candidates(cands, {&ref, "ref", 0}, envs, o); });
        std::printf("rank 10 candidates x 3 environments, 1-deg grid, orientation sweep, %d thread%s: %7.0f ms CPU, "
                    "%7.0f ms wall (medians of 3; target < 3000 ms)\n",
                    threads, threads > 1 ? "s" : "", t.cpu_ms, t.wall_ms);
    }
}

}  // namespace

int main() {
    ten_by_three();
    std::vector<Environment> envs;
    for (const EnvironmentPreset& p : environment_presets()) envs.push_back(*environment_preset(p.name));
    for (double step : {2.0, 1.0}) {
        std::vector<FarFieldSet> sets;
        const ReferenceKind kinds[] = {ReferenceKind::dipole, ReferenceKind::short_dipole, ReferenceKind::small_loop,
                                       ReferenceKind::crossed_dipoles};
        for (int k = 0; k < 20; ++k)
            sets.push_back(diversity_fixture(kinds[k % 4], rotation_xyz_deg(10.0 * k, 7.0 * k, 0), step));
        std::vector<RankCandidate> cands;
        for (const FarFieldSet& s : sets) cands.push_back({&s, "c", 0});
        const FarFieldSet ref = reference_dipole(sets.front().grid, 1e9);
        for (bool turned : {false, true})
            for (int threads : {1, 4}) {
                RankOptions o;
                o.orientations = turned;
                o.threads = threads;
                const double ms = best_ms(1, [&] { (void)rank_candidates(cands, {&ref, "ref", 0}, envs, o); });
                std::printf("rank 20 candidates x %zu environments, %.0f-deg grid, %s, %d thread%s: %8.1f ms "
                            "(%.2f ms per candidate and environment)\n",
                            envs.size(), step, turned ? "orientation sweep" : "no sweep", threads, threads > 1 ? "s" : "",
                            ms, ms / double(cands.size() * envs.size()));
            }
    }
}
