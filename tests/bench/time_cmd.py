#!/usr/bin/python3
"""Run a command a few times; print the median of its wall-clock times and the median of its CPU
times (user + system of the child and its children), in seconds: "wall cpu". CPU time barely
depends on what else the machine is doing, so the benchmark table shows both.
Usage: time_cmd.py RUNS CMD [ARGS...]"""
import os
import statistics
import subprocess
import sys
import time

runs = int(sys.argv[1])
cmd = sys.argv[2:]
walls, cpus = [], []
for _ in range(runs):
    before = os.times()
    t0 = time.perf_counter()
    subprocess.run(cmd, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, check=False)
    wall = time.perf_counter() - t0
    after = os.times()
    cpu = (after.children_user - before.children_user) + (after.children_system - before.children_system)
    walls.append(wall)
    cpus.append(cpu)
print(f"{statistics.median(walls):.3f} {statistics.median(cpus):.3f}")
