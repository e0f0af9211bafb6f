#include "cli/load.hpp"

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <sys/stat.h>
#include <unistd.h>

namespace ellipsa::cli {

void add_load_options(CLI::App* sub, LoadOptions& o) {
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
}  // namespace

// Every entry names the option it came from, so the reader's refusals name it too.
Result<CsvReadOptions> read_options(const LoadOptions& o) {
    CsvReadOptions ro;
    if (!o.map.empty()) {
        if (o.map[0] == '@') {
            if (auto st = read_csv_map_file(o.map.substr(1), ro); !st) return st.error();
        } else {
            std::vector<std::pair<std::string, std::string>> items;
            if (auto st = split_pairs(o.map, "--map", items); !st) return st.error();
            for (auto& [k, v] : items) ro.column_map.push_back({k, v, {"--map", 0}});
        }
    }
    if (!o.map_file.empty())
        if (auto st = read_csv_map_file(o.map_file, ro); !st) return st.error();
    if (!o.assume.empty()) {
        std::vector<std::pair<std::string, std::string>> items;
        if (auto st = split_pairs(o.assume, "--assume", items); !st) return st.error();
        for (auto& [k, v] : items) ro.settings.push_back(CsvSetting{k, v, {"--assume", 0}});
    }
    if (!o.scale.empty())
        if (auto st = numbers(o.scale, "--scale", ro.scale); !st) return st.error();
    if (!o.offset.empty())
        if (auto st = numbers(o.offset, "--offset", ro.offset); !st) return st.error();
    return ro;
}

Result<FarFieldSet> load_pattern(const std::string& path, const LoadOptions& o) {
    auto ro = read_options(o);
    if (!ro) return ro.error();
    // Progress for long loads on a terminal.
    if (::isatty(2)) {
        struct stat st {};
        if (::stat(path.c_str(), &st) == 0 && st.st_size > (200 << 20)) {
            ro->progress = [last = -1](double f) mutable {
                const int pc = int(f * 100);
                if (pc != last) {
                    last = pc;
                    std::fprintf(stderr, "\rreading %3d %%", pc);
                    if (pc >= 100) std::fprintf(stderr, "\r              \r");
                }
                return true;
            };
        }
    }
    return read_far_field_csv(path, *ro);
}

Result<std::size_t> pick_frequency(const FarFieldSet& s, const std::optional<double>& f, const std::string& path) {
    if (s.frequencies.empty()) return Error{path, 0, 0, "holds no frequency"};
    if (!f) return std::size_t(0);  // the only one; callers that handle every frequency ignore this
    return find_frequency(s, *f, path);
}

}  // namespace ellipsa::cli
