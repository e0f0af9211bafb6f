// Shared pieces of the Python module: the Pattern object, errors as Python exceptions, numpy views
// of the core's arrays and the conversions every binding file uses.
#pragma once
#include <array>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include "exports/render.hpp"
#include "pattern/components.hpp"
#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa::python {

namespace py = pybind11;

// What `ellipsa.Pattern` wraps: one far-field set, never changed after it is made, so numpy views
// of its arrays stay valid as long as the Python object lives (each view holds it as its base).
struct Pattern {
    FarFieldSet set;
    std::string path;  // names the pattern in Errors, as the command line names its file
};
// The name Errors give a pattern made without a file.
inline std::string label_of(const FarFieldSet& s) { return s.name.empty() ? std::string("the pattern") : s.name; }
using PatternPtr = std::shared_ptr<Pattern>;

// What `ellipsa.Environment` wraps: the environment as chosen, with where its XPR came from.
struct PyEnvironment {
    ChosenEnvironment chosen;
};

// Raise ellipsa.Error (a ValueError) with the core's "file:line:column: message" text as its
// message and the parts as attributes file, line, column, message.
[[noreturn]] void raise(const Error& e);
template <class T>
T take(Result<T> r) {
    if (!r) raise(r.error());
    return std::move(r.value());
}
inline void check(const Status& s) {
    if (!s) raise(s.error());
}

// A read-only numpy view of `count` values at `data`, shaped `shape`, kept alive by `owner`.
template <class T>
py::array view(const T* data, std::vector<py::ssize_t> shape, py::handle owner) {
    py::array a(py::dtype::of<T>(), std::move(shape), {}, data, owner);
    a.attr("setflags")(py::arg("write") = false);
    return a;
}
// A new array that owns its values (a copy of `v`), shaped `shape` (default: 1-D).
template <class T>
py::array_t<T> copy(const std::vector<T>& v, std::vector<py::ssize_t> shape = {}) {
    if (shape.empty()) shape = {py::ssize_t(v.size())};
    py::array_t<T> a(shape);
    std::copy(v.begin(), v.end(), a.mutable_data());
    return a;
}

// The frequency to use: `frequency_hz` when given (nearest within 0.5 %, else an Error listing
// what the set holds), else `index` (checked).
std::size_t frequency_index(const Pattern& p, int index, const std::optional<double>& frequency_hz);
// A component by its machine name ("total", "rhcp", ...), or ValueError listing the names.
Component component_named(const std::string& name);
// Raise ellipsa.Error when the set cannot give the component (the core's reason).
void check_component(const Pattern& p, Component c);

// A figure's size as the command line's --size WIDTHxHEIGHT and --dpi check it (exports/render.hpp),
// else ValueError naming size_px or dpi with the command's message.
exports::RenderSize render_size(const std::array<int, 2>& size_px, double dpi);

// Optional values as Python None.
inline py::object opt(const std::optional<double>& v) { return v ? py::object(py::float_(*v)) : py::none(); }
inline py::object opt(const std::optional<std::string>& v) { return v ? py::object(py::str(*v)) : py::none(); }

// The parts of the module, each in its own file.
void bind_pattern(py::module_& m);
void bind_figures(py::module_& m);
void bind_diversity(py::module_& m);
void bind_fading(py::module_& m);
void bind_band(py::module_& m);
void bind_map(py::module_& m);
void bind_report(py::module_& m);
void bind_view(py::module_& m);

}  // namespace ellipsa::python
