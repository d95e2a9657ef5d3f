#!/usr/bin/env python3
"""
Greybody factors of Kerr holes with scipy: a PEER TO BEAT, NOT A REFERENCE.

This is the straightforward calculation a physicist would write for the job
penumbra does, so that the benchmark (bench/greybody.bench.mjs) compares like
with like. It is not an accuracy reference: its answers are checked against
penumbra's own high-accuracy results, never the other way round.

Method (formulas as in the project's physics notes, Teukolsky 1973 and
Teukolsky & Press 1974):
  * the +s radial Teukolsky equation
        Delta R'' + (s+1) Delta' R' + V R = 0,
        V = (K^2 - 2is(r-M)K)/Delta + 4is omega r - lambda,
    integrated as a complex first-order system with solve_ivp (DOP853);
  * start near the horizon from the ingoing Frobenius series
        R = (r-r+)^rho sum a_n (r-r+)^n,  rho = -s - 2i k M r+/(r+ - r-),
    normalised so that |R| -> |Delta^-s e^{-ikr*}|;
  * at a large radius r_max, fit R and R' to the two asymptotic series
        e^{-i omega r*} r^-1 sum c_n r^-n  and  e^{+i omega r*} r^(-2s-1) sum d_n r^-n
    (coefficients by recurrence; r_max is pushed out until the smallest
    term is below the requested accuracy);
  * Gamma from |Z_in|^2 with the flux formulas of the physics notes.
The spheroidal eigenvalue A_{+s l m}(a omega) is an input, so both sides of
the benchmark use the same A.

Input: a JSON list of modes {spin, l, m, a, omega, A, mass?} on stdin or in a
file named on the command line. Options: --tol T (requested relative
accuracy, default 1e-8; the DOP853 rtol is T times --rtol-factor, default 1),
--repeat N (time each mode N times and report the median, default 1).
Output (stdout): JSON {"peer": ..., "results": [...]} with, per mode, gamma,
the wall and CPU time of that mode in seconds and the RHS evaluation count.
Exit status 3 with a one-line message if numpy or scipy is missing.
"""
import json
import math
import sys
import time

try:
    import numpy as np
    import scipy
    from scipy.integrate import solve_ivp
except ImportError as missing:  # reported, not a traceback: the node bench reads exit status 3
    sys.stderr.write(
        "greybody_peer: scipy not available (%s); install numpy and scipy to run the peer\n" % missing
    )
    sys.exit(3)


def horizon_series(s, m, a, M, omega, lam, x0, tol, max_terms=80):
    """Ingoing Frobenius series about r+; returns (R, dR/dr) at r+ + x0 and the term count."""
    rp = M + math.sqrt(M * M - a * a)
    rm = M - math.sqrt(M * M - a * a)
    d = rp - rm
    k = omega - m * a / (2 * M * rp)
    rho = -s - 2j * k * M * rp / d
    # Delta^2 R'' + (s+1) Delta Delta' R' + P(x) R = 0 in x = r - r+, P a quartic
    # (the equation multiplied by Delta).
    X = np.polynomial.Polynomial([0, 1])
    r = X + rp
    Delta = X * (X + d)
    K = omega * (r * r + a * a) - a * m
    P = K * K - 2j * s * (r - M) * K + (4j * s * omega * r - lam) * Delta
    p = np.zeros(5, dtype=complex)
    p[: len(P.coef)] = P.coef

    def f(j, nu):
        if j == 0:
            return d * d * nu * (nu - 1) + (s + 1) * d * d * nu + p[0]
        if j == 1:
            return 2 * d * nu * (nu - 1) + 3 * d * (s + 1) * nu + p[1]
        if j == 2:
            return nu * (nu - 1) + 2 * (s + 1) * nu + p[2]
        return p[j]

    coeffs = [d ** (-s) + 0j]
    R = coeffs[0]
    dR = rho * coeffs[0] / x0
    for n in range(1, max_terms):
        acc = 0j
        for j in range(1, 5):
            if n - j >= 0:
                acc += f(j, n - j + rho) * coeffs[n - j]
        a_n = -acc / f(0, n + rho)
        coeffs.append(a_n)
        term = a_n * x0 ** n
        R += term
        dR += (n + rho) * term / x0
        if abs(term) < 1e-3 * tol * abs(R) and n >= 3:
            break
    else:
        return None
    scale = x0 ** rho
    return R * scale, dR * scale, len(coeffs)


