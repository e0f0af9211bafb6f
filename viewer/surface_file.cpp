// The gain surface as a 3D file (viewer/surface_file.hpp).
#include "viewer/surface_file.hpp"

#include <cctype>
#include <cstdio>

#include "exports/figure_text.hpp"
#include "exports/mesh_file.hpp"
#include "io/atomic_write.hpp"

namespace ellipsa::viewer {

bool is_surface_file(const std::string& path) {
    auto ends = [&](const char* tail) {
        const std::string t = tail;
        if (path.size() < t.size()) return false;
        for (std::size_t k = 0; k < t.size(); ++k)
            if (std::tolower(static_cast<unsigned char>(path[path.size() - t.size() + k])) != t[k]) return false;
        return true;
    };
    return ends(".glb") || ends(".ply");
}

Status write_surface_file(const FarFieldSet& s, std::size_t fi, Component component, const SurfaceMesh& mesh,
                          const std::string& path, bool overwrite) {
    if (mesh.vertices.empty()) return Error{path, 0, 0, "no surface is shown"};
    auto view_of = [](const std::vector<float>& vertices, const std::vector<std::uint32_t>& triangles) {
        exports::MeshView m;
        m.vertices = vertices.data();
        m.vertex_count = vertices.size() / surface_floats_per_vertex;
        m.stride = surface_floats_per_vertex;
        m.indices = triangles.data();
        m.index_count = triangles.size();
        return m;
    };
    exports::MeshFileInfo info;
    info.name = (s.name.empty() ? std::string("pattern") : s.name) + ", " + format_frequency(s.frequencies[fi].frequency_hz);
    info.generator = "ellipsa";
    char c[256];
    std::snprintf(c, sizeof c, "; radius: %s from %.2f (centre) to %.2f %s (radius 1, the largest sample); colour: %s %g..%g %s; +z up",
                  to_string(component), mesh.floor_db, mesh.peak_db, mesh.unit.c_str(), mesh.bar.title.c_str(), mesh.bar.min,
                  mesh.bar.max, mesh.bar.unit.c_str());
    info.comment = info.name + c;
    // The directions the file does not sample: a part of their own, named as the view's key names them.
    std::vector<exports::MeshPart> parts{{view_of(mesh.vertices, mesh.triangles), info.name, "colour map"}};
    if (!mesh.unsampled.empty()) {
        parts.push_back({view_of(mesh.unsampled.vertices, mesh.unsampled.triangles), exports::not_measured_label, exports::not_measured_label});
        info.comment += "; grey faces: " + std::string(exports::not_measured_label) + " (directions the file does not sample)";
    }
    const std::string p = path;
    const bool glb = p.size() >= 4 && std::tolower(static_cast<unsigned char>(p[p.size() - 3])) == 'g';
    return io::write_file_atomically(path, glb ? exports::to_glb(parts, info) : exports::to_ply(parts, info), overwrite);
}

Status write_surface_file(const FarFieldSet& s, const SnapshotOptions& o, const std::string& path, bool overwrite) {
    SurfaceOptions so;
    so.component = o.component;
    so.color_by = o.color_by;
    so.range_db = o.range_db;
    so.gain_map = o.gain_map;
    auto mesh = build_surface(s, o.frequency_index, so);
    if (!mesh) return mesh.error();
    return write_surface_file(s, o.frequency_index, o.component, *mesh, path, overwrite);
}

}  // namespace ellipsa::viewer
