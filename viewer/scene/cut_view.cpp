#include "viewer/scene/cut_view.hpp"

#include <algorithm>
#include <cmath>

#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

std::optional<CutSpec> cut_spec_for(const ViewerSettings& s, const std::optional<double>& pin_theta_deg,
                                    const std::optional<double>& pin_phi_deg) {
    if (s.cut_kind == 0 || s.cut_kind == 1) {
        if (!std::isfinite(s.cut_angle_deg)) return std::nullopt;
        return s.cut_kind == 0 ? CutSpec::phi_cut(s.cut_angle_deg) : CutSpec::theta_cut(std::clamp(s.cut_angle_deg, 0.0, 180.0));
    }
    if (!pin_theta_deg || !pin_phi_deg || !std::isfinite(*pin_theta_deg) || !std::isfinite(*pin_phi_deg)) return std::nullopt;
    return CutSpec::through(*pin_theta_deg, *pin_phi_deg, false);
}

namespace {
std::vector<Component> available(const FarFieldSet& p, unsigned components) {
    std::vector<Component> out;
    for (Component comp : all_components)
        if (((components >> unsigned(comp)) & 1u) && !component_unavailable(p, comp)) out.push_back(comp);
    return out;
}
void add_curves(CutData& cd, const ComponentCut& c, int which) {
    for (std::size_t i = 0; i < c.components.size(); ++i) {
        CutCurve cv{c.components[i], which, {}, c.beams[i]};
        cv.db.reserve(c.power[i].size());
        for (double v : c.power[i]) cv.db.push_back(std::isnan(v) ? v : to_db(v));
        cd.curves.push_back(std::move(cv));
    }
}
}  // namespace

CutData build_cut_data(const FarFieldSet& a, std::size_t fa, const FarFieldSet* b, std::size_t fb, const CutSpec& spec,
                       unsigned components) {
    CutData cd;
    cd.spec = spec;
    const double step = std::max(0.25, default_cut_step(a.grid));
    const std::vector<Component> ca = available(a, components);
    if (ca.empty()) return cd;
    auto cut_a = compute_cut(a, fa, spec, ca, step);
    if (!cut_a) {
        cd.why = cut_a.error().message;
        return cd;
    }
    cd.a = std::move(*cut_a);
    cd.angle_deg = cd.a->samples.angle_deg;
    add_curves(cd, *cd.a, 0);
    if (b) {
        auto cut_b = compute_cut(*b, fb, spec, available(*b, components), cd.a->samples.step_deg);
        if (cut_b && cut_b->samples.angle_deg.size() == cd.angle_deg.size()) {
            cd.b = std::move(*cut_b);
            add_curves(cd, *cd.b, 1);
        }
    }
    cd.valid = true;
    cd.unit = db_unit(a.quantity, cd.curves[0].component);
    for (const CutCurve& cv : cd.curves)
        for (double v : cv.db)
            if (std::isfinite(v)) cd.peak_db = cd.peak_db ? std::max(*cd.peak_db, v) : v;
    return cd;
}

}  // namespace ellipsa::viewer
