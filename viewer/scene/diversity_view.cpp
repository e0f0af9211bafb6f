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

const std::vector<std::string>& diversity_choice_names() {
    static const std::vector<std::string> names = [] {
        std::vector<std::string> v;
        for (const EnvironmentPreset& p : environment_presets()) v.push_back(p.name);
        v.push_back("gaussian");
        return v;
    }();
    return names;
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

Result<Environment> make_environment(const DiversityChoice& c) {
    Environment e;
    if (c.preset == "gaussian") {
        e.model = EnvironmentModel::gaussian;
        e.name = "custom";
        e.source = "user parameters";
    } else {
        auto p = environment_preset(c.preset);
        if (!p) return p.error();
        e = *p;
    }
    if (e.model == EnvironmentModel::gaussian) {
        const bool changed = e.v_mean_deg != c.v_mean_deg || e.v_spread_deg != c.v_spread_deg ||
                             e.h_mean_deg != c.h_mean_deg || e.h_spread_deg != c.h_spread_deg;
        e.v_mean_deg = c.v_mean_deg;
        e.v_spread_deg = c.v_spread_deg;
        e.h_mean_deg = c.h_mean_deg;
        e.h_spread_deg = c.h_spread_deg;
        if (changed && c.preset != "gaussian") {
            e.name += " (modified)";
            e.source += "; changed by the user";
        }
    }
    e.xpr_db = c.vertical_only ? INFINITY : c.xpr_db;
    Status ok = validate(e);
    if (!ok) return ok.error();
    return e;
}

namespace {
PatternDiversity figures_of(const FarFieldSet& s, std::size_t f, const Environment& e, const DiversityChoice& c) {
    PatternDiversity p;
    auto m = mean_effective_gain(s, f, e);
    if (m)
        p.meg = *m;
    else
        p.meg_error = m.error().message;
    if (c.orientations) {
        auto o = orientation_robustness(s, f, e, c.sweep);
        if (o)
            p.orientations = *o;
        else
            p.orientation_error = o.error().message;
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
    if (a && fa < a->frequencies.size()) d.a = figures_of(*a, fa, *e, c);
    if (a && b && fb < b->frequencies.size()) {
        d.has_b = true;
        d.b = figures_of(*b, fb, *e, c);
        auto r = envelope_correlation(*a, fa, *b, fb, *e);
        if (r)
            d.correlation = *r;
        else
            d.correlation_error = r.error().message;
        if (d.a.meg && d.b.meg && d.a.meg->meg > 0 && d.b.meg->meg > 0)
            d.meg_ratio_db = to_db(d.a.meg->meg / d.b.meg->meg);
    }
    return d;
}

}  // namespace ellipsa::viewer
