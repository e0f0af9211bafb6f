#!/usr/bin/python3
"""Run a command a few times; print its best wall-clock and best CPU time (user + system of the
child), in seconds: "wall cpu". CPU time barely depends on what else the machine is doing, so
the benchmark table shows both. Usage: time_cmd.py RUNS CMD [ARGS...]"""
import os
import subprocess
import sys
import time

runs = int(sys.argv[1])
cmd = sys.argv[2:]
best_wall = best_cpu = float("inf")
for _ in range(runs):
    before = os.times()
    t0 = time.perf_counter()
    subprocess.run(cmd, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, check=False)
    wall = time.perf_counter() - t0
    after = os.times()
    cpu = (after.children_user - before.children_user) + (after.children_system - before.children_system)
    best_wall = min(best_wall, wall)
    best_cpu = min(best_cpu, cpu)
print(f"{best_wall:.3f} {best_cpu:.3f}")
