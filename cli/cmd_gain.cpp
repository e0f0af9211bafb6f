// ellipsa gain-transfer: relative range levels to absolute gain by the gain-comparison method
// (IEEE Std 149-1979, sec. 12; pattern/gain_transfer.hpp), with a reference antenna of known gain
// measured in the same set-up: its pattern file, or its measured level.
#include <cmath>
#include <cstdio>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/load.hpp"
#include "importers/far_field_csv.hpp"
#include "importers/frequency_text.hpp"
#include "pattern/gain_transfer.hpp"

namespace ellipsa::cli {

namespace {

struct GainArgs {
    std::string file, out, reference, gain;
    std::optional<double> level_db;
    bool force = false;
    LoadOptions load;
};

// --reference-gain: "G" for every frequency, or "F=G,F=G" per frequency.
Result<std::vector<std::pair<std::optional<double>, double>>> parse_gains(const std::string& text) {
    std::vector<std::pair<std::optional<double>, double>> out;
    std::size_t pos = 0;
    while (pos <= text.size()) {
        const std::size_t comma = std::min(text.find(',', pos), text.size());
        const std::string item = text.substr(pos, comma - pos);
        const std::size_t eq = item.find('=');
        std::optional<double> f;
        if (eq != std::string::npos) {
            auto hz = parse_frequency_text(item.substr(0, eq));
            if (!hz) return Error{"--reference-gain", 0, 0, "before '=': " + hz.error().message};
            f = *hz;
        }
        const std::string g = eq == std::string::npos ? item : item.substr(eq + 1);
        char* end = nullptr;
        const double v = std::strtod(g.c_str(), &end);
        if (end == g.c_str() || *end != 0 || !(v >= -100 && v <= 100))
            return Error{"--reference-gain", 0, 0, "expected a gain in dBi from -100 to 100, found \"" + g + "\""};
        out.emplace_back(f, v);
        pos = comma + 1;
    }
    // One value for every frequency stands alone; several must each name their frequency.
    if (out.size() > 1)
        for (const auto& [fh, v] : out)
            if (!fh)
                return Error{"--reference-gain", 0, 0,
                             "expected one gain for every frequency or FREQ=GAIN items, found a gain without a frequency among " +
                                 std::to_string(out.size()) + " items in \"" + text + "\""};
    return out;
}

// The gain given for one frequency of the antenna under test (matched within 0.5 %); two items
// that both match are refused rather than one silently winning.
Result<double> gain_for(const std::vector<std::pair<std::optional<double>, double>>& gains, double f_hz) {
    std::optional<double> found;
    for (const auto& [fh, v] : gains) {
        if (fh && std::abs(*fh - f_hz) > 0.005 * f_hz) continue;
        if (found)
            return Error{"--reference-gain", 0, 0, "expected one gain for " + format_frequency(f_hz) + ", found two items that match it"};
        found = v;
    }
    if (!found) return Error{"--reference-gain", 0, 0, "expected a gain for " + format_frequency(f_hz) + ", found none"};
    return *found;
}

// One GainReference per frequency of the antenna under test.
Result<std::vector<GainReference>> references(const GainArgs& a, const FarFieldSet& aut, std::string& name) {
    auto gains = parse_gains(a.gain);
    if (!gains) return gains.error();
    std::optional<FarFieldSet> ref;
    if (!a.reference.empty()) {
        auto r = load_pattern(a.reference, a.load);
        if (!r) return r.error();
        ref = std::move(*r);
        name = "the reference " + file_path(a.reference);
    } else {
        char b[64];
        std::snprintf(b, sizeof b, "a reference measured at %g dB", *a.level_db);
        name = b;
    }
    std::vector<GainReference> out;
    for (const FarField& f : aut.frequencies) {
        GainReference g{f.frequency_hz, 0, a.level_db.value_or(0)};
        auto gain = gain_for(*gains, f.frequency_hz);
        if (!gain) return gain.error();
        g.gain_dbi = *gain;
        if (ref) {
            auto k = find_frequency(*ref, f.frequency_hz, file_path(a.reference));
            if (!k) return k.error();
            if (ref->quantity != Quantity::relative)
                return Error{file_path(a.reference), 0, 0, "expected the reference's relative levels (quantity relative), found " + std::string(to_string(ref->quantity))};
            g.measured_db = reference_level_db(*ref, *k);
        }
        out.push_back(g);
    }
    return out;
}

int run(const GainArgs& a) {
    auto fail = [](int code, const std::string& m) {
        std::cerr << "ellipsa gain-transfer: " << m << "\n";
        return code;
    };
    if (a.reference.empty() == !a.level_db)
        return fail(exit_usage, "give the reference as --reference FILE or as --reference-level DB, one of them");
    auto aut = load_pattern(a.file, a.load);
    if (!aut) return fail(exit_bad_input, aut.error().format());
    std::string name;
    auto refs = references(a, *aut, name);
    if (!refs) return fail(refs.error().file.rfind("--", 0) == 0 ? exit_usage : exit_bad_input, refs.error().format());
    auto g = transfer_gain(std::move(*aut), *refs, name);
    if (!g) return fail(exit_bad_input, g.error().format());
    CsvWriteOptions w;
    w.family = natural_family(*g);
    w.overwrite = a.force;
    if (Status st = write_far_field_csv(*g, a.out, w); !st) return fail(exit_bad_input, st.error().format());
    std::printf("wrote %s: gain by comparison with %s (IEEE Std 149 sec. 12)\n", a.out.c_str(), name.c_str() + (name.rfind("the ", 0) == 0 ? 4 : 0));
    std::printf("  %-12s %12s %14s %12s\n", "frequency", "G_ref dBi", "P_ref dB", "added dB");
    for (const GainReference& r : *refs)
        std::printf("  %-12s %12.2f %14.2f %12.2f\n", format_frequency(r.frequency_hz).c_str(), r.gain_dbi, r.measured_db,
                    r.gain_dbi - r.measured_db);
    return exit_ok;
}

Registered add_gain(CLI::App& root) {
    auto a = std::make_shared<GainArgs>();
    CLI::App* sub = root.add_subcommand(
        "gain-transfer", "Relative range levels to gain (dBi) by comparison with a reference antenna of known gain (IEEE Std 149)");
    sub->add_option("FILE", a->file, "The antenna under test: relative levels (quantity relative)")->required();
    sub->add_option("--reference", a->reference, "The reference antenna measured in the same set-up (relative levels); its peak is its measured level");
    sub->add_option("--reference-level", a->level_db, "Or the reference's measured level, dB in the file's relative units")
        ->check(number_from_to(-400, 400));
    sub->add_option("--reference-gain", a->gain, "The reference's known gain, dBi: one value, or per frequency \"5.7GHz=7.4,5.8GHz=7.5\"")
        ->required()
        ->check([](const std::string& s) {  // checked while parsing, as references() reads it
            auto g = parse_gains(s);
            return g ? std::string() : g.error().message;
        });
    sub->add_option("--out", a->out, "Output far-field CSV (quantity gain)")->required();
    sub->add_flag("--force", a->force, "Replace --out if it exists");
    add_load_options(sub, a->load);
    return {sub, [a]() -> int { return run(*a); }};
}
const CommandRegistration registration(45, add_gain);

}  // namespace

}  // namespace ellipsa::cli
