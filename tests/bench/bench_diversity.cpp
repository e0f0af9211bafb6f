// Diversity benchmark: prints figures, never fails on a slow machine.
//   MEG of one frequency on a 1-degree and a 0.5-degree grid (one pass)
//   orientation sweep, 145 orientations (tilt 0..90 step 15, roll step 15), 1 and 0.5 degree grids:
//     rolls by exact column shift, the general path (environment evaluated per orientation),
//     and the naive way (rotate_pattern resampling + MEG) for comparison
//   envelope correlation on a common grid and with resampling
#include <chrono>
#include <cstdio>

#include "tests/bench/best_time.hpp"
#include "pattern/diversity.hpp"
#include "pattern/reference.hpp"
#include "pattern/rotate.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

int main() {
    const Environment e = urbanish_environment();
    for (double step : {1.0, 0.5}) {
        const FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 10, 0), step);
        double m = 0;
        double ms = best_ms(5, [&] { m = mean_effective_gain(s, 0, e)->meg; });
        std::printf("MEG, %.1f-deg grid (%zu samples): %8.3f ms  (MEG %.3f dB; target < 10 ms)\n", step, s.grid.size(),
                    ms, to_db(m));
        OrientationSweep sw;
        OrientationFigures o;
        ms = best_ms(3, [&] { o = *orientation_robustness(s, 0, e, sw); });
        std::printf("orientation sweep, %zu orientations, %.1f-deg grid, exact roll shifts: %8.2f ms  (%.3f ms each; "
                    "target < 1 s total)\n",
                    o.samples.size(), step, ms, ms / double(o.samples.size()));
        OrientationSweep sw2 = sw;
        sw2.roll_step_deg = step == 1.0 ? 15.5 : 15.25;  // not a multiple of the phi step: general path
        ms = best_ms(1, [&] { o = *orientation_robustness(s, 0, e, sw2); });
        std::printf("orientation sweep, %zu orientations, %.1f-deg grid, general path: %8.2f ms  (%.3f ms each)\n",
                    o.samples.size(), step, ms, ms / double(o.samples.size()));
        const int n_naive = 5;
        ms = best_ms(1, [&] {
            for (int k = 0; k < n_naive; ++k) {
                auto r = rotate_pattern(s, rotation_x((15.0 * k) * deg));
                (void)mean_effective_gain(*r, 0, e);
            }
        });
        std::printf("resample-then-integrate (rotate_pattern + MEG), %.1f-deg grid: %8.2f ms each (%.0f x slower than "
                    "a shifted roll)\n",
                    step, ms / n_naive, (ms / n_naive) / (best_ms(3, [&] { (void)orientation_robustness(s, 0, e, sw); }) / 145));
        const FarFieldSet t = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(0, 50, 0), step);
        const FarFieldSet t2 = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(0, 50, 0), step * 2);
        double c = 0;
        ms = best_ms(5, [&] { c = envelope_correlation(s, 0, t, 0, e)->ecc; });
        std::printf("ECC, common %.1f-deg grid: %8.3f ms  (ECC %.4f)\n", step, ms, c);
        ms = best_ms(3, [&] { c = envelope_correlation(s, 0, t2, 0, e)->ecc; });
        std::printf("ECC, second pattern resampled from %.1f deg: %8.3f ms  (ECC %.4f)\n", step * 2, ms, c);
    }
}
