// Figures against frequency, maps and coverage: time from a loaded set to the finished figure.
// Target: a band plot over 100 frequencies in under 1 s after loading. Prints figures only.
#include <cstdio>

#include "exports/band_figure.hpp"
#include "exports/coverage_figure.hpp"
#include "exports/map_plot.hpp"
#include "exports/render.hpp"
#include "pattern/reference.hpp"
#include "best_time.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;

namespace {
// A turnstile whose quadrature phase drifts over 100 frequencies (2.40..2.50 GHz).
FarFieldSet band_set(double step_deg, int n) {
    FarFieldSet s;
    for (int k = 0; k < n; ++k) {
        ReferenceAntenna a;
        a.kind = ReferenceKind::crossed_dipoles;
        a.phase_deg = -90 + 40.0 * (k - n / 2) / n;
        FarFieldSet one = synthesize(a, step_deg, 2.40e9 + 0.1e9 * k / (n - 1));
        if (k == 0) s = one;
        else s.frequencies.push_back(std::move(one.frequencies[0]));
    }
    s.name = "turnstile";
    return s;
}
}  // namespace

int main() {
    for (double step : {5.0, 2.0, 1.0}) {
        const FarFieldSet s = band_set(step, 100);
        BandRequest r;
        r.options.environments = {*environment_preset("uniform")};
        r.panels = {BandPanel::gain, BandPanel::efficiency, BandPanel::meg, BandPanel::axial_ratio, BandPanel::beamwidth};
        BandSet b;
        const double t_fig = best_ms(2, [&] { b = compute_band_set("", s, r.options); });
        const XyFigure fig = make_band_figure({b}, {}, r);
        const double t_svg = best_ms(3, [&] {
            auto img = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, FileFormat::svg, {});
            (void)img;
        });
        const double t_png = best_ms(3, [&] {
            auto img = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, FileFormat::png, {});
            (void)img;
        });
        std::printf("band plot, 100 frequencies, %g-degree grid (%zu samples each): figures %.0f ms + SVG %.0f ms = %.0f ms "
                    "(PNG %.0f ms); target < 1000 ms\n",
                    step, s.grid.size(), t_fig, t_svg, t_fig + t_svg, t_png);
    }
    const FarFieldSet one = band_set(1.0, 2);
    MapRequest mr;
    MapPlot mp;
    const double t_map = best_ms(3, [&] { mp = *make_map_plot(one, 0, mr); });
    const double t_map_png = best_ms(3, [&] {
        auto img = render_image([&](cairo_t* cr, double w, double h) { draw_map_plot(cr, mp, w, h); }, FileFormat::png, {1200, 720, 150});
        (void)img;
    });
    std::printf("Hammer map of a 1-degree grid: values and contours %.1f ms, PNG %.0f ms\n", t_map, t_map_png);
    CoverageRequest cr;
    cr.components = {Component::total, Component::theta, Component::phi, Component::rhcp, Component::lhcp};
    const double t_cov = best_ms(3, [&] { auto c = coverage_series({&one}, {""}, {0}, cr); (void)c; });
    std::printf("coverage curves, five components, 1-degree grid: %.1f ms\n", t_cov);
    return 0;
}
