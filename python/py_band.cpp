// band() and write_band(): the figures against frequency of `ellipsa band`, through the command's
// own code (cli/band_json.hpp), so the dict is the JSON `ellipsa band --out NAME.json` writes.
#include <cstdio>

#include "cli/band_json.hpp"
#include "io/atomic_write.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

// Words joined as the command line writes a list ("uniform,indoor").
std::string joined(const std::vector<std::string>& words) {
    std::string out;
    for (const std::string& w : words) out += (out.empty() ? "" : ",") + w;
    return out;
}

// The command's choices from the keyword arguments (the same checks and messages).
struct BandCall {
    std::vector<std::string> environments{"uniform"};
    std::optional<std::array<double, 2>> direction_deg;
    std::optional<std::vector<std::string>> show;
    double ar_threshold_db = ellipsa::ar_threshold_db;
    bool pair = false;
    std::string title;
};

cli::BandChoices choices_of(const BandCall& c) {
    cli::BandChoices b;
    b.environments = joined(c.environments);
    if (c.direction_deg) {
        char text[64];
        std::snprintf(text, sizeof text, "%.17g,%.17g", (*c.direction_deg)[0], (*c.direction_deg)[1]);
        b.direction = text;
    }
    if (c.show) b.show = joined(*c.show);
    b.ar_threshold_db = c.ar_threshold_db, b.pair = c.pair, b.title = c.title;
    return b;
}

struct BandResult {
    exports::BandRequest request;
    cli::BandRun run;
    std::vector<std::string> files;
};

BandResult band_result(const std::vector<PatternPtr>& patterns, const BandCall& call) {
    if (patterns.empty()) throw py::value_error("patterns: expected at least one ellipsa.Pattern");
    auto request = cli::band_request(choices_of(call), patterns.size());
    if (!request) throw py::value_error(request.error().message);
    BandResult r{std::move(*request), {}, {}};
    std::vector<const FarFieldSet*> sets;
    std::vector<std::string> names;
    for (const PatternPtr& p : patterns) {
        if (!p) throw py::value_error("patterns: expected ellipsa.Pattern objects");
        sets.push_back(&p->set);
        r.files.push_back(p->path);
        const std::string file = p->path.empty() ? label_of(p->set) : p->path;
        names.push_back(p->set.name.empty() ? file : p->set.name);
    }
    Result<cli::BandRun> run = Error{};
    {
        py::gil_scoped_release unlocked;
        run = cli::band_run(sets, names, r.files, call.pair, r.request);
    }
    r.run = take(std::move(run));
    return r;
}

py::dict band(const std::vector<PatternPtr>& patterns, const BandCall& call) {
    const BandResult r = band_result(patterns, call);
    return py::module_::import("json").attr("loads")(cli::band_json(r.files, r.run, r.request));
}

void write_band(const std::string& path, const std::vector<PatternPtr>& patterns, const BandCall& call,
                const std::array<int, 2>& size_px, double dpi, bool force) {
    const exports::RenderSize size = render_size(size_px, dpi);
    const BandResult r = band_result(patterns, call);
    Status done = Ok{};
    {
        py::gil_scoped_release unlocked;
        auto bytes = cli::band_file(path, r.files, r.run, r.request, size);
        done = bytes ? io::write_file_atomically(path, *bytes, force) : Status(bytes.error());
    }
    check(done);
}

}  // namespace

void bind_band(py::module_& m) {
    m.def(
        "band",
        [](const std::vector<PatternPtr>& patterns, const std::vector<std::string>& environments,
           std::optional<std::array<double, 2>> direction_deg, double ar_threshold_db, bool pair) {
            return band(patterns, {environments, direction_deg, std::nullopt, ar_threshold_db, pair, ""});
        },
        py::arg("patterns"), py::kw_only(), py::arg("environments") = std::vector<std::string>{"uniform"},
        py::arg("direction_deg") = py::none(), py::arg("ar_threshold_db") = ellipsa::ar_threshold_db,
        py::arg("pair") = false,
        "The figures against frequency of `ellipsa band`, as its --out NAME.json writes them (the same code):\n"
        "per pattern and frequency the peak, directivity, efficiency, HPBW, front-to-back, axial ratio, sense,\n"
        "AR beamwidth (ar_threshold_db) and MEG in each environment (preset names), the band summary (gain and\n"
        "AR bandwidth), with direction_deg=(theta, phi) the axial ratio there, and with pair=True the ECC and\n"
        "diversity gain of the first two patterns at their shared frequencies.");
    m.def(
        "write_band",
        [](const std::string& path, const std::vector<PatternPtr>& patterns, const std::optional<std::vector<std::string>>& show,
           const std::vector<std::string>& environments, std::optional<std::array<double, 2>> direction_deg,
           double ar_threshold_db, bool pair, const std::string& title, std::array<int, 2> size_px, double dpi, bool force) {
            write_band(path, patterns, {environments, direction_deg, show, ar_threshold_db, pair, title}, size_px, dpi, force);
        },
        py::arg("path"), py::arg("patterns"), py::kw_only(), py::arg("show") = py::none(),
        py::arg("environments") = std::vector<std::string>{"uniform"}, py::arg("direction_deg") = py::none(),
        py::arg("ar_threshold_db") = ellipsa::ar_threshold_db, py::arg("pair") = false, py::arg("title") = "",
        py::arg("size_px") = std::array<int, 2>{1200, 900}, py::arg("dpi") = 150.0, py::arg("force") = false,
        "Write what `ellipsa band --out` writes, chosen by the file name: the plot (.svg, .png, .pdf; show: the\n"
        "panels, e.g. [\"gain\", \"meg\"]), the values (.csv) or the figures of band() (.json). The patterns and\n"
        "options as in band(). An existing file is replaced only with force=True.");
}

}  // namespace ellipsa::python
