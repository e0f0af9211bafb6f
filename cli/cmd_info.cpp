// ellipsa info: the headline figures of a pattern file, per frequency.
#include <cstdio>
#include <iostream>
#include <memory>
#include <optional>

#include "cli/band_text.hpp"
#include "cli/commands.hpp"
#include "cli/frequency_option.hpp"
#include "cli/format.hpp"
#include "cli/info_json.hpp"
#include "cli/json.hpp"
#include "cli/load.hpp"
#include "exports/figure_text.hpp"
#include "pattern/convention_hints.hpp"
#include "pattern/integrate.hpp"
#include "pattern/summary.hpp"

namespace ellipsa::cli {

namespace {

struct InfoArgs {
    std::string file;
    std::optional<double> frequency_hz;
    bool json = false;
    LoadOptions load;
};

std::string grid_line(const Grid& g) {
    char buf[256];
    std::snprintf(buf, sizeof buf, "theta %g..%g deg step %g (%d), phi %g..%g deg step %g (%d)", g.theta.start_deg,
                  g.theta.last_deg(), g.theta.step_deg, g.theta.count, g.phi.start_deg, g.phi.last_deg(),
                  g.phi.step_deg, g.phi.count);
    return buf;
}

// The files read for one FILE argument: its path and the files it joins ("co.csv + cross.csv",
// as the merge names them in the set's source).
std::string files_read(const std::string& arg, const LoadOptions& o) {
    auto p = prepare_load(arg, o);
    if (!p) return file_path(arg);
    std::string out = p->path;
    for (const std::string& j : p->join) out += " + " + j;
    return out;
}

// The header: the files read, then the pattern's name (a file without one is named by its path
// when read, which the header need not repeat), then the source unless it is that list of files.
void write_header(const std::string& files, const std::string& path, const FarFieldSet& s) {
    std::cout << files << ": " << (s.name.empty() || s.name == path ? "(no name)" : s.name) << "\n";
    if (!s.source.empty() && s.source != files) std::cout << "  source       " << s.source << "\n";
}

void write_human(const std::string& files, const std::string& path, const FarFieldSet& s, const std::vector<std::size_t>& which,
                 const InfoFigures& f) {
    const std::vector<PatternSummary>& rs = f.summaries;
    const std::vector<InfoExtras>& extras = f.extras;
    const char* q = to_string(s.quantity);
    const char* u = db_unit(s.quantity, Component::total);
    write_header(files, path, s);
    std::cout << "  quantity     " << q
              << (s.quantity == Quantity::gain          ? " (absolute, includes radiation efficiency)"
                  : s.quantity == Quantity::directivity ? " (lossless)"
                                                        : " (relative power, unknown reference)")
              << "\n";
    std::cout << "  data         " << to_string(s.content)
              << (s.content == FieldContent::complex ? " E_theta, E_phi with phase" : "")
              << (s.part != FieldPart::whole ? std::string("; the ") + to_string(s.part) + " part only (the other stored as zero)" : "")
              << "\n";
    std::cout << "  grid         " << grid_line(s.grid) << "\n";
    std::cout << "  coverage     " << exports::coverage_text(s.grid) << "\n";
    std::cout << "  mounting     " << exports::mounting_text(s) << "\n";
    for (const PatternSummary& r : rs) {
        std::cout << "\n  " << format_frequency(r.frequency_hz) << "\n";
        std::cout << "    peak                  " << exports::peak_text(r, u, "deg") << "\n";
        if (r.zero_field) {
            std::cout << "    every sample is zero: no peak direction, beam or polarisation figures\n";
            continue;
        }
        if (r.directivity_dbi)
            std::cout << "    directivity           " << fmt(r.directivity_dbi, "dBi") << "\n";
        else if (r.power.directivity_sampled_only)
            std::cout << "    directivity           unavailable (partial sphere); "
                      << fmt(to_db(*r.power.directivity_sampled_only), "dBi")
                      << " assuming nothing radiates outside the sampled region\n";
        else
            std::cout << "    directivity           " << exports::needs_sphere_text(s.grid) << "\n";
        const bool cuts = s.grid.sampling == Sampling::cuts;
        std::cout << "    radiation efficiency  "
                  << (r.power.radiation_efficiency ? fmt(100 * *r.power.radiation_efficiency, "%", 1)
                      : cuts ? exports::needs_sphere_text(s.grid)
                      : s.quantity == Quantity::gain ? std::string("unavailable (partial sphere)")
                                                     : std::string("unavailable (needs absolute gain data)"))
                  << "\n";
        if (r.efficiency_above_100) std::cout << "    warning: " << exports::efficiency_warning_text(*r.power.radiation_efficiency) << "\n";
        for (const bool az : {false, true}) {  // "HPBW elevation plane", or at a pole "HPBW plane phi = 0"
            std::string label = "HPBW " + exports::beam_plane_text(r, az, "");
            label.resize(std::max<std::size_t>(label.size() + 1, 22), ' ');
            std::cout << "    " << label << exports::beamwidth_text(az ? r.azimuth : r.elevation, az ? "angle" : "theta", "deg") << "\n";
        }
        // The plane goes with the value: "elevation plane: -13.26 dB", "plane phi = 0: none (...)".
        std::cout << "    side lobe             " << exports::beam_plane_text(r, false, "") << ": " << exports::sidelobe_text(r.elevation) << "\n";
        std::cout << "    front-to-back         " << exports::front_to_back_text(r.front_to_back_db, r.front_to_back_above_db) << "\n";
        std::cout << "    polarisation at peak  "
                  << (r.sense ? exports::polarisation_text(*r.sense, r.axial_ratio_db) : "unavailable (" + r.unavailable_reason + ")")
                  << "\n";
        // issue 16: AR beamwidth around the peak and the AR <= 3 dB share of the sphere.
        const std::size_t i = std::size_t(&r - rs.data()), k = which[i];
        std::cout << "    AR beamwidth (3 dB)   " << circular_text(extras[i].circular) << "\n";
        std::cout << "    phase centre          " << phase_centre_text(s, k, extras[i].phase_centre) << "\n";
        if (const std::string moved = reference_shift_text(s, k); !moved.empty())
            std::cout << "    phase reference       moved to " << moved << "\n";
    }
    if (rs.size() > 1) std::cout << band_summary_text(band_summary(s, which, rs));  // issue 16
    const std::vector<std::string> hints = convention_hints(s, which, rs);  // issue 14
    if (!hints.empty()) std::cout << "\n";
    for (const std::string& h : hints) std::cout << "  " << h << "\n";
}

Registered add_info(CLI::App& root) {
    auto a = std::make_shared<InfoArgs>();
    CLI::App* sub = root.add_subcommand("info", "Summarise a pattern file: peak, directivity, beamwidths, polarisation");
    sub->add_option("FILE", a->file, "Far-field CSV file")->required();
    add_frequency_option(sub, a->frequency_hz, "Only this frequency (nearest within 0.5 %; default all)");
    sub->add_flag("--json", a->json, "Print one JSON object instead of the human summary");
    add_load_options(sub, a->load);
    return {sub, [a]() -> int {
                auto s = load_pattern(a->file, a->load);
                if (!s) {
                    std::cerr << "ellipsa info: " << s.error().format() << "\n";
                    return exit_bad_input;
                }
                std::vector<std::size_t> which;
                if (a->frequency_hz) {
                    auto k = pick_frequency(*s, a->frequency_hz, file_path(a->file));
                    if (!k) {
                        std::cerr << "ellipsa info: " << k.error().format() << "\n";
                        return exit_bad_input;
                    }
                    which.push_back(*k);
                } else {
                    for (std::size_t k = 0; k < s->frequencies.size(); ++k) which.push_back(k);
                }
                const InfoFigures figures = info_figures(*s, which);
                if (a->json)
                    std::cout << info_json(*s, which, figures) << "\n";
                else
                    write_human(files_read(a->file, a->load), file_path(a->file), *s, which, figures);
                return exit_ok;
            }};
}
const CommandRegistration registration(20, add_info);

}  // namespace

}  // namespace ellipsa::cli
