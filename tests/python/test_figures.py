"""Summary figures and cuts against published closed-form values and the command line's JSON."""
import json
import math
import os
import subprocess
import sys

import numpy as np
import pytest

import ellipsa
from conftest import EXAMPLES, NO_3D_VIEWS_NOTE, VIEWER


def test_short_dipole_directivity_and_beamwidth():
    # Balanis, Antenna Theory (3rd ed.), sec. 4.2: D = 1.5 (1.76 dBi), HPBW 90 deg.
    s = ellipsa.synth("short-dipole", step_deg=1).summary()
    assert s["directivity_dbi"] == pytest.approx(10 * math.log10(1.5), abs=0.005)
    assert s["hpbw_elevation_deg"] == pytest.approx(90.0, abs=0.1)
    assert s["sense"] == "linear" and s["axial_ratio_db"] is None


def test_half_wave_dipole_directivity_and_beamwidth():
    # Balanis sec. 4.6: D = 1.643 (2.15 dBi), HPBW 78 deg (78.1 to one decimal).
    s = ellipsa.synth("dipole", length_wl=0.5, step_deg=1).summary()
    assert s["directivity_dbi"] == pytest.approx(2.15, abs=0.01)
    assert s["hpbw_elevation_deg"] == pytest.approx(78.0, abs=0.2)


def test_power_and_polarisation_of_crossed_dipoles():
    # Crossed short dipoles in quadrature (-90 deg): right-hand circular toward +z (IEEE Std 145,
    # exp(+jwt)); at the zenith E_theta = j E_phi... so |E_L| = 0 and the axial ratio is 0 dB.
    p = ellipsa.synth("crossed-dipoles", step_deg=5)
    pol = p.polarisation()
    assert abs(pol["e_lhcp"][0, 0]) < 1e-12 and pol["axial_ratio_db"][0, 0] == pytest.approx(0, abs=1e-9)
    assert ellipsa.SENSES[pol["sense"][0, 0]] == "right"
    # On the horizon the field is linear: no axial ratio is reported there.
    h = list(p.theta_deg).index(90)
    assert np.isnan(pol["axial_ratio_db"][h]).all()
    assert {ellipsa.SENSES[k] for k in pol["sense"][h]} == {"linear"}
    # Every basis splits the same total power: |R|^2 + |L|^2 = |co|^2 + |cross|^2 = I.
    total = p.power("total")
    np.testing.assert_allclose(p.power("rhcp") + p.power("lhcp"), total, atol=1e-12)
    np.testing.assert_allclose(p.power("co") + p.power("cross"), total, atol=1e-12)
    np.testing.assert_allclose(pol["stokes_i"], total, atol=1e-12)
    np.testing.assert_allclose(np.abs(pol["e_rhcp"]) ** 2, p.power("rhcp"), atol=1e-12)
    np.testing.assert_allclose(pol["stokes_v"], p.power("rhcp") - p.power("lhcp"), atol=1e-12)
    np.testing.assert_allclose(p.power("rhcp", db=True)[0, 0], 10 * np.log10(p.power("rhcp")[0, 0]))
    with pytest.raises(ValueError, match="expected one of"):
        p.power("slant")


def test_phase_figures_refused_without_phase():
    t, f = np.arange(0, 181, 30.0), np.arange(0, 360, 30.0)
    one = np.ones((t.size, f.size), complex)
    p = ellipsa.Pattern.from_arrays(t, f, one, one, content="magnitude-only")
    with pytest.raises(ellipsa.Error, match="phase"):
        p.power("rhcp")
    with pytest.raises(ellipsa.Error, match="phase"):
        p.polarisation()
    assert p.summary()["axial_ratio_db"] is None


@pytest.mark.parametrize("name", ["printed-dipole.csv", "turnstile.csv", "small-loop.csv"])
def test_info_is_the_cli_json(name, cli_json):
    path = str(EXAMPLES / name)
    p = ellipsa.read(path)
    assert p.info() == cli_json("info", path)
    assert p.summary(10) == cli_json("info", path, "--frequency", "2.45e9")["results"][0]


