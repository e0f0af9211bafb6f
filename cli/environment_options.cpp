#include "cli/environment_options.hpp"

#include <cmath>
#include <cstdlib>

#include "cli/usage.hpp"
#include "importers/elevation_profile_csv.hpp"
#include "importers/text.hpp"

namespace ellipsa::cli {

namespace {
// Why `s` is no XPR (empty when it is one): the one message of the option and of the Python module.
std::string xpr_problem(const std::string& s) {
    double db;
    if (parse_xpr_db(s, db)) return {};
    return "expected a number of dB from " + text::number(-max_finite_xpr_db) + " to " + text::number(max_finite_xpr_db) +
           ", inf or -inf, found " + text::quote_found(s);
}
}  // namespace

void add_environment_options(CLI::App* sub, EnvironmentOptions& o) {
    std::string presets;
    for (const EnvironmentPreset& p : environment_presets()) presets += (presets.empty() ? "" : ", ") + std::string(p.name);
    sub->add_option("--environment", o.environment,
                    "uniform (default), gaussian (give all four angles), a preset (" + presets +
                        "; angle options override its values) or profile (with --profile)");
    sub->add_option("--xpr", o.xpr, "Vertical-to-horizontal power ratio, dB (inf: vertical only)")
        ->check(CLI::Validator([](std::string& s) { return xpr_problem(s); }, ""));
    sub->add_option("--v-mean", o.v_mean, "Gaussian: mean elevation of the vertical part, deg above the horizon")
        ->check(number_from_to(-90, 90));
    sub->add_option("--v-spread", o.v_spread, "Gaussian: spread of the vertical part, deg")->check(number_above_to(0, 1000));
    sub->add_option("--h-mean", o.h_mean, "Gaussian: mean elevation of the horizontal part, deg")->check(number_from_to(-90, 90));
    sub->add_option("--h-spread", o.h_spread, "Gaussian: spread of the horizontal part, deg")->check(number_above_to(0, 1000));
    sub->add_option("--profile", o.profile,
                    "User environment: CSV table elevation_deg,p_v,p_h (interpolated; zero outside its "
                    "elevations; XPR from the column totals unless --xpr is given)")
        ->type_name("FILE");
    sub->add_option("--profile-measure", o.profile_measure,
                    "How the table's values are meant: solid-angle (per steradian, default) or elevation "
                    "(per unit elevation, summed over azimuth)")
        ->check(one_of({"solid-angle", "elevation"}));
}

bool parse_xpr_db(const std::string& s, double& db) {
    if (s == "inf" || s == "+inf" || s == "infinity") return db = INFINITY, true;
    if (s == "-inf" || s == "-infinity") return db = -INFINITY, true;
    char* end = nullptr;
    db = std::strtod(s.c_str(), &end);
    return !s.empty() && end == s.c_str() + s.size() && std::isfinite(db) && std::abs(db) <= max_finite_xpr_db;
}

std::variant<ChosenEnvironment, UsageError, Error> chosen_environment(const EnvironmentOptions& o) {
    EnvironmentChoice c;
    c.model = o.environment;
    c.v_mean_deg = o.v_mean;
    c.v_spread_deg = o.v_spread;
    c.h_mean_deg = o.h_mean;
    c.h_spread_deg = o.h_spread;
    if (!o.xpr.empty()) {
        double db;
        if (!parse_xpr_db(o.xpr, db)) return UsageError{"--xpr: " + xpr_problem(o.xpr)};
        c.xpr_db = db;
    }
    if (c.model == "profile" && o.profile.empty())
        return UsageError{"--environment profile needs --profile FILE (elevation_deg,p_v,p_h)"};
    if (!o.profile.empty()) {
        auto t = read_elevation_profile(o.profile);
        if (!t) return t.error();
        c.profile = std::move(*t);
        c.profile_name = o.profile;
        c.profile_measure = o.profile_measure == "elevation" ? ProfileMeasure::per_elevation : ProfileMeasure::per_solid_angle;
    }
    auto chosen = choose_environment(c);
    if (!chosen) return UsageError{"environment: " + chosen.error().message};
    return std::move(*chosen);
}

void write_environment_json(JsonWriter& j, const ChosenEnvironment& c) {
    const Environment& e = c.environment;
    j.key("environment").begin_object();
    j.field("model", to_string(e.model)).field("name", e.name).field("source", e.source);
    j.field("description", describe(e));
    j.key("xpr_db");
    if (std::isinf(e.xpr_db))
        j.value(e.xpr_db > 0 ? "inf" : "-inf");
    else
        j.value(e.xpr_db);
    j.field("xpr_from", to_string(c.xpr_from));
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

}  // namespace ellipsa::cli
