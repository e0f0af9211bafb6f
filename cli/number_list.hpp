// Comma-separated numbers on the command line ("0,-3,-10"): the one parser the commands share.
#pragma once
#include <optional>
#include <string>
#include <vector>

namespace ellipsa::cli {

// Every item a finite number with nothing after it; "none" gives an empty list when allow_none.
// nullopt when an item is not a number (the caller says which option it was).
std::optional<std::vector<double>> parse_number_list(const std::string& text, bool allow_none = false);

}  // namespace ellipsa::cli
