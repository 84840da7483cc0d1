import { strengthModelKind } from './strengthModelKind.js';
import type { StrengthModel } from './types.js';

/**
 * The default model uncertainty θ = (test result) / (model prediction) of each strength model, used
 * when a scenario gives no `model_factor`. Plain numbers: limitState/ turns them into a distribution
 * (mechanics/ knows nothing of probability). `mean` is the bias, `cov` the scatter of θ.
 * Every value here was recalled, not read from the document named: `source` says so, and the docs
 * page docs/model-uncertainty.md gives the reasoning. A scenario's own `model_factor` always wins.
 */
export interface ModelUncertaintyDefault {
  readonly dist: 'lognormal';
  readonly mean: number;
  readonly cov: number;
  /** where the numbers come from, ready to print */
  readonly source: string;
}

/**
 * First yield of a column with a geometric bow only: no residual stress (which lowers the strength)
 * and no plastic reserve beyond first yield (which raises it); the two partly cancel, so no bias.
 */
const FIRST_YIELD: ModelUncertaintyDefault = {
  dist: 'lognormal',
  mean: 1.0,
  cov: 0.1,
  source:
    'JCSS Probabilistic Model Code Part 3 (2001), resistance model uncertainties: steel bending and shear 1.00 / CoV 0.05, no entry for column buckling; CoV doubled for a first-yield model that ignores residual stress and plastic reserve (from memory; engineering judgement)',
};

/** AISC 360 E3: a mean-strength curve (SSRC curve 2P, out-of-straightness about L/1500). */
const AISC_E3: ModelUncertaintyDefault = {
  dist: 'lognormal',
  mean: 1.0,
  cov: 0.07,
  source:
    'background of AISC 360-16 E3: SSRC Guide (Ziemian ed., 6th ed., 2010) ch. 3, curve 2P fitted to mean column strengths; Ravindra & Galambos, J. Struct. Div. ASCE 104(9), 1978, column test scatter (from memory)',
};

/**
 * The European curves are lower-fractile design curves (strengths of columns with an L/1000 bow and
 * residual stresses), so tests sit above them on average.
 */
const EN_CURVE: ModelUncertaintyDefault = {
  dist: 'lognormal',
  mean: 1.1,
  cov: 0.07,
  source:
    'background of EN 1993-1-1 6.3.1.2: Beer & Schulz, Construction Métallique 7(3), 1970 (the European column curves); Sedlacek & Müller, J. Constr. Steel Res. 62 (2006) 1047–1059, evaluation of column tests to EN 1990 Annex D supporting γ_M1 = 1.0 (from memory)',
};

/**
 * A plastic-zone simulation with the measured bow and the family's residual stresses is a
 * best-estimate model: no bias, and a scatter against tests of the order of that of the column
 * tests about the maximum-strength curves themselves.
 */
const PLASTIC_ZONE: ModelUncertaintyDefault = {
  dist: 'lognormal',
  mean: 1.0,
  cov: 0.06,
  source:
    'maximum-strength columns computed with measured imperfections against tests: Bjorhovde, PhD thesis, Lehigh University 1972, and SSRC Guide (Ziemian ed., 6th ed., 2010) ch. 3; Beer & Schulz, Construction Métallique 7(3), 1970 (from memory; engineering judgement: bias 1.00, CoV 0.06 where the section, bow and residual stresses are those of the column)',
};

export function defaultModelUncertainty(model: StrengthModel): ModelUncertaintyDefault {
  const kind = strengthModelKind(model);
  if (!kind) throw new RangeError(`unknown strength model '${String(model)}'`);
  switch (kind.family) {
    case 'first-yield':
      return FIRST_YIELD;
    case 'aisc360-e3':
      return AISC_E3;
    case 'en1993':
      return EN_CURVE;
    case 'plastic-zone':
      return PLASTIC_ZONE;
    case 'equivalent-bow':
      // reproduces curve X exactly (without the measured bow), so it inherits the curve's uncertainty
      return {
        ...EN_CURVE,
        source: `as en1993-${kind.curve} (this model reproduces its curve): ${EN_CURVE.source}${kind.usesBow ? '; the measured bow on top makes it cautious' : ''}`,
      };
  }
}
