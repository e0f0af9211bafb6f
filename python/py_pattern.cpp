// ellipsa.read, ellipsa.Pattern (grid, fields, powers, polarisation as numpy arrays), writing the
// schema, and the closed-form reference antennas.
#include <array>
#include <cmath>
#include <cstdio>

#include "cli/load.hpp"
#include "exports/figure_text.hpp"
#include "importers/far_field_csv.hpp"
#include "pattern/component_phase.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/install.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/reference.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

// One import option (map, assume, scale, offset): a string in the command line's own syntax
// ("A=b,C=d"; a map may be "@FILE") or a dict.
using OptionArg = std::optional<std::variant<std::string, py::dict>>;

std::string text_of(const OptionArg& a) {
    return a && std::holds_alternative<std::string>(*a) ? std::get<std::string>(*a) : std::string();
}

// The reader's options: strings through the command line's own parser (the same messages, which
// name --map, --assume, ...), dict entries named after the keyword they came in ("map", ...).
CsvReadOptions read_options(const OptionArg& map, const std::optional<std::string>& map_file, const OptionArg& assume,
                            const OptionArg& scale, const OptionArg& offset, int threads) {
    cli::FileOptions lo{text_of(map), map_file.value_or(""), text_of(assume), text_of(scale), text_of(offset), {}, {}};
    CsvReadOptions ro = take(cli::read_options(lo));
    auto each = [](const OptionArg& a, auto add) {
        if (a && std::holds_alternative<py::dict>(*a))
            for (auto [k, v] : std::get<py::dict>(*a)) add(py::str(k).cast<std::string>(), v);
    };
    each(map, [&](std::string k, py::handle v) { ro.column_map.push_back({k, py::str(v), {"map", 0}}); });
    each(assume, [&](std::string k, py::handle v) { ro.settings.push_back(CsvSetting{k, py::str(v), {"assume", 0}}); });
    each(scale, [&](std::string k, py::handle v) { ro.scale.push_back({k, v.cast<double>(), {"scale", 0}}); });
    each(offset, [&](std::string k, py::handle v) { ro.offset.push_back({k, v.cast<double>(), {"offset", 0}}); });
    ro.threads = threads;
    return ro;
}

// The mounting arguments (up, rotate, phase_centre) in the command line's text forms, through its
// own parser (cli/mounting_options.hpp): up "+x" or "THETA,PHI"; rotate "z:30,x:10" or a sequence
// of (axis, degrees); phase_centre "auto" or (x, y, z) metres. Errors name the keyword.
using TurnsArg = std::optional<std::variant<std::string, std::vector<std::pair<std::string, double>>>>;
using CentreArg = std::optional<std::variant<std::string, std::array<double, 3>>>;

std::string exact_text(double v) {  // reads back to the same double
    char b[40];
    std::snprintf(b, sizeof b, "%.17g", v);
    return b;
}

InstallRequest mounting_request(const std::optional<std::string>& up, const TurnsArg& rotate, const CentreArg& centre) {
    cli::MountingOptions o;
    o.up = up.value_or("");
    if (rotate && std::holds_alternative<std::string>(*rotate)) o.rotate = std::get<std::string>(*rotate);
    if (rotate && !std::holds_alternative<std::string>(*rotate))
        for (const auto& [axis, deg] : std::get<1>(*rotate))
            o.rotate += (o.rotate.empty() ? "" : ",") + axis + ":" + exact_text(deg);
    if (centre && std::holds_alternative<std::string>(*centre)) o.phase_centre = std::get<std::string>(*centre);
    if (centre && !std::holds_alternative<std::string>(*centre)) {
        const auto& c = std::get<1>(*centre);
        o.phase_centre = exact_text(c[0]) + "," + exact_text(c[1]) + "," + exact_text(c[2]);
    }
    auto q = cli::install_request(o);
    if (q) return *q;
    const std::string& flag = q.error().file;
    raise(Error{flag == "--up" ? "up" : flag == "--rotate" ? "rotate" : "phase_centre", 0, 0, q.error().message});
}

