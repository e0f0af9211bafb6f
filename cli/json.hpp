// A small streaming JSON writer for the CLI's --json output. Non-finite numbers and empty
// optionals are written as null: unavailable values are never invented.
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace ellipsa::cli {

class JsonWriter {
public:
    JsonWriter& begin_object();
    JsonWriter& end_object();
    JsonWriter& begin_array();
    JsonWriter& end_array();
    JsonWriter& key(std::string_view k);
    JsonWriter& value(double v);
    JsonWriter& value(int v) { return value(double(v)); }
    JsonWriter& value(std::size_t v) { return value(double(v)); }
    JsonWriter& value(const std::optional<double>& v);
    JsonWriter& value(std::string_view s);
    JsonWriter& value(const char* s) { return value(std::string_view(s)); }
    JsonWriter& value(bool b);
    JsonWriter& null();
    // Shorthand: key + value.
    template <class T>
    JsonWriter& field(std::string_view k, const T& v) {
        key(k);
        return value(v);
    }
    const std::string& str() const { return out_; }

private:
    void separate();
    void write_string(std::string_view s);
    std::string out_;
    std::vector<bool> first_;  // per open container: nothing written yet
    bool after_key_ = false;
};

// Shortest round-trip formatting of a double ("1.5", "2.15", "1e-12").
std::string format_number(double v);

}  // namespace ellipsa::cli
