// Viewer scene benchmark: prints figures, never fails on a slow machine.
//   mesh rebuild on a component or colouring switch (target < 20 ms) for 1-degree and 0.5-degree grids,
//   polarisation glyphs, one hover pick (ray against every triangle), and the window's state
//   machinery: refresh() of the derived data when nothing changed (every frame) and after a
//   range change (surface, glyphs, cut ring rebuilt).
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <string>
#include <vector>

#include "pattern/reference.hpp"
#include "viewer/scene/camera.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene/picking.hpp"
#include "viewer/scene/surface_mesh.hpp"
#include "viewer/state/apply.hpp"
#include "viewer/state/derived.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

template <class F>
double median_ms(int reps, F&& f) {
    std::vector<double> t;
    for (int r = 0; r < reps; ++r) {
        auto t0 = std::chrono::steady_clock::now();
        f();
        t.push_back(std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count());
    }
    std::sort(t.begin(), t.end());
    return t[t.size() / 2];
}

int main() {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    for (double step : {1.0, 0.5}) {
        FarFieldSet s = synthesize(a, step, 2.45e9);
        std::printf("grid %.1f deg (%zu samples)\n", step, s.grid.size());
        SurfaceMesh m;
        struct Case {
            const char* label;
            Component comp;
            ColorBy by;
        };
        const Case cases[] = {{"total, coloured by itself", Component::total, ColorBy::component},
                              {"RHCP, coloured by axial ratio", Component::rhcp, ColorBy::axial_ratio},
                              {"co-polar, coloured by tilt", Component::co, ColorBy::tilt}};
        for (auto [label, comp, by] : cases) {
            SurfaceOptions o;
            o.component = comp;
            o.color_by = by;
            const double ms = median_ms(7, [&] { m = *build_surface(s, 0, o); });
            std::printf("  %-44s %8.2f ms   (target < 20 ms)\n", (std::string("mesh rebuild: ") + label).c_str(), ms);
        }
        GlyphOptions g;
        const double gms = median_ms(7, [&] { (void)build_glyphs(s, 0, m, g); });
        std::printf("  %-44s %8.2f ms\n", "polarisation glyphs (15 deg spacing)", gms);
        OrbitCamera cam;
        const Ray ray = ray_through_pixel(cam, 500, 330, 1000, 660);
        const double pms = median_ms(9, [&] { (void)pick_direction(m, ray); });
        std::printf("  %-44s %8.2f ms\n", "hover pick (ray vs all triangles)", pms);
        AppState st;
        apply(st, Intents{intent::AddPatterns{{s}, ""}, intent::Pin{Direction{40, 30}}});
        Derived d;
        refresh(d, st);
        const double idle_ms = median_ms(101, [&] { (void)refresh(d, st); });
        std::printf("  %-44s %8.2f us\n", "derived refresh, nothing changed (per frame)", idle_ms * 1000);
        const double range_ms = median_ms(7, [&] {
            ViewerSettings v = st.settings;
            v.range_db = v.range_db == 30 ? 40 : 30;
            apply(st, Intents{intent::ChangeSettings{v}});
            (void)refresh(d, st);
        });
        std::printf("  %-44s %8.2f ms\n", "apply + refresh after a range change", range_ms);
    }
    return 0;
}
