// ellipsa fading: the random-field simulation (pattern/fading.hpp). Many realisations of a
// multipath field made of plane waves drawn from the environment; what each antenna receives, its
// mean (against MEG), its levels at chosen outages and its fade depth; for two antennas the
// simulated power correlation (against the ECC) and selection and maximal-ratio combining. An
// optional dominant (Rician) wave and an optional random orientation. Curves as SVG/PNG/PDF/CSV.
#include <cmath>
#include <cstdio>
#include <iostream>
#include <memory>
#include <optional>
#include <thread>
#include <tuple>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/environment_options.hpp"
#include "cli/format.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "cli/number_list.hpp"
#include "importers/text.hpp"
#include "exports/fading_figure.hpp"
#include "exports/render.hpp"
#include "io/atomic_write.hpp"
#include "pattern/diversity.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct FadingArgs {
    std::vector<std::string> files;
    EnvironmentOptions environment;
    FadingOptions sim;
    std::optional<double> frequency_hz;
    std::string dominant;      // THETA,PHI
    std::string k_factor;      // linear, or "10dB"
    std::string polarisation;  // of the dominant wave
    std::string partner;       // a partner antenna file: its field toward us is the dominant wave's
    bool random_orientation = false;
    std::optional<double> tilt_max_deg;
    std::string plot, size = "1200x900";
    double dpi = 150;
    bool json = false, force = false;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa fading: " << msg << "\n";
    return code;
}

std::string letter(std::size_t i) { return std::string(1, char('A' + i % 26)); }

// "10" (linear, from 0 to max_k_factor) or "10dB" / "10 dB" (a finite number of dB within that range);
// nullopt for anything else (a sign on a linear ratio included).
std::optional<double> parse_k_factor(std::string text) {
    bool db = false;
    for (const char* suffix : {"dB", "db"}) {
        const std::size_t at = text.rfind(suffix);
        if (at != std::string::npos && at + 2 == text.size()) {
            text.resize(at);
            db = true;
        }
    }
    while (!text.empty() && text.back() == ' ') text.pop_back();
    const auto v = parse_number_list(text);
    if (!v || v->size() != 1 || (!db && text.find_first_of("+-") != std::string::npos)) return std::nullopt;
    const double k = db ? std::pow(10.0, v->front() / 10) : v->front();
    if (!(k >= 0 && k <= max_k_factor)) return std::nullopt;
    return k;
}

// The --k-factor check while parsing (exit 2, the usage hint).
CLI::Validator k_factor_check() {
    return CLI::Validator(
        [](std::string& s) -> std::string {
            if (parse_k_factor(s)) return {};
            return "expected a linear power ratio from 0 to " + text::number(max_k_factor) + " or the same in dB (up to " +
                   text::number(10 * std::log10(max_k_factor)) + "dB, e.g. 10dB), found " + text::quote_found(s);
        },
        "");
}

// The dominant wave the options describe (nullopt: none). Usage errors as UsageError, a partner
// file that cannot be used as Error.
std::variant<std::optional<DominantWave>, UsageError, Error> dominant_wave(const FadingArgs& a) {
    const bool any = !a.dominant.empty() || !a.k_factor.empty() || !a.polarisation.empty() || !a.partner.empty();
    if (!any) return std::optional<DominantWave>{};
    if (a.k_factor.empty()) return UsageError{"a dominant wave needs --k-factor K (linear, or e.g. 10dB)"};
    if (!a.polarisation.empty() && !a.partner.empty())
        return UsageError{"--polarisation and --partner both set the dominant wave's polarisation; give one"};
    DominantWave d;
    d.k_factor = parse_k_factor(a.k_factor).value_or(0);  // checked while parsing (k_factor_check)
    if (!a.dominant.empty()) std::tie(d.theta_deg, d.phi_deg) = read_number_pair(a.dominant);  // checked while parsing
    if (!a.partner.empty()) {
        auto p = load_pattern(a.partner, a.load);
        if (!p) return p.error();
        auto k = pick_frequency(*p, a.frequency_hz, file_path(a.partner));
        if (!k) return k.error();
        auto f = partner_field(*p, *k, d.theta_deg, d.phi_deg);
        if (!f) return Error{file_path(a.partner), 0, 0, f.error().message};
        d.field = *f;
        return std::optional<DominantWave>(d);
    }
    WavePolarisation pol = WavePolarisation::vertical;
    if (!a.polarisation.empty()) parse_wave_polarisation(a.polarisation, pol);  // checked while parsing (one_of)
    d.field = incoming_field(pol, d.theta_deg, d.phi_deg);
    return std::optional<DominantWave>(d);
}

