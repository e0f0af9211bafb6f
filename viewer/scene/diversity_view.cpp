#include "viewer/scene/diversity_view.hpp"

#include <cmath>

namespace ellipsa::viewer {

bool DiversityChoice::operator==(const DiversityChoice& o) const {
    return preset == o.preset && xpr_db == o.xpr_db && vertical_only == o.vertical_only &&
           v_mean_deg == o.v_mean_deg && v_spread_deg == o.v_spread_deg && h_mean_deg == o.h_mean_deg &&
           h_spread_deg == o.h_spread_deg && orientations == o.orientations &&
           sweep.tilt_step_deg == o.sweep.tilt_step_deg && sweep.tilt_max_deg == o.sweep.tilt_max_deg &&
           sweep.roll_step_deg == o.sweep.roll_step_deg;
}

std::vector<std::string> diversity_choice_names() {
    std::vector<std::string> v;
    for (const EnvironmentPreset& p : environment_presets()) v.push_back(p.name);
    v.push_back("gaussian");
    return v;
}

DiversityChoice choice_from_preset(const std::string& name) {
    DiversityChoice c;
    c.preset = name;
    auto p = environment_preset(name);
    if (p) {
        c.xpr_db = std::isfinite(p->xpr_db) ? p->xpr_db : 0;
        c.vertical_only = std::isinf(p->xpr_db) && p->xpr_db > 0;
        if (p->model == EnvironmentModel::gaussian) {
            c.v_mean_deg = p->v_mean_deg;
            c.v_spread_deg = p->v_spread_deg;
            c.h_mean_deg = p->h_mean_deg;
            c.h_spread_deg = p->h_spread_deg;
        }
    }
    return c;
}

EnvironmentChoice environment_choice(const DiversityChoice& c) {
    EnvironmentChoice e;
    e.model = c.preset;
    e.xpr_db = c.vertical_only ? INFINITY : c.xpr_db;
    if (c.preset != "uniform") {
        e.v_mean_deg = c.v_mean_deg;
        e.v_spread_deg = c.v_spread_deg;
        e.h_mean_deg = c.h_mean_deg;
        e.h_spread_deg = c.h_spread_deg;
    }
    return e;
}

Result<Environment> make_environment(const DiversityChoice& c) {
    auto chosen = choose_environment(environment_choice(c));
    if (!chosen) return chosen.error();
    return chosen->environment;
}

namespace {
PatternDiversity figures_of(const FrequencyStudy& f) {
    PatternDiversity p;
    if (f.meg)
        p.meg = *f.meg;
    else
        p.meg_error = f.meg.error().message;
    if (f.orientations) {
        if (*f.orientations)
            p.orientations = **f.orientations;
        else
            p.orientation_error = f.orientations->error().message;
    }
    return p;
}
}  // namespace

DiversityFigures compute_diversity(const DiversityChoice& c, const FarFieldSet* a, std::size_t fa,
                                   const FarFieldSet* b, std::size_t fb, int curve_points) {
    DiversityFigures d;
    auto e = make_environment(c);
    if (!e) {
        d.environment_error = e.error().message;
        return d;
    }
    d.environment = *e;
    d.curve = elevation_curve(*e, curve_points);
    if (!a || fa >= a->frequencies.size()) return d;
    std::vector<StudyPattern> inputs{{a, "A", {fa}}};
    if (b && fb < b->frequencies.size()) inputs.push_back({b, "B", {fb}});
    DiversityOptions o;
    o.orientations = c.orientations;
    o.sweep = c.sweep;
    auto st = study_diversity(*e, o, inputs);
    if (!st) {
        d.a.meg_error = st.error().message;
        return d;
    }
    d.a = figures_of(st->patterns[0].front());
    if (st->pairs.empty()) return d;
    d.has_b = true;
    d.b = figures_of(st->patterns[1].front());
    const PairStudy& q = st->pairs.front();
    if (q.correlation)
        d.correlation = *q.correlation;
    else
        d.correlation_error = q.correlation.error().message;
    d.meg_ratio_db = q.meg_ratio_db;
    if (q.combining)
        d.combining = *q.combining;
    else
        d.combining_error = q.combining.error().message;
    return d;
}

FadingCurves fading_curves(const DiversityFigures& f, int points) {
    FadingCurves c;
    if (!f.a.meg || !(f.a.meg->meg > 0)) return c;
    const double ga = f.a.meg->meg;
    const double gb = f.has_b && f.b.meg && f.b.meg->meg > 0 ? f.b.meg->meg : 0;
    const double top = to_db(std::max(ga, gb));
    c.level_hi_db = 10 * std::ceil((top + 5) / 10);
    c.level_lo_db = c.level_hi_db - 50;
    const auto log_p = [](double p) { return p >= 1e-4 ? std::log10(p) : NAN; };
    for (int k = 0; k < points; ++k) {
        const double db = c.level_lo_db + (c.level_hi_db - c.level_lo_db) * k / (points - 1);
        const double x = std::pow(10.0, db / 10);
        c.level_db.push_back(db);
        c.a.push_back(log_p(rayleigh_cdf(x, ga)));
        c.b.push_back(gb > 0 ? log_p(rayleigh_cdf(x, gb)) : NAN);
        const BranchPair pair{ga, gb, f.correlation ? f.correlation->ecc : 0};
        const bool both = gb > 0 && f.combining;
        c.selection.push_back(both ? log_p(selection_cdf(x, pair)) : NAN);
        c.mrc.push_back(both ? log_p(mrc_cdf(x, pair)) : NAN);
    }
    return c;
}

}  // namespace ellipsa::viewer
