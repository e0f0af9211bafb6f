#include "cli/usage.hpp"

#include <charconv>
#include "exports/render.hpp"

#include <algorithm>
#include <cmath>

#include "cli/number_list.hpp"
#include "importers/text.hpp"

namespace ellipsa::cli {

namespace {

std::size_t edit_distance(const std::string& a, const std::string& b) {
    std::vector<std::vector<std::size_t>> d(a.size() + 1, std::vector<std::size_t>(b.size() + 1));
    for (std::size_t i = 0; i <= a.size(); ++i) d[i][0] = i;
    for (std::size_t j = 0; j <= b.size(); ++j) d[0][j] = j;
    for (std::size_t i = 1; i <= a.size(); ++i)
        for (std::size_t j = 1; j <= b.size(); ++j) {
            const std::size_t cost = a[i - 1] == b[j - 1] ? 0 : 1;
            d[i][j] = std::min({d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost});
            if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1]) d[i][j] = std::min(d[i][j], d[i - 2][j - 2] + 1);
        }
    return d[a.size()][b.size()];
}

std::string quoted_list(const std::vector<std::string>& v, const char* last_sep) {
    std::string out;
    for (std::size_t i = 0; i < v.size(); ++i)
        out += (i == 0 ? "" : i + 1 == v.size() ? last_sep : ", ") + ("'" + v[i] + "'");
    return out;
}

std::vector<std::string> command_names(const CLI::App& root) {
    std::vector<std::string> names;
    for (const CLI::App* sub : root.get_subcommands([](const CLI::App* s) { return !s->get_group().empty(); }))
        names.push_back(sub->get_name());
    return names;
}

std::vector<std::string> option_names(const CLI::App& app) {
    std::vector<std::string> names;
    for (const CLI::Option* o : app.get_options()) {
        if (o->get_group().empty()) continue;
        for (const std::string& l : o->get_lnames()) names.push_back("--" + l);
        for (const std::string& s : o->get_snames()) names.push_back("-" + s);
    }
    return names;
}

// "--frequncy=2.4e9" -> "--frequncy".
std::string option_word(const std::string& arg) { return arg.substr(0, arg.find('=')); }

// One line about the arguments `app` did not expect; `command` is its name ("" for the root).
std::string not_expected(const CLI::App& app, const std::string& command, const std::vector<std::string>& extra) {
    std::vector<std::string> options, strays;
    for (const std::string& x : extra) (x.size() > 1 && x[0] == '-' && !std::isdigit(static_cast<unsigned char>(x[1])) ? options : strays).push_back(x);
    const std::string who = command.empty() ? "" : command + ": ";
    std::string msg;
    for (const std::string& o : options) {
        msg += (msg.empty() ? "" : "\n") + who + "unknown option '" + option_word(o) + "'";
        if (auto near = closest_names(option_word(o), option_names(app)); !near.empty()) msg += "; did you mean " + quoted_list(near, " or ") + "?";
    }
    // An unknown option's value arrives as a stray argument: the option is the mistake to show.
    if (strays.empty() || !options.empty()) return msg;
    if (command.empty()) {  // the root takes no arguments: the first is a mistyped command
        msg += "unknown command '" + strays[0] + "'";
        auto near = closest_names(strays[0], command_names(app));
        return msg + (near.empty() ? "" : "; did you mean " + quoted_list(near, " or ") + "?");
    }
    return msg + who + "unexpected argument" + (strays.size() > 1 ? "s" : "") + ", in the order given: " +
           quoted_list(strays, ", ");
}

}  // namespace

std::vector<std::string> closest_names(const std::string& word, const std::vector<std::string>& candidates) {
    std::vector<std::string> best;
    std::size_t best_d = 3;
    for (const std::string& c : candidates) {
        const std::size_t d = edit_distance(word, c);
        if (d == 0 || d > 2 || 2 * d >= word.size()) continue;
        if (d < best_d) best.clear(), best_d = d;
        if (d == best_d) best.push_back(c);
    }
    return best;
}

std::string usage_message(const CLI::App& root, const CLI::ParseError& e) {
    if (dynamic_cast<const CLI::ExtrasError*>(&e) == nullptr) return e.what();
    if (!root.remaining(false).empty()) return not_expected(root, "", root.remaining(false));
    for (const CLI::App* sub : root.get_subcommands([](const CLI::App* s) { return s->parsed() && !s->remaining(false).empty(); }))
        return not_expected(*sub, sub->get_name(), sub->remaining(false));
    return e.what();
}

