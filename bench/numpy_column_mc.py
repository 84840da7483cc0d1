#!/usr/bin/env python3
"""Independent vectorised numpy Monte Carlo of the demo column (scenarios/braced-base-plate.yaml).

A yardstick for `npm run bench`, written without the tool's code: the bench compares the tool's
sampling rate with this script's in the same run. Two modes:

  solve      solves the buckling equation for every sample (bracketing, then Newton), then the
             mode shape, curvature factor and first-yield capacity;
  tabulated  the same limit state with phi and c read from 129 x 129 tables over the fixity
             factors f = R/(R+3) by local bicubic Lagrange interpolation (tables built with the
             per-sample solver), processed in cache-sized blocks.

Mechanics (braced column, rotational end springs k_A, k_B, R = kL/EI, phi = L sqrt(P/EI)):
  slope-deflection with stability functions (common practice, e.g. Chen & Lui, Structural
  Stability, 1987, ch. 4): (s + R_A)(s + R_B) = (sc)^2, with
  s = phi (sin phi - phi cos phi)/D, sc = phi (phi - sin phi)/D, D = 2 - 2 cos phi - phi sin phi;
  first root in (pi, 2 pi). Mode w = A sin(phi xi) + B (cos(phi xi) - 1) + C xi with
  w''(0) = R_A w'(0), w''(1) = -R_B w'(1), w(1) = 0; curvature factor c = max|w''|/(phi^2 max|w|).
  First yield (Ayrton-Perry): P/A + P e0 c/(S (1 - P/Pcr)) = fy, smaller root.
  g = theta * P_first_yield - (dead + imposed).

Prints one JSON line: mode, samples, seconds and CPU seconds (sampling and limit state only),
rate per wall and per CPU second, pf.
Usage: numpy_column_mc.py [solve|tabulated] [SAMPLES] [SEED]
"""
import json
import math
import sys
import time

import numpy as np

# The demo scenario's numbers (SI).
L = 5.6
AREA = 6640e-6
INERTIA = 15.4e6 * 1e-12
MODULUS = 152e3 * 1e-9
RHO_E_FY = 0.2


def lognormal_params(mean, cov):
    zeta2 = math.log1p(cov * cov)
    return math.log(mean) - 0.5 * zeta2, math.sqrt(zeta2)


LN_E = lognormal_params(200e9, 0.03)
LN_FY = lognormal_params(300e6, 0.07)
LN_KA = lognormal_params(1.2e6, 0.5)
LN_KB = lognormal_params(0.25e6, 0.5)
LN_THETA = lognormal_params(1.0, 0.05)
BOW = (L / 1500, L / 3000)
DEAD = (430e3, 43e3)
# Gumbel (maxima) from mean and sd: scale = sd sqrt(6)/pi, loc = mean - 0.5772 scale.
GUMBEL_SCALE = 190e3 * 0.25 * math.sqrt(6) / math.pi
GUMBEL_LOC = 190e3 - 0.5772156649015329 * GUMBEL_SCALE
# Nataf for two lognormals, exact: rho0 = ln(1 + rho V1 V2) / (zeta1 zeta2) (Der Kiureghian & Liu 1986).
RHO0 = math.log1p(RHO_E_FY * 0.03 * 0.07) / (LN_E[1] * LN_FY[1])


def char_fn(phi, ra, rb):
    s, c = np.sin(phi), np.cos(phi)
    d = 2 - 2 * c - phi * s
    a = phi * (s - phi * c)
    b = phi * (phi - s)
    return (a + ra * d) * (a + rb * d) - b * b


def solve_phi(ra, rb):
    lo = np.full(ra.shape, math.pi)
    hi = np.full(ra.shape, 2 * math.pi - 1e-9)
    for _ in range(8):
        mid = 0.5 * (lo + hi)
        pos = char_fn(mid, ra, rb) > 0
        lo = np.where(pos, mid, lo)
        hi = np.where(pos, hi, mid)
    phi = 0.5 * (lo + hi)
    for _ in range(4):
        h = 1e-7 * phi
        f = char_fn(phi, ra, rb)
        df = (char_fn(phi + h, ra, rb) - f) / h
        phi = np.clip(phi - f / df, lo, hi)
    return phi


def curvature_factor(phi, ra, rb):
    s, c = np.sin(phi), np.cos(phi)
    r1 = np.stack([ra * phi, phi * phi, ra])
    r2 = np.stack([s, c - 1, np.ones_like(phi)])
    coef = np.cross(r1, r2, axis=0)
    a, b, cc = coef[0], coef[1], coef[2]
    rho = np.sqrt(a * a + b * b)
    # interior extremes of w: w' = phi rho cos(t + delta) + C = 0, t = phi xi in [0, phi]
    delta = np.arctan2(b, a)
    q = np.clip(-cc / (phi * rho), -1.0, 1.0)
    base = np.arccos(q)
    wmax = np.zeros_like(phi)  # w(0) = w(1) = 0
    for sign in (-1.0, 1.0):
        for k in (-1.0, 0.0, 1.0, 2.0):
            t = sign * base - delta + 2 * math.pi * k
            inside = (t >= 0) & (t <= phi)
            x = np.where(inside, t / phi, 0.0)
            w = a * np.sin(phi * x) + b * (np.cos(phi * x) - 1) + cc * x
            wmax = np.maximum(wmax, np.where(inside, np.abs(w), 0.0))
    # braced: phi >= pi, so a crest of |w''| = phi^2 rho lies inside the column
    return rho / wmax


