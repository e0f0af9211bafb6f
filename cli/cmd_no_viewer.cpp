// A build without the viewer (ELLIPSA_VIEWER=OFF) has no `view` and no `render`. Both names stay
// known, hidden from --help, the manual pages and the completions, so that calling one says why it
// is missing (exit 2, bad usage) instead of calling its options unknown.
#include <iostream>
#include <string>

#include "cli/commands.hpp"
#include "cli/report_3d.hpp"

namespace ellipsa::cli {
namespace {

Registered add_missing(CLI::App& root, const std::string& name) {
    CLI::App* sub = root.add_subcommand(name, "Not in this build")->group("");
    sub->set_help_flag();      // `render --help` is refused as well, not answered with nothing
    sub->allow_extras();       // any arguments: the refusal is about the command, not its options
    sub->prefix_command();
    return {sub, [name] {
                std::cerr << "ellipsa: '" << name << "' is not available: " << no_viewer_reason
                          << "; the other commands work without it\n";
                return exit_usage;
            }};
}

const CommandRegistration view_registration(50, [](CLI::App& root) { return add_missing(root, "view"); });
const CommandRegistration render_registration(65, [](CLI::App& root) { return add_missing(root, "render"); });

}  // namespace
}  // namespace ellipsa::cli
