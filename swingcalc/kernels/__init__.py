"""Numerical kernels: SI floats and numpy arrays, radians, no classes, no I/O, no validation."""