std::string dominant_text(const FadingArgs& a, const DominantWave& d) {
    char buf[240];
    std::snprintf(buf, sizeof buf, "from theta %g, phi %g deg, K = %.4g (%.2f dB), polarisation %s", d.theta_deg, d.phi_deg,
                  d.k_factor, 10 * std::log10(d.k_factor),
                  a.partner.empty() ? (a.polarisation.empty() ? "vertical" : a.polarisation.c_str())
                                    : ("of the partner " + file_path(a.partner)).c_str());
    return buf;
}

void json_levels(JsonWriter& j, const char* key, const std::vector<LevelEstimate>& levels) {
    j.key(key).begin_object();
    for (const LevelEstimate& l : levels) j.field(format_number(l.outage), to_db(l.level));
    j.end_object();
}
void json_level_intervals(JsonWriter& j, const char* key, const std::vector<LevelEstimate>& levels) {
    j.key(key).begin_object();
    for (const LevelEstimate& l : levels) j.key(format_number(l.outage)).begin_array().value(to_db(l.ci95.lo)).value(to_db(l.ci95.hi)).end_array();
    j.end_object();
}
void json_values(JsonWriter& j, const char* key, const std::vector<double>& outages, const std::vector<double>& linear) {
    j.key(key).begin_object();
    for (std::size_t k = 0; k < outages.size() && k < linear.size(); ++k) j.field(format_number(outages[k]), to_db(linear[k]));
    j.end_object();
}
void json_cdf(JsonWriter& j, const char* key, const std::vector<CdfPoint>& cdf) {
    j.key(key).begin_array();  // [level_db, probability]
    for (const CdfPoint& c : cdf) j.begin_array().value(to_db(c.level)).value(c.probability).end_array();
    j.end_array();
}

void json_antenna(JsonWriter& j, const std::string& file, const FarFieldSet& s, std::size_t fi, const SimulatedAntenna& a,
                  const FadingOptions& o) {
    j.begin_object();
    j.field("file", file).field("name", s.name).field("frequency_hz", s.frequencies[fi].frequency_hz);
    mounting_json(j, s);
    j.field("mean_db", to_db(a.mean));
    j.key("mean_ci95_db").begin_array().value(to_db(a.mean_ci95.lo)).value(to_db(a.mean_ci95.hi)).end_array();
    j.field("analytic_mean_db", a.analytic_mean ? std::optional<double>(to_db(*a.analytic_mean)) : std::nullopt);
    j.field("k_factor", a.analytic_k);
    json_levels(j, "levels_db", a.levels);
    json_level_intervals(j, "levels_ci95_db", a.levels);
    json_values(j, "analytic_levels_db", o.outages, a.analytic_levels);
    j.field("level_1pct_db", to_db(a.level_1pct.level)).field("fade_depth_db", a.fade_depth_db);
    json_cdf(j, "cdf", a.cdf);
    j.end_object();
}

void json_pair(JsonWriter& j, const Result<SimulatedPair>& r, const FadingOptions& o) {
    j.key("pair");
    if (!r) {
        j.begin_object().field("unavailable_reason", r.error().message).end_object();
        return;
    }
    const SimulatedPair& q = *r;
    j.begin_object();
    j.field("power_correlation", q.power_correlation);
    j.key("power_correlation_ci95").begin_array().value(q.power_correlation_ci95.lo).value(q.power_correlation_ci95.hi).end_array();
    j.field("complex_correlation_squared", q.complex_correlation_squared);
    j.field("ecc", q.analytic_ecc);
    j.field("power_correlation_expected", q.expected_power_correlation);
    json_levels(j, "selection_levels_db", q.selection);
    json_level_intervals(j, "selection_levels_ci95_db", q.selection);
    json_levels(j, "mrc_levels_db", q.mrc);
    json_level_intervals(j, "mrc_levels_ci95_db", q.mrc);
    std::vector<double> sel, mrc;
    if (q.analytic)
        for (const OutageFigures& f : q.analytic->outages) sel.push_back(f.selection_level), mrc.push_back(f.mrc_level);
    json_values(j, "analytic_selection_levels_db", o.outages, sel);
    json_values(j, "analytic_mrc_levels_db", o.outages, mrc);
    json_cdf(j, "selection_cdf", q.selection_cdf);
    json_cdf(j, "mrc_cdf", q.mrc_cdf);
    j.end_object();
}

