#include "viewer/scene/components.hpp"


namespace ellipsa::viewer {

const char* to_string(ColorBy c) {
    switch (c) {
        case ColorBy::component: return "component";
        case ColorBy::axial_ratio: return "axial-ratio";
        case ColorBy::circular_balance: return "rhcp-minus-lhcp";
        case ColorBy::tilt: return "tilt";
        case ColorBy::difference: return "difference";
    }
    return "?";
}

const char* label_of(ColorBy c) {
    switch (c) {
        case ColorBy::component: return "Shown component";
        case ColorBy::axial_ratio: return "Axial ratio";
        case ColorBy::circular_balance: return "RHCP minus LHCP";
        case ColorBy::tilt: return "Tilt of major axis";
        case ColorBy::difference: return "A minus B";
    }
    return "?";
}

bool parse_color_by(const std::string& name, ColorBy& out) {
    for (ColorBy c : all_color_by)
        if (name == to_string(c)) {
            out = c;
            return true;
        }
    if (name == "ar") return out = ColorBy::axial_ratio, true;
    return false;
}

bool color_by_needs_phase(ColorBy c) {
    return c == ColorBy::axial_ratio || c == ColorBy::circular_balance || c == ColorBy::tilt;
}

std::optional<std::string> color_by_unavailable(const FarFieldSet& s, ColorBy c) {
    if (!color_by_needs_phase(c)) return std::nullopt;
    return polarisation_unavailable(s);
}

}  // namespace ellipsa::viewer
