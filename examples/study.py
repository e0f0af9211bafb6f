#!/usr/bin/python3
# %% [markdown]
# # The tag antenna study in Python (notebook style)
#
# The demo scenario of examples/README.md (invented): a 2.45 GHz pallet tag in a cold store, three
# candidate antennas, power arriving scattered from around the horizon. The same study as
# docs/guide.md, through `import ellipsa` instead of the command line. Each `# %%` is a cell for
# editors that run cells; the file also runs as a script:
#
#     examples/study.py                 # after ./dev build (finds build/python by itself)
#     examples/study.py --plot out.png  # also draws the figures (needs python3-matplotlib)
import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent
try:
    import ellipsa
except ImportError:  # not installed: use the one ./dev build made
    sys.path.insert(0, str(HERE.parent / "build" / "python"))
    import ellipsa
import numpy as np

# %% The three candidates and the environment
names = {"printed dipole": "printed-dipole.csv", "turnstile": "turnstile.csv", "small loop": "small-loop.csv"}
tags = {name: ellipsa.read(str(HERE / file)) for name, file in names.items()}
indoor = ellipsa.environment("indoor")  # Taga's Gaussian model, power from around the horizon, XPR 1 dB
print(indoor.description)

# %% Headline figures at 2.45 GHz (what `ellipsa info` says)
print(f"\n{'2.45 GHz':16s} {'peak dBi':>9s} {'eff. %':>7s} {'HPBW el.':>9s} {'polarisation':>22s}")
for name, p in tags.items():
    s = p.summary(frequency_hz=2.45e9)
    pol = s["sense"] if s["axial_ratio_db"] is None else f"{s['sense']}, AR {s['axial_ratio_db']:.2f} dB"
    hpbw = "none" if s["hpbw_elevation_deg"] is None else f"{s['hpbw_elevation_deg']:.1f}"
    print(f"{name:16s} {s['peak_db']:9.2f} {100 * s['radiation_efficiency']:7.1f} {hpbw:>9s} {pol:>22s}")

# %% Mean effective gain as mounted, across the band
band = tags["printed dipole"].frequencies_hz
meg = {name: np.array([ellipsa.meg(p, indoor, k)["meg_db"] for k in range(len(band))]) for name, p in tags.items()}
edges = [int(np.argmin(abs(band - f))) for f in (2.40e9, 2.45e9, 2.48e9)]
print("\nMEG indoors as mounted, dBi   2.40 / 2.45 / 2.48 GHz")
for name, m in meg.items():
    print(f"{name:16s} " + " ".join(f"{m[k]:7.2f}" for k in edges))

# %% Orientation: pallets are moved by fork-lift, so the tag may end up tilted or rolled
print("\nMEG over orientations at 2.45 GHz, dBi: as mounted, worst, best, random mean, 90 % reach")
turned = {name: ellipsa.orientations(p, indoor, frequency_hz=2.45e9) for name, p in tags.items()}
for name, o in turned.items():
    print(f"{name:16s} {o['as_given_db']:7.2f} {o['min_db']:7.2f} {o['max_db']:7.2f} "
          f"{o['random_orientation_mean_db']:7.2f} {o['random_orientation_p10_db']:7.2f}")

# %% Fading: how deep the 1 % fades go, and what two of them together would gain
pair = [tags["printed dipole"], tags["turnstile"]]
study = ellipsa.diversity(pair, indoor, frequency_hz=2.45e9)["pairs"][0]
sim = ellipsa.fading(pair, indoor, indices=[pair[0].frequency_index(2.45e9)] * 2, realisations=20000, threads=2)
print(f"\nprinted dipole + turnstile: ECC {study['ecc']:.2g}, selection gain at 1 % "
      f"{study['diversity_gain_db']:.2f} dB (exact), simulated power correlation "
      f"{sim['pair']['power_correlation']:.3f}")
print(f"1 % level, dBi: dipole {sim['patterns'][0]['level_1pct_db']:.2f}, turnstile "
      f"{sim['patterns'][1]['level_1pct_db']:.2f}, selection of both {sim['pair']['selection_levels_db'][0]:.2f}")

# %% Figures (optional): MEG across the band, and the distribution of received power
if "--plot" in sys.argv:
    try:
        import matplotlib
        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
    except ImportError:
        sys.exit("--plot needs matplotlib (Debian: python3-matplotlib)")
    fig, (left, right) = plt.subplots(1, 2, figsize=(11, 4.2))
    for name, m in meg.items():
        left.plot(band / 1e9, m, marker=".", label=name)
    left.axvspan(2.4, 2.4835, color="0.92")
    left.set(xlabel="frequency (GHz)", ylabel="MEG indoors (dBi)", title="Mean effective gain as mounted")
    left.legend()
    curves = [("printed dipole", sim["patterns"][0]["cdf"]), ("turnstile", sim["patterns"][1]["cdf"]),
              ("selection of both", sim["pair"]["selection_cdf"])]
    for name, (level, prob) in curves:
        right.semilogy(level, prob, label=name)
    right.set(xlabel="received power (dBi)", ylabel="P(power <= level)", title="Fading at 2.45 GHz (simulated)",
              ylim=(1e-3, 1))
    right.legend()
    fig.tight_layout()
    out = sys.argv[sys.argv.index("--plot") + 1]
    fig.savefig(out, dpi=100)
    print(f"\nwrote {out}")
