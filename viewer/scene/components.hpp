// Per-sample values of a pattern for the viewer: one component's power over the whole grid, its
// dB unit, and the polarisation figures used to colour the surface. Pure code over plain arrays.
#pragma once
#include <cstddef>
#include <string>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/result.hpp"

namespace ellipsa::viewer {

// What colours the surface besides the component itself.
enum class ColorBy {
    component,         // the shown component's dB (same as the radius)
    axial_ratio,       // axial ratio in dB, 0 = circular
    circular_balance,  // RHCP minus LHCP in dB (positive: right-hand dominates)
    tilt,              // tilt of the major axis, deg, cyclic
    difference         // A minus B in dB for the same component (needs a second pattern)
};
inline constexpr ColorBy all_color_by[] = {ColorBy::component, ColorBy::axial_ratio, ColorBy::circular_balance,
                                           ColorBy::tilt, ColorBy::difference};
const char* to_string(ColorBy c);        // "component", "axial-ratio", "rhcp-minus-lhcp", "tilt", "difference"
const char* label_of(ColorBy c);         // for menus: "Axial ratio", ...
bool parse_color_by(const std::string& name, ColorBy& out);
bool color_by_needs_phase(ColorBy c);
// Menu label of a component: "Total", "E-theta", "RHCP", ...
const char* label_of(Component c);

// "dBi", "dBic" (circular parts of gain/directivity) or "dB" (relative data).
std::string db_unit(Quantity q, Component c);

// Why a component or colouring cannot be shown for this set ("" when it can).
std::string unavailable_reason(const FarFieldSet& s, Component c);
std::string unavailable_reason(const FarFieldSet& s, ColorBy c);

// Linear power of one component at every grid sample of one frequency (size grid.size()).
// Cost: one decomposition per sample, no allocation besides the result.
std::vector<double> component_power_grid(const FarFieldSet& s, std::size_t freq_index, Component c);

// Polarisation figures at every grid sample: AR in dB (+inf for linear), RHCP-LHCP in dB, tilt deg.
struct PolarisationGrid {
    std::vector<double> axial_ratio_db, balance_db, tilt_deg;
};
PolarisationGrid polarisation_grid(const FarFieldSet& s, std::size_t freq_index);

}  // namespace ellipsa::viewer