PatternPtr read(const std::string& path, const OptionArg& map, const std::optional<std::string>& map_file,
                const OptionArg& assume, const OptionArg& scale, const OptionArg& offset, int threads,
                const std::optional<std::string>& up, const TurnsArg& rotate, const CentreArg& phase_centre) {
    CsvReadOptions ro = read_options(map, map_file, assume, scale, offset, threads);
    const InstallRequest request = mounting_request(up, rotate, phase_centre);
    Result<FarFieldSet> r = Error{};
    {
        py::gil_scoped_release unlocked;  // reading a large file takes a while; other threads may run
        r = read_far_field_csv(path, ro);
        // Installed as the command line installs it (pattern/install.hpp): the file's own mounting
        // or the one asked for applied, and the phase centres kept for interpolation, so the
        // figures are the command's.
        if (r) {
            auto installed = install_pattern(std::move(*r), request);
            r = installed ? std::move(installed) : Result<FarFieldSet>(Error{path, 0, 0, installed.error().message});
        }
    }
    return std::make_shared<Pattern>(Pattern{take(std::move(r)), path});
}

// A regular axis from sample values: equal steps to a relative 1e-9 of the span.
AngleAxis axis_of(const py::array_t<double, py::array::c_style | py::array::forcecast>& v, const char* name) {
    if (v.ndim() != 1 || v.size() < 1) throw py::value_error(std::string(name) + ": expected a 1-D array of angles");
    const double* x = v.data();
    const py::ssize_t n = v.size();
    AngleAxis a{x[0], n > 1 ? (x[n - 1] - x[0]) / double(n - 1) : 1.0, int(n)};
    for (py::ssize_t i = 0; i < n; ++i)
        if (!std::isfinite(x[i]) || std::abs(x[i] - a.value_deg(int(i))) > 1e-9 * std::max(1.0, std::abs(x[n - 1] - x[0])))
            throw py::value_error(std::string(name) + ": expected equally spaced finite angles in increasing order");
    if (n > 1 && !(a.step_deg > 0)) throw py::value_error(std::string(name) + ": expected increasing angles");
    return a;
}

template <class E>
E enum_named(const std::string& name, std::initializer_list<E> all, const char* what) {
    std::string known;
    for (E e : all) {
        if (name == to_string(e)) return e;
        known += std::string(known.empty() ? "" : ", ") + to_string(e);
    }
    throw py::value_error(std::string("unknown ") + what + " \"" + name + "\"; expected one of " + known);
}

using ComplexArray = py::array_t<cplx, py::array::c_style | py::array::forcecast>;

