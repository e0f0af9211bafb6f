"""MEG, ECC, exact combining and the fading simulation against published values and against the
command line's JSON on the demo files."""
import math

import numpy as np
import pytest

import ellipsa
from conftest import EXAMPLES

IDEAL_MEG_DB = 10 * math.log10(0.5)  # -3.0103 dBi


def isotropic(quantity="directivity"):
    """|E_theta|^2 = 1 everywhere: an isotropic lossless antenna (not realisable, a definition)."""
    t, f = np.arange(0, 181, 5.0), np.arange(0, 360, 5.0)
    one = np.ones((t.size, f.size), complex)
    return ellipsa.Pattern.from_arrays(t, f, one, 0 * one, quantity=quantity)


def test_meg_of_isotropic_lossless_antenna():
    # Taga, IEEE Trans. VT-39 (1990); Kildal & Rosengren, IEEE Commun. Mag. 42(12) (2004): in the
    # isotropic environment (XPR 0 dB) MEG = radiation efficiency / 2 = -3.01 dBi for a lossless antenna.
    env = ellipsa.environment("uniform")
    m = ellipsa.meg(isotropic(), env)
    assert m["meg_db"] == pytest.approx(IDEAL_MEG_DB, abs=1e-9)
    assert m["vertical_share"] == pytest.approx(1.0)
    # Any lossless antenna gives the same, to the grid's integration error (short dipole, 2 deg grid).
    d = ellipsa.meg(ellipsa.synth("short-dipole", step_deg=2), env)
    assert d["meg_db"] == pytest.approx(IDEAL_MEG_DB, abs=0.005)
    # Horizontal-only incoming power and a vertical antenna: nothing received (XPR -inf).
    h = ellipsa.meg(isotropic(), ellipsa.environment("uniform", xpr_db="-inf"))
    assert h["meg"] == 0


def test_combining_independent_equal_branches():
    # Jakes, Microwave Mobile Communications (1974), ch. 5; Simon & Alouini (2005), ch. 9: two
    # independent equal Rayleigh branches at 1 % outage gain 10.2 dB (selection) and 11.7 dB (MRC).
    c = ellipsa.combine(1.0, 1.0, 0.0, [0.01, 0.1])
    assert c["selection_db"][0] == pytest.approx(10.2, abs=0.05)
    assert c["mrc_db"][0] == pytest.approx(11.7, abs=0.05)
    # Closed forms for rho = 0 and equal means (same sources): F_SC = (1 - e^-x)^2,
    # F_MRC = 1 - e^-x (1 + x).
    x = np.logspace(-4, 1, 30)
    np.testing.assert_allclose(ellipsa.selection_cdf(x, 1, 1, 0), np.expm1(-x) ** 2, rtol=1e-12)
    np.testing.assert_allclose(ellipsa.mrc_cdf(x, 1, 1, 0), -np.expm1(-x) - x * np.exp(-x), rtol=1e-9)
    # Fully correlated branches gain nothing by selection (the stronger branch alone).
    full = ellipsa.combine(1.0, 1.0, 1.0, [0.01])
    assert abs(full["selection_db"][0]) < 0.003
    with pytest.raises(ellipsa.Error):
        ellipsa.combine(1.0, 1.0, 1.5)


def test_diversity_study_is_the_cli(cli_json):
    a, b = str(EXAMPLES / "printed-dipole.csv"), str(EXAMPLES / "turnstile.csv")
    env = ellipsa.environment("indoor")
    d = ellipsa.diversity([ellipsa.read(a), ellipsa.read(b)], env, frequency_hz=2.45e9, orientations=True)
    j = cli_json("diversity", a, b, "--environment", "indoor", "--frequency", "2.45e9", "--orientations")
    assert d["environment"] == j["environment"]
    for mine, theirs in zip(d["patterns"], j["patterns"]):
        r = mine[0]
        assert r["meg_db"] == theirs["meg_db"] and r["meg_vertical_db"] == theirs["meg_vertical_db"]
        assert r["orientations"]["min_db"] == theirs["orientations"]["min_db"]
        assert r["orientations"]["random_orientation_p10_db"] == theirs["orientations"]["random_orientation_p10_db"]
        np.testing.assert_array_equal(r["orientations"]["meg_db"], [s[2] for s in theirs["orientations"]["samples"]])
    q = d["pairs"][0]
    assert q["ecc"] == j["ecc"] and q["diversity_gain_db"] == j["diversity_gain_db"]
    assert q["combining"]["mrc_db"][1] == j["combining"]["0.1"]["mrc_db"]
    e = ellipsa.ecc(ellipsa.read(a), ellipsa.read(b), env, 10, 10)
    assert e["ecc"] == j["ecc"]