def test_cut_is_the_cli_cut(tmp_path, cli):
    path = str(EXAMPLES / "printed-dipole.csv")
    p = ellipsa.read(path)
    out = tmp_path / "cut.csv"
    code, _, err = cli("cut", path, "--phi", "90", "--frequency", "2.45e9", "--components", "total,theta",
                       "--out", out)
    assert code == 0, err
    rows = [ln.strip().split(",") for ln in out.read_text().splitlines() if not ln.startswith("#")]
    head, body = rows[0], rows[1:]
    c = p.cut(phi_deg=90, components=["total", "theta"], frequency_hz=2.45e9)
    angle = np.array([float(r[0]) for r in body])
    np.testing.assert_allclose(c["angle_deg"], angle, atol=1e-12)
    for name in ("total", "theta"):
        k = next(i for i, h in enumerate(head) if i > 2 and h.startswith(name + "_"))
        db = np.array([float(r[k]) if r[k] else np.nan for r in body])
        with np.errstate(divide="ignore"):  # zero power is -inf dB, as the CSV writes it
            np.testing.assert_allclose(10 * np.log10(c["power"][name]), db, rtol=1e-12, atol=1e-12)
    assert c["beam"]["total"]["shape"] in ("beam", "omnidirectional")


def test_polarisation_arrays_are_the_cli_probe(cli_json):
    # At a grid sample the command's probe gives that sample's figures: the arrays hold the same.
    path = str(EXAMPLES / "turnstile.csv")
    p = ellipsa.read(path)
    k = p.frequency_index(2.45e9)
    pol = p.polarisation(k)
    for theta, phi in ((30, 45), (90, 0), (120, 300)):
        i, j = list(p.theta_deg).index(theta), list(p.phi_deg).index(phi)
        probe = cli_json("probe", path, "--theta", theta, "--phi", phi, "--frequency", "2.45e9")
        for name in ("total", "theta", "phi", "rhcp", "lhcp", "co", "cross"):
            db = p.power(name, k, db=True)[i, j]
            if probe[name + "_db"] is None:  # JSON has no -inf: null for a zero component
                assert db == -np.inf, name
            else:
                assert db == pytest.approx(probe[name + "_db"], abs=1e-9), name
        for key in ("axial_ratio_db", "tilt_deg"):  # NaN here where the probe says null (linear, undefined)
            want = np.nan if probe[key] is None else probe[key]
            assert pol[key][i, j] == pytest.approx(want, abs=1e-7, nan_ok=True), key
        assert ellipsa.SENSES[pol["sense"][i, j]] == probe["sense"]
        stokes = [pol[f"stokes_{s}"][i, j] for s in "iquv"]
        np.testing.assert_allclose(stokes, probe["stokes"], rtol=1e-9, atol=1e-12)


def test_probe_is_the_cli_probe_between_samples(cli_json):
    path = str(EXAMPLES / "turnstile.csv")
    p = ellipsa.read(path)
    k = p.frequency_index(2.45e9)
    # At grid samples the probe returns the samples themselves (interpolate.hpp).
    g = p.probe(p.theta_deg[:, None], p.phi_deg[None, :], k)
    np.testing.assert_allclose(g["e_theta"], p.e_theta(k), rtol=1e-12, atol=1e-15)
    np.testing.assert_allclose(g["stokes_v"], p.polarisation(k)["stokes_v"], rtol=1e-9, atol=1e-15)
    # Between samples: what `ellipsa probe` says there.
    theta, phi = np.array([12.5, 47.3, 91.0]), np.array([3.0, 181.7, 359.2])
    q = p.probe(theta, phi, frequency_hz=2.45e9)
    for n in range(3):
        want = cli_json("probe", path, "--theta", theta[n], "--phi", phi[n], "--frequency", "2.45e9")
        assert 10 * np.log10(q["stokes_i"][n]) == pytest.approx(want["total_db"], abs=1e-9)
        np.testing.assert_allclose([q[f"stokes_{s}"][n] for s in "iquv"], want["stokes"], rtol=1e-9, atol=1e-12)
        assert ellipsa.SENSES[q["sense"][n]] == want["sense"]


