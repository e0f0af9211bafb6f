#include "cli/cli_docs.hpp"

#include <filesystem>
#include <iostream>

#include "cli/commands.hpp"
#include "cli/usage.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::cli {

namespace {

// "TEXT:{polar,rect}" -> value TEXT, choices polar, rect; "INT:INT in [1 - 9]" -> limits.
void read_type_name(const std::string& full, OptionDoc& d) {
    std::size_t colon = full.find(':');
    d.value = full.substr(0, colon);
    while (colon != std::string::npos) {
        std::size_t next = full.find(':', colon + 1);
        std::string part = full.substr(colon + 1, next == std::string::npos ? std::string::npos : next - colon - 1);
        if (part.size() >= 2 && part.front() == '{' && part.back() == '}') {
            std::stringstream items(part.substr(1, part.size() - 2));
            for (std::string item; std::getline(items, item, ',');) d.choices.push_back(item);
        } else if (!part.empty()) {
            d.limits += (d.limits.empty() ? "" : "; ") + part;
        }
        colon = next;
    }
}

OptionDoc describe_option(const CLI::Option& o) {
    OptionDoc d;
    for (const std::string& s : o.get_snames()) d.names.push_back("-" + s);
    for (const std::string& l : o.get_lnames()) d.names.push_back("--" + l);
    if (!o.nonpositional()) d.positional = o.get_name();
    if (o.get_type_size_max() > 0) read_type_name(o.get_type_name(), d);
    d.help = o.get_description();
    for (char& c : d.help)
        if (c == '\n') c = ' ';
    d.required = o.get_required();
    d.many = o.get_items_expected_max() > 1;
    // Options that name a file say so with type_name("FILE") or ("FOLDER"); positionals are files
    // unless they have choices.
    d.files = d.choices.empty() && (d.value == "FILE" || d.value == "FOLDER" ||
                                    (!d.positional.empty() && d.value.rfind("TEXT", 0) == 0));
    return d;
}

CommandDoc describe_command(const CLI::App& app) {
    CommandDoc c{app.get_name(), app.get_description(), {}, {}};
    for (const CLI::Option* o : app.get_options()) {
        if (o->get_group().empty()) continue;  // hidden
        OptionDoc d = describe_option(*o);
        (d.positional.empty() ? c.options : c.positionals).push_back(std::move(d));
    }
    return c;
}

// --- manual pages (man(7) macros) ---

// Text for roff: backslashes and minus signs escaped (so options copy as typed), no line may
// start with a control character.
std::string roff(const std::string& s) {
    std::string out;
    for (char c : s) {
        if (c == '\\') out += "\\e";
        else if (c == '-') out += "\\-";
        else out += c;
    }
    if (!out.empty() && (out[0] == '.' || out[0] == '\'')) out.insert(0, "\\&");
    return out;
}

std::string man_item(const OptionDoc& o) {
    std::string head;
    if (o.positional.empty()) {
        for (const std::string& n : o.names) head += (head.empty() ? "" : ", ") + ("\\fB" + roff(n) + "\\fR");
        if (!o.value.empty()) head += " \\fI" + roff(o.value) + "\\fR";
    } else {
        head = "\\fI" + roff(o.positional) + "\\fR";
    }
    if (o.many) head += " ...";
    std::string text = roff(o.help);
    if (!o.choices.empty()) text += "\n.br\nOne of: " + roff(join(o.choices, ", ")) + ".";
    if (!o.limits.empty()) text += "\n.br\nAccepts " + roff(o.limits) + ".";
    if (o.required) text += "\n.br\nRequired.";
    return ".TP\n" + head + "\n" + text + "\n";
}

std::string synopsis(const CommandDoc& c) {
    std::string s = ".B ellipsa" + (c.name.empty() ? std::string() : " " + roff(c.name)) + "\n";
    if (c.name.empty()) return s + "[\\fIOPTIONS\\fR] [\\fICOMMAND\\fR [\\fICOMMAND OPTIONS\\fR]]\n";
    s += "[\\fIOPTIONS\\fR]";
    for (const OptionDoc& p : c.positionals) {
        std::string a = "\\fI" + roff(p.positional) + "\\fR" + (p.many ? " ..." : "");
        s += " " + (p.required ? a : "[" + a + "]");
    }
    return s + "\n";
}

const char* exit_status_text =
    ".SH EXIT STATUS\n.TP\n.B 0\nsuccess\n.TP\n.B 1\nbad input: the message on standard error names the file, "
    "line and column and what was expected\n.TP\n.B 2\nbad usage (an unknown option, a missing argument)\n";

#ifdef ELLIPSA_HAVE_VIEWER
// All of it is the viewer's: a build without the viewer has no such section.
const char* root_environment_text =
    ".SH ENVIRONMENT\n.TP\n.B XDG_CONFIG_HOME\nThe viewer keeps its settings in \\fI$XDG_CONFIG_HOME/ellipsa/\\fR "
    "(\\fI~/.config/ellipsa/\\fR when it is unset or not an absolute path).\n.TP\n.B ELLIPSA_EXAMPLES\n"
    "A folder of far\\-field CSV files that \\fBellipsa view\\fR opens when it is given no file, before the "
    "bundled examples.\n.TP\n.B LIBGL_ALWAYS_SOFTWARE\nWhen set (not 0), the viewer uses Mesa's software "
    "renderer, as with \\fB\\-\\-software\\fR.\n"
    ".SH FILES\n.TP\n.I $XDG_CONFIG_HOME/ellipsa/viewer.conf\nThe viewer's settings (window size, panels, view).\n"
    ".TP\n.I $XDG_CONFIG_HOME/ellipsa/imgui.ini\nThe viewer's window layout.\n";
#endif

// The EXAMPLES of each manual page: a command line and what it does. They use two files that
// `ellipsa synth` writes (the root page's first examples), so every line runs as shown
// (tests/scripts/usage_cli.sh runs them all but view's).
struct Example {
    const char* command;  // "" for the root page
    const char* line;
    const char* what;
};
const Example examples[] = {
    {"", "ellipsa synth small-loop --frequency 2.45GHz --out loop.csv", "Write a closed-form small loop to loop.csv."},
    {"", "ellipsa synth dipole --frequency 2.45GHz --out dipole.csv", "Write a half-wave dipole to dipole.csv."},
    {"", "ellipsa info loop.csv", "Headline figures of every frequency in the file."},
    {"view", "ellipsa view loop.csv dipole.csv", "Open both patterns in the viewer."},
    {"view", "ellipsa view loop.csv dipole.csv --compare 2 --color-by difference", "Colour the loop by its difference from the dipole."},
    {"synth", "ellipsa synth crossed-dipoles --phase 90 --step 2 --out turnstile.csv", "A turnstile (circular along z) on a 2-degree grid."},
    {"info", "ellipsa info loop.csv --frequency 2.45GHz --json", "One frequency's figures as one JSON object."},
    {"probe", "ellipsa probe loop.csv --theta 80 --phi 45", "Every component, axial ratio, tilt and Stokes at one direction."},
    {"cut", "ellipsa cut loop.csv --phi 0 --components total,theta,phi --out loop-phi0.svg", "An elevation cut with three components."},
    {"cut", "ellipsa cut dipole.csv --theta 90 --style rect --out dipole-azimuth.csv", "The azimuth plane as a table."},
    {"map", "ellipsa map loop.csv --show axial-ratio --out loop-ar.png", "The axial ratio over the whole sphere (Hammer projection)."},
    {"coverage", "ellipsa coverage loop.csv dipole.csv --horizon 30", "Share of the sphere covered at each level by the better of two antennas."},
    {"band", "ellipsa band loop.csv --out loop-band.svg", "Figures against frequency as a plot."},
    {"diversity", "ellipsa diversity loop.csv dipole.csv --environment indoor", "MEG of each and their envelope correlation indoors."},
    {"fading", "ellipsa fading loop.csv dipole.csv --environment urban --samples 2000", "Fading and combining of the pair in an urban environment."},
    {"rank", "ellipsa rank loop.csv dipole.csv --environment uniform,indoor", "Rank the two candidates in two environments."},
    {"render", "ellipsa render loop.csv --color-by axial-ratio --out loop-3d.png", "A 3D snapshot without a display."},
    {"report", "ellipsa report loop.csv dipole.csv --out report", "A report folder with figures of both antennas."},
    {"convert", "ellipsa convert loop.csv loop-circular.csv --family circular-db-phase", "Rewrite the file as RHCP/LHCP dB and phase."},
    {"gain-transfer", "ellipsa convert loop.csv rel.csv --assume quantity=relative", "A file of relative levels, for the example below."},
    {"gain-transfer", "ellipsa gain-transfer rel.csv --reference-level 0 --reference-gain 2.45GHz=2.15 --out gain.csv",
     "Relative levels to gain with a reference of 2.15 dBi measured at 0 dB."},
};

std::string examples_section(const std::string& command) {
    std::string s;
    for (const Example& e : examples)
        if (command == e.command) s += ".PP\n" + roff(e.what) + "\n.IP\n.nf\n\\fB" + roff(e.line) + "\\fR\n.fi\n";
    return s.empty() ? s : ".SH EXAMPLES\n" + s;
}

std::string man_page(const CommandDoc& c, const std::vector<CommandDoc>& all, const std::string& version) {
    const std::string page = c.name.empty() ? "ellipsa" : "ellipsa-" + c.name;
    std::string upper;
    for (char ch : page) upper += static_cast<char>(std::toupper(static_cast<unsigned char>(ch)));
    std::string s = ".\\\" Generated by ellipsa --write-cli-docs from the command line's definitions; do not edit.\n";
    s += ".TH " + roff(upper) + " 1 \"\" \"ellipsa " + version + "\" \"ellipsa manual\"\n.nh\n";
    std::string what = c.description;
    if (c.name.empty() && what.rfind("ellipsa: ", 0) == 0) what = what.substr(9);
    s += ".SH NAME\n" + roff(page) + " \\- " + roff(what) + "\n.SH SYNOPSIS\n" + synopsis(c);
    s += ".SH DESCRIPTION\n" + roff(c.description) + "\n";
    if (c.name.empty()) {
        s += ".PP\nEach command has its own manual page, \\fBellipsa\\-\\fICOMMAND\\fR(1), and \\fB\\-\\-help\\fR.\n";
        s += ".SH COMMANDS\n";
        for (std::size_t i = 1; i < all.size(); ++i)
            s += ".TP\n\\fB" + roff(all[i].name) + "\\fR\n" + roff(all[i].description) + "\n";
    }
    if (!c.positionals.empty()) s += ".SH ARGUMENTS\n";
    for (const OptionDoc& p : c.positionals) s += man_item(p);
    s += ".SH OPTIONS\n";
    for (const OptionDoc& o : c.options) s += man_item(o);
    s += exit_status_text;
#ifdef ELLIPSA_HAVE_VIEWER
    if (c.name.empty()) s += root_environment_text;
#endif
    s += examples_section(c.name);
    s += ".SH SEE ALSO\n";
    if (!c.name.empty()) return s + "\\fBellipsa\\fR(1)\n";
    for (std::size_t i = 1; i < all.size(); ++i)
        s += "\\fBellipsa\\-" + roff(all[i].name) + "\\fR(1)" + (i + 1 < all.size() ? ",\n" : "\n");
    return s;
}

// --- completions ---

// The help text cut to a short line for a completion menu.
std::string short_help(const std::string& help) {
    std::string s = help;
    for (const char* stop : {" (", "; ", ": "})
        if (std::size_t at = s.find(stop); at != std::string::npos && at > 10) s.resize(at);
    if (s.size() > 72) s.replace(69, std::string::npos, "...");
    return s;
}

std::string all_names(const CommandDoc& c) {
    std::vector<std::string> n;
    for (const OptionDoc& o : c.options) n.insert(n.end(), o.names.begin(), o.names.end());
    return join(n, " ");
}

// What a bash case arm does for an option's value.
std::string bash_value_action(const OptionDoc& o) {
    if (!o.choices.empty()) return "COMPREPLY=($(compgen -W \"" + join(o.choices, " ") + "\" -- \"$cur\")); return ;;";
    if (o.files) return "COMPREPLY=($(compgen -f -- \"$cur\")); return ;;";
    return "return ;;";  // a number or a free text: nothing to offer
}

std::string bash_command_arm(const CommandDoc& c) {
    std::string s = "        " + c.name + ")\n            opts=\"" + all_names(c) + "\"\n            case $prev in\n";
    for (const OptionDoc& o : c.options)
        if (!o.value.empty()) s += "                " + join(o.names, "|") + ") " + bash_value_action(o) + "\n";
    s += "            esac\n";
    if (!c.positionals.empty() && !c.positionals[0].choices.empty())
        s += "            [[ $cur != -* ]] && { COMPREPLY=($(compgen -W \"" + join(c.positionals[0].choices, " ") +
             "\" -- \"$cur\")); return; }\n";
    return s + "            ;;\n";
}

std::string bash_completion(const std::vector<CommandDoc>& all) {
    std::vector<std::string> names;
    for (std::size_t i = 1; i < all.size(); ++i) names.push_back(all[i].name);
    std::string s = "# bash completion for ellipsa. Generated by ellipsa --write-cli-docs from the command line's\n"
                    "# definitions; do not edit.\n_ellipsa() {\n"
                    "    local cur=${COMP_WORDS[COMP_CWORD]} prev=${COMP_WORDS[COMP_CWORD-1]} cmd=\"\" opts i\n"
                    "    for ((i = 1; i < COMP_CWORD; i++)); do\n        case ${COMP_WORDS[i]} in\n            " +
                    join(names, "|") + ") cmd=${COMP_WORDS[i]}; break ;;\n        esac\n    done\n    case $cmd in\n";
    s += "        \"\")\n            COMPREPLY=($(compgen -W \"" + join(names, " ") + " " + all_names(all[0]) +
         "\" -- \"$cur\"))\n            return ;;\n";
    for (std::size_t i = 1; i < all.size(); ++i) s += bash_command_arm(all[i]);
    s += "    esac\n    if [[ $cur == -* ]]; then\n        COMPREPLY=($(compgen -W \"$opts\" -- \"$cur\"))\n"
         "    else\n        COMPREPLY=($(compgen -f -- \"$cur\"))\n    fi\n}\n"
         "complete -o filenames -F _ellipsa ellipsa\n";
    return s;
}

// Inside a single-quoted zsh _arguments spec: quotes closed and reopened, brackets and colons escaped.
std::string zsh_quote(const std::string& s) {
    std::string out;
    for (char c : s) {
        if (c == '\'') out += "'\\''";
        else if (c == '[' || c == ']' || c == ':' || c == '\\') out += std::string("\\") + c;
        else out += c;
    }
    return out;
}

std::string zsh_action(const OptionDoc& o) {
    if (!o.choices.empty()) return "(" + join(o.choices, " ") + ")";
    return o.files ? "_files" : " ";
}

std::string zsh_spec(const OptionDoc& o) {
    const std::string help = "[" + zsh_quote(short_help(o.help)) + "]";
    const std::string arg = o.value.empty() ? "" : ":" + zsh_quote(o.value) + ":" + zsh_action(o);
    const std::string eq = o.value.empty() ? "" : "=";
    if (o.names.size() == 1) return "'" + o.names[0] + eq + help + arg + "'";
    return "'(" + join(o.names, " ") + ")'{" + join(o.names, ",") + "}'" + eq + help + arg + "'";
}

std::string zsh_command_function(const CommandDoc& c) {
    std::string s = "_ellipsa_" + c.name + "() {\n    _arguments -s";
    for (const OptionDoc& o : c.options) s += " \\\n        " + zsh_spec(o);
    for (std::size_t i = 0; i < c.positionals.size(); ++i) {
        const OptionDoc& p = c.positionals[i];
        const std::string pos = p.many ? "*" : std::to_string(i + 1);
        s += " \\\n        '" + pos + ":" + zsh_quote(p.positional) + ":" + zsh_action(p) + "'";
    }
    return s + "\n}\n";
}

std::string zsh_completion(const std::vector<CommandDoc>& all) {
    std::string s = "#compdef ellipsa\n# zsh completion for ellipsa. Generated by ellipsa --write-cli-docs from the "
                    "command line's\n# definitions; do not edit.\n";
    for (std::size_t i = 1; i < all.size(); ++i) s += zsh_command_function(all[i]);
    s += "_ellipsa() {\n    local curcontext=$curcontext state line\n    local -a commands\n    commands=(\n";
    for (std::size_t i = 1; i < all.size(); ++i)
        s += "        '" + all[i].name + ":" + zsh_quote(short_help(all[i].description)) + "'\n";
    s += "    )\n    _arguments -C";
    for (const OptionDoc& o : all[0].options) s += " \\\n        " + zsh_spec(o);
    s += " \\\n        '1: :->command' \\\n        '*:: :->arguments'\n    case $state in\n"
         "        command) _describe -t commands 'ellipsa command' commands ;;\n"
         "        arguments) (( $+functions[_ellipsa_$words[1]] )) && _ellipsa_$words[1] ;;\n    esac\n}\n"
         "_ellipsa \"$@\"\n";
    return s;
}

std::string fish_quote(const std::string& s) {
    std::string out = "'";
    for (char c : s) {
        if (c == '\'' || c == '\\') out += '\\';
        out += c;
    }
    return out + "'";
}

std::string fish_option(const OptionDoc& o, const std::string& when) {
    std::string s = "complete -c ellipsa -n " + fish_quote(when);
    for (const std::string& n : o.names) s += n.rfind("--", 0) == 0 ? " -l " + n.substr(2) : " -s " + n.substr(1);
    if (!o.choices.empty()) s += " -x -a " + fish_quote(join(o.choices, " "));
    else if (o.files) s += " -r -F";
    else if (!o.value.empty()) s += " -x";
    return s + " -d " + fish_quote(short_help(o.help)) + "\n";
}

std::string fish_completion(const std::vector<CommandDoc>& all) {
    std::string s = "# fish completion for ellipsa. Generated by ellipsa --write-cli-docs from the command line's\n"
                    "# definitions; do not edit.\ncomplete -c ellipsa -f\n";
    const std::string top = "__fish_use_subcommand";
    for (const OptionDoc& o : all[0].options) s += fish_option(o, top);
    for (std::size_t i = 1; i < all.size(); ++i)
        s += "complete -c ellipsa -n " + top + " -a " + all[i].name + " -d " + fish_quote(short_help(all[i].description)) + "\n";
    for (std::size_t i = 1; i < all.size(); ++i) {
        const CommandDoc& c = all[i];
        const std::string when = "__fish_seen_subcommand_from " + c.name;
        for (const OptionDoc& o : c.options) s += fish_option(o, when);
        if (!c.positionals.empty() && !c.positionals[0].choices.empty())
            s += "complete -c ellipsa -n " + fish_quote(when) + " -a " + fish_quote(join(c.positionals[0].choices, " ")) + "\n";
        else if (!c.positionals.empty())
            s += "complete -c ellipsa -n " + fish_quote(when) + " -F\n";
    }
    return s;
}

}  // namespace

