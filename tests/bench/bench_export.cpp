// Export benchmark: time to sample one cut and write it as SVG, PNG (1200x900) and PDF, from the
// same drawing code. Prints figures; never fails on a slow machine.
#include <chrono>
#include <cstdio>

#include "tests/bench/best_time.hpp"
#include "exports/cut_figure.hpp"
#include "exports/render.hpp"
#include "exports/report.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;
using namespace ellipsa::exports;


int main() {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    const FarFieldSet s = synthesize(a, 1.0, 2.45e9);
    const std::vector<Component> comps{Component::total, Component::rhcp, Component::lhcp};
    CutPlot plot;
    const double cut_ms = best_ms(5, [&] {
        auto c = compute_cut(s, 0, CutSpec::phi_cut(0), comps);
        plot = make_cut_plot(s, *c, {});
    });
    std::printf("cut: sample + 3 components + beam figures (1 deg grid, 1440 samples): %8.2f ms\n", cut_ms);
    const RenderSize size;  // 1200x900 px at 150 dpi
    for (FileFormat f : {FileFormat::svg, FileFormat::png, FileFormat::pdf}) {
        for (PlotStyle st : {PlotStyle::polar, PlotStyle::rect}) {
            plot.style = st;
            std::size_t bytes = 0;
            const double ms = best_ms(5, [&] {
                auto r = render_image([&](cairo_t* cr, double w, double h) { draw_cut_plot(cr, plot, w, h); }, f, size);
                bytes = r.ok() ? r->size() : 0;
            });
            std::printf("cut plot %-5s %-3s (1200x900, 3 curves): %8.2f ms per figure  (%zu kB)\n",
                        st == PlotStyle::polar ? "polar" : "rect", to_string(f), ms, bytes / 1024);
        }
    }
    // A whole report without 3D views (those are the viewer's cost): 3 patterns x 3 frequencies,
    // 4 cuts each as SVG + PNG + CSV, plus the comparison.
    std::vector<ReportInput> in;
    for (int k = 0; k < 3; ++k) {
        ReferenceAntenna r;
        r.kind = k == 0 ? ReferenceKind::dipole : k == 1 ? ReferenceKind::crossed_dipoles : ReferenceKind::loop;
        r.orientation = rotation_xyz_deg(20.0 * k, 0, 15.0 * k);
        ReportInput ri;
        ri.set = synthesize(r, 2.0, 2.4e9);
        for (double f : {2.45e9, 2.5e9}) {
            FarField ff = ri.set.frequencies[0];
            ff.frequency_hz = f;
            ri.set.frequencies.push_back(ff);
        }
        ri.path = "bench" + std::to_string(k) + ".csv";
        in.push_back(std::move(ri));
    }
    std::size_t nfiles = 0;
    const double rep_ms = best_ms(2, [&] {
        auto r = build_report(in, ReportOptions{});
        nfiles = r.ok() ? r->size() : 0;
    });
    std::printf("report, 3 patterns x 3 frequencies, no 3D views (%zu files):  %8.0f ms\n", nfiles, rep_ms);
    return 0;
}
