// Small text helpers every importer shares: trimming, ASCII lower case, input quoted in messages,
// numbers in messages, and the lines of a small side file (map file, elevation profile).
// Cheap: each is one pass over its argument.
#pragma once
#include <cstddef>
#include <string>
#include <string_view>

namespace ellipsa::text {

// Without leading spaces and tabs, nor trailing spaces, tabs and a CR.
std::string_view trim(std::string_view s);
// ASCII letters in lower case; other bytes as they are (names in files are ASCII).
std::string lower(std::string_view s);
// Trimmed, without surrounding double quotes (and the spaces inside them), in lower case: how
// header names, map entries and metadata keys compare.
std::string normalise_name(std::string_view s);

// Some input as it may be shown in a message: in double quotes, at most 40 bytes (then "..."),
// control bytes (NUL, CR, ...) as \xNN so a terminal shows exactly what the file holds.
std::string quote_found(std::string_view s);
// A number in a message: up to 9 significant digits ("%.9g"), as the files give them.
std::string number(double v);

// The message for a line that holds a CR before its end: the file uses old Mac line ends (CR
// alone), which are not read as line ends (LF and CR LF are).
inline constexpr const char* lone_cr_message =
    "expected lines that end in LF or CR LF, found a CR alone inside a line (old Mac line ends?); "
    "convert the line ends to LF first";
// Offset of a CR that is not the last byte of `line`, or npos.
std::size_t lone_cr(std::string_view line);

// The lines of a small text in memory, for side files. Skips a leading UTF-8 byte-order mark;
// each line comes without its LF (a CR before it is left for trim()).
class Lines {
public:
    explicit Lines(std::string_view text);
    // The next line and its 1-based number; false at the end.
    bool next(std::string_view& line, long& number);

private:
    std::string_view text_;
    std::size_t pos_ = 0;
    long number_ = 0;
};

}  // namespace ellipsa::text
