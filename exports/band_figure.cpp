#include "exports/band_figure.hpp"

#include <algorithm>
#include <cmath>

#include "exports/csv_text.hpp"
#include "exports/figure_text.hpp"
#include "exports/plot_pen.hpp"

namespace ellipsa::exports {

namespace {
constexpr BandPanel all_panels[] = {BandPanel::gain,         BandPanel::efficiency,   BandPanel::meg,
                                    BandPanel::axial_ratio,  BandPanel::beamwidth,    BandPanel::front_to_back,
                                    BandPanel::ar_beamwidth, BandPanel::correlation,  BandPanel::diversity_gain};

double or_nan(const std::optional<double>& v) { return v ? *v : std::nan(""); }

// A series of one set: y(figure) at every frequency.
template <class F>
XySeries series(const BandSet& b, const std::string& what, int style, F y) {
    XySeries s;
    s.label = b.label.empty() ? what : b.label + " " + what;
    s.style = style;
    for (const FrequencyFigures& f : b.figures) {
        s.x.push_back(b.set->frequencies[f.freq_index].frequency_hz);
        s.y.push_back(y(f));
    }
    return s;
}

// A marker at x, or one more label on a marker already there (edges of two bands can coincide).
void add_marker(XyPanel& p, double x, const std::string& label) {
    for (XyMarker& m : p.markers)
        if (std::abs(m.x - x) <= 1e-9 * std::abs(x)) {
            m.label += ", " + label;
            return;
        }
    p.markers.push_back({x, label});
}
void edge_markers(XyPanel& p, const std::optional<BandEdges>& e, const std::string& what) {
    if (!e) return;
    add_marker(p, e->lower_hz, what + (e->lower_open ? " (open)" : ""));
    add_marker(p, e->upper_hz, what + (e->upper_open ? " (open)" : ""));
}

std::string band_db_unit(const std::vector<BandSet>& sets) {
    for (const BandSet& b : sets)
        if (b.set->quantity == Quantity::relative) return "dB";
    return "dBi";
}

// ECC (0..1) or the diversity gain (dB) of every pair in every environment.
void pair_panel(XyPanel& p, bool ecc, const std::vector<BandPair>& pairs, const BandRequest& r) {
    p.y_label = ecc ? "ECC" : "Diversity gain";
    p.y_unit = ecc ? "" : "dB";
    if (ecc) p.y_min = 0, p.y_max = 1;
    p.empty_text = pairs.empty() ? "needs two patterns" : "unavailable: needs complex data on both";
    int style = 0;
    for (const BandPair& pr : pairs)
        for (std::size_t e = 0; e < r.options.environments.size(); ++e) {
            XySeries s;
            s.label = pr.label + ", " + r.options.environments[e].name;
            s.style = style++;
            for (const PairFrequencyFigures& f : pr.figures) {
                s.x.push_back(f.frequency_hz);
                const auto& en = f.per_environment[e];
                s.y.push_back(or_nan(ecc ? en.ecc : en.diversity_gain_db));
            }
            p.series.push_back(std::move(s));
        }
}

// Every frequency of every set has its peak at a pole: the beam planes are phi = 0 and phi = 90.
bool peaks_at_pole(const std::vector<BandSet>& sets) {
    return !sets.empty() && std::all_of(sets.begin(), sets.end(), [](const BandSet& b) { return ellipsa::peaks_at_pole(b.figures); });
}

// One panel for one quantity over all sets (and pairs).
XyPanel panel(BandPanel kind, const std::vector<BandSet>& sets, const std::vector<BandPair>& pairs, const BandRequest& r) {
    XyPanel p;
    const int n = int(sets.size());
    const bool at_pole = peaks_at_pole(sets);
    auto add = [&](int k, const std::string& what, auto y) {
        for (int i = 0; i < n; ++i) p.series.push_back(series(sets[std::size_t(i)], what, i + k * n, y));
    };
    switch (kind) {
        case BandPanel::gain:
            p.y_label = "Peak";
            p.y_unit = band_db_unit(sets);
            add(0, "peak", [](const FrequencyFigures& f) { return f.summary.peak_db; });
            add(1, "directivity", [](const FrequencyFigures& f) { return or_nan(f.summary.directivity_dbi); });
            if (n == 1) {
                edge_markers(p, sets[0].summary.gain_1db, "−1 dB");
                edge_markers(p, sets[0].summary.gain_3db, "−3 dB");
            }
            break;
        case BandPanel::efficiency:
            p.y_label = "Efficiency";
            p.y_unit = "%";
            p.empty_text = "unavailable: needs absolute gain on the full sphere";
            add(0, "efficiency", [](const FrequencyFigures& f) {
                return f.summary.power.radiation_efficiency ? 100 * *f.summary.power.radiation_efficiency : std::nan("");
            });
            break;
        case BandPanel::meg:
            p.y_label = "MEG";
            p.y_unit = "dBi";
            p.empty_text = "unavailable (see the CSV or the command's message)";
            for (std::size_t e = 0; e < r.options.environments.size(); ++e)
                add(int(e), "MEG " + r.options.environments[e].name, [e](const FrequencyFigures& f) {
                    return f.meg[e].meg ? to_db(*f.meg[e].meg) : std::nan("");
                });
            break;
        case BandPanel::axial_ratio:
            p.y_label = "AR";
            p.y_unit = "dB";
            p.empty_text = "unavailable: the data have no phase, or the field is linear";
            p.y_references.push_back(ar_threshold_db);
            add(0, "at the peak", [](const FrequencyFigures& f) { return or_nan(f.summary.axial_ratio_db); });
            if (r.options.direction_deg)
                add(1, "at θ " + num(r.options.direction_deg->first, 1) + "°, φ " + num(r.options.direction_deg->second, 1) + "°",
                    [](const FrequencyFigures& f) {
                        const double v = f.ar_at_direction ? or_nan(f.ar_at_direction->ar_db) : std::nan("");
                        return std::isinf(v) ? std::nan("") : v;
                    });
            if (n == 1) edge_markers(p, sets[0].summary.ar, "AR 3 dB");
            break;
        case BandPanel::beamwidth:
            p.y_label = "HPBW";
            p.y_unit = "°";
            add(0, beam_plane_text(at_pole, false, "°"), [](const FrequencyFigures& f) { return or_nan(f.summary.hpbw_elevation_deg); });
            add(1, beam_plane_text(at_pole, true, "°"), [](const FrequencyFigures& f) { return or_nan(f.summary.hpbw_azimuth_deg); });
            break;
        case BandPanel::front_to_back:
            p.y_label = "Front-to-back";
            p.y_unit = "dB";
            add(0, "F/B", [](const FrequencyFigures& f) { return or_nan(f.summary.front_to_back_db); });
            break;
        case BandPanel::ar_beamwidth:
            p.y_label = "AR width";
            p.y_unit = "°";
            p.empty_text = "none: the axial ratio at the peak exceeds " + num(r.options.ar_threshold_db, 1) + " dB, or no phase";
            add(0, "AR ≤ " + num(r.options.ar_threshold_db, 1) + " dB, " + beam_plane_text(at_pole, false, "°"),
                [](const FrequencyFigures& f) { return or_nan(f.ar_beamwidth_elevation.width_deg); });
            add(1, beam_plane_text(at_pole, true, "°"), [](const FrequencyFigures& f) { return or_nan(f.ar_beamwidth_azimuth.width_deg); });
            break;
        case BandPanel::correlation:
        case BandPanel::diversity_gain: pair_panel(p, kind == BandPanel::correlation, pairs, r); break;
    }
    return p;
}

}  // namespace

const char* to_string(BandPanel p) {
    switch (p) {
        case BandPanel::gain: return "gain";
        case BandPanel::efficiency: return "efficiency";
        case BandPanel::meg: return "meg";
        case BandPanel::axial_ratio: return "axial-ratio";
        case BandPanel::beamwidth: return "hpbw";
        case BandPanel::front_to_back: return "front-to-back";
        case BandPanel::ar_beamwidth: return "ar-beamwidth";
        case BandPanel::correlation: return "ecc";
        case BandPanel::diversity_gain: return "diversity-gain";
    }
    return "?";
}

Result<std::vector<BandPanel>> parse_band_panels(const std::string& text) {
    std::vector<BandPanel> out;
    std::size_t pos = 0;
    while (pos <= text.size()) {
        const std::size_t c = text.find(',', pos);
        const std::string name = text.substr(pos, c == std::string::npos ? std::string::npos : c - pos);
        bool found = false;
        for (BandPanel p : all_panels)
            if (name == to_string(p)) {
                out.push_back(p);
                found = true;
            }
        if (!found) {
            std::string known;
            for (BandPanel p : all_panels) known += (known.empty() ? "" : ", ") + std::string(to_string(p));
            return Error{"", 0, 0, "unknown panel \"" + name + "\"; expected one or more of " + known};
        }
        if (c == std::string::npos) break;
        pos = c + 1;
    }
    return out;
}

std::string edges_text(const BandEdges& e) {
    std::string s = format_frequency(e.lower_hz) + (e.lower_open ? " or below" : "") + " .. " + format_frequency(e.upper_hz) +
                    (e.upper_open ? " or above" : "");
    s += " (" + num(e.percent, 1) + " %" + (e.lower_open || e.upper_open ? " at least" : "") + ")";
    return s;
}

BandSet compute_band_set(const std::string& label, const FarFieldSet& s, const BandOptions& o) {
    BandSet b;
    b.label = label;
    b.set = &s;
    b.figures = band_figures(s, o);
    b.summary = band_summary(s, b.figures, o.direction_deg);
    return b;
}

XyFigure make_band_figure(const std::vector<BandSet>& sets, const std::vector<BandPair>& pairs, const BandRequest& r) {
    XyFigure f;
    f.title = !r.title.empty() ? r.title : sets.size() == 1 ? sets[0].set->name : "Figures against frequency";
    f.subtitle = "Figures at each sampled frequency (points); lines only join them";
    f.x_label = "Frequency";
    double hi = 0;
    for (const BandSet& b : sets)
        for (const FarField& ff : b.set->frequencies) hi = std::max(hi, ff.frequency_hz);
    f.x_scale = hi >= 1e9 ? 1e9 : hi >= 1e6 ? 1e6 : hi >= 1e3 ? 1e3 : 1;
    f.x_unit = hi >= 1e9 ? "GHz" : hi >= 1e6 ? "MHz" : hi >= 1e3 ? "kHz" : "Hz";
    for (BandPanel k : r.panels) f.panels.push_back(panel(k, sets, pairs, r));
    f.notes.push_back("Dashed vertical lines: band edges, interpolated linearly between the sampled frequencies "
                      "(\"open\": the band reaches the first or last sample, its edge lies there or beyond).");
    if (r.options.direction_deg || std::find(r.panels.begin(), r.panels.end(), BandPanel::axial_ratio) != r.panels.end())
        f.notes.push_back("Dotted line: AR 3 dB. A linear field (infinite axial ratio) has no point.");
    return f;
}

std::string band_csv(const std::vector<BandSet>& sets, const std::vector<BandPair>& pairs, const BandRequest& r) {
    const auto& envs = r.options.environments;
    std::string out = "kind,label,frequency_hz,peak_db,peak_theta_deg,peak_phi_deg,directivity_dbi,radiation_efficiency,"
                      "hpbw_elevation_deg,hpbw_azimuth_deg,front_to_back_db,axial_ratio_db,sense,ar_beamwidth_deg,"
                      "ar_beamwidth_azimuth_deg,axial_ratio_at_direction_db";
    for (const Environment& e : envs) out += ",meg_" + e.name + "_db";
    for (const Environment& e : envs) out += ",ecc_" + e.name + ",diversity_gain_" + e.name + "_db";
    out += "\n";
    auto field = [&](double v) {
        out += ",";
        append_csv_number(out, v);
    };
    for (const BandSet& b : sets)
        for (const FrequencyFigures& f : b.figures) {
            const PatternSummary& s = f.summary;
            out += "pattern," + (b.label.empty() ? b.set->name : b.label);
            field(b.set->frequencies[f.freq_index].frequency_hz);
            for (double v : {s.peak_db, s.peak.theta_deg, s.peak.phi_deg, or_nan(s.directivity_dbi),
                             or_nan(s.power.radiation_efficiency), or_nan(s.hpbw_elevation_deg), or_nan(s.hpbw_azimuth_deg),
                             or_nan(s.front_to_back_db)})
                field(v);
            field(s.sense == Sense::linear ? INFINITY : or_nan(s.axial_ratio_db));
            out += std::string(",") + (s.sense && *s.sense != Sense::none ? to_string(*s.sense) : "");
            field(or_nan(f.ar_beamwidth_elevation.width_deg));
            field(or_nan(f.ar_beamwidth_azimuth.width_deg));
            field(f.ar_at_direction ? or_nan(f.ar_at_direction->ar_db) : std::nan(""));
            for (const MegReading& m : f.meg) field(m.meg ? to_db(*m.meg) : std::nan(""));
            for (std::size_t e = 0; e < envs.size(); ++e) out += ",,";
            out += "\n";
        }
    for (const BandPair& p : pairs)
        for (const PairFrequencyFigures& f : p.figures) {
            out += "pair," + p.label;
            field(f.frequency_hz);
            out += std::string(13, ',');
            for (std::size_t e = 0; e < envs.size(); ++e) out += ",";
            for (const auto& en : f.per_environment) {
                field(or_nan(en.ecc));
                field(or_nan(en.diversity_gain_db));
            }
            out += "\n";
        }
    return out;
}

}  // namespace ellipsa::exports
