#include "importers/text.hpp"

#include <cstdio>

namespace ellipsa::text {

std::string_view trim(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '\r')) s.remove_suffix(1);
    return s;
}

std::string lower(std::string_view s) {
    std::string o(s);
    for (char& c : o)
        if (c >= 'A' && c <= 'Z') c = char(c - 'A' + 'a');
    return o;
}

std::string normalise_name(std::string_view s) {
    s = trim(s);
    if (s.size() >= 2 && s.front() == '"' && s.back() == '"') s = trim(s.substr(1, s.size() - 2));
    return lower(s);
}

std::string quote_found(std::string_view s) {
    std::string o = "\"";
    std::size_t n = 0;
    for (unsigned char c : s) {
        if (++n > 40) {
            o += "...";
            break;
        }
        if (c < 0x20 || c == 0x7f) {
            char b[8];
            std::snprintf(b, sizeof b, "\\x%02X", c);
            o += b;
        } else {
            o += char(c);
        }
    }
    return o + "\"";
}

std::string number(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%.9g", v);
    return b;
}

std::size_t lone_cr(std::string_view line) {
    const std::size_t r = line.find('\r');
    return r != std::string_view::npos && r + 1 < line.size() ? r : std::string_view::npos;
}

Lines::Lines(std::string_view text) : text_(text) {
    if (text_.substr(0, 3) == "\xEF\xBB\xBF") pos_ = 3;
}

bool Lines::next(std::string_view& line, long& number) {
    if (pos_ >= text_.size()) return false;
    const std::size_t nl = text_.find('\n', pos_);
    const std::size_t end = nl == std::string_view::npos ? text_.size() : nl;
    line = text_.substr(pos_, end - pos_);
    pos_ = nl == std::string_view::npos ? text_.size() : nl + 1;
    number = ++number_;
    return true;
}

}  // namespace ellipsa::text
