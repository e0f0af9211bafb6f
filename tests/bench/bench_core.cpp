// Core kernel benchmark: prints figures, never fails on a slow machine.
//   one component's power over 1 million samples, against the per-sample code it replaced
//   full-sphere integration of a 0.5-degree grid (target well under 50 ms)
#include <chrono>
#include <cstdio>
#include <vector>

#include "tests/bench/best_time.hpp"
#include "pattern/components.hpp"
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
    // One component's power over n samples: the core kernel against the per-sample switch the
    // viewer's surface used before (kept here as the baseline) and against decompose() per sample
    // (what the peak search and the cuts used for components other than total).
    std::vector<double> out(n);
    const Component comps[] = {Component::total, Component::theta, Component::rhcp, Component::co};
    for (Component c : comps) {
        const double t_new = best_ms(7, [&] {
            component_power_many(n, et.data(), ep.data(), cph.data(), sph.data(), Ludwig3Reference::x, c, out.data());
        });
        const double t_old = best_ms(7, [&] {
            for (std::size_t k = 0; k < n; ++k) {
                const cplx a = et[k], b = ep[k];
                double v = 0;
                switch (c) {
                    case Component::total: v = std::norm(a) + std::norm(b); break;
                    case Component::theta:
                    case Component::vertical: v = std::norm(a); break;
                    case Component::phi:
                    case Component::horizontal: v = std::norm(b); break;
                    case Component::rhcp: v = std::norm(rhcp(a, b)); break;
                    case Component::lhcp: v = std::norm(lhcp(a, b)); break;
                    case Component::co:
                    case Component::cross: {
                        CoCross cc = ludwig3(a, b, cph[k], sph[k], Ludwig3Reference::x);
                        v = std::norm(c == Component::co ? cc.co : cc.cross);
                        break;
                    }
                }
                out[k] = v;
            }
        });
        const double t_dec = best_ms(3, [&] {
            for (std::size_t k = 0; k < n; ++k) out[k] = component_power(decompose(et[k], ep[k], ph[k], Ludwig3Reference::x), c);
        });
        std::printf("component power %-6s 1e6 samples: %6.2f ms  (previous per-sample switch %6.2f ms: %.2fx; "
                    "decompose() per sample %6.1f ms)\n",
                    to_string(c), t_new, t_old, t_old / t_new, t_dec);
    }
    {
        FarFieldSet g = synthesize(ReferenceAntenna{}, 0.5, 1e9);
        std::vector<double> grid(g.grid.size());
        const double t = best_ms(7, [&] { component_power_grid(g, 0, Component::co, grid.data()); });
        std::printf("component_power_grid co, 0.5-deg full sphere (%zu samples): %6.2f ms\n", g.grid.size(), t);
    }
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    a.length_wl = 1.25;
    FarFieldSet s = synthesize(a, 0.5, 1e9);
    double p = 0;
    const double ms = best_ms(5, [&] { p = radiated_power(s.grid, s.frequencies[0]); });
    std::printf("integrate 0.5-deg full sphere (%zu samples): %8.3f ms  (P/4pi = %.6f; target < 50 ms)\n",
                s.grid.size(), ms, p / (4 * pi));
    return 0;
}
