#include "pattern/mounting.hpp"

#include <cmath>

namespace ellipsa {

namespace {

// cos and sin of an angle in degrees, exact (0, +-1) at multiples of 90 deg.
void cos_sin_deg(double angle_deg, double& c, double& s) {
    const double q = angle_deg / 90.0;
    if (q == std::round(q) && std::abs(q) < 1e15) {
        const long long k = ((static_cast<long long>(q) % 4) + 4) % 4;
        const double cs[4] = {1, 0, -1, 0};
        c = cs[k];
        s = cs[(k + 3) % 4];
        return;
    }
    c = std::cos(angle_deg * deg);
    s = std::sin(angle_deg * deg);
}

}  // namespace

const char* to_string(Axis a) {
    switch (a) {
        case Axis::x: return "x";
        case Axis::y: return "y";
        case Axis::z: return "z";
    }
    return "z";
}

Vec3 direction_deg(double theta_deg, double phi_deg) {
    double ct, st, cp, sp;
    cos_sin_deg(theta_deg, ct, st);
    cos_sin_deg(phi_deg, cp, sp);
    return {st * cp, st * sp, ct};
}

Mat3 axis_rotation_deg(Axis a, double angle_deg) {
    double c, s;
    cos_sin_deg(angle_deg, c, s);
    Mat3 r;
    switch (a) {
        case Axis::x: r.m[1][1] = c, r.m[1][2] = -s, r.m[2][1] = s, r.m[2][2] = c; break;
        case Axis::y: r.m[0][0] = c, r.m[0][2] = s, r.m[2][0] = -s, r.m[2][2] = c; break;
        case Axis::z: r.m[0][0] = c, r.m[0][1] = -s, r.m[1][0] = s, r.m[1][1] = c; break;
    }
    return r;
}

Mat3 up_rotation(Vec3 up) {
    const Vec3 a = normalized(up);
    const Vec3 z{0, 0, 1};
    const double c = dot(a, z);
    const Vec3 axis = cross(a, z);  // |axis| = sin of the angle
    const double s = norm(axis);
    Mat3 r;
    if (s == 0) {
        if (c < 0) r = axis_rotation_deg(Axis::x, 180);
        return r;
    }
    // Rodrigues from cos and sin directly (no angle round trip): R = c I + s [k]x + (1 - c) k k^T.
    const Vec3 k = (1.0 / s) * axis;
    const double kk[3] = {k.x, k.y, k.z};
    const double kx[3][3] = {{0, -k.z, k.y}, {k.z, 0, -k.x}, {-k.y, k.x, 0}};
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) r.m[i][j] = (i == j ? c : 0.0) + s * kx[i][j] + (1 - c) * kk[i] * kk[j];
    return r;
}

Mat3 mounting_matrix(const Mounting& m) {
    Mat3 r = up_rotation(m.up);
    for (const AxisTurn& t : m.turns) r = axis_rotation_deg(t.axis, t.angle_deg) * r;
    return r;
}

bool is_identity(const Mat3& r) {
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            if (std::abs(r.m[i][j] - (i == j ? 1.0 : 0.0)) > 1e-12) return false;
    return true;
}

bool is_identity(const Mounting& m) { return is_identity(mounting_matrix(m)); }

Mounting resolve_mounting(const Mounting& from_file, const std::optional<Vec3>& up,
                          const std::vector<AxisTurn>& turns) {
    Mounting m = from_file;
    if (up) m = Mounting{*up, {}};
    m.turns.insert(m.turns.end(), turns.begin(), turns.end());
    return m;
}

}  // namespace ellipsa
