/** The scenario file of docs/scenario-format.md, verbatim (comments included). */
export const FORMAT_EXAMPLE = `stanchion: 1                      # format version
title: Cold-store mezzanine, column M4
column:
  length: 4.2 m
  frame: braced                   # braced | sway
  section:                        # about the buckling axis
    area: 7640 mm^2
    inertia: 25.1e6 mm^4
    section_modulus: 281e3 mm^3   # elastic section modulus, same axis
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}
    fy: {dist: lognormal, mean: 310 MPa, cov: 0.07}
  ends:
    bottom: {rotation: {dist: lognormal, mean: 2.5 MN m/rad, cov: 0.5}}
    top: pinned                   # pinned | fixed | {rotation: Q} | {fixity: X}
    lateral: 0 kN/m               # sway frames only: translational spring at the top
  imperfection:
    bow: {dist: normal, mean: L/1500, sd: L/3000}
loads:                            # axial compression, concentric, summed
  dead: {dist: normal, mean: 420 kN, cov: 0.10}
  imposed: {dist: gumbel, mean: 160 kN, cov: 0.25}
model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}
strength: first-yield             # first-yield | aisc360-e3 | en1993-a0 | -a | -b | -c | -d
target_beta: 3.8
correlation:                      # optional, Pearson correlation of the physical variables
  - [column.material.E, column.material.fy, 0.2]
analysis:                         # optional
  seed: 20261201
  methods: [form, sorm, is, mc]
  mc_samples: 1000000
`;
