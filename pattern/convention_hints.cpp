#include "pattern/convention_hints.hpp"

#include <cstdio>
#include <optional>

#include "pattern/interpolate.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa {

namespace {

bool clearly_circular(const PatternSummary& r) {
    return !r.zero_field && r.sense && (*r.sense == Sense::right || *r.sense == Sense::left) && r.axial_ratio_db &&
           *r.axial_ratio_db <= hint_circular_ar_db;
}

const char* hand(Sense s) { return s == Sense::right ? "right-hand" : "left-hand"; }

std::string sense_flip_hint(const std::vector<PatternSummary>& rs) {
    bool flips = false;
    for (std::size_t i = 1; i < rs.size(); ++i)
        flips = flips || (clearly_circular(rs[i - 1]) && clearly_circular(rs[i]) && *rs[i - 1].sense != *rs[i].sense);
    if (!flips) return "";
    std::string list;
    for (const PatternSummary& r : rs)
        if (clearly_circular(r)) list += (list.empty() ? "" : ", ") + std::string(hand(*r.sense)) + " at " + format_frequency(r.frequency_hz);
    return "hint: the sense of polarisation at the peak flips between neighbouring frequencies (" + list +
           "), which an antenna seldom does; check the time convention of each scan (a file in exp(-i w t) needs "
           "\"time-convention: -iwt\", which conjugates its phases) and whether its RHCP and LHCP (or E_theta and "
           "E_phi) columns are swapped";
}

// The cross-polar level above the co-polar one at the peak, dB; nothing without a value there.
std::optional<double> cross_over_co_db(const FarFieldSet& s, std::size_t fi, const PatternSummary& r) {
    if (r.zero_field || !s.has_phase()) return std::nullopt;
    auto f = interpolate(s, fi, r.peak.theta_deg, r.peak.phi_deg);
    if (!f) return std::nullopt;
    const PolarisationState st = decompose(f->e_theta, f->e_phi, r.peak.phi_deg * deg, s.ludwig3_reference);
    if (!(st.cross > 0)) return std::nullopt;
    return st.co > 0 ? to_db(st.cross / st.co) : 1e300;
}

std::string swapped_pair_hint(const FarFieldSet& s, const std::vector<std::size_t>& which,
                              const std::vector<PatternSummary>& rs) {
    if (!s.ludwig3_declared) return "";
    std::string list;
    for (std::size_t i = 0; i < rs.size(); ++i) {
        const auto d = cross_over_co_db(s, which[i], rs[i]);
        if (!d || *d < hint_swapped_margin_db) continue;
        char buf[64];
        if (*d > 1e299) std::snprintf(buf, sizeof buf, " (co-polar zero)");
        else std::snprintf(buf, sizeof buf, " (by %.1f dB)", *d);
        list += (list.empty() ? "" : ", ") + format_frequency(rs[i].frequency_hz) + buf;
    }
    if (list.empty()) return "";
    return std::string("hint: at the peak the cross-polar level exceeds the co-polar one (Ludwig-3, ") +
           (s.ludwig3_reference == Ludwig3Reference::x ? "x" : "y") + " reference) at " + list +
           "; the co- and cross-polar columns may be exchanged, or the antenna is polarised along the other reference";
}

}  // namespace

std::vector<std::string> convention_hints(const FarFieldSet& s, const std::vector<std::size_t>& which,
                                          const std::vector<PatternSummary>& rs) {
    std::vector<std::string> out;
    for (const std::string& h : {sense_flip_hint(rs), swapped_pair_hint(s, which, rs)})
        if (!h.empty()) out.push_back(h);
    return out;
}

}  // namespace ellipsa
