#include "viewer/scene/demo_scene.hpp"

#include "pattern/reference.hpp"

namespace ellipsa::viewer {

std::vector<FarFieldSet> demo_patterns(double step_deg) {
    std::vector<FarFieldSet> out;
    auto add = [&](ReferenceAntenna a, const char* name) {
        FarFieldSet s = synthesize(a, step_deg, 2.45e9);
        s.name = name;
        s.source = "built-in demo: " + describe(a);
        s.note = "Closed-form model generated in memory (no example files found).";
        out.push_back(std::move(s));
    };
    ReferenceAntenna turnstile;
    turnstile.kind = ReferenceKind::crossed_dipoles;
    turnstile.phase_deg = -90;  // right-hand circular toward +z
    add(turnstile, "turnstile (crossed dipoles)");
    ReferenceAntenna dipole;
    dipole.kind = ReferenceKind::dipole;
    dipole.length_wl = 0.5;
    add(dipole, "half-wave dipole");
    ReferenceAntenna loop;
    loop.kind = ReferenceKind::small_loop;
    add(loop, "small loop");
    return out;
}

}  // namespace ellipsa::viewer
