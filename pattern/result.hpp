// Errors are values with a place: file:line:column: what was expected, what was found.
#pragma once
#include <string>
#include <utility>
#include <variant>

namespace ellipsa {

struct Error {
    std::string file;    // empty when the error has no file
    long line = 0;       // 1-based; 0 when not tied to a line
    long column = 0;     // 1-based; 0 when not tied to a column
    std::string message; // what was expected, what was found

    // "file:line:column: message" with the parts that are known.
    std::string format() const {
        std::string s;
        if (!file.empty()) s += file + ":";
        if (line > 0) s += std::to_string(line) + ":";
        if (column > 0) s += std::to_string(column) + ":";
        if (!s.empty()) s += " ";
        return s + message;
    }
};

// Either a value or an Error. Small on purpose: ok(), value(), error().
template <class T>
class Result {
public:
    Result(T v) : v_(std::move(v)) {}
    Result(Error e) : v_(std::move(e)) {}
    bool ok() const { return v_.index() == 0; }
    explicit operator bool() const { return ok(); }
    T& value() { return std::get<0>(v_); }
    const T& value() const { return std::get<0>(v_); }
    T* operator->() { return &value(); }
    const T* operator->() const { return &value(); }
    T& operator*() { return value(); }
    const T& operator*() const { return value(); }
    const Error& error() const { return std::get<1>(v_); }

private:
    std::variant<T, Error> v_;
};

struct Ok {};
using Status = Result<Ok>;

}  // namespace ellipsa
