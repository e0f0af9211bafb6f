// What colours the viewer's surface besides the shown component. Component facts (names, labels,
// units, availability, power over the grid) live in the core: pattern/components.hpp.
#pragma once
#include <cstddef>
#include <optional>
#include <string>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"

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
// Why a colouring cannot be shown for this set, or nullopt when it can.
std::optional<std::string> color_by_unavailable(const FarFieldSet& s, ColorBy c);

}  // namespace ellipsa::viewer
