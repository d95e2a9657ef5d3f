#!/usr/bin/env python3
"""
Greybody factors of Schwarzschild holes in the tortoise coordinate, with scipy:
a PEER TO BEAT, NOT A REFERENCE.

This is the careful calculation a physicist would write for a non-rotating
hole: the Regge-Wheeler form of the wave equation in r*, with high-order
series at both ends, so that the numerical leg is as short as the series
allow. bench/tortoise-peer.bench.mjs times it beside penumbra.

Method (units M = 1; Regge 1957 / Wheeler and Zerilli's odd form for spin 1
and 2, Chandrasekhar, "The Mathematical Theory of Black Holes" (1983), ch. 4):
  * psi'' + (omega^2 - V) psi = 0 in r*, with
        V = f [l(l+1)/r^2 + (1 - s^2) 2/r^3],  f = 1 - 2/r,
    for field spin s = 0, 1, 2 (the massless spin-1/2 potential carries
    sqrt(f) and has no polynomial series; it is not covered);
  * the state (r, Re psi, Im psi, Re psi', Im psi') is integrated in r* with
    dr/dr* = f by solve_ivp (DOP853), so no r(r*) inversion is needed;
  * start: psi = e^{-i omega r*} sum a_n (r-2)^n (Frobenius series of the
    regular ingoing solution, summed until a term is below 1e-17 of the sum)
    at r = 2 + x0;
  * end: psi = A_in e^{-i omega r*} sum d_n r^-n + A_out e^{+i omega r*} sum c_n r^-n,
    the asymptotic series of each summed to its smallest term; the matching
    radius is pushed out until that term is below 1e-3 of the requested
    accuracy;
  * Gamma = 1 / |A_in|^2 (unit transmitted flux at the horizon).

Input: a JSON list of modes {spin, l, omega} on stdin or in a file named on
the command line. Options: --tol T (requested relative accuracy, default
1e-8; the DOP853 rtol is T times --rtol-factor, default 1), --repeat N (time
each mode N times, report the median). Output (stdout): JSON
{"peer": ..., "results": [...]} with, per mode, gamma, wall and CPU seconds
and the RHS evaluation count. Exit status 3 with one line if scipy is missing.
"""
import cmath
import json
import math
import sys
import time

try:
    import numpy as np
    import scipy
    from scipy.integrate import solve_ivp
except ImportError as missing:  # the node bench reads exit status 3
    sys.stderr.write("tortoise_peer: scipy not available (%s); install numpy and scipy to run the peer\n" % missing)
    sys.exit(3)


def tortoise(r):
    return r + 2.0 * math.log(r / 2.0 - 1.0)


def horizon_start(s, l, omega, x0):
    """psi and dpsi/dr* of the ingoing solution at r = 2 + x0 (Frobenius series)."""
    L = l * (l + 1)
    c = 2.0 * (1 - s * s)
    # psi = e^{-i w r*} u(x): r^2 (r-2) u'' + (2r - 2 i w r^3) u' - (L r + c) u = 0, x = r - 2
    # P2 = x (x+2)^2, P1 = 2(x+2) - 2i w (x+2)^3, P0 = -(L (x+2) + c)
    P2 = [0.0, 4.0, 4.0, 1.0]
    P1 = [4.0 - 16j * omega, 2.0 - 24j * omega, -12j * omega, -2j * omega]
    P0 = [-(2.0 * L + c), -float(L)]
    a = [1.0 + 0j]
    u, du = 1.0 + 0j, 0j
    xn = 1.0
    for N in range(0, 400):
        # coefficient of x^N: sum_j P2[j](N-j+2)(N-j+1)a[N-j+2] + P1[j](N-j+1)a[N-j+1] + P0[j]a[N-j] = 0
        rest = 0j
        for j in range(2, 4):
            k = N - j + 2
            if 0 <= k < len(a):
                rest += P2[j] * k * (k - 1) * a[k]
        for j in range(1, 4):
            k = N - j + 1
            if 0 <= k < len(a):
                rest += P1[j] * k * a[k]
        for j in range(0, 2):
            k = N - j
            if 0 <= k < len(a):
                rest += P0[j] * a[k]
        nxt = -rest / ((N + 1) * (N * P2[1] + P1[0]))
        a.append(nxt)
        du += (N + 1) * nxt * xn
        xn *= x0
        term = nxt * xn
        u += term
        if abs(term) < 1e-17 * abs(u) and N > 4:
            break
    f = x0 / (2.0 + x0)
    phase = cmath.exp(-1j * omega * tortoise(2.0 + x0))
    return phase * u, phase * (f * du - 1j * omega * u)


