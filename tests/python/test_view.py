"""Pattern.write_view against `ellipsa render`: the same bytes for the same options, the same
refusals with the same words (cli/render_options.hpp holds the checks both use), and several
views in one session through the headless GL context (Mesa llvmpipe, EGL surfaceless)."""
import os
import subprocess
import sys

import pytest

import ellipsa
from conftest import EXAMPLES, SOURCE, VIEWER

# A build without the viewer has no write_view to compare (test_no_viewer.py checks its refusal).
pytestmark = pytest.mark.skipif(not VIEWER, reason="built without the viewer (ELLIPSA_VIEWER=OFF)")

TURNSTILE = EXAMPLES / "turnstile.csv"

# The PNG and the 3D files carry no date (exports/png.cpp, exports/mesh_file.cpp), so no
# SOURCE_DATE_EPOCH is needed for the bytes to agree; it is set anyway, for both, should one come.
EPOCH = "1700000000"


@pytest.fixture()
def render(cli, monkeypatch):
    monkeypatch.setenv("SOURCE_DATE_EPOCH", EPOCH)

    def run(*args):
        code, out, err = cli("render", *args)
        assert code == 0, err
        return out

    return run


@pytest.mark.parametrize("kwargs,args", [
    # every option the command takes, each away from its default
    ({"component": "rhcp", "color_by": "axial-ratio", "view_deg": (-120, 40), "size_px": (320, 240),
      "frequency_hz": 2.4e9, "range_db": 25, "colormap": "magma", "glyphs": True},
     ["--component", "rhcp", "--color-by", "axial-ratio", "--view=-120,40", "--size", "320x240",
      "--frequency", "2.4GHz", "--range", "25", "--colormap", "magma", "--glyphs"]),
    ({"color_by": "tilt", "size_px": (200, 160), "software": True}, ["--color-by", "tilt", "--size", "200x160", "--software"]),
])
def test_png_is_the_command_s_file(tmp_path, monkeypatch, render, kwargs, args):
    mine, theirs = tmp_path / "py.png", tmp_path / "cli.png"
    render(TURNSTILE, "--out", theirs, *args)
    monkeypatch.setenv("SOURCE_DATE_EPOCH", EPOCH)
    ellipsa.read(str(TURNSTILE)).write_view(str(mine), **kwargs)
    assert mine.read_bytes() == theirs.read_bytes()
    assert mine.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"


def test_defaults_are_the_command_s(tmp_path, render):
    # No options at all: the default size (1200x900), view, range, colouring and the middle
    # frequency of the file (docs/guide.md, "Which frequency"), all from one place.
    render(TURNSTILE, "--out", tmp_path / "cli.png")
    ellipsa.read(str(TURNSTILE)).write_view(str(tmp_path / "py.png"))
    assert (tmp_path / "py.png").read_bytes() == (tmp_path / "cli.png").read_bytes()


@pytest.mark.parametrize("name,kwargs,args", [
    ("s.glb", {"frequency_hz": 2.45e9}, ["--frequency", "2.45e9"]),
    ("s.ply", {"color_by": "axial-ratio", "component": "lhcp", "range_db": 40},
     ["--color-by", "axial-ratio", "--component", "lhcp", "--range", "40"]),
])
def test_surface_files_are_the_command_s(tmp_path, render, name, kwargs, args):
    (tmp_path / "cli").mkdir()
    render(TURNSTILE, "--out", tmp_path / "cli" / name, *args)
    ellipsa.read(str(TURNSTILE)).write_view(str(tmp_path / name), **kwargs)
    assert (tmp_path / name).read_bytes() == (tmp_path / "cli" / name).read_bytes()


def test_mounted_pattern_is_the_command_s_view(tmp_path, render):
    # The mounting travels with the pattern (read(up=...) as --up): caption, gizmo and surface.
    render(TURNSTILE, "--up", "+x", "--size", "256x192", "--out", tmp_path / "cli.png")
    ellipsa.read(str(TURNSTILE), up="+x").write_view(str(tmp_path / "py.png"), size_px=(256, 192))
    assert (tmp_path / "py.png").read_bytes() == (tmp_path / "cli.png").read_bytes()


@pytest.mark.parametrize("kwargs,args", [
    ({"range_db": 500}, ["--range", "500"]),
    ({"range_db": float("nan")}, ["--range", "nan"]),
    ({"view_deg": (400, 10)}, ["--view", "400,10"]),
    ({"view_deg": (0, -91)}, ["--view=0,-91"]),
    ({"size_px": (10, 10)}, ["--size", "10x10"]),
    ({"size_px": (8193, 100)}, ["--size", "8193x100"]),
    ({"component": "rhpc"}, ["--component", "rhpc"]),
    ({"color_by": "difference"}, ["--color-by", "difference"]),
    ({"colormap": "rdbu"}, ["--colormap", "rdbu"]),
    ({}, []),  # the output name: .jpg is not written
])
def test_bad_values_raise_the_command_s_message(tmp_path, cli, kwargs, args):
    out = tmp_path / ("v.jpg" if not kwargs else "v.png")
    code, _, err = cli("render", TURNSTILE, "--out", out, *args)
    assert code == 2
    # refused while parsing: "ellipsa: MESSAGE" and a line naming --help; after: "ellipsa render: MESSAGE"
    message = err.strip().removeprefix("ellipsa render: ").removeprefix("ellipsa: ").splitlines()[0]
    with pytest.raises(ValueError) as e:
        ellipsa.read(str(TURNSTILE)).write_view(str(out), **kwargs)
    assert message.startswith("--")  # the command names its option; the module, the keyword given
    option, reason = message.split(":", 1)
    assert str(e.value) == (next(iter(kwargs)) if kwargs else "path") + ":" + reason
    assert not out.exists()