struct Loaded {
    std::string path;
    FarFieldSet set;
    std::size_t freq = 0;
};

void write_json(const ChosenEnvironment& env, const std::vector<Loaded>& ps, const FadingResult& r, const FadingArgs& a) {
    JsonWriter j;
    j.begin_object();
    write_environment_json(j, env);
    j.key("simulation").begin_object();
    j.field("realisations", r.realisations).field("seed", double(r.seed)).field("waves", r.waves);
    j.field("vertical_waves", r.vertical_waves).field("horizontal_waves", r.horizontal_waves);
    j.field("generator", "xoshiro256** seeded by SplitMix64, blocks of 4096 realisations as streams (seed, block)");
    j.key("random_orientation_tilt_max_deg").value(a.sim.random_tilt_max_deg);
    j.key("dominant");
    if (a.sim.dominant) {
        const DominantWave& d = *a.sim.dominant;
        j.begin_object().field("theta_deg", d.theta_deg).field("phi_deg", d.phi_deg).field("k_factor", d.k_factor);
        j.field("description", dominant_text(a, d)).end_object();
    } else {
        j.null();
    }
    j.end_object();
    j.key("outages").begin_array();
    for (double p : a.sim.outages) j.value(p);
    j.end_array();
    j.key("patterns").begin_array();
    for (std::size_t i = 0; i < ps.size(); ++i) json_antenna(j, ps[i].path, ps[i].set, ps[i].freq, r.antennas[i], a.sim);
    j.end_array();
    if (r.pair) json_pair(j, *r.pair, a.sim);
    j.key("cautions").begin_array();
    for (const char* c : outage_cautions) j.value(c);
    j.end_array();
    j.end_object();
    std::cout << j.str() << "\n";
}

// A power in dB with two decimals, or "none" for no power (never "-inf").
std::string db_or_none(double v) {
    if (!(v > 0)) return "none";
    char b[32];
    std::snprintf(b, sizeof b, "%.2f", to_db(v));
    return b;
}

std::string db_ci(double v, const Interval& ci) {
    if (!(v > 0)) return "   none (no power received)";
    char b[96];
    std::snprintf(b, sizeof b, "%7.2f [%.2f, %.2f] dBi", to_db(v), to_db(ci.lo), to_db(ci.hi));
    return b;
}

void human_levels(const std::vector<LevelEstimate>& sim, const std::vector<double>& analytic, const char* closed_form) {
    for (std::size_t k = 0; k < sim.size(); ++k) {
        char label[40];
        std::snprintf(label, sizeof label, "level at %g %%", 100 * sim[k].outage);
        std::printf("    %-20s %s", label, db_ci(sim[k].level, sim[k].ci95).c_str());
        if (k < analytic.size()) std::printf("   %s %s", closed_form, db_or_none(analytic[k]).c_str());
        std::printf("\n");
    }
}

