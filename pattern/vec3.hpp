// Small value types for directions and complex field vectors.
// The core uses these instead of a linear-algebra library so the data layout stays plain.
#pragma once
#include <cmath>
#include <complex>

namespace ellipsa {

using cplx = std::complex<double>;

inline constexpr double pi = 3.14159265358979323846;
inline constexpr double deg = pi / 180.0;  // multiply degrees by this to get radians

struct Vec3 {
    double x = 0, y = 0, z = 0;
};
inline Vec3 operator+(Vec3 a, Vec3 b) { return {a.x + b.x, a.y + b.y, a.z + b.z}; }
inline Vec3 operator-(Vec3 a, Vec3 b) { return {a.x - b.x, a.y - b.y, a.z - b.z}; }
inline Vec3 operator*(double s, Vec3 a) { return {s * a.x, s * a.y, s * a.z}; }
inline double dot(Vec3 a, Vec3 b) { return a.x * b.x + a.y * b.y + a.z * b.z; }
inline Vec3 cross(Vec3 a, Vec3 b) {
    return {a.y * b.z - a.z * b.y, a.z * b.x - a.x * b.z, a.x * b.y - a.y * b.x};
}
inline double norm(Vec3 a) { return std::sqrt(dot(a, a)); }
inline Vec3 normalized(Vec3 a) {
    double n = norm(a);
    return n > 0 ? (1.0 / n) * a : a;
}

// A complex 3-vector: the Cartesian phasor (Ex, Ey, Ez) of a far field.
struct CVec3 {
    cplx x, y, z;
};
inline CVec3 operator+(const CVec3& a, const CVec3& b) { return {a.x + b.x, a.y + b.y, a.z + b.z}; }
inline CVec3 operator*(double s, const CVec3& a) { return {s * a.x, s * a.y, s * a.z}; }
inline CVec3 operator*(cplx s, Vec3 a) { return {s * a.x, s * a.y, s * a.z}; }
// Projection of a complex vector on a real unit vector.
inline cplx dot(const CVec3& a, Vec3 b) { return a.x * b.x + a.y * b.y + a.z * b.z; }

// 3x3 rotation matrix, row-major. apply(R, v) = R v; apply_transposed(R, v) = R^T v.
struct Mat3 {
    double m[3][3] = {{1, 0, 0}, {0, 1, 0}, {0, 0, 1}};
};
inline Vec3 apply(const Mat3& r, Vec3 v) {
    return {r.m[0][0] * v.x + r.m[0][1] * v.y + r.m[0][2] * v.z,
            r.m[1][0] * v.x + r.m[1][1] * v.y + r.m[1][2] * v.z,
            r.m[2][0] * v.x + r.m[2][1] * v.y + r.m[2][2] * v.z};
}
inline Vec3 apply_transposed(const Mat3& r, Vec3 v) {
    return {r.m[0][0] * v.x + r.m[1][0] * v.y + r.m[2][0] * v.z,
            r.m[0][1] * v.x + r.m[1][1] * v.y + r.m[2][1] * v.z,
            r.m[0][2] * v.x + r.m[1][2] * v.y + r.m[2][2] * v.z};
}
inline CVec3 apply(const Mat3& r, const CVec3& v) {
    return {r.m[0][0] * v.x + r.m[0][1] * v.y + r.m[0][2] * v.z,
            r.m[1][0] * v.x + r.m[1][1] * v.y + r.m[1][2] * v.z,
            r.m[2][0] * v.x + r.m[2][1] * v.y + r.m[2][2] * v.z};
}
inline Mat3 operator*(const Mat3& a, const Mat3& b) {
    Mat3 c;
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            c.m[i][j] = a.m[i][0] * b.m[0][j] + a.m[i][1] * b.m[1][j] + a.m[i][2] * b.m[2][j];
    return c;
}
inline Mat3 transposed(const Mat3& a) {
    Mat3 t;
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) t.m[i][j] = a.m[j][i];
    return t;
}
// Right-handed rotations about the axes by an angle in radians.
Mat3 rotation_x(double angle_rad);
Mat3 rotation_y(double angle_rad);
Mat3 rotation_z(double angle_rad);
// Extrinsic rotation: first about x, then y, then z (R = Rz Ry Rx).
Mat3 rotation_xyz_deg(double x_deg, double y_deg, double z_deg);
// Rotation about an arbitrary unit axis (Rodrigues).
Mat3 rotation_axis(Vec3 axis, double angle_rad);

// Spherical directions and their unit vectors (conventions.md: theta from +z, phi from +x toward +y).
inline Vec3 direction(double theta_rad, double phi_rad) {
    double st = std::sin(theta_rad);
    return {st * std::cos(phi_rad), st * std::sin(phi_rad), std::cos(theta_rad)};
}
inline Vec3 theta_hat(double theta_rad, double phi_rad) {
    double ct = std::cos(theta_rad);
    return {ct * std::cos(phi_rad), ct * std::sin(phi_rad), -std::sin(theta_rad)};
}
inline Vec3 phi_hat(double phi_rad) { return {-std::sin(phi_rad), std::cos(phi_rad), 0.0}; }

// theta in [0, pi], phi in [0, 2 pi) of a unit (or any non-zero) vector.
void to_spherical(Vec3 r, double& theta_rad, double& phi_rad);

// Wrap an angle in degrees into [0, 360).
inline double wrap360(double a_deg) {
    double w = std::fmod(a_deg, 360.0);
    if (w < 0) w += 360.0;
    if (w >= 360.0) w -= 360.0;
    return w;
}

}  // namespace ellipsa