PatternPtr from_arrays(const py::array_t<double, py::array::c_style | py::array::forcecast>& theta_deg,
                       const py::array_t<double, py::array::c_style | py::array::forcecast>& phi_deg,
                       const ComplexArray& e_theta, const ComplexArray& e_phi, const std::vector<double>& frequencies_hz,
                       const std::string& quantity, const std::string& content, const std::string& name,
                       const std::string& source, const std::string& note, const std::string& ludwig3_reference) {
    FarFieldSet s;
    s.grid = {axis_of(theta_deg, "theta_deg"), axis_of(phi_deg, "phi_deg")};
    const Grid& g = s.grid;
    if (g.theta.start_deg < -1e-9 || g.theta.last_deg() > 180 + 1e-9)
        throw py::value_error("theta_deg: expected angles within 0..180 deg");
    if (g.phi.count > 1 && g.phi.count * g.phi.step_deg > 360 + 1e-9)
        throw py::value_error("phi_deg: expected at most one turn (360 deg not repeated as 0 deg)");
    const std::size_t nf = frequencies_hz.size(), n = g.size();
    for (const ComplexArray* a : {&e_theta, &e_phi}) {
        const bool shaped = (a->ndim() == 3 && std::size_t(a->shape(0)) == nf && a->shape(1) == g.theta.count &&
                             a->shape(2) == g.phi.count) ||
                            (a->ndim() == 2 && nf == 1 && a->shape(0) == g.theta.count && a->shape(1) == g.phi.count);
        if (!shaped)
            throw py::value_error("e_theta, e_phi: expected shape (frequencies, theta, phi) = (" + std::to_string(nf) +
                                  ", " + std::to_string(g.theta.count) + ", " + std::to_string(g.phi.count) + ")");
    }
    s.quantity = enum_named(quantity, {Quantity::gain, Quantity::directivity, Quantity::relative}, "quantity");
    s.content = enum_named(content, {FieldContent::complex, FieldContent::magnitude_only, FieldContent::total_only},
                           "content");
    if (ludwig3_reference != "x" && ludwig3_reference != "y")
        throw py::value_error("ludwig3_reference: expected \"x\" or \"y\"");
    s.ludwig3_reference = ludwig3_reference == "x" ? Ludwig3Reference::x : Ludwig3Reference::y;
    s.name = name, s.source = source, s.note = note;
    for (std::size_t f = 0; f < nf; ++f) {
        FarField ff;
        ff.frequency_hz = frequencies_hz[f];
        ff.e_theta.assign(e_theta.data() + f * n, e_theta.data() + (f + 1) * n);
        ff.e_phi.assign(e_phi.data() + f * n, e_phi.data() + (f + 1) * n);
        for (std::size_t k = 0; k < n; ++k)
            if (!std::isfinite(std::abs(ff.e_theta[k])) || !std::isfinite(std::abs(ff.e_phi[k])))
                throw py::value_error("e_theta, e_phi: expected finite values");
        s.frequencies.push_back(std::move(ff));
    }
    if (nf == 0) throw py::value_error("frequencies_hz: expected at least one frequency (0 when unknown)");
    std::string label = label_of(s);
    return std::make_shared<Pattern>(Pattern{std::move(s), std::move(label)});
}

void write(const Pattern& p, const std::string& path, const std::optional<std::string>& family, bool force) {
    CsvWriteOptions w;
    w.overwrite = force;
    if (family && !parse_csv_family(*family, w.family))
        throw py::value_error("unknown family \"" + *family + "\"");
    if (!family) w.family = natural_family(p.set);
    check(write_far_field_csv(p.set, path, w));
}

PatternPtr synth(const std::string& kind, double length_wl, double circumference_wl, double phase_deg,
                 std::array<double, 3> rotate_deg, double step_deg, double frequency_hz) {
    ReferenceAntenna a;
    if (!parse_reference_kind(kind, a.kind))
        throw py::value_error("unknown kind \"" + kind + "\"; expected short-dipole, dipole, small-loop, loop or crossed-dipoles");
    const double n = 180.0 / step_deg;
    if (!(step_deg >= 0.05 && step_deg <= 90) || std::abs(n - std::round(n)) > 1e-9)
        throw py::value_error("step_deg: expected a step of 0.05..90 deg that divides 180 deg evenly");
    if (!(length_wl > 0) || !(circumference_wl > 0) || !(frequency_hz > 0) || !std::isfinite(phase_deg))
        throw py::value_error("expected a positive length, circumference and frequency and a finite phase");
    a.length_wl = length_wl, a.circumference_wl = circumference_wl, a.phase_deg = phase_deg;
    a.orientation = rotation_xyz_deg(rotate_deg[0], rotate_deg[1], rotate_deg[2]);
    FarFieldSet s = synthesize(a, step_deg, frequency_hz);
    std::string label = label_of(s);
    return std::make_shared<Pattern>(Pattern{std::move(s), std::move(label)});
}

py::array angles(const AngleAxis& a) {
    py::array_t<double> v(a.count);
    for (int i = 0; i < a.count; ++i) v.mutable_data()[i] = a.value_deg(i);
    return v;
}

py::dict grid_dict(const Grid& g) {
    py::dict d;
    d["theta_start_deg"] = g.theta.start_deg, d["theta_step_deg"] = g.theta.step_deg, d["theta_count"] = g.theta.count;
    d["phi_start_deg"] = g.phi.start_deg, d["phi_step_deg"] = g.phi.step_deg, d["phi_count"] = g.phi.count;
    return d;
}