def test_probe_outside_the_data_is_nan():
    p = ellipsa.read(str(EXAMPLES / "measured-loop-range.csv"), map_file=str(EXAMPLES / "measured-loop.map"))
    q = p.probe([10.0, 150.0], 0.0)  # the range sampled the upper hemisphere only
    assert np.isfinite(q["stokes_i"][0]) and np.isnan(q["stokes_i"][1])
    assert ellipsa.SENSES[q["sense"][1]] == "none"
    with pytest.raises(ValueError, match="theta_deg"):
        p.probe(190.0, 0.0)


def test_write_cut_is_the_cli_cut(tmp_path, cli):
    path = str(EXAMPLES / "turnstile.csv")
    p = ellipsa.read(path)
    code, _, err = cli("cut", path, "--theta", "60", "--frequency", "2.45e9", "--components", "rhcp,lhcp",
                       "--out", tmp_path / "cli.csv")
    assert code == 0, err
    p.write_cut(str(tmp_path / "py.csv"), theta_deg=60, components=["rhcp", "lhcp"], frequency_hz=2.45e9)
    assert (tmp_path / "py.csv").read_bytes() == (tmp_path / "cli.csv").read_bytes()
    p.write_cut(str(tmp_path / "py.svg"), phi_deg=0, components=["total"], style="rect")
    assert b"<svg" in (tmp_path / "py.svg").read_bytes()[:400]
    with pytest.raises(ellipsa.Error, match="exists"):
        p.write_cut(str(tmp_path / "py.svg"), phi_deg=0)
    p.write_cut(str(tmp_path / "py.svg"), phi_deg=0, force=True)


def test_svg_is_the_cli_svg_whatever_was_drawn_before(tmp_path, cli):
    # Cairo names an SVG's page group and embedded images after a count of every surface the
    # process made; exports/render.cpp renumbers them per file, so a figure drawn after others in
    # one Python session is the command's file byte for byte (a fresh process draws it first).
    path = str(EXAMPLES / "turnstile.csv")
    p = ellipsa.read(path)
    p.write_cut(str(tmp_path / "first.png"), phi_deg=0, size_px=(300, 200))
    code, _, err = cli("cut", path, "--phi", "0", "--components", "rhcp,lhcp", "--frequency", "2.45e9",
                       "--out", tmp_path / "cli-cut.svg")
    assert code == 0, err
    for n in range(2):
        p.write_cut(str(tmp_path / f"py-cut{n}.svg"), phi_deg=0, components=["rhcp", "lhcp"], frequency_hz=2.45e9)
        assert (tmp_path / f"py-cut{n}.svg").read_bytes() == (tmp_path / "cli-cut.svg").read_bytes()
    # A map embeds its colours as an image, which cairo names the same way.
    code, _, err = cli("map", path, "--show", "rhcp", "--size", "600x360", "--out", tmp_path / "cli-map.svg")
    assert code == 0, err
    p.write_map(str(tmp_path / "py-map.svg"), "rhcp", size_px=(600, 360))
    svg = (tmp_path / "py-map.svg").read_bytes()
    assert b'id="image1"' in svg and b'id="surface1"' in svg
    assert svg == (tmp_path / "cli-map.svg").read_bytes()


def test_peak_and_largest_sample():
    # The refined peak (peak_db, a parabola through the largest sample and its neighbours in dB)
    # is at least the largest sample, which info() gives beside it as peak_sample_db: the largest
    # of the samples' total power, read here with numpy. A half-wave dipole tilted by 13.3 deg puts
    # its broadside ring between the samples of a 2-degree grid; its peak is D = 1.641 (2.15 dBi,
    # Balanis sec. 4.6).
    p = ellipsa.synth("dipole", length_wl=0.5, step_deg=2, rotate_deg=(0.0, 13.3, 0.0))
    r = p.info()["results"][0]
    assert r["peak_sample_db"] == pytest.approx(10 * math.log10(np.max(p.power("total"))), abs=1e-12)
    assert r["peak_db"] >= r["peak_sample_db"]
    assert r["peak_db"] == pytest.approx(2.15, abs=0.01)


