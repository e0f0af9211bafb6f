// The one --frequency option of every command: it takes what the CSV's frequency line takes
// (importers/frequency_text.hpp: "2.45e9", "2.45GHz", "2.45 GHz", "2450 MHz") and hands the
// command a plain number of Hz; a bad value is a usage error (exit 2) that explains the unit.
#pragma once
#include <optional>
#include <string>

#include <CLI/CLI.hpp>

namespace ellipsa::cli {

// The largest frequency an option takes (1000 THz: far beyond any antenna), so a typo as 2.45e19
// is refused while parsing instead of matching nothing.
inline constexpr double max_option_frequency_hz = 1e15;

// A CLI11 transform: frequency text -> the number of Hz (shortest round-trip text).
CLI::Validator frequency_text_validator();

// --frequency FREQ with the transform above.
CLI::Option* add_frequency_option(CLI::App* sub, std::optional<double>& hz, const std::string& help);
CLI::Option* add_frequency_option(CLI::App* sub, double& hz, const std::string& help);

}  // namespace ellipsa::cli
