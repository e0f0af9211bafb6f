// ellipsa diversity: how well one or two antennas take in a multipath (non-line-of-sight) field.
// Mean effective gain and its V/H parts, polarisation balance, orientation robustness, and for two
// files the envelope correlation and the diversity gain it implies (pattern/diversity.hpp).
#include <cmath>
#include <cstdio>
#include <iostream>
#include <memory>
#include <optional>
#include <variant>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/frequency_option.hpp"
#include "cli/environment_options.hpp"
#include "cli/format.hpp"
#include "cli/json.hpp"
#include "exports/figure_text.hpp"
#include "cli/load.hpp"
#include "pattern/diversity_study.hpp"

namespace ellipsa::cli {

namespace {

struct DiversityArgs {
    std::string file, file2;
    EnvironmentOptions environment;
    DiversityOptions study;
    bool json = false;
    LoadOptions load;
};

const char* orientation_definition =
    "antenna turned by roll about its own z axis, then tilted by tilt about the world's horizontal x axis "
    "(R = R_x(tilt) R_z(roll)); world up is +z; tilts 0 and 180 counted once";

std::optional<double> db(const std::optional<double>& v) {
    if (!v) return std::nullopt;
    return to_db(*v);
}

// A loaded pattern and its figures.
struct PatternResult {
    std::string path;
    FarFieldSet set;
};

void json_sample(JsonWriter& j, const OrientationSample& o) {
    j.begin_object();
    j.field("tilt_deg", o.tilt_deg).field("roll_deg", o.roll_deg);
    j.field("meg_db", to_db(o.meg)).field("meg_vertical_db", to_db(o.meg_vertical));
    j.field("meg_horizontal_db", to_db(o.meg_horizontal));
    j.end_object();
}

void json_orientations(JsonWriter& j, const Result<OrientationFigures>& r, const OrientationSweep& sw) {
    j.key("orientations").begin_object();
    j.field("definition", orientation_definition);
    j.field("tilt_step_deg", sw.tilt_step_deg).field("tilt_max_deg", sw.tilt_max_deg);
    j.field("roll_step_deg", sw.roll_step_deg);
    if (!r) {
        j.field("unavailable_reason", r.error().message);
        j.end_object();
        return;
    }
    const OrientationFigures& o = *r;
    j.field("count", o.samples.size());
    j.field("min_db", to_db(o.min)).field("median_db", to_db(o.median)).field("max_db", to_db(o.max));
    j.field("spread_db", to_db(o.max) - to_db(o.min));
    j.field("random_orientation_mean_db", to_db(o.random_mean));
    j.field("random_orientation_p10_db", to_db(o.random_p10));
    j.field("as_given_db", to_db(o.samples.front().meg));
    j.field("worst_loss_db", to_db(o.samples.front().meg) - to_db(o.min));
    j.key("worst");
    json_sample(j, o.worst);
    j.key("best");
    json_sample(j, o.best);
    j.key("samples").begin_array();  // every orientation: [tilt_deg, roll_deg, meg_db]
    for (const OrientationSample& q : o.samples)
        j.begin_array().value(q.tilt_deg).value(q.roll_deg).value(to_db(q.meg)).end_array();
    j.end_array();
    j.key("by_tilt").begin_array();
    for (const TiltRow& t : o.by_tilt) {
        j.begin_object();
        j.field("tilt_deg", t.tilt_deg).field("min_db", to_db(t.min)).field("mean_db", to_db(t.mean));
        j.field("max_db", to_db(t.max));
        j.end_object();
    }
    j.end_array();
    j.end_object();
}

void write_figures(JsonWriter& j, const FrequencyStudy& r, const OrientationSweep& sweep) {
    if (r.meg) {
        const MegFigures& m = *r.meg;
        j.field("meg_db", to_db(m.meg)).field("meg", m.meg);
        j.field("meg_vertical_db", db(m.meg_vertical)).field("meg_horizontal_db", db(m.meg_horizontal));
        j.field("vertical_share", m.vertical_share).field("horizontal_share", m.horizontal_share);
        j.field("balanced_share", m.balanced_share);
        j.field("sampled_share", m.sampled_share);
        j.key("assumption");
        if (m.assumption.empty())
            j.null();
        else
            j.value(m.assumption);
        j.key("notes").begin_array();
        for (const std::string& n : m.notes) j.value(n);
        j.end_array();
    } else {
        j.key("meg_db").null();
        j.key("meg_vertical_db").null();
        j.key("meg_horizontal_db").null();
        j.field("unavailable_reason", r.meg.error().message);
    }
    if (r.orientations) json_orientations(j, *r.orientations, sweep);
}

std::string different_frequencies_note(const PairStudy& q) {
    return "the two files hold different frequencies (" + format_frequency(q.frequency_hz) + " and " +
           format_frequency(q.frequency2_hz) + "); correlated as given";
}

std::optional<double> ecc_of(const PairStudy& q) {
    return q.correlation ? std::optional<double>(q.correlation->ecc) : std::nullopt;
}

// The combining figures keyed by outage ("0.01"), each with its outage, gains and levels.
void json_combining(JsonWriter& j, const PairStudy& q) {
    j.key("combining");
    if (!q.combining) {
        j.null();
        j.field("combining_unavailable_reason", q.combining.error().message);
        return;
    }
    j.begin_object();
    for (const OutageFigures& o : q.combining->outages) {
        j.key(format_number(o.outage)).begin_object();
        j.field("outage", o.outage);
        j.field("selection_db", o.selection_gain_db).field("mrc_db", o.mrc_gain_db);
        j.field("selection_effective_db", o.selection_effective_gain_db).field("mrc_effective_db", o.mrc_effective_gain_db);
        j.field("selection_level_db", to_db(o.selection_level)).field("mrc_level_db", to_db(o.mrc_level));
        j.field("branch1_level_db", to_db(o.branch1_level)).field("branch2_level_db", to_db(o.branch2_level));
        j.field("ideal_level_db", to_db(o.ideal_level));
        j.end_object();
    }
    j.end_object();
}

void json_pairs(JsonWriter& j, const std::vector<PairStudy>& pairs) {
    // Scalars for the first (or only) frequency; one value per frequency of FILE after them.
    const PairStudy& q0 = pairs.front();
    j.field("ecc", ecc_of(q0));
    j.field("diversity_gain_db", q0.selection_gain_1pct_db);
    json_combining(j, q0);
    j.key("ecc_per_frequency").begin_array();
    for (const PairStudy& q : pairs) j.value(ecc_of(q));
    j.end_array();
    j.key("diversity_gain_db_per_frequency").begin_array();
    for (const PairStudy& q : pairs) j.value(q.selection_gain_1pct_db);
    j.end_array();
    j.key("correlation").begin_array();
    for (const PairStudy& q : pairs) {
        j.begin_object();
        j.field("frequency_hz", q.frequency_hz).field("frequency2_hz", q.frequency2_hz);
        j.field("ecc", ecc_of(q)).field("diversity_gain_db", q.selection_gain_1pct_db);
        if (q.correlation) {
            j.field("diversity_gain_approximation_db", q.correlation->approximate_gain_db);
            j.field("resampled", q.correlation->resampled).field("sampled_share", q.correlation->sampled_share);
        } else {
            j.field("unavailable_reason", q.correlation.error().format());
        }
        j.field("meg_ratio_db", q.meg_ratio_db);
        json_combining(j, q);
        if (q.frequencies_differ) j.field("note", different_frequencies_note(q));
        j.end_object();
    }
    j.end_array();
    j.field("diversity_gain_method", "exact selection combining at 1 % outage, apparent gain; " + std::string(combining_method));
    j.field("diversity_gain_approximation_method", approximate_gain_method);
    j.key("cautions").begin_array();
    for (const char* c : outage_cautions) j.value(c);
    j.end_array();
}

void write_json(const ChosenEnvironment& env, const std::vector<PatternResult>& ps, const DiversityStudy& st,
                const DiversityArgs& a) {
    JsonWriter j;
    j.begin_object();
    write_environment_json(j, env);
    j.key("patterns").begin_array();
    for (std::size_t i = 0; i < ps.size(); ++i) {
        const PatternResult& p = ps[i];
        const std::vector<FrequencyStudy>& results = st.patterns[i];
        j.begin_object();
        j.field("file", p.path).field("name", p.set.name);
        j.field("quantity", to_string(p.set.quantity)).field("content", to_string(p.set.content));
        mounting_json(j, p.set);
        // The first (or only) frequency's figures sit on the pattern itself, so a script reading a
        // single-frequency file finds patterns[i].meg_db; every frequency is in "results".
        if (!results.empty()) {
            j.field("frequency_hz", results.front().frequency_hz);
            write_figures(j, results.front(), a.study.sweep);
        }
        j.key("results").begin_array();
        for (const FrequencyStudy& r : results) {
            j.begin_object();
            j.field("frequency_hz", r.frequency_hz);
            write_figures(j, r, a.study.sweep);
            j.end_object();
        }
        j.end_array();
        j.end_object();
    }
    j.end_array();
    if (!st.pairs.empty()) json_pairs(j, st.pairs);
    j.end_object();
    std::cout << j.str() << "\n";
}

std::string pct(const std::optional<double>& v) { return v ? fmt(100 * *v, "%", 1) : std::string("unavailable"); }

void human_orientations(const OrientationFigures& o, const OrientationSweep& sw) {
    char buf[256];
    std::snprintf(buf, sizeof buf, "%zu (tilt 0..%g deg step %g, roll step %g deg)", o.samples.size(), sw.tilt_max_deg,
                  sw.tilt_step_deg, sw.roll_step_deg);
    std::cout << "    orientations        " << buf << "\n";
    std::cout << "      min / median / max  " << fmt(to_db(o.min), "") << " / " << fmt(to_db(o.median), "") << " / "
              << fmt(to_db(o.max), "dBi") << "  (spread " << fmt(to_db(o.max) - to_db(o.min), "dB") << ")\n";
    if (to_db(o.max) - to_db(o.min) < 0.005) {
        std::cout << "      worst / best        every orientation within 0.01 dB\n";
    } else {
        std::snprintf(buf, sizeof buf, "tilt %g deg, roll %g deg", o.worst.tilt_deg, o.worst.roll_deg);
        std::cout << "      worst               " << fmt(to_db(o.worst.meg), "dBi") << " at " << buf << "\n";
        std::snprintf(buf, sizeof buf, "tilt %g deg, roll %g deg", o.best.tilt_deg, o.best.roll_deg);
        std::cout << "      best                " << fmt(to_db(o.best.meg), "dBi") << " at " << buf << "\n";
    }
    std::cout << "      random orientation  " << fmt(to_db(o.random_mean), "dBi") << " mean, 90 % reach "
              << fmt(to_db(o.random_p10), "dBi") << "\n";
    std::cout << "      careless mounting   costs up to " << fmt(to_db(o.samples.front().meg) - to_db(o.min), "dB")
              << " against the orientation as given\n";
    std::cout << "      by tilt (deg: min / mean / max dBi)\n";
    for (const TiltRow& t : o.by_tilt) {
        std::snprintf(buf, sizeof buf, "        %5.1f: %7.2f / %7.2f / %7.2f\n", t.tilt_deg, to_db(t.min), to_db(t.mean),
                      to_db(t.max));
        std::cout << buf;
    }
}

void human_frequency(const FrequencyStudy& r, const OrientationSweep& sw) {
    std::cout << "  " << format_frequency(r.frequency_hz) << "\n";
    if (!r.meg) {
        std::cout << "    MEG                 unavailable: " << r.meg.error().message << "\n";
        return;
    }
    const MegFigures& m = *r.meg;
    std::cout << "    MEG                 " << fmt(to_db(m.meg), "dBi") << "  (" << fmt(m.meg, "", 4) << " linear)\n";
    if (!m.assumption.empty()) std::cout << "                        " << m.assumption << "\n";
    const auto part = [](const std::optional<double>& v, const std::optional<double>& share) {
        return v ? exports::part_text(*v, share, "dBi", " of MEG") : std::string("unavailable");
    };
    std::cout << "      vertical part     " << part(m.meg_vertical, m.vertical_share) << "\n";
    std::cout << "      horizontal part   " << part(m.meg_horizontal, m.horizontal_share) << "\n";
    std::cout << "    V and H within 3 dB " << pct(m.balanced_share) << " of the incoming power\n";
    for (const std::string& n : m.notes) std::cout << "    note: " << n << "\n";
    if (!r.orientations) return;
    if (!*r.orientations)
        std::cout << "    orientations        unavailable: " << r.orientations->error().message << "\n";
    else
        human_orientations(**r.orientations, sw);
}

void human_combining(const CombiningFigures& c) {
    std::cout << "    at outage   level A   level B   selection (gain, effective)   max. ratio (gain, effective)\n";
    for (const OutageFigures& o : c.outages) {
        char buf[200];
        std::snprintf(buf, sizeof buf, "    %7g %%  %8.2f  %8.2f   %7.2f (%5.2f, %5.2f)        %7.2f (%5.2f, %5.2f)\n",
                      100 * o.outage, to_db(o.branch1_level), to_db(o.branch2_level), to_db(o.selection_level),
                      o.selection_gain_db, o.selection_effective_gain_db, to_db(o.mrc_level), o.mrc_gain_db,
                      o.mrc_effective_gain_db);
        std::cout << buf;
    }
    std::cout << "                (levels in dBi, gains in dB: over the stronger branch, and over an ideal lossless\n"
                 "                 antenna in the isotropic environment)\n";
}

void human_pairs(const std::vector<PatternResult>& ps, const std::vector<PairStudy>& pairs) {
    std::cout << "\ncorrelation  " << ps[0].path << " with " << ps[1].path << "\n";
    for (const PairStudy& q : pairs) {
        std::cout << "  " << format_frequency(q.frequency_hz) << "\n";
        if (!q.correlation) {
            std::cout << "    ECC                 unavailable: " << q.correlation.error().format() << "\n";
            continue;
        }
        std::cout << "    ECC                 " << fmt(q.correlation->ecc, "", 4) << "\n";
        std::cout << "    MEG ratio           " << fmt(q.meg_ratio_db, "dB") << " (first / second)\n";
        if (q.combining) {
            std::cout << "    diversity gain      " << fmt(q.selection_gain_1pct_db, "dB")
                      << " (exact selection combining at 1 % outage; 10 sqrt(1 - ECC) would say "
                      << fmt(q.correlation->approximate_gain_db, "dB") << ")\n";
            human_combining(*q.combining);
        } else {
            std::cout << "    diversity gain      unavailable: " << q.combining.error().message << "\n";
        }
        if (q.correlation->resampled) std::cout << "    note: the second pattern was interpolated onto the first one's grid\n";
        if (q.frequencies_differ) std::cout << "    note: " << different_frequencies_note(q) << "\n";
    }
    std::cout << "  method: " << combining_method << "\n";
    for (const char* c : outage_cautions) std::cout << "  caution: " << c << "\n";
}

void write_human(const ChosenEnvironment& env, const std::vector<PatternResult>& ps, const DiversityStudy& st,
                 const DiversityArgs& a) {
    const Environment& e = env.environment;
    std::cout << "environment  " << describe(e) << "\n";
    if (!e.source.empty()) std::cout << "  source     " << e.source << "\n";
    if (env.xpr_from == XprOrigin::profile_table)
        std::cout << "  XPR        from the table's p_v / p_h totals (override with --xpr)\n";
    for (std::size_t i = 0; i < ps.size(); ++i) {
        const PatternResult& p = ps[i];
        std::cout << "\n" << p.path << ": " << (p.set.name.empty() ? "(no name)" : p.set.name) << " ("
                  << to_string(p.set.quantity) << ", " << to_string(p.set.content) << ")\n";
        if (const std::string m = mounting_note(p.set); !m.empty()) std::cout << "  " << m << "\n";
        for (const FrequencyStudy& r : st.patterns[i]) human_frequency(r, a.study.sweep);
    }
    if (!st.pairs.empty()) human_pairs(ps, st.pairs);
}

int fail(int code, const std::string& message) {
    std::cerr << "ellipsa diversity: " << message << "\n";
    return code;
}

int run(const DiversityArgs& a) {
    auto built = chosen_environment(a.environment);
    if (auto* u = std::get_if<UsageError>(&built)) return fail(exit_usage, u->message);
    if (auto* er = std::get_if<Error>(&built)) return fail(exit_bad_input, er->format());
    const ChosenEnvironment& env = std::get<ChosenEnvironment>(built);
    if (a.study.orientations)
        if (Status sv = validate(a.study.sweep); !sv) return fail(exit_usage, sv.error().message);
    if (Status so = validate_outages(a.study.outages); !so) return fail(exit_usage, "--outage: " + so.error().message);

    std::vector<PatternResult> ps;
    for (const std::string& path : {a.file, a.file2}) {
        if (path.empty()) continue;
        auto s = load_pattern(path, a.load);
        if (!s) return fail(exit_bad_input, s.error().format());
        ps.push_back({file_path(path), std::move(*s)});
    }
    std::vector<StudyPattern> inputs;
    for (const PatternResult& p : ps) inputs.push_back({&p.set, p.path, {}});
    auto st = study_diversity(env.environment, a.study, inputs);
    if (!st) return fail(exit_bad_input, st.error().format());

    if (a.json)
        write_json(env, ps, *st, a);
    else
        write_human(env, ps, *st, a);
    for (const auto& pattern : st->patterns)
        for (const FrequencyStudy& r : pattern)
            if (!r.meg) return fail(exit_bad_input, "MEG is unavailable for at least one pattern (see the reason above)");
    return exit_ok;
}

Registered add_diversity(CLI::App& root) {
    auto a = std::make_shared<DiversityArgs>();
    CLI::App* sub = root.add_subcommand(
        "diversity",
        "Score antennas for multipath links: mean effective gain (Taga), V/H balance, orientation robustness, "
        "envelope correlation and diversity gain of two antennas");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    sub->add_option("FILE2", a->file2, "Second antenna: adds envelope correlation and diversity gain");
    add_environment_options(sub, a->environment);
    sub->add_flag("--orientations", a->study.orientations, "Also turn the antenna through tilts and rolls: MEG statistics");
    sub->add_option("--tilt-step", a->study.sweep.tilt_step_deg,
                    "Orientation sweep: tilt step, deg (default 15; implies --orientations)")
        ->check(number_from_to(0.1, 180));
    sub->add_option("--tilt-max", a->study.sweep.tilt_max_deg, "Orientation sweep: largest tilt, deg (default 90; up to 180)")
        ->check(number_from_to(0, 180));
    sub->add_option("--roll-step", a->study.sweep.roll_step_deg,
                    "Orientation sweep: roll step, deg (default 15; a multiple of the grid's phi step is exact and fast)")
        ->check(number_from_to(0.1, 360));
    add_frequency_option(sub, a->study.frequency_hz, "Only this frequency (nearest within 0.5 %; default all)");
    sub->add_option("--outage", a->study.outages,
                    "Outage probabilities of the combining figures, comma-separated fractions (default 0.01,0.1)")
        ->delimiter(',')
        ->check(number_between(0, 1));
    sub->add_flag("--json", a->json, "Print one JSON object instead of the human summary");
    add_load_options(sub, a->load);
    a->load.whole_sphere_figure = "diversity (MEG and ECC)";
    return {sub, [a, sub]() -> int {
                // Giving a sweep option asks for the sweep.
                if (sub->count("--tilt-step") || sub->count("--tilt-max") || sub->count("--roll-step"))
                    a->study.orientations = true;
                return run(*a);
            }};
}
const CommandRegistration registration(60, add_diversity);

}  // namespace

}  // namespace ellipsa::cli
