// Human-readable number formatting shared by the commands.
#pragma once
#include <optional>
#include <string>

namespace ellipsa::cli {

// "5.16 dBi", or `missing` when the value is unavailable; "none (zero field)" for a zero power
// (-inf dB, exports::level_text), "n/a" for NaN.
std::string fmt(const std::optional<double>& v, const char* unit, int decimals = 2,
                const char* missing = "unavailable");
std::string fmt(double v, const char* unit, int decimals = 2);

}  // namespace ellipsa::cli
