#include "exports/mesh_file.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
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

// The glTF JSON for a buffer of `n` vertices and `ni` indices laid out as positions, normals,
// colours, indices.
std::string gltf_json(const MeshFileInfo& info, std::size_t n, std::size_t ni, const V3& lo, const V3& hi, std::size_t bin_bytes) {
    const std::size_t vb = n * 12;
    std::string j = "{\"asset\":{\"version\":\"2.0\",\"generator\":" + json_string(info.generator) + "},";
    j += "\"extensionsUsed\":[\"KHR_materials_unlit\"],\"scene\":0,\"scenes\":[{\"nodes\":[0]}],";
    j += "\"nodes\":[{\"mesh\":0,\"name\":" + json_string(info.name) + "}],";
    j += "\"meshes\":[{\"name\":" + json_string(info.name) +
         ",\"primitives\":[{\"attributes\":{\"POSITION\":0,\"NORMAL\":1,\"COLOR_0\":2},\"indices\":3,\"material\":0,\"mode\":4}]}],";
    j += "\"materials\":[{\"name\":\"colour map\",\"doubleSided\":true,\"pbrMetallicRoughness\":{\"baseColorFactor\":[1,1,1,1],"
         "\"metallicFactor\":0,\"roughnessFactor\":1},\"extensions\":{\"KHR_materials_unlit\":{}}}],";
    j += "\"buffers\":[{\"byteLength\":" + std::to_string(bin_bytes) + "}],\"bufferViews\":[";
    for (int k = 0; k < 3; ++k)
        j += "{\"buffer\":0,\"byteOffset\":" + std::to_string(k * vb) + ",\"byteLength\":" + std::to_string(vb) + ",\"target\":34962},";
    j += "{\"buffer\":0,\"byteOffset\":" + std::to_string(3 * vb) + ",\"byteLength\":" + std::to_string(ni * 4) + ",\"target\":34963}],";
    j += "\"accessors\":[{\"bufferView\":0,\"componentType\":5126,\"count\":" + std::to_string(n) + ",\"type\":\"VEC3\",\"min\":[" +
         json_number(lo.x) + "," + json_number(lo.y) + "," + json_number(lo.z) + "],\"max\":[" + json_number(hi.x) + "," +
         json_number(hi.y) + "," + json_number(hi.z) + "]},";
    j += "{\"bufferView\":1,\"componentType\":5126,\"count\":" + std::to_string(n) + ",\"type\":\"VEC3\"},";
    j += "{\"bufferView\":2,\"componentType\":5126,\"count\":" + std::to_string(n) + ",\"type\":\"VEC3\"},";
    j += "{\"bufferView\":3,\"componentType\":5125,\"count\":" + std::to_string(ni) + ",\"type\":\"SCALAR\"}]}";
    return j;
}

}  // namespace

std::string to_glb(const MeshView& m, const MeshFileInfo& info) {
    const std::vector<std::uint32_t> tri = proper_triangles(m);
    const std::size_t n = m.vertex_count;
    std::string bin;
    bin.reserve(n * 36 + tri.size() * 4);
    V3 lo{INFINITY, INFINITY, INFINITY}, hi{-INFINITY, -INFINITY, -INFINITY};
    for (std::size_t k = 0; k < n; ++k) {  // our (x, y, z) is glTF's (x, z, -y)
        const V3 p = at(m, k, m.position), g{p.x, p.z, -p.y};
        lo = {std::min(lo.x, g.x), std::min(lo.y, g.y), std::min(lo.z, g.z)};
        hi = {std::max(hi.x, g.x), std::max(hi.y, g.y), std::max(hi.z, g.z)};
        for (float f : {g.x, g.y, g.z}) put(bin, f);
    }
    for (std::size_t k = 0; k < n; ++k) {
        const V3 q = unit_normal(m, k);
        for (float f : {q.x, q.z, -q.y}) put(bin, f);
    }
    for (std::size_t k = 0; k < n; ++k) {
        const V3 c = m.colour >= 0 ? at(m, k, m.colour) : V3{1, 1, 1};
        for (float f : {c.x, c.y, c.z}) put(bin, srgb_to_linear(f));
    }
    for (std::uint32_t i : tri) put(bin, i);
    if (n == 0) lo = hi = {0, 0, 0};
    std::string json = gltf_json(info, n, tri.size(), lo, hi, bin.size());
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

std::string to_ply(const MeshView& m, const MeshFileInfo& info) {
    const std::vector<std::uint32_t> tri = proper_triangles(m);
    std::string comment = info.comment;
    std::replace(comment.begin(), comment.end(), '\n', ' ');
    std::string out = "ply\nformat binary_little_endian 1.0\n";
    if (!comment.empty()) out += "comment " + comment + "\n";
    out += "element vertex " + std::to_string(m.vertex_count) +
           "\nproperty float x\nproperty float y\nproperty float z\nproperty float nx\nproperty float ny\nproperty float nz\n"
           "property uchar red\nproperty uchar green\nproperty uchar blue\n";
    out += "element face " + std::to_string(tri.size() / 3) + "\nproperty list uchar int vertex_indices\nend_header\n";
    for (std::size_t k = 0; k < m.vertex_count; ++k) {
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
