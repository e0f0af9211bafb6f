// ellipsa convert: read a pattern file (any schema family, or a foreign layout through the
// import options) and write it in the schema, in any family.
#include <iostream>
#include <memory>
#include <sys/stat.h>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/load.hpp"
#include "importers/far_field_csv.hpp"

namespace ellipsa::cli {

namespace {

struct ConvertArgs {
    std::string in, out;
    std::string family;
    std::string ludwig3_reference;
    bool force = false;
    LoadOptions load;
};

// True when both names are the same file (same device and inode), so writing one would
// destroy the other before it is read.
bool same_file(const std::string& a, const std::string& b) {
    struct stat sa {}, sb {};
    if (::stat(a.c_str(), &sa) != 0 || ::stat(b.c_str(), &sb) != 0) return false;
    return sa.st_dev == sb.st_dev && sa.st_ino == sb.st_ino;
}

Registered add_convert(CLI::App& root) {
    auto a = std::make_shared<ConvertArgs>();
    CLI::App* sub = root.add_subcommand("convert", "Rewrite a pattern file in the far-field CSV schema, in any field family");
    sub->add_option("IN", a->in, "Input far-field CSV (schema, or a foreign layout with --map)")->required();
    sub->add_option("OUT", a->out, "Output far-field CSV")->required();
    sub->add_option("--family", a->family,
                    "Field columns to write: complex | theta-phi-db-phase | circular-db-phase | ludwig3-db-phase | "
                    "theta-phi-db | total-db (default: complex, or what the data allow)")
        ->check(one_of({"complex", "theta-phi-db-phase", "circular-db-phase", "ludwig3-db-phase",
                               "theta-phi-db", "total-db"}));
    sub->add_option("--ludwig3-reference", a->ludwig3_reference,
                    "Reference for ludwig3-db-phase: x | y (default: the input's, else x)")
        ->check(one_of({"x", "y"}));
    sub->add_flag("--force", a->force, "Replace OUT if it exists");
    add_load_options(sub, a->load);
    // The fields stay in the file's frame; the mounting that applies (the file's, or --up and
    // --rotate) is written as metadata instead, so nothing is resampled.
    a->load.mounting.turn_fields = false;
    return {sub, [a]() -> int {
                if (same_file(file_path(a->in), a->out) || file_path(a->in) == a->out) {
                    std::cerr << "ellipsa convert: " << a->out
                              << ": expected an output file other than the input, found the input itself\n";
                    return exit_usage;
                }
                auto s = load_pattern(a->in, a->load);
                if (!s) {
                    std::cerr << "ellipsa convert: " << s.error().format() << "\n";
                    return exit_bad_input;
                }
                CsvWriteOptions w;
                w.family = natural_family(*s);
                if (!a->family.empty()) parse_csv_family(a->family, w.family);
                if (a->ludwig3_reference == "x") w.ludwig3_reference = Ludwig3Reference::x;
                if (a->ludwig3_reference == "y") w.ludwig3_reference = Ludwig3Reference::y;
                w.overwrite = a->force;
                Status st = write_far_field_csv(*s, a->out, w);
                if (!st) {
                    std::cerr << "ellipsa convert: " << st.error().format() << "\n";
                    return exit_bad_input;
                }
                return exit_ok;
            }};
}
const CommandRegistration registration(40, add_convert);

}  // namespace

}  // namespace ellipsa::cli
