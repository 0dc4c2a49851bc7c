# Writes h5py_observation.h5, an observation file made by the HDF5 C library (through h5py) rather than by
# PureHDF, used by ObservationFileFromOtherWritersTests. Made with h5py 3.7.0 / HDF5 1.10.8 (Debian 12):
#   /usr/bin/python3 make_h5py_observation.py
# It exercises what other writers do differently: a 512-byte user block (superblock at byte 512, version 0),
# int64 and float32 attributes, fixed-length byte-string and variable-length attributes, Michelson X/Y/Z
# channels with explicit time stamps, a gap table and a truth table.
import h5py
import numpy as np

with h5py.File("h5py_observation.h5", "w", userblock_size=512) as f:
    f.attrs["format_version"] = np.int64(2)
    f.attrs["created_utc"] = "2026-12-01T23:05:00+01:00"
    f.attrs["generator"] = np.bytes_("h5py reference writer")
    f.create_group("provenance").attrs["seed"] = "7"
    tdi = f.create_group("tdi")
    tdi.attrs["channels"] = "XYZ"
    tdi.attrs["units"] = np.bytes_("fractional frequency")
    tdi.attrs["dt_s"] = np.float32(0.5)
    tdi.create_dataset("time_s", data=1.9e9 + 0.5 * np.arange(4))
    tdi.create_dataset("X", data=np.array([1.0, 0.0, 3.0, -1.0]))
    tdi.create_dataset("Y", data=np.array([2.0, 1.0, 3.0, 0.0]))
    tdi.create_dataset("Z", data=np.array([4.0, 0.0, 3.0, 1.0]))
    f.create_dataset("gaps", data=np.array([[1.9e9 + 0.5, 1.9e9 + 1.5]]))
    table = f.create_group("truth/galactic_binaries")
    values = table.create_dataset("values", data=np.array([[3.0e-3, 1.5e-22], [4.5e-3, np.nan]]))
    values.attrs["columns"] = ["f0_hz", "amplitude"]
    table.create_dataset("ids", data=["gb-a", "gb-b"])
