// Picking a direction from a ray: which direction of the pattern lies under the cursor.
// The ray is intersected with the surface triangles (Moller-Trumbore); every vertex lies on its own
// direction from the origin, so the hit point's direction is the picked direction. Cost: one
// ray-triangle test per triangle (about 1 ms for a 1-degree grid), only when the cursor moves.
#pragma once
#include <optional>

#include "viewer/scene/camera.hpp"
#include "viewer/scene/surface_mesh.hpp"

namespace ellipsa::viewer {

struct Pick {
    double theta_deg = 0, phi_deg = 0;
    glm::dvec3 point{0};  // on the surface
    double distance = 0;  // along the ray
};

// Nearest hit of the ray with the surface, or nullopt when it misses (or only grazes the origin).
std::optional<Pick> pick_direction(const SurfaceMesh& m, const Ray& ray);

}  // namespace ellipsa::viewer
