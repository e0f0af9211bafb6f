// The distribution curves of a fading simulation (pattern/fading.hpp) as a figure and as CSV:
// P(received power <= level) against the level in dBi, on a logarithmic probability axis, one
// curve per antenna and, for a pair, selection and maximal-ratio combining; the closed-form
// references (Rayleigh or Rician per antenna, the exact combining for a pair) dashed beside them.
// What `ellipsa fading --plot` writes and what the report's fading section shows; drawn by
// exports/xy_plot.hpp like every other plot against a number.
#pragma once
#include <string>
#include <vector>

#include "exports/xy_plot.hpp"
#include "pattern/fading.hpp"

namespace ellipsa::exports {

struct FadingFigureLabels {
    std::string title = "Received power in multipath fading";
    std::string subtitle;             // e.g. the environment and the sample count
    std::vector<std::string> names;  // one per antenna ("A. printed dipole")
};

// The figure: one panel, a series per curve, the outage probabilities as dotted references.
XyFigure make_fading_figure(const FadingResult& r, const FadingFigureLabels& labels,
                            const std::vector<double>& outages);

// The curves as one table, a row per probability: probability, then one level column (dBi) per
// curve, named "<name> simulated", "<name> Rayleigh"/"Rician", "selection simulated", ...
// Numbers with 17 significant digits; an empty field where a curve has no value.
std::string fading_csv(const FadingResult& r, const FadingFigureLabels& labels);

}  // namespace ellipsa::exports
