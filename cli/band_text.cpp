#include "cli/band_text.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <numeric>

#include "cli/format.hpp"

namespace ellipsa::cli {

namespace {
std::string number(double v, int decimals) {
    char b[64];
    std::snprintf(b, sizeof b, "%.*f", decimals, v);
    return b;
}
std::string frequency_text(double hz) { return format_frequency(hz); }
}  // namespace

std::string edges_text(const BandEdges& e) {
    std::string s = frequency_text(e.lower_hz) + (e.lower_open ? " or below" : "") + " .. " + frequency_text(e.upper_hz) +
                    (e.upper_open ? " or above" : "");
    s += " (" + number(e.percent, 1) + " %" + (e.lower_open || e.upper_open ? " at least" : "") + ")";
    return s;
}

void edges_json(JsonWriter& j, std::string_view key, const std::optional<BandEdges>& e) {
    j.key(key);
    if (!e) {
        j.null();
        return;
    }
    j.begin_object();
    j.field("lower_hz", e->lower_hz).field("upper_hz", e->upper_hz).field("centre_hz", e->centre_hz);
    j.field("percent", e->percent).field("lower_open", e->lower_open).field("upper_open", e->upper_open);
    j.field("anchor_hz", e->anchor_hz).field("interpolated", e->interpolated);
    j.end_object();
}

CircularFigures circular_figures(const FarFieldSet& s, std::size_t fi, const PatternSummary& r) {
    CircularFigures c;
    c.elevation = ar_beamwidth_through(s, fi, r.peak.theta_deg, r.peak.phi_deg, false);
    c.azimuth = ar_beamwidth_through(s, fi, r.peak.theta_deg, r.peak.phi_deg, true);
    c.solid_angle = ar_solid_angle(s, fi);
    return c;
}

void circular_json(JsonWriter& j, const CircularFigures& c) {
    j.field("ar_beamwidth_deg", c.elevation.width_deg);
    if (!c.elevation.width_deg) j.field("ar_beamwidth_unavailable_reason", c.elevation.unavailable_reason);
    j.field("ar_beamwidth_azimuth_deg", c.azimuth.width_deg);
    std::optional<double> share;
    if (c.solid_angle) share = c.solid_angle->share;
    j.field("ar_solid_angle_share", share);
}

std::string circular_text(const CircularFigures& c) {
    if (!c.solid_angle) return "unavailable (" + c.elevation.unavailable_reason + ")";
    std::string s;
    if (c.elevation.width_deg || c.azimuth.width_deg) {
        s = fmt(c.elevation.width_deg, "deg", 1, "none") + " (elevation plane), " +
            fmt(c.azimuth.width_deg, "deg", 1, "none") + " (azimuth plane)";
    } else {
        s = "none (" + c.elevation.unavailable_reason + ")";
    }
    return s + "; AR <= 3 dB over " + number(100 * c.solid_angle->share, 1) + " % of the sphere";
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

void band_summary_json(JsonWriter& j, const BandSummary& b) {
    j.key("band").begin_object();
    j.field("edges", "interpolated linearly between sampled frequencies");
    edges_json(j, "gain_bandwidth_1db", b.gain_1db);
    edges_json(j, "gain_bandwidth_3db", b.gain_3db);
    edges_json(j, "ar_bandwidth_3db", b.ar);
    j.field("ar_bandwidth_theta_deg", b.ar_theta_deg).field("ar_bandwidth_phi_deg", b.ar_phi_deg);
    if (!b.ar) j.field("ar_bandwidth_unavailable_reason", b.ar_unavailable_reason);
    j.end_object();
}

std::string band_summary_text(const BandSummary& b) {
    auto line = [](const std::string& label, const std::optional<BandEdges>& e, const std::string& missing) {
        std::string l = "    " + label;
        l.resize(std::max<std::size_t>(l.size() + 1, 26), ' ');
        return l + (e ? edges_text(*e) : missing) + "\n";
    };
    std::string s = "\n  band (edges interpolated linearly between sampled frequencies)\n";
    s += line("peak within 1 dB", b.gain_1db, "unavailable");
    s += line("peak within 3 dB", b.gain_3db, "unavailable");
    s += line("AR <= 3 dB", b.ar, "none (" + b.ar_unavailable_reason + ")");
    s += "                          (AR at theta " + number(b.ar_theta_deg, 1) + ", phi " + number(b.ar_phi_deg, 1) +
         " deg)\n";
    return s;
}

}  // namespace ellipsa::cli