std::vector<CommandDoc> describe_commands(const CLI::App& root) {
    std::vector<CommandDoc> out{describe_command(root)};
    out[0].name.clear();  // the root is "" to the writers
    for (const CLI::App* sub : root.get_subcommands([](const CLI::App* a) { return !a->get_group().empty(); }))
        out.push_back(describe_command(*sub));
    return out;
}

std::vector<DocFile> cli_documents(const std::vector<CommandDoc>& commands, const std::string& version) {
    std::vector<DocFile> out;
    for (const CommandDoc& c : commands)
        out.push_back({"man1/" + (c.name.empty() ? std::string("ellipsa") : "ellipsa-" + c.name) + ".1",
                       man_page(c, commands, version)});
    out.push_back({"bash/ellipsa", bash_completion(commands)});
    out.push_back({"zsh/_ellipsa", zsh_completion(commands)});
    out.push_back({"fish/ellipsa.fish", fish_completion(commands)});
    return out;
}

int write_cli_documents(const CLI::App& root, const std::string& dir) {
    namespace fs = std::filesystem;
    const std::vector<DocFile> files = cli_documents(describe_commands(root), ELLIPSA_VERSION);
    std::error_code ec;
    // Never replaces a file, and writes nothing when one is in the way: the build empties the folder first.
    for (const DocFile& f : files)
        if (fs::exists(fs::symlink_status(fs::path(dir) / f.path, ec))) {
            std::cerr << "ellipsa: " << (fs::path(dir) / f.path).string() << ": already exists; give an empty folder\n";
            return exit_bad_input;
        }
    for (const DocFile& f : files) {
        const fs::path p = fs::path(dir) / f.path;
        fs::create_directories(p.parent_path(), ec);
        Status st = ec ? Status(Error{p.parent_path().string(), 0, 0, "cannot create the folder: " + ec.message()})
                       : io::write_file_atomically(p.string(), f.text, false);
        if (!st) {
            std::cerr << "ellipsa: " << st.error().format() << "\n";
            return exit_bad_input;
        }
    }
    return exit_ok;
}

}  // namespace ellipsa::cli
