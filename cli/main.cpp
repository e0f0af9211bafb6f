// ellipsa: far-field polarisation analysis for antennas in cluttered, non-line-of-sight links.
#include <algorithm>
#include <cstdio>
#include <iostream>
#include <sstream>
#include <vector>

#include "cli/cli_docs.hpp"
#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "cli/version.hpp"

using namespace ellipsa::cli;

namespace ellipsa::cli {
std::vector<CommandEntry>& command_registry() {
    static std::vector<CommandEntry> r;
    return r;
}
}  // namespace ellipsa::cli

namespace {
// "ellipsa cut" when the error came from a command's options, else "ellipsa".
std::string help_command(const CLI::App& app) {
    for (const CLI::App* sub : app.get_subcommands([](const CLI::App* s) { return s->parsed(); }))
        return "ellipsa " + sub->get_name();
    return "ellipsa";
}
}  // namespace

int main(int argc, char** argv) {
    CLI::App app{"ellipsa: read far-field patterns, decompose their polarisation, score them for multipath links"};
    app.name("ellipsa");
    app.require_subcommand(0, 1);
    bool show_version = false;
#ifdef ELLIPSA_HAVE_VIEWER
    app.add_flag("--version", show_version, "Print the version and which OpenGL renderer would be used");
#else
    app.add_flag("--version", show_version, "Print the version (this build has no viewer, so no OpenGL renderer)");
#endif
    // Hidden (empty group): the build writes the manual pages and completions with it (cli/cli_docs.hpp).
    std::string docs_dir;
    app.add_option("--write-cli-docs", docs_dir, "Write manual pages and shell completions into DIR")->group("");

    std::vector<CommandEntry> entries = command_registry();
    std::sort(entries.begin(), entries.end(), [](const CommandEntry& a, const CommandEntry& b) { return a.order < b.order; });
    std::vector<Registered> commands;
    for (const CommandEntry& e : entries) commands.push_back(e.add(app));
    refuse_non_finite(app);
    try {
        app.parse(argc, argv);
    } catch (const CLI::CallForHelp& e) {
        return app.exit(e);
    } catch (const CLI::CallForAllHelp& e) {
        return app.exit(e);
    } catch (const CLI::ParseError& e) {
        std::stringstream lines(usage_message(app, e));
        for (std::string line; std::getline(lines, line);) std::cerr << "ellipsa: " << line << "\n";
        std::cerr << "Run '" << help_command(app) << " --help' for usage.\n";
        return exit_usage;
    }
    if (!docs_dir.empty()) return write_cli_documents(app, docs_dir);
    if (show_version) {
        std::cout << version_text();
        return exit_ok;
    }
    for (auto& [sub, run] : commands)
        if (sub->parsed()) {
            try {
                return run();
            } catch (const std::bad_alloc&) {
                std::cerr << "ellipsa: out of memory\n";
                return exit_bad_input;
            }
        }
    std::cout << app.help();
    return exit_usage;
}
