"""Summary figures and cuts against published closed-form values and the command line's JSON."""
import math

import numpy as np
import pytest

import ellipsa
from conftest import EXAMPLES


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