// E_theta or E_phi of one frequency as a (theta, phi) complex view of the core's own array.
py::array field_view(py::object self, bool theta, int index, std::optional<double> frequency_hz) {
    const Pattern& p = self.cast<const Pattern&>();
    const FarFieldSet& s = p.set;
    const FarField& f = s.frequencies[frequency_index(p, index, frequency_hz)];
    return view((theta ? f.e_theta : f.e_phi).data(), {s.grid.theta.count, s.grid.phi.count}, self);
}

py::array power(const Pattern& p, const std::string& component, int index, std::optional<double> frequency_hz, bool db) {
    const FarFieldSet& s = p.set;
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    const Component c = component_named(component);
    check_component(p, c);
    py::array_t<double> out({s.grid.theta.count, s.grid.phi.count});
    component_power_grid(s, fi, c, out.mutable_data());
    if (db)
        for (py::ssize_t k = 0; k < out.size(); ++k) out.mutable_data()[k] = to_db(out.data()[k]);
    return out;
}

// Arrays of every basis and polarisation figure, filled one sample at a time from decompose()
// (the one definition the command line and the viewer use).
class StateArrays {
public:
    explicit StateArrays(std::vector<py::ssize_t> shape) : sense_(shape) {
        for (int k = 0; k < 6; ++k) cx_.emplace_back(shape);
        for (int k = 0; k < 7; ++k) re_.emplace_back(shape);
        for (Component c : all_components)
            if (has_phase(c)) phase_.emplace_back(c, py::array_t<double>(shape));
    }
    // The phase of each component (the keys of `ellipsa probe --json`: theta_phase_deg, ...), deg,
    // NaN where it has none (pattern/component_phase.hpp).
    void set_phases(std::size_t k, const FarFieldSet& s, cplx et, cplx ep, double phi_deg) {
        const double cp = std::cos(phi_deg * deg), sp = std::sin(phi_deg * deg);
        for (auto& [c, a] : phase_) a.mutable_data()[k] = component_phase_deg(et, ep, cp, sp, s.ludwig3_reference, c);
    }
    void set(std::size_t k, const PolarisationState& st) {
        const cplx c[] = {st.e_theta, st.e_phi, st.e_rhcp, st.e_lhcp, st.e_co, st.e_cross};
        const double r[] = {st.axial_ratio, st.axial_ratio_db.value_or(std::nan("")), st.tilt_deg,
                            st.stokes.i, st.stokes.q, st.stokes.u, st.stokes.v};
        for (int j = 0; j < 6; ++j) cx_[j].mutable_data()[k] = c[j];
        for (int j = 0; j < 7; ++j) re_[j].mutable_data()[k] = r[j];
        sense_.mutable_data()[k] = std::int8_t(st.sense);
    }
    // A direction outside the data: NaN everywhere, sense "none".
    void set_missing(std::size_t k) {
        for (auto& a : cx_) a.mutable_data()[k] = cplx(std::nan(""), std::nan(""));
        for (auto& a : re_) a.mutable_data()[k] = std::nan("");
        for (auto& ca : phase_) ca.second.mutable_data()[k] = std::nan("");
        sense_.mutable_data()[k] = std::int8_t(Sense::none);
    }
    // with_fields: also e_theta and e_phi (a probe's interpolated values; the grid has its views).
    py::dict dict(bool with_fields) const {
        const char* cx_names[] = {"e_theta", "e_phi", "e_rhcp", "e_lhcp", "e_co", "e_cross"};
        const char* re_names[] = {"axial_ratio", "axial_ratio_db", "tilt_deg", "stokes_i", "stokes_q", "stokes_u", "stokes_v"};
        py::dict d;
        for (int j = with_fields ? 0 : 2; j < 6; ++j) d[cx_names[j]] = cx_[j];
        for (int j = 0; j < 7; ++j) d[re_names[j]] = re_[j];
        d["sense"] = sense_;
        for (const auto& [c, a] : phase_) d[(std::string(to_string(c)) + "_phase_deg").c_str()] = a;
        return d;
    }

private:
    std::vector<py::array_t<cplx>> cx_;
    std::vector<py::array_t<double>> re_;
    py::array_t<std::int8_t> sense_;
    std::vector<std::pair<Component, py::array_t<double>>> phase_;
};

