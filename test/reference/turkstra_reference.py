#!/usr/bin/env python3
"""Independent reference for the load-combination (Turkstra) series system of
test/reference/turkstra-column.yaml, written without any of stanchion's code.

Column: pinned-pinned, braced, first-yield strength. With c = 1 and Pcr = pi^2 E I / L^2 the
capacity is the smallest root of P/A + P e0 / (S (1 - P/Pcr)) = fy (stanchion contract section 3),
i.e. of the quadratic P^2/(A Pcr) - P (1/A + |e0|/S + fy/Pcr) + fy = 0.

Loads: the permanent load as given; each annual-maximum Gumbel load is taken to the T-year
maximum by moving its location by scale * ln(T) (same scale), Gumbel 1958, and used at its
annual maximum as a companion (Turkstra 1970). Combination j: load j leads. Every load keeps
one standard normal u in all combinations (x = F^-1(Phi(u))). The system fails when
min_j g_j <= 0, g_j = theta * capacity - (dead + leading_T + companions_1).

Direct Monte Carlo; prints JSON with the seed, the sample count, pf and its standard error.
Usage: python3 turkstra_reference.py [samples] [seed]
"""
import json
import math
import sys

import numpy as np
from scipy import stats

SAMPLES = int(sys.argv[1]) if len(sys.argv) > 1 else 4_000_000
SEED = int(sys.argv[2]) if len(sys.argv) > 2 else 20261202
BATCH = 500_000

# The scenario, in SI (N, m, Pa), typed in again from the YAML file.
L = 4.0
A = 5000e-6
I = 20e6 * 1e-12
S = 250e3 * 1e-9
T = 50.0  # reference period, years


def lognormal(mean, cov):
    s = math.sqrt(math.log1p(cov * cov))
    return stats.lognorm(s=s, scale=mean / math.sqrt(1 + cov * cov))


def gumbel(mean, cov):
    scale = mean * cov * math.sqrt(6) / math.pi
    return stats.gumbel_r(loc=mean - np.euler_gamma * scale, scale=scale), scale


E = lognormal(200e9, 0.03)
FY = lognormal(300e6, 0.07)
BOW = stats.norm(loc=4e-3, scale=2e-3)
DEAD = stats.norm(loc=380e3, scale=38e3)
THETA = lognormal(1.0, 0.05)
IMPOSED_1, IMPOSED_SCALE = gumbel(150e3, 0.35)
SNOW_1, SNOW_SCALE = gumbel(110e3, 0.40)


def at_period(annual, scale, years):
    loc = annual.kwds['loc'] + scale * math.log(years)
    return stats.gumbel_r(loc=loc, scale=scale)


IMPOSED_T = at_period(IMPOSED_1, IMPOSED_SCALE, T)
SNOW_T = at_period(SNOW_1, SNOW_SCALE, T)


def from_u(dist, u):
    # upper tail through the survival function keeps accuracy for large u
    return np.where(u <= 0, dist.ppf(stats.norm.cdf(u)), dist.isf(stats.norm.sf(u)))


def capacity(e, fy, e0):
    pcr = math.pi ** 2 * e * I / L ** 2
    a = 1.0 / (A * pcr)
    b = 1.0 / A + np.abs(e0) / S + fy / pcr
    # smallest root of a P^2 - b P + fy = 0, written without cancellation
    return 2.0 * fy / (b + np.sqrt(b * b - 4.0 * a * fy))


def main():
    rng = np.random.default_rng(SEED)
    failures = 0
    done = 0
    while done < SAMPLES:
        n = min(BATCH, SAMPLES - done)
        u = rng.standard_normal((7, n))
        e, fy, e0 = from_u(E, u[0]), from_u(FY, u[1]), from_u(BOW, u[2])
        dead, theta = from_u(DEAD, u[3]), from_u(THETA, u[6])
        r = theta * capacity(e, fy, e0)
        g_imposed = r - (dead + from_u(IMPOSED_T, u[4]) + from_u(SNOW_1, u[5]))
        g_snow = r - (dead + from_u(IMPOSED_1, u[4]) + from_u(SNOW_T, u[5]))
        failures += int(np.count_nonzero(np.minimum(g_imposed, g_snow) <= 0))
        done += n
    pf = failures / SAMPLES
    print(json.dumps({
        'scenario': 'test/reference/turkstra-column.yaml',
        'method': 'direct Monte Carlo on min over combinations (numpy/scipy)',
        'seed': SEED,
        'samples': SAMPLES,
        'failures': failures,
        'pf': pf,
        'standard_error': math.sqrt(pf * (1 - pf) / SAMPLES),
    }, indent=2))


if __name__ == '__main__':
    main()
