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
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/environment_options.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "cli/rank_json.hpp"
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

// The comma-separated names of --environment; an empty item (as in "uniform,,indoor") or a repeated
// one is refused.
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
        // each environment once: a repeat would count twice in the score and repeat a JSON key
        if (std::find(out.begin(), out.end(), cur) != out.end())
            return UsageError{"--environment: expected each environment once, found \"" + cur + "\" twice in \"" + text + "\""};
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
    const std::string path = file_path(a.reference);
    auto k = pick_frequency(*s, a.frequency_hz, path);
    if (!k) return k.error();
    return Loaded{path, std::move(*s), *k};
}

Result<std::vector<Loaded>> load_candidates(const RankArgs& a) {
    std::vector<Loaded> ps;
    for (const std::string& f : a.files) {
        auto s = load_pattern(f, a.load);
        if (!s) return s.error();
        auto k = pick_frequency(*s, a.frequency_hz, file_path(f));
        if (!k) return k.error();
        ps.push_back({file_path(f), std::move(*s), *k});
    }
    return ps;
}

int emit(const RankArgs& a, const std::vector<ChosenEnvironment>& envs, const std::vector<RankCandidate>& ps, const Ranking& r,
         const RankLabels& l) {
    if (!a.out.empty()) {
        std::string lower = a.out;
        for (char& c : lower) c = char(std::tolower(static_cast<unsigned char>(c)));
        const auto ends = [&](const std::string& x) { return lower.size() >= x.size() && lower.compare(lower.size() - x.size(), x.size(), x) == 0; };
        std::string bytes = ends(".csv")    ? rank_csv(r, l)
                            : ends(".json") ? rank_json(envs, ps, r, l)
                            : ends(".md")   ? to_markdown(rank_document(r, l))
                                            : to_html(rank_document(r, l));
        if (Status st = io::write_file_atomically(a.out, bytes, a.force); !st) return fail(exit_bad_input, st.error().format());
        std::cerr << "wrote " << a.out << "\n";
    }
    if (a.json)
        std::cout << rank_json(envs, ps, r, l);
    else if (a.csv)
        std::cout << rank_csv(r, l);
    else if (a.out.empty())
        std::cout << to_text(rank_document(r, l));
    return exit_ok;
}

int run(RankArgs a) {
    if (auto bad = rank_score_problem(a.score, a.rank.score)) return fail(exit_usage, "--score: " + *bad);
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
    for (const Loaded& p : *ps) cands.push_back({&p.set, p.path, p.freq});
    auto r = rank_run(cands, {&ref->set, ref->path.empty() ? "reference dipole" : ref->path, ref->freq},
                      a.reference == "dipole" ? reference_dipole_description : ref->path, envs, a.rank);
    if (!r) return fail(exit_bad_input, r.error().format());
    return emit(a, envs, cands, r->ranking, r->labels);
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
    sub->add_option("--outage", a->rank.outage, "Outage probability of the fading levels (default 0.01)")->check(rank_outage_check());
    add_frequency_option(sub, a->frequency_hz, "Use this frequency of every file (nearest within 0.5 %; default the middle one of each)");
    sub->add_option("--tilt-step", a->rank.sweep.tilt_step_deg, "Orientation sweep: tilt step, deg (default 15)")->check(number_from_to(0.1, 180));
    sub->add_option("--tilt-max", a->rank.sweep.tilt_max_deg, "Orientation sweep: largest tilt, deg (default 180: every orientation)")
        ->check(number_from_to(0, 180));
    sub->add_option("--roll-step", a->rank.sweep.roll_step_deg, "Orientation sweep: roll step, deg (default 15)")->check(number_from_to(0.1, 360));
    sub->add_flag("--no-orientations", a->no_orientations, "Skip the orientation sweep (faster; only the mounted score)");
    sub->add_option("--threads", a->rank.threads, "Threads (the result does not depend on it)")->check(number_from_to(1, 64));
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
