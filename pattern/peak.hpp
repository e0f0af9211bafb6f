// Peak search: the largest sample (ties within 1e-9 go to the lowest theta, then phi), refined below the grid step by a parabola through the
// neighbouring samples in dB along theta and along phi (exact for a Gaussian beam).
#pragma once
#include <functional>

#include "pattern/far_field.hpp"
#include "pattern/components.hpp"

namespace ellipsa {

struct Peak {
    double theta_deg = 0, phi_deg = 0;  // refined direction
    double value = 0;                   // refined linear power
    int i_theta = 0, i_phi = 0;         // the largest sample
    double sample_value = 0;            // its linear power
};

// Peak of a component (total by default) at one frequency. The component must be one the data
// can give (see needs_phase); the caller checks.
Peak find_peak(const FarFieldSet& s, std::size_t freq_index, Component c = Component::total);

}  // namespace ellipsa
