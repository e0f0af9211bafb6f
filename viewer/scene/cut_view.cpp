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
void add_curves(CutData& cd, const FarFieldSet& p, int which, const CutSamples& c, unsigned components) {
    for (Component comp : all_components) {
        if (!((components >> unsigned(comp)) & 1u)) continue;
        if (component_unavailable(p, comp)) continue;
        CutCurve cv{comp, which, {}};
        for (double v : cut_power(p, c, comp)) cv.db.push_back(std::isnan(v) ? v : to_db(v));
        cd.curves.push_back(std::move(cv));
    }
}
}  // namespace

CutData build_cut_data(const FarFieldSet& a, std::size_t fa, const FarFieldSet* b, std::size_t fb, const CutSpec& spec,
                       unsigned components) {
    CutData cd;
    cd.spec = spec;
    const double step = std::max(0.25, default_cut_step(a.grid));
    CutSamples cs = sample_cut(a, fa, spec, step);
    cd.angle_deg = cs.angle_deg;
    cd.theta_deg = cs.theta_deg;
    cd.phi_deg = cs.phi_deg;
    cd.unit = db_unit(a.quantity, Component::total);
    add_curves(cd, a, 0, cs, components);
    if (b) {
        CutSamples cb = sample_cut(*b, fb, spec, step);
        if (cb.angle_deg.size() == cs.angle_deg.size()) add_curves(cd, *b, 1, cb, components);
    }
    if (cd.curves.empty()) return cd;
    cd.valid = true;
    cd.unit = db_unit(a.quantity, cd.curves[0].component);
    for (const CutCurve& cv : cd.curves)
        for (double v : cv.db)
            if (std::isfinite(v)) cd.peak_db = cd.peak_db ? std::max(*cd.peak_db, v) : v;
    const std::vector<double>& first = cd.curves[0].db;
    if (std::none_of(first.begin(), first.end(), [](double v) { return std::isfinite(v); })) return cd;  // nothing to measure
    std::vector<double> lin;
    for (double v : first) lin.push_back(std::isnan(v) ? v : std::pow(10.0, v / 10));
    cd.figures = beam_figures(cd.angle_deg, lin, -1, spec.kind == CutKind::phi_const);
    return cd;
}

}  // namespace ellipsa::viewer
