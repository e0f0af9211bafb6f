// What `ellipsa report` makes of its options and how it publishes the folder (cli/report_options.hpp).
#include "cli/report_options.hpp"

#include <cctype>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <ctime>

#include "cli/version.hpp"
#include "exports/cut_plot.hpp"
#include "importers/text.hpp"
#include "io/atomic_folder.hpp"

namespace ellipsa::cli {

namespace {

// The date line: now, or SOURCE_DATE_EPOCH when set (seconds since 1970 UTC, the reproducible
// builds convention, reproducible-builds.org/specs/source-date-epoch), so a report can be made
// again byte for byte. A malformed value is refused, as that specification asks.
Result<std::string> report_date() {
    std::time_t t = std::time(nullptr);
    if (const char* e = std::getenv("SOURCE_DATE_EPOCH"); e && *e) {
        char* end = nullptr;
        errno = 0;
        const long long v = std::strtoll(e, &end, 10);
        if (*end != '\0' || errno != 0 || v < 0 || v > 253402300799LL || !std::isdigit(static_cast<unsigned char>(*e)))
            return Error{"", 0, 0, "SOURCE_DATE_EPOCH: expected whole seconds since 1970-01-01 UTC, found \"" +
                                       std::string(e) + "\""};
        t = std::time_t(v);
    }
    std::tm utc{};
    char date[64];
    if (!gmtime_r(&t, &utc) || std::strftime(date, sizeof date, "%Y-%m-%d %H:%M UTC", &utc) == 0)
        return Error{"", 0, 0, "cannot write the report's date"};
    return std::string(date);
}

}  // namespace

Result<exports::ReportOptions> report_options(const ReportChoices& c, const exports::RenderSize& size,
                                             const ChosenEnvironment& environment) {
    if (!(std::isfinite(c.range_db) && c.range_db >= exports::min_range_db && c.range_db <= exports::max_range_db))
        return Error{"", 0, 0, "--range: expected a number of dB from " + text::number(exports::min_range_db) + " to " +
                                   text::number(exports::max_range_db)};
    exports::ReportOptions o;
    o.title = c.title;
    o.frequency_hz = c.frequency_hz;
    o.size = size;
    o.range_db = c.range_db;
    if (!exports::parse_plot_style(c.style, o.style))
        return Error{"", 0, 0, "--style: expected polar or rect, found \"" + c.style + "\""};
    o.generator = version_line();
    auto date = report_date();
    if (!date) return date.error();
    o.generated_utc = *date;
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
