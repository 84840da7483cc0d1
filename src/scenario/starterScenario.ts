/**
 * A commented starter scenario to copy and edit. The numbers are invented for the demo: they
 * describe no real structure. loadScenario accepts the text unchanged (tested).
 */
import type { Frame } from './types.js';

export function starterScenario(frame: Frame): string {
  const sway = frame === 'sway';
  const ends = sway
    ? `  ends:
    # bottom and top: pinned | fixed | {rotation: Q} | {fixity: X} | {alignment_g: G}
    #   rotation: rotational spring, moment per radian (e.g. 4 MN m/rad), fixed or random
    #   fixity:   X = R/(R+3) in [0, 1), where R = k L / (E I) (Monforton and Wu, 1963)
    #   alignment_g: alignment-chart G >= 0 (R = 2/G braced, 6/G sway)
    bottom: {rotation: {dist: lognormal, mean: 6 MN m/rad, cov: 0.4}}
    top: {fixity: {dist: uniform, min: 0.2, max: 0.6}}
    # lateral: translational spring at the top (sway frames only; default 0).
    # A sway column needs some restraint against sway: here the spring and the bottom spring.
    lateral: {dist: lognormal, mean: 300 kN/m, cov: 0.3}`
    : `  ends:
    # bottom and top: pinned | fixed | {rotation: Q} | {fixity: X} | {alignment_g: G}
    #   rotation: rotational spring, moment per radian (e.g. 4 MN m/rad), fixed or random
    #   fixity:   X = R/(R+3) in [0, 1), where R = k L / (E I) (Monforton and Wu, 1963)
    #   alignment_g: alignment-chart G >= 0 (R = 2/G braced, 6/G sway)
    bottom: {rotation: {dist: lognormal, mean: 1.8 MN m/rad, cov: 0.5}}
    top: pinned
    # lateral: only for sway frames (a braced column does not move sideways)`;
  return `# stanchion scenario: the reliability of one existing column with uncertain end restraint.
# Quantities are a number and a unit ("3.6 m", "210 GPa", "1.8 MN m/rad"); any unit of the
# right dimension is converted to SI. Any quantity may instead be a random variable:
#   {dist: normal | lognormal | gumbel | weibull, mean: Q, sd: Q or cov: number}
#   {dist: uniform, min: Q, max: Q}
#   {dist: truncnormal, mean: Q, sd: Q (of the parent normal), min: Q, max: Q}
#   {dist: beta, min: Q, max: Q, mean: Q, sd: Q}
# A value that cannot be negative (stiffness, E, fy, section, model_factor) takes lognormal,
# weibull, or a truncnormal/uniform/beta with min >= 0; a fixity factor stays in [0, 1].
# The numbers below are invented for the demo: replace every one with your own.

stanchion: 1                         # format version (required)
title: Demo column (${frame})          # shown in the reports

column:
  length: 3.6 m                      # fixed: it sets the geometry and the symbol L below
  frame: ${frame}                      # braced: ends do not sway; sway: the top may move sideways
  section:                           # about the buckling axis
    area: 5380 mm^2
    inertia: 14.2e6 mm^4             # second moment of area
    section_modulus: 170e3 mm^3      # elastic section modulus, same axis
  material:
    E: {dist: lognormal, mean: 205 GPa, cov: 0.04}    # Young's modulus
    fy: {dist: lognormal, mean: 290 MPa, cov: 0.08}   # yield strength
${ends}
  imperfection:
    # bow: amplitude of the initial out-of-straightness (shape of the first buckling mode).
    # A length or an expression of L (+ - * / ^ and brackets only), e.g. L/1000 + 2 mm.
    # Required for strength: first-yield; the code curves ignore it.
    bow: {dist: normal, mean: L/1200, sd: L/2400}
    # sway frames may add an out-of-plumb angle (rad), e.g. out_of_plumb: en1993 (1/200 αh αm, EN 1993-1-1 5.3.2)

reference_period: 50 years           # the period the verdict is for

loads:                               # axial compression; name them as you like
  # kind: permanent | imposed | snow | wind | other. A time-varying load states which period its
  # distribution describes: maximum_over: 1 year (annual maximum), maximum_over: 50 years, or
  # point_in_time: true with renewal_period. Two or more are combined by Turkstra's rule.
  # A load may also act sideways, in the plane of the buckling axis and scaled with every load:
  # eccentricity: {top: 60 mm}, moments: {top: 8 kN m}, transverse: 1.5 kN/m (along the height),
  # horizontal: 3 kN (at the top; sway only), e.g. wind: {value: 0 kN, kind: wind, transverse: ...}.
  permanent: {dist: normal, mean: 280 kN, cov: 0.08, kind: permanent}
  variable: {dist: gumbel, mean: 110 kN, cov: 0.3, kind: imposed, maximum_over: 50 years}

model_factor: {dist: lognormal, mean: 1.0, cov: 0.06}   # capacity model uncertainty (no unit); leave out for the strength model's default

# strength: first-yield | aisc360-e3 | en1993-a0 | en1993-a | en1993-b | en1993-c | en1993-d | plastic-zone
# first-yield-en1993-X (equivalent bow of EN 1993-1-1 5.3.2(11)), first-yield-en1993-X-plus-bow (plus the bow above)
strength: first-yield

# target reliability index, the period it is stated for, and where it comes from (free text)
target: {beta: 3.8, period: 50 years, source: "EN 1990 Annex C, RC2", consequence_class: CC2}

correlation:                         # optional: [variable, variable, rho], by path
  - [column.material.E, column.material.fy, 0.1]

analysis:                            # optional
  seed: 12345                        # same seed, same numbers
  methods: [form, sorm, is, mc]      # any of form, sorm, is, mc, subset
  mc_samples: 200000

display_units: si                    # si | us: units used in the reports
`;
}