def test_fading_is_the_cli_and_matches_meg(cli_json):
    a, b = str(EXAMPLES / "printed-dipole.csv"), str(EXAMPLES / "turnstile.csv")
    env = ellipsa.environment("indoor")
    pa, pb = ellipsa.read(a), ellipsa.read(b)
    f = ellipsa.fading([pa, pb], env, indices=[10, 10], realisations=20000, seed=3, threads=2)
    j = cli_json("fading", a, b, "--environment", "indoor", "--frequency", "2.45e9", "--samples", "20000", "--seed", "3")
    for mine, theirs in zip(f["patterns"], j["patterns"]):
        assert mine["mean_db"] == theirs["mean_db"]  # the same seed: the same draws, whatever the threads
        np.testing.assert_array_equal(mine["levels_db"], [theirs["levels_db"][k] for k in ("0.01", "0.1", "0.5")])
        level, prob = mine["cdf"]
        np.testing.assert_array_equal(np.c_[level, prob], np.array(theirs["cdf"], float))
    assert f["pair"]["power_correlation"] == j["pair"]["power_correlation"]
    # The simulation's expectation is the MEG (pattern/fading.hpp): the mean lies within its interval.
    meg = ellipsa.meg(pa, env, 10)["meg_db"]
    assert f["patterns"][0]["analytic_mean_db"] == pytest.approx(meg, abs=1e-12)
    lo, hi = f["patterns"][0]["mean_ci95_db"]
    assert lo - 0.05 <= meg <= hi + 0.05


def test_rank_is_the_cli_rank(cli_json):
    # Two demo antennas in two environments against the default reference dipole: the dict is
    # what `ellipsa rank --json` prints (the same code, cli/rank_json.cpp), compared key by key.
    a, b = str(EXAMPLES / "printed-dipole.csv"), str(EXAMPLES / "turnstile.csv")
    envs = [ellipsa.environment("uniform"), ellipsa.environment("indoor")]
    r = ellipsa.rank([ellipsa.read(a), ellipsa.read(b)], envs, frequency_hz=2.45e9, tilt_step_deg=30,
                     roll_step_deg=30, threads=2)
    j = cli_json("rank", a, b, "--environment", "uniform,indoor", "--frequency", "2.45e9", "--tilt-step", "30",
                 "--roll-step", "30")
    assert r.keys() == j.keys()
    for key in j:
        assert r[key] == j[key], key
    # Taga 1990: in the uniform environment with XPR 0 dB the MEG is half the radiation efficiency,
    # for the lossless reference dipole -3.01 dBi.
    assert r["reference"]["environments"]["uniform"]["meg_db"] == pytest.approx(IDEAL_MEG_DB, abs=0.01)
    # The rows are sorted best first by the score, the mean advantage over the environments.
    scores = [row["score_db"] for row in r["rows"]]
    assert scores == sorted(scores, reverse=True)
    for row in r["rows"]:
        parts = [e["score_part_db"] for e in row["environments"].values()]
        assert row["score_db"] == pytest.approx(sum(parts) / len(parts), abs=1e-9)


def test_rank_defaults_and_reference_as_the_cli(cli_json):
    # No environments: every preset; no frequency: the middle one of each file; a pattern as the
    # reference is named by its file, as --reference FILE.
    a, ref = str(EXAMPLES / "small-loop.csv"), str(EXAMPLES / "printed-dipole.csv")
    r = ellipsa.rank([ellipsa.read(a)], reference=ellipsa.read(ref), orientations=False, outage=0.1)
    j = cli_json("rank", a, "--reference", ref, "--no-orientations", "--outage", "0.1")
    assert r == j
    assert [e["environment"]["name"] for e in r["environment_list"]] == [
        p["name"] for p in ellipsa.environment_presets()]


@pytest.mark.parametrize("kwargs,args,option", [
    ({"score": "best"}, ["--score", "best"], "score"),
    ({"outage": 1.5}, ["--outage", "1.5"], None),
    ({"score": "worst", "orientations": False}, ["--score", "worst", "--no-orientations"], None),
])
def test_rank_refusals_as_the_cli(cli, kwargs, args, option):
    # Bad arguments raise ValueError with the command line's message (after the option's name).
    a = str(EXAMPLES / "printed-dipole.csv")
    code, _, err = cli("rank", a, *args)
    assert code == 2
    # a value refused while parsing reads "ellipsa: MESSAGE" and a line naming the command's help
    message = err.strip().removeprefix("ellipsa rank: ").removeprefix("ellipsa: ").splitlines()[0]
    if option:
        message = message.removeprefix("--" + option + ": ")
    with pytest.raises(ValueError) as e:
        ellipsa.rank([ellipsa.read(a)], [ellipsa.environment("uniform")], **kwargs)
    assert str(e.value) == (option + ": " if option else "") + message


def test_environment_refusals_as_the_cli(tmp_path, cli):
    with pytest.raises(ValueError, match="xpr"):
        ellipsa.environment("indoor", xpr_db="lots")
    with pytest.raises(ValueError, match="environment"):
        ellipsa.environment("nowhere")
    table = tmp_path / "profile.csv"
    table.write_text("elevation_deg,p_v,p_h\n0,1,1\n10,x,1\n")
    with pytest.raises(ellipsa.Error) as caught:
        ellipsa.environment("profile", profile=str(table))
    assert caught.value.line == 3
    code, _, err = cli("diversity", EXAMPLES / "printed-dipole.csv", "--environment", "profile", "--profile", table)
    assert code != 0 and err.strip() == f"ellipsa diversity: {caught.value}"
