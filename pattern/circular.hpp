// Circular-polarisation figures of one frequency: the axial-ratio beamwidth on a cut and the
// solid angle where the axial ratio stays within a threshold.
//
// The test "AR <= t" is carried out on the normalised Stokes parameter m = |V| / I, which is 1 for
// a circular field, 0 for a linear one and finite everywhere (AR itself is infinite for a linear
// field). Through the ellipticity angle chi (sin 2chi = V / I, AR = |cot chi|; IEEE Std 145-2013,
// Balanis sec. 2.12): m = sin 2|chi| = 2 tan|chi| / (1 + tan^2 chi) = 2 AR / (1 + AR^2), which
// falls as AR grows, so
//   AR <= t  <=>  m >= 2 t / (1 + t^2).
// Crossings on a cut are interpolated linearly in m between the two samples that straddle the
// threshold (m varies smoothly even where the field turns linear, AR in dB does not).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "pattern/cut.hpp"
#include "pattern/far_field.hpp"

namespace ellipsa {

// The usual axial-ratio limit of a circularly polarised antenna.
inline constexpr double ar_threshold_db = 3.0;

// |V| / I at the limit AR = threshold_db (in dB): 2 t / (1 + t^2) with t = 10^(threshold_db / 20).
double circularity_at_ar_db(double threshold_db);
// |V| / I of a field sample; NaN for a zero field.
double circularity(cplx e_theta, cplx e_phi);

struct ArBeamwidth {
    std::optional<double> width_deg;            // right - left, degrees along the cut
    std::optional<double> left_deg, right_deg;  // the crossings, as angles of the cut
    double threshold_db = ar_threshold_db;
    std::string unavailable_reason;  // why width_deg is missing (empty when it is given)
};

// Axial-ratio beamwidth along a sampled cut: from the sample `start_index` (the chosen
// direction), walk both ways while AR <= threshold_db and interpolate each crossing (see top).
// Missing with a reason when the data have no phase, AR at the start exceeds the threshold, the
// cut leaves the sampled region first, or AR stays within the threshold along the whole cut.
// Cost: one pass over the cut.
ArBeamwidth ar_beamwidth(const FarFieldSet& s, const CutSamples& c, int start_index, double threshold_db);

// The same on the great circle through (theta_deg, phi_deg): along theta-hat (the elevation
// cut, as HPBW elevation) when along_phi is false, along phi-hat otherwise. The cut is sampled at
// default_cut_step(grid). Cost: one cut (a few thousand interpolations).
ArBeamwidth ar_beamwidth_through(const FarFieldSet& s, std::size_t freq_index, double theta_deg, double phi_deg,
                                 bool along_phi, double threshold_db = ar_threshold_db);

struct ArSolidAngle {
    double solid_angle_sr = 0;  // where AR <= threshold (pattern/sphere_coverage.hpp solid_angle_at_or_above)
    double share = 0;           // solid_angle_sr / (4 pi)
    double threshold_db = ar_threshold_db;
};
// Solid angle where AR <= threshold_db, that is |V|/I >= circularity_at_ar_db(threshold_db):
// the cells of pattern/integrate's exact weights, each with |V|/I interpolated inside it (the
// quarter-cell model of pattern/sphere_coverage.hpp), so a boundary through a cell counts the
// part of the cell inside it. nullopt without phase and for cuts
// (far_field.hpp, Sampling: no solid angle). Cost: one pass over the grid.
std::optional<ArSolidAngle> ar_solid_angle(const FarFieldSet& s, std::size_t freq_index,
                                           double threshold_db = ar_threshold_db);

}  // namespace ellipsa
