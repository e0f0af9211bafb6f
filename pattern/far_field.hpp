// The far-field set: the one data model everything else reads.
//
// A FarFieldSet holds one or more frequencies sampled on one regular theta/phi grid. Each
// frequency stores complex E_theta and E_phi per sample (structure of arrays, row-major with
// theta as the slow index: index = i_theta * phi.count + i_phi). Amplitudes are in square-root
// units of the set's quantity, so |E_theta|^2 + |E_phi|^2 is gain, directivity or relative power
// in linear terms. Phasors follow exp(+j w t); importers convert other conventions on the way in.
#pragma once
#include <cstddef>
#include <string>
#include <vector>

#include "pattern/mounting.hpp"
#include "pattern/result.hpp"
#include "pattern/vec3.hpp"

namespace ellipsa {

enum class Quantity { gain, directivity, relative };
const char* to_string(Quantity q);

// What the file carried. Magnitude-only and total-only data lack the phase that circular
// components, axial ratio and correlation need; analyses check this and say so.
enum class FieldContent {
    complex,         // E_theta and E_phi with phase
    magnitude_only,  // |E_theta| and |E_phi|, no phase (stored with zero phase)
    total_only       // only |E|^2 (stored as E_theta = |E|, E_phi = 0)
};
const char* to_string(FieldContent c);

enum class Ludwig3Reference { x, y };

// One polarisation part of a field split over files (a range's co-polar and cross-polar scans,
// or an E_theta file and an E_phi file): the file held one component of a basis, the other is
// stored as zero until the parts are merged (pattern/merge.hpp). whole: the complete field.
enum class FieldPart { whole, theta, phi, rhcp, lhcp, co, cross };
const char* to_string(FieldPart p);  // "whole", "E_theta", "E_phi", "RHCP", "LHCP", "co-polar", "cross-polar"


// One regularly sampled angle axis: values start_deg + i * step_deg, i in [0, count).
struct AngleAxis {
    double start_deg = 0;
    double step_deg = 1;
    int count = 1;
    double value_deg(int i) const { return start_deg + i * step_deg; }
    double last_deg() const { return value_deg(count - 1); }
};

// How the samples stand for the sphere: the one fact every whole-sphere figure asks about
// (through pattern/integrate.hpp: coverage, is_full_sphere, sphere_shortfall).
//   surface: each sample is the centre of a cell; together the cells cover the sampled region.
//   cuts:    principal cuts only (a range's phi = 0 and phi = 90 planes, a theta = 90 azimuth
//            cut): values exist along each phi column (or along the one theta row), nothing
//            between columns. Cuts cover no solid angle: coverage 0, no directivity, efficiency,
//            MEG, ECC or 3D surface; cuts, beam figures and polarisation along them remain.
enum class Sampling { surface, cuts };
const char* to_string(Sampling s);  // "surface", "cuts"

// Regular grid. theta in [0, 180]; phi start in [0, 360), samples taken modulo 360.
struct Grid {
    AngleAxis theta;
    AngleAxis phi;
    Sampling sampling = Sampling::surface;
    std::size_t size() const { return std::size_t(theta.count) * std::size_t(phi.count); }
    std::size_t index(int i_theta, int i_phi) const {
        return std::size_t(i_theta) * std::size_t(phi.count) + std::size_t(i_phi);
    }
    // True when the phi samples go all the way round (count * step == 360).
    bool phi_wraps() const;
    // True when the theta samples reach the given pole (within a tiny tolerance).
    bool has_north_pole() const;
    bool has_south_pole() const;
};

// What a reader assumes when a file does not say (docs/far-field-csv.md, "Cut-only data"):
// cuts when one axis holds a single value (one phi column, or one theta row), or when the phi
// columns stand at least 45 deg apart and at least 5 times further apart than the theta rows
// (phi 0 and 90 over theta in 1-deg steps; the four half-planes 0, 90, 180, 270 that a theta
// -180..180 file gives). A grid as coarse in theta as in phi is a surface.
Sampling inferred_sampling(const Grid& g);

// True when two grids sample the same directions (and stand for the sphere the same way): equal counts, and starts and steps equal to a
// relative 1e-9 (|x - y| <= 1e-9 max(1, |x|)). Angles that went through text (a file's "0.1"
// steps summed, or a step computed as span / (count - 1)) differ in their last bits; exact
// equality would call such grids different and send the caller to interpolation for nothing.
// At 1e-9 the sample directions agree to well under 1e-6 deg over a whole turn.
bool same_grid(const Grid& a, const Grid& b);

// Build a full-sphere grid with the given steps: theta 0..180 inclusive, phi 0..360 exclusive.
// The steps must divide 180 and 360 (callers check; the result is rounded to whole counts).
Grid full_sphere_grid(double theta_step_deg, double phi_step_deg);

struct FarField {
    double frequency_hz = 0;  // 0 when unknown
    std::vector<cplx> e_theta;
    std::vector<cplx> e_phi;
    // Interpolation takes the linear phase 2 pi r.c of this point c (in wavelengths) out of the
    // samples before blending them and puts it back after (pattern/phase_centre.hpp): zero until
    // the phase centre is estimated. It never changes a sample, only values between samples.
    Vec3 interpolation_centre_wl{};
    // How far the phase reference was moved on request (--phase-centre), in wavelengths in the
    // world frame: the fields are those of the file times exp(-j 2 pi r.shift). Zero: not moved.
    Vec3 reference_shift_wl{};
};

struct FarFieldSet {
    std::string name;    // short label for legends and reports
    std::string source;  // where the data came from (file path, "synth dipole ...")
    std::string note;
    // What reading did that the user should hear about (lines of free text skipped before the
    // header row, ...), one sentence each; the front ends show them.
    std::vector<std::string> reading_notes;
    Quantity quantity = Quantity::gain;
    FieldContent content = FieldContent::complex;
    FieldPart part = FieldPart::whole;  // one polarisation part of a split field, until merged
    Ludwig3Reference ludwig3_reference = Ludwig3Reference::x;
    bool ludwig3_declared = false;  // the file named its Ludwig-3 reference (co/cross data): it means a co-polar direction
    bool time_convention_converted = false;  // true when the file used exp(-i w t) and was conjugated
    // The mounting frame (pattern/mounting.hpp). `mounting` has been applied to the fields, which
    // then describe the installed antenna in the world frame (identity: the file's own frame);
    // `file_mounting` is what the file's metadata declares, kept so that a writer can record it
    // while the fields are still in the file's frame.
    Mounting mounting;
    bool mounting_resampled = false;  // true when applying it interpolated (the grid did not map onto itself)
    Mounting file_mounting;
    Grid grid;
    std::vector<FarField> frequencies;

    bool has_phase() const { return content == FieldContent::complex; }
    // Index of the frequency nearest to f_hz (0 when there is only one).
    std::size_t nearest_frequency(double f_hz) const;
};

// The index of the frequency within 0.5 % of f_hz, or an Error naming `path` that lists the
// frequencies the set holds.
Result<std::size_t> find_frequency(const FarFieldSet& s, double f_hz, const std::string& path);

// Display text for a frequency: "2.45 GHz", "915 MHz"; "unknown frequency" for 0.
std::string format_frequency(double hz);

// Sample values in convenient forms.
inline double power(cplx et, cplx ep) { return std::norm(et) + std::norm(ep); }
// 10 log10 of a linear power quantity; -inf for zero.
double to_db(double linear);

}  // namespace ellipsa