py::dict polarisation(const Pattern& p, int index, std::optional<double> frequency_hz) {
    const FarFieldSet& s = p.set;
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    if (auto why = polarisation_unavailable(s)) raise(Error{p.path, 0, 0, *why});
    StateArrays out({s.grid.theta.count, s.grid.phi.count});
    const FarField& f = s.frequencies[fi];
    for (int it = 0; it < s.grid.theta.count; ++it)
        for (int ip = 0; ip < s.grid.phi.count; ++ip) {
            const std::size_t k = s.grid.index(it, ip);
            out.set(k, decompose(f.e_theta[k], f.e_phi[k], s.grid.phi.value_deg(ip) * deg, s.ludwig3_reference));
            out.set_phases(k, s, f.e_theta[k], f.e_phi[k], s.grid.phi.value_deg(ip));
        }
    return out.dict(false);
}

// Any directions (arrays broadcast together), interpolated as `ellipsa probe` does.
py::dict probe(const Pattern& p, py::object theta_deg, py::object phi_deg, int index, std::optional<double> frequency_hz) {
    const FarFieldSet& s = p.set;
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    if (auto why = polarisation_unavailable(s)) raise(Error{p.path, 0, 0, *why});
    py::module_ np = py::module_::import("numpy");
    py::tuple b = np.attr("broadcast_arrays")(np.attr("asarray")(theta_deg, "float64"), np.attr("asarray")(phi_deg, "float64"));
    using Doubles = py::array_t<double, py::array::c_style | py::array::forcecast>;
    const Doubles t = Doubles::ensure(b[0]), f = Doubles::ensure(b[1]);
    StateArrays out(std::vector<py::ssize_t>(t.shape(), t.shape() + t.ndim()));
    for (py::ssize_t k = 0; k < t.size(); ++k) {
        const double th = t.data()[k], ph = f.data()[k];
        if (!(th >= 0 && th <= 180) || !std::isfinite(ph))
            throw py::value_error("theta_deg: expected 0..180 deg, phi_deg: finite angles");
        const auto v = interpolate(s, fi, th, ph);
        if (v) {
            out.set(std::size_t(k), decompose(v->e_theta, v->e_phi, ph * deg, s.ludwig3_reference));
            out.set_phases(std::size_t(k), s, v->e_theta, v->e_phi, ph);
        } else
            out.set_missing(std::size_t(k));
    }
    return out.dict(true);
}

}  // namespace