void write_human(const ChosenEnvironment& env, const std::vector<Loaded>& ps, const FadingResult& r, const FadingArgs& a) {
    std::cout << "environment  " << describe(env.environment) << "\n";
    if (!env.environment.source.empty()) std::cout << "  source     " << env.environment.source << "\n";
    std::printf("simulation   %zu realisations of %d plane waves (%d vertical, %d horizontal), seed %llu; "
                "[95 %% intervals]\n",
                r.realisations, r.waves, r.vertical_waves, r.horizontal_waves, static_cast<unsigned long long>(r.seed));
    if (a.sim.dominant) std::cout << "dominant     " << dominant_text(a, *a.sim.dominant) << "\n";
    if (a.sim.random_tilt_max_deg)
        std::printf("orientation  random per realisation, up axis within %g deg of vertical (all antennas together)\n",
                    *a.sim.random_tilt_max_deg);
    for (std::size_t i = 0; i < ps.size(); ++i) {
        const SimulatedAntenna& s = r.antennas[i];
        std::cout << "\n" << letter(i) << ". " << ps[i].path << ": " << (ps[i].set.name.empty() ? "(no name)" : ps[i].set.name)
                  << " at " << format_frequency(ps[i].set.frequencies[ps[i].freq].frequency_hz) << "\n";
        if (const std::string m = mounting_note(ps[i].set); !m.empty()) std::cout << "    " << m << "\n";
        std::printf("    %-20s %s", "mean power", db_ci(s.mean, s.mean_ci95).c_str());
        if (s.analytic_mean) std::printf("   %s %s", a.sim.dominant ? "MEG + dominant" : "MEG", db_or_none(*s.analytic_mean).c_str());
        std::printf("\n");
        if (s.analytic_k) std::printf("    %-20s %7s dB (dominant wave against MEG)\n", "own K-factor", db_or_none(*s.analytic_k).c_str());
        human_levels(s.levels, s.analytic_levels, s.analytic_k ? "Rician" : "Rayleigh");
        if (std::isfinite(s.fade_depth_db))
            std::printf("    %-20s %7.2f dB (mean over the 1 %% level; Rayleigh: 19.98)\n", "fade depth", s.fade_depth_db);
        else
            std::printf("    %-20s none (no power received)\n", "fade depth");
    }
    if (r.pair) {
        std::cout << "\nA with B\n";
        if (!*r.pair) {
            std::cout << "    unavailable: " << r.pair->error().message << "\n";
        } else {
            const SimulatedPair& q = **r.pair;
            std::printf("    %-20s %7.4f [%.4f, %.4f]", "power correlation", q.power_correlation, q.power_correlation_ci95.lo,
                        q.power_correlation_ci95.hi);
            if (q.analytic_ecc) std::printf("   ECC %.4f", *q.analytic_ecc);
            if (q.expected_power_correlation)
                std::printf("\n    %-20s %7.4f (expected with %d waves: the interval is around it; ECC + O(1/waves))",
                            "  expected", *q.expected_power_correlation, r.waves);
            std::printf("\n    %-20s %7.4f (tends to the ECC for any number of waves)\n", "|r1 r2*|^2 estimate",
                        q.complex_correlation_squared);
            std::vector<double> sel, mrc;
            if (q.analytic)
                for (const OutageFigures& f : q.analytic->outages) sel.push_back(f.selection_level), mrc.push_back(f.mrc_level);
            std::cout << "    selection combining\n";
            human_levels(q.selection, sel, "exact");
            std::cout << "    maximal-ratio combining\n";
            human_levels(q.mrc, mrc, "exact");
        }
    }
    std::cout << "\n";
    for (const char* c : outage_cautions) std::cout << "caution: " << c << "\n";
}

