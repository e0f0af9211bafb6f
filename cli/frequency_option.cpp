#include "cli/frequency_option.hpp"

#include <charconv>

#include "importers/frequency_text.hpp"

namespace ellipsa::cli {

CLI::Validator frequency_text_validator() {
    // An empty description: the documents show the type name FREQ alone.
    return CLI::Validator(
        [](std::string& s) -> std::string {
            auto hz = parse_frequency_text(s);
            if (!hz) return hz.error().message;
            if (!(*hz > 0 && *hz <= max_option_frequency_hz))
                return "expected a frequency above 0 Hz and up to 1e15 Hz (1000 THz), found \"" + s + "\"";
            char buffer[32];
            auto r = std::to_chars(buffer, buffer + sizeof buffer, *hz);
            s.assign(buffer, r.ptr);
            return {};
        },
        "");
}

namespace {
std::string with_units(const std::string& help) { return help + ". FREQ: Hz, or with a unit, as 2.45GHz or 2450 MHz"; }
}  // namespace

CLI::Option* add_frequency_option(CLI::App* sub, std::optional<double>& hz, const std::string& help) {
    return sub->add_option("--frequency", hz, with_units(help))->transform(frequency_text_validator())->type_name("FREQ");
}

CLI::Option* add_frequency_option(CLI::App* sub, double& hz, const std::string& help) {
    return sub->add_option("--frequency", hz, with_units(help))->transform(frequency_text_validator())->type_name("FREQ");
}

}  // namespace ellipsa::cli