static void bind_pattern_class(py::module_& m) {
    auto p = py::class_<Pattern, PatternPtr>(m, "Pattern",
        "A far-field pattern: one regular theta/phi grid and, per frequency, complex E_theta and E_phi whose\n"
        "|E_theta|^2 + |E_phi|^2 is gain, directivity or relative power (see quantity). Made by read(),\n"
        "synth() or Pattern.from_arrays(); never changed afterwards, so the array views stay valid.");
    p.def_property_readonly("name", [](const Pattern& p) { return p.set.name; })
        .def_property_readonly("path", [](const Pattern& p) { return p.path; },
                               "The file it was read from (its name when made otherwise): errors name it.")
        .def_property_readonly("source", [](const Pattern& p) { return p.set.source; })
        .def_property_readonly("note", [](const Pattern& p) { return p.set.note; })
        .def_property_readonly("mounting", [](const Pattern& p) { return exports::mounting_text(p.set); },
                               "The mounting applied, in the words of every output (\"up +x; rotation resampled ...\");\n"
                               "info()[\"mounting\"] has it as numbers.")
        .def_property_readonly("quantity", [](const Pattern& p) { return to_string(p.set.quantity); },
                               "\"gain\", \"directivity\" or \"relative\".")
        .def_property_readonly("content", [](const Pattern& p) { return to_string(p.set.content); },
                               "\"complex\", \"magnitude-only\" (no phase) or \"total-only\" (|E|^2 only).")
        .def_property_readonly("ludwig3_reference",
                               [](const Pattern& p) { return p.set.ludwig3_reference == Ludwig3Reference::x ? "x" : "y"; })
        .def_property_readonly("frequencies_hz", [](const Pattern& p) {
            std::vector<double> f;
            for (const FarField& ff : p.set.frequencies) f.push_back(ff.frequency_hz);
            return copy(f);
        }, "The frequencies, Hz (0 when unknown), as a new array.")
        .def_property_readonly("theta_deg", [](const Pattern& p) { return angles(p.set.grid.theta); },
                               "The theta samples, deg (the fields' first axis).")
        .def_property_readonly("phi_deg", [](const Pattern& p) { return angles(p.set.grid.phi); },
                               "The phi samples, deg (the fields' second axis).")
        .def_property_readonly("grid", [](const Pattern& p) { return grid_dict(p.set.grid); },
                               "The grid as start, step and count of theta and phi (the keys of `ellipsa info --json`).")
        .def("frequency_index", [](const Pattern& p, double f) { return frequency_index(p, 0, f); }, py::arg("frequency_hz"),
             "The index of the frequency within 0.5 % of frequency_hz; ellipsa.Error lists what the pattern holds.")
        .def("e_theta", [](py::object self, int i, std::optional<double> f) { return field_view(self, true, i, f); },
             py::arg("index") = 0, py::kw_only(), py::arg("frequency_hz") = py::none(),
             "E_theta of one frequency, complex (theta, phi): a read-only view of the pattern's own array (no copy).")
        .def("e_phi", [](py::object self, int i, std::optional<double> f) { return field_view(self, false, i, f); },
             py::arg("index") = 0, py::kw_only(), py::arg("frequency_hz") = py::none(),
             "E_phi of one frequency, complex (theta, phi): a read-only view of the pattern's own array (no copy).")
        .def("power", &power, py::arg("component") = "total", py::arg("index") = 0, py::kw_only(),
             py::arg("frequency_hz") = py::none(), py::arg("db") = false,
             "Power of one component over the grid, (theta, phi), linear in the pattern's quantity (db=True: 10 log10,\n"
             "-inf for zero). Components: ellipsa.COMPONENTS. Raises ellipsa.Error when the data cannot give it.")
        .def("polarisation", &polarisation, py::arg("index") = 0, py::kw_only(), py::arg("frequency_hz") = py::none(),
             "Every grid sample in every basis: a dict of (theta, phi) arrays e_rhcp, e_lhcp, e_co, e_cross (complex),\n"
             "axial_ratio (linear, inf when linear, NaN for a zero field), axial_ratio_db (as reported: NaN when\n"
             "linear or zero), tilt_deg (NaN where undefined), stokes_i/q/u/v, sense (codes into ellipsa.SENSES) and\n"
             "<component>_phase_deg (theta, phi, vertical, horizontal, co, cross, rhcp, lhcp; deg in (-180, 180],\n"
             "relative to the phase reference; NaN where the component has no field).")
        .def("probe", &probe, py::arg("theta_deg"), py::arg("phi_deg"), py::arg("index") = 0, py::kw_only(),
             py::arg("frequency_hz") = py::none(),
             "The field and its polarisation at any directions, as `ellipsa probe` gives them: theta_deg and phi_deg\n"
             "(numbers or arrays, broadcast together) interpolated on the Cartesian field vector; the same keys as\n"
             "polarisation() plus e_theta and e_phi, NaN (sense \"none\") outside the sampled region.")
        .def("write", &write, py::arg("path"), py::kw_only(), py::arg("family") = py::none(), py::arg("force") = false,
             "Write the pattern in the far-field CSV schema (docs/far-field-csv.md). family: \"complex\",\n"
             "\"theta-phi-db-phase\", \"circular-db-phase\", \"ludwig3-db-phase\", \"theta-phi-db\", \"total-db\"\n"
             "(default: the one that keeps everything). An existing file is replaced only with force=True.")
        .def_static("from_arrays", &from_arrays, py::arg("theta_deg"), py::arg("phi_deg"), py::arg("e_theta"),
                    py::arg("e_phi"), py::arg("frequencies_hz") = std::vector<double>{0.0}, py::kw_only(),
                    py::arg("quantity") = "gain", py::arg("content") = "complex", py::arg("name") = "",
                    py::arg("source") = "python", py::arg("note") = "", py::arg("ludwig3_reference") = "x",
                    "A pattern from numpy arrays (copied): equally spaced theta_deg (0..180) and phi_deg (at most\n"
                    "one turn), complex e_theta and e_phi shaped (frequencies, theta, phi) or (theta, phi).")
        .def("__repr__", [](const Pattern& p) {
            return "<ellipsa.Pattern " + (p.set.name.empty() ? std::string("(no name)") : p.set.name) + ", " +
                   std::to_string(p.set.frequencies.size()) + " frequencies, " + std::to_string(p.set.grid.theta.count) +
                   " x " + std::to_string(p.set.grid.phi.count) + " samples>";
        });
}