def same_as_cli(got, want):
    """Key by key, so a difference names its key."""
    assert got.keys() == want.keys()
    for key in want:
        assert got[key] == want[key], key


def test_coverage_is_the_cli_coverage(tmp_path, cli):
    # One pattern with its default components, and two with the best of both near the horizon:
    # the dict is the JSON `ellipsa coverage --out NAME.json` writes (the same code).
    a, b = str(EXAMPLES / "printed-dipole.csv"), str(EXAMPLES / "small-loop.csv")
    out = tmp_path / "one.json"
    code, _, err = cli("coverage", a, "--frequency", "2.45e9", "--levels", "0,-3", "--out", out)
    assert code == 0, err
    pa, pb = ellipsa.read(a), ellipsa.read(b)
    same_as_cli(ellipsa.coverage([pa], frequency_hz=2.45e9, levels_db=[0, -3]), json.loads(out.read_text()))
    out = tmp_path / "two.json"
    code, _, err = cli("coverage", a, b, "--horizon", "30", "--out", out)
    assert code == 0, err
    got = ellipsa.coverage([pa, pb], horizon_deg=30)  # no frequency: the middle one of A's, as the CLI
    same_as_cli(got, json.loads(out.read_text()))
    assert [s["pattern"] for s in got["series"]] == ["A", "B", "best of both"]
    # The same curves as a CSV file, byte for byte as the command writes it; refused without force.
    mine, theirs = tmp_path / "mine.csv", tmp_path / "theirs.csv"
    ellipsa.write_coverage(str(mine), [pa, pb], frequency_hz=2.45e9, horizon_deg=30)
    code, _, err = cli("coverage", a, b, "--frequency", "2.45e9", "--horizon", "30", "--out", theirs)
    assert code == 0, err
    assert mine.read_bytes() == theirs.read_bytes()
    with pytest.raises(ellipsa.Error, match="already exists"):
        ellipsa.write_coverage(str(mine), [pa, pb], frequency_hz=2.45e9, horizon_deg=30)
    ellipsa.write_coverage(str(tmp_path / "c.svg"), [pa], components=["total"], size_px=(400, 300))
    assert (tmp_path / "c.svg").read_text().startswith("<?xml")


def test_coverage_refusals_as_the_cli(cli):
    a = str(EXAMPLES / "printed-dipole.csv")
    code, _, err = cli("coverage", a, "--horizon", "120")
    assert code == 2
    with pytest.raises(ValueError) as e:
        ellipsa.coverage([ellipsa.read(a)], horizon_deg=120)
    # refused while the command line is parsed: "ellipsa: MESSAGE" and a line naming the help
    assert str(e.value) == err.strip().removeprefix("ellipsa: ").splitlines()[0]
    with pytest.raises(ValueError, match="not both"):
        ellipsa.coverage([ellipsa.read(a)], horizon_deg=10, elevation_deg=(0, 10))
    with pytest.raises(ValueError, match="size_px"):
        ellipsa.write_coverage("never.svg", [ellipsa.read(a)], size_px=(5, 5))


def test_coverage_of_a_short_dipole():
    # Balanis sec. 4.2: G = 1.5 sin^2 t; G >= 1 (0 dBi) on the zone |cos t| <= 1/sqrt 3, whose share
    # of the sphere is 1/sqrt 3 = 0.5774 (by hand). A 5-degree grid gives it to 0.001 (docs/views.md).
    c = ellipsa.coverage([ellipsa.synth("short-dipole", step_deg=5)], components=["total"], levels_db=[0])
    assert c["series"][0]["at_levels"][0]["share"] == pytest.approx(1 / math.sqrt(3), abs=1e-3)