def capacity(e, fy, bow, phi, c):
    pcr = phi * phi * e * INERTIA / (L * L)
    sigma_e = pcr / AREA
    eta = c * np.abs(bow) * AREA / MODULUS
    b = fy + (1 + eta) * sigma_e
    disc = np.maximum(b * b - 4 * fy * sigma_e, 0)
    return 2 * fy * sigma_e / (b + np.sqrt(disc)) * AREA


def draw(rng, n):
    z = rng.standard_normal((5, n))
    e = np.exp(LN_E[0] + LN_E[1] * z[0])
    fy = np.exp(LN_FY[0] + LN_FY[1] * (RHO0 * z[0] + math.sqrt(1 - RHO0 * RHO0) * z[1]))
    ka = rng.lognormal(LN_KA[0], LN_KA[1], n)
    kb = rng.lognormal(LN_KB[0], LN_KB[1], n)
    theta = np.exp(LN_THETA[0] + LN_THETA[1] * z[2])
    bow = BOW[0] + BOW[1] * z[3]
    dead = DEAD[0] + DEAD[1] * z[4]
    imposed = rng.gumbel(GUMBEL_LOC, GUMBEL_SCALE, n)
    ei = e * INERTIA
    return e, fy, ka * L / ei, kb * L / ei, theta, bow, dead + imposed


class Tables:
    CELLS = 128

    def __init__(self):
        f = np.arange(self.CELLS + 1) / self.CELLS
        fa, fb = np.meshgrid(f, f, indexing="ij")
        ra = 3 * fa / np.maximum(1 - fa, 1e-12)
        rb = 3 * fb / np.maximum(1 - fb, 1e-12)
        phi = solve_phi(ra.ravel(), rb.ravel())
        self.phi = phi.reshape(fa.shape)
        self.c = curvature_factor(phi, ra.ravel(), rb.ravel()).reshape(fa.shape)
        self.phi_flat = self.phi.ravel()
        self.c_flat = self.c.ravel()

    @staticmethod
    def weights(s):
        return (-s * (s - 1) * (s - 2) / 6, (s + 1) * (s - 1) * (s - 2) / 2,
                -(s + 1) * s * (s - 2) / 2, (s + 1) * s * (s - 1) / 6)

    def lookup(self, ra, rb):
        n = self.CELLS
        x = ra / (ra + 3) * n
        y = rb / (rb + 3) * n
        i = np.clip(np.floor(x), 1, n - 2).astype(np.intp)
        j = np.clip(np.floor(y), 1, n - 2).astype(np.intp)
        ws = self.weights(x - i)
        wu = self.weights(y - j)
        base = (i - 1) * (n + 1) + (j - 1)
        phi = np.zeros_like(ra)
        c = np.zeros_like(ra)
        for p in range(4):
            row_phi = np.zeros_like(ra)
            row_c = np.zeros_like(ra)
            for q in range(4):
                k = base + (p * (n + 1) + q)
                row_phi += wu[q] * np.take(self.phi_flat, k)
                row_c += wu[q] * np.take(self.c_flat, k)
            phi += ws[p] * row_phi
            c += ws[p] * row_c
        return phi, c


def main():
    mode = sys.argv[1] if len(sys.argv) > 1 else "tabulated"
    samples = int(float(sys.argv[2])) if len(sys.argv) > 2 else 4_000_000
    seed = int(sys.argv[3]) if len(sys.argv) > 3 else 20261201
    rng = np.random.default_rng(seed)
    tables = Tables() if mode == "tabulated" else None
    block = 16384 if mode == "tabulated" else 32768
    failures = 0
    t0 = time.perf_counter()
    cpu0 = time.process_time()
    done = 0
    while done < samples:
        n = min(block, samples - done)
        e, fy, ra, rb, theta, bow, demand = draw(rng, n)
        if tables is not None:
            phi, c = tables.lookup(ra, rb)
        else:
            phi = solve_phi(ra, rb)
            c = curvature_factor(phi, ra, rb)
        g = theta * capacity(e, fy, bow, phi, c) - demand
        failures += int(np.count_nonzero(g <= 0))
        done += n
    seconds = time.perf_counter() - t0
    cpu = time.process_time() - cpu0
    print(json.dumps({"mode": mode, "samples": samples, "seconds": seconds, "cpu_seconds": cpu,
                      "rate": samples / seconds, "rate_per_cpu_second": samples / cpu, "pf": failures / samples}))


if __name__ == "__main__":
    main()
