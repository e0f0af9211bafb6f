// Numbers in the CSV files the exports write: 17 significant digits (they read back as the same
// doubles), "inf"/"-inf" for infinities, an empty field for NaN (no value there).
#pragma once
#include <string>

namespace ellipsa::exports {

void append_csv_number(std::string& out, double v);

}  // namespace ellipsa::exports
