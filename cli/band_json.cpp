// What `ellipsa band` computes and writes (cli/band_json.hpp).
#include "cli/band_json.hpp"
#include "cli/usage.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>

#include "cli/band_text.hpp"
#include "cli/json.hpp"
#include "cli/mounting_options.hpp"
#include "exports/cut_figure.hpp"

namespace ellipsa::cli {

using namespace ellipsa::exports;

namespace {

std::string letter(std::size_t i) { return std::string(1, char('A' + i % 26)); }

// --environment uniform,indoor -> the presets.
Result<std::vector<Environment>> parse_environments(const std::string& text) {
    std::vector<Environment> out;
    std::size_t pos = 0;
    while (pos <= text.size()) {
        const std::size_t c = text.find(',', pos);
        auto e = environment_preset(text.substr(pos, c == std::string::npos ? std::string::npos : c - pos));
        if (!e) return e.error();
        out.push_back(*e);
        if (c == std::string::npos) break;
        pos = c + 1;
    }
    return out;
}

void frequency_json(JsonWriter& j, const FarFieldSet& s, const FrequencyFigures& f, const BandOptions& o) {
    const PatternSummary& r = f.summary;
    j.begin_object();
    j.field("frequency_hz", s.frequencies[f.freq_index].frequency_hz);
    j.field("peak_db", r.peak_db).field("peak_theta_deg", r.peak.theta_deg).field("peak_phi_deg", r.peak.phi_deg);
    j.field("peak_sample_db", to_db(r.peak.sample_value));  // the largest sample, beside the refined peak
    j.field("directivity_dbi", r.directivity_dbi).field("radiation_efficiency", r.power.radiation_efficiency);
    j.field("hpbw_elevation_deg", r.hpbw_elevation_deg).field("hpbw_azimuth_deg", r.hpbw_azimuth_deg);
    j.field("front_to_back_db", r.front_to_back_db).field("axial_ratio_db", r.axial_ratio_db);
    j.key("sense");
    if (r.sense && *r.sense != Sense::none)
        j.value(to_string(*r.sense));
    else
        j.null();
    circular_json(j, CircularFigures{f.ar_beamwidth_elevation, f.ar_beamwidth_azimuth, std::nullopt, false, {}});
    if (f.ar_at_direction) j.field("axial_ratio_at_direction_db", f.ar_at_direction->ar_db);
    j.key("meg_db").begin_object();
    for (std::size_t e = 0; e < f.meg.size(); ++e) {
        std::optional<double> v;
        if (f.meg[e].meg) v = to_db(*f.meg[e].meg);
        j.field(o.environments[e].name, v);
    }
    j.end_object();
    j.end_object();
}

}  // namespace

std::string band_json(const std::vector<std::string>& files, const BandRun& run, const BandRequest& r) {
    const std::vector<BandSet>& sets = run.sets;
    const std::vector<BandPair>& pairs = run.pairs;
    JsonWriter j;
    j.begin_object();
    j.key("environments").begin_array();
    for (const Environment& e : r.options.environments) j.value(e.name);
    j.end_array();
    j.key("patterns").begin_array();
    for (std::size_t i = 0; i < sets.size(); ++i) {
        const FarFieldSet& s = *sets[i].set;
        j.begin_object().field("label", letter(i)).field("name", run.names[i]).field("file", files[i]);
        j.field("quantity", to_string(s.quantity)).field("content", to_string(s.content));
        mounting_json(j, s);
        j.key("frequencies").begin_array();
        for (const FrequencyFigures& f : sets[i].figures) frequency_json(j, s, f, r.options);
        j.end_array();
        band_summary_json(j, sets[i].summary);
        j.end_object();
    }
    j.end_array();
    j.key("pairs").begin_array();
    for (const BandPair& p : pairs) {
        j.begin_object().field("label", p.label).key("frequencies").begin_array();
        for (const PairFrequencyFigures& f : p.figures) {
            j.begin_object().field("frequency_hz", f.frequency_hz);
            for (const char* what : {"ecc", "diversity_gain_db"}) {
                j.key(what).begin_object();
                for (std::size_t e = 0; e < f.per_environment.size(); ++e)
                    j.field(r.options.environments[e].name,
                            what[0] == 'e' ? f.per_environment[e].ecc : f.per_environment[e].diversity_gain_db);
                j.end_object();
            }
            j.end_object();
        }
        j.end_array().end_object();
    }
    j.end_array();
    j.end_object();
    return j.str() + "\n";
}

CLI::Validator band_direction_check() { return number_pair({"THETA", 0, 180}, {"PHI", -360, 360}, "degrees"); }

CLI::Validator band_ar_threshold_check() { return number_above_to(0, max_ar_threshold_db); }

Result<BandRequest> band_request(const BandChoices& a, std::size_t nfiles) {
    if (const std::string bad = check_number(band_ar_threshold_check(), a.ar_threshold_db); !bad.empty())
        return Error{"", 0, 0, "--ar-threshold: " + bad};
    BandRequest r;
    r.title = a.title;
    auto envs = parse_environments(a.environments);
    if (!envs) return Error{"", 0, 0, "--environment: " + envs.error().message};
    r.options.environments = *envs;
    r.options.ar_threshold_db = a.ar_threshold_db;
    if (!a.direction.empty()) {
        std::string text = a.direction;
        const std::string bad = band_direction_check()(text);
        if (!bad.empty()) return Error{"", 0, 0, "--direction: " + bad};
        r.options.direction_deg = read_number_pair(a.direction);
    }
    if (a.pair && nfiles < 2) return Error{"", 0, 0, "--pair needs two pattern files"};
    if (!a.show.empty()) {
        auto p = parse_band_panels(a.show);
        if (!p) return Error{"", 0, 0, "--show: " + p.error().message};
        r.panels = *p;
    } else if (a.pair) {
        r.panels.push_back(BandPanel::correlation);
    }
    return r;
}

Result<BandRun> band_run(const std::vector<const FarFieldSet*>& sets, const std::vector<std::string>& names,
                         const std::vector<std::string>& files, bool pair, const BandRequest& r) {
    BandRun run;
    run.names = names;
    for (std::size_t i = 0; i < sets.size(); ++i)
        run.sets.push_back(compute_band_set(sets.size() > 1 ? letter(i) + ". " + names[i] : "", *sets[i], r.options));
    if (pair) {
        run.pairs.push_back({"A–B", band_pair_figures(*sets[0], *sets[1], r.options.environments)});
        if (run.pairs[0].figures.empty()) return Error{"", 0, 0, files[0] + " and " + files[1] + " share no frequency (within 0.5 %)"};
    }
    return run;
}

Result<std::string> band_file(const std::string& path, const std::vector<std::string>& files, const BandRun& run,
                              const BandRequest& r, const RenderSize& size) {
    if (std::string_view(path).ends_with(".json")) return band_json(files, run, r);
    const auto format = format_from_path(path);
    if (!format) return Error{"", 0, 0, path + ": expected a file name ending in .svg, .png, .pdf, .csv or .json"};
    if (*format == FileFormat::csv) return band_csv(run.sets, run.pairs, r);
    const XyFigure fig = make_band_figure(run.sets, run.pairs, r);
    return render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, *format, size, fig.title);
}

}  // namespace ellipsa::cli
