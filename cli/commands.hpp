// The subcommands of the one executable. Each command lives in its own cmd_*.cpp file and
// registers itself with a static CommandRegistration: it adds its CLI11 subcommand to the root
// app and returns the function that runs it. Adding a command never touches main.cpp.
//
// Exit codes (a stable contract scripts depend on): 0 success, 1 bad input (message on stderr,
// file:line:column where there is one), 2 bad usage.
#pragma once
#include <CLI/CLI.hpp>
#include <functional>
#include <utility>
#include <vector>

namespace ellipsa::cli {

using Runner = std::function<int()>;
using Registered = std::pair<CLI::App*, Runner>;
using AddCommand = Registered (*)(CLI::App& root);

struct CommandEntry {
    int order;  // position in --help (lower first)
    AddCommand add;
};
std::vector<CommandEntry>& command_registry();

struct CommandRegistration {
    CommandRegistration(int order, AddCommand add) { command_registry().push_back({order, add}); }
};

inline constexpr int exit_ok = 0;
inline constexpr int exit_bad_input = 1;
inline constexpr int exit_usage = 2;

}  // namespace ellipsa::cli
