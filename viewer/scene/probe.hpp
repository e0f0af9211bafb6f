// The probe's figures for one direction, as numbers: every component the data can give (in dB, with its phase),
// and with phase the field's polarisation state (axial ratio, tilt, sense, Stokes). Pure code:
// the field comes from pattern/interpolate.hpp (Cartesian interpolation) and decompose(). The
// probe panel formats these values; nothing here makes text.
#pragma once
#include <cmath>
#include <optional>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa::viewer {

struct ComponentValue {
    Component component = Component::total;
    double db = 0;  // -inf where the component is zero
    // Its phase, deg in (-180, 180], relative to the set's phase reference (pattern/component_phase.hpp);
    // NaN where it has none: total, no field there, or data without phase.
    double phase_deg = NAN;
};

struct ProbeValues {
    double theta_deg = 0, phi_deg = 0;
    bool inside = false;                       // the direction lies in the sampled region
    std::vector<ComponentValue> components;    // the components the data can give, in all_components order
    // With phase: the decomposed field (axial_ratio +inf when linear, NaN for a zero field).
    std::optional<PolarisationState> polarisation;
    std::optional<double> db_of(Component c) const;  // none when the data cannot give c (or outside)
};

// The probe at (theta, phi) in degrees, one frequency. Cost: one interpolation and one
// decomposition.
ProbeValues probe(const FarFieldSet& set, std::size_t freq, double theta_deg, double phi_deg);

}  // namespace ellipsa::viewer