def far_series(s, l, omega, r, sign):
    """e^{sign i w r*} sum c_n r^-n and its r*-derivative, summed to the smallest term; returns (psi, dpsi, smallest term)."""
    L = l * (l + 1)
    c = 2.0 * (1 - s * s)
    w = sign * omega
    cs = [1.0 + 0j]
    prev = 0j
    v, dv = 1.0 + 0j, 0j
    smallest = 1.0
    last = 1.0
    for N in range(0, 200):
        nxt = ((N * (N + 1) - L) * cs[N] - (2.0 * (N - 1) * (N + 1) + c) * prev) / (2j * w * (N + 1))
        term = abs(nxt) * r ** -(N + 1)
        if term > last and N > 2 * l + 4:
            break  # past the smallest term: the series is asymptotic
        prev = cs[N]
        cs.append(nxt)
        v += nxt * r ** -(N + 1)
        dv += -(N + 1) * nxt * r ** -(N + 2)
        if term > 0:  # a coefficient can vanish exactly (e.g. c_1 for l = 0); it says nothing about convergence
            last = term
            smallest = min(smallest, term)
        if 0 < term < 1e-18:
            break
    f = 1.0 - 2.0 / r
    phase = cmath.exp(1j * w * tortoise(r))
    return phase * v, phase * (f * dv + 1j * w * v), smallest


def greybody(mode, tol, rtol):
    s, l, omega = int(mode["spin"]), int(mode["l"]), float(mode["omega"])
    L = l * (l + 1)
    c = 2.0 * (1 - s * s)
    x0 = 0.5
    psi0, dpsi0 = horizon_start(s, l, omega, x0)
    r_match = max(30.0, 4.0 * (l + 1) / omega)
    while True:
        _, _, small_in = far_series(s, l, omega, r_match, -1)
        _, _, small_out = far_series(s, l, omega, r_match, +1)
        if max(small_in, small_out) < 1e-3 * tol or r_match > 1e7:
            break
        r_match *= 1.5

    def rhs(t, y):
        r = y[0]
        f = 1.0 - 2.0 / r
        q = f * (L / (r * r) + c / (r * r * r)) - omega * omega
        return [f, y[3], y[4], q * y[1], q * y[2]]

    def reached(t, y):
        return y[0] - r_match

    reached.terminal = True
    t0 = tortoise(2.0 + x0)
    t1 = tortoise(r_match) + 1.0
    y0 = [2.0 + x0, psi0.real, psi0.imag, dpsi0.real, dpsi0.imag]
    sol = solve_ivp(rhs, (t0, t1), y0, method="DOP853", rtol=rtol, atol=1e-300, events=reached)
    if sol.status < 0:
        raise RuntimeError(sol.message)
    y = sol.y_events[0][0] if len(sol.t_events[0]) else sol.y[:, -1]
    r = y[0]
    psi = y[1] + 1j * y[2]
    dpsi = y[3] + 1j * y[4]
    pin, dpin, _ = far_series(s, l, omega, r, -1)
    pout, dpout, _ = far_series(s, l, omega, r, +1)
    det = pin * dpout - pout * dpin
    a_in = (psi * dpout - pout * dpsi) / det
    return {"gamma": 1.0 / abs(a_in) ** 2, "rhsEvaluations": int(sol.nfev), "steps": int(len(sol.t) - 1), "matchRadius": r}


def main(argv):
    tol = 1e-8
    rtol_factor = 1.0
    repeat = 1
    source = None
    args = list(argv)
    while args:
        arg = args.pop(0)
        if arg == "--tol":
            tol = float(args.pop(0))
        elif arg == "--rtol-factor":
            rtol_factor = float(args.pop(0))
        elif arg == "--repeat":
            repeat = max(1, int(args.pop(0)))
        else:
            source = arg
    modes = json.load(open(source) if source else sys.stdin)
    rtol = tol * rtol_factor
    if modes:
        greybody(modes[0], tol, rtol)  # warm-up
    results = []
    for mode in modes:
        times, cpu_times = [], []
        for _ in range(repeat):
            t0 = time.perf_counter()
            c0 = time.process_time()
            try:
                out = greybody(mode, tol, rtol)
            except Exception as err:  # keep going; the bench reports failed modes
                out = {"error": str(err)}
            cpu_times.append(time.process_time() - c0)
            times.append(time.perf_counter() - t0)
        out["seconds"] = sorted(times)[len(times) // 2]
        out["cpuSeconds"] = sorted(cpu_times)[len(cpu_times) // 2]
        results.append({**mode, **out})
    json.dump({
        "peer": "scipy solve_ivp DOP853 in r*, Regge-Wheeler potential, Frobenius start, asymptotic series at both ends",
        "python": sys.version.split()[0],
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "tol": tol,
        "rtol": rtol,
        "repeat": repeat,
        "results": results,
    }, sys.stdout)
    sys.stdout.write("\n")


if __name__ == "__main__":
    main(sys.argv[1:])