def far_series_coefficients(s, m, a, M, omega, lam, eps, n_terms):
    """c_n of R = e^{i eps omega r*} r^beta sum c_n r^-n (eps = -1 incoming, +1 outgoing)."""
    r = np.polynomial.Polynomial([0, 1])
    Delta = r * r - 2 * M * r + a * a
    dDelta = 2 * r - 2 * M
    S = r * r + a * a
    K = omega * S - a * m
    iw = 1j * eps * omega
    # Delta^2 f'' + B f' + C f = 0 for f = R e^{-i eps omega r*}
    A = Delta * Delta
    B = 2 * iw * S * Delta + (s + 1) * Delta * dDelta
    C = (iw * (2 * r * Delta - S * dDelta) + (s + 1) * iw * dDelta * S - omega * omega * S * S
         + K * K - 2j * s * (r - M) * K + (4j * s * omega * r - lam) * Delta)

    def padded(poly, n):
        out = np.zeros(n, dtype=complex)
        c = np.asarray(poly.coef, dtype=complex)
        out[: min(n, len(c))] = c[:n]
        return out

    Ac, Bc, Cc = padded(A, 6), padded(B, 6), padded(C, 6)
    # the r^4 part of C cancels; keep the exact zero
    Cc[4:] = 0
    beta = -Cc[3] / Bc[4]
    c = [1.0 + 0j]
    for N in range(1, n_terms):
        acc = 0j
        for n in range(max(0, N - 5), N):
            ja, jb, jc = 5 - N + n, 4 - N + n, 3 - N + n
            term = 0j
            if 0 <= ja <= 4:
                term += Ac[ja] * (beta - n) * (beta - n - 1)
            if 0 <= jb <= 4:
                term += Bc[jb] * (beta - n)
            if 0 <= jc <= 3:
                term += Cc[jc]
            acc += c[n] * term
        c.append(acc / (Bc[4] * N))
    return beta, c


def far_series_value(beta, c, r, phase, dphase, tol):
    """Optimally truncated sum; returns (value, derivative, smallest relative term)."""
    total = 0j
    dtotal = 0j
    smallest = math.inf
    prev = math.inf
    for n, cn in enumerate(c):
        t = cn * r ** (beta - n)
        if abs(t) > prev and n > 2:
            break  # asymptotic series: stop at the smallest term
        prev = abs(t)
        total += t
        dtotal += (beta - n) * t / r
        smallest = abs(t)
        if n > 2 and abs(t) < 1e-3 * tol * abs(total):
            break
    return phase * total, phase * (dtotal + dphase * total), smallest / abs(total)


def tortoise(r, a, M):
    rp = M + math.sqrt(M * M - a * a)
    rm = M - math.sqrt(M * M - a * a)
    if rm == 0.0:
        return r + 2 * M * math.log((r - rp) / (2 * M))
    return (r + 2 * M * rp / (rp - rm) * math.log((r - rp) / (2 * M))
            - 2 * M * rm / (rp - rm) * math.log((r - rm) / (2 * M)))