void bind_pattern(py::module_& m) {
    m.attr("SENSES") = py::make_tuple(to_string(Sense::right), to_string(Sense::left), to_string(Sense::linear),
                                      to_string(Sense::none));
    py::list comps;
    for (Component c : all_components) comps.append(to_string(c));
    m.attr("COMPONENTS") = py::tuple(comps);
    bind_pattern_class(m);
    m.def("read", &read, py::arg("path"), py::kw_only(), py::arg("map") = py::none(), py::arg("map_file") = py::none(),
          py::arg("assume") = py::none(), py::arg("scale") = py::none(), py::arg("offset") = py::none(),
          py::arg("threads") = 0, py::arg("up") = py::none(), py::arg("rotate") = py::none(),
          py::arg("phase_centre") = py::none(),
          "Read a far-field CSV file (docs/far-field-csv.md) into a Pattern, with the command line's import\n"
          "options: map (\"Source=schema,...\", \"@FILE\" or a dict), map_file, assume (\"key=value,...\" or a\n"
          "dict), scale and offset (\"column=number,...\" or a dict). Bad input raises ellipsa.Error with the\n"
          "command line's \"file:line:column: message\" text.\n"
          "The mounting, as --up, --rotate and --phase-centre (docs/conventions.md, \"The mounting frame\"): up, the\n"
          "file's axis that points up (\"+x\" ... \"-z\" or \"THETA,PHI\"; replaces the file's own mounting); rotate,\n"
          "turns about the world axes applied left to right (\"z:30,x:10\" or [(\"z\", 30), (\"x\", 10)]);\n"
          "phase_centre, \"auto\" or (x, y, z) metres in the world frame. Pattern.mounting says what was applied.");
    m.def("synth", &synth, py::arg("kind"), py::kw_only(), py::arg("length_wl") = 0.5, py::arg("circumference_wl") = 1.0,
          py::arg("phase_deg") = -90.0, py::arg("rotate_deg") = std::array<double, 3>{0, 0, 0}, py::arg("step_deg") = 1.0,
          py::arg("frequency_hz") = 2.45e9,
          "A closed-form reference antenna (Balanis ch. 4-5), as `ellipsa synth`: \"short-dipole\", \"dipole\"\n"
          "(length_wl), \"small-loop\", \"loop\" (circumference_wl), \"crossed-dipoles\" (phase_deg of the y current),\n"
          "turned about x, then y, then z by rotate_deg, on a full-sphere grid of step_deg. Normalised so that\n"
          "|E|^2 is the directivity.");
}

}  // namespace ellipsa::python
