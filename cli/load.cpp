#include "cli/load.hpp"

#include "pattern/integrate.hpp"

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa::cli {

namespace {
// The options that name a pattern file, by their CLI11 names.
bool names_pattern_file(const CLI::Option* opt) {
    const std::string n = opt->get_name();
    return n == "FILE" || n == "FILE2" || n == "IN" || n == "--minus" || n == "--partner" ||
           n == "--reference";
}

// Checks one mention of a pattern file ("PATH" or "PATH::key=value...") while the command line is
// parsed (a bad key or mounting value is a usage error, exit 2) and keeps the mention whole: each
// mention carries its own options, so one file named twice (z.csv z.csv::up=+x) is read once per
// mention with that mention's options. Commands name the file by file_path(mention).
std::string check_file_argument(const std::string& arg) {
    auto f = parse_file_argument(arg);
    if (!f) throw CLI::ValidationError(f.error().format());
    return arg;
}
}  // namespace

void add_load_options(CLI::App* sub, LoadOptions& o) {
    for (CLI::Option* opt : sub->get_options())
        if (names_pattern_file(opt)) opt->transform(check_file_argument, "", "");
    sub->add_option("--map", o.map,
                    "Read a foreign column layout: \"SourceName=schema_name,...\" (schema_name may be "
                    "\"ignore\"; @FILE reads a map file; see docs/far-field-csv.md)");
    sub->add_option("--map-file", o.map_file, "Read a foreign column layout from a map file (docs/far-field-csv.md)")
        ->type_name("FILE");
    sub->add_option("--assume", o.assume,
                    "Metadata the file lacks or gets wrong, \"key=value,...\": quantity, time-convention, "
                    "angle-unit, phase-unit, frequency-unit, frequency, ludwig3-reference, name, source, note");
    sub->add_option("--scale", o.scale, "Multiply schema columns on reading: \"e_theta_re=0.001,...\"");
    sub->add_option("--offset", o.offset, "Add to schema columns on reading (after --scale): \"e_theta_db=-3,...\"");
    add_mounting_options(sub, o.mounting);
    sub->footer("These options apply to every FILE. Options for one file only follow its name: "
                "FILE::map=FILE.map::offset=e_total_db=7.5 (keys map, map-file, assume, scale, offset, angles, up, "
                "rotate, phase-centre; join=OTHER reads another file of the same pattern: other frequencies or the "
                "other polarisation part). "
                "A map file beside a file (FILE's stem with .map, or a .map file naming it) is used when no map is given.");
}

namespace {
// "A=b,C=d" -> pairs; the value is split at the last '='.
Status split_pairs(const std::string& text, const char* option,
                   std::vector<std::pair<std::string, std::string>>& out) {
    std::size_t pos = 0;
    while (pos <= text.size()) {
        std::size_t comma = text.find(',', pos);
        std::string item = text.substr(pos, comma == std::string::npos ? std::string::npos : comma - pos);
        std::size_t eq = item.rfind('=');
        auto blank = [](const std::string& s) { return s.find_first_not_of(" \t\"") == std::string::npos; };
        if (eq == std::string::npos || blank(item.substr(0, eq)) || blank(item.substr(eq + 1)))
            return Error{option, 0, 0, "expected name=value, found \"" + item + "\""};
        auto trim = [](std::string s) {
            s.erase(0, s.find_first_not_of(" \t"));
            s.erase(s.find_last_not_of(" \t") + 1);
            return s;
        };
        out.emplace_back(trim(item.substr(0, eq)), trim(item.substr(eq + 1)));
        if (comma == std::string::npos) break;
        pos = comma + 1;
    }
    return Ok{};
}

Status numbers(const std::string& text, const char* option, std::vector<CsvAdjustment>& out) {
    std::vector<std::pair<std::string, std::string>> items;
    if (auto st = split_pairs(text, option, items); !st) return st;
    for (auto& [k, v] : items) {
        char* end = nullptr;
        const double x = std::strtod(v.c_str(), &end);
        if (end == v.c_str() || *end != 0 || !std::isfinite(x))
            return Error{option, 0, 0, "expected a finite number after \"" + k + "=\", found \"" + v + "\""};
        out.push_back({k, x, {option, 0}});
    }
    return Ok{};
}

// The options into `ro`; `names` are the words messages use for each (the flags, or
// "FILE::map" and so on for one file's own), so the reader's refusals name them too.
struct OptionNames {
    const char *map, *assume, *scale, *offset;
};
constexpr OptionNames flag_names{"--map", "--assume", "--scale", "--offset"};

Status add_options(const FileOptions& o, const OptionNames& n, CsvReadOptions& ro) {
    if (!o.map.empty()) {
        // A column map always holds '='; without one the value names a map file.
        if (o.map[0] == '@' || o.map.find('=') == std::string::npos) {
            if (auto st = read_csv_map_file(o.map[0] == '@' ? o.map.substr(1) : o.map, ro); !st) return st;
        } else {
            std::vector<std::pair<std::string, std::string>> items;
            if (auto st = split_pairs(o.map, n.map, items); !st) return st;
            for (auto& [k, v] : items) ro.column_map.push_back({k, v, {n.map, 0}});
        }
    }
    if (!o.map_file.empty())
        if (auto st = read_csv_map_file(o.map_file, ro); !st) return st;
    if (!o.assume.empty()) {
        std::vector<std::pair<std::string, std::string>> items;
        if (auto st = split_pairs(o.assume, n.assume, items); !st) return st;
        for (auto& [k, v] : items) ro.settings.push_back(CsvSetting{k, v, {n.assume, 0}});
    }
    if (!o.scale.empty())
        if (auto st = numbers(o.scale, n.scale, ro.scale); !st) return st;
    if (!o.offset.empty())
        if (auto st = numbers(o.offset, n.offset, ro.offset); !st) return st;
    return Ok{};
}

bool exists(const std::string& path) {
    struct stat st {};
    return ::stat(path.c_str(), &st) == 0;
}

constexpr const char* file_keys = "map, map-file, assume, scale, offset, angles, up, rotate, phase-centre, join";

// The field of `own` (or `angles`, which joins own.assume) that "::key=" sets; null for an unknown key.
std::string* file_key_field(const std::string& key, FileOptions& own, std::string& angles) {
    return key == "map"            ? &own.map
           : key == "map-file"     ? &own.map_file
           : key == "assume"       ? &own.assume
           : key == "scale"        ? &own.scale
           : key == "offset"       ? &own.offset
           : key == "angles"       ? &angles
           : key == "up"           ? &own.mounting.up
           : key == "rotate"       ? &own.mounting.rotate
           : key == "phase-centre" ? &own.mounting.phase_centre
                                   : nullptr;
}

// One mounting option from the command or from the file's own key, never both.
Status merge_mounting(const std::string& command, const char* flag, const std::string& own, const std::string& path,
                      const char* key, std::string& out) {
    if (!command.empty() && !own.empty())
        return Error{path, 0, 0, std::string("expected the mounting once, found ") + flag + " and ::" + key + "= both"};
    out = own.empty() ? command : own;
    return Ok{};
}
}  // namespace

bool has_options(const FileOptions& o) {
    return !o.map.empty() || !o.map_file.empty() || !o.assume.empty() || !o.scale.empty() || !o.offset.empty() ||
           !o.mounting.up.empty() || !o.mounting.rotate.empty() || !o.mounting.phase_centre.empty() || !o.join.empty();
}

Result<CsvReadOptions> read_options(const FileOptions& o) {
    CsvReadOptions ro;
    if (Status st = add_options(o, flag_names, ro); !st) return st.error();
    return ro;
}

Result<FileArgument> parse_file_argument(const std::string& arg) {
    if (arg.empty()) return Error{"", 0, 0, "expected a file name, found an empty one"};  // "" (an unset variable in a script)
    const std::size_t cut = arg.find("::");
    if (cut == std::string::npos || exists(arg)) return FileArgument{arg, {}};
    FileArgument out{arg.substr(0, cut), {}};
    if (out.path.empty()) return Error{arg, 0, 0, "expected FILE::key=value, found no FILE before \"::\""};
    std::string angles;  // ::angles=X is short for ::assume=angles=X
    for (std::size_t pos = cut + 2; pos <= arg.size();) {
        const std::size_t next = std::min(arg.find("::", pos), arg.size());
        const std::string item = arg.substr(pos, next - pos);
        const std::size_t eq = item.find('=');
        const std::string key = item.substr(0, eq);
        if (key == "join" && eq != std::string::npos && eq + 1 < item.size()) {
            out.own.join.push_back(item.substr(eq + 1));
            pos = next + 2;
            continue;
        }
        std::string* field = file_key_field(key, out.own, angles);
        if (!field || eq == std::string::npos || eq + 1 == item.size())
            return Error{out.path, 0, 0,
                         std::string("expected ::key=value after the file name, key one of ") + file_keys + ", found \"" +
                             item + "\""};
        if (!field->empty()) return Error{out.path, 0, 0, "expected each ::" + key + "= once, found it again"};
        *field = item.substr(eq + 1);
        if (auto q = install_request(out.own.mounting); !q)  // a mounting key is checked as its option is
            return Error{out.path, 0, 0, "::" + key + "=: " + q.error().message};
        pos = next + 2;
    }
    if (!angles.empty()) out.own.assume += (out.own.assume.empty() ? "angles=" : ",angles=") + angles;
    return out;
}

std::string file_path(const std::string& arg) {
    auto f = parse_file_argument(arg);
    return f ? f->path : arg;
}

namespace {
Status prepare_mounting(const MountingOptions& command, const MountingOptions& own, const std::string& path,
                        MountingOptions& out) {
    out.turn_fields = command.turn_fields;
    if (Status st = merge_mounting(command.up, "--up", own.up, path, "up", out.up); !st) return st;
    if (Status st = merge_mounting(command.rotate, "--rotate", own.rotate, path, "rotate", out.rotate); !st) return st;
    return merge_mounting(command.phase_centre, "--phase-centre", own.phase_centre, path, "phase-centre",
                          out.phase_centre);
}
}  // namespace

Result<PreparedLoad> prepare_load(const std::string& arg, const LoadOptions& o) {
    auto file = parse_file_argument(arg);
    if (!file) return file.error();
    PreparedLoad p;
    p.path = file->path;
    p.join = file->own.join;
    if (Status st = prepare_mounting(o.mounting, file->own.mounting, file->path, p.mounting); !st) return st.error();
    if (Status st = add_options(o, flag_names, p.options); !st) return st.error();
    const std::string own_map = file->path + "::map", own_assume = file->path + "::assume",
                      own_scale = file->path + "::scale", own_offset = file->path + "::offset";
    if (Status st = add_options(file->own, {own_map.c_str(), own_assume.c_str(), own_scale.c_str(), own_offset.c_str()},
                                p.options);
        !st)
        return st.error();
    const bool any_map = !o.map.empty() || !o.map_file.empty() || !file->own.map.empty() || !file->own.map_file.empty();
    if (!any_map) {
        p.beside_map = find_csv_map_beside(p.path);
        if (!p.beside_map.empty())
            if (Status st = read_csv_map_file(p.beside_map, p.options); !st) return st.error();
    }
    return p;
}

namespace {
// The options with progress on a terminal when the first file is long (over 200 MB).
CsvReadOptions with_progress(const std::string& path, CsvReadOptions options) {
    struct stat st {};
    if (::isatty(2) && ::stat(path.c_str(), &st) == 0 && st.st_size > (200 << 20)) {
        options.progress = [last = -1](double f) mutable {
            const int pc = int(f * 100);
            if (pc != last) {
                last = pc;
                std::fprintf(stderr, "\rreading %3d %%", pc);
                if (pc >= 100) std::fprintf(stderr, "\r              \r");
            }
            return true;
        };
    }
    return options;
}

// The file and the files it joins (FILE::join=OTHER), read with the same options and merged
// (importers/far_field_csv.hpp, the viewer's read too).
Result<FarFieldSet> read_joined(const PreparedLoad& p) {
    return read_joined_far_field_csv(p.path, p.join, with_progress(p.path, p.options));
}
}  // namespace

Status refuse_cuts(const FarFieldSet& s, const std::string& path, const std::string& figure) {
    if (s.grid.sampling != Sampling::cuts) return Ok{};
    return Error{path, 0, 0, figure + " needs the whole sphere; " + sphere_shortfall(s.grid) + ": cut, probe and info read cuts"};
}

Result<FarFieldSet> load_pattern(const std::string& arg, const LoadOptions& o) {
    auto ro = prepare_load(arg, o);
    if (!ro) return ro.error();
    if (!ro->beside_map.empty()) std::fprintf(stderr, "ellipsa: %s: read with the map file beside it, %s\n", ro->path.c_str(), ro->beside_map.c_str());
    const std::string& path = ro->path;
    auto raw = read_joined(*ro);
    if (!raw) return raw;
    for (const std::string& n : raw->reading_notes) std::fprintf(stderr, "ellipsa: %s: %s\n", path.c_str(), n.c_str());
    if (o.whole_sphere_figure)
        if (Status whole = refuse_cuts(*raw, path, o.whole_sphere_figure); !whole) return whole.error();
    auto request = install_request(ro->mounting);
    if (!request) return request.error();
    auto installed = install_pattern(std::move(*raw), *request);
    if (!installed) return Error{path, 0, 0, installed.error().message};
    return installed;
}

Result<std::size_t> pick_frequency(const FarFieldSet& s, const std::optional<double>& f, const std::string& path,
                                   bool note) {
    if (s.frequencies.empty()) return Error{path, 0, 0, "holds no frequency"};
    if (f) return find_frequency(s, *f, path);
    const std::size_t n = s.frequencies.size(), middle = (n - 1) / 2;
    if (n > 1 && note)
        std::fprintf(stderr, "ellipsa: %s holds %zu frequencies (%s to %s); using the middle one, %s (choose with --frequency)\n",
                     path.c_str(), n, format_frequency(s.frequencies.front().frequency_hz).c_str(),
                     format_frequency(s.frequencies.back().frequency_hz).c_str(),
                     format_frequency(s.frequencies[middle].frequency_hz).c_str());
    return middle;
}

}  // namespace ellipsa::cli
