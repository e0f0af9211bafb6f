// Picking a direction from a ray: which direction of the pattern lies under the cursor.
// The ray is intersected with the surface triangles (Moller-Trumbore); every vertex lies on its own
// direction from the origin, so the hit point's direction is the picked direction. Cost: a box test
// per block of 16 x 16 grid cells (SurfaceMesh::pick_boxes), then ray-triangle tests only in the
// blocks the ray crosses, nearest first: well under a millisecond even for a 0.25-degree grid
// (testing all 2 million triangles of that grid took tens of milliseconds). Only when the cursor moves.
// The "not measured" region (SurfaceMesh::unsampled, a few thousand triangles) is tested too: a ray
// that meets it first gives a Pick with measured = false, which callers never read as data.
#pragma once
#include <optional>

#include "viewer/scene/camera.hpp"
#include "viewer/scene/surface_mesh.hpp"

namespace ellipsa::viewer {

struct Pick {
    double theta_deg = 0, phi_deg = 0;
    glm::dvec3 point{0};  // on the surface
    double distance = 0;  // along the ray
    bool measured = true;  // false: the ray met the "not measured" region first (no data there)
};

// Nearest hit of the ray with the surface or its "not measured" region, or nullopt when it misses (or only grazes the origin).
std::optional<Pick> pick_direction(const SurfaceMesh& m, const Ray& ray);

}  // namespace ellipsa::viewer
