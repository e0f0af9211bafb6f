#include "pattern/band.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numeric>

#include "pattern/components.hpp"
#include "pattern/diversity_study.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/parallel.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa {

namespace {

// Frequency indices of a set in ascending order of frequency.
std::vector<std::size_t> ascending(const FarFieldSet& s) {
    std::vector<std::size_t> k(s.frequencies.size());
    std::iota(k.begin(), k.end(), std::size_t(0));
    std::stable_sort(k.begin(), k.end(), [&](std::size_t a, std::size_t b) {
        return s.frequencies[a].frequency_hz < s.frequencies[b].frequency_hz;
    });
    return k;
}

}  // namespace

ArReading axial_ratio_at(const FarFieldSet& s, std::size_t fi, double theta_deg, double phi_deg) {
    ArReading r;
    if (auto why = polarisation_unavailable(s)) {
        r.unavailable_reason = *why;
        return r;
    }
    const auto f = interpolate(s, fi, theta_deg, phi_deg);
    if (!f) {
        r.unavailable_reason = "the direction lies outside the sampled region";
        return r;
    }
    const PolarisationState st = decompose(f->e_theta, f->e_phi, phi_deg * deg, s.ludwig3_reference);
    r.sense = st.sense;
    if (st.sense == Sense::none) {
        r.unavailable_reason = "the field is zero in that direction";
        return r;
    }
    r.ar_db = std::isinf(st.axial_ratio) ? std::numeric_limits<double>::infinity() : 20 * std::log10(st.axial_ratio);
    return r;
}

bool peaks_at_pole(const std::vector<FrequencyFigures>& figures) {
    return !figures.empty() &&
           std::all_of(figures.begin(), figures.end(), [](const FrequencyFigures& f) { return f.summary.peak_at_pole; });
}

std::vector<FrequencyFigures> band_figures(const FarFieldSet& s, const BandOptions& o) {
    const std::vector<std::size_t> order = ascending(s);
    std::vector<FrequencyFigures> out(order.size());
    // One frequency a task: each writes only its own entry.
    parallel_each(order.size(), [&](std::size_t i) {
        const std::size_t fi = order[i];
        FrequencyFigures& f = out[i];
        f.freq_index = fi;
        f.summary = summarize(s, fi);
        for (const Environment& e : o.environments) {
            auto m = mean_effective_gain(s, fi, e);
            f.meg.push_back(m ? MegReading{m->meg, ""} : MegReading{std::nullopt, m.error().message});
        }
        if (o.direction_deg) f.ar_at_direction = axial_ratio_at(s, fi, o.direction_deg->first, o.direction_deg->second);
        const double t = f.summary.planes_theta_deg, p = f.summary.planes_phi_deg;  // the summary's beam planes
        f.ar_beamwidth_elevation = ar_beamwidth_through(s, fi, t, p, false, o.ar_threshold_db);
        f.ar_beamwidth_azimuth = ar_beamwidth_through(s, fi, t, p, true, o.ar_threshold_db);
    });
    return out;
}

std::vector<PairFrequencyFigures> band_pair_figures(const FarFieldSet& a, const FarFieldSet& b,
                                                    const std::vector<Environment>& environments) {
    std::vector<PairFrequencyFigures> out;
    for (std::size_t fa : ascending(a)) {
        const double f = a.frequencies[fa].frequency_hz;
        if (b.frequencies.empty()) break;
        const std::size_t fb = b.nearest_frequency(f);
        if (std::abs(b.frequencies[fb].frequency_hz - f) > 0.005 * std::abs(f)) continue;
        PairFrequencyFigures p;
        p.frequency_hz = f;
        p.index_a = fa;
        p.index_b = fb;
        for (const Environment& e : environments) {
            // The one diversity study (pattern/diversity_study.hpp): ECC and the exact selection gain.
            auto st = study_diversity(e, DiversityOptions{}, {{&a, a.name, {fa}}, {&b, b.name, {fb}}});
            PairFrequencyFigures::Entry en;
            if (!st) {
                en.unavailable_reason = st.error().message;
            } else if (const PairStudy& q = st->pairs.front(); q.correlation) {
                en.ecc = q.correlation->ecc;
                en.diversity_gain_db = q.selection_gain_1pct_db;
                if (!q.combining) en.unavailable_reason = "diversity gain: " + q.combining.error().message;
            } else {
                en.unavailable_reason = q.correlation.error().message;
            }
            p.per_environment.push_back(en);
        }
        out.push_back(std::move(p));
    }
    return out;
}

