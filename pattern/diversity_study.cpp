#include "pattern/diversity_study.hpp"

#include <cmath>

namespace ellipsa {

namespace {

Result<std::vector<std::size_t>> studied_frequencies(const StudyPattern& p, const DiversityOptions& o) {
    if (!p.set || p.set->frequencies.empty()) return Error{p.path, 0, 0, "holds no frequency"};
    if (!p.frequencies.empty()) {
        for (std::size_t k : p.frequencies)
            if (k >= p.set->frequencies.size()) return Error{p.path, 0, 0, "has no frequency number " + std::to_string(k + 1)};
        return p.frequencies;
    }
    if (o.frequency_hz) {
        auto k = find_frequency(*p.set, *o.frequency_hz, p.path);
        if (!k) return k.error();
        return std::vector<std::size_t>{*k};
    }
    std::vector<std::size_t> all(p.set->frequencies.size());
    for (std::size_t k = 0; k < all.size(); ++k) all[k] = k;
    return all;
}

FrequencyStudy study_frequency(const FarFieldSet& s, std::size_t k, const Environment& e, const DiversityOptions& o) {
    FrequencyStudy f;
    f.index = k;
    f.frequency_hz = s.frequencies[k].frequency_hz;
    f.meg = mean_effective_gain(s, k, e);
    if (o.orientations) f.orientations = orientation_robustness(s, k, e, o.sweep);
    return f;
}

Result<CombiningFigures> combining_of(PairStudy& q, const FrequencyStudy& f1, const FrequencyStudy& f2,
                                      const std::vector<double>& outages) {
    if (!q.correlation) return Error{"", 0, 0, "needs the envelope correlation, which is unavailable"};
    if (!f1.meg || !f2.meg) return Error{"", 0, 0, "needs the MEG of both patterns, which is unavailable"};
    const BranchPair b{f1.meg->meg, f2.meg->meg, q.correlation->ecc};
    auto c = combine_two_branches(b, outages);
    if (!c) return c;
    for (const OutageFigures& o : c->outages)
        if (o.outage == 0.01) q.selection_gain_1pct_db = o.selection_gain_db;
    if (!q.selection_gain_1pct_db) {
        auto one = combine_two_branches(b, {0.01});
        if (one) q.selection_gain_1pct_db = one->outages.front().selection_gain_db;
    }
    return c;
}

PairStudy study_pair(const StudyPattern& p1, const FrequencyStudy& f1, const StudyPattern& p2,
                     const std::vector<FrequencyStudy>& s2, const Environment& e,
                     const std::vector<double>& outages) {
    PairStudy q;
    q.index = f1.index;
    q.frequency_hz = f1.frequency_hz;
    const FrequencyStudy* partner = nullptr;
    if (s2.size() == 1) {
        partner = &s2.front();
        const double f2 = partner->frequency_hz;
        q.frequencies_differ = q.frequency_hz > 0 && f2 > 0 && std::abs(f2 - q.frequency_hz) > 0.005 * q.frequency_hz;
    } else {
        auto k = find_frequency(*p2.set, q.frequency_hz, p2.path);
        if (!k) {
            q.correlation = k.error();
            return q;
        }
        for (const FrequencyStudy& f : s2)
            if (f.index == *k) partner = &f;
        if (!partner) {
            q.correlation = Error{p2.path, 0, 0, "was not studied at " + format_frequency(q.frequency_hz)};
            return q;
        }
    }
    q.index2 = partner->index;
    q.frequency2_hz = partner->frequency_hz;
    q.correlation = envelope_correlation(*p1.set, f1.index, *p2.set, partner->index, e);
    if (f1.meg && partner->meg && f1.meg->meg > 0 && partner->meg->meg > 0)
        q.meg_ratio_db = to_db(f1.meg->meg / partner->meg->meg);
    q.combining = combining_of(q, f1, *partner, outages);
    return q;
}

}  // namespace

Result<DiversityStudy> study_diversity(const Environment& e, const DiversityOptions& o,
                                       const std::vector<StudyPattern>& patterns) {
    if (patterns.empty() || patterns.size() > 2) return Error{"", 0, 0, "a diversity study takes one or two patterns"};
    if (Status ok = validate_outages(o.outages); !ok) return ok.error();
    DiversityStudy out;
    out.environment = e;
    for (const StudyPattern& p : patterns) {
        auto which = studied_frequencies(p, o);
        if (!which) return which.error();
        std::vector<FrequencyStudy> fs;
        for (std::size_t k : *which) fs.push_back(study_frequency(*p.set, k, e, o));
        out.patterns.push_back(std::move(fs));
    }
    if (patterns.size() == 2)
        for (const FrequencyStudy& f1 : out.patterns[0])
            out.pairs.push_back(study_pair(patterns[0], f1, patterns[1], out.patterns[1], e, o.outages));
    return out;
}

}  // namespace ellipsa