namespace {

// A number as people write it: 180, 0.05, 1e-06.
std::string plain(double v) { return text::number(v); }

CLI::Validator number_check(std::string description, std::function<bool(double)> ok, std::string expected) {
    return CLI::Validator(
        [ok = std::move(ok), expected = std::move(expected)](std::string& s) -> std::string {
            double v = 0;
            const bool read = CLI::detail::lexical_cast(s, v);
            if (read && std::isfinite(v) && ok(v)) return {};
            return "expected " + expected + ", found " + text::quote_found(s);
        },
        std::move(description));
}

}  // namespace

CLI::Validator number_from_to(double lo, double hi) {
    const std::string range = "from " + plain(lo) + " to " + plain(hi);
    return number_check(range, [lo, hi](double v) { return v >= lo && v <= hi; }, "a number " + range);
}

CLI::Validator number_above_to(double lo, double hi) {
    const std::string range = "above " + plain(lo) + " and up to " + plain(hi);
    return number_check(range, [lo, hi](double v) { return v > lo && v <= hi; }, "a number " + range);
}

CLI::Validator number_between(double lo, double hi) {
    const std::string range = "between " + plain(lo) + " and " + plain(hi) + ", both excluded";
    return number_check(range, [lo, hi](double v) { return v > lo && v < hi; }, "a number " + range);
}

CLI::Validator pixel_size(int min_width, int min_height, int max_side) {
    return CLI::Validator(
        [=](std::string& s) -> std::string {
            auto r = exports::parse_pixel_size(s, {min_width, min_height, max_side});
            return r ? std::string() : r.error().message;
        },
        "");
}

std::string check_number(const CLI::Validator& check, double x) {
    char buf[40];
    std::string text(buf, std::to_chars(buf, buf + sizeof buf, x).ptr);
    return check(text);
}

CLI::Validator positive_number() {
    return number_check("above 0", [](double v) { return v > 0; }, "a number above 0");
}

CLI::Validator finite_number() {
    return number_check("", [](double) { return true; }, "a finite number");
}

CLI::Validator number_pair(const PairPart& first, const PairPart& second, const std::string& unit) {
    const std::string expected = first.name + "," + second.name + (unit.empty() ? "" : " in " + unit) + ", " + first.name + " from " +
                                 plain(first.lo) + " to " + plain(first.hi) + " and " + second.name + " from " + plain(second.lo) +
                                 " to " + plain(second.hi);
    return CLI::Validator(
        [first, second, expected](std::string& s) -> std::string {
            const auto v = parse_number_list(s);
            const auto within = [](const PairPart& p, double x) { return x >= p.lo && x <= p.hi; };
            if (v && v->size() == 2 && within(first, (*v)[0]) && within(second, (*v)[1])) return {};
            return "expected " + expected + ", found " + text::quote_found(s);
        },
        "");
}

std::pair<double, double> read_number_pair(const std::string& text) {
    const auto v = parse_number_list(text);
    if (!v || v->size() != 2) return {0.0, 0.0};  // number_pair() let nothing else through
    return {(*v)[0], (*v)[1]};
}

std::string join(const std::vector<std::string>& items, const std::string& sep) {
    std::string out;
    for (const std::string& s : items) out += (out.empty() ? "" : sep) + s;
    return out;
}

void refuse_non_finite(CLI::App& app) {
    for (CLI::Option* o : app.get_options())
        if (o->get_type_name() == "FLOAT") o->check(finite_number());
    for (CLI::App* sub : app.get_subcommands([](CLI::App*) { return true; })) refuse_non_finite(*sub);
}

std::string not_one_of(const std::vector<std::string>& names, const std::string& s) {
    if (std::find(names.begin(), names.end(), s) != names.end()) return {};
    std::string msg = "expected one of " + quoted_list(names, " or ") + ", found " + text::quote_found(s);
    if (auto near = closest_names(s, names); !near.empty()) msg += "; did you mean " + quoted_list(near, " or ") + "?";
    return msg;
}

CLI::Validator one_of(std::vector<std::string> names) {
    std::string description;
    for (const std::string& n : names) description += (description.empty() ? "{" : ",") + n;
    return CLI::Validator(
        [names](std::string& s) -> std::string { return not_one_of(names, s); },
        description + "}");
}

}  // namespace ellipsa::cli
