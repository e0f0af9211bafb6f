#include "viewer/scene/camera.hpp"

#include <algorithm>
#include <cmath>
#include <glm/gtc/matrix_transform.hpp>

namespace ellipsa::viewer {

namespace {
constexpr double to_rad = 3.14159265358979323846 / 180.0;
}

void OrbitCamera::orbit(double dx, double dy) {
    azimuth_deg = std::fmod(azimuth_deg - 0.4 * dx, 360.0);
    elevation_deg = std::clamp(elevation_deg + 0.4 * dy, -89.5, 89.5);
}

void OrbitCamera::zoom(double steps) { distance = std::clamp(distance * std::pow(0.9, steps), 1.2, 20.0); }

void OrbitCamera::look_from(Preset p) {
    switch (p) {
        case Preset::px: azimuth_deg = 0, elevation_deg = 0; break;
        case Preset::nx: azimuth_deg = 180, elevation_deg = 0; break;
        case Preset::py: azimuth_deg = 90, elevation_deg = 0; break;
        case Preset::ny: azimuth_deg = -90, elevation_deg = 0; break;
        case Preset::pz: azimuth_deg = -90, elevation_deg = 89.5; break;
        case Preset::nz: azimuth_deg = -90, elevation_deg = -89.5; break;
    }
}

glm::vec3 OrbitCamera::eye() const {
    const double a = azimuth_deg * to_rad, e = elevation_deg * to_rad;
    return glm::vec3(float(distance * std::cos(e) * std::cos(a)), float(distance * std::cos(e) * std::sin(a)),
                     float(distance * std::sin(e)));
}

glm::mat4 OrbitCamera::view() const { return glm::lookAt(eye(), glm::vec3(0), glm::vec3(0, 0, 1)); }

glm::mat4 OrbitCamera::projection(double aspect) const {
    return glm::perspective(float(fov_deg * to_rad), float(std::max(aspect, 1e-3)), 0.05f, 100.0f);
}

Ray ray_through_pixel(const OrbitCamera& c, double x, double y, double w, double h) {
    const glm::dmat4 inv = glm::inverse(glm::dmat4(c.projection(w / h)) * glm::dmat4(c.view()));
    const double nx = 2 * x / w - 1, ny = 1 - 2 * y / h;
    glm::dvec4 a = inv * glm::dvec4(nx, ny, -1, 1), b = inv * glm::dvec4(nx, ny, 1, 1);
    glm::dvec3 pa = glm::dvec3(a) / a.w, pb = glm::dvec3(b) / b.w;
    return {pa, glm::normalize(pb - pa)};
}

Projected project(const OrbitCamera& c, glm::dvec3 p, double w, double h) {
    glm::dvec4 q = glm::dmat4(c.projection(w / h)) * glm::dmat4(c.view()) * glm::dvec4(p, 1);
    Projected out;
    if (q.w <= 1e-9) return out;
    out.x = (q.x / q.w * 0.5 + 0.5) * w;
    out.y = (0.5 - q.y / q.w * 0.5) * h;
    out.visible = true;
    return out;
}

}  // namespace ellipsa::viewer
