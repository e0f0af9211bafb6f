// The gain surface as a 3D file, by the name's extension: .glb (glTF 2.0 binary) or .ply
// (exports/mesh_file.hpp), with a name and comment saying what the radius and colour show. Needs
// no GL context. `ellipsa render --out NAME.glb|ply`, the Python module's Pattern.write_view and
// the viewer's File menu all write through this.
#pragma once
#include <string>

#include "pattern/far_field.hpp"
#include "pattern/result.hpp"
#include "viewer/scene/surface_mesh.hpp"
#include "viewer/snapshot.hpp"

namespace ellipsa::viewer {

// True for a name ending in .glb or .ply (any case).
bool is_surface_file(const std::string& path);
// The mesh as a file; without `overwrite` an existing file is refused.
Status write_surface_file(const FarFieldSet& s, std::size_t freq_index, Component component, const SurfaceMesh& mesh,
                          const std::string& path, bool overwrite);
// The surface a snapshot with options `o` shows (component, colouring, range, colour map), built
// and written as above.
Status write_surface_file(const FarFieldSet& s, const SnapshotOptions& o, const std::string& path, bool overwrite);

}  // namespace ellipsa::viewer
