// The phase centre of a pattern, and moving the phase reference.
//
// A source displaced by d from the phase reference has its far field multiplied by
// exp(+j k r-hat . d) (exp(+j w t), conventions.md "Phase centre"). The estimate fits
//
//     psi(r-hat) ~ psi0 + k r-hat . d
//
// to the unwrapped co-polar phase psi over the main beam by weighted least squares, the weights
// being the co-polar power times each sample's solid angle. This is the least-squares phase-centre
// method after Y. Y. Hu, "A method of determining phase centers and its application to
// electromagnetic horns", J. Franklin Inst. 271 (1961) 31-39 (a fit over the beam, there on cuts),
// taken here over the whole main-beam region at once (source cited from memory).
//
// Choices (documented in docs/far-field-csv.md, "Phase centre"):
// - Co-polar: the field's own polarisation at the strongest sample, p (a complex unit vector),
//   carried to each direction by projecting it on that direction's transverse plane,
//   u(r) = (p - (p.r) r) / |p - (p.r) r|; the co-polar field is u^H E. For a vertical dipole this is
//   E_theta, for a circular antenna its hand of circular polarisation, everywhere in the beam
//   (no theta/phi singularity at the poles).
// - Region: the samples whose co-polar power lies within phase_centre_region_db of the co-polar
//   peak and that connect to the peak through such samples (grid neighbours, phi wrapping, poles).
// - Unwrapping: quality-guided path following from the peak, the strongest unwrapped sample's
//   neighbours first (D. C. Ghiglia, M. D. Pritt, "Two-Dimensional Phase Unwrapping", Wiley 1998,
//   ch. 4; from memory). A grid that samples the pattern adequately turns the phase by less than
//   pi between neighbours, which this needs.
// - Directions the region cannot resolve (a one-dimensional region, a very narrow beam along its
//   axis) are left at zero and counted in `unresolved_axes`.
#pragma once
#include <cstddef>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// Speed of light in vacuum, m/s (exact by the SI definition of the metre); wavelength = c / f.
inline constexpr double speed_of_light_m_per_s = 299792458.0;

// The main-beam region of the fit: co-polar power within this many dB of its peak.
inline constexpr double phase_centre_region_db = 10.0;

struct PhaseCentre {
    Vec3 centre_wl{};          // d / lambda: where the phase centre lies from the phase reference
    double constant_deg = 0;   // psi0, the phase the fit gives at the phase centre
    double residual_deg = 0;   // power-weighted RMS of psi minus the fit over the region
    std::size_t samples = 0;   // samples in the region
    int unresolved_axes = 0;   // 0 normally; directions of d the region does not determine
};

// Estimate at one frequency. Errors (with the reason) for data without phase, an empty or
// all-zero pattern, or a region of fewer than 4 samples. Costs one pass over the grid plus a heap
// walk over the region (O(n log n) in its samples); asked again for the same grid and samples
// (bit for bit), it returns the first estimate after one pass that fingerprints them.
Result<PhaseCentre> estimate_phase_centre(const FarFieldSet& s, std::size_t freq_index);

// Multiply every sample by exp(-j 2 pi r.c): the fields as seen from the point c (wavelengths),
// which becomes the new phase reference. Exact (no resampling). Complex data only.
void move_phase_reference(const Grid& g, FarField& f, Vec3 c_wl);
// The farthest a phase reference may move, in wavelengths: the phase 2 pi r.c is then still
// good to about 1e-9 rad in double arithmetic; beyond it the phases would be rounding noise.
inline constexpr double max_reference_shift_wl = 1e6;

// Estimate every frequency's phase centre and keep it as its interpolation centre (far_field.hpp);
// frequencies where no estimate is possible keep zero. Does nothing to data without phase.
void set_interpolation_centres(FarFieldSet& s);

}  // namespace ellipsa
