// Polarisation of one far-field sample in every basis the tool shows.
//
// Conventions (docs/conventions.md, IEEE Std 145-2013, Balanis sec. 2.12), exp(+j w t):
//   E_R = (E_theta + j E_phi)/sqrt2,  E_L = (E_theta - j E_phi)/sqrt2
//   Ludwig-3 x reference: co = Et cos p - Ep sin p, cross = Et sin p + Ep cos p
//   Ludwig-3 y reference: co = Et sin p + Ep cos p, cross = Et cos p - Ep sin p
//   Stokes: I = |Et|^2+|Ep|^2, Q = |Et|^2-|Ep|^2, U = 2 Re(Et Ep*), V = 2 Im(Et Ep*) = |E_R|^2-|E_L|^2
//   AR = (|E_R|+|E_L|)/||E_R|-|E_L||  (infinite for linear), tilt = arg(E_R E_L*)/2 in (-90, 90]
// Vertical/horizontal relative to the horizon of an antenna whose up axis is +z are the theta
// and phi components.
#pragma once
#include <cstddef>
#include <limits>
#include <optional>
#include <vector>

#include "pattern/components.hpp"
#include "pattern/far_field.hpp"

namespace ellipsa {

enum class Sense { right, left, linear, none };  // none: zero field
const char* to_string(Sense s);

// Below this |V|/I the axial ratio is exactly infinite. Double-precision rounding of a truly
// linear field leaves |V|/I near 1e-16; this keeps a margin for data written to 15+ digits.
inline constexpr double linear_threshold = 1e-12;

// The thresholds that decide what a polarisation is reported as (conventions.md, "Honest
// figures"); every output (text, JSON, viewer, glyphs, report) goes through sense_of(),
// reported_axial_ratio_db() and tilt_deg(), which apply them.
// - At or above linear_axial_ratio_db (40 dB: the minor axis is under 1 % of the major) the field
//   is linear: sense "linear", no left or right, no axial-ratio number. The sense of such a field
//   is decided by rounding and measurement noise, not by the antenna.
// - Below circular_axial_ratio_db (0.1 dB: the axes differ by under 1.2 %) the tilt is undefined:
//   the orientation of a near-circle is decided by noise.
inline constexpr double linear_axial_ratio_db = 40.0;
inline constexpr double linear_axial_ratio = 100.0;  // 10^(40/20)
inline constexpr double circular_axial_ratio_db = 0.1;
inline constexpr double circular_axial_ratio = 1.0115794542598986;  // 10^(0.1/20)

struct Stokes {
    double i = 0, q = 0, u = 0, v = 0;
};

inline Stokes stokes(cplx et, cplx ep) {
    double a = std::norm(et), b = std::norm(ep);
    cplx c = et * std::conj(ep);
    return {a + b, a - b, 2 * c.real(), 2 * c.imag()};
}

inline constexpr double inv_sqrt2 = 0.70710678118654752440;
inline cplx rhcp(cplx et, cplx ep) { return (et + cplx(0, 1) * ep) * inv_sqrt2; }
inline cplx lhcp(cplx et, cplx ep) { return (et - cplx(0, 1) * ep) * inv_sqrt2; }

struct CoCross {
    cplx co, cross;
};
inline CoCross ludwig3(cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref) {
    if (ref == Ludwig3Reference::x) return {et * cos_phi - ep * sin_phi, et * sin_phi + ep * cos_phi};
    return {et * sin_phi + ep * cos_phi, et * cos_phi - ep * sin_phi};
}
// Inverse of ludwig3(): E_theta, E_phi from co and cross.
void from_ludwig3(cplx co, cplx cross, double cos_phi, double sin_phi, Ludwig3Reference ref, cplx& et,
                  cplx& ep);

// Axial ratio (linear, >= 1) from the circular partial powers |E_R|^2 and |E_L|^2 (computed
// directly from E_R and E_L, which keeps full precision near circular); +infinity for a linear
// field, NaN for zero field. (|R|+|L|)/||R|-|L|| = (|R|+|L|)^2 / ||R|^2-|L|^2|.
inline double axial_ratio_from_circular(double rhcp_power, double lhcp_power) {
    const double i = rhcp_power + lhcp_power, v = rhcp_power - lhcp_power;
    if (!(i > 0)) return std::numeric_limits<double>::quiet_NaN();
    const double av = std::abs(v);
    if (av <= linear_threshold * i) return std::numeric_limits<double>::infinity();
    const double s = std::sqrt(rhcp_power) + std::sqrt(lhcp_power);
    return s * s / av;
}
double axial_ratio(cplx et, cplx ep);
// The axial ratio in dB as reported: nullopt for a linear field (at or above
// linear_axial_ratio_db) and for a zero field (NaN in).
std::optional<double> reported_axial_ratio_db(double axial_ratio);
// Tilt of the major axis from theta-hat toward phi-hat, degrees in (-90, 90]; NaN where it is
// undefined: a zero field, or an axial ratio below circular_axial_ratio_db.
double tilt_deg(const Stokes& s);
// Whether tilt_deg(s) is defined: a nonzero field whose axial ratio is at least circular_axial_ratio_db.
inline bool tilt_defined(const Stokes& s) {
    // Degree of linear polarisation sqrt(Q^2 + U^2) / I = (AR^2 - 1) / (AR^2 + 1) (Born & Wolf sec. 1.4).
    constexpr double a2 = circular_axial_ratio * circular_axial_ratio, min_linear = (a2 - 1) / (a2 + 1);
    return s.i > 0 && !(s.q * s.q + s.u * s.u < min_linear * min_linear * s.i * s.i);
}
// none for a zero field, linear at or above linear_axial_ratio_db, else right (V > 0) or left.
Sense sense_of(const Stokes& s);

// Everything about one sample. Powers are linear in the set's quantity.
struct PolarisationState {
    cplx e_theta, e_phi, e_rhcp, e_lhcp, e_co, e_cross;
    double total = 0, theta = 0, phi = 0, rhcp = 0, lhcp = 0, co = 0, cross = 0;
    double axial_ratio = 0;                // linear, as measured; +inf when exactly linear, NaN for a zero field
    std::optional<double> axial_ratio_db;  // as reported: only for right- and left-hand fields
    double tilt_deg = 0;                   // NaN where undefined (zero field, near circular)
    Sense sense = Sense::none;             // as reported (thresholds above)
    Stokes stokes;
};

PolarisationState decompose(cplx et, cplx ep, double phi_rad, Ludwig3Reference ref);

// Linear power of a component from a decomposed state.
double component_power(const PolarisationState& s, Component c);

}  // namespace ellipsa