def test_band_is_the_cli_band(tmp_path, cli):
    # Two demo antennas over their band with the pair figures: the dict is the JSON
    # `ellipsa band --out NAME.json` writes (the same code), compared key by key.
    a, b = str(EXAMPLES / "printed-dipole.csv"), str(EXAMPLES / "turnstile.csv")
    out = tmp_path / "band.json"
    code, _, err = cli("band", a, b, "--pair", "--environment", "uniform,indoor", "--direction", "30,45", "--out", out)
    assert code == 0, err
    pa, pb = ellipsa.read(a), ellipsa.read(b)
    got = ellipsa.band([pa, pb], environments=["uniform", "indoor"], direction_deg=(30, 45), pair=True)
    same_as_cli(got, json.loads(out.read_text()))
    # Taga 1990: in the uniform environment (XPR 0 dB) MEG is half the radiation efficiency.
    for f in got["patterns"][0]["frequencies"]:
        assert f["meg_db"]["uniform"] == pytest.approx(10 * math.log10(f["radiation_efficiency"] / 2), abs=0.02)
    # The CSV as the command writes it, byte for byte; a plot with chosen panels.
    mine, theirs = tmp_path / "mine.csv", tmp_path / "theirs.csv"
    ellipsa.write_band(str(mine), [pb])
    code, _, err = cli("band", b, "--out", theirs)
    assert code == 0, err
    assert mine.read_bytes() == theirs.read_bytes()
    ellipsa.write_band(str(tmp_path / "b.svg"), [pb], show=["gain", "axial-ratio"], size_px=(600, 400))
    assert (tmp_path / "b.svg").read_text().startswith("<?xml")
    with pytest.raises(ellipsa.Error, match="already exists"):
        ellipsa.write_band(str(mine), [pb])


@pytest.mark.parametrize("kwargs,args", [
    ({"environments": ["uniform", "nowhere"]}, ["--environment", "uniform,nowhere"]),
    ({"direction_deg": (200, 0)}, ["--direction", "200,0"]),
    ({"ar_threshold_db": -1}, ["--ar-threshold", "-1"]),
    ({"pair": True}, ["--pair"]),
])
def test_band_refusals_as_the_cli(tmp_path, cli, kwargs, args):
    # Bad arguments raise ValueError with the command line's message.
    a = str(EXAMPLES / "turnstile.csv")
    code, _, err = cli("band", a, *args, "--out", tmp_path / "x.json")
    assert code == 2
    with pytest.raises(ValueError) as e:
        ellipsa.band([ellipsa.read(a)], **kwargs)
    # A value refused while the command line is parsed (--direction) reads "ellipsa: MESSAGE" and a
    # line naming the command's help; the message itself is the same.
    assert str(e.value) == err.strip().removeprefix("ellipsa band: ").removeprefix("ellipsa: ").splitlines()[0]


def test_map_is_the_cli_map(tmp_path, cli):
    # The mapped values are the column of `ellipsa map --out NAME.csv` (the same code), sample by
    # sample; the CSV and the figure are the command's bytes.
    a, b = str(EXAMPLES / "turnstile.csv"), str(EXAMPLES / "printed-dipole.csv")
    p = ellipsa.read(a)
    for show, extra in (("rhcp", []), ("axial-ratio", ["--projection", "az-el"])):
        out = tmp_path / f"{show}.csv"
        code, _, err = cli("map", a, "--show", show, *extra, "--out", out)
        assert code == 0, err
        rows = np.genfromtxt(out, delimiter=",", names=True)
        m = p.map(show, projection="az-el" if extra else "hammer")
        assert m["quantity"] == rows.dtype.names[-1]
        assert np.array_equal(m["values"].ravel(), rows[m["quantity"]], equal_nan=True), show
        assert np.array_equal(np.repeat(m["theta_deg"], m["phi_deg"].size), rows["theta_deg"])
        mine = tmp_path / f"mine-{show}.csv"
        p.write_map(str(mine), show, projection="az-el" if extra else "hammer")
        assert mine.read_bytes() == out.read_bytes()
    # Conventions (docs/conventions.md): an ideal turnstile is right-hand circular toward the zenith,
    # axial ratio 0 dB there.
    ar = p.map("axial-ratio")
    assert ar["unit"] == "dB" and ar["values"][0, 0] == pytest.approx(0.0, abs=0.01)
    # A minus B, in dB, and the figure as the command draws it.
    d = p.map("total", minus=ellipsa.read(b), levels=[0], bar=(-10, 10))
    assert d["bar"] == (-10.0, 10.0) and list(d["contour_levels"]) == [0.0]
    mine, theirs = tmp_path / "mine.png", tmp_path / "theirs.png"
    p.write_map(str(mine), "total", minus=ellipsa.read(b), levels=[0], bar=(-10, 10), size_px=(600, 360))
    code, _, err = cli("map", a, "--minus", b, "--levels", "0", "--bar", "-10,10", "--size", "600x360", "--out", theirs)
    assert code == 0, err
    assert mine.read_bytes() == theirs.read_bytes()
    with pytest.raises(ellipsa.Error, match="already exists"):
        p.write_map(str(mine))