def test_unavailable_figures_raise_the_command_s_error(tmp_path, cli):
    # Cut-only data (no 3D view), magnitude-only data (no axial ratio), a frequency the file lacks.
    for path, kwargs, args in [
        (SOURCE / "tests/data/csv/split/cuts.csv", {}, []),
        (SOURCE / "tests/data/csv/upper_hemisphere.csv", {"color_by": "axial-ratio"}, ["--color-by", "axial-ratio"]),
        (TURNSTILE, {"frequency_hz": 9e9}, ["--frequency", "9e9"]),
    ]:
        code, _, err = cli("render", path, "--out", tmp_path / "v.glb", *args)
        assert code == 1
        with pytest.raises(ellipsa.Error) as e:
            ellipsa.read(str(path)).write_view(str(tmp_path / "v.glb"), **kwargs)
        assert str(e.value) == err.strip().removeprefix("ellipsa render: ")
        assert not (tmp_path / "v.glb").exists()


def test_existing_file_refused_and_untouched(tmp_path, cli):
    out = tmp_path / "v.png"
    out.write_bytes(b"mine")
    code, _, err = cli("render", TURNSTILE, "--out", out)
    assert code == 1
    p = ellipsa.read(str(TURNSTILE))
    for name in (out, tmp_path / "v.ply"):
        name.write_bytes(b"mine")
        with pytest.raises(ellipsa.Error) as e:
            p.write_view(str(name), size_px=(128, 96))
        assert name.read_bytes() == b"mine"
    # The one refusal of every writer (io/place.hpp exists_message).
    assert str(e.value) == f"{tmp_path / 'v.ply'}: already exists; use force=True to replace it"
    assert err.strip() == f"ellipsa render: {out}: already exists; use --force to replace it"
    p.write_view(str(out), size_px=(128, 96), force=True)
    assert out.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"


def test_views_one_after_another_in_one_session(tmp_path, exe):
    # Each view makes and drops a headless GL context (a new size always does); the EGL display
    # lives for the whole process (commit 3df44df), so a second and a third view, and a report
    # between them, do not meet a terminated display. Each run is its own process, so a crash is a
    # failed run, not a lost session; the last view is the command's file byte for byte.
    script = ("import ellipsa, sys\n"
              "out, p = sys.argv[1], ellipsa.read(sys.argv[2])\n"
              "p.write_view(out + '/a.png', size_px=(320, 240), glyphs=True)\n"
              "p.write_view(out + '/b.png', size_px=(200, 150), color_by='axial-ratio')\n"
              "ellipsa.write_report(out + '/rep', [p], frequency_hz=2.45e9, size_px=(320, 240))\n"
              "p.write_view(out + '/c.png', size_px=(320, 240), view_deg=(90, 10))\n")
    env = dict(os.environ, SOURCE_DATE_EPOCH=EPOCH)
    r = subprocess.run([exe, "render", TURNSTILE, "--size", "320x240", "--view", "90,10", "--out", tmp_path / "cli.png"],
                       env=env, capture_output=True, text=True, check=False)
    assert r.returncode == 0, r.stderr
    for run in range(4):
        out = tmp_path / f"r{run}"
        out.mkdir()
        r = subprocess.run([sys.executable, "-c", script, str(out), str(TURNSTILE)], env=env,
                           capture_output=True, text=True, check=False)
        assert r.returncode == 0, f"run {run}: exit {r.returncode}: {r.stderr[-2000:]}"
        assert (out / "a.png").stat().st_size > 0 and (out / "b.png").stat().st_size > 0
        assert (out / "c.png").read_bytes() == (tmp_path / "cli.png").read_bytes()


def test_views_from_two_threads_at_once(tmp_path):
    # write_view releases the interpreter's lock while it draws; views drawn in two threads at
    # once take turns at the renderer (viewer::snapshot_turn: ImGui has one current context a
    # process), so each is the view drawn alone.
    import threading
    p = ellipsa.read(str(TURNSTILE))
    p.write_view(str(tmp_path / "alone.png"), size_px=(160, 120), color_by="axial-ratio")
    failures = []

    def draw(n):
        try:
            for k in range(3):
                p.write_view(str(tmp_path / f"t{n}-{k}.png"), size_px=(160, 120), color_by="axial-ratio")
        except Exception as e:  # noqa: BLE001 (reported below)
            failures.append(e)

    threads = [threading.Thread(target=draw, args=(n,)) for n in range(2)]
    for t in threads:
        t.start()
    for t in threads:
        t.join()
    assert not failures
    alone = (tmp_path / "alone.png").read_bytes()
    for n in range(2):
        for k in range(3):
            assert (tmp_path / f"t{n}-{k}.png").read_bytes() == alone
