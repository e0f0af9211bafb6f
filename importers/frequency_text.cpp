#include "importers/frequency_text.hpp"

#include <cmath>
#include <cctype>
#include <string>

#include "importers/csv_number.hpp"
#include "importers/text.hpp"

namespace ellipsa {

std::optional<double> frequency_unit_hz(std::string_view unit) {
    const std::string l = text::lower(text::trim(unit));
    if (l == "hz") return 1.0;
    if (l == "khz") return 1e3;
    if (l == "mhz") return 1e6;
    if (l == "ghz") return 1e9;
    return std::nullopt;
}

namespace {

std::string expected_frequency(std::string_view found) {
    return std::string("expected a number >= 0, optionally with a unit (") + frequency_units_text +
           "), as 2.45e9, 2.45GHz or 2450 MHz; found " + text::quote_found(found);
}

// The unit after the number: a word made of letters only, else an explanation.
Result<double> unit_after(std::string_view whole, std::string_view unit) {
    if (auto hz = frequency_unit_hz(unit)) return *hz;
    std::string msg = "expected the unit " + std::string(frequency_units_text) + " after the number, found " +
                      text::quote_found(unit) + " in " + text::quote_found(whole);
    const std::string l = text::lower(unit);
    if (l == "g" || l == "m" || l == "k") msg += " (did you mean " + std::string(l == "k" ? "k" : l == "m" ? "M" : "G") + "Hz?)";
    return Error{"", 0, 0, msg};
}

}  // namespace

Result<double> parse_frequency_text(std::string_view whole, double unit_hz, bool decimal_comma) {
    std::string_view t = text::trim(whole);
    if (t.size() >= 2 && t.front() == '"' && t.back() == '"') t = text::trim(t.substr(1, t.size() - 2));  // as a CSV cell may quote it
    const char* b = t.data();
    const char* e = t.data() + t.size();
    if (b < e && *b == '+') ++b;
    // A number starts with a digit, a sign or a point: "inf", "nan" and words are refused here.
    if (b == e || !(std::isdigit(static_cast<unsigned char>(*b)) || *b == '-' || *b == '.'))
        return Error{"", 0, 0, expected_frequency(whole)};
    double v = 0;
    auto r = fast_float::from_chars(b, e, v);
    if (decimal_comma && r.ec == std::errc() && r.ptr < e && *r.ptr == ',')
        r = fast_float::from_chars_advanced(b, e, v, fast_float::parse_options{fast_float::chars_format::general, ','});
    if (r.ec != std::errc() && r.ec != std::errc::result_out_of_range) return Error{"", 0, 0, expected_frequency(whole)};
    double hz = unit_hz;
    if (const std::string_view unit = text::trim(std::string_view(r.ptr, std::size_t(e - r.ptr))); !unit.empty()) {
        auto u = unit_after(whole, unit);
        if (!u) return u.error();
        hz = *u;
    }
    if (std::isnan(v) || v < 0) return Error{"", 0, 0, expected_frequency(whole)};
    if (!std::isfinite(v) || !std::isfinite(v * hz))
        return Error{"", 0, 0,
                     "expected a frequency within the range of numbers (about 1.8e308 Hz), found " + text::quote_found(whole) +
                         ", which overflows"};
    return v * hz;
}

}  // namespace ellipsa
