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

// One component's curve on the cut, in dB for drawing.
struct CutCurve {
    Component component = Component::total;
    int pattern = 0;         // 0: A, 1: B
    std::vector<double> db;  // NaN where invalid, -inf where the component is zero
    BeamFigures beam;        // the core's figures of this curve (BeamShape::no_power for a zero curve)
};

struct CutData {
    CutSpec spec;
    // The core's cut values (pattern/cut.hpp compute_cut) of A and, when comparing, of B: the
    // screen draws them and the viewer's export writes them, so screen and file cannot differ.
    std::optional<ComponentCut> a, b;
    std::vector<CutCurve> curves;    // A's curves, then B's
    std::vector<double> angle_deg;   // the cut's angles (A's samples)
    std::string unit;                // of the first curve ("dBi", "dBic", "dB")
    std::optional<double> peak_db;   // highest finite value of every curve; none: no power on this cut
    std::string why;                 // no cut of A: what the core said
    bool valid = false;              // a cut with at least one curve
    // The figures of the first curve, when it has power.
    const BeamFigures* figures() const {
        return !curves.empty() && curves[0].beam.shape != BeamShape::no_power ? &curves[0].beam : nullptr;
    }
};

// The cut the settings ask for: phi = const, theta = const (theta clamped to [0, 180]) or the
// great circle through the pinned direction along theta-hat (the meridian through the pin). None when the kind needs a pin and
// there is none, or when an angle is not finite.
std::optional<CutSpec> cut_spec_for(const ViewerSettings& s, const std::optional<double>& pin_theta_deg,
                                    const std::optional<double>& pin_phi_deg);

// The core's cut of A (and of B, when given and its cut has as many samples) for every component
// in the `components` bit mask that the data can give. Cost: one compute_cut per pattern at a
// quarter of A's grid step (at least 0.25 deg) and one pass per curve.
CutData build_cut_data(const FarFieldSet& a, std::size_t fa, const FarFieldSet* b, std::size_t fb, const CutSpec& spec,
                       unsigned components);

}  // namespace ellipsa::viewer
