#include "pattern/rank.hpp"

#include <algorithm>
#include <cmath>

#include "pattern/combining.hpp"
#include "pattern/diversity_study.hpp"
#include "pattern/parallel.hpp"
#include "pattern/reference.hpp"

namespace ellipsa {

const char* to_string(RankScore s) {
    switch (s) {
        case RankScore::mounted: return "mounted";
        case RankScore::random: return "random";
        case RankScore::worst: return "worst";
    }
    return "mounted";
}

bool parse_rank_score(const std::string& name, RankScore& out) {
    for (RankScore s : {RankScore::mounted, RankScore::random, RankScore::worst})
        if (name == to_string(s)) {
            out = s;
            return true;
        }
    return false;
}

const char* rank_score_definition(RankScore s) {
    switch (s) {
        case RankScore::mounted:
            return "score = mean over the environments of the fading level at the outage as mounted (Rayleigh: "
                   "MEG (-ln(1 - p))) over the reference's, in dB; equal to the MEG advantage";
        case RankScore::random:
            return "score = mean over the environments of the fading level at the outage with the orientation random "
                   "too (the mixture of Rayleigh distributions over the swept orientations, solid-angle weights) over "
                   "the reference's, in dB";
        case RankScore::worst:
            return "score = mean over the environments of the MEG at the worst swept orientation over the reference's "
                   "worst, in dB";
    }
    return "";
}

Status validate(const RankOptions& o) {
    const auto fail = [](const std::string& m) -> Status { return Error{"", 0, 0, m}; };
    if (!(o.outage > 0 && o.outage < 1)) return fail("the outage must lie between 0 and 1 (exclusive)");
    if (o.threads < 1 || o.threads > 64) return fail("threads must lie between 1 and 64");
    if (!o.orientations && o.score != RankScore::mounted)
        return fail(std::string("the ") + to_string(o.score) + " score needs the orientation sweep");
    if (o.orientations)
        if (Status s = validate(o.sweep); !s) return s;
    return Ok{};
}

std::optional<double> score_part_db(const RankFigures& f, RankScore s) {
    switch (s) {
        case RankScore::mounted: return f.advantage_db;
        case RankScore::random: return f.random_advantage_db;
        case RankScore::worst: return f.worst_advantage_db;
    }
    return std::nullopt;
}

FarFieldSet reference_dipole(const Grid& g, double frequency_hz) {
    ReferenceAntenna a;  // a half-wave dipole along z: vertical
    a.kind = ReferenceKind::dipole;
    a.length_wl = 0.5;
    FarFieldSet s = synthesize_on(a, g, frequency_hz);
    s.name = "reference dipole";
    s.source = std::string(reference_dipole_description) + " (Balanis sec. 4.5), synthesised on the candidates' grid";
    return s;
}

namespace {

// The p-quantile of the received power when the orientation is random as well: the mixture of
// Rayleigh distributions with the swept orientations' MEG as means and their weights.
double random_orientation_level(const OrientationFigures& o, double p) {
    double null_share = 0, mean = 0;
    for (std::size_t k = 0; k < o.samples.size(); ++k) {
        if (o.samples[k].meg > 0)
            mean += o.random_weights[k] * o.samples[k].meg;
        else
            null_share += o.random_weights[k];
    }
    if (null_share >= p || !(mean > 0)) return 0;  // orientations that receive nothing reach the outage alone
    const auto cdf = [&](double x) {
        double f = 0;
        for (std::size_t k = 0; k < o.samples.size(); ++k)
            f += o.random_weights[k] * (o.samples[k].meg > 0 ? rayleigh_cdf(x, o.samples[k].meg) : 1.0);
        return f;
    };
    return level_at(cdf, p, rayleigh_level(p, mean));
}

RankFigures figures_of(const RankCandidate& c, const Environment& e, const RankOptions& o) {
    DiversityOptions d;
    d.orientations = o.orientations;
    d.sweep = o.sweep;
    const double phi_step = c.set->grid.phi.step_deg;
    if (o.fit_roll_to_grid && phi_step > 0 && o.sweep.roll_step_deg > 0)
        d.sweep.roll_step_deg = std::max(1.0, std::round(o.sweep.roll_step_deg / phi_step)) * phi_step;
    RankFigures f;
    auto st = study_diversity(e, d, {StudyPattern{c.set, c.path, {c.freq_index}}});
    if (!st) {
        f.meg = st.error();
        return f;
    }
    const FrequencyStudy& fs = st->patterns.front().front();
    f.meg = fs.meg;
    f.orientations = fs.orientations;
    if (f.meg && f.meg->meg > 0) f.level = rayleigh_level(o.outage, f.meg->meg);
    if (f.orientations && *f.orientations) f.random_level = random_orientation_level(**f.orientations, o.outage);
    return f;
}

std::optional<double> ratio_db(const std::optional<double>& a, const std::optional<double>& b) {
    if (!a || !b || !(*a > 0) || !(*b > 0)) return std::nullopt;
    return to_db(*a / *b);
}

std::optional<double> worst_of(const RankFigures& f) {
    if (!f.orientations || !*f.orientations) return std::nullopt;
    return (**f.orientations).min;
}

void add_advantages(RankFigures& f, const RankFigures& ref) {
    f.advantage_db = ratio_db(f.level, ref.level);
    f.random_advantage_db = ratio_db(f.random_level, ref.random_level);
    f.worst_advantage_db = ratio_db(worst_of(f), worst_of(ref));
}

// Why a row has no score: the first environment whose figure is missing, and the reason.
std::string missing_reason(const RankFigures& f, const Environment& e, RankScore s) {
    std::string why;
    if (!f.meg)
        why = "MEG unavailable: " + f.meg.error().message;
    else if (!(f.meg->meg > 0))
        why = "the antenna receives nothing (MEG 0)";
    else if (s != RankScore::mounted && f.orientations && !*f.orientations)
        why = "orientation statistics unavailable: " + f.orientations->error().message;
    else
        why = "its orientations include some that receive nothing";
    return "in the " + e.name + " environment, " + why;
}

Status check_inputs(const std::vector<RankCandidate>& candidates, const RankCandidate& reference,
                    const std::vector<Environment>& environments, const RankOptions& o) {
    if (candidates.empty()) return Error{"", 0, 0, "no candidate to rank"};
    if (environments.empty()) return Error{"", 0, 0, "no environment to rank in"};
    if (Status v = validate(o); !v) return v;
    for (const Environment& e : environments)
        if (Status v = validate(e); !v) return v;
    std::vector<const RankCandidate*> all{&reference};
    for (const RankCandidate& c : candidates) all.push_back(&c);
    for (const RankCandidate* c : all) {
        if (!c->set) return Error{c->path, 0, 0, "no pattern"};
        if (c->freq_index >= c->set->frequencies.size())
            return Error{c->path, 0, 0, "has no frequency number " + std::to_string(c->freq_index + 1)};
    }
    return Ok{};
}

void score_row(RankRow& row, const std::vector<Environment>& environments, RankScore s) {
    double sum = 0;
    for (std::size_t e = 0; e < environments.size(); ++e) {
        const std::optional<double> part = score_part_db(row.environments[e], s);
        if (!part) {
            row.unavailable_reason = missing_reason(row.environments[e], environments[e], s);
            return;
        }
        sum += *part;
    }
    row.score_db = sum / double(environments.size());
}

}  // namespace

Result<Ranking> rank_candidates(const std::vector<RankCandidate>& candidates, const RankCandidate& reference,
                                const std::vector<Environment>& environments, const RankOptions& o) {
    if (Status v = check_inputs(candidates, reference, environments, o); !v) return v.error();
    const std::size_t ne = environments.size(), na = candidates.size() + 1;  // antenna 0: the reference
    std::vector<RankFigures> figs(na * ne);
    parallel_each(figs.size(), std::size_t(o.threads), [&](std::size_t k) {
        const std::size_t a = k / ne, e = k % ne;
        figs[k] = figures_of(a == 0 ? reference : candidates[a - 1], environments[e], o);
    });
    Ranking out;
    out.score = o.score;
    out.outage = o.outage;
    out.reference.assign(figs.begin(), figs.begin() + std::ptrdiff_t(ne));
    for (std::size_t e = 0; e < ne; ++e) {
        const RankFigures& r = out.reference[e];
        if (!r.meg) return Error{reference.path, 0, 0, "reference MEG unavailable in the " + environments[e].name +
                                                          " environment: " + r.meg.error().message};
        if (!(r.meg->meg > 0)) return Error{reference.path, 0, 0, "the reference receives nothing in the " + environments[e].name + " environment"};
    }
    for (std::size_t e = 0; e < ne; ++e) {
        add_advantages(out.reference[e], out.reference[e]);
        if (!score_part_db(out.reference[e], o.score))
            return Error{reference.path, 0, 0, std::string("the reference has no ") + to_string(o.score) + " score: " +
                                                   missing_reason(out.reference[e], environments[e], o.score)};
    }
    for (std::size_t c = 0; c < candidates.size(); ++c) {
        RankRow row;
        row.input = c;
        for (std::size_t e = 0; e < ne; ++e) {
            row.environments.push_back(figs[(c + 1) * ne + e]);
            add_advantages(row.environments.back(), out.reference[e]);
        }
        score_row(row, environments, o.score);
        out.rows.push_back(std::move(row));
    }
    std::stable_sort(out.rows.begin(), out.rows.end(), [](const RankRow& a, const RankRow& b) {
        if (a.score_db && b.score_db) return *a.score_db > *b.score_db;
        return a.score_db.has_value() && !b.score_db.has_value();
    });
    return out;
}

}  // namespace ellipsa