Status write_plot(const FadingArgs& a, const ChosenEnvironment& env, const std::vector<Loaded>& ps, const FadingResult& r) {
    const auto format = format_from_path(a.plot);
    auto size = parse_size(a.size, a.dpi);
    if (!size) return size.error();
    FadingFigureLabels labels;
    labels.subtitle = describe(env.environment);
    for (std::size_t i = 0; i < ps.size(); ++i)
        labels.names.push_back(letter(i) + ". " + (ps[i].set.name.empty() ? ps[i].path : ps[i].set.name));
    std::string bytes;
    if (*format == FileFormat::csv) {
        bytes = fading_csv(r, labels);
    } else {
        const XyFigure fig = make_fading_figure(r, labels, a.sim.outages);
        auto img = render_image([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, *format, *size, fig.title);
        if (!img) return img.error();
        bytes = std::move(*img);
    }
    return io::write_file_atomically(a.plot, bytes, a.force);
}

int run(FadingArgs a) {
    auto built = chosen_environment(a.environment);
    if (auto* u = std::get_if<UsageError>(&built)) return fail(exit_usage, u->message);
    if (auto* er = std::get_if<Error>(&built)) return fail(exit_bad_input, er->format());
    const ChosenEnvironment& env = std::get<ChosenEnvironment>(built);
    if (!a.plot.empty() && !format_from_path(a.plot))
        return fail(exit_usage, "--plot " + a.plot + ": expected a file name ending in .svg, .png, .pdf or .csv");
    if (a.tilt_max_deg) a.random_orientation = true;
    if (a.random_orientation) a.sim.random_tilt_max_deg = a.tilt_max_deg.value_or(180.0);
    auto dom = dominant_wave(a);
    if (auto* u = std::get_if<UsageError>(&dom)) return fail(exit_usage, u->message);
    if (auto* er = std::get_if<Error>(&dom)) return fail(exit_bad_input, er->format());
    a.sim.dominant = std::get<std::optional<DominantWave>>(dom);
    if (Status v = validate(a.sim, a.files.size()); !v) return fail(exit_usage, v.error().message);

    std::vector<Loaded> ps;
    for (const std::string& path : a.files) {
        auto s = load_pattern(path, a.load);
        if (!s) return fail(exit_bad_input, s.error().format());
        auto k = pick_frequency(*s, a.frequency_hz, file_path(path));
        if (!k) return fail(exit_bad_input, k.error().format());
        ps.push_back({file_path(path), std::move(*s), *k});
    }
    std::vector<FadingAntenna> ants;
    for (const Loaded& p : ps) ants.push_back({&p.set, p.freq});
    auto r = simulate_fading(ants, env.environment, a.sim);
    if (!r) return fail(exit_bad_input, r.error().message);
    if (!a.plot.empty())
        if (Status st = write_plot(a, env, ps, *r); !st) return fail(exit_bad_input, st.error().format());
    if (a.json)
        write_json(env, ps, *r, a);
    else
        write_human(env, ps, *r, a);
    return exit_ok;
}

Registered add_fading(CLI::App& root) {
    auto a = std::make_shared<FadingArgs>();
    a->sim.threads = int(std::clamp(std::thread::hardware_concurrency(), 1u, 4u));
    CLI::App* sub = root.add_subcommand(
        "fading", "Simulate multipath fading: received power levels, fade depth, correlation and combining of antennas");
    sub->add_option("FILE", a->files, "Far-field CSV files (one or more; two also give correlation and combining)")->required();
    add_environment_options(sub, a->environment);
    sub->add_option("--samples", a->sim.realisations, "Realisations of the field (default 100000)")->check(number_from_to(100, 1e7));
    sub->add_option("--seed", a->sim.seed, "Seed of the random numbers (default 1; the same seed gives the same result)")
        ->check(number_from_to(0, 4294967295.0));
    sub->add_option("--waves", a->sim.waves, "Diffuse plane waves per realisation (default 100)")->check(number_from_to(1, 10000));
    sub->add_option("--outage", a->sim.outages, "Outage probabilities, comma-separated fractions (default 0.01,0.1,0.5)")
        ->delimiter(',')
        ->check(number_between(0, 1));
    add_frequency_option(sub, a->frequency_hz, "Use this frequency of every file (nearest within 0.5 %; default the middle one of each)");
    sub->add_option("--dominant", a->dominant, "Add a dominant (Rician) wave from THETA,PHI, deg (default 90,0: the horizon)")
        ->check(number_pair({"THETA", 0, 180}, {"PHI", -360, 360}, "degrees"))
        ->type_name("THETA,PHI");
    sub->add_option("--k-factor", a->k_factor, "Its K-factor: dominant over diffuse power, linear or in dB (\"10dB\")")
        ->check(k_factor_check());
    sub->add_option("--polarisation", a->polarisation, "Its polarisation (default vertical)")
        ->check(one_of(names_of(all_wave_polarisations)));
    sub->add_option("--partner", a->partner,
                    "Its polarisation is the field this link-partner antenna file sends toward us from the --dominant direction")
        ->type_name("FILE");
    sub->add_flag("--random-orientation", a->random_orientation,
                  "Turn the antennas (together) to a random orientation in each realisation, uniform over all");
    sub->add_option("--tilt-max", a->tilt_max_deg,
                    "With a random orientation: keep the up axis within this tilt of vertical, deg (implies --random-orientation)")
        ->check(number_from_to(0, 180));
    sub->add_option("--threads", a->sim.threads, "Threads (the result does not depend on it)")->check(number_from_to(1, 64));
    sub->add_option("--plot", a->plot, "Write the distribution curves: .svg, .png, .pdf or .csv")->type_name("FILE");
    sub->add_option("--size", a->size, "Plot size WIDTHxHEIGHT in pixels (default 1200x900)")
        ->check(pixel_size(exports::min_size_px, exports::min_size_px, exports::max_size_px));
    sub->add_option("--dpi", a->dpi, "Plot dots per inch (default 150)")->check(number_from_to(exports::min_dpi, exports::max_dpi));
    sub->add_flag("--force", a->force, "Replace the plot file if it exists");
    sub->add_flag("--json", a->json, "Print one JSON object instead of the human summary");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "the fading study (from MEG and ECC)";
    return {sub, [a]() -> int { return run(*a); }};
}
const CommandRegistration registration(62, add_fading);

}  // namespace

}  // namespace ellipsa::cli
