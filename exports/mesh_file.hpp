// A triangle mesh as a 3D file: glTF 2.0 binary (.glb) and PLY, each with per-vertex colours, so
// the gain surface can be dropped into a CAD model, a 3D document or a web page. The mesh comes
// in as plain interleaved arrays (the viewer's surface, viewer/scene/surface_mesh.hpp, is one).
//
// glTF 2.0 (Khronos, "glTF 2.0 Specification"): one buffer, four tightly packed buffer views
// (POSITION, NORMAL and COLOR_0 as float VEC3, indices as UNSIGNED_INT), POSITION with its
// min/max, every view 4-byte aligned; the JSON chunk padded with spaces and the BIN chunk with
// zeros to a multiple of 4. glTF's +Y is up and its unit is the metre: a direction (x, y, z) of
// ours (+z up) is written as (x, z, -y), and the radius 1 is the peak. COLOR_0 is linear light,
// so the sRGB colours of the colour map are converted (IEC 61966-2-1); the material is
// unlit (KHR_materials_unlit, used but not required) and otherwise non-metallic and rough, so
// a viewer shows the map's colours. Zero-area triangles (the rows at the poles) are left out.
//
// PLY (binary little-endian 1.0): vertex x, y, z, nx, ny, nz (float) and red, green, blue
// (uchar, sRGB); faces as a uchar count and int indices; the frame is ours (+z up).
#pragma once
#include <cstddef>
#include <cstdint>
#include <string>
#include <vector>

namespace ellipsa::exports {

struct MeshView {
    const float* vertices = nullptr;  // interleaved, `stride` floats per vertex
    std::size_t vertex_count = 0;
    int stride = 9;
    int position = 0;  // offset of x, y, z
    int normal = 3;    // offset of nx, ny, nz (-1: none; written as the normalised position)
    int colour = 6;    // offset of r, g, b in 0..1 sRGB
    const std::uint32_t* indices = nullptr;  // triangles, three per face
    std::size_t index_count = 0;
};

struct MeshFileInfo {
    std::string name;       // node and mesh name
    std::string generator;  // asset.generator ("ellipsa 0.1.0")
    std::string comment;    // PLY comment line (one line)
};

// One part of a file with several: in glTF its own node, mesh and material, each named `name`
// (the gain surface's material is "colour map"), so a CAD or web viewer lists it by name; PLY
// names no parts, so there the parts' faces follow one another in one list (the file's comment
// line says which faces are which).
struct MeshPart {
    MeshView mesh;
    std::string name;      // node and mesh name
    std::string material;  // material name
};

// The .glb bytes. Cost: one pass over the vertices and indices.
std::string to_glb(const MeshView& m, const MeshFileInfo& info);
// Several parts, each with its own buffer views, accessors, mesh, node and material, in order.
std::string to_glb(const std::vector<MeshPart>& parts, const MeshFileInfo& info);
// The .ply bytes (binary little-endian).
std::string to_ply(const MeshView& m, const MeshFileInfo& info);
// Several parts as one vertex list and one face list (part 2's indices moved past part 1's vertices).
std::string to_ply(const std::vector<MeshPart>& parts, const MeshFileInfo& info);

}  // namespace ellipsa::exports
