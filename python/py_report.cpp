// write_report(): the report folder of `ellipsa report`, through the command's own code
// (cli/report_options.hpp, cli/report_3d.hpp, exports/report.hpp), 3D views included.
#include "cli/load.hpp"
#include "cli/report_options.hpp"
#include "cli/report_3d.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

void write_report(const std::string& path, const std::vector<PatternPtr>& patterns, std::optional<double> frequency_hz,
                  const std::string& title, const std::array<int, 2>& size_px, double dpi, double range_db,
                  const std::string& style, const std::optional<PyEnvironment>& environment, bool force) {
    if (patterns.empty()) throw py::value_error("patterns: expected at least one ellipsa.Pattern");
    const exports::RenderSize size = render_size(size_px, dpi);
    ChosenEnvironment env;
    if (environment) {
        env = environment->chosen;
    } else {
        auto built = cli::chosen_environment(cli::EnvironmentOptions{});  // the command's default
        if (auto* u = std::get_if<cli::UsageError>(&built)) throw py::value_error(u->message);
        env = std::get<ChosenEnvironment>(built);
    }
    auto options = cli::report_options({title, style, frequency_hz, range_db}, size, env);
    if (!options) throw py::value_error(options.error().message);
    cli::add_report_3d_views(*options, size);
    std::vector<exports::ReportInput> inputs;
    std::vector<std::string> read;
    for (const PatternPtr& p : patterns) {
        if (!p) throw py::value_error("patterns: expected ellipsa.Pattern objects");
        const std::string file = p->path.empty() ? label_of(p->set) : p->path;
        check(cli::refuse_cuts(p->set, file, "a report (maps, 3D views, shares of the sphere)"));
        inputs.push_back({file, p->set});
        if (!p->path.empty()) read.push_back(p->path);
    }
    Result<std::size_t> written = Error{};
    {
        py::gil_scoped_release unlocked;
        written = cli::publish_report(path, inputs, *options, force, read);
    }
    take(std::move(written));
}

}  // namespace

void bind_report(py::module_& m) {
    m.def("write_report", &write_report, py::arg("path"), py::arg("patterns"), py::kw_only(),
          py::arg("frequency_hz") = py::none(), py::arg("title") = "Antenna pattern report",
          py::arg("size_px") = std::array<int, 2>{1200, 900}, py::arg("dpi") = 150.0, py::arg("range_db") = 40.0,
          py::arg("style") = "polar", py::arg("environment") = py::none(), py::arg("force") = false,
          "Write the report folder `ellipsa report --out` writes (the same code): index.html and report.md with\n"
          "the figures per pattern and frequency (only frequency_hz when given), the principal cuts (style\n"
          "\"polar\" or \"rect\", range_db 3..200, size_px and dpi of every figure), the maps, MEG in the\n"
          "environment (default: the command's default), the 3D views (headless, as the command draws them)\n"
          "and a comparison of several patterns. The folder is replaced only with force=True, and only one\n"
          "ellipsa made that holds none of the patterns' files.");
}

}  // namespace ellipsa::python
