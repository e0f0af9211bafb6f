#include "cli/info_json.hpp"

#include "cli/band_text.hpp"
#include "cli/mounting_options.hpp"
#include "exports/figure_text.hpp"
#include "pattern/convention_hints.hpp"
#include "pattern/integrate.hpp"
#include "pattern/parallel.hpp"

namespace ellipsa::cli {

InfoFigures info_figures(const FarFieldSet& s, const std::vector<std::size_t>& which) {
    InfoFigures out;
    out.summaries.resize(which.size());
    out.extras.resize(which.size());
    parallel_each(which.size(), [&](std::size_t i) {
        out.summaries[i] = summarize(s, which[i]);
        out.extras[i].circular = circular_figures(s, which[i], out.summaries[i]);
        out.extras[i].phase_centre = estimate_phase_centre(s, which[i]);
    });
    return out;
}

void summary_json(JsonWriter& j, const FarFieldSet& s, std::size_t freq_index, const PatternSummary& r, const InfoExtras& x) {
    j.field("frequency_hz", r.frequency_hz);
    // A zero field has no peak direction: null, with zero_field true (docs/guide.md, JSON keys).
    std::optional<double> pt, pp;
    if (!r.zero_field) pt = r.peak.theta_deg, pp = r.peak.phi_deg;
    j.field("peak_db", r.peak_db).field("peak_theta_deg", pt).field("peak_phi_deg", pp);
    // The largest sample itself, beside the refined peak above (pattern/peak.hpp).
    std::optional<double> ps;
    if (!r.zero_field) ps = to_db(r.peak.sample_value);
    j.field("peak_sample_db", ps);
    j.field("zero_field", r.zero_field);
    j.field("directivity_dbi", r.directivity_dbi);
    j.field("radiation_efficiency", r.power.radiation_efficiency);
    j.field("hpbw_elevation_deg", r.hpbw_elevation_deg);
    j.field("hpbw_azimuth_deg", r.hpbw_azimuth_deg);
    j.field("front_to_back_db", r.front_to_back_db).field("front_to_back_above_db", r.front_to_back_above_db);
    j.field("sidelobe_elevation_db", r.sidelobe_elevation_db);
    // Why a figure is missing (null when it is given), and the ripple of an omnidirectional cut.
    auto reason = [&](const char* key, const std::optional<std::string>& why) {
        j.key(key);
        if (r.zero_field) j.value("zero_field");
        else if (why) j.value(*why);
        else j.null();
    };
    reason("hpbw_elevation_reason", exports::beamwidth_reason(r.elevation));
    reason("hpbw_azimuth_reason", exports::beamwidth_reason(r.azimuth));
    j.field("elevation_ripple_db", r.elevation.ripple_db).field("azimuth_ripple_db", r.azimuth.ripple_db);
    reason("sidelobe_elevation_reason",
           r.sidelobe_elevation_db ? std::nullopt : std::optional<std::string>("no_side_lobe"));
    j.field("axial_ratio_db", r.axial_ratio_db);
    j.key("sense");
    if (r.sense && *r.sense != Sense::none)
        j.value(to_string(*r.sense));
    else
        j.null();
    std::optional<double> d_sampled;
    if (r.power.directivity_sampled_only) d_sampled = to_db(*r.power.directivity_sampled_only);
    j.field("directivity_sampled_region_only_dbi", d_sampled);
    if (!r.unavailable_reason.empty()) j.field("unavailable_reason", r.unavailable_reason);
    j.key("warnings").begin_array();
    if (r.efficiency_above_100) j.value(exports::efficiency_warning_text(*r.power.radiation_efficiency));
    j.end_array();
    circular_json(j, x.circular);  // issue 16: AR beamwidth
    phase_centre_json(j, s, freq_index, x.phase_centre);
}

std::string info_json(const FarFieldSet& s, const std::vector<std::size_t>& which, const InfoFigures& f) {
    const std::vector<PatternSummary>& rs = f.summaries;
    JsonWriter j;
    j.begin_object();
    j.field("name", s.name).field("source", s.source);
    j.field("quantity", to_string(s.quantity)).field("content", to_string(s.content));
    j.key("frequencies_hz").begin_array();
    for (std::size_t k : which) j.value(s.frequencies[k].frequency_hz);
    j.end_array();
    j.field("coverage", coverage(s.grid));
    j.key("grid").begin_object();
    j.field("theta_start_deg", s.grid.theta.start_deg).field("theta_step_deg", s.grid.theta.step_deg);
    j.field("theta_count", s.grid.theta.count).field("phi_start_deg", s.grid.phi.start_deg);
    j.field("phi_step_deg", s.grid.phi.step_deg).field("phi_count", s.grid.phi.count);
    j.field("sampling", to_string(s.grid.sampling));
    if (const std::string why = sphere_shortfall(s.grid); !why.empty()) j.field("whole_sphere_unavailable", why);
    j.end_object();
    mounting_json(j, s);
    j.key("results").begin_array();
    for (std::size_t k = 0; k < rs.size(); ++k) {
        j.begin_object();
        summary_json(j, s, which[k], rs[k], f.extras[k]);
        j.end_object();
    }
    j.end_array();
    if (rs.size() > 1) band_summary_json(j, band_summary(s, which, rs));  // issue 16: band edges
    j.key("hints").begin_array();  // issue 14: a wrong time convention or a swapped pair, as hints
    for (const std::string& h : convention_hints(s, which, rs)) j.value(h);
    j.end_array();
    j.end_object();
    return j.str();
}

}  // namespace ellipsa::cli
