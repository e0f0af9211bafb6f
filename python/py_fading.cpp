// ellipsa.fading: the random-field simulation (pattern/fading.hpp) of one or more patterns, with
// levels, intervals and distribution curves as numpy arrays (dB where the command line's JSON
// gives dB; the same key names).
#include <cmath>

#include "pattern/fading.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

py::dict levels_dict(const std::vector<LevelEstimate>& levels, const std::string& prefix) {
    const std::size_t n = levels.size();
    py::array_t<double> level(n), ci({py::ssize_t(n), py::ssize_t(2)});
    for (std::size_t k = 0; k < n; ++k) {
        level.mutable_data()[k] = to_db(levels[k].level);
        ci.mutable_data()[2 * k] = to_db(levels[k].ci95.lo), ci.mutable_data()[2 * k + 1] = to_db(levels[k].ci95.hi);
    }
    py::dict d;
    d[py::str(prefix + "levels_db")] = level, d[py::str(prefix + "levels_ci95_db")] = ci;
    return d;
}

// A distribution curve as two arrays: level_db and probability (P(power <= level)).
py::tuple curve(const std::vector<CdfPoint>& c) {
    py::array_t<double> level(c.size()), prob(c.size());
    for (std::size_t k = 0; k < c.size(); ++k) level.mutable_data()[k] = to_db(c[k].level), prob.mutable_data()[k] = c[k].probability;
    return py::make_tuple(level, prob);
}

py::array_t<double> db_array(const std::vector<double>& linear) {
    py::array_t<double> a(linear.size());
    for (std::size_t k = 0; k < linear.size(); ++k) a.mutable_data()[k] = to_db(linear[k]);
    return a;
}

py::dict antenna_dict(const SimulatedAntenna& a) {
    py::dict d = levels_dict(a.levels, "");
    d["mean_db"] = to_db(a.mean), d["mean_ci95_db"] = py::make_tuple(to_db(a.mean_ci95.lo), to_db(a.mean_ci95.hi));
    d["analytic_mean_db"] = a.analytic_mean ? py::object(py::float_(to_db(*a.analytic_mean))) : py::none();
    d["k_factor"] = opt(a.analytic_k);
    d["analytic_levels_db"] = db_array(a.analytic_levels);
    d["level_1pct_db"] = to_db(a.level_1pct.level), d["fade_depth_db"] = a.fade_depth_db;
    d["cdf"] = curve(a.cdf), d["analytic_cdf"] = curve(a.analytic_cdf);
    return d;
}

py::dict pair_dict(const SimulatedPair& q) {
    py::dict d;
    d["power_correlation"] = q.power_correlation;
    d["power_correlation_ci95"] = py::make_tuple(q.power_correlation_ci95.lo, q.power_correlation_ci95.hi);
    d["complex_correlation_squared"] = q.complex_correlation_squared, d["ecc"] = opt(q.analytic_ecc);
    d["power_correlation_expected"] = opt(q.expected_power_correlation);
    for (auto [k, v] : levels_dict(q.selection, "selection_")) d[k] = v;
    for (auto [k, v] : levels_dict(q.mrc, "mrc_")) d[k] = v;
    std::vector<double> sel, mrc;
    if (q.analytic)
        for (const OutageFigures& f : q.analytic->outages) sel.push_back(f.selection_level), mrc.push_back(f.mrc_level);
    d["analytic_selection_levels_db"] = db_array(sel), d["analytic_mrc_levels_db"] = db_array(mrc);
    d["selection_cdf"] = curve(q.selection_cdf), d["mrc_cdf"] = curve(q.mrc_cdf);
    d["analytic_selection_cdf"] = curve(q.analytic_selection_cdf), d["analytic_mrc_cdf"] = curve(q.analytic_mrc_cdf);
    return d;
}

