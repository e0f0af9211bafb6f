"""The mounting arguments of ellipsa.read (up, rotate, phase_centre): the command line's --up,
--rotate and --phase-centre through the same core (pattern/install.hpp), with the repeatable check
of docs/conventions.md "The mounting frame": a dipole along x read with up="+x" has the MEG in
every environment and the orientation curve of the same dipole along z read as it is."""
import numpy as np
import pytest

import ellipsa


@pytest.fixture(scope="module")
def dipoles(tmp_path_factory):
    d = tmp_path_factory.mktemp("mounting")
    z, x = d / "z.csv", d / "x.csv"
    # Half-wave dipoles (Balanis ch. 4) on a 2-degree grid; x: turned 90 deg about y.
    ellipsa.synth("dipole", step_deg=2).write(str(z))
    ellipsa.synth("dipole", step_deg=2, rotate_deg=(0, 90, 0)).write(str(x))
    return str(z), str(x)


@pytest.mark.parametrize("env", ["uniform", "indoor", "urban", "rural"])
def test_x_dipole_with_up_x_is_the_z_dipole(dipoles, env):
    z_path, x_path = dipoles
    z, x = ellipsa.read(z_path), ellipsa.read(x_path, up="+x")
    e = ellipsa.environment(env)
    mz, mx = ellipsa.meg(z, e), ellipsa.meg(x, e)
    # up +x is a quarter turn about y: the x dipole is resampled (interpolated) onto the grid.
    assert mx["meg_db"] == pytest.approx(mz["meg_db"], abs=0.01)
    assert mx["vertical_share"] == pytest.approx(mz["vertical_share"], abs=1e-3)
    oz, ox = ellipsa.orientations(z, e), ellipsa.orientations(x, e)
    np.testing.assert_allclose(ox["meg_db"], oz["meg_db"], atol=0.02)
    # Unmounted, the x dipole lies in the horizon: its vertical share is far below the z dipole's.
    flat = ellipsa.meg(ellipsa.read(x_path), e)
    assert flat["vertical_share"] < mz["vertical_share"] - 0.3


def test_mounting_is_the_command_line(dipoles, cli_json):
    _, x_path = dipoles
    p = ellipsa.read(x_path, up="+x", rotate="z:30,x:10")
    j = cli_json("info", x_path, "--up", "+x", "--rotate", "z:30,x:10")
    mine = p.info()
    assert mine["mounting"] == j["mounting"]
    assert mine["results"][0]["peak_db"] == j["results"][0]["peak_db"]
    assert p.mounting.startswith("up +x, then turns z:30,x:10 about the world axes")
    # The same turns as (axis, degrees) pairs.
    q = ellipsa.read(x_path, up="+x", rotate=[("z", 30), ("x", 10)])
    np.testing.assert_array_equal(q.e_theta(), p.e_theta())
    assert ellipsa.read(x_path).mounting == "as in the file (+z up)"


def test_phase_centre_moves_the_reference(dipoles):
    z_path, _ = dipoles
    # Moving the reference to c multiplies the field by exp(-j k r.c) (docs/conventions.md):
    # toward the zenith (theta 0) the phase turns by -k c_z; sideways (theta 90) not at all.
    c = 0.1
    k = 2 * np.pi * 2.45e9 / 299792458.0
    a, b = ellipsa.read(z_path), ellipsa.read(z_path, phase_centre=(0, 0, c))
    i90 = int(np.argmin(abs(a.theta_deg - 90)))
    np.testing.assert_allclose(b.e_theta()[i90], a.e_theta()[i90], rtol=1e-12, atol=1e-15)
    i30 = int(np.argmin(abs(a.theta_deg - 30)))
    expect = np.exp(-1j * k * c * np.cos(np.radians(30)))
    np.testing.assert_allclose(b.e_theta()[i30], a.e_theta()[i30] * expect, rtol=1e-9, atol=1e-15)
    assert ellipsa.read(z_path, phase_centre="auto").info()["results"][0]["phase_centre"] is not None


def test_mounting_refusals_name_the_argument(dipoles):
    z_path, _ = dipoles
    with pytest.raises(ellipsa.Error, match="expected an axis") as e:
        ellipsa.read(z_path, up="sideways")
    assert e.value.file == "up"
    with pytest.raises(ellipsa.Error, match="expected turns AXIS:DEG") as e:
        ellipsa.read(z_path, rotate="z30")
    assert e.value.file == "rotate"
    with pytest.raises(ellipsa.Error, match="expected X,Y,Z in metres") as e:
        ellipsa.read(z_path, phase_centre="1,2")
    assert e.value.file == "phase_centre"
