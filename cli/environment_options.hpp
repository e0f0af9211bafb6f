// The command-line options that choose a multipath environment (--environment, --xpr, the four
// Gaussian angles, --profile, --profile-measure), shared by every command that scores antennas in
// one. They only collect the user's words; pattern/environment.hpp choose_environment() decides.
#pragma once
#include <optional>
#include <string>
#include <variant>

#include <CLI/CLI.hpp>

#include "cli/json.hpp"
#include "pattern/environment.hpp"
#include "pattern/result.hpp"

namespace ellipsa::cli {

struct EnvironmentOptions {
    std::string environment;  // preset, gaussian or profile; empty: from the other options
    std::string xpr;          // dB, or inf / -inf
    std::optional<double> v_mean, v_spread, h_mean, h_spread;
    std::string profile;  // table file
    std::string profile_measure = "solid-angle";
};
// Adds the options to a subcommand.
void add_environment_options(CLI::App* sub, EnvironmentOptions& o);

// A wrong combination or value: the caller exits with the usage code.
struct UsageError {
    std::string message;
};
// The environment the options stand for. Errors: UsageError for the options themselves, Error
// (file:line:column) for a profile table that cannot be read.
std::variant<ChosenEnvironment, UsageError, Error> chosen_environment(const EnvironmentOptions& o);

// The environment as the "environment" object of a command's JSON (model, name, source, XPR and
// where it came from, the weights, the model's parameters).
void write_environment_json(JsonWriter& j, const ChosenEnvironment& c);

// "inf", "-inf" or a finite number of dB; false when the text is none of these.
bool parse_xpr_db(const std::string& text, double& db);

}  // namespace ellipsa::cli
