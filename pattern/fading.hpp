// The random-field (multipath) simulation: many realisations of a field made of plane waves, and
// what one or several antennas receive from it (conventions.md, "The random-field simulation").
//
// Each realisation sums `waves` diffuse plane waves: round(waves w_v) vertically polarised ones
// whose directions are drawn from P_theta, the rest horizontally polarised from P_phi (w_v, w_h =
// XPR/(1+XPR), 1/(1+XPR)); each V wave carries power w_v / (its count), each H wave w_h / (its
// count), with a random phase. An antenna receives the sum over waves of the wave's amplitude
// times its E_theta (V waves) or E_phi (H waves) in the wave's direction, in the world frame.
//
// What is exact: directions are drawn from the environment sampled on the pattern's grid, with
// the same cell weights the MEG integral uses (pattern/environment.hpp sample_environment; Walker's
// alias method), so each wave meets the antenna's own samples (no interpolation) and the
// expectation of the received power is exactly the MEG ellipsa reports, and the expectation of
// r1 conj(r2) exactly the numerator of the Vaughan-Andersen correlation. Power that arrives
// outside a partial grid meets a zero field (MEG there is the same lower bound). Phases take one of
// 2048 equally spaced values, which has the same moments as a uniform phase up to order 2047.
// What is statistical: the estimates (their 95 % intervals are given) and the shape of the
// distribution, which tends to Rayleigh as `waves` grows (the power correlation of two antennas
// approaches the ECC to within about 1/waves: SimulatedPair::expected_power_correlation gives the
// exact value for the number of waves used).
//
// Options: a dominant (Rician) wave of given direction, polarisation and K-factor, with the same
// random phase for every antenna of a realisation; a random orientation per realisation, the same
// for every antenna (one rigid device), uniform over all orientations or with the up axis within a
// largest tilt of vertical (then the turned antenna's field is interpolated, pattern/interpolate.hpp).
//
// Reproducible: realisations are drawn in blocks of 4096, block b with xoshiro256** stream (seed, b)
// (pattern/random.hpp), so the result depends on the seed only, not on the number of threads.
#pragma once
#include <cstdint>
#include <optional>
#include <vector>

#include "pattern/combining.hpp"
#include "pattern/environment.hpp"
#include "pattern/far_field.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// The polarisation of an incoming plane wave, named as the wave's own sense (IEEE Std 145: RHCP
// turns clockwise looking along the direction of propagation). Slant: +45 deg from vertical toward
// horizontal (theta-hat + phi-hat) / sqrt 2, and -45 deg.
enum class WavePolarisation { vertical, horizontal, slant_plus, slant_minus, rhcp, lhcp };
inline constexpr WavePolarisation all_wave_polarisations[] = {WavePolarisation::vertical,    WavePolarisation::horizontal,
                                                             WavePolarisation::slant_plus,  WavePolarisation::slant_minus,
                                                             WavePolarisation::rhcp,        WavePolarisation::lhcp};
const char* to_string(WavePolarisation p);
bool parse_wave_polarisation(const std::string& name, WavePolarisation& out);

// The unit field vector (Cartesian, world frame) of a wave arriving from (theta, phi): it
// propagates along -r-hat, so in the basis at r-hat an RHCP wave is (theta-hat + j phi-hat) / sqrt 2,
// which an RHCP antenna (E ~ theta-hat - j phi-hat) receives fully: E . p with no conjugate.
CVec3 incoming_field(WavePolarisation p, double theta_deg, double phi_deg);
// The field a partner antenna sends toward us when it stands in direction (theta, phi) from us:
// its own field in the opposite direction, normalised to unit power (the partner's pattern is
// read in the world frame, up = +z). Errors: the direction outside its data, a zero field there,
// data without phase.
Result<CVec3> partner_field(const FarFieldSet& partner, std::size_t freq_index, double theta_deg, double phi_deg);

// The largest K-factor the study takes (linear; 60 dB): beyond it the diffuse part is below the
// simulation's resolution and the link is no longer a fading one.
constexpr double max_k_factor = 1e6;

struct DominantWave {
    double theta_deg = 90, phi_deg = 0;  // where it arrives from, world frame
    CVec3 field{1, 0, 0};                // unit incoming field vector (incoming_field, partner_field)
    double k_factor = 0;                 // power of the dominant wave over the diffuse power, linear
};

