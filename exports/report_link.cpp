#include "exports/report_link.hpp"

#include <algorithm>
#include <cstdio>

#include "exports/fading_figure.hpp"
#include "exports/figure_text.hpp"
#include "exports/rank_table.hpp"
#include "exports/report_views.hpp"
#include "pattern/combining.hpp"
#include "pattern/diversity_study.hpp"
#include "pattern/fading.hpp"
#include "pattern/parallel.hpp"
#include "pattern/rank.hpp"

namespace ellipsa::exports {

namespace {

std::string db_ci(double v, const Interval& ci) {
    return fixed(to_db(v), db_decimals) + " [" + fixed(to_db(ci.lo), db_decimals) + ", " + fixed(to_db(ci.hi), db_decimals) + "]";
}

// Simulated against closed form, one row per figure.
void fading_table(Document& doc, const FadingResult& r, const std::vector<LinkInput>& in) {
    DocTable t;
    t.header = {"Figure", "Simulated [95 % interval] (dBi)", "Closed form (dBi)"};
    for (std::size_t a = 0; a < r.antennas.size(); ++a) {
        const SimulatedAntenna& s = r.antennas[a];
        t.rows.push_back({in[a].name + ": mean power", db_ci(s.mean, s.mean_ci95),
                          s.analytic_mean ? fixed(to_db(*s.analytic_mean), db_decimals) + " (MEG)" : "n/a"});
        for (std::size_t k = 0; k < s.levels.size(); ++k)
            t.rows.push_back({in[a].name + ": level at " + outage_text(s.levels[k].outage), db_ci(s.levels[k].level, s.levels[k].ci95),
                              k < s.analytic_levels.size() ? fixed(to_db(s.analytic_levels[k]), db_decimals) + " (Rayleigh)" : "n/a"});
    }
    if (r.pair && *r.pair) {
        const SimulatedPair& q = **r.pair;
        char c[120];
        std::snprintf(c, sizeof c, "%.3f [%.3f, %.3f]", q.power_correlation, q.power_correlation_ci95.lo, q.power_correlation_ci95.hi);
        char e[80];
        if (q.expected_power_correlation)
            std::snprintf(e, sizeof e, "%.3f (ECC); %.3f with %d waves", q.analytic_ecc.value_or(0), *q.expected_power_correlation, r.waves);
        else
            std::snprintf(e, sizeof e, "%.3f (ECC)", q.analytic_ecc.value_or(0));
        t.rows.push_back({"power correlation of A and B", c, q.analytic_ecc ? e : "n/a"});
        for (std::size_t k = 0; k < q.selection.size(); ++k) {
            const OutageFigures* x = q.analytic && k < q.analytic->outages.size() ? &q.analytic->outages[k] : nullptr;
            t.rows.push_back({"selection combining: level at " + outage_text(q.selection[k].outage),
                              db_ci(q.selection[k].level, q.selection[k].ci95), x ? fixed(to_db(x->selection_level), db_decimals) + " (exact)" : "n/a"});
            t.rows.push_back({"maximal-ratio combining: level at " + outage_text(q.mrc[k].outage), db_ci(q.mrc[k].level, q.mrc[k].ci95),
                              x ? fixed(to_db(x->mrc_level), db_decimals) + " (exact)" : "n/a"});
        }
    }
    t.numeric = {false, true, true};
    doc.table(t);
    if (r.pair && *r.pair && (**r.pair).expected_power_correlation)
        doc.note("The simulated power correlation estimates what " + std::to_string(r.waves) +
                 " plane waves a realisation give, which differs from the ECC by a term of order 1/waves (of either sign, the "
                 "second value in its row); its interval is around that value, so an uncorrelated pair's interval need not "
                 "contain 0. The Pearson estimate over " + std::to_string(r.realisations) +
                 " realisations adds a bias of order 1/realisations, far smaller.");
}

// The exact combining gains of the first two patterns (the diversity study's).
void combining_table(Document& doc, const std::vector<LinkInput>& in, const Environment& env) {
    auto st = study_diversity(env, DiversityOptions{},
                              {StudyPattern{in[0].set, in[0].path, {in[0].freq_index}}, StudyPattern{in[1].set, in[1].path, {in[1].freq_index}}});
    if (!st || st->pairs.empty() || !st->pairs.front().combining) {
        doc.note("Exact combining of A and B unavailable: " +
                 (!st ? st.error().message : st->pairs.empty() ? std::string("no pair") : st->pairs.front().combining.error().message));
        return;
    }
    DocTable t;
    t.header = {"Outage", "Selection gain (dB)", "effective (dB)", "Maximal-ratio gain (dB)", "effective (dB)"};
    for (const OutageFigures& o : st->pairs.front().combining->outages)
        t.rows.push_back({outage_text(o.outage), fixed(o.selection_gain_db, db_decimals), fixed(o.selection_effective_gain_db, db_decimals),
                          fixed(o.mrc_gain_db, db_decimals), fixed(o.mrc_effective_gain_db, db_decimals)});
    doc.table(t);
    doc.note(std::string("Diversity gains of A and B: ") + combining_method + ".");
}

Status fading_part(Document& doc, std::vector<ReportFile>& files, const std::vector<LinkInput>& in, const ReportOptions& o) {
    const std::size_t n = std::min<std::size_t>(2, in.size());
    std::vector<FadingAntenna> ants;
    for (std::size_t a = 0; a < n; ++a) ants.push_back({in[a].set, in[a].freq_index});
    FadingOptions fo;
    fo.realisations = report_fading_realisations;
    fo.outages = {0.01, 0.1};
    fo.threads = int(parallel_threads());
    auto r = simulate_fading(ants, *o.environment, fo);
    if (!r) {
        doc.note("Fading simulation unavailable: " + r.error().message);
        return Ok{};
    }
    FadingFigureLabels labels;
    labels.subtitle = describe(*o.environment);
    for (std::size_t a = 0; a < n; ++a) labels.names.push_back(in[a].name);
    const XyFigure fig = make_fading_figure(*r, labels, fo.outages);
    DocFigure f;
    f.caption = "Received power in multipath fading: " + std::string(n == 2 ? "A, B and their combination" : "A") +
                ", simulated (solid) and closed form (dashed)";
    f.alt = f.caption;
    Status st = add_figure_files([&](cairo_t* cr, double w, double h) { draw_xy_figure(cr, fig, w, h); }, fig.title,
                                 "link-fading", o.size, files, f);
    if (!st) return st;
    files.push_back({"link-fading.csv", fading_csv(*r, labels)});
    doc.figures({f});
    fading_table(doc, *r, in);
    if (r->pair && !*r->pair) doc.note("A with B: " + r->pair->error().message);
    return Ok{};
}

void ranking_part(Document& doc, const std::vector<LinkInput>& in, const ReportOptions& o) {
    const FarFieldSet ref = reference_dipole(in[0].set->grid, in[0].set->frequencies[in[0].freq_index].frequency_hz);
    std::vector<RankCandidate> cands;
    RankLabels l;
    for (const LinkInput& c : in) {
        cands.push_back({c.set, c.path, c.freq_index});
        l.names.push_back(c.name);
        l.files.push_back(c.path);
        l.frequencies_hz.push_back(c.set->frequencies[c.freq_index].frequency_hz);
    }
    l.environments = {*o.environment};
    l.reference = reference_dipole_description;
    RankOptions ro;
    ro.threads = int(parallel_threads());
    l.sweep = ro.sweep;
    auto r = rank_candidates(cands, {&ref, "reference dipole", 0}, l.environments, ro);
    doc.heading(3, "Ranking");
    if (!r) {
        doc.note("Ranking unavailable: " + r.error().message);
        return;
    }
    Document part;
    rank_blocks(part, *r, l, 4);
    // The section's own cautions follow once at its end.
    for (DocBlock& b : part.blocks)
        if (!(b.kind == DocBlock::Kind::note && b.text.rfind("Caution: ", 0) == 0)) doc.blocks.push_back(std::move(b));
}

}  // namespace

Status link_section(Document& doc, std::vector<ReportFile>& files, const std::vector<LinkInput>& inputs, const ReportOptions& o) {
    if (!o.environment || inputs.empty()) return Ok{};
    doc.heading(2, "Link reliability", "link");
    doc.paragraph("In the " + describe(*o.environment) + " environment, each pattern at " +
                  format_frequency(inputs[0].set->frequencies[inputs[0].freq_index].frequency_hz) +
                  " or its nearest frequency, mounted as the Method section states. The simulation sums plane waves drawn from "
                  "the environment (" + std::to_string(report_fading_realisations) +
                  " realisations, seed 1); the closed forms use the patterns' MEG and ECC (docs/conventions.md).");
    if (Status st = fading_part(doc, files, inputs, o); !st) return st;
    if (inputs.size() >= 2) combining_table(doc, inputs, *o.environment);
    if (inputs.size() >= 2) ranking_part(doc, inputs, o);
    for (const char* c : outage_cautions) doc.note(std::string("Caution: ") + c);
    return Ok{};
}

}  // namespace ellipsa::exports
