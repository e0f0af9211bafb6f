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

int main() {
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
