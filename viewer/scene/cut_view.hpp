// The cut the viewer shows: which cut the settings and the pin ask for, and its curves (every
// chosen component of A, and of B when comparing) in dB with the beam figures of the first curve.
// Pure code over pattern/cut.hpp; the cut panel only draws a CutData and formats its numbers.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/cut.hpp"
#include "pattern/far_field.hpp"
#include "viewer/scene/settings.hpp"

namespace ellipsa::viewer {

// One component's curve on the cut.
struct CutCurve {
    Component component = Component::total;
    int pattern = 0;         // 0: A, 1: B
    std::vector<double> db;  // NaN where invalid, -inf where the component is zero
};

struct CutData {
    CutSpec spec;
    std::vector<double> angle_deg, theta_deg, phi_deg;
    std::vector<CutCurve> curves;
    std::optional<BeamFigures> figures;  // of the first curve; none when that curve has no power
    std::string unit;                // of the first curve ("dBi", "dBic", "dB")
    std::optional<double> peak_db;   // highest finite value of every curve; none: no power on this cut
    bool valid = false;              // a cut with at least one curve
};

// The cut the settings ask for: phi = const, theta = const (theta clamped to [0, 180]) or the
// great circle through the pinned direction along phi-hat. None when the kind needs a pin and
// there is none, or when an angle is not finite.
std::optional<CutSpec> cut_spec_for(const ViewerSettings& s, const std::optional<double>& pin_theta_deg,
                                    const std::optional<double>& pin_phi_deg);

// Sample the cut of A (and of B, when given and its cut has as many samples) for every component
// in the `components` bit mask that the data can give. Cost: one sample_cut per pattern at
// a quarter of the grid step (at least 0.25 deg) and one pass per curve.
CutData build_cut_data(const FarFieldSet& a, std::size_t fa, const FarFieldSet* b, std::size_t fb, const CutSpec& spec,
                       unsigned components);

}  // namespace ellipsa::viewer
