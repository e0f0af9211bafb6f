// Polarisation ellipse geometry: the path the field vector traces in one period, in the plane
// across the direction of propagation, and the small ellipses ("glyphs") drawn on the surface.
//
// Plane coordinates are (x, y) = (phi-hat, theta-hat) components: an observer looking along the
// propagation direction sees phi-hat to the right and theta-hat up, so a right-hand field turns
// clockwise in these coordinates (IEEE Std 145-2013 sense, exp(+j w t)).
#pragma once
#include <cstddef>
#include <vector>

#include "pattern/far_field.hpp"
#include "pattern/polarisation.hpp"
#include "viewer/scene/colormap.hpp"
#include "viewer/scene/surface_mesh.hpp"

namespace ellipsa::viewer {

struct PlanePoint {
    double x = 0, y = 0;  // phi-hat, theta-hat components
};

// n points of Re{(E_theta theta-hat + E_phi phi-hat) exp(j w t)} for w t = 0 .. 2 pi (exclusive),
// in time order, scaled so that the field magnitude sqrt(|E_theta|^2 + |E_phi|^2) is 1.
// Empty for a zero field.
std::vector<PlanePoint> ellipse_path(cplx e_theta, cplx e_phi, int n);

// Semi-axes of the ellipse on the same scale (a^2 + b^2 = 1), major axis first.
struct EllipseAxes {
    double semi_major = 0, semi_minor = 0;
};
EllipseAxes ellipse_axes(cplx e_theta, cplx e_phi);

// Twice the signed area swept by a closed path in (x, y); negative = clockwise.
double signed_area2(const std::vector<PlanePoint>& path);

// Glyph line segments over the sphere: an ellipse at every sampled direction whose shown component
// is above the surface floor, lifted a little off the surface, with a short arrowhead showing
// the sense. Colour: right-hand, left-hand or linear (the core's sense_of: linear_axial_ratio_db and up).
struct GlyphOptions {
    double spacing_deg = 15;  // between glyph centres along theta, and about the same along phi
    double size = 0.06;       // major semi-axis in view units (the peak radius is 1)
    int points = 24;          // per ellipse
    Rgb right{0.84f, 0.37f, 0.0f};   // Okabe-Ito vermillion
    Rgb left{0.0f, 0.30f, 0.55f};    // dark blue
    Rgb linear{0.15f, 0.15f, 0.15f}; // near black
};
struct LineSet {
    std::vector<float> vertices;  // xyz rgb per vertex, two vertices per segment
    std::size_t segments() const { return vertices.size() / 12; }
    void add(const Vec3& a, const Vec3& b, Rgb c);
};
LineSet build_glyphs(const FarFieldSet& s, std::size_t freq_index, const SurfaceMesh& m, const GlyphOptions& o);

// A ring along a cut, lifted just off the surface: the active cut shown on the 3D view.
LineSet build_cut_ring(const FarFieldSet& s, const SurfaceMesh& m, const std::vector<double>& theta_deg,
                       const std::vector<double>& phi_deg, Rgb colour);

// Axes through the origin (x red-ish, y green-ish, z blue-ish but muted), length in view units.
LineSet build_axes(double length);

}  // namespace ellipsa::viewer
