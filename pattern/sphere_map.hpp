// Whole-sphere maps: the value of a quantity at every grid sample, map projections (rectangular
// theta/phi and azimuth/elevation, and Hammer's equal-area projection), contour lines, and the
// grid sample that holds a direction. Pure code: the drawing is in exports/map_plot.hpp.
//
// Projections map a direction to (x, y) with y pointing up (toward +z); azimuth = phi and
// elevation = 90 deg - theta (conventions.md):
//   theta_phi          x = phi in [0, 360), y = 90 - theta (theta 0 at the top, 180 at the bottom)
//   azimuth_elevation  x = azimuth in [-180, 180), y = elevation in [-90, 90]
//   hammer             Hammer's equal-area projection (E. Hammer, 1892; formulas as given by
//                      J. P. Snyder, "Flattening the Earth", 1993, pp. 130-133), with
//                      longitude l = azimuth in [-180, 180] and latitude b = elevation:
//                        x = 2 sqrt2 cos b sin(l/2) / sqrt(1 + cos b cos(l/2))
//                        y = sqrt2 sin b / sqrt(1 + cos b cos(l/2))
//                      inverse with z = sqrt(1 - (x/4)^2 - (y/2)^2):
//                        l = 2 atan2(z x, 2 (2 z^2 - 1)),  b = asin(z y).
//                      The sphere of radius 1 fills an ellipse of semi-axes 2 sqrt2 and sqrt2, of
//                      area 4 pi: every area on the map equals the solid angle it shows, in sr.
#pragma once
#include <cstddef>
#include <optional>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/result.hpp"

namespace ellipsa {

// What a map shows at each direction.
enum class MapQuantity {
    component,         // a component's power in dB (dBi / dBic / dB)
    axial_ratio,       // AR in dB; +inf for a linear field
    circular_balance,  // RHCP minus LHCP, dB
    linear_balance,    // vertical (theta) minus horizontal (phi), dB
    tilt,              // tilt of the major axis from theta-hat toward phi-hat, deg in (-90, 90]
    difference         // A minus B of one component, dB
};
inline constexpr MapQuantity all_map_quantities[] = {MapQuantity::component, MapQuantity::axial_ratio,
                                                     MapQuantity::circular_balance, MapQuantity::linear_balance,
                                                     MapQuantity::tilt, MapQuantity::difference};
const char* to_string(MapQuantity q);  // "component", "axial-ratio", "rhcp-minus-lhcp", "v-minus-h", "tilt", "difference"
bool parse_map_quantity(const char* name, MapQuantity& out);
bool map_quantity_needs_phase(MapQuantity q);

// Values of the quantity at every grid sample of frequency fi (row-major like the field arrays).
// NaN where there is no value (zero field for ratios and tilt, B outside its data). For
// `difference`, b (frequency fb) is interpolated onto s's grid when the grids differ.
// Errors: a quantity or component the data cannot give (no phase, total only), no B for a difference.
Result<std::vector<double>> map_values(const FarFieldSet& s, std::size_t fi, MapQuantity q, Component c,
                                       const FarFieldSet* b = nullptr, std::size_t fb = 0);

enum class MapProjection { theta_phi, azimuth_elevation, hammer };
inline constexpr MapProjection all_map_projections[] = {MapProjection::hammer, MapProjection::theta_phi,
                                                       MapProjection::azimuth_elevation};
const char* to_string(MapProjection p);  // "theta-phi", "az-el", "hammer"
bool parse_map_projection(const char* name, MapProjection& out);

struct MapPoint {
    double x = 0, y = 0;
};
struct MapBounds {
    double x_min = 0, x_max = 0, y_min = 0, y_max = 0;
};
MapBounds map_bounds(MapProjection p);
// Direction (degrees) to map coordinates. Cost: a few trigonometric calls.
MapPoint project(MapProjection p, double theta_deg, double phi_deg);
// The same with the horizontal angle taken as given, not wrapped: the azimuth in [-180, 180]
// (az-el, hammer) or phi in [0, 360] (theta-phi). Lets a line end exactly on either map edge.
MapPoint project_unwrapped(MapProjection p, double theta_deg, double x_angle_deg);
// The horizontal angle of a direction on the map: azimuth wrapped to [-180, 180) or phi to [0, 360).
double map_x_angle(MapProjection p, double phi_deg);
// Map coordinates to (theta_deg, phi_deg in [0, 360)); nullopt outside the map.
std::optional<std::pair<double, double>> unproject(MapProjection p, double x, double y);

// The grid sample whose cell holds a direction (the cell of pattern/integrate), or nullopt
// outside the sampled region.
std::optional<std::size_t> sample_of(const Grid& g, double theta_deg, double phi_deg);

// Contour segments at `level` by marching squares over the grid cells (values at the samples,
// crossings interpolated linearly along the cell edges; across the phi seam when phi wraps).
// Cells with a NaN corner are skipped; +inf counts as above every level. Ends in degrees.
struct ContourSegment {
    double theta0_deg, phi0_deg, theta1_deg, phi1_deg;
};
std::vector<ContourSegment> contour_segments(const Grid& g, const std::vector<double>& values, double level);

}  // namespace ellipsa
