// 3D files: the GLB container and accessors follow the glTF 2.0 specification, PLY's counts
// match its data, zero-area triangles are left out, colours turn linear for glTF.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>

#include "exports/mesh_file.hpp"

using namespace ellipsa::exports;

namespace {
std::uint32_t u32(const std::string& s, std::size_t at) {
    std::uint32_t v;
    std::memcpy(&v, s.data() + at, 4);
    return v;
}
float f32(const std::string& s, std::size_t at) {
    float v;
    std::memcpy(&v, s.data() + at, 4);
    return v;
}
// A tetrahedron-like fan: four vertices (x, y, z, nx, ny, nz, r, g, b) and two faces plus one
// degenerate face (a repeated vertex).
const float verts[] = {0, 0, 1, 0, 0, 1, 1, 0, 0,    //
                       1, 0, 0, 1, 0, 0, 0, 1, 0,    //
                       0, 1, 0, 0, 1, 0, 0, 0, 1,    //
                       0, 0, -1, 0, 0, 0, 0.5f, 0.5f, 0.5f};  // zero normal: replaced by the radial one
const std::uint32_t tris[] = {0, 1, 2, 1, 2, 3, 2, 2, 0};
MeshView view() {
    MeshView m;
    m.vertices = verts;
    m.vertex_count = 4;
    m.indices = tris;
    m.index_count = 9;
    return m;
}
}  // namespace

TEST_CASE("GLB: header, chunk alignment, accessors and min/max as glTF 2.0 asks", "[export][mesh]") {
    // glTF 2.0 specification, section "GLB File Format Specification": magic 0x46546C67, version 2,
    // total length; chunks JSON (0x4E4F534A, space-padded) then BIN (0x004E4942, zero-padded), each
    // a multiple of 4 bytes.
    const std::string g = to_glb(view(), {"test mesh", "ellipsa test", ""});
    REQUIRE(g.size() > 28);
    CHECK(u32(g, 0) == 0x46546C67u);
    CHECK(u32(g, 4) == 2u);
    CHECK(u32(g, 8) == g.size());
    const std::uint32_t jlen = u32(g, 12);
    CHECK(jlen % 4 == 0);
    CHECK(u32(g, 16) == 0x4E4F534Au);
    const std::string json = g.substr(20, jlen);
    const std::uint32_t blen = u32(g, 20 + jlen);
    CHECK(blen % 4 == 0);
    CHECK(u32(g, 24 + jlen) == 0x004E4942u);
    CHECK(28 + jlen + blen == g.size());
    CHECK(json.find("\"version\":\"2.0\"") != std::string::npos);
    // Four vertices, two proper triangles (the degenerate one left out): 4 * 36 + 6 * 4 bytes.
    CHECK(json.find("\"byteLength\":168}") != std::string::npos);
    CHECK(json.find("\"count\":6,\"type\":\"SCALAR\"") != std::string::npos);
    // +z up becomes glTF's +y up: (x, y, z) -> (x, z, -y); min/max are the data's own.
    CHECK(json.find("\"min\":[0,-1,-1],\"max\":[1,1,-0]") != std::string::npos);
    const std::size_t bin = 28 + jlen;
    CHECK(f32(g, bin + 4) == 1.0f);   // vertex 0: z = 1 is glTF y
    CHECK(f32(g, bin + 12 + 8) == -0.0f);
    CHECK(f32(g, bin + 24 + 8) == -1.0f);  // vertex 2: y = 1 is glTF -z
    // Normal of vertex 3 (zero in the input): the unit radial direction (0, 0, -1) -> (0, -1, 0).
    CHECK(f32(g, bin + 48 + 36 + 4) == -1.0f);
    // Colours are linear light (sRGB 0.5 -> 0.214, IEC 61966-2-1).
    CHECK(f32(g, bin + 96 + 36) == Approx(0.21404).epsilon(1e-4));
    // Indices after the three attribute views.
    CHECK(u32(g, bin + 144) == 0u);
    CHECK(u32(g, bin + 144 + 20) == 3u);
}

TEST_CASE("PLY: header counts match the binary data", "[export][mesh]") {
    // PLY (Turk, 1994; the binary_little_endian 1.0 form): header then vertex and face records.
    const std::string p = to_ply(view(), {"", "", "a comment\nwith a newline"});
    const std::size_t end = p.find("end_header\n") + 11;
    const std::string header = p.substr(0, end);
    CHECK(header.rfind("ply\nformat binary_little_endian 1.0\ncomment a comment with a newline\n", 0) == 0);
    CHECK(header.find("element vertex 4\n") != std::string::npos);
    CHECK(header.find("element face 2\n") != std::string::npos);
    CHECK(p.size() == end + 4 * (24 + 3) + 2 * 13);
    // The second vertex's colour (0, 1, 0) as bytes.
    CHECK(static_cast<unsigned char>(p[end + 27 + 24 + 1]) == 255);
}
