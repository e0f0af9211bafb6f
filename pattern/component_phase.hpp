// The phase of one component: what probe, cut and the viewer show beside a component's gain.
//
// The complex amplitude of a component is the one the gains come from (polarisation.hpp):
//   theta / vertical E_theta; phi / horizontal E_phi; rhcp E_R = (Et + j Ep)/sqrt2 and lhcp
//   E_L = (Et - j Ep)/sqrt2 (IEEE Std 145-2013, Balanis sec. 2.12); co / cross Ludwig-3 with the
//   set's reference (Ludwig 1973). "total" is a power and has no phase.
// The phase is arg() of that amplitude in degrees, in (-180, 180], with exp(+j w t) (a file in
// exp(-i w t) was conjugated on import, so its phases read negated). It is relative to the set's
// current phase reference: the file's origin, or the point --phase-centre moved it to
// (FarField::reference_shift_wl).
//
// Honest figures (conventions.md): a component whose power is at most linear_threshold
// (polarisation.hpp, 1e-12: -120 dB) of the total power at its direction has no phase: its
// arg() would be decided by rounding residue, not by the antenna. A zero field has no phase at all.
#pragma once
#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include "pattern/cut.hpp"
#include "pattern/polarisation.hpp"

namespace ellipsa {

// True for the components that have a phase (all but total).
inline bool has_phase(Component c) { return c != Component::total; }

// The complex amplitude of a component at one sample (square-root units of the set's quantity);
// cos_phi and sin_phi (of the sample's phi) are used by co and cross only. For total it returns
// E_theta (callers ask has_phase() first).
cplx component_field(cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref, Component c);

// The phase of a component at one sample, degrees in (-180, 180]; NaN where it has none (total,
// a zero field, or a component at most linear_threshold of the total power there).
double component_phase_deg(cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref, Component c);

// Why a set cannot give a component's phase, or nullopt when it can: total has none, data
// without phase (magnitude-only, total-only) have none, and component_unavailable()'s reasons.
std::optional<std::string> phase_unavailable(const FarFieldSet& s, Component c);

// The phase of a component along a cut (degrees, NaN where invalid or undefined), one value per
// cut sample; all NaN when phase_unavailable(s, comp). Cost: one pass over the samples.
std::vector<double> cut_phase_deg(const FarFieldSet& s, const CutSamples& c, Component comp);

}  // namespace ellipsa
