// The mounting frame: how the antenna described in a file is installed in the world
// (conventions.md, "The mounting frame").
//
// A file's axes are the model's or the positioner's. The world frame has +z up (the zenith) and
// the horizon in the xy-plane. A mounting names the file's direction that points up once the
// antenna is installed, then turns the installed antenna further about the world axes:
//
//   R = T_n ... T_2 T_1 U
//
// where U is the smallest rotation taking the up direction to +z (for up = -z: 180 deg about x)
// and T_1, T_2, ... are the turns in the order given. The whole pattern turns: E'(r) = R E(R^T r)
// (pattern/rotate.hpp). Matrices of quarter turns and of axis-aligned up directions are exact
// (entries 0, +-1), so rotations that map a grid onto itself stay exact.
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "pattern/result.hpp"
#include "pattern/vec3.hpp"

namespace ellipsa {

enum class Axis { x, y, z };
const char* to_string(Axis a);  // "x", "y", "z"

// One right-handed turn about a world axis.
struct AxisTurn {
    Axis axis = Axis::z;
    double angle_deg = 0;
};

struct Mounting {
    Vec3 up{0, 0, 1};             // the file's direction that points up when installed (unit length)
    std::vector<AxisTurn> turns;  // then these turns about the world axes, applied in order
};

// The unit direction at (theta, phi) in degrees, with exact components at multiples of 90 deg
// (so "90,0" is exactly +x).
Vec3 direction_deg(double theta_deg, double phi_deg);
// Right-handed rotation about a world axis; exact at multiples of 90 deg.
Mat3 axis_rotation_deg(Axis a, double angle_deg);
// The smallest rotation taking `up` (any non-zero vector) to +z; 180 deg about x for -z.
Mat3 up_rotation(Vec3 up);
// R = T_n ... T_1 U as above. Costs a few multiplications.
Mat3 mounting_matrix(const Mounting& m);
// True when the mounting leaves every direction where it is (R is the identity to 1e-12).
bool is_identity(const Mounting& m);
bool is_identity(const Mat3& r);

// The mounting that applies when a file declares one and the user gives options too. An up axis
// from the user replaces the file's whole mounting (the file's turns were stated after its own up
// axis and mean nothing after another one); turns from the user follow whatever mounting stands.
Mounting resolve_mounting(const Mounting& from_file, const std::optional<Vec3>& up,
                          const std::vector<AxisTurn>& turns);

// The text forms, shared by the command line (--up, --rotate) and the CSV metadata
// (mounting-up, mounting-turns; docs/far-field-csv.md). Errors say what was expected and
// carry no place (the caller adds the option or the file line).
//   up:    "+x", "-x", "+y", "-y", "+z", "-z" (the sign may be left out for +), or
//          "THETA,PHI" in degrees: a direction in the file's frame
//   turns: "AXIS:DEG,AXIS:DEG,..." with AXIS x, y or z (world axes), applied left to right;
//          "" is no turn
Result<Vec3> parse_up(std::string_view text);
Result<std::vector<AxisTurn>> parse_turns(std::string_view text);
// "+x" for an axis-aligned unit direction, else "THETA,PHI" (shortest round trip).
std::string format_up(Vec3 up);
// "z:30,x:10" ("" for none).
std::string format_turns(const std::vector<AxisTurn>& turns);

}  // namespace ellipsa