std::optional<BandEdges> band_edges(const std::vector<double>& fr, const std::vector<double>& v, std::size_t anchor,
                                    double limit, bool below) {
    const std::size_t n = std::min(fr.size(), v.size());
    auto meets = [&](std::size_t k) { return !std::isnan(v[k]) && (below ? v[k] <= limit : v[k] >= limit); };
    if (anchor >= n || !meets(anchor)) return std::nullopt;
    // The crossing between sample a (meets) and sample b (does not), linear in the figure.
    auto cross = [&](std::size_t a, std::size_t b) {
        if (!std::isfinite(v[b])) return fr[b];  // beyond an infinite value: the crossing is at the far sample's side
        const double t = (limit - v[a]) / (v[b] - v[a]);
        return fr[a] + std::clamp(t, 0.0, 1.0) * (fr[b] - fr[a]);
    };
    BandEdges e;
    e.anchor_hz = fr[anchor];
    std::size_t lo = anchor, hi = anchor;
    while (lo > 0 && meets(lo - 1)) --lo;
    while (hi + 1 < n && meets(hi + 1)) ++hi;
    if (lo == 0 || std::isnan(v[lo - 1])) {
        e.lower_hz = fr[lo];
        e.lower_open = true;
    } else {
        e.lower_hz = cross(lo, lo - 1);
    }
    if (hi + 1 == n || std::isnan(v[hi + 1])) {
        e.upper_hz = fr[hi];
        e.upper_open = true;
    } else {
        e.upper_hz = cross(hi, hi + 1);
    }
    e.centre_hz = (e.lower_hz + e.upper_hz) / 2;
    e.percent = e.centre_hz > 0 ? 100 * (e.upper_hz - e.lower_hz) / e.centre_hz : 0;
    return e;
}

std::optional<BandEdges> gain_bandwidth(const std::vector<double>& fr, const std::vector<double>& v, double drop_db) {
    if (fr.size() < 2 || v.size() != fr.size()) return std::nullopt;
    for (double f : fr)
        if (!(f > 0)) return std::nullopt;
    const std::size_t best = std::size_t(std::max_element(v.begin(), v.end()) - v.begin());
    return band_edges(fr, v, best, v[best] - drop_db, false);
}

std::optional<BandEdges> ar_bandwidth(const std::vector<double>& fr, const std::vector<double>& ar_db, double threshold_db) {
    if (fr.size() < 2) return std::nullopt;
    std::size_t best = ar_db.size();
    for (std::size_t k = 0; k < ar_db.size(); ++k)
        if (!std::isnan(ar_db[k]) && (best == ar_db.size() || ar_db[k] < ar_db[best])) best = k;
    if (best == ar_db.size()) return std::nullopt;
    for (double f : fr)
        if (!(f > 0)) return std::nullopt;
    return band_edges(fr, ar_db, best, threshold_db, true);
}

BandSummary band_summary(const FarFieldSet& s, const std::vector<std::size_t>& which,
                         const std::vector<PatternSummary>& rs, std::optional<std::pair<double, double>> dir) {
    BandSummary b;
    std::vector<std::size_t> order(which.size());
    std::iota(order.begin(), order.end(), std::size_t(0));
    std::stable_sort(order.begin(), order.end(), [&](std::size_t x, std::size_t y) { return rs[x].frequency_hz < rs[y].frequency_hz; });
    std::vector<double> fr, pk;
    for (std::size_t k : order) {
        fr.push_back(rs[k].frequency_hz);
        pk.push_back(rs[k].peak_db);
    }
    b.gain_1db = gain_bandwidth(fr, pk, 1.0);
    b.gain_3db = gain_bandwidth(fr, pk, 3.0);
    if (!b.gain_1db) b.gain_unavailable_reason = fr.size() < 2 ? "needs two or more frequencies" : "needs frequencies above 0 Hz";
    if (order.empty()) return b;
    const PatternSummary& mid = rs[order[order.size() / 2]];
    b.ar_theta_deg = dir ? dir->first : mid.peak.theta_deg;
    b.ar_phi_deg = dir ? dir->second : mid.peak.phi_deg;
    std::vector<double> ar;
    for (std::size_t k : order) {
        const ArReading a = axial_ratio_at(s, which[k], b.ar_theta_deg, b.ar_phi_deg);
        if (!a.ar_db && b.ar_unavailable_reason.empty()) b.ar_unavailable_reason = a.unavailable_reason;
        ar.push_back(a.ar_db ? *a.ar_db : std::nan(""));
    }
    b.ar = ar_bandwidth(fr, ar, ar_threshold_db);
    if (!b.ar && b.ar_unavailable_reason.empty())
        b.ar_unavailable_reason = fr.size() < 2 ? "needs two or more frequencies"
                                                : "the axial ratio there exceeds 3 dB at every sampled frequency";
    return b;
}

BandSummary band_summary(const FarFieldSet& s, const std::vector<FrequencyFigures>& band,
                         std::optional<std::pair<double, double>> dir) {
    std::vector<std::size_t> which;
    std::vector<PatternSummary> rs;
    for (const FrequencyFigures& f : band) {
        which.push_back(f.freq_index);
        rs.push_back(f.summary);
    }
    return band_summary(s, which, rs, dir);
}

}  // namespace ellipsa
