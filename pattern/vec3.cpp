#include "pattern/vec3.hpp"

namespace ellipsa {

Mat3 rotation_x(double a) {
    double c = std::cos(a), s = std::sin(a);
    return Mat3{{{1, 0, 0}, {0, c, -s}, {0, s, c}}};
}
Mat3 rotation_y(double a) {
    double c = std::cos(a), s = std::sin(a);
    return Mat3{{{c, 0, s}, {0, 1, 0}, {-s, 0, c}}};
}
Mat3 rotation_z(double a) {
    double c = std::cos(a), s = std::sin(a);
    return Mat3{{{c, -s, 0}, {s, c, 0}, {0, 0, 1}}};
}
Mat3 rotation_xyz_deg(double x_deg, double y_deg, double z_deg) {
    return rotation_z(z_deg * deg) * rotation_y(y_deg * deg) * rotation_x(x_deg * deg);
}
Mat3 rotation_axis(Vec3 k, double a) {
    k = normalized(k);
    double c = std::cos(a), s = std::sin(a), t = 1 - c;
    return Mat3{{{t * k.x * k.x + c, t * k.x * k.y - s * k.z, t * k.x * k.z + s * k.y},
                 {t * k.x * k.y + s * k.z, t * k.y * k.y + c, t * k.y * k.z - s * k.x},
                 {t * k.x * k.z - s * k.y, t * k.y * k.z + s * k.x, t * k.z * k.z + c}}};
}

void to_spherical(Vec3 r, double& theta_rad, double& phi_rad) {
    double rho = std::hypot(r.x, r.y);
    theta_rad = std::atan2(rho, r.z);
    phi_rad = std::atan2(r.y, r.x);
    if (phi_rad < 0) phi_rad += 2 * pi;
    if (phi_rad >= 2 * pi) phi_rad -= 2 * pi;
}

}  // namespace ellipsa
