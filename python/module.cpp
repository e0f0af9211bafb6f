// import ellipsa: the module's entry point. The parts live in py_pattern.cpp (reading, arrays,
// writing), py_figures.cpp (summary figures, cuts, coverage), py_band.cpp (figures against frequency), py_map.cpp (maps), py_report.cpp (the report folder), py_view.cpp (one 3D view as a file) and py_diversity.cpp (environments, MEG, ECC,
// combining, fading).
#include "python/py_common.hpp"

PYBIND11_MODULE(ellipsa, m) {
    namespace py = pybind11;
    m.doc() =
        "ellipsa: far-field antenna patterns, polarisation, and diversity in multipath, as numpy arrays.\n\n"
        "The same core as the ellipsa command line: read a far-field CSV (read), look at its fields and\n"
        "every polarisation basis (Pattern), the headline figures and cuts (Pattern.summary, Pattern.cut),\n"
        "mean effective gain, envelope correlation, two-branch combining and the fading simulation\n"
        "(environment, meg, ecc, diversity, combine, fading), coverage, band and rank. Conventions: docs/conventions.md.";
    py::object error = py::module_::import("builtins").attr("type")(
        "Error", py::make_tuple(py::handle(PyExc_ValueError)),
        py::dict(py::arg("__doc__") = "Bad input or an unavailable figure. str(e) is the core's "
                                      "\"file:line:column: message\" text; the attributes file, line, "
                                      "column (None when unknown) and message hold its parts.",
                 py::arg("__module__") = "ellipsa"));
    m.attr("Error") = error;
    m.attr("__version__") = ELLIPSA_VERSION;  // the project version CMake knows
    ellipsa::python::bind_pattern(m);
    ellipsa::python::bind_figures(m);
    ellipsa::python::bind_diversity(m);
    ellipsa::python::bind_band(m);
    ellipsa::python::bind_map(m);
    ellipsa::python::bind_report(m);
    ellipsa::python::bind_view(m);
}
