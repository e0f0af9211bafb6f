#!/usr/bin/python3
"""Structural check of the 3D files `ellipsa render` writes (no validator for glTF 2.0 is packaged
in Debian 12; this follows the glTF 2.0 specification's GLB and accessor rules and the PLY header
format, and re-reads every number with the struct module).

usage: check_mesh_files.py FILE.glb|FILE.ply ...   exit 0 when every file passes
"""
import json
import math
import struct
import sys

COMPONENT = {5120: ("b", 1), 5121: ("B", 1), 5122: ("h", 2), 5123: ("H", 2), 5125: ("I", 4), 5126: ("f", 4)}
WIDTH = {"SCALAR": 1, "VEC2": 2, "VEC3": 3, "VEC4": 4}


def check_glb(path):
    data = open(path, "rb").read()
    magic, version, length = struct.unpack_from("<III", data, 0)
    assert magic == 0x46546C67, "magic is not glTF"
    assert version == 2, "GLB version %d" % version
    assert length == len(data), "header length %d, file %d" % (length, len(data))
    jlen, jtype = struct.unpack_from("<II", data, 12)
    assert jtype == 0x4E4F534A and jlen % 4 == 0, "JSON chunk type/padding"
    doc = json.loads(data[20:20 + jlen].decode("utf-8"))
    blen, btype = struct.unpack_from("<II", data, 20 + jlen)
    assert btype == 0x004E4942 and blen % 4 == 0, "BIN chunk type/padding"
    assert 20 + jlen + 8 + blen == len(data), "chunks do not fill the file"
    bin_ = data[28 + jlen:28 + jlen + blen]
    assert doc["asset"]["version"] == "2.0"
    buf = doc["buffers"][0]
    assert "uri" not in buf and buf["byteLength"] <= blen < buf["byteLength"] + 4, "buffer length against BIN chunk"
    for v in doc["bufferViews"]:
        off = v.get("byteOffset", 0)
        assert off % 4 == 0 and off + v["byteLength"] <= buf["byteLength"], "buffer view outside or unaligned"
    arrays = []
    for a in doc["accessors"]:
        v = doc["bufferViews"][a["bufferView"]]
        fmt, size = COMPONENT[a["componentType"]]
        n = a["count"] * WIDTH[a["type"]]
        off = v.get("byteOffset", 0) + a.get("byteOffset", 0)
        assert off % size == 0 and n * size <= v["byteLength"], "accessor overruns its view"
        arrays.append(struct.unpack_from("<%d%s" % (n, fmt), bin_, off))
    # Every mesh (the surface, and the "not measured" region of a partly sampled pattern), each
    # the primitive of one node with a material of its own.
    assert len(doc["nodes"]) == len(doc["meshes"]) == len(doc["materials"]) == len(doc["scenes"][0]["nodes"]), "one node, mesh, material a part"
    names, nv_all, nt_all = [], 0, 0
    for k, mesh in enumerate(doc["meshes"]):
        assert doc["nodes"][k]["mesh"] == k and doc["nodes"][k]["name"] == mesh["name"], "node %d names its mesh" % k
        prim = mesh["primitives"][0]
        assert prim["material"] == k, "mesh %d has its own material" % k
        nv, nt = check_primitive(doc, arrays, prim)
        names.append(mesh["name"])
        nv_all, nt_all = nv_all + nv, nt_all + nt
    return "%d vertices, %d triangles; parts: %s" % (nv_all, nt_all, ", ".join(names))


def check_primitive(doc, arrays, prim):
    pos_i, nrm_i, col_i = (prim["attributes"][k] for k in ("POSITION", "NORMAL", "COLOR_0"))
    pos, acc = arrays[pos_i], doc["accessors"][pos_i]
    nv = acc["count"]
    for k in range(3):  # min/max must be the data's own (as float32)
        comp = pos[k::3]
        assert math.isclose(min(comp), acc["min"][k], rel_tol=1e-6, abs_tol=1e-7), "POSITION min"
        assert math.isclose(max(comp), acc["max"][k], rel_tol=1e-6, abs_tol=1e-7), "POSITION max"
    nrm = arrays[nrm_i]
    assert all(abs(math.sqrt(nrm[i] ** 2 + nrm[i + 1] ** 2 + nrm[i + 2] ** 2) - 1) < 1e-3 for i in range(0, len(nrm), 3)), "normals not unit"
    assert all(0 <= c <= 1 for c in arrays[col_i]), "colour outside 0..1"
    idx = arrays[prim["indices"]]
    assert len(idx) % 3 == 0 and idx and max(idx) < nv, "indices"
    for i in (nrm_i, col_i):
        assert doc["accessors"][i]["count"] == nv, "attribute counts differ"
    return nv, len(idx) // 3


def check_ply(path):
    data = open(path, "rb").read()
    end = data.index(b"end_header\n") + len(b"end_header\n")
    header = data[:end].decode("ascii").split("\n")
    assert header[0] == "ply" and header[1] == "format binary_little_endian 1.0"
    nv = int(next(l for l in header if l.startswith("element vertex")).split()[2])
    nf = int(next(l for l in header if l.startswith("element face")).split()[2])
    props = [l.split()[-1] for l in header if l.startswith("property ") and "list" not in l]
    assert props == ["x", "y", "z", "nx", "ny", "nz", "red", "green", "blue"], props
    vsize = 6 * 4 + 3
    assert len(data) == end + nv * vsize + nf * 13, "file size against the header's counts"
    off = end + nv * vsize
    for f in range(nf):
        n, a, b, c = struct.unpack_from("<Biii", data, off + 13 * f)
        assert n == 3 and 0 <= min(a, b, c) and max(a, b, c) < nv
    return "%d vertices, %d triangles" % (nv, nf)


def main():
    ok = True
    for p in sys.argv[1:]:
        try:
            what = check_glb(p) if p.endswith(".glb") else check_ply(p)
            print("ok   %s: %s" % (p, what))
        except (AssertionError, ValueError, KeyError, StopIteration, struct.error) as e:
            print("FAIL %s: %s" % (p, e))
            ok = False
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
