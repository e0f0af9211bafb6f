// Numbers in the CSV files the exports write: 17 significant digits (they read back as the same
// doubles), "inf"/"-inf" for infinities, an empty field for NaN (no value there).
#pragma once
#include <string>

namespace ellipsa::exports {

void append_csv_number(std::string& out, double v);
// A text field: as it is, or in double quotes (inner quotes doubled) when it holds a comma, a
// quote or a line break (RFC 4180).
void append_csv_text(std::string& out, const std::string& s);

}  // namespace ellipsa::exports
