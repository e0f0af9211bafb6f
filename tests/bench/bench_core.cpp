// Core kernel benchmark: prints figures, never fails on a slow machine.
//   all bases + AR + Stokes for 1 million directions (target well under 50 ms, one thread)
//   full-sphere integration of a 0.5-degree grid (target well under 50 ms)
#include <chrono>
#include <cstdio>
#include <vector>

#include "tests/bench/best_time.hpp"
#include "pattern/integrate.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;


int main() {
    const std::size_t n = 1000000;
    std::vector<cplx> et(n), ep(n);
    std::vector<double> ph(n), cph(n), sph(n);
    for (std::size_t k = 0; k < n; ++k) {
        et[k] = std::polar(1.0 + 0.001 * double(k % 997), 0.001 * double(k));
        ep[k] = std::polar(0.5 + 0.002 * double(k % 331), -0.0007 * double(k));
        ph[k] = 6.283 * double(k) / double(n);
        cph[k] = std::cos(ph[k]);
        sph[k] = std::sin(ph[k]);
    }
    DecompositionBuffer buffer(n);
    const DecompositionArrays& o = buffer.arrays();
    double ms = best_ms(5, [&] { decompose_many(n, et.data(), ep.data(), cph.data(), sph.data(), Ludwig3Reference::x, o); });
    std::printf("decompose 1e6 directions (all bases, AR, tilt, Stokes): %8.2f ms  (%.1f M dir/s; target < 50 ms)\n",
                ms, 1e-3 * double(n) / ms);

    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    a.length_wl = 1.25;
    FarFieldSet s = synthesize(a, 0.5, 1e9);
    double p = 0;
    ms = best_ms(5, [&] { p = radiated_power(s.grid, s.frequencies[0]); });
    std::printf("integrate 0.5-deg full sphere (%zu samples): %8.3f ms  (P/4pi = %.6f; target < 50 ms)\n",
                s.grid.size(), ms, p / (4 * pi));
    return 0;
}