struct FadingOptions {
    std::size_t realisations = 100000;
    std::uint64_t seed = 1;
    int waves = 100;  // diffuse plane waves per realisation
    std::optional<DominantWave> dominant;
    // A random orientation per realisation with the up axis within this tilt of vertical (180:
    // uniform over all orientations; roll and azimuth uniform).
    std::optional<double> random_tilt_max_deg;
    std::vector<double> outages{0.01, 0.1, 0.5};
    int threads = 1;
    int cdf_points = 200;  // points of each distribution curve, from probability max(10/N, 1e-6) to 1
};
// Checks the counts (realisations 100 .. 1e7 and their product with the antennas at most 4e7,
// waves 1 .. 10000, threads 1 .. 64), the outages, the dominant wave (finite K >= 0, a unit field
// vector across its direction) and the tilt (0 .. 180 deg).
Status validate(const FadingOptions& o, std::size_t antennas);

struct Interval {
    double lo = 0, hi = 0;
};
// One outage's level (linear power, the unit of gain), with the 95 % interval from the order
// statistics around it (binomial, distribution-free).
struct LevelEstimate {
    double outage = 0;
    double level = 0;
    Interval ci95;
};
// A point of a distribution curve: P(power <= level) = probability.
struct CdfPoint {
    double level = 0;
    double probability = 0;
};

struct SimulatedAntenna {
    double mean = 0;  // mean received power, linear (gain)
    Interval mean_ci95;
    std::vector<LevelEstimate> levels;  // per outage
    LevelEstimate level_1pct;           // always, for the fade depth
    double fade_depth_db = 0;           // mean over the 1 % level
    std::vector<CdfPoint> cdf;
    // The closed-form reference where there is one (fixed orientation): the mean (MEG in the
    // environment, plus the dominant wave's power), the antenna's own K-factor
    // K |E(d0) . p|^2 / MEG, and the Rayleigh or Rician levels (1 - Q1, pattern/marcum.hpp).
    std::optional<double> analytic_mean;
    std::optional<double> analytic_k;
    std::vector<double> analytic_levels;  // per outage, when analytic_mean is given
    std::vector<CdfPoint> analytic_cdf;   // at the probabilities of `cdf`, when analytic_mean is given
};

struct SimulatedPair {
    double power_correlation = 0;  // of |r1|^2 and |r2|^2
    Interval power_correlation_ci95;  // from 20 batch means (Student's t, 19 degrees of freedom)
    // |mean(r1 conj r2)|^2 / (mean|r1|^2 mean|r2|^2): the estimate of the envelope correlation
    // whose expectation the Vaughan-Andersen formula gives for any number of waves.
    double complex_correlation_squared = 0;
    std::vector<LevelEstimate> selection, mrc;  // per outage: max(|r1|^2, |r2|^2) and |r1|^2 + |r2|^2
    std::vector<CdfPoint> selection_cdf, mrc_cdf;
    // Fixed orientation, no dominant wave: the analytic ECC and the exact combining figures.
    std::optional<double> analytic_ecc;
    // Fixed orientation, no dominant wave: the power correlation this simulation has in
    // expectation with its finite number of waves (tends to analytic_ecc as the waves grow; the
    // difference is O(1/waves), of either sign; the formula is in fading.cpp
    // finite_wave_correlation). The simulated figure's interval is around this value, not the ECC.
    std::optional<double> expected_power_correlation;
    std::optional<CombiningFigures> analytic;
    std::vector<CdfPoint> analytic_selection_cdf, analytic_mrc_cdf;  // with `analytic`
};

struct FadingResult {
    std::size_t realisations = 0;
    std::uint64_t seed = 0;
    int waves = 0;
    int vertical_waves = 0, horizontal_waves = 0;
    std::vector<SimulatedAntenna> antennas;
    std::optional<Result<SimulatedPair>> pair;  // with exactly two antennas
};

// One antenna: a set and the frequency to use.
struct FadingAntenna {
    const FarFieldSet* set = nullptr;
    std::size_t freq_index = 0;
};

// Simulates the antennas in environment e. Antennas on other grids are interpolated once onto the
// first one's grid. Errors: an invalid environment or option, data that cannot be simulated
// (relative data on a partial grid, a single cut; the pair, a dominant wave or turning need phase;
// turning needs the full sphere; total-only data need a polarisation-blind environment).
// Cost: about realisations x waves x (2 random draws' worth + antennas complex products) without
// turning; with turning, a direction change and a bilinear interpolation per wave and antenna.
// Memory: 16 bytes per realisation and antenna, plus sorting copies.
Result<FadingResult> simulate_fading(const std::vector<FadingAntenna>& antennas, const Environment& e,
                                     const FadingOptions& o);

}  // namespace ellipsa