@pytest.mark.parametrize("kwargs,args", [
    ({"show": "gain"}, ["--show", "gain"]),
    ({"projection": "mercator"}, ["--projection", "mercator"]),
    ({"show": "tilt", "minus": "B"}, ["--show", "tilt", "--minus", "B"]),
    ({"bar": (3, 1)}, ["--bar", "3,1"]),
    ({"range_db": 0.5}, ["--range", "0.5"]),
])
def test_map_refusals_as_the_cli(tmp_path, cli, kwargs, args):
    # Bad arguments raise ValueError with the command line's message.
    a = str(EXAMPLES / "turnstile.csv")
    args = [str(EXAMPLES / "printed-dipole.csv") if x == "B" else x for x in args]
    if kwargs.get("minus") == "B":
        kwargs = dict(kwargs, minus=ellipsa.read(str(EXAMPLES / "printed-dipole.csv")))
    code, _, err = cli("map", a, *args, "--out", tmp_path / "x.csv")
    assert code == 2
    with pytest.raises(ValueError) as e:
        ellipsa.read(a).map(**kwargs)
    assert str(e.value).splitlines()[0] == err.strip().removeprefix("ellipsa map: ").removeprefix("ellipsa: ").splitlines()[0]


def same_folders(mine, theirs):
    """Every file of both folders, byte for byte (a PNG's bytes hold its pixels: equal bytes are
    equal pixels)."""
    names = sorted(f.name for f in theirs.iterdir())
    assert sorted(f.name for f in mine.iterdir()) == names
    for name in names:
        assert (mine / name).read_bytes() == (theirs / name).read_bytes(), name
    return names


def assert_no_3d_views(folder):
    """A build without the viewer: the report has no 3D view and says why (cli/report_3d.cpp), in
    the HTML and in the Markdown (where the underscore is escaped)."""
    assert not [f.name for f in folder.iterdir() if "-3d" in f.name]
    assert NO_3D_VIEWS_NOTE in (folder / "index.html").read_text()
    assert NO_3D_VIEWS_NOTE.replace("_", "\\_") in (folder / "report.md").read_text()


def test_report_is_the_cli_report(tmp_path, cli, monkeypatch):
    # The folder `ellipsa report --out` writes (the same code, cli/report_3d.cpp for the 3D
    # views): with the date fixed by SOURCE_DATE_EPOCH (reproducible-builds.org's convention),
    # every file is the command's, the 3D views included.
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1700000000")
    a, b = str(EXAMPLES / "turnstile.csv"), str(EXAMPLES / "small-loop.csv")
    theirs, mine = tmp_path / "cli", tmp_path / "py"
    code, _, err = cli("report", a, b, "--frequency", "2.45e9", "--style", "rect", "--environment", "indoor",
                       "--size", "640x480", "--out", theirs)
    assert code == 0, err
    p = ellipsa.read(a)
    ellipsa.write_report(str(mine), [p, ellipsa.read(b)], frequency_hz=2.45e9, style="rect", size_px=(640, 480),
                         environment=ellipsa.environment("indoor"))
    names = same_folders(mine, theirs)
    # Both patterns' views; the turnstile has phase, so it has the axial-ratio view too.
    if VIEWER:
        assert {n for n in names if "-3d" in n} >= {"p1-turnstile-2450MHz-3d.png", "p1-turnstile-2450MHz-3d-axial-ratio.png"}
    else:
        assert_no_3d_views(mine)
    md = (mine / "report.md").read_text()
    assert "MEG" in md and "2023-11-14 22:13 UTC" in md  # 1700000000 s after 1970-01-01 UTC
    with pytest.raises(ellipsa.Error, match="exists"):
        ellipsa.write_report(str(mine), [p])
    ellipsa.write_report(str(mine), [p], frequency_hz=2.45e9, force=True)
    with pytest.raises(ValueError, match="style"):
        ellipsa.write_report(str(tmp_path / "x"), [p], style="round")


