// Words and numbers for the core's figures, made once at the edge and shared by every output that
// shows them as text: the command line (info, probe, cut), the report and the viewer's panels.
// The core decides (pattern/polarisation.hpp, summary.hpp); this only says it, with one rounding:
// powers and ratios in dB to 2 decimals, angles to 1 decimal, percentages to 1 decimal.
#pragma once
#include <optional>
#include <string>

#include "pattern/cut.hpp"
#include "pattern/phase_centre.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/summary.hpp"

namespace ellipsa::exports {

inline constexpr int db_decimals = 2, angle_decimals = 1, percent_decimals = 1;

// v with `decimals` decimals, never "-0.0" (values that round to zero print as zero); "n/a" for
// NaN, "inf" / "-inf" for infinities.
std::string fixed(double v, int decimals);
// fixed(v, decimals) followed by " unit" (no space before a degree sign).
std::string with_unit(double v, int decimals, const std::string& unit);
// A level in dB as reported: with_unit(v_db, decimals, unit), "2.15 dBi"; an exactly zero power
// (-inf dB) is "none (zero field)", never "-inf dBi".
std::string level_text(double v_db, int decimals, const std::string& unit);
// A part of a power with its share of the whole (MEG's vertical and horizontal parts): "-8.80 dBi
// (42.1 %<of>)", and for an exactly zero part "none (0 %<of>)", never "-inf dBi (0.0 %)". `of` follows
// the percent sign (" of MEG" or ""); a share that is unavailable reads "share unavailable".
std::string part_text(double linear, const std::optional<double>& share, const std::string& unit, const std::string& of);
// An angle on a cut as shown: rounded to `decimals`, then once in the cut's range. The cut's angle
// axis is a closed loop (pattern/cut.hpp): with `signed_range` (phi = const and great-circle cuts)
// -180 is the same direction as +180 and is shown as 180, range (-180, 180]; otherwise (conical
// cuts) 360 is shown as 0, range [0, 360).
double shown_cut_angle(double angle_deg, bool signed_range, int decimals);
// The same as text for a cut: "180.0 deg" (`deg` "deg" or "°").
std::string cut_angle_text(const CutSpec& spec, double angle_deg, int decimals, const std::string& deg);

// "right-hand", "left-hand", "linear", "zero field".
const char* sense_text(Sense s);
// The axial ratio as reported: "3.01 dB", "above 40 dB (linear)", "none (zero field)".
std::string axial_ratio_text(Sense s, const std::optional<double>& axial_ratio_db);
// "right-hand, axial ratio 3.01 dB", "linear (axial ratio above 40 dB)", "zero field (no polarisation)".
std::string polarisation_text(Sense s, const std::optional<double>& axial_ratio_db);
// The tilt as reported: "12.3 <deg>", "undefined (near circular: axial ratio below 0.1 dB)",
// "none (zero field)". `deg` is the degree unit: "deg" or "°".
std::string tilt_text(double tilt_deg, Sense s, const std::string& deg);
// A component's phase as reported (pattern/component_phase.hpp): "-45.0 <deg>", rounded once
// into (-180, 180] (-179.96 shows as 180.0); "none: no field" where it has none (NaN).
std::string phase_text(double phase_deg, const std::string& deg);
// The phase to 1 decimal as shown, in (-180, 180]; NaN stays NaN.
double shown_phase_deg(double phase_deg);
// What every shown phase is relative to: "the file's origin", or "(0.0000, 0.0000, 0.1000) m from
// the file's origin (world frame)" when the phase reference was moved (reference_shift_text).
std::string phase_reference_text(const FarFieldSet& s, std::size_t freq_index);

// The peak of a summary: "5.16 dBi at theta 90.0, phi 0.0 deg" (`deg` "deg") or with Greek
// letters and degree signs (`deg` "°"); "none (zero field)" when every sample is zero. A peak at a
// pole (PatternSummary::peak_at_pole) has no phi: "3.34 dBi at theta 0.0 deg (zenith)".
std::string peak_text(const PatternSummary& r, const char* unit, const std::string& deg);
// The 3D view's caption (the viewer and every rendered view): what sets the radius, its peak
// (refined between samples, as in every other place a peak is given; none: the component is zero
// everywhere) and the range shown.
std::string radius_caption(const std::string& component, const std::optional<double>& peak_db, const std::string& unit,
                           double range_db);

// The directions a pattern does not sample (a range's upper hemisphere), as every 3D view, 3D
// file and probe names them: the key beside the view, the node of a glTF file, the probe's line.
inline constexpr const char* not_measured_label = "not measured";

// The half-power beamwidth of a cut as reported: "78.1 <deg>"; or why there is none:
// "none: omnidirectional (ripple 0.35 dB)", "none: no beam (above half power over 283.6 <deg>)",
// "none: the beam's edge lies outside the sampled range (toward lower theta)". `angle` names the
// cut's angle ("theta", "phi", "angle").
std::string beamwidth_text(const BeamFigures& b, const std::string& angle, const std::string& deg);
// The plane of a summary's beamwidth, as reported: "elevation plane" (azimuth false) or "azimuth
// plane"; when the peak is at a pole (PatternSummary::peak_at_pole), where both are elevation
// planes and the peak's phi means nothing, "plane phi = 0 deg" / "plane phi = 90 deg" (`deg`
// "deg"; "" gives "plane phi = 0"), or "plane φ = 0°" / "plane φ = 90°" (`deg` "°").
// `brief` gives the narrow table form: "elev." / "azim.", at a pole "φ = 0°" / "phi = 90 deg".
// This is the one wording of these planes: every label that names one (summaries, tables, band
// plots and menus, the viewer's panels) is made here.
std::string beam_plane_text(bool peak_at_pole, bool azimuth, const std::string& deg, bool brief = false);
std::string beam_plane_text(const PatternSummary& r, bool azimuth, const std::string& deg, bool brief = false);
// Its JSON reason code: null (nullopt) when the HPBW exists, else "omnidirectional",
// "wider_than_180_deg", "edge_outside_data_lower_angle", "edge_outside_data_higher_angle",
// "edges_outside_data_both_sides", "no_power".
std::optional<std::string> beamwidth_reason(const BeamFigures& b);
// The side-lobe level: "-13.26 dB", or "none (no other lobe stands out by 3 dB)".
std::string sidelobe_text(const BeamFigures& b);
// The same as a short table cell: "78.1°", "none (omni)", "none (> 180°)", "edge outside data",
// "no power" (the long form is beamwidth_text).
std::string beamwidth_cell(const BeamFigures& b);
// What a cut's angle axis means and which way is positive, for every cut on screen and in files:
// "Angle θ from +z: positive in the half-plane φ = 0°, negative in φ = 180°."
std::string cut_axis_text(const CutSpec& spec);
// Front-to-back: "12.30 dB", "above 60 dB (the back is a null)", "unavailable (outside the data)".
std::string front_to_back_text(const std::optional<double>& db, const std::optional<double>& above_db);

// A whole-sphere figure that the grid cannot give (pattern/integrate.hpp, sphere_shortfall):
// "unavailable (needs the whole sphere; the data hold cuts only (phi 0, 90 deg))".
std::string needs_sphere_text(const Grid& g);
// How much of the sphere a grid stands for, for summaries: "100.0 % of the sphere (full)",
// "50.0 % of the sphere", "none: the data hold cuts only (phi 0, 90 deg)".
std::string coverage_text(const Grid& g);

// Why an efficiency above 100 % cannot be right, with the likely causes (one sentence each).
std::string efficiency_warning_text(double efficiency);

// The mounting applied to a pattern (pattern/mounting.hpp): "up +x, then turns z:30 about the
// world axes (declared in the file); rotation exact (samples permuted)", "as in the file (+z up)",
// and when options replaced the file's own mounting, which.
std::string mounting_text(const FarFieldSet& s);
// Same up direction and turns, as written in text.
bool same_mounting(const Mounting& a, const Mounting& b);

// The estimated phase centre at one frequency: "(0.0120, 0.0000, -0.0031) m = (0.098, 0.000,
// -0.025) wavelengths, residual 0.4 deg over 812 samples", or "unavailable (why)". `pc` is
// estimate_phase_centre(s, freq_index) (pattern/phase_centre.hpp), computed by the caller.
std::string phase_centre_text(const FarFieldSet& s, std::size_t freq_index, const Result<PhaseCentre>& pc);
// "(0.0000, 0.0000, 0.1000) m from the file's origin (world frame)" when the phase reference was
// moved (--phase-centre, FILE::phase-centre=, the viewer's control), else "".
std::string reference_shift_text(const FarFieldSet& s, std::size_t freq_index);

}  // namespace ellipsa::exports
