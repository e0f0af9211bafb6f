#include "exports/figure_text.hpp"

#include "pattern/integrate.hpp"

#include <cmath>
#include <cstdio>

namespace ellipsa::exports {

std::string fixed(double v, int decimals) {
    if (std::isnan(v)) return "n/a";
    if (std::isinf(v)) return v < 0 ? "-inf" : "inf";
    if (std::abs(v) < 0.5 * std::pow(10.0, -decimals)) v = 0;  // no "-0.0"
    char b[64];
    std::snprintf(b, sizeof b, "%.*f", decimals, v);
    return b;
}

std::string with_unit(double v, int decimals, const std::string& unit) {
    const bool tight = unit.empty() || unit == "\u00b0";
    return fixed(v, decimals) + (tight ? "" : " ") + unit;
}

std::string level_text(double v_db, int decimals, const std::string& unit) {
    if (std::isinf(v_db) && v_db < 0) return "none (zero field)";
    return with_unit(v_db, decimals, unit);
}

std::string part_text(double linear, const std::optional<double>& share, const std::string& unit, const std::string& of) {
    if (!(linear > 0)) return "none (0 %" + of + ")";
    const std::string value = with_unit(10 * std::log10(linear), db_decimals, unit);
    return value + (share ? " (" + fixed(100 * *share, percent_decimals) + " %" + of + ")" : " (share unavailable)");
}

double shown_cut_angle(double angle_deg, bool signed_range, int decimals) {
    const double scale = std::pow(10.0, decimals);
    double a = std::round(angle_deg * scale) / scale;  // round first: -179.96 is shown as 180.0
    if (!std::isfinite(a)) return a;
    a = std::fmod(a, 360.0);
    if (signed_range) {
        if (a <= -180) a += 360;
        if (a > 180) a -= 360;
    } else {
        if (a < 0) a += 360;
        if (a >= 360) a -= 360;
    }
    return a;
}

std::string cut_angle_text(const CutSpec& spec, double angle_deg, int decimals, const std::string& deg) {
    return with_unit(shown_cut_angle(angle_deg, spec.kind != CutKind::theta_const, decimals), decimals, deg);
}

const char* sense_text(Sense s) {
    switch (s) {
        case Sense::right: return "right-hand";
        case Sense::left: return "left-hand";
        case Sense::linear: return "linear";
        case Sense::none: return "zero field";
    }
    return "zero field";
}

std::string axial_ratio_text(Sense s, const std::optional<double>& ar_db) {
    if (s == Sense::none) return "none (zero field)";
    if (s == Sense::linear || !ar_db) return "above " + fixed(linear_axial_ratio_db, 0) + " dB (linear)";
    return with_unit(*ar_db, db_decimals, "dB");
}

std::string polarisation_text(Sense s, const std::optional<double>& ar_db) {
    if (s == Sense::none) return "zero field (no polarisation)";
    if (s == Sense::linear || !ar_db) return "linear (axial ratio above " + fixed(linear_axial_ratio_db, 0) + " dB)";
    return std::string(sense_text(s)) + ", axial ratio " + with_unit(*ar_db, db_decimals, "dB");
}

std::string tilt_text(double tilt_deg, Sense s, const std::string& deg) {
    if (s == Sense::none) return "none (zero field)";
    if (std::isnan(tilt_deg))
        return "undefined (near circular: axial ratio below " + fixed(circular_axial_ratio_db, 1) + " dB)";
    return with_unit(tilt_deg, angle_decimals, deg);
}

double shown_phase_deg(double phase_deg) {
    const double p = std::pow(10.0, angle_decimals);
    double r = std::round(phase_deg * p) / p;
    if (r <= -180) r += 360;
    return r;
}

std::string phase_text(double phase_deg, const std::string& deg) {
    if (std::isnan(phase_deg)) return "none: no field";
    return with_unit(shown_phase_deg(phase_deg), angle_decimals, deg);
}

std::string peak_text(const PatternSummary& r, const char* unit, const std::string& deg) {
    if (r.zero_field) return "none (zero field)";
    const bool greek = deg != "deg";
    const std::string at = with_unit(r.peak_db, db_decimals, unit) + " at " + (greek ? "\u03b8 " : "theta ");
    if (r.peak_at_pole)  // phi means nothing at a pole: the pole by name
        return at + with_unit(r.peak.theta_deg, angle_decimals, deg) + (r.peak.theta_deg < 90 ? " (zenith)" : " (nadir)");
    return at + fixed(r.peak.theta_deg, angle_decimals) + (greek ? "\u00b0, \u03c6 " : ", phi ") +
           with_unit(r.peak.phi_deg, angle_decimals, deg);
}

std::string radius_caption(const std::string& component, const std::optional<double>& peak_db, const std::string& unit,
                           double range_db) {
    const std::string range = "range " + fixed(range_db, 0) + " dB";
    if (peak_db) return "radius: " + component + ", peak " + with_unit(*peak_db, db_decimals, unit) + ", " + range;
    return "radius: " + component + ", no power (every sample of it is zero)";
}

std::string beamwidth_text(const BeamFigures& b, const std::string& angle, const std::string& deg) {
    switch (b.shape) {
        case BeamShape::beam: return with_unit(*b.hpbw_deg, angle_decimals, deg);
        case BeamShape::no_power: return "none (no power on this cut)";
        case BeamShape::omnidirectional:
            return "none: omnidirectional (ripple " + with_unit(b.ripple_db.value_or(0), db_decimals, "dB") + ")";
        case BeamShape::wider_than_180:
            return "none: no beam (above half power over " + with_unit(b.half_power_span_deg.value_or(0), angle_decimals, deg) +
                   " of this cut)";
        case BeamShape::edges_outside_data: {
            const bool lo = b.left == EdgeStatus::outside_data, hi = b.right == EdgeStatus::outside_data;
            const std::string side = lo && hi ? "on both sides" : lo ? "toward lower " + angle : "toward higher " + angle;
            return "none: the beam's edge lies outside the sampled range (" + side + ")";
        }
    }
    return "none";
}

std::string beam_plane_text(bool peak_at_pole, bool azimuth, const std::string& deg, bool brief) {
    if (!peak_at_pole) return brief ? (azimuth ? "azim." : "elev.") : azimuth ? "azimuth plane" : "elevation plane";
    const bool greek = deg == "\u00b0";
    return std::string(brief ? "" : "plane ") + (greek ? "\u03c6 = " : "phi = ") + with_unit(azimuth ? 90 : 0, 0, deg);
}

std::string beam_plane_text(const PatternSummary& r, bool azimuth, const std::string& deg, bool brief) {
    return beam_plane_text(r.peak_at_pole, azimuth, deg, brief);
}

std::string beamwidth_cell(const BeamFigures& b) {
    switch (b.shape) {
        case BeamShape::beam: return with_unit(*b.hpbw_deg, angle_decimals, "\u00b0");
        case BeamShape::no_power: return "no power";
        case BeamShape::omnidirectional: return "none (omni)";
        case BeamShape::wider_than_180: return "none (> 180\u00b0)";
        case BeamShape::edges_outside_data: return "edge outside data";
    }
    return "none";
}

std::string cut_axis_text(const CutSpec& spec) {
    char b[240];
    switch (spec.kind) {
        case CutKind::phi_const:
            std::snprintf(b, sizeof b,
                          "Angle \u03b8 from +z: positive in the half-plane \u03c6 = %g\u00b0, negative in \u03c6 = %g\u00b0.",
                          wrap360(spec.phi_deg), wrap360(spec.phi_deg + 180));
            return b;
        case CutKind::theta_const:
            return "Angle \u03c6 from +x toward +y (counter-clockwise seen from +z).";
        case CutKind::great_circle: {
            double t, p;
            to_spherical(spec.centre, t, p);
            const double along_theta = dot(spec.tangent, theta_hat(t, p)), along_phi = dot(spec.tangent, phi_hat(p));
            const char* way = along_theta > 0.999 ? "along \u03b8-hat (the meridian): positive toward larger \u03b8"
                              : along_phi > 0.999 ? "along \u03c6-hat: positive toward larger \u03c6"
                                                  : "along the great circle: positive toward its tangent";
            std::snprintf(b, sizeof b, "Angle from \u03b8 %.1f\u00b0, \u03c6 %.1f\u00b0 %s.", t / deg, wrap360(p / deg), way);
            return b;
        }
    }
    return "";
}

std::optional<std::string> beamwidth_reason(const BeamFigures& b) {
    if (b.shape == BeamShape::beam) return std::nullopt;
    if (b.shape != BeamShape::edges_outside_data) return std::string(to_string(b.shape));
    const bool lo = b.left == EdgeStatus::outside_data, hi = b.right == EdgeStatus::outside_data;
    return std::string(lo && hi ? "edges_outside_data_both_sides" : lo ? "edge_outside_data_lower_angle" : "edge_outside_data_higher_angle");
}

std::string sidelobe_text(const BeamFigures& b) {
    if (b.shape == BeamShape::no_power) return "none (no power on this cut)";
    if (!b.sidelobe_db) return "none (no other lobe stands out by " + fixed(lobe_prominence_db, 0) + " dB)";
    return with_unit(*b.sidelobe_db, db_decimals, "dB");
}

std::string front_to_back_text(const std::optional<double>& db, const std::optional<double>& above_db) {
    if (above_db) return "above " + with_unit(*above_db, 0, "dB") + " (the back is a null)";
    if (db) return with_unit(*db, db_decimals, "dB");
    return "unavailable (the back direction lies outside the data)";
}

std::string needs_sphere_text(const Grid& g) { return "unavailable (needs the whole sphere; " + sphere_shortfall(g) + ")"; }

std::string coverage_text(const Grid& g) {
    if (g.sampling == Sampling::cuts) return "none: " + sphere_shortfall(g);
    return with_unit(100 * coverage(g), 1, "%") + " of the sphere" + (is_full_sphere(g) ? " (full)" : "");
}

std::string efficiency_warning_text(double efficiency) {
    return "radiation efficiency " + with_unit(100 * efficiency, percent_decimals, "%") +
           " is above 100 %, which no passive antenna reaches: the data are probably not absolute gain "
           "(directivity or relative power read as gain), or scaled wrongly (a --scale or --offset, or field "
           "values read as power), or in dB against another reference (dBm, dBuV/m or a "
           "range's uncalibrated level are not gain). The figures below are computed as given.";
}

bool same_mounting(const Mounting& a, const Mounting& b) {
    return format_up(a.up) == format_up(b.up) && format_turns(a.turns) == format_turns(b.turns);
}

std::string mounting_text(const FarFieldSet& s) {
    auto describe = [](const Mounting& m) {
        std::string t = "up " + format_up(m.up);
        if (!m.turns.empty()) t += ", then turns " + format_turns(m.turns) + " about the world axes";
        return t;
    };
    const bool from_file = same_mounting(s.mounting, s.file_mounting);
    const std::string replaced =
        is_identity(s.file_mounting) || from_file ? "" : " (the options replace or extend the file's " + describe(s.file_mounting) + ")";
    if (is_identity(s.mounting)) return "as in the file (+z up)" + replaced;
    return describe(s.mounting) + (from_file ? " (declared in the file)" : replaced) +
           (s.mounting_resampled ? "; rotation resampled (interpolated between samples)" : "; rotation exact (samples permuted)");
}

namespace {
std::string fixed(double v, const char* format) {
    char b[32];
    std::snprintf(b, sizeof b, format, v);
    const std::string t = b;
    return t.find_first_not_of("-0.") == std::string::npos ? t.substr(t[0] == '-' ? 1 : 0) : t;  // no "-0.0000"
}
std::string metres(double v) { return fixed(v, "%.4f"); }
std::string wavelengths(double v) { return fixed(v, "%.3f"); }
std::string triple(Vec3 v, std::string (*f)(double)) {
    std::string t = "(";  // appended piece by piece: "(" + std::string&& trips g++ 12's -Wrestrict (GCC bug 105329)
    t += f(v.x);
    t += ", ";
    t += f(v.y);
    t += ", ";
    t += f(v.z);
    t += ")";
    return t;
}
double wavelength_m(const FarField& f) { return f.frequency_hz > 0 ? speed_of_light_m_per_s / f.frequency_hz : 0; }
}  // namespace

std::string phase_centre_text(const FarFieldSet& s, std::size_t k, const Result<PhaseCentre>& pc) {
    if (!pc) return "unavailable (" + pc.error().message + ")";
    const double lambda = wavelength_m(s.frequencies[k]);
    std::string t = lambda > 0 ? triple(lambda * pc->centre_wl, metres) + " m = " : "";
    char b[96];
    std::snprintf(b, sizeof b, " wavelengths, residual %.1f deg over %zu samples", pc->residual_deg, pc->samples);
    t += triple(pc->centre_wl, wavelengths) + b;
    if (pc->unresolved_axes > 0)
        t += "; " + std::to_string(pc->unresolved_axes) + " direction(s) not resolved by the main beam (left at 0)";
    return t;
}

std::string reference_shift_text(const FarFieldSet& s, std::size_t k) {
    const FarField& f = s.frequencies[k];
    const double lambda = wavelength_m(f);
    if (norm(f.reference_shift_wl) == 0) return "";
    if (!(lambda > 0)) return triple(f.reference_shift_wl, wavelengths) + " wavelengths from the file's origin";
    return triple(lambda * f.reference_shift_wl, metres) + " m from the file's origin (world frame)";
}

std::string phase_reference_text(const FarFieldSet& s, std::size_t k) {
    const std::string moved = reference_shift_text(s, k);
    return moved.empty() ? "the file's origin" : moved;
}

}  // namespace ellipsa::exports