// dominant = {"theta_deg": .., "phi_deg": .., "k_factor": linear, "polarisation": "vertical"}.
std::optional<DominantWave> dominant_of(const std::optional<py::dict>& d) {
    if (!d) return std::nullopt;
    DominantWave w;
    w.theta_deg = d->contains("theta_deg") ? (*d)["theta_deg"].cast<double>() : 90.0;
    w.phi_deg = d->contains("phi_deg") ? (*d)["phi_deg"].cast<double>() : 0.0;
    if (!d->contains("k_factor")) throw py::value_error("dominant: expected a k_factor (linear, >= 0)");
    w.k_factor = (*d)["k_factor"].cast<double>();
    const std::string pol = d->contains("polarisation") ? (*d)["polarisation"].cast<std::string>() : "vertical";
    WavePolarisation p;
    if (!parse_wave_polarisation(pol, p))
        throw py::value_error("dominant: polarisation expected vertical, horizontal, slant+45, slant-45, rhcp or lhcp");
    if (!(w.theta_deg >= 0 && w.theta_deg <= 180) || !std::isfinite(w.phi_deg))
        throw py::value_error("dominant: expected theta_deg 0..180 and a finite phi_deg");
    w.field = incoming_field(p, w.theta_deg, w.phi_deg);
    return w;
}

py::dict fading(const std::vector<PatternPtr>& patterns, const PyEnvironment& e, const std::vector<int>& indices,
                std::size_t realisations, std::uint64_t seed, int waves, const std::vector<double>& outages,
                std::optional<double> random_tilt_max_deg, const std::optional<py::dict>& dominant, int threads,
                int cdf_points) {
    FadingOptions o;
    o.realisations = realisations, o.seed = seed, o.waves = waves, o.outages = outages;
    o.random_tilt_max_deg = random_tilt_max_deg, o.dominant = dominant_of(dominant);
    o.threads = threads, o.cdf_points = cdf_points;
    if (!indices.empty() && indices.size() != patterns.size())
        throw py::value_error("indices: expected one frequency index per pattern");
    std::vector<FadingAntenna> in;
    for (std::size_t k = 0; k < patterns.size(); ++k)
        in.push_back({&patterns[k]->set, frequency_index(*patterns[k], indices.empty() ? 0 : indices[k], std::nullopt)});
    check(validate(o, in.size()));
    Result<FadingResult> r = Error{};
    {
        py::gil_scoped_release unlocked;
        r = simulate_fading(in, e.chosen.environment, o);
    }
    const FadingResult f = take(std::move(r));
    py::dict d;
    d["realisations"] = f.realisations, d["seed"] = f.seed, d["waves"] = f.waves;
    d["vertical_waves"] = f.vertical_waves, d["horizontal_waves"] = f.horizontal_waves;
    d["outages"] = copy(outages);
    py::list ants;
    for (const SimulatedAntenna& a : f.antennas) ants.append(antenna_dict(a));
    d["patterns"] = ants;
    if (f.pair) {
        if (*f.pair)
            d["pair"] = pair_dict(**f.pair);
        else
            d["pair"] = py::dict(py::arg("unavailable_reason") = (*f.pair).error().message);
    }
    py::list cautions;
    for (const char* c : outage_cautions) cautions.append(c);
    d["cautions"] = cautions;
    return d;
}

}  // namespace

void bind_fading(py::module_& m) {
    m.def("fading", &fading, py::arg("patterns"), py::arg("environment"), py::kw_only(),
          py::arg("indices") = std::vector<int>{}, py::arg("realisations") = std::size_t(100000), py::arg("seed") = 1,
          py::arg("waves") = 100, py::arg("outages") = std::vector<double>{0.01, 0.1, 0.5},
          py::arg("random_tilt_max_deg") = py::none(), py::arg("dominant") = py::none(), py::arg("threads") = 1,
          py::arg("cdf_points") = 200,
          "The random-field simulation `ellipsa fading` runs: realisations of `waves` plane waves drawn from the\n"
          "environment, received by every pattern (indices: the frequency of each). Per pattern: mean_db with its\n"
          "95 % interval, levels_db per outage with intervals, fade_depth_db, cdf = (level_db, probability) and\n"
          "the closed-form references; for two patterns \"pair\": power correlation, ecc, selection and MRC levels\n"
          "and curves. random_tilt_max_deg turns the device at random (180: any orientation); dominant adds a\n"
          "Rician wave {theta_deg, phi_deg, k_factor (linear), polarisation}. The same seed gives the same result\n"
          "for any thread count.");
}

}  // namespace ellipsa::python
