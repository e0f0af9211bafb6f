// A frequency as people write it, the one parser of frequency text: the CSV's `# frequency:` and
// `# frequency-unit:` lines, and every command-line option that takes a frequency.
#pragma once
#include <optional>
#include <string_view>

#include "pattern/result.hpp"

namespace ellipsa {

// The units, as messages list them.
inline constexpr const char* frequency_units_text = "Hz, kHz, MHz or GHz";

// The factor to Hz of a unit name (Hz, kHz, MHz, GHz; any case, spaces around ignored), or nothing.
std::optional<double> frequency_unit_hz(std::string_view unit);

// A number >= 0, optionally followed by a unit with or without a space between:
// "2.45e9", "2.45GHz", "2.45 GHz", "2450 MHz". A bare number is in units of `unit_hz` (the file's
// frequency-unit; 1 for Hz). `decimal_comma` also accepts "2,45 GHz". The Error has no place
// (the caller adds one) and says what was expected and what was found.
Result<double> parse_frequency_text(std::string_view text, double unit_hz = 1.0, bool decimal_comma = false);

}  // namespace ellipsa
