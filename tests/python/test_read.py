"""Reading files, arrays without copies, writing the schema, and errors with the command line's
file:line:column text."""
import re

import numpy as np
import pytest

import ellipsa
from conftest import EXAMPLES


def plain_numpy_reading(path):
    """A separate reading of a complex-family schema file with numpy alone."""
    with open(path, encoding="utf-8") as f:
        lines = [ln for ln in f if not ln.startswith("#") and ln.strip()]
    names = lines[0].strip().split(",")
    v = np.loadtxt(lines[1:], delimiter=",")
    col = {n: v[:, i] for i, n in enumerate(names)}
    order = np.lexsort((col["phi"], col["theta"], col["frequency"]))
    return {n: c[order] for n, c in col.items()}


def test_fields_are_views_of_the_file_values():
    path = EXAMPLES / "printed-dipole.csv"
    p = ellipsa.read(str(path))
    ref = plain_numpy_reading(path)
    nf, nt, nph = len(p.frequencies_hz), len(p.theta_deg), len(p.phi_deg)
    assert nf == 21 and p.quantity == "gain" and p.content == "complex"
    np.testing.assert_allclose(np.unique(ref["frequency"]) * 1e6, p.frequencies_hz, rtol=1e-12)
    et = (ref["e_theta_re"] + 1j * ref["e_theta_im"]).reshape(nf, nt, nph)
    ep = (ref["e_phi_re"] + 1j * ref["e_phi_im"]).reshape(nf, nt, nph)
    for k in (0, 10, 20):
        np.testing.assert_array_equal(p.e_theta(k), et[k])  # the same doubles: shortest round trip
        np.testing.assert_array_equal(p.e_phi(k), ep[k])
    a = p.e_theta(3)
    assert not a.flags.owndata and not a.flags.writeable  # a view of the pattern's own array
    assert a.base is p
    assert np.shares_memory(a, p.e_theta(3))
    del p  # the view keeps the pattern alive
    assert np.isfinite(a).all()


def test_frequency_by_value(cli):
    p = ellipsa.read(str(EXAMPLES / "turnstile.csv"))
    assert p.frequency_index(2.45e9) == 10
    np.testing.assert_array_equal(p.e_phi(frequency_hz=2.451e9), p.e_phi(10))
    with pytest.raises(ellipsa.Error, match="2.45 GHz") as caught:
        p.e_phi(frequency_hz=3e9)  # the message lists what the file holds
    assert caught.value.file == p.path == str(EXAMPLES / "turnstile.csv")
    code, _, err = cli("info", p.path, "--frequency", "3e9")
    assert code != 0 and err.strip() == f"ellipsa info: {caught.value}"  # the command's very words
    with pytest.raises(IndexError):
        p.e_theta(21)


def test_round_trip_through_the_schema(tmp_path):
    rng = np.random.default_rng(7)
    theta = np.arange(0, 181, 15.0)
    phi = np.arange(0, 360, 30.0)
    shape = (2, theta.size, phi.size)
    et = rng.normal(size=shape) + 1j * rng.normal(size=shape)
    ep = rng.normal(size=shape) + 1j * rng.normal(size=shape)
    p = ellipsa.Pattern.from_arrays(theta, phi, et, ep, [2.4e9, 2.5e9], quantity="directivity", name="random")
    out = tmp_path / "r.csv"
    p.write(str(out))
    with pytest.raises(ellipsa.Error, match="exists"):
        p.write(str(out))  # never replaced without force
    p.write(str(out), force=True)
    q = ellipsa.read(str(out))
    assert q.name == "random" and q.quantity == "directivity"
    np.testing.assert_array_equal(q.theta_deg, theta)
    np.testing.assert_array_equal(q.phi_deg, phi)
    for k in range(2):
        np.testing.assert_array_equal(q.e_theta(k), et[k])
        np.testing.assert_array_equal(q.e_phi(k), ep[k])
    # Another family keeps the values to its own rounding (dB and degrees written shortest round trip).
    p.write(str(tmp_path / "c.csv"), family="circular-db-phase")
    c = ellipsa.read(str(tmp_path / "c.csv"))
    np.testing.assert_allclose(c.e_theta(1), et[1], rtol=1e-12, atol=1e-12)


def test_bad_arrays_are_refused():
    t, f = np.arange(0, 181, 90.0), np.arange(0, 360, 90.0)
    z = np.zeros((t.size, f.size), complex)
    with pytest.raises(ValueError, match="equally spaced"):
        ellipsa.Pattern.from_arrays([0, 10, 30], f, z[:3], z[:3])
    with pytest.raises(ValueError, match="shape"):
        ellipsa.Pattern.from_arrays(t, f, z[:, :2], z[:, :2])
    with pytest.raises(ValueError, match="finite"):
        ellipsa.Pattern.from_arrays(t, f, z + np.nan, z)
    with pytest.raises(ValueError, match="quantity"):
        ellipsa.Pattern.from_arrays(t, f, z, z, quantity="power")


def test_error_carries_file_line_column_as_the_cli(tmp_path, cli):
    bad = tmp_path / "bad.csv"
    bad.write_text("# ellipsa far-field CSV, schema version 1\n"
                   "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n"
                   "0,0,1,0,0,0\n"
                   "0,90,1,x,0,0\n")
    with pytest.raises(ellipsa.Error) as caught:
        ellipsa.read(str(bad))
    e = caught.value
    assert isinstance(e, ValueError)
    assert (e.file, e.line, e.column) == (str(bad), 4, 8)
    assert re.search(r'column "e_theta_im", found "x"', e.message)
    code, _, err = cli("info", bad)
    assert code != 0
    assert err.strip() == f"ellipsa info: {e}"  # the very same text


def test_map_and_assume_as_the_cli(cli_json):
    path = str(EXAMPLES / "measured-loop-range.csv")
    mapfile = str(EXAMPLES / "measured-loop.map")
    p = ellipsa.read(path, map_file=mapfile)
    assert p.name == "small loop (range, upper hemisphere)"
    assert p.info(frequency_hz=2.42e9) == cli_json("info", path, "--map-file", mapfile, "--frequency", "2.42e9")
    # The same options given as a dict and as the command line's text, refused with the same words.
    q = ellipsa.read(path, map_file=mapfile, assume={"source": "range B"})
    assert q.source == "range B"
    with pytest.raises(ellipsa.Error, match=r"assume: expected metadata \"name\" once.*measured-loop.map:16"):
        ellipsa.read(path, map_file=mapfile, assume={"name": "renamed"})  # the map file gives it
    with pytest.raises(ellipsa.Error, match="--assume") as a:
        ellipsa.read(path, map_file=mapfile, assume="name")
    assert "expected name=value" in str(a.value)
