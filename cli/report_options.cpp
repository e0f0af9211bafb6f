// What `ellipsa report` makes of its options and how it publishes the folder (cli/report_options.hpp).
#include "cli/report_options.hpp"

#include <cmath>
#include <cstdio>
#include <ctime>

#include "cli/version.hpp"
#include "io/atomic_folder.hpp"

namespace ellipsa::cli {

Result<exports::ReportOptions> report_options(const ReportChoices& c, const exports::RenderSize& size,
                                             const ChosenEnvironment& environment) {
    if (!(std::isfinite(c.range_db) && c.range_db >= 3 && c.range_db <= 200))
        return Error{"", 0, 0, "--range: expected a number of dB from 3 to 200"};
    exports::ReportOptions o;
    o.title = c.title;
    o.frequency_hz = c.frequency_hz;
    o.size = size;
    o.range_db = c.range_db;
    if (!exports::parse_plot_style(c.style, o.style))
        return Error{"", 0, 0, "--style: expected polar or rect, found \"" + c.style + "\""};
    const std::string version = version_text();
    o.generator = version.substr(0, version.find('\n'));
    const std::time_t t = std::time(nullptr);
    char date[64];
    std::strftime(date, sizeof date, "%Y-%m-%d %H:%M UTC", std::gmtime(&t));
    o.generated_utc = date;
    o.environment = environment.environment;
    if (environment.xpr_from == XprOrigin::user) {
        char xpr[48];
        std::snprintf(xpr, sizeof xpr, ", XPR %g dB", environment.environment.xpr_db);
        o.environment->name += xpr;
    }
    return o;
}

Result<std::size_t> publish_report(const std::string& out, const std::vector<exports::ReportInput>& inputs,
                                   const exports::ReportOptions& o, bool force, const std::vector<std::string>& read) {
    auto files = exports::build_report(inputs, o);
    if (!files) return files.error();
    Status st = io::publish_folder(
        out, [&](const std::string& dir) { return exports::write_report_files(dir, *files); }, force, read);
    if (!st) return st.error();
    return files->size() - 2;
}

}  // namespace ellipsa::cli
