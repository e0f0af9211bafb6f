// Usage errors as people can act on them (exit 2, cli/commands.hpp): a mistyped command or option
// gets the closest names ("did you mean 'info'?"), stray arguments are listed in the order given,
// and number checks say "from 0 to 180" with the numbers as people write them.
#pragma once
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

namespace ellipsa::cli {

// The candidates closest to `word` by edit distance (optimal string alignment: insertions,
// deletions, substitutions and swaps of neighbours), when close: at most 2 edits and fewer than
// half of the word's letters; the nearest ones only, in the candidates' order.
std::vector<std::string> closest_names(const std::string& word, const std::vector<std::string>& candidates);

// The message for a parse error of `root` (the app that threw, after its parse): what was not
// expected, with suggestions; other errors as CLI11 words them.
std::string usage_message(const CLI::App& root, const CLI::ParseError& e);

// Number checks with messages in plain numbers ("expected a number from 0 to 180, found 200");
// NaN and infinities are refused by all of them.
CLI::Validator number_from_to(double lo, double hi);
// lo < v <= hi ("a number above 0 and up to 1000").
CLI::Validator number_above_to(double lo, double hi);
// lo < v < hi ("a number between 0 and 1, both excluded"), as outage probabilities.
CLI::Validator number_between(double lo, double hi);
CLI::Validator positive_number();
// What `check` says of the number `x` written shortest ("" when it passes), for the Python module's
// path, which takes numbers, not text, and must refuse them with the command line's words.
std::string check_number(const CLI::Validator& check, double x);
CLI::Validator finite_number();
// --size: "WIDTHxHEIGHT" in whole pixels within the limits (exports::parse_pixel_size, the one
// reader of sizes), checked while parsing.
CLI::Validator pixel_size(int min_width, int min_height, int max_side);

// One number of a pair as its message names it ("THETA") and the range it must lie in.
struct PairPart {
    std::string name;
    double lo, hi;
};

// "A,B" (cli/number_list.hpp): two finite numbers, each within its range, and nothing else;
// a wrong text gets "expected THETA,PHI in degrees, THETA from 0 to 180 and PHI from -360 to 360,
// found ...". Sets the option's type name in --help to "A,B". `unit` may be empty.
CLI::Validator number_pair(const PairPart& first, const PairPart& second, const std::string& unit);

// The two numbers of a text number_pair() accepted.
std::pair<double, double> read_number_pair(const std::string& text);

// Adds finite_number() to every option of `app` and its subcommands whose values are plain
// FLOATs without a check of their own, so no command takes "nan", "inf" or "1e400" for a number.
void refuse_non_finite(CLI::App& app);

// One of `names` (exact): the description "{a,b,c}" puts the choices in --help, the manual pages
// and the completions (cli/cli_docs.hpp); a wrong value gets the closest names as suggestions.
CLI::Validator one_of(std::vector<std::string> names);
// What one_of says of `s` (empty when `s` is one of `names`), for callers that check a choice
// outside CLI11 (the Python module) and must say the same.
std::string not_one_of(const std::vector<std::string>& names, const std::string& s);

// The items with `sep` between them.
std::string join(const std::vector<std::string>& items, const std::string& sep);

// The names of an enumeration's values (to_string of each) from its list of all values, the ones
// `keep` accepts when given.
template <class E, std::size_t N>
std::vector<std::string> names_of(const E (&all)[N], bool (*keep)(E) = nullptr) {
    std::vector<std::string> out;
    for (E e : all)
        if (!keep || keep(e)) out.push_back(to_string(e));
    return out;
}

}  // namespace ellipsa::cli
