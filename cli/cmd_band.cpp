// ellipsa band: figures against frequency (peak gain, directivity, efficiency, MEG, axial ratio,
// HPBW, front-to-back, AR beamwidth; ECC and diversity gain for a pair) as a plot (SVG, PNG, PDF),
// or as values (CSV, JSON), with the gain and axial-ratio band edges on stdout.
#include <cmath>
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/band_text.hpp"
#include "cli/commands.hpp"
#include "cli/format.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "exports/band_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct BandArgs {
    std::vector<std::string> files;
    std::string out, show, environments = "uniform", direction, title, size = "1200x900";
    double dpi = 150, ar_threshold_db = ellipsa::ar_threshold_db;
    bool pair = false, force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa band: " << msg << "\n";
    return code;
}

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

std::string band_json(const std::vector<std::string>& files, const std::vector<BandSet>& sets,
                      const std::vector<BandPair>& pairs, const BandRequest& r) {
    JsonWriter j;
    j.begin_object();
    j.key("environments").begin_array();
    for (const Environment& e : r.options.environments) j.value(e.name);
    j.end_array();
    j.key("patterns").begin_array();
    for (std::size_t i = 0; i < sets.size(); ++i) {
        const FarFieldSet& s = *sets[i].set;
        j.begin_object().field("label", letter(i)).field("name", s.name).field("file", files[i]);
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

Result<BandRequest> request_of(const BandArgs& a, std::size_t nfiles) {
    BandRequest r;
    r.title = a.title;
    auto envs = parse_environments(a.environments);
    if (!envs) return Error{"", 0, 0, "--environment: " + envs.error().message};
    r.options.environments = *envs;
    r.options.ar_threshold_db = a.ar_threshold_db;
    if (!a.direction.empty()) {
        double t = 0, p = 0;
        char extra = 0;
        if (std::sscanf(a.direction.c_str(), "%lf,%lf%c", &t, &p, &extra) != 2 || !std::isfinite(t) || !std::isfinite(p) ||
            t < 0 || t > 180)
            return Error{"", 0, 0, "--direction: expected THETA,PHI in degrees (theta 0..180), found \"" + a.direction + "\""};
        r.options.direction_deg = std::make_pair(t, p);
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

int run_band(const BandArgs& a) {
    if (!std::isfinite(a.ar_threshold_db) || a.ar_threshold_db <= 0)
        return fail(exit_usage, "--ar-threshold: expected a positive number of dB");
    const bool json = std::string_view(a.out).ends_with(".json");
    const auto parsed = format_from_path(a.out);
    if (!parsed && !json) return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .svg, .png, .pdf, .csv or .json");
    auto size = parse_size(a.size, a.dpi);
    if (!size) return fail(exit_usage, size.error().format());
    auto req = request_of(a, a.files.size());
    if (!req) return fail(exit_usage, req.error().message);
    std::error_code ec;
    if (!a.force && std::filesystem::exists(a.out, ec)) return fail(exit_bad_input, a.out + ": already exists; use --force to replace it");

    std::vector<FarFieldSet> loaded;
    for (const std::string& f : a.files) {
        auto s = load_pattern(f, a.load);
        if (!s) return fail(exit_bad_input, s.error().format());
        if (s->name.empty()) s->name = f;
        loaded.push_back(std::move(*s));
    }
    std::vector<BandSet> sets;
    for (std::size_t i = 0; i < loaded.size(); ++i)
        sets.push_back(compute_band_set(loaded.size() > 1 ? letter(i) + ". " + loaded[i].name : "", loaded[i], req->options));
    std::vector<BandPair> pairs;
    if (a.pair) {
        pairs.push_back({"A–B", band_pair_figures(loaded[0], loaded[1], req->options.environments)});
        if (pairs[0].figures.empty()) return fail(exit_bad_input, a.files[0] + " and " + a.files[1] + " share no frequency (within 0.5 %)");
    }
    const FileFormat format = json ? FileFormat::csv : *parsed;
    std::string bytes;
    if (json) {
        bytes = band_json(a.files, sets, pairs, *req);
    } else if (format == FileFormat::csv) {
        bytes = band_csv(sets, pairs, *req);
    } else {
        const XyFigure fig = make_band_figure(sets, pairs, *req);
        auto img = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, format, *size, fig.title);
        if (!img) return fail(exit_bad_input, img.error().message);
        bytes = std::move(*img);
    }
    if (Status st = io::write_file_atomically(a.out, bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
    std::cout << "wrote " << a.out << "\n";
    for (std::size_t i = 0; i < sets.size(); ++i) {
        std::cout << "\n" << a.files[i] << ": " << sets[i].figures.size() << " frequencies";
        if (const std::string m = mounting_note(*sets[i].set); !m.empty()) std::cout << "\n  " << m;
        std::cout << band_summary_text(sets[i].summary);
    }
    return exit_ok;
}

Registered add_band(CLI::App& root) {
    auto a = std::make_shared<BandArgs>();
    CLI::App* sub = root.add_subcommand(
        "band", "Figures against frequency (gain, efficiency, MEG, axial ratio, HPBW, ECC) as a plot, CSV or JSON");
    sub->add_option("FILE", a->files, "Far-field CSV files (one or more; several are overlaid)")->required();
    sub->add_option("--out", a->out, "Output file: .svg, .png, .pdf (the plot), .csv or .json (the values)")
        ->required()
        ->type_name("FILE");
    sub->add_option("--show", a->show,
                    "Panels, comma-separated: gain, efficiency, meg, axial-ratio, hpbw, front-to-back, ar-beamwidth, "
                    "ecc, diversity-gain (default gain,efficiency,axial-ratio,hpbw; ecc added with --pair)");
    sub->add_option("--environment", a->environments,
                    "Environments for MEG and ECC, comma-separated presets: uniform, indoor, urban, rural (default uniform)");
    sub->add_option("--direction", a->direction, "Also read the axial ratio at THETA,PHI (deg) at every frequency");
    sub->add_option("--ar-threshold", a->ar_threshold_db, "Axial-ratio limit of the AR beamwidth, dB (default 3)");
    sub->add_flag("--pair", a->pair, "ECC and diversity gain between the first two files at their shared frequencies");
    sub->add_option("--title", a->title, "Figure title (default: the pattern's name)");
    sub->add_option("--size", a->size, "Image size WIDTHxHEIGHT in pixels (default 1200x900)");
    sub->add_option("--dpi", a->dpi, "Dots per inch (default 150)");
    sub->add_flag("--force", a->force, "Replace the output file if it exists");
    add_load_options(sub, a->load);
    return {sub, [a]() -> int { return run_band(*a); }};
}
const CommandRegistration registration(72, add_band);

}  // namespace

}  // namespace ellipsa::cli
