#!/usr/bin/python3
"""Writes a large synthetic NWB 2.x file for the NWB benchmark (not a test
fixture; nothing here is committed output). Seeded; h5py + NumPy.

  /usr/bin/python3 bench/nwb/make_large_nwb.py OUT.nwb [units] [hours] [raw_gb]

Units fire as Poisson trains (rates 0.5-6 Hz, about 20 M spikes for 1,000
units over 2 h), 600 trials, 10,000 laser pulses in an interval table, and an
int16 raw ElectricalSeries of `raw_gb` GB that a session read must NOT load.
"""
import sys

import h5py
import numpy as np

out = sys.argv[1]
n_units = int(sys.argv[2]) if len(sys.argv) > 2 else 1000
hours = float(sys.argv[3]) if len(sys.argv) > 3 else 2.0
raw_gb = float(sys.argv[4]) if len(sys.argv) > 4 else 2.0
rng = np.random.default_rng(7)
T = hours * 3600.0
STR = h5py.string_dtype()

with h5py.File(out, "w") as f:
    f.attrs["nwb_version"] = "2.7.0"
    f.attrs["neurodata_type"] = "NWBFile"
    f.attrs["namespace"] = "core"
    for g in ["acquisition", "analysis", "processing", "stimulus/presentation", "general", "intervals"]:
        f.require_group(g)
    u = f.create_group("units")
    u.attrs["neurodata_type"] = "Units"
    u.attrs.create("colnames", np.array(["spike_times"], dtype=object), dtype=STR)
    u.create_dataset("id", data=np.arange(n_units, dtype=np.int64))
    rates = rng.uniform(0.5, 6.0, n_units)
    counts = rng.poisson(rates * T)
    ends = np.cumsum(counts).astype(np.uint64)
    st = u.create_dataset("spike_times", shape=(int(ends[-1]),), dtype=np.float64, chunks=(1 << 20,))
    a = 0
    for k in range(n_units):
        st[a:a + counts[k]] = np.sort(rng.uniform(0, T, counts[k]))
        a += counts[k]
    u.create_dataset("spike_times_index", data=ends)
    tr = f["intervals"].create_group("trials")
    tr.attrs["neurodata_type"] = "TimeIntervals"
    tr.attrs.create("colnames", np.array(["start_time", "stop_time", "condition"], dtype=object), dtype=STR)
    start = np.arange(600) * 10.0 + 5
    tr.create_dataset("id", data=np.arange(600, dtype=np.int64))
    tr.create_dataset("start_time", data=start)
    tr.create_dataset("stop_time", data=start + 6)
    tr.create_dataset("condition", data=np.array(["standard"] * 600, dtype=object), dtype=STR)
    tr.create_dataset("reward_time", data=start + 4)
    lp = f["intervals"].create_group("laser_pulses")
    lp.attrs["neurodata_type"] = "TimeIntervals"
    lp.attrs.create("colnames", np.array(["start_time", "stop_time"], dtype=object), dtype=STR)
    on = np.sort(rng.uniform(6100, T - 10, 10000))
    lp.create_dataset("id", data=np.arange(10000, dtype=np.int64))
    lp.create_dataset("start_time", data=on)
    lp.create_dataset("stop_time", data=on + 0.005)
    raw = f["acquisition"].create_group("raw")
    raw.attrs["neurodata_type"] = "ElectricalSeries"
    frames = int(raw_gb * 1e9 / (64 * 2))
    d = raw.create_dataset("data", shape=(frames, 64), dtype=np.int16, chunks=(16384, 64))
    block = rng.integers(-200, 200, size=(16384 * 16, 64), dtype=np.int16)
    for a in range(0, frames, block.shape[0]):
        b = min(frames, a + block.shape[0])
        d[a:b] = block[: b - a]
    s = raw.create_dataset("starting_time", data=0.0)
    s.attrs["rate"] = 30000.0
print(out, int(ends[-1]), "spikes")
