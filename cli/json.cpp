#include "cli/json.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>

namespace ellipsa::cli {

std::string format_number(double v) {
    char buf[32];
    auto r = std::to_chars(buf, buf + sizeof buf, v);
    return std::string(buf, r.ptr);
}

void JsonWriter::separate() {
    if (after_key_) {
        after_key_ = false;
        return;
    }
    if (!first_.empty()) {
        if (!first_.back()) out_ += ", ";
        first_.back() = false;
    }
}

JsonWriter& JsonWriter::begin_object() {
    separate();
    out_ += '{';
    first_.push_back(true);
    return *this;
}
JsonWriter& JsonWriter::end_object() {
    out_ += '}';
    first_.pop_back();
    return *this;
}
JsonWriter& JsonWriter::begin_array() {
    separate();
    out_ += '[';
    first_.push_back(true);
    return *this;
}
JsonWriter& JsonWriter::end_array() {
    out_ += ']';
    first_.pop_back();
    return *this;
}
JsonWriter& JsonWriter::key(std::string_view k) {
    separate();
    write_string(k);
    out_ += ": ";
    after_key_ = true;
    return *this;
}
JsonWriter& JsonWriter::value(double v) {
    separate();
    if (!std::isfinite(v))
        out_ += "null";
    else
        out_ += format_number(v == 0 ? 0.0 : v);  // no "-0"
    return *this;
}
JsonWriter& JsonWriter::value(const std::optional<double>& v) {
    if (v) return value(*v);
    return null();
}
JsonWriter& JsonWriter::value(std::string_view s) {
    separate();
    write_string(s);
    return *this;
}
void JsonWriter::write_string(std::string_view s) {
    out_ += '"';
    for (char c : s) {
        unsigned char u = static_cast<unsigned char>(c);
        if (c == '"' || c == '\\') {
            out_ += '\\';
            out_ += c;
        } else if (u < 0x20) {
            char buf[8];
            std::snprintf(buf, sizeof buf, "\\u%04x", u);
            out_ += buf;
        } else
            out_ += c;
    }
    out_ += '"';
}
JsonWriter& JsonWriter::value(bool b) {
    separate();
    out_ += b ? "true" : "false";
    return *this;
}
JsonWriter& JsonWriter::null() {
    separate();
    out_ += "null";
    return *this;
}

}  // namespace ellipsa::cli
