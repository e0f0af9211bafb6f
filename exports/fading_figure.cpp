#include "exports/fading_figure.hpp"

#include <cmath>

#include "exports/csv_text.hpp"
#include "pattern/combining.hpp"

namespace ellipsa::exports {

namespace {

struct Curve {
    std::string label;  // also the CSV column
    const std::vector<CdfPoint>* points;
    int style;
    bool closed_form;  // drawn dashed and thin in the colour of its simulated curve, not in the legend
};

std::vector<Curve> curves_of(const FadingResult& r, const FadingFigureLabels& l) {
    std::vector<Curve> c;
    int style = 0;
    for (std::size_t a = 0; a < r.antennas.size(); ++a, ++style) {
        const SimulatedAntenna& s = r.antennas[a];
        const std::string name = a < l.names.size() ? l.names[a] : "antenna " + std::to_string(a + 1);
        c.push_back({name, &s.cdf, style, false});
        if (!s.analytic_cdf.empty())
            c.push_back({name + (s.analytic_k ? " Rician" : " Rayleigh"), &s.analytic_cdf, style, true});
    }
    if (r.pair && *r.pair) {
        const SimulatedPair& q = **r.pair;
        c.push_back({"selection", &q.selection_cdf, style, false});
        if (!q.analytic_selection_cdf.empty()) c.push_back({"selection exact", &q.analytic_selection_cdf, style, true});
        ++style;
        c.push_back({"maximal ratio", &q.mrc_cdf, style, false});
        if (!q.analytic_mrc_cdf.empty()) c.push_back({"maximal ratio exact", &q.analytic_mrc_cdf, style, true});
    }
    return c;
}

double level_db(double linear) { return linear > 0 ? 10 * std::log10(linear) : NAN; }

}  // namespace

XyFigure make_fading_figure(const FadingResult& r, const FadingFigureLabels& l, const std::vector<double>& outages) {
    XyFigure f;
    f.title = l.title;
    f.subtitle = l.subtitle;
    f.x_label = "Received power level";
    f.x_unit = "dBi";
    XyPanel p;
    p.y_label = "P(power ≤ level)";
    p.log_y = true;
    p.y_references = outages;
    for (const Curve& c : curves_of(r, l)) {
        XySeries s;
        s.label = c.closed_form ? "" : c.label;
        s.style = c.style;
        s.dash = c.closed_form ? 1 : 0;  // dashed, or solid
        s.width = c.closed_form ? 0.8 : 1.2;
        s.points = false;
        for (const CdfPoint& q : *c.points) {
            s.x.push_back(level_db(q.level));
            s.y.push_back(q.probability);
        }
        p.series.push_back(std::move(s));
    }
    f.panels.push_back(std::move(p));
    char n[160];
    std::snprintf(n, sizeof n, "%zu realisations of %d plane waves each, seed %llu; dotted lines: the outage probabilities.",
                  r.realisations, r.waves, static_cast<unsigned long long>(r.seed));
    f.notes.push_back(n);
    f.notes.push_back("Solid: simulated. Dashed, same colour: the closed form (Rayleigh or Rician for each antenna, exact "
                      "combining for the pair) from the MEG and ECC of the patterns (conventions.md).");
    for (const char* c : outage_cautions) f.notes.push_back(c);
    return f;
}

std::string fading_csv(const FadingResult& r, const FadingFigureLabels& l) {
    const std::vector<Curve> curves = curves_of(r, l);
    std::string out = "probability";
    for (const Curve& c : curves) out += "," + c.label + (c.closed_form ? "" : " simulated") + " level_dbi";
    out += "\n";
    const std::size_t rows = curves.empty() ? 0 : curves.front().points->size();
    for (std::size_t k = 0; k < rows; ++k) {
        append_csv_number(out, (*curves.front().points)[k].probability);
        for (const Curve& c : curves) {
            out += ",";
            if (k < c.points->size()) append_csv_number(out, level_db((*c.points)[k].level));
        }
        out += "\n";
    }
    return out;
}

}  // namespace ellipsa::exports