def test_reports_one_after_another_in_one_session(tmp_path):
    # A session writing a second report tears down a second headless GL context; with the EGL
    # display terminated after the first, Mesa's llvmpipe crashed there in about one run in three
    # (this sequence). Each run is its own process, so a crash is a failed run, not a lost session.
    script = ("import ellipsa, sys\n"
              "p, q = ellipsa.read(sys.argv[2]), ellipsa.read(sys.argv[3])\n"
              "ellipsa.write_report(sys.argv[1], [p, q], frequency_hz=2.45e9, style='rect', size_px=(640, 480),\n"
              "                     environment=ellipsa.environment('indoor'))\n"
              "ellipsa.write_report(sys.argv[1], [p], frequency_hz=2.45e9, force=True)\n")
    for run in range(6):
        out = tmp_path / f"r{run}"
        r = subprocess.run([sys.executable, "-c", script, str(out), str(EXAMPLES / "turnstile.csv"),
                            str(EXAMPLES / "small-loop.csv")], capture_output=True, text=True, check=False)
        assert r.returncode == 0, f"run {run}: exit {r.returncode}: {r.stderr[-2000:]}"
        if VIEWER:
            assert (out / "p1-turnstile-2450MHz-3d.png").stat().st_size > 0
        else:
            assert_no_3d_views(out)


def test_report_without_gl_says_what_the_cli_says(tmp_path, cli, exe):
    # Where no OpenGL context can be made (here: GLVND finds no EGL vendor), the report notes each
    # 3D view as unavailable with the reason, from Python as from the command. Python runs in a
    # process of its own, so that the variable is read before any EGL use.
    env = dict(os.environ, SOURCE_DATE_EPOCH="1700000000", __EGL_VENDOR_LIBRARY_FILENAMES=str(tmp_path / "none.json"))
    a = str(EXAMPLES / "turnstile.csv")
    theirs, mine = tmp_path / "cli", tmp_path / "py"
    r = subprocess.run([exe, "report", a, "--frequency", "2.45e9", "--size", "320x240", "--out", str(theirs)],
                       env=env, capture_output=True, text=True, check=False)
    assert r.returncode == 0, r.stderr
    script = ("import ellipsa, sys; ellipsa.write_report(sys.argv[1], [ellipsa.read(sys.argv[2])], "
              "frequency_hz=2.45e9, size_px=(320, 240))")
    r = subprocess.run([sys.executable, "-c", script, str(mine), a], env=env, capture_output=True, text=True, check=False)
    assert r.returncode == 0, r.stderr
    names = same_folders(mine, theirs)
    assert not [n for n in names if "-3d" in n]
    if not VIEWER:  # no GL asked for: the note is the build's
        assert_no_3d_views(mine)
        return
    md = (mine / "report.md").read_text()
    assert "3D view unavailable: cannot create a headless OpenGL 3.3 context" in md
    assert "3D axial-ratio view unavailable" in md


def test_report_date_from_source_date_epoch_refused_as_the_cli(tmp_path, cli, monkeypatch):
    # The reproducible-builds specification asks a tool to refuse a malformed SOURCE_DATE_EPOCH.
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "yesterday")
    a = str(EXAMPLES / "turnstile.csv")
    code, _, err = cli("report", a, "--out", tmp_path / "cli")
    assert code == 2 and "SOURCE_DATE_EPOCH" in err
    with pytest.raises(ValueError) as e:
        ellipsa.write_report(str(tmp_path / "py"), [ellipsa.read(a)])
    assert str(e.value) == err.strip().removeprefix("ellipsa report: ")
    assert not (tmp_path / "py").exists()