def greybody(mode, tol, rtol):
    s = float(mode["spin"])
    m = float(mode["m"])
    a = float(mode["a"])
    M = float(mode.get("mass", 1.0))
    omega = float(mode["omega"])
    A = float(mode["A"])
    lam = A + a * a * omega * omega - 2 * a * m * omega
    rp = M + math.sqrt(M * M - a * a)
    rm = M - math.sqrt(M * M - a * a)
    d = rp - rm
    k = omega - m * a / (2 * M * rp)
    kappa = d / (2 * (rp * rp + a * a))

    x0 = 0.25 * d
    start = None
    while start is None:
        start = horizon_series(s, m, a, M, omega, lam, x0, tol)
        if start is None:
            x0 *= 0.5
    R0, dR0, horizon_terms = start

    n_far = 40
    beta_in, c_in = far_series_coefficients(s, m, a, M, omega, lam, -1, n_far)
    beta_out, c_out = far_series_coefficients(s, m, a, M, omega, lam, +1, n_far)
    r_max = max(50.0 * M, 20.0 / omega)
    while True:
        rs = tortoise(r_max, a, M)
        dphase = omega * (r_max * r_max + a * a) / (r_max * r_max - 2 * M * r_max + a * a)
        u_in, du_in, e_in = far_series_value(beta_in, c_in, r_max, np.exp(-1j * omega * rs), -1j * dphase, tol)
        u_out, du_out, e_out = far_series_value(beta_out, c_out, r_max, np.exp(1j * omega * rs), 1j * dphase, tol)
        if max(e_in, e_out) < 1e-3 * tol:
            break
        r_max *= 1.5

    def rhs(r, y):
        R, dR = y[0], y[1]
        Delta = r * r - 2 * M * r + a * a
        K = (r * r + a * a) * omega - a * m
        V = (K * K - 2j * s * (r - M) * K) / Delta + 4j * s * omega * r - lam
        return np.array([dR, -((s + 1) * (2 * r - 2 * M) * dR + V * R) / Delta])

    sol = solve_ivp(rhs, (rp + x0, r_max), np.array([R0, dR0], dtype=complex),
                    method="DOP853", rtol=rtol, atol=1e-300)
    if sol.status != 0:
        raise RuntimeError("solve_ivp failed: " + sol.message)
    R, dR = sol.y[0, -1], sol.y[1, -1]
    W = u_in * du_out - du_in * u_out
    z_in = (R * du_out - dR * u_out) / W
    z_out = (u_in * dR - du_in * R) / W

    if s == 0:
        h = (k / omega) * 2 * M * rp
    elif s == 0.5:
        h = 1.0
    elif s == 1:
        h = (omega / k) / (2 * M * rp)
    elif s == 2:
        h = omega ** 3 / (k * (k * k + kappa * kappa) * (2 * M * rp) ** 3)
    else:
        raise ValueError("unsupported spin %r" % s)
    gamma = h / abs(z_in) ** 2
    return {
        "gamma": gamma,
        "absZIn": abs(z_in),
        "absZOut": abs(z_out),
        "rhsEvaluations": int(sol.nfev),
        "steps": int(len(sol.t) - 1),
        "startRadius": rp + x0,
        "matchRadius": r_max,
        "horizonTerms": horizon_terms,
    }


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
        greybody(modes[0], tol, rtol)  # warm-up: first-call imports and caches stay out of the timings
    results = []
    for mode in modes:
        times = []
        cpu_times = []
        for _ in range(repeat):
            t0 = time.perf_counter()
            c0 = time.process_time()
            try:
                out = greybody(mode, tol, rtol)
            except Exception as err:  # keep going; the bench reports failed modes
                out = {"error": str(err)}
            cpu_times.append(time.process_time() - c0)
            times.append(time.perf_counter() - t0)
        # medians of the repeats; CPU time is immune to preemption on a shared machine
        out["seconds"] = sorted(times)[len(times) // 2]
        out["cpuSeconds"] = sorted(cpu_times)[len(cpu_times) // 2]
        results.append({**mode, **out})
    json.dump({
        "peer": "scipy solve_ivp DOP853, +s Teukolsky equation, Frobenius start, asymptotic-series fit",
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
