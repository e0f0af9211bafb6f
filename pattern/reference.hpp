// Closed-form reference antennas (for demos, tests and `ellipsa synth`).
//
//   short dipole along z:            E_theta ~ sin(theta)                          (Balanis sec. 4.2)
//   sinusoidal-current dipole, L:    E_theta ~ [cos(pi L cos t) - cos(pi L)] / sin t  (Balanis sec. 4.5)
//   small loop in the xy-plane:      E_phi ~ sin(theta)                            (Balanis sec. 5.2)
//   loop of circumference C, uniform current: E_phi ~ J1(C sin theta), C in wavelengths (= ka) (Balanis sec. 5.3)
//   crossed short dipoles along x and y, currents 1 and exp(j phase): the field is the transverse part
//   of the current moment, E ~ -(p - (p.r) r); phase = +90 deg radiates left-hand toward +z,
//   -90 deg right-hand (IEEE Std 145, exp(+j w t)).
// Each is normalised so that |E|^2 is its directivity (lossless: gain = directivity), and then
// turned by the orientation R: E(r) = R E_local(R^T r).
#pragma once
#include <string>

#include "pattern/far_field.hpp"

namespace ellipsa {

enum class ReferenceKind { short_dipole, dipole, small_loop, loop, crossed_dipoles };
const char* to_string(ReferenceKind k);
bool parse_reference_kind(const std::string& name, ReferenceKind& out);

struct ReferenceAntenna {
    ReferenceKind kind = ReferenceKind::dipole;
    double length_wl = 0.5;         // dipole length in wavelengths
    double circumference_wl = 1.0;  // loop circumference in wavelengths
    double phase_deg = -90;         // crossed dipoles: phase of the y current against the x current
    Mat3 orientation;               // identity: dipoles along z, loops in the xy-plane
};

// The unnormalised local field of the antenna toward a unit direction (antenna frame).
CVec3 local_field(const ReferenceAntenna& a, Vec3 dir);
// The scale that makes |E|^2 the directivity (from an accurate quadrature, independent of any grid).
double normalisation(const ReferenceAntenna& a);
// Field of the oriented, normalised antenna toward a global direction.
CVec3 reference_field(const ReferenceAntenna& a, double scale, Vec3 dir);

// Sample the antenna on a full-sphere grid (theta 0..180, phi 0..360-step) at one frequency.
FarFieldSet synthesize(const ReferenceAntenna& a, double step_deg, double frequency_hz);
// The same on any grid (a partial one too: the antenna's samples at those directions).
FarFieldSet synthesize_on(const ReferenceAntenna& a, const Grid& grid, double frequency_hz);

// A short description, e.g. "dipole, L = 1.25 wavelengths".
std::string describe(const ReferenceAntenna& a);

}  // namespace ellipsa
