#include "cli/rank_json.hpp"

#include "cli/json.hpp"
#include "cli/usage.hpp"
#include "pattern/combining.hpp"

namespace ellipsa::cli {

CLI::Validator rank_outage_check() { return number_between(0, 1); }

namespace {
void json_figures(JsonWriter& j, const RankFigures& f, double outage, RankScore score) {
    const auto db = [](const std::optional<double>& v) -> std::optional<double> {
        return v && *v > 0 ? std::optional<double>(to_db(*v)) : std::nullopt;
    };
    const std::string key = format_number(outage);
    j.begin_object();
    if (f.meg) {
        j.field("meg_db", to_db(f.meg->meg)).field("meg_vertical_db", db(f.meg->meg_vertical));
        j.field("meg_horizontal_db", db(f.meg->meg_horizontal));
        if (!f.meg->assumption.empty()) j.field("assumption", f.meg->assumption);
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

}  // namespace

std::optional<std::string> rank_score_problem(const std::string& text, RankScore& out) {
    if (parse_rank_score(text, out)) return std::nullopt;
    return "expected mounted, random or worst, found \"" + text + "\"";
}

std::string rank_display_name(const RankCandidate& c) {
    if (!c.set->name.empty()) return c.set->name;
    const std::size_t s = c.path.rfind('/');
    return s == std::string::npos ? c.path : c.path.substr(s + 1);
}

Result<RankRun> rank_run(const std::vector<RankCandidate>& candidates, const RankCandidate& reference,
                         const std::string& reference_label, const std::vector<ChosenEnvironment>& environments,
                         const RankOptions& o) {
    RankRun run;
    exports::RankLabels& l = run.labels;
    for (const RankCandidate& c : candidates) {
        l.names.push_back(rank_display_name(c));
        l.files.push_back(c.path);
        l.frequencies_hz.push_back(c.set->frequencies[c.freq_index].frequency_hz);
    }
    for (const ChosenEnvironment& c : environments) l.environments.push_back(c.environment);
    l.reference = reference_label;
    l.sweep = o.sweep;
    l.orientations = o.orientations;
    auto r = rank_candidates(candidates, reference, l.environments, o);
    if (!r) return r.error();
    run.ranking = std::move(*r);
    return run;
}

std::string rank_json(const std::vector<ChosenEnvironment>& envs, const std::vector<RankCandidate>& candidates,
                      const Ranking& r, const exports::RankLabels& l) {
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
        const RankCandidate& p = candidates[row.input];
        j.begin_object();
        j.field("rank", row.score_db ? std::optional<double>(double(k + 1)) : std::nullopt);
        j.field("file", p.path).field("name", p.set->name).field("frequency_hz", p.set->frequencies[p.freq_index].frequency_hz);
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

}  // namespace ellipsa::cli
