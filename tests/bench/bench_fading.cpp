// Fading benchmark: prints figures, never fails on a slow machine.
//   the random-field simulation, 1e5 realisations of 100 plane waves for three antennas on a
//   1-degree grid (target: under 2 s on the 2-core machine), on one thread and on two, wall and
//   CPU time; with a dominant wave; with a random orientation per realisation (interpolated fields)
//   the exact combining figures (selection and maximal ratio at two outages)
#include <ctime>
#include <cstdio>

#include "pattern/combining.hpp"
#include "pattern/fading.hpp"
#include "tests/bench/best_time.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {
double cpu_s() { return double(std::clock()) / CLOCKS_PER_SEC; }
}  // namespace

int main() {
    const Environment e = urbanish_environment();
    const FarFieldSet a = diversity_fixture(ReferenceKind::dipole, {}, 1.0);
    const FarFieldSet b = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(40, 0, 0), 1.0);
    const FarFieldSet c = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 10, 0), 1.0);
    const std::vector<FadingAntenna> three{{&a, 0}, {&b, 0}, {&c, 0}};
    FadingOptions o;
    o.realisations = 100000;
    for (int threads : {1, 2}) {
        o.threads = threads;
        const double c0 = cpu_s();
        double mean = 0;
        const double ms = best_ms(3, [&] { mean = simulate_fading(three, e, o)->antennas[0].mean; });
        std::printf("fading, 1e5 realisations x 100 waves, 3 antennas, 1-deg grid, %d thread%s: %7.0f ms wall "
                    "(best of 3; %.0f ms CPU each; target < 2000 ms)  mean A %.3f dBi\n",
                    threads, threads > 1 ? "s" : "", ms, (cpu_s() - c0) * 1000 / 3, to_db(mean));
    }
    o.threads = 1;
    o.dominant = DominantWave{90, 0, incoming_field(WavePolarisation::vertical, 90, 0), 5};
    double ms = best_ms(1, [&] { (void)simulate_fading(three, e, o); });
    std::printf("  with a dominant wave (Rician levels by Marcum Q): %7.0f ms\n", ms);
    o.dominant.reset();
    o.random_tilt_max_deg = 180;
    o.realisations = 20000;
    ms = best_ms(1, [&] { (void)simulate_fading(three, e, o); });
    std::printf("  with a random orientation per realisation, 2e4 realisations: %7.0f ms (%.1f us per realisation)\n", ms,
                ms * 1000 / 20000);
    CombiningFigures f;
    ms = best_ms(5, [&] { f = *combine_two_branches({1.0, 0.4, 0.6}, {0.01, 0.1}); });
    std::printf("exact combining, two outages (selection series + maximal ratio, levels solved): %.3f ms  "
                "(selection gain at 1 %%: %.3f dB)\n",
                ms, f.outages[0].selection_gain_db);
}
