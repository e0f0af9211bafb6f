// The orbit camera of the 3D view: it circles the origin (the antenna) at a distance, looking in.
// azimuth_deg and elevation_deg say where the eye is, in the antenna's own frame (azimuth from +x
// toward +y, elevation above the xy-plane; +z is up on screen). Pure math on glm matrices.
#pragma once
#include <glm/glm.hpp>

namespace ellipsa::viewer {

struct OrbitCamera {
    double azimuth_deg = 35;
    double elevation_deg = 22;
    double distance = 5.4;   // in units of the surface's peak radius (1)
    double fov_deg = 30;     // vertical field of view

    void reset() { *this = OrbitCamera{}; }
    // Drag by pixels: 0.4 deg per pixel; elevation is held inside (-89.5, 89.5).
    void orbit(double dx_px, double dy_px);
    // Wheel steps: each step brings the eye 10 % closer (positive) or further.
    void zoom(double steps);
    // Look along one axis: the eye on +x, -x, +y, -y, +z (top) or -z (bottom).
    enum class Preset { px, nx, py, ny, pz, nz };
    void look_from(Preset p);

    glm::vec3 eye() const;
    glm::mat4 view() const;
    glm::mat4 projection(double aspect) const;
};

struct Ray {
    glm::dvec3 origin;
    glm::dvec3 dir;  // unit
};

// The ray under a pixel (x right, y down, origin at the top-left of a w x h view).
Ray ray_through_pixel(const OrbitCamera& c, double x_px, double y_px, double w_px, double h_px);

// Where a world point lands in the view: pixel x, y (y down) and whether it is in front of the eye.
struct Projected {
    double x = 0, y = 0;
    bool visible = false;
};
Projected project(const OrbitCamera& c, glm::dvec3 p, double w_px, double h_px);

}  // namespace ellipsa::viewer
