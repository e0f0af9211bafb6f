#include "viewer/state/derived.hpp"

#include <chrono>
#include <cmath>

#include "pattern/peak.hpp"
#include "pattern/vec3.hpp"

namespace ellipsa::viewer {

double band_value(const FrequencyFigures& f, int q) {
    const double nan = std::nan("");
    auto v = [&](const std::optional<double>& x) { return x ? *x : nan; };
    switch (q) {
        case 0: return f.summary.peak_db;
        case 1: return v(f.summary.directivity_dbi);
        case 2: return f.summary.power.radiation_efficiency ? 100 * *f.summary.power.radiation_efficiency : nan;
        case 3: return !f.meg.empty() && f.meg[0].meg ? to_db(*f.meg[0].meg) : nan;
        case 4: return v(f.summary.axial_ratio_db);
        case 5: return v(f.summary.hpbw_elevation_deg);
        case 6: return v(f.summary.hpbw_azimuth_deg);
        case 7: return v(f.summary.front_to_back_db);
        case 8: return v(f.ar_beamwidth_elevation.width_deg);
        default: return nan;
    }
}

namespace {

double ms_since(std::chrono::steady_clock::time_point t0) {
    return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
}

// A's and B's ids and frequencies (0 when absent).
struct Shown {
    const LoadedPattern* a = nullptr;
    const LoadedPattern* b = nullptr;
    int a_id = 0, b_id = 0;
    int a_ref = 0, b_ref = 0;  // LoadedPattern::reference_id
    std::size_t fa = 0, fb = 0;
};
Shown shown(const AppState& s) {
    Shown w;
    w.a = s.active_pattern();
    w.b = w.a ? s.compare_pattern() : nullptr;
    if (w.a) w.a_id = w.a->id, w.a_ref = w.a->reference_id, w.fa = s.freq;
    if (w.b) w.b_id = w.b->id, w.b_ref = w.b->reference_id, w.fb = s.freq_for(*w.b);
    return w;
}

SurfaceKey surface_key(const AppState& s, const Shown& w) {
    const ViewerSettings& st = s.settings;
    SurfaceKey k{w.a_id, w.fa, st.component, st.color_by, st.range_db, st.gain_map, 0, 0};
    if (st.color_by == ColorBy::difference) k.b = w.b_id, k.fb = w.fb;
    return k;
}

// `previous`: the surface shown until now, whose arrays the new one reuses (build_surface()).
SurfaceView build_surface_view(const AppState& s, const Shown& w, SurfaceMesh&& previous) {
    SurfaceView v;
    if (!w.a) return v;
    const auto t0 = std::chrono::steady_clock::now();
    SurfaceOptions o;
    o.component = s.settings.component;
    o.color_by = s.settings.color_by;
    o.range_db = s.settings.range_db;
    o.gain_map = s.settings.gain_map;
    const bool diff = o.color_by == ColorBy::difference && w.b;
    auto m = build_surface(w.a->set, w.fa, o, diff ? &w.b->set : nullptr, w.fb, std::move(previous));
    if (m) v.mesh = std::move(*m);
    else v.error = m.error().message;
    v.build_ms = ms_since(t0);
    return v;
}

CutKey cut_key(const AppState& s, const Shown& w) {
    const ViewerSettings& st = s.settings;
    CutKey k{w.a_id, w.b_id, w.fa, w.fb, st.cut_kind, 0, std::nullopt, st.cut_components};
    if (st.cut_kind == 2) k.pin = s.pinned;
    else k.angle_deg = st.cut_angle_deg;
    return k;
}

CutData build_cut_view(const AppState& s, const Shown& w) {
    if (!w.a) return {};
    const auto spec = cut_spec_for(s.settings, s.pinned ? std::optional(s.pinned->theta_deg) : std::nullopt,
                                   s.pinned ? std::optional(s.pinned->phi_deg) : std::nullopt);
    if (!spec) return {};
    return build_cut_data(w.a->set, w.fa, w.b ? &w.b->set : nullptr, w.fb, *spec, s.settings.cut_components);
}

std::optional<DirectionProbe> probe_at(const Shown& w, const std::optional<Direction>& at) {
    if (!w.a || !at) return std::nullopt;
    DirectionProbe p{probe(w.a->set, w.fa, at->theta_deg, at->phi_deg), std::nullopt};
    if (w.b) p.b = probe(w.b->set, w.fb, at->theta_deg, at->phi_deg);
    return p;
}

void refresh_band(Derived& d, const AppState& s, const Shown& w) {
    if (!s.band_open) return;
    d.band.update(BandKey{w.a_id}, [&] {
        BandView v;
        if (!w.a) return v;
        const auto t0 = std::chrono::steady_clock::now();
        BandOptions o;
        if (auto e = environment_preset("uniform")) o.environments.push_back(*e);
        v.figures = band_figures(w.a->set, o);
        for (const FrequencyFigures& f : v.figures) v.frequency_hz.push_back(w.a->set.frequencies[f.freq_index].frequency_hz);
        v.summary = band_summary(w.a->set, v.figures);
        v.compute_ms = ms_since(t0);
        return v;
    });
}

// The diversity figures; while a slider is held the orientation sweep waits and the last one stays.
void refresh_diversity(Derived& d, const AppState& s, const Shown& w, bool interacting) {
    if (!s.diversity_open && !s.fading_open) return;
    DiversityKey k{s.diversity, w.a_id, w.b_id, w.fa, w.fb, w.a_ref, w.b_ref};
    if (!s.diversity_open) k.choice.orientations = false;  // the fading panel alone needs no sweep
    const bool defer = interacting && k.choice.orientations;
    if (defer) k.choice.orientations = false;
    d.diversity.update(k, [&] {
        const DiversityView& last = d.diversity.value();  // still the previous build here
        DiversityView v;
        const auto t0 = std::chrono::steady_clock::now();
        v.figures = compute_diversity(k.choice, w.a ? &w.a->set : nullptr, w.fa, w.b ? &w.b->set : nullptr, w.fb);
        v.fading = fading_curves(v.figures);
        v.compute_ms = ms_since(t0);
        v.computed = true;
        v.sweep_pending = defer;
        if (defer) {
            v.figures.a.orientations = last.figures.a.orientations;
            v.figures.b.orientations = last.figures.b.orientations;
        }
        return v;
    });
}

}  // namespace

DerivedChanges refresh(Derived& d, const AppState& s, bool interacting) {
    const Shown w = shown(s);
    DerivedChanges c;
    const SurfaceKey sk = surface_key(s, w);
    c.surface = d.surface.update(sk, [&] { return build_surface_view(s, w, std::move(d.surface.value().mesh)); });
    const SurfaceMesh& mesh = d.surface.value().mesh;
    const GlyphKey gk{sk, s.settings.glyphs && w.a, s.settings.glyph_spacing_deg};
    c.glyphs = d.glyphs.update(gk, [&] {
        GlyphOptions g;
        g.spacing_deg = gk.spacing_deg;
        return gk.on ? build_glyphs(w.a->set, w.fa, mesh, g) : LineSet{};
    });
    const CutKey ck = cut_key(s, w);
    d.cut.update(ck, [&] { return build_cut_view(s, w); });
    c.ring = d.ring.update(RingKey{sk, ck}, [&] {
        const CutData& cd = d.cut.value();
        return cd.a ? build_cut_ring(w.a->set, mesh, cd.a->samples.theta_deg, cd.a->samples.phi_deg, {0.10f, 0.10f, 0.12f}) : LineSet{};
    });
    d.hover.update(ProbeKey{w.a_id, w.b_id, w.fa, w.fb, s.hover}, [&] { return probe_at(w, s.hover); });
    d.pinned.update(ProbeKey{w.a_id, w.b_id, w.fa, w.fb, s.pinned}, [&] { return probe_at(w, s.pinned); });
    d.summary.update(SummaryKey{w.a_id, w.fa}, [&] { return w.a ? std::optional(summarize(w.a->set, w.fa)) : std::nullopt; });
    const PeakKey peak_key{w.a_id, w.fa, s.settings.component};
    d.peak_db.update(peak_key, [&]() -> std::optional<double> {
        if (!w.a || component_unavailable(w.a->set, peak_key.component)) return std::nullopt;
        const Peak p = find_peak(w.a->set, w.fa, peak_key.component);
        return p.value > 0 ? std::optional(to_db(p.value)) : std::nullopt;
    });
    const PoincareKey pk{w.a_id, w.fa, s.settings.poincare_within_db};
    d.poincare.update(pk, [&] {
        return w.a && w.a->set.has_phase() ? poincare_cloud(w.a->set, w.fa, pk.within_db, 2000) : std::vector<PoincarePoint>{};
    });
    refresh_diversity(d, s, w, interacting);
    refresh_band(d, s, w);
    if (s.browser) {
        const BrowserView& b = *s.browser;
        d.folder.update(FolderKey{b.folder, b.all_files, b.hidden, b.reload}, [&] {
            return list_folder(b.folder, b.all_files ? BrowseFilter::all_files : BrowseFilter::patterns, b.hidden);
        });
    }
    return c;
}

glm::dvec3 surface_point(const AppState& s, const Derived& d, const Direction& at) {
    const LoadedPattern* a = s.active_pattern();
    if (!a) return glm::dvec3(0);
    const double r = surface_radius(a->set, d.surface.value().mesh, at.theta_deg, at.phi_deg);
    const Vec3 u = direction(at.theta_deg * deg, at.phi_deg * deg);
    return glm::dvec3(r * u.x, r * u.y, r * u.z);
}

}  // namespace ellipsa::viewer
