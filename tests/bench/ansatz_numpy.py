"""NumPy reference timing of the benchmark's layered ansatz (see tests/bench/ansatz.ts).

Same circuit, same angles: per layer ry(θ(l,q)) on every qubit, rz(φ(l,q)) on every qubit,
then cx(q, q+1) for q = 0..n-2, with θ(l,q) = 0.1 + 0.37 l + 0.61 q and
φ(l,q) = 0.2 + 0.53 l + 0.29 q. Amplitude index bit k = qubit k (as in the engine), so in
the (2,)*n tensor view axis j is qubit n-1-j.

Two kernels, one gate at a time (no fusion): an einsum kernel (a new array per gate; plain einsum
measured faster here than optimize=True or tensordot for one small gate tensor) and an
in-place sliced kernel on strided views. Prints one JSON line with both timings and a few
amplitudes so the caller can check that both programs computed the same state.

Usage: python3 ansatz_numpy.py N LAYERS
"""
import json
import math
import string
import sys
import time

import numpy as np


def ry(t):
    c, s = math.cos(t / 2), math.sin(t / 2)
    return np.array([[c, -s], [s, c]], dtype=np.complex128)


def rz(t):
    return np.array([[np.exp(-0.5j * t), 0], [0, np.exp(0.5j * t)]], dtype=np.complex128)


CX = np.array([[1, 0, 0, 0], [0, 1, 0, 0], [0, 0, 0, 1], [0, 0, 1, 0]], dtype=np.complex128)


def gates(n, layers):
    for l in range(layers):
        for q in range(n):
            yield ("ry", (q,), ry(0.1 + 0.37 * l + 0.61 * q))
        for q in range(n):
            yield ("rz", (q,), rz(0.2 + 0.53 * l + 0.29 * q))
        for q in range(n - 1):
            yield ("cx", (q, q + 1), CX)


def run_einsum(n, gate_list):
    letters = string.ascii_lowercase + string.ascii_uppercase
    psi = np.zeros((2,) * n, dtype=np.complex128)
    psi[(0,) * n] = 1
    state_sub = letters[:n]
    for _, qubits, u in gate_list:
        k = len(qubits)
        axes = [n - 1 - q for q in qubits]
        outs = letters[n : n + k]
        ins = "".join(state_sub[a] for a in axes)
        result = list(state_sub)
        for j, a in enumerate(axes):
            result[a] = outs[j]
        subs = f"{outs}{ins},{state_sub}->{''.join(result)}"
        psi = np.einsum(subs, u.reshape((2,) * (2 * k)), psi)
    return psi.reshape(-1)


def run_sliced(n, gate_list):
    psi = np.zeros(2**n, dtype=np.complex128)
    psi[0] = 1
    t = psi.reshape((2,) * n)

    def view(assign):
        idx = [slice(None)] * n
        for q, v in assign.items():
            idx[n - 1 - q] = v
        return t[tuple(idx)]

    for name, qubits, u in gate_list:
        if name == "cx":
            c, tq = qubits
            s0, s1 = view({c: 1, tq: 0}), view({c: 1, tq: 1})
            tmp = s0.copy()
            s0[...] = s1
            s1[...] = tmp
        elif name == "rz":
            (q,) = qubits
            view({q: 0})[...] *= u[0, 0]
            view({q: 1})[...] *= u[1, 1]
        else:
            (q,) = qubits
            a, b = view({q: 0}), view({q: 1})
            a0 = a.copy()
            a *= u[0, 0]
            a += u[0, 1] * b
            b *= u[1, 1]
            b += u[1, 0] * a0
    return psi


def timed(fn, *args):
    # process CPU time, like the engine's side of the comparison (tests/bench/bench-kit.ts)
    t0 = time.process_time()
    out = fn(*args)
    return (time.process_time() - t0) * 1000, out


def main():
    n, layers = int(sys.argv[1]), int(sys.argv[2])
    gate_list = list(gates(n, layers))
    ms_einsum, psi_e = timed(run_einsum, n, gate_list)
    ms_sliced, psi_s = timed(run_sliced, n, gate_list)
    probe = [0, 1, 12345 % 2**n, 2**n - 1]
    print(
        json.dumps(
            {
                "numpy": np.__version__,
                "gates": len(gate_list),
                "einsumMs": ms_einsum,
                "slicedMs": ms_sliced,
                "agree": float(np.max(np.abs(psi_e - psi_s))),
                "probe": probe,
                "amplitudes": [[float(psi_s[i].real), float(psi_s[i].imag)] for i in probe],
            }
        )
    )


if __name__ == "__main__":
    main()
