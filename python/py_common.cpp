#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {
// The writers' refusals to replace a file name the command's --force (io/place.hpp); a Python
// caller has the keyword force=True.
Error in_python_words(Error e) {
    for (std::size_t at = e.message.find("--force"); at != std::string::npos; at = e.message.find("--force", at))
        e.message.replace(at, 7, "force=True");
    return e;
}
}  // namespace

void raise(const Error& error) {
    const Error e = in_python_words(error);
    py::object type = py::module_::import("ellipsa").attr("Error");
    py::object inst = type(e.format());
    inst.attr("file") = e.file.empty() ? py::object(py::none()) : py::object(py::str(e.file));
    inst.attr("line") = e.line > 0 ? py::object(py::int_(e.line)) : py::object(py::none());
    inst.attr("column") = e.column > 0 ? py::object(py::int_(e.column)) : py::object(py::none());
    inst.attr("message") = e.message;
    PyErr_SetObject(type.ptr(), inst.ptr());
    throw py::error_already_set();
}

std::size_t frequency_index(const Pattern& p, int index, const std::optional<double>& frequency_hz) {
    const FarFieldSet& s = p.set;
    if (frequency_hz) return take(find_frequency(s, *frequency_hz, p.path));
    if (index < 0 || std::size_t(index) >= s.frequencies.size())
        throw py::index_error("frequency index " + std::to_string(index) + " outside 0.." +
                              std::to_string(int(s.frequencies.size()) - 1));
    return std::size_t(index);
}

exports::RenderSize render_size(const std::array<int, 2>& size_px, double dpi) {
    auto r = exports::parse_size(std::to_string(size_px[0]) + "x" + std::to_string(size_px[1]), dpi);
    if (!r) throw py::value_error((r.error().file == "--dpi" ? "dpi: " : "size_px: ") + r.error().message);
    return *r;
}

Component component_named(const std::string& name) {
    Component c;
    if (parse_component(name.c_str(), c)) return c;
    std::string known;
    for (Component k : all_components) known += std::string(known.empty() ? "" : ", ") + to_string(k);
    throw py::value_error("unknown component \"" + name + "\"; expected one of " + known);
}

void check_component(const Pattern& p, Component c) {
    if (auto why = component_unavailable(p.set, c)) raise(Error{p.path, 0, 0, std::string(to_string(c)) + ": " + *why});
}

}  // namespace ellipsa::python
