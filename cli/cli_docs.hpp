// Manual pages and shell completions made from the command line's own definitions (the CLI11
// app every cmd_*.cpp registers into), so they cannot drift from what the executable accepts.
// The build runs the hidden `ellipsa --write-cli-docs DIR` (cli/CMakeLists.txt), which writes
//   DIR/man1/ellipsa.1, DIR/man1/ellipsa-COMMAND.1   one page per command
//   DIR/bash/ellipsa, DIR/zsh/_ellipsa, DIR/fish/ellipsa.fish
// The root command has the name "". Options in the empty group (hidden from --help) are left out of both.
#pragma once
#include <CLI/CLI.hpp>
#include <string>
#include <vector>

namespace ellipsa::cli {

// One option or positional argument as the documents see it.
struct OptionDoc {
    std::vector<std::string> names;    // "-h", "--help"; empty for a positional
    std::string positional;            // "FILE" for a positional
    std::string value;                 // the value's kind ("TEXT", "FLOAT", ...); "" for a flag
    std::vector<std::string> choices;  // the allowed values, when the option checks them
    std::string limits;                // other checks, as CLI11 states them ("INT in [1 - 100]")
    std::string help;
    bool required = false;
    bool many = false;     // takes several values (FILE ...)
    bool files = false;    // its value names a file or folder
};

// One command: the root ("" name) or a subcommand.
struct CommandDoc {
    std::string name, description;
    std::vector<OptionDoc> options, positionals;
};

// The root first, then every visible subcommand in --help order.
std::vector<CommandDoc> describe_commands(const CLI::App& root);

struct DocFile {
    std::string path;  // relative to the output folder
    std::string text;
};
std::vector<DocFile> cli_documents(const std::vector<CommandDoc>& commands, const std::string& version);

// Writes every document under dir (created if missing). Returns an exit code.
int write_cli_documents(const CLI::App& root, const std::string& dir);

}  // namespace ellipsa::cli