def test_reports_from_two_threads_at_once(tmp_path, monkeypatch):
    # write_report releases the interpreter's lock; two reports drawn at once take turns at the
    # 3D renderer (cli/report_3d.cpp: ImGui has one current context a process), and their 3D views
    # are those of a report drawn alone. (Only the 3D views: under a loaded machine a Cairo cut
    # PNG drawn by two threads at once once differed from the lone one in a few pixels; open.)
    import threading
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1700000000")
    p = ellipsa.read(str(EXAMPLES / "turnstile.csv"))
    ellipsa.write_report(str(tmp_path / "alone"), [p], frequency_hz=2.45e9, size_px=(320, 240))
    errors = []

    def write(n):
        try:
            ellipsa.write_report(str(tmp_path / f"t{n}"), [p], frequency_hz=2.45e9, size_px=(320, 240))
        except Exception as e:  # noqa: BLE001 (reported below)
            errors.append(e)

    threads = [threading.Thread(target=write, args=(n,)) for n in range(2)]
    for t in threads:
        t.start()
    for t in threads:
        t.join()
    assert not errors
    views = sorted(f.name for f in (tmp_path / "alone").iterdir() if "-3d" in f.name)
    assert len(views) == (2 if VIEWER else 0)
    for n in range(2):
        if not VIEWER:
            assert_no_3d_views(tmp_path / f"t{n}")
        for name in views:
            assert (tmp_path / f"t{n}" / name).read_bytes() == (tmp_path / "alone" / name).read_bytes(), name


def test_phases_are_the_cli_probe(cli_json):
    # The phase of each component: the keys and values of `ellipsa probe --json` (null there: NaN here).
    path = str(EXAMPLES / "turnstile.csv")
    p = ellipsa.read(path)
    q = p.probe([47.3, 0.0], [181.7, 0.0], frequency_hz=2.45e9)
    for n, (theta, phi) in enumerate([(47.3, 181.7), (0.0, 0.0)]):
        want = cli_json("probe", path, "--theta", theta, "--phi", phi, "--frequency", "2.45e9")
        for name in ("theta", "phi", "vertical", "horizontal", "co", "cross", "rhcp", "lhcp"):
            key = name + "_phase_deg"
            if want[key] is None:
                assert np.isnan(q[key][n]), key
            else:
                assert q[key][n] == pytest.approx(want[key], abs=1e-9), key
    c = p.cut(phi_deg=0, components=["total", "rhcp"], frequency_hz=2.45e9)
    assert np.all(np.isnan(c["phase_deg"]["total"]))  # a power has no phase
    e_r = (c["e_theta"] + 1j * c["e_phi"]) / np.sqrt(2)  # IEEE Std 145, Balanis sec. 2.12
    ok = np.isfinite(c["phase_deg"]["rhcp"])
    assert ok.sum() > 100
    np.testing.assert_allclose(c["phase_deg"]["rhcp"][ok], np.degrees(np.angle(e_r[ok])), atol=1e-9)


def test_cut_range_and_dpi_limits_as_the_cli(tmp_path, cli):
    # One set of limits for the cut plot's range (exports/cut_plot.hpp) and the dpi
    # (exports/render.hpp): the module refuses what `ellipsa cut` refuses, in the same numbers.
    p = ellipsa.synth("short-dipole", step_deg=10)
    code, _, err = cli("cut", "-", "--phi", "0", "--range", "2", "--out", tmp_path / "c.svg")
    assert code == 2 and "from 3 to 200" in err
    with pytest.raises(ValueError, match="from 3 to 200"):
        p.write_cut(str(tmp_path / "c.svg"), phi_deg=0, range_db=2)
    with pytest.raises(ValueError, match="from 3 to 200"):
        p.write_cut(str(tmp_path / "c.svg"), phi_deg=0, range_db=201)
    with pytest.raises((ValueError, ellipsa.Error), match="from 36 to 2400"):
        p.write_cut(str(tmp_path / "c.svg"), phi_deg=0, dpi=2401)
    p.write_cut(str(tmp_path / "c.svg"), phi_deg=0, range_db=3, dpi=36)
    assert (tmp_path / "c.svg").exists()
