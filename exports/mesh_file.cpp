#include "exports/mesh_file.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
#include <initializer_list>
#include <string_view>
#include <vector>

namespace ellipsa::exports {

namespace {

struct V3 {
    float x, y, z;
};

V3 at(const MeshView& m, std::size_t k, int off) {
    const float* v = m.vertices + k * std::size_t(m.stride) + off;
    return {v[0], v[1], v[2]};
}
V3 unit_normal(const MeshView& m, std::size_t k) {
    V3 n = m.normal >= 0 ? at(m, k, m.normal) : at(m, k, m.position);
    float len = std::sqrt(n.x * n.x + n.y * n.y + n.z * n.z);
    if (!(len > 0)) {  // no direction (a point at the origin): any unit vector will do
        n = at(m, k, m.position);
        len = std::sqrt(n.x * n.x + n.y * n.y + n.z * n.z);
        if (!(len > 0)) return {0, 0, 1};
    }
    return {n.x / len, n.y / len, n.z / len};
}

// Triangles with three distinct positions and non-zero area.
std::vector<std::uint32_t> proper_triangles(const MeshView& m) {
    std::vector<std::uint32_t> out;
    out.reserve(m.index_count);
    for (std::size_t t = 0; t + 2 < m.index_count; t += 3) {
        const std::uint32_t a = m.indices[t], b = m.indices[t + 1], c = m.indices[t + 2];
        if (a >= m.vertex_count || b >= m.vertex_count || c >= m.vertex_count) continue;
        const V3 p = at(m, a, m.position), q = at(m, b, m.position), r = at(m, c, m.position);
        const double ux = q.x - p.x, uy = q.y - p.y, uz = q.z - p.z, vx = r.x - p.x, vy = r.y - p.y, vz = r.z - p.z;
        const double cx = uy * vz - uz * vy, cy = uz * vx - ux * vz, cz = ux * vy - uy * vx;
        if (cx * cx + cy * cy + cz * cz > 1e-24) out.insert(out.end(), {a, b, c});
    }
    return out;
}

float srgb_to_linear(float c) {
    c = std::clamp(c, 0.0f, 1.0f);
    return c <= 0.04045f ? c / 12.92f : std::pow((c + 0.055f) / 1.055f, 2.4f);
}

template <class T>
void put(std::string& out, T v) {
    char b[sizeof(T)];
    std::memcpy(b, &v, sizeof(T));  // little-endian hosts only (x86-64, arm64), as the formats need
    out.append(b, sizeof(T));
}

std::string json_number(double v) {
    char b[40];
    std::snprintf(b, sizeof b, "%.9g", v);
    return b;
}
std::string json_string(const std::string& s) {
    std::string o = "\"";
    for (unsigned char c : s) {
        if (c == '"' || c == '\\') o += '\\', o += char(c);
        else if (c < 0x20) {
            char b[8];
            std::snprintf(b, sizeof b, "\\u%04x", c);
            o += b;
        } else o += char(c);
    }
    return o + "\"";
}

// Where one part lies in the binary buffer, and its bounds (glTF's frame).
struct PartLayout {
    std::string name, material;
    std::size_t n = 0, ni = 0, offset = 0;  // vertices, indices, byte offset of its positions
    V3 lo{0, 0, 0}, hi{0, 0, 0};
};

// Text joined by appending only (GCC 12 warns, wrongly, on "literal" + a temporary string).
std::string cat(std::initializer_list<std::string_view> parts) {
    std::string out;
    for (std::string_view p : parts) out += p;
    return out;
}

std::string vec3_json(const V3& v) { return cat({"[", json_number(v.x), ",", json_number(v.y), ",", json_number(v.z), "]"}); }

// One part's mesh, material, buffer views and accessors (views and accessors 4k .. 4k + 3).
void gltf_part(const PartLayout& p, std::size_t k, std::string& meshes, std::string& materials, std::string& views,
               std::string& accessors) {
    const std::string K = std::to_string(k), n = std::to_string(p.n), vb = std::to_string(p.n * 12);
    const std::string at[4] = {std::to_string(4 * k), std::to_string(4 * k + 1), std::to_string(4 * k + 2), std::to_string(4 * k + 3)};
    const char* sep = k ? "," : "";
    meshes += cat({sep, "{\"name\":", json_string(p.name), ",\"primitives\":[{\"attributes\":{\"POSITION\":", at[0], ",\"NORMAL\":", at[1],
                   ",\"COLOR_0\":", at[2], "},\"indices\":", at[3], ",\"material\":", K, ",\"mode\":4}]}"});
    materials += cat({sep, "{\"name\":", json_string(p.material),
                      ",\"doubleSided\":true,\"pbrMetallicRoughness\":{\"baseColorFactor\":[1,1,1,1],"
                      "\"metallicFactor\":0,\"roughnessFactor\":1},\"extensions\":{\"KHR_materials_unlit\":{}}}"});
    for (std::size_t v = 0; v < 3; ++v)
        views += cat({k || v ? "," : "", "{\"buffer\":0,\"byteOffset\":", std::to_string(p.offset + v * p.n * 12), ",\"byteLength\":", vb,
                      ",\"target\":34962}"});
    views += cat({",{\"buffer\":0,\"byteOffset\":", std::to_string(p.offset + 3 * p.n * 12), ",\"byteLength\":", std::to_string(p.ni * 4),
                  ",\"target\":34963}"});
    accessors += cat({sep, "{\"bufferView\":", at[0], ",\"componentType\":5126,\"count\":", n, ",\"type\":\"VEC3\",\"min\":",
                      vec3_json(p.lo), ",\"max\":", vec3_json(p.hi), "}"});
    for (int v = 1; v < 3; ++v)
        accessors += cat({",{\"bufferView\":", at[v], ",\"componentType\":5126,\"count\":", n, ",\"type\":\"VEC3\"}"});
    accessors += cat({",{\"bufferView\":", at[3], ",\"componentType\":5125,\"count\":", std::to_string(p.ni), ",\"type\":\"SCALAR\"}"});
}

// The glTF JSON: per part, four buffer views (positions, normals, colours, indices) and their
// accessors, one mesh, one node and one material.
std::string gltf_json(const MeshFileInfo& info, const std::vector<PartLayout>& parts, std::size_t bin_bytes) {
    std::string nodes, meshes, materials, views, accessors, roots;
    for (std::size_t k = 0; k < parts.size(); ++k) {
        const char* sep = k ? "," : "";
        roots += cat({sep, std::to_string(k)});
        nodes += cat({sep, "{\"mesh\":", std::to_string(k), ",\"name\":", json_string(parts[k].name), "}"});
        gltf_part(parts[k], k, meshes, materials, views, accessors);
    }
    return cat({"{\"asset\":{\"version\":\"2.0\",\"generator\":", json_string(info.generator),
                "},\"extensionsUsed\":[\"KHR_materials_unlit\"],\"scene\":0,\"scenes\":[{\"nodes\":[", roots, "]}],\"nodes\":[", nodes,
                "],\"meshes\":[", meshes, "],\"materials\":[", materials, "],\"buffers\":[{\"byteLength\":", std::to_string(bin_bytes),
                "}],\"bufferViews\":[", views, "],\"accessors\":[", accessors, "]}"});
}

// One part's positions, normals, colours (linear light) and proper triangles appended to `bin`.
PartLayout append_part(std::string& bin, const MeshPart& part) {
    const MeshView& m = part.mesh;
    const std::vector<std::uint32_t> tri = proper_triangles(m);
    PartLayout p{part.name, part.material, m.vertex_count, tri.size(), bin.size(), {INFINITY, INFINITY, INFINITY}, {-INFINITY, -INFINITY, -INFINITY}};
    for (std::size_t k = 0; k < p.n; ++k) {  // our (x, y, z) is glTF's (x, z, -y)
        const V3 q = at(m, k, m.position), g{q.x, q.z, -q.y};
        p.lo = {std::min(p.lo.x, g.x), std::min(p.lo.y, g.y), std::min(p.lo.z, g.z)};
        p.hi = {std::max(p.hi.x, g.x), std::max(p.hi.y, g.y), std::max(p.hi.z, g.z)};
        for (float f : {g.x, g.y, g.z}) put(bin, f);
    }
    for (std::size_t k = 0; k < p.n; ++k) {
        const V3 q = unit_normal(m, k);
        for (float f : {q.x, q.z, -q.y}) put(bin, f);
    }
    for (std::size_t k = 0; k < p.n; ++k) {
        const V3 c = m.colour >= 0 ? at(m, k, m.colour) : V3{1, 1, 1};
        for (float f : {c.x, c.y, c.z}) put(bin, srgb_to_linear(f));
    }
    for (std::uint32_t i : tri) put(bin, i);
    if (p.n == 0) p.lo = p.hi = {0, 0, 0};
    return p;
}

}  // namespace

std::string to_glb(const MeshView& m, const MeshFileInfo& info) { return to_glb(std::vector<MeshPart>{{m, info.name, "colour map"}}, info); }

std::string to_glb(const std::vector<MeshPart>& parts, const MeshFileInfo& info) {
    std::string bin;
    std::vector<PartLayout> layout;
    for (const MeshPart& part : parts) layout.push_back(append_part(bin, part));
    std::string json = gltf_json(info, layout, bin.size());
    while (json.size() % 4) json += ' ';
    while (bin.size() % 4) bin += '\0';
    std::string out;
    put(out, std::uint32_t(0x46546C67));  // "glTF"
    put(out, std::uint32_t(2));
    put(out, std::uint32_t(12 + 8 + json.size() + 8 + bin.size()));
    put(out, std::uint32_t(json.size()));
    put(out, std::uint32_t(0x4E4F534A));  // "JSON"
    out += json;
    put(out, std::uint32_t(bin.size()));
    put(out, std::uint32_t(0x004E4942));  // "BIN\0"
    out += bin;
    return out;
}

std::string to_ply(const MeshView& m, const MeshFileInfo& info) { return to_ply(std::vector<MeshPart>{{m, info.name, ""}}, info); }

std::string to_ply(const std::vector<MeshPart>& parts, const MeshFileInfo& info) {
    std::vector<std::uint32_t> tri;
    std::size_t vertices = 0;
    for (const MeshPart& part : parts) {
        for (std::uint32_t i : proper_triangles(part.mesh)) tri.push_back(std::uint32_t(vertices) + i);
        vertices += part.mesh.vertex_count;
    }
    std::string comment = info.comment;
    std::replace(comment.begin(), comment.end(), '\n', ' ');
    std::string out = "ply\nformat binary_little_endian 1.0\n";
    if (!comment.empty()) out += "comment " + comment + "\n";
    out += "element vertex " + std::to_string(vertices) +
           "\nproperty float x\nproperty float y\nproperty float z\nproperty float nx\nproperty float ny\nproperty float nz\n"
           "property uchar red\nproperty uchar green\nproperty uchar blue\n";
    out += "element face " + std::to_string(tri.size() / 3) + "\nproperty list uchar int vertex_indices\nend_header\n";
    for (const MeshPart& part : parts)
        for (std::size_t k = 0; k < part.mesh.vertex_count; ++k) {
            const MeshView& m = part.mesh;
            const V3 p = at(m, k, m.position), q = unit_normal(m, k);
            for (float f : {p.x, p.y, p.z, q.x, q.y, q.z}) put(out, f);
            const V3 c = m.colour >= 0 ? at(m, k, m.colour) : V3{1, 1, 1};
            for (float f : {c.x, c.y, c.z}) put(out, std::uint8_t(std::lround(std::clamp(f, 0.0f, 1.0f) * 255)));
        }
    for (std::size_t t = 0; t < tri.size(); t += 3) {
        put(out, std::uint8_t(3));
        for (int k = 0; k < 3; ++k) put(out, std::int32_t(tri[t + std::size_t(k)]));
    }
    return out;
}

}  // namespace ellipsa::exports
