// ellipsa rank: every candidate antenna in every chosen multipath environment against a reference,
// sorted by a documented score (pattern/rank.hpp). Text, JSON or CSV on stdout; Markdown, HTML or
// CSV into a file with --out (exports/rank_table.hpp, exports/document.hpp).
#include <algorithm>
#include <cctype>
#include <iostream>
#include <memory>
#include <thread>
#include <variant>

#include "cli/commands.hpp"
#include "cli/frequency_option.hpp"
#include "cli/environment_options.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "exports/rank_table.hpp"
#include "io/atomic_write.hpp"
#include "pattern/combining.hpp"
#include "pattern/rank.hpp"

namespace ellipsa::cli {

namespace {

using namespace ellipsa::exports;

struct RankArgs {
    std::vector<std::string> files;
    EnvironmentOptions environment;  // --environment may list several, comma-separated
    std::string reference = "dipole";
    std::optional<double> frequency_hz;
    std::string score = "mounted";
    RankOptions rank;
    bool no_orientations = false;
    bool json = false, csv = false, force = false;
    std::string out;
    LoadOptions load;
};

int fail(int code, const std::string& msg) {
    std::cerr << "ellipsa rank: " << msg << "\n";
    return code;
}

struct Loaded {
    std::string path;
    FarFieldSet set;
    std::size_t freq = 0;
};

// The comma-separated names of --environment; an empty item (as in "uniform,,indoor") is refused.
std::variant<std::vector<std::string>, UsageError> split_names(const std::string& text) {
    std::vector<std::string> out;
    if (text.empty()) return out;
    std::string cur;
    for (char c : text + ",") {
        if (c != ',') {
            if (!std::isspace(static_cast<unsigned char>(c))) cur += c;
            continue;
        }
        if (cur.empty())
            return UsageError{"--environment: expected comma-separated environment names, found an empty item in \"" + text + "\""};
        out.push_back(cur);
        cur.clear();
    }
    return out;
}

bool other_environment_options(const EnvironmentOptions& o) {
    return !o.xpr.empty() || o.v_mean || o.v_spread || o.h_mean || o.h_spread || !o.profile.empty();
}

// The environments: each name of --environment with the other options applied to it; none given:
// every preset (unless other environment options describe one).
std::variant<std::vector<ChosenEnvironment>, UsageError, Error> environments_of(const EnvironmentOptions& o) {
    auto split = split_names(o.environment);
    if (auto* u = std::get_if<UsageError>(&split)) return *u;
    std::vector<std::string> names = std::get<std::vector<std::string>>(split);
    if (names.empty() && !other_environment_options(o))
        for (const EnvironmentPreset& p : environment_presets()) names.push_back(p.name);
    if (names.empty()) names.push_back("");
    std::vector<ChosenEnvironment> out;
    for (const std::string& n : names) {
        EnvironmentOptions one = o;
        one.environment = n;
        auto built = chosen_environment(one);
        if (auto* u = std::get_if<UsageError>(&built)) return *u;
        if (auto* er = std::get_if<Error>(&built)) return *er;
        out.push_back(std::get<ChosenEnvironment>(built));
    }
    return out;
}

std::string display_name(const Loaded& l) {
    if (!l.set.name.empty()) return l.set.name;
    const std::size_t s = l.path.rfind('/');
    return s == std::string::npos ? l.path : l.path.substr(s + 1);
}

void json_figures(JsonWriter& j, const RankFigures& f, double outage, RankScore score) {
    const auto db = [](const std::optional<double>& v) -> std::optional<double> {
        return v && *v > 0 ? std::optional<double>(to_db(*v)) : std::nullopt;
    };
    const std::string key = format_number(outage);
    j.begin_object();
    if (f.meg) {
        j.field("meg_db", to_db(f.meg->meg)).field("meg_vertical_db", db(f.meg->meg_vertical));
        j.field("meg_horizontal_db", db(f.meg->meg_horizontal));
    } else {
        j.key("meg_db").null();
        j.field("unavailable_reason", f.meg.error().message);
    }
    const bool turned = f.orientations && *f.orientations;
    j.field("orientation_median_db", turned ? db((**f.orientations).median) : std::nullopt);
    j.field("orientation_p10_db", turned ? db((**f.orientations).random_p10) : std::nullopt);
    j.field("orientation_worst_db", turned ? db((**f.orientations).min) : std::nullopt);
    if (f.orientations && !*f.orientations) j.field("orientation_unavailable_reason", f.orientations->error().message);
    j.key("fading_levels_db").begin_object().field(key, db(f.level)).end_object();
    j.key("fading_levels_random_db").begin_object().field(key, db(f.random_level)).end_object();
    j.field("advantage_db", f.advantage_db).field("random_advantage_db", f.random_advantage_db);
    j.field("worst_advantage_db", f.worst_advantage_db).field("score_part_db", score_part_db(f, score));
    j.end_object();
}

void json_environments(JsonWriter& j, const std::vector<ChosenEnvironment>& envs, const std::vector<RankFigures>& figs,
                       const Ranking& r) {
    j.key("environments").begin_object();
    for (std::size_t e = 0; e < envs.size(); ++e) {
        j.key(envs[e].environment.name);
        json_figures(j, figs[e], r.outage, r.score);
    }
    j.end_object();
}

std::string write_json(const std::vector<ChosenEnvironment>& envs, const std::vector<Loaded>& ps, const Ranking& r,
                       const RankLabels& l) {
    JsonWriter j;
    j.begin_object();
    j.field("score", to_string(r.score)).field("score_definition", rank_score_definition(r.score));
    j.field("outage", r.outage);
    j.key("environment_list").begin_array();
    for (const ChosenEnvironment& c : envs) {
        j.begin_object();
        write_environment_json(j, c);
        j.end_object();
    }
    j.end_array();
    j.key("reference").begin_object().field("name", l.reference);
    json_environments(j, envs, r.reference, r);
    j.end_object();
    j.key("rows").begin_array();
    for (std::size_t k = 0; k < r.rows.size(); ++k) {
        const RankRow& row = r.rows[k];
        const Loaded& p = ps[row.input];
        j.begin_object();
        j.field("rank", row.score_db ? std::optional<double>(double(k + 1)) : std::nullopt);
        j.field("file", p.path).field("name", p.set.name).field("frequency_hz", p.set.frequencies[p.freq].frequency_hz);
        j.field("score_db", row.score_db);
        if (!row.score_db) j.field("unavailable_reason", row.unavailable_reason);
        json_environments(j, envs, row.environments, r);
        j.end_object();
    }
    j.end_array();
    j.key("cautions").begin_array();
    for (const char* c : outage_cautions) j.value(c);
    j.end_array();
    j.end_object();
    return j.str() + "\n";
}

Document rank_document(const Ranking& r, const RankLabels& l) {
    Document doc;
    doc.title = "Ranking of candidate antennas";
    rank_blocks(doc, r, l, 2);
    return doc;
}

// The reference the options ask for, on the first candidate's grid when it is the dipole.
Result<Loaded> load_reference(const RankArgs& a, const Loaded& first) {
    if (a.reference == "dipole")
        return Loaded{"", reference_dipole(first.set.grid, first.set.frequencies[first.freq].frequency_hz), 0};
    auto s = load_pattern(a.reference, a.load);
    if (!s) return s.error();
    auto k = pick_frequency(*s, a.frequency_hz, a.reference);
    if (!k) return k.error();
    return Loaded{a.reference, std::move(*s), *k};
}

Result<std::vector<Loaded>> load_candidates(const RankArgs& a) {
    std::vector<Loaded> ps;
    for (const std::string& f : a.files) {
        auto s = load_pattern(f, a.load);
        if (!s) return s.error();
        auto k = pick_frequency(*s, a.frequency_hz, f);
        if (!k) return k.error();
        ps.push_back({f, std::move(*s), *k});
    }
    return ps;
}

int emit(const RankArgs& a, const std::vector<ChosenEnvironment>& envs, const std::vector<Loaded>& ps, const Ranking& r,
         const RankLabels& l) {
    if (!a.out.empty()) {
        std::string lower = a.out;
        for (char& c : lower) c = char(std::tolower(static_cast<unsigned char>(c)));
        const auto ends = [&](const std::string& x) { return lower.size() >= x.size() && lower.compare(lower.size() - x.size(), x.size(), x) == 0; };
        std::string bytes = ends(".csv")    ? rank_csv(r, l)
                            : ends(".json") ? write_json(envs, ps, r, l)
                            : ends(".md")   ? to_markdown(rank_document(r, l))
                                            : to_html(rank_document(r, l));
        if (Status st = io::write_file_atomically(a.out, bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
        std::cerr << "wrote " << a.out << "\n";
    }
    if (a.json)
        std::cout << write_json(envs, ps, r, l);
    else if (a.csv)
        std::cout << rank_csv(r, l);
    else if (a.out.empty())
        std::cout << to_text(rank_document(r, l));
    return exit_ok;
}

int run(RankArgs a) {
    if (!parse_rank_score(a.score, a.rank.score))
        return fail(exit_usage, "--score: expected mounted, random or worst, found \"" + a.score + "\"");
    a.rank.orientations = !a.no_orientations;
    if (Status v = validate(a.rank); !v) return fail(exit_usage, v.error().message);
    if (a.json && a.csv) return fail(exit_usage, "--json and --csv both choose what is printed; give one");
    if (!a.out.empty()) {
        std::string e = a.out.substr(a.out.find_last_of('.') == std::string::npos ? a.out.size() : a.out.find_last_of('.'));
        for (char& c : e) c = char(std::tolower(static_cast<unsigned char>(c)));
        if (e != ".md" && e != ".html" && e != ".csv" && e != ".json")
            return fail(exit_usage, "--out " + a.out + ": expected a file name ending in .md, .html, .csv or .json");
    }
    auto built = environments_of(a.environment);
    if (auto* u = std::get_if<UsageError>(&built)) return fail(exit_usage, u->message);
    if (auto* er = std::get_if<Error>(&built)) return fail(exit_bad_input, er->format());
    const auto& envs = std::get<std::vector<ChosenEnvironment>>(built);
    auto ps = load_candidates(a);
    if (!ps) return fail(exit_bad_input, ps.error().format());
    auto ref = load_reference(a, ps->front());
    if (!ref) return fail(exit_bad_input, ref.error().format());

    std::vector<RankCandidate> cands;
    RankLabels l;
    for (const Loaded& p : *ps) {
        cands.push_back({&p.set, p.path, p.freq});
        l.names.push_back(display_name(p));
        l.files.push_back(p.path);
        l.frequencies_hz.push_back(p.set.frequencies[p.freq].frequency_hz);
    }
    std::vector<Environment> environments;
    for (const ChosenEnvironment& c : envs) environments.push_back(c.environment);
    l.environments = environments;
    l.reference = a.reference == "dipole" ? reference_dipole_description : ref->path;
    l.sweep = a.rank.sweep;
    l.orientations = a.rank.orientations;
    auto r = rank_candidates(cands, {&ref->set, ref->path.empty() ? "reference dipole" : ref->path, ref->freq}, environments, a.rank);
    if (!r) return fail(exit_bad_input, r.error().format());
    return emit(a, envs, *ps, *r, l);
}

Registered add_rank(CLI::App& root) {
    auto a = std::make_shared<RankArgs>();
    a->rank.threads = int(std::clamp(std::thread::hardware_concurrency(), 1u, 4u));
    CLI::App* sub = root.add_subcommand(
        "rank",
        "Rank candidate antennas for links without line of sight: MEG, V/H parts, orientation statistics and fading "
        "levels in each environment, advantage over a reference, sorted by a score");
    sub->add_option("FILE", a->files, "Far-field CSV files of the candidates")->required();
    add_environment_options(sub, a->environment);
    sub->footer("--environment may list several, comma-separated (e.g. uniform,indoor,urban); the other environment "
                "options apply to each. Default: every preset.");
    sub->add_option("--reference", a->reference,
                    "dipole (default: a lossless vertical half-wave dipole on the first candidate's grid) or a pattern file");
    sub->add_option("--score", a->score,
                    "mounted (default: fading level as mounted = MEG), random (with random orientation) or worst "
                    "(worst orientation): each as the mean advantage over the reference across the environments, dB");
    sub->add_option("--outage", a->rank.outage, "Outage probability of the fading levels (default 0.01)");
    add_frequency_option(sub, a->frequency_hz, "Use this frequency of every file (nearest within 0.5 %; default the middle one of each)");
    sub->add_option("--tilt-step", a->rank.sweep.tilt_step_deg, "Orientation sweep: tilt step, deg (default 15)");
    sub->add_option("--tilt-max", a->rank.sweep.tilt_max_deg, "Orientation sweep: largest tilt, deg (default 180: every orientation)");
    sub->add_option("--roll-step", a->rank.sweep.roll_step_deg, "Orientation sweep: roll step, deg (default 15)");
    sub->add_flag("--no-orientations", a->no_orientations, "Skip the orientation sweep (faster; only the mounted score)");
    sub->add_option("--threads", a->rank.threads, "Threads (the result does not depend on it)");
    sub->add_flag("--json", a->json, "Print one JSON object instead of the tables");
    sub->add_flag("--csv", a->csv, "Print CSV (one row per candidate and environment) instead of the tables");
    sub->add_option("--out", a->out, "Also write the ranking to a file: .md, .html, .csv or .json");
    sub->add_flag("--force", a->force, "Replace the --out file if it exists");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "ranking (MEG in each environment)";
    return {sub, [a]() -> int { return run(*a); }};
}
const CommandRegistration registration(65, add_rank);

}  // namespace

}  // namespace ellipsa::cli
