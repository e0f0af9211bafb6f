// Environments (the command line's own choice of words, cli/environment_options), MEG, orientation
// sweep, ECC, the diversity study (pattern/diversity_study), exact two-branch combining
// (pattern/combining) and the random-field simulation (pattern/fading). Key names follow the
// command line's JSON; distributions and per-outage values are numpy arrays.
#include <algorithm>
#include <cmath>
#include <thread>

#include "cli/environment_options.hpp"
#include "cli/load.hpp"
#include "cli/rank_json.hpp"
#include "cli/usage.hpp"
#include "pattern/diversity_study.hpp"
#include "pattern/fading.hpp"
#include "python/py_common.hpp"

namespace ellipsa::python {

namespace {

py::object db_or_none(const std::optional<double>& v) { return v ? py::object(py::float_(to_db(*v))) : py::none(); }

PyEnvironment environment(const std::string& model, const std::optional<std::string>& xpr_db,
                          std::optional<double> v_mean_deg, std::optional<double> v_spread_deg,
                          std::optional<double> h_mean_deg, std::optional<double> h_spread_deg,
                          const std::optional<std::string>& profile, const std::string& profile_measure) {
    cli::EnvironmentOptions o;
    o.environment = model, o.xpr = xpr_db.value_or(""), o.profile = profile.value_or("");
    o.v_mean = v_mean_deg, o.v_spread = v_spread_deg, o.h_mean = h_mean_deg, o.h_spread = h_spread_deg;
    if (profile_measure != "solid-angle" && profile_measure != "elevation")
        throw py::value_error("profile_measure: expected \"solid-angle\" or \"elevation\"");
    o.profile_measure = profile_measure;
    auto built = cli::chosen_environment(o);
    if (auto* u = std::get_if<cli::UsageError>(&built)) throw py::value_error(u->message);
    if (auto* e = std::get_if<Error>(&built)) raise(*e);
    return {std::get<ChosenEnvironment>(built)};
}

py::dict environment_dict(const PyEnvironment& e) {
    cli::JsonWriter j;
    j.begin_object();
    cli::write_environment_json(j, e.chosen);
    j.end_object();
    return py::module_::import("json").attr("loads")(j.str())["environment"];
}

py::list presets() {
    py::list l;
    for (const EnvironmentPreset& p : environment_presets()) {
        py::dict d;
        d["name"] = p.name, d["description"] = p.description, d["model"] = to_string(p.model), d["xpr_db"] = p.xpr_db;
        if (p.model == EnvironmentModel::gaussian)
            d["v_mean_deg"] = p.v_mean_deg, d["v_spread_deg"] = p.v_spread_deg, d["h_mean_deg"] = p.h_mean_deg,
            d["h_spread_deg"] = p.h_spread_deg;
        d["source"] = p.source;
        l.append(d);
    }
    return l;
}

py::dict meg_dict(const MegFigures& m) {
    py::dict d;
    d["meg_db"] = to_db(m.meg), d["meg"] = m.meg;
    d["meg_vertical_db"] = db_or_none(m.meg_vertical), d["meg_horizontal_db"] = db_or_none(m.meg_horizontal);
    d["vertical_share"] = opt(m.vertical_share), d["horizontal_share"] = opt(m.horizontal_share);
    d["balanced_share"] = opt(m.balanced_share), d["sampled_share"] = m.sampled_share;
    d["assumption"] = m.assumption.empty() ? py::object(py::none()) : py::object(py::str(m.assumption));
    d["notes"] = m.notes;
    return d;
}

py::dict orientation_dict(const OrientationFigures& o) {
    py::dict d;
    const std::size_t n = o.samples.size();
    py::array_t<double> tilt(n), roll(n), meg(n), v(n), h(n);
    for (std::size_t k = 0; k < n; ++k) {
        const OrientationSample& s = o.samples[k];
        tilt.mutable_data()[k] = s.tilt_deg, roll.mutable_data()[k] = s.roll_deg, meg.mutable_data()[k] = to_db(s.meg);
        v.mutable_data()[k] = to_db(s.meg_vertical), h.mutable_data()[k] = to_db(s.meg_horizontal);
    }
    d["tilt_deg"] = tilt, d["roll_deg"] = roll, d["meg_db"] = meg, d["meg_vertical_db"] = v, d["meg_horizontal_db"] = h;
    d["min_db"] = to_db(o.min), d["median_db"] = to_db(o.median), d["max_db"] = to_db(o.max);
    d["random_orientation_mean_db"] = to_db(o.random_mean), d["random_orientation_p10_db"] = to_db(o.random_p10);
    d["as_given_db"] = to_db(o.samples.front().meg);
    d["worst"] = py::make_tuple(o.worst.tilt_deg, o.worst.roll_deg, to_db(o.worst.meg));
    d["best"] = py::make_tuple(o.best.tilt_deg, o.best.roll_deg, to_db(o.best.meg));
    return d;
}

py::dict combining_dict(const CombiningFigures& c) {
    const std::size_t n = c.outages.size();
    const char* names[] = {"outage", "selection_db", "mrc_db", "selection_effective_db", "mrc_effective_db",
                           "selection_level_db", "mrc_level_db", "branch1_level_db", "branch2_level_db", "ideal_level_db"};
    std::vector<py::array_t<double>> a;
    for (int k = 0; k < 10; ++k) a.emplace_back(n);
    for (std::size_t i = 0; i < n; ++i) {
        const OutageFigures& o = c.outages[i];
        const double v[] = {o.outage, o.selection_gain_db, o.mrc_gain_db, o.selection_effective_gain_db,
                            o.mrc_effective_gain_db, to_db(o.selection_level), to_db(o.mrc_level),
                            to_db(o.branch1_level), to_db(o.branch2_level), to_db(o.ideal_level)};
        for (int k = 0; k < 10; ++k) a[k].mutable_data()[i] = v[k];
    }
    py::dict d;
    for (int k = 0; k < 10; ++k) d[names[k]] = a[k];
    d["eigenvalues"] = py::make_tuple(c.eigenvalues.l1, c.eigenvalues.l2);
    d["method"] = combining_method;
    return d;
}

py::dict meg(const Pattern& p, const PyEnvironment& e, int index, std::optional<double> frequency_hz) {
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    return meg_dict(take(mean_effective_gain(p.set, fi, e.chosen.environment)));
}

py::dict orientations(const Pattern& p, const PyEnvironment& e, int index, std::optional<double> frequency_hz,
                      double tilt_step_deg, double tilt_max_deg, double roll_step_deg) {
    const std::size_t fi = frequency_index(p, index, frequency_hz);
    const OrientationSweep sweep{tilt_step_deg, tilt_max_deg, roll_step_deg};
    check(validate(sweep));
    Result<OrientationFigures> r = Error{};
    {
        py::gil_scoped_release unlocked;
        r = orientation_robustness(p.set, fi, e.chosen.environment, sweep);
    }
    return orientation_dict(take(std::move(r)));
}

py::dict ecc(const Pattern& a, const Pattern& b, const PyEnvironment& e, int index_a, int index_b) {
    const CorrelationFigures c = take(envelope_correlation(a.set, frequency_index(a, index_a, std::nullopt), b.set,
                                                           frequency_index(b, index_b, std::nullopt), e.chosen.environment));
    py::dict d;
    d["ecc"] = c.ecc, d["diversity_gain_approximation_db"] = c.approximate_gain_db;
    d["sampled_share"] = c.sampled_share, d["resampled"] = c.resampled;
    return d;
}

py::dict combine(double g1, double g2, double rho, const std::vector<double>& outages) {
    return combining_dict(take(combine_two_branches(BranchPair{g1, g2, rho}, outages)));
}

// A distribution function of the combiners over an array of levels (linear).
py::array_t<double> cdf(py::array_t<double, py::array::c_style | py::array::forcecast> x, double g1, double g2, double rho, int which) {
    const BranchPair b{g1, g2, rho};
    check(validate(b));
    py::array_t<double> out(std::vector<py::ssize_t>(x.shape(), x.shape() + x.ndim()));
    const double* xs = x.data();
    for (py::ssize_t k = 0; k < x.size(); ++k)
        out.mutable_data()[k] = which == 0 ? selection_cdf(xs[k], b) : which == 1 ? mrc_cdf(xs[k], b) : rayleigh_cdf(xs[k], g1);
    return out;
}

// The diversity study of one or two patterns: per pattern and frequency MEG (and the orientation
// sweep), with two patterns per frequency of the first the ECC, MEG ratio and exact combining.
py::dict diversity(const std::vector<PatternPtr>& patterns, const PyEnvironment& e, std::optional<double> frequency_hz,
                   bool with_orientations, double tilt_step_deg, double tilt_max_deg, double roll_step_deg,
                   const std::vector<double>& outages) {
    DiversityOptions o;
    o.orientations = with_orientations, o.sweep = {tilt_step_deg, tilt_max_deg, roll_step_deg};
    o.frequency_hz = frequency_hz, o.outages = outages;
    if (with_orientations) check(validate(o.sweep));
    check(validate_outages(outages));
    std::vector<StudyPattern> in;
    for (const PatternPtr& p : patterns) in.push_back({&p->set, p->path, {}});
    Result<DiversityStudy> r = Error{};
    {
        py::gil_scoped_release unlocked;
        r = study_diversity(e.chosen.environment, o, in);
    }
    const DiversityStudy st = take(std::move(r));
    py::dict d;
    py::list ps;
    for (const std::vector<FrequencyStudy>& pattern : st.patterns) {
        py::list rs;
        for (const FrequencyStudy& f : pattern) {
            py::dict x = f.meg ? meg_dict(*f.meg) : py::dict();
            if (!f.meg) x["meg_db"] = py::none(), x["unavailable_reason"] = f.meg.error().message;
            x["frequency_hz"] = f.frequency_hz;
            if (f.orientations)
                x["orientations"] = *f.orientations ? py::object(orientation_dict(**f.orientations))
                                                    : py::object(py::str((*f.orientations).error().message));
            rs.append(x);
        }
        ps.append(rs);
    }
    d["patterns"] = ps;
    py::list pairs;
    for (const PairStudy& q : st.pairs) {
        py::dict x;
        x["frequency_hz"] = q.frequency_hz, x["frequency2_hz"] = q.frequency2_hz;
        x["ecc"] = q.correlation ? py::object(py::float_(q.correlation->ecc)) : py::none();
        if (!q.correlation) x["unavailable_reason"] = q.correlation.error().format();
        x["meg_ratio_db"] = opt(q.meg_ratio_db), x["diversity_gain_db"] = opt(q.selection_gain_1pct_db);
        x["combining"] = q.combining ? py::object(combining_dict(*q.combining)) : py::none();
        pairs.append(x);
    }
    d["pairs"] = pairs;
    d["environment"] = environment_dict(e);
    return d;
}

// The environments of a ranking: the ones given, else every preset (as `ellipsa rank` without
// --environment).
std::vector<ChosenEnvironment> rank_environments(const std::optional<std::vector<PyEnvironment>>& given) {
    std::vector<ChosenEnvironment> envs;
    if (given) {
        if (given->empty()) throw py::value_error("environments: expected at least one ellipsa.Environment");
        for (const PyEnvironment& e : *given) envs.push_back(e.chosen);
        return envs;
    }
    for (const EnvironmentPreset& p : environment_presets()) {
        cli::EnvironmentOptions o;
        o.environment = p.name;
        envs.push_back(std::get<ChosenEnvironment>(cli::chosen_environment(o)));
    }
    return envs;
}

// One pattern of a ranking at the frequency the command would use (cli::pick_frequency).
RankCandidate rank_candidate(const Pattern& p, const std::optional<double>& frequency_hz) {
    const std::string name = p.path.empty() ? label_of(p.set) : p.path;
    check(cli::refuse_cuts(p.set, name, "ranking (MEG in each environment)"));
    return {&p.set, p.path, take(cli::pick_frequency(p.set, frequency_hz, name, false))};
}

// The ranking as `ellipsa rank --json` prints it (cli/rank_json.hpp, the same code): the candidates
// in every environment against the reference (default: the lossless vertical half-wave dipole on
// the first candidate's grid).
py::dict rank(const std::vector<PatternPtr>& candidates, const std::optional<std::vector<PyEnvironment>>& environments,
              const std::optional<PatternPtr>& reference, const std::string& score, double outage, double tilt_step_deg,
              double tilt_max_deg, double roll_step_deg, bool orientations, std::optional<double> frequency_hz,
              std::optional<int> threads) {
    if (candidates.empty()) throw py::value_error("candidates: expected at least one ellipsa.Pattern");
    RankOptions o;
    if (auto bad = cli::rank_score_problem(score, o.score)) throw py::value_error("score: " + *bad);
    if (const std::string bad = cli::check_number(cli::rank_outage_check(), outage); !bad.empty())
        throw py::value_error("--outage: " + bad);  // the command line's words
    o.outage = outage, o.sweep = {tilt_step_deg, tilt_max_deg, roll_step_deg}, o.orientations = orientations;
    o.threads = threads.value_or(int(std::clamp(std::thread::hardware_concurrency(), 1u, 4u)));
    check(validate(o));
    const std::vector<ChosenEnvironment> envs = rank_environments(environments);
    std::vector<RankCandidate> cands;
    for (const PatternPtr& p : candidates) cands.push_back(rank_candidate(*p, frequency_hz));
    FarFieldSet dipole;
    RankCandidate ref{&dipole, "reference dipole", 0};
    std::string label = reference_dipole_description;
    if (reference && *reference) {
        ref = rank_candidate(**reference, frequency_hz);
        label = (*reference)->path.empty() ? label_of((*reference)->set) : (*reference)->path;
    } else {
        dipole = reference_dipole(cands[0].set->grid, cands[0].set->frequencies[cands[0].freq_index].frequency_hz);
    }
    Result<cli::RankRun> r = Error{};
    {
        py::gil_scoped_release unlocked;
        r = cli::rank_run(cands, ref, label, envs, o);
    }
    const cli::RankRun run = take(std::move(r));
    return py::module_::import("json").attr("loads")(cli::rank_json(envs, cands, run.ranking, run.labels));
}

}  // namespace

void bind_diversity(py::module_& m) {
    py::class_<PyEnvironment>(m, "Environment",
        "A multipath environment (pattern/environment.hpp): azimuth-uniform densities of incoming vertical and\n"
        "horizontal power and their ratio XPR. Made by ellipsa.environment().")
        .def_property_readonly("name", [](const PyEnvironment& e) { return e.chosen.environment.name; })
        .def_property_readonly("description", [](const PyEnvironment& e) { return describe(e.chosen.environment); })
        .def("info", &environment_dict, "The \"environment\" object of the command line's JSON, as a dict.")
        .def("__repr__", [](const PyEnvironment& e) { return "<ellipsa.Environment " + describe(e.chosen.environment) + ">"; });
    m.def("environment", &environment, py::arg("model") = "", py::kw_only(), py::arg("xpr_db") = py::none(),
          py::arg("v_mean_deg") = py::none(), py::arg("v_spread_deg") = py::none(), py::arg("h_mean_deg") = py::none(),
          py::arg("h_spread_deg") = py::none(), py::arg("profile") = py::none(), py::arg("profile_measure") = "solid-angle",
          "An environment, in the command line's words (--environment, --xpr, --v-mean ...): a preset name\n"
          "(environment_presets()), \"uniform\", \"gaussian\" (all four angles) or \"profile\" (a table file\n"
          "elevation_deg,p_v,p_h). xpr_db is text: a number of dB, \"inf\" or \"-inf\". Wrong combinations raise\n"
          "ValueError; a table that cannot be read raises ellipsa.Error with file:line:column.");
    m.def("environment_presets", &presets, "The named environments, each with its numbers and their source.");
    m.def("meg", &meg, py::arg("pattern"), py::arg("environment"), py::arg("index") = 0, py::kw_only(),
          py::arg("frequency_hz") = py::none(),
          "Mean effective gain (Taga 1990) of one frequency: meg (linear), meg_db, its vertical and horizontal\n"
          "parts, shares, balanced_share, sampled_share, assumption (how relative data were scaled), notes.");
    m.def("orientations", &orientations, py::arg("pattern"), py::arg("environment"), py::arg("index") = 0, py::kw_only(),
          py::arg("frequency_hz") = py::none(), py::arg("tilt_step_deg") = 15.0, py::arg("tilt_max_deg") = 90.0,
          py::arg("roll_step_deg") = 15.0,
          "MEG of the antenna turned by roll about its own z axis, then tilt about the world's x axis: arrays\n"
          "tilt_deg, roll_deg, meg_db (and its parts), with min, median, max and the random-orientation mean and\n"
          "90 % level (dB).");
    m.def("ecc", &ecc, py::arg("a"), py::arg("b"), py::arg("environment"), py::arg("index_a") = 0, py::arg("index_b") = 0,
          "Envelope correlation (Vaughan & Andersen 1987, XPR-weighted) of two patterns in an environment.");
    m.def("diversity", &diversity, py::arg("patterns"), py::arg("environment"), py::kw_only(),
          py::arg("frequency_hz") = py::none(), py::arg("orientations") = false, py::arg("tilt_step_deg") = 15.0,
          py::arg("tilt_max_deg") = 90.0, py::arg("roll_step_deg") = 15.0,
          py::arg("outages") = std::vector<double>(std::begin(default_outages), std::end(default_outages)),
          "The study `ellipsa diversity` makes of one or two patterns: \"patterns\" (per pattern, per frequency:\n"
          "MEG and, with orientations=True, the sweep) and, for two, \"pairs\" (per frequency of the first: ecc,\n"
          "meg_ratio_db, diversity_gain_db = exact selection gain at 1 %, and the combining figures).");
    m.def("combine", &combine, py::arg("g1"), py::arg("g2"), py::arg("rho"),
          py::arg("outages") = std::vector<double>(std::begin(default_outages), std::end(default_outages)),
          "Exact two-branch combining in Rayleigh fading (mean branch powers g1, g2 linear, power correlation rho):\n"
          "arrays per outage of the selection and maximal-ratio gains over the stronger branch (apparent) and\n"
          "over an ideal antenna in the isotropic environment (effective), and the levels in dB.");
    m.def("selection_cdf", [](py::array_t<double, py::array::c_style | py::array::forcecast> x, double g1, double g2, double rho) { return cdf(x, g1, g2, rho, 0); },
          py::arg("x"), py::arg("g1"), py::arg("g2"), py::arg("rho"),
          "P(max(|a1|^2, |a2|^2) <= x) for correlated Rayleigh branches, exact (bivariate Rayleigh).");
    m.def("mrc_cdf", [](py::array_t<double, py::array::c_style | py::array::forcecast> x, double g1, double g2, double rho) { return cdf(x, g1, g2, rho, 1); },
          py::arg("x"), py::arg("g1"), py::arg("g2"), py::arg("rho"),
          "P(|a1|^2 + |a2|^2 <= x) for correlated Rayleigh branches, exact (maximal-ratio combining).");
    bind_fading(m);
    m.def("rank", &rank, py::arg("candidates"), py::arg("environments") = py::none(), py::kw_only(),
          py::arg("reference") = py::none(), py::arg("score") = "mounted", py::arg("outage") = 0.01,
          py::arg("tilt_step_deg") = 15.0, py::arg("tilt_max_deg") = 180.0, py::arg("roll_step_deg") = 15.0,
          py::arg("orientations") = true, py::arg("frequency_hz") = py::none(), py::arg("threads") = py::none(),
          "The ranking `ellipsa rank --json` prints (the same code): every candidate in every environment (MEG, its\n"
          "V and H parts, orientation statistics, fading levels at the outage as mounted and with random\n"
          "orientation), its advantage over the reference (default: a lossless vertical half-wave dipole on the\n"
          "first candidate's grid) and the score (\"mounted\", \"random\" or \"worst\": the mean advantage over the\n"
          "environments, dB), rows sorted best first. environments: default every preset. frequency_hz: of every\n"
          "pattern (nearest within 0.5 %; default the middle one of each, as the command line). The result does\n"
          "not depend on threads (default: up to 4).");
}

}  // namespace ellipsa::python
