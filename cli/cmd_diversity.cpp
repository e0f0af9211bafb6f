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
#include "cli/format.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "importers/elevation_profile_csv.hpp"
#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"

namespace ellipsa::cli {

namespace {

struct DiversityArgs {
    std::string file, file2;
    std::string environment;
    std::string xpr;  // dB, or inf / -inf
    std::optional<double> v_mean, v_spread, h_mean, h_spread;
    std::string profile;
    std::string profile_measure = "solid-angle";
    bool orientations = false;
    OrientationSweep sweep;
    std::optional<double> frequency_hz;
    bool json = false;
    LoadOptions load;
};

const char* orientation_definition =
    "antenna turned by roll about its own z axis, then tilted by tilt about the world's horizontal x axis "
    "(R = R_x(tilt) R_z(roll)); world up is +z; tilts 0 and 180 counted once";
const char* diversity_gain_method =
    "two-branch selection combining at 1 % outage, Rayleigh fading, equal branch powers: 10 sqrt(1 - ECC) dB "
    "(approximation used with Vaughan & Andersen 1987; common practice)";

struct Usage {
    std::string message;
};

bool parse_xpr(const std::string& s, double& db) {
    if (s == "inf" || s == "+inf" || s == "infinity") return db = INFINITY, true;
    if (s == "-inf" || s == "-infinity") return db = -INFINITY, true;
    char* end = nullptr;
    db = std::strtod(s.c_str(), &end);
    return !s.empty() && end == s.c_str() + s.size() && std::isfinite(db);
}

// Builds the environment from the options. Usage errors -> exit 2, file errors -> exit 1.
struct EnvChoice {
    Environment env;
    std::string xpr_from;  // "default", "option", "preset", "profile table"
};
std::variant<EnvChoice, Usage, Error> build_environment(const DiversityArgs& a) {
    const bool any_gauss = a.v_mean || a.v_spread || a.h_mean || a.h_spread;
    std::string model = a.environment;
    if (model.empty()) model = !a.profile.empty() ? "profile" : any_gauss ? "gaussian" : "uniform";
    EnvChoice c;
    c.xpr_from = "default";
    if (model == "profile" || !a.profile.empty()) {
        if (model != "profile")
            return Usage{"--profile gives a user environment; it cannot be combined with --environment " + model};
        if (a.profile.empty()) return Usage{"--environment profile needs --profile FILE (elevation_deg,p_v,p_h)"};
        if (any_gauss) return Usage{"--v-mean/--v-spread/--h-mean/--h-spread belong to Gaussian environments, not to a profile"};
        auto t = read_elevation_profile(a.profile);
        if (!t) return t.error();
        c.env.model = EnvironmentModel::profile;
        c.env.name = "user profile";
        c.env.source = "user table " + a.profile;
        c.env.profile = *t;
        c.env.profile_measure =
            a.profile_measure == "elevation" ? ProfileMeasure::per_elevation : ProfileMeasure::per_solid_angle;
        c.env.xpr_db = profile_xpr_db(c.env);
        c.xpr_from = "profile table";
    } else if (model == "gaussian") {
        const char* missing = !a.v_mean     ? "--v-mean"
                              : !a.v_spread ? "--v-spread"
                              : !a.h_mean   ? "--h-mean"
                              : !a.h_spread ? "--h-spread"
                                            : nullptr;
        if (missing)
            return Usage{std::string("--environment gaussian needs --v-mean, --v-spread, --h-mean and --h-spread (deg); ") +
                         missing + " is missing (or start from a preset: indoor, urban, rural)"};
        c.env.model = EnvironmentModel::gaussian;
        c.env.name = "custom";
        c.env.source = "user parameters";
    } else {
        auto p = environment_preset(model);
        if (!p) return Usage{"--environment: " + p.error().message + ", gaussian, profile"};
        c.env = *p;
        c.xpr_from = "preset";
        if (c.env.model == EnvironmentModel::uniform && any_gauss)
            return Usage{"--v-mean/--v-spread/--h-mean/--h-spread need a Gaussian environment (gaussian, indoor, urban, rural)"};
        if (any_gauss) {
            c.env.name += " (modified)";
            c.env.source += "; changed by the user's options";
        }
    }
    if (c.env.model == EnvironmentModel::gaussian) {
        if (a.v_mean) c.env.v_mean_deg = *a.v_mean;
        if (a.v_spread) c.env.v_spread_deg = *a.v_spread;
        if (a.h_mean) c.env.h_mean_deg = *a.h_mean;
        if (a.h_spread) c.env.h_spread_deg = *a.h_spread;
    }
    if (!a.xpr.empty()) {
        double db;
        if (!parse_xpr(a.xpr, db)) return Usage{"--xpr: expected a number of dB, inf or -inf, found \"" + a.xpr + "\""};
        c.env.xpr_db = db;
        c.xpr_from = "option";
    }
    Status ok = validate(c.env);
    if (!ok) return Usage{"environment: " + ok.error().message};
    return c;
}

std::optional<double> db(const std::optional<double>& v) {
    if (!v) return std::nullopt;
    return to_db(*v);
}

struct FreqResult {
    double frequency_hz = 0;
    Result<MegFigures> meg = Error{};
    std::optional<Result<OrientationFigures>> orient;
};
struct PatternResult {
    std::string path;
    FarFieldSet set;
    std::vector<std::size_t> which;
    std::vector<FreqResult> results;
};
struct PairResult {
    double frequency_hz = 0, frequency2_hz = 0;
    Result<CorrelationFigures> corr = Error{};
    std::optional<double> meg_ratio_db;
    std::string note;
};

void json_environment(JsonWriter& j, const EnvChoice& c) {
    const Environment& e = c.env;
    j.key("environment").begin_object();
    j.field("model", to_string(e.model)).field("name", e.name).field("source", e.source);
    j.field("description", describe(e));
    j.key("xpr_db");
    if (std::isinf(e.xpr_db))
        j.value(e.xpr_db > 0 ? "inf" : "-inf");
    else
        j.value(e.xpr_db);
    j.field("xpr_from", c.xpr_from);
    j.field("weight_vertical", e.weight_vertical()).field("weight_horizontal", e.weight_horizontal());
    if (e.model == EnvironmentModel::gaussian) {
        j.field("v_mean_deg", e.v_mean_deg).field("v_spread_deg", e.v_spread_deg);
        j.field("h_mean_deg", e.h_mean_deg).field("h_spread_deg", e.h_spread_deg);
    }
    if (e.model == EnvironmentModel::profile) {
        j.field("profile_measure", to_string(e.profile_measure));
        j.key("profile").begin_array();
        for (const ProfilePoint& p : e.profile) {
            j.begin_array().value(p.elevation_deg).value(p.p_v).value(p.p_h).end_array();
        }
        j.end_array();
    }
    j.end_object();
}

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

void write_json(const EnvChoice& env, const std::vector<PatternResult>& ps, const std::vector<PairResult>& pairs,
                const DiversityArgs& a) {
    JsonWriter j;
    auto write_figures = [&](JsonWriter& j, const FreqResult& r) {
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
        if (r.orient) json_orientations(j, *r.orient, a.sweep);
    };
    j.begin_object();
    json_environment(j, env);
    j.key("patterns").begin_array();
    for (const PatternResult& p : ps) {
        j.begin_object();
        j.field("file", p.path).field("name", p.set.name);
        j.field("quantity", to_string(p.set.quantity)).field("content", to_string(p.set.content));
        // The first (or only) frequency's figures sit on the pattern itself, so a script reading a
        // single-frequency file finds patterns[i].meg_db; every frequency is in "results".
        if (!p.results.empty()) {
            j.field("frequency_hz", p.results.front().frequency_hz);
            write_figures(j, p.results.front());
        }
        j.key("results").begin_array();
        for (const FreqResult& r : p.results) {
            j.begin_object();
            j.field("frequency_hz", r.frequency_hz);
            write_figures(j, r);
            j.end_object();
        }
        j.end_array();
        j.end_object();
    }
    j.end_array();
    if (!pairs.empty()) {
        // Scalars for the first (or only) frequency; one value per frequency of FILE after them.
        const PairResult& q0 = pairs.front();
        j.field("ecc", q0.corr ? std::optional<double>(q0.corr->ecc) : std::nullopt);
        j.field("diversity_gain_db", q0.corr ? std::optional<double>(q0.corr->diversity_gain_db) : std::nullopt);
        j.key("ecc_per_frequency").begin_array();
        for (const PairResult& q : pairs) j.value(q.corr ? std::optional<double>(q.corr->ecc) : std::nullopt);
        j.end_array();
        j.key("diversity_gain_db_per_frequency").begin_array();
        for (const PairResult& q : pairs)
            j.value(q.corr ? std::optional<double>(q.corr->diversity_gain_db) : std::nullopt);
        j.end_array();
        j.key("correlation").begin_array();
        for (const PairResult& q : pairs) {
            j.begin_object();
            j.field("frequency_hz", q.frequency_hz).field("frequency2_hz", q.frequency2_hz);
            if (q.corr) {
                j.field("ecc", q.corr->ecc).field("diversity_gain_db", q.corr->diversity_gain_db);
                j.field("resampled", q.corr->resampled).field("sampled_share", q.corr->sampled_share);
            } else {
                j.key("ecc").null();
                j.key("diversity_gain_db").null();
                j.field("unavailable_reason", q.corr.error().message);
            }
            j.field("meg_ratio_db", q.meg_ratio_db);
            if (!q.note.empty()) j.field("note", q.note);
            j.end_object();
        }
        j.end_array();
        j.field("diversity_gain_method", diversity_gain_method);
    }
    j.end_object();
    std::cout << j.str() << "\n";
}

std::string pct(const std::optional<double>& v) { return v ? fmt(100 * *v, "%", 1) : std::string("unavailable"); }

void write_human(const EnvChoice& env, const std::vector<PatternResult>& ps, const std::vector<PairResult>& pairs,
                 const DiversityArgs& a) {
    const Environment& e = env.env;
    std::cout << "environment  " << describe(e) << "\n";
    if (!e.source.empty()) std::cout << "  source     " << e.source << "\n";
    if (env.xpr_from == "profile table") std::cout << "  XPR        from the table's p_v / p_h totals (override with --xpr)\n";
    for (const PatternResult& p : ps) {
        std::cout << "\n" << p.path << ": " << (p.set.name.empty() ? "(no name)" : p.set.name) << " ("
                  << to_string(p.set.quantity) << ", " << to_string(p.set.content) << ")\n";
        for (const FreqResult& r : p.results) {
            std::cout << "  " << format_frequency(r.frequency_hz) << "\n";
            if (!r.meg) {
                std::cout << "    MEG                 unavailable: " << r.meg.error().message << "\n";
                continue;
            }
            const MegFigures& m = *r.meg;
            std::cout << "    MEG                 " << fmt(to_db(m.meg), "dBi") << "  (" << fmt(m.meg, "", 4)
                      << " linear)\n";
            if (!m.assumption.empty()) std::cout << "                        " << m.assumption << "\n";
            std::cout << "      vertical part     " << fmt(db(m.meg_vertical), "dBi") << "  (" << pct(m.vertical_share)
                      << " of MEG)\n";
            std::cout << "      horizontal part   " << fmt(db(m.meg_horizontal), "dBi") << "  ("
                      << pct(m.horizontal_share) << " of MEG)\n";
            std::cout << "    V and H within 3 dB " << pct(m.balanced_share) << " of the incoming power\n";
            for (const std::string& n : m.notes) std::cout << "    note: " << n << "\n";
            if (!r.orient) continue;
            const Result<OrientationFigures>& o = *r.orient;
            if (!o) {
                std::cout << "    orientations        unavailable: " << o.error().message << "\n";
                continue;
            }
            char buf[256];
            std::snprintf(buf, sizeof buf, "%zu (tilt 0..%g deg step %g, roll step %g deg)", o->samples.size(),
                          a.sweep.tilt_max_deg, a.sweep.tilt_step_deg, a.sweep.roll_step_deg);
            std::cout << "    orientations        " << buf << "\n";
            std::cout << "      min / median / max  " << fmt(to_db(o->min), "") << " / " << fmt(to_db(o->median), "")
                      << " / " << fmt(to_db(o->max), "dBi") << "  (spread " << fmt(to_db(o->max) - to_db(o->min), "dB")
                      << ")\n";
            if (to_db(o->max) - to_db(o->min) < 0.005) {
                std::cout << "      worst / best        every orientation within 0.01 dB\n";
            } else {
                std::snprintf(buf, sizeof buf, "tilt %g deg, roll %g deg", o->worst.tilt_deg, o->worst.roll_deg);
                std::cout << "      worst               " << fmt(to_db(o->worst.meg), "dBi") << " at " << buf << "\n";
                std::snprintf(buf, sizeof buf, "tilt %g deg, roll %g deg", o->best.tilt_deg, o->best.roll_deg);
                std::cout << "      best                " << fmt(to_db(o->best.meg), "dBi") << " at " << buf << "\n";
            }
            std::cout << "      random orientation  " << fmt(to_db(o->random_mean), "dBi") << " mean, 90 % reach "
                      << fmt(to_db(o->random_p10), "dBi") << "\n";
            std::cout << "      careless mounting   costs up to " << fmt(to_db(o->samples.front().meg) - to_db(o->min), "dB")
                      << " against the orientation as given\n";
            std::cout << "      by tilt (deg: min / mean / max dBi)\n";
            for (const TiltRow& t : o->by_tilt) {
                std::snprintf(buf, sizeof buf, "        %5.1f: %7.2f / %7.2f / %7.2f\n", t.tilt_deg, to_db(t.min),
                              to_db(t.mean), to_db(t.max));
                std::cout << buf;
            }
        }
    }
    if (!pairs.empty()) {
        std::cout << "\ncorrelation  " << ps[0].path << " with " << ps[1].path << "\n";
        for (const PairResult& q : pairs) {
            std::cout << "  " << format_frequency(q.frequency_hz) << "\n";
            if (!q.corr) {
                std::cout << "    ECC                 unavailable: " << q.corr.error().message << "\n";
                continue;
            }
            std::cout << "    ECC                 " << fmt(q.corr->ecc, "", 4) << "\n";
            std::cout << "    diversity gain      " << fmt(q.corr->diversity_gain_db, "dB") << "\n";
            std::cout << "    MEG ratio           " << fmt(q.meg_ratio_db, "dB") << " (first / second)\n";
            if (q.corr->resampled) std::cout << "    note: the second pattern was interpolated onto the first one's grid\n";
            if (!q.note.empty()) std::cout << "    note: " << q.note << "\n";
        }
        std::cout << "  diversity gain: " << diversity_gain_method << "\n";
    }
}

int run(const DiversityArgs& a) {
    auto built = build_environment(a);
    if (auto* u = std::get_if<Usage>(&built)) {
        std::cerr << "ellipsa diversity: " << u->message << "\n";
        return exit_usage;
    }
    if (auto* er = std::get_if<Error>(&built)) {
        std::cerr << "ellipsa diversity: " << er->format() << "\n";
        return exit_bad_input;
    }
    const EnvChoice& env = std::get<EnvChoice>(built);
    if (a.orientations) {
        Status sv = validate(a.sweep);
        if (!sv) {
            std::cerr << "ellipsa diversity: " << sv.error().message << "\n";
            return exit_usage;
        }
    }

    std::vector<PatternResult> ps;
    for (const std::string& path : {a.file, a.file2}) {
        if (path.empty()) continue;
        auto s = load_pattern(path, a.load);
        if (!s) {
            std::cerr << "ellipsa diversity: " << s.error().format() << "\n";
            return exit_bad_input;
        }
        PatternResult p;
        p.path = path;
        p.set = std::move(*s);
        if (a.frequency_hz) {
            auto k = pick_frequency(p.set, a.frequency_hz, path);
            if (!k) {
                std::cerr << "ellipsa diversity: " << k.error().format() << "\n";
                return exit_bad_input;
            }
            p.which.push_back(*k);
        } else {
            for (std::size_t k = 0; k < p.set.frequencies.size(); ++k) p.which.push_back(k);
        }
        ps.push_back(std::move(p));
    }

    bool all_meg = true;
    for (PatternResult& p : ps)
        for (std::size_t k : p.which) {
            FreqResult r;
            r.frequency_hz = p.set.frequencies[k].frequency_hz;
            r.meg = mean_effective_gain(p.set, k, env.env);
            if (!r.meg) all_meg = false;
            if (a.orientations) r.orient = orientation_robustness(p.set, k, env.env, a.sweep);
            p.results.push_back(std::move(r));
        }

    std::vector<PairResult> pairs;
    if (ps.size() == 2) {
        const PatternResult& p1 = ps[0];
        const PatternResult& p2 = ps[1];
        for (std::size_t n = 0; n < p1.which.size(); ++n) {
            const std::size_t k1 = p1.which[n];
            PairResult q;
            q.frequency_hz = p1.set.frequencies[k1].frequency_hz;
            // The partner frequency: the only one, or the nearest within 0.5 %.
            std::optional<std::size_t> k2;
            if (p2.which.size() == 1) {
                k2 = p2.which[0];
                const double f2 = p2.set.frequencies[*k2].frequency_hz;
                if (q.frequency_hz > 0 && f2 > 0 && std::abs(f2 - q.frequency_hz) > 0.005 * q.frequency_hz)
                    q.note = "the two files hold different frequencies (" + format_frequency(q.frequency_hz) + " and " +
                             format_frequency(f2) + "); correlated as given";
            } else {
                std::size_t best = p2.which[0];
                for (std::size_t k : p2.which)
                    if (std::abs(p2.set.frequencies[k].frequency_hz - q.frequency_hz) <
                        std::abs(p2.set.frequencies[best].frequency_hz - q.frequency_hz))
                        best = k;
                const double f2 = p2.set.frequencies[best].frequency_hz;
                if (std::abs(f2 - q.frequency_hz) <= 0.005 * std::abs(q.frequency_hz) || f2 == q.frequency_hz) k2 = best;
            }
            if (!k2) {
                q.corr = Error{p2.path, 0, 0, "has no data at " + format_frequency(q.frequency_hz)};
                pairs.push_back(std::move(q));
                continue;
            }
            q.frequency2_hz = p2.set.frequencies[*k2].frequency_hz;
            q.corr = envelope_correlation(p1.set, k1, p2.set, *k2, env.env);
            std::size_t r2 = 0;
            for (std::size_t m = 0; m < p2.which.size(); ++m)
                if (p2.which[m] == *k2) r2 = m;
            const auto& m1 = p1.results[n].meg;
            const auto& m2 = p2.results[r2].meg;
            if (m1 && m2 && m1->meg > 0 && m2->meg > 0) q.meg_ratio_db = to_db(m1->meg / m2->meg);
            pairs.push_back(std::move(q));
        }
    }

    if (a.json)
        write_json(env, ps, pairs, a);
    else
        write_human(env, ps, pairs, a);
    if (!all_meg) {
        std::cerr << "ellipsa diversity: MEG is unavailable for at least one pattern (see the reason above)\n";
        return exit_bad_input;
    }
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
    sub->add_option("--environment", a->environment,
                    "uniform (default), gaussian (give all four angles), a preset (indoor, urban, rural; "
                    "angle options override its values) or profile (with --profile)");
    sub->add_option("--xpr", a->xpr, "Vertical-to-horizontal power ratio, dB (inf: vertical only)");
    sub->add_option("--v-mean", a->v_mean, "Gaussian: mean elevation of the vertical part, deg above the horizon");
    sub->add_option("--v-spread", a->v_spread, "Gaussian: spread of the vertical part, deg");
    sub->add_option("--h-mean", a->h_mean, "Gaussian: mean elevation of the horizontal part, deg");
    sub->add_option("--h-spread", a->h_spread, "Gaussian: spread of the horizontal part, deg");
    sub->add_option("--profile", a->profile,
                    "User environment: CSV table elevation_deg,p_v,p_h (interpolated; zero outside its elevations; "
                    "XPR from the column totals unless --xpr is given)");
    sub->add_option("--profile-measure", a->profile_measure,
                    "How the table's values are meant: solid-angle (per steradian, default) or elevation "
                    "(per unit elevation, summed over azimuth)")
        ->check(CLI::IsMember({"solid-angle", "elevation"}));
    sub->add_flag("--orientations", a->orientations, "Also turn the antenna through tilts and rolls: MEG statistics");
    sub->add_option("--tilt-step", a->sweep.tilt_step_deg, "Orientation sweep: tilt step, deg (default 15; implies --orientations)");
    sub->add_option("--tilt-max", a->sweep.tilt_max_deg, "Orientation sweep: largest tilt, deg (default 90; up to 180)");
    sub->add_option("--roll-step", a->sweep.roll_step_deg,
                    "Orientation sweep: roll step, deg (default 15; a multiple of the grid's phi step is exact and fast)");
    sub->add_option("--frequency", a->frequency_hz, "Only this frequency, Hz (nearest within 0.5 %)");
    sub->add_flag("--json", a->json, "Print one JSON object instead of the human summary");
    add_load_options(sub, a->load);
    return {sub, [a, sub]() -> int {
                // Giving a sweep option asks for the sweep.
                if (sub->count("--tilt-step") || sub->count("--tilt-max") || sub->count("--roll-step"))
                    a->orientations = true;
                return run(*a);
            }};
}
const CommandRegistration registration(60, add_diversity);

}  // namespace

}  // namespace ellipsa::cli
