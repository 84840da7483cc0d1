/**
 * What updating hands back: the distribution of the next value of the quantity (the posterior
 * predictive), on the scale the updating worked on (the value itself, or its logarithm).
 */
export type Predictive =
  | { readonly family: 'normal'; readonly mean: number; readonly sd: number }
  | { readonly family: 'studentt'; readonly loc: number; readonly scale: number; readonly dof: number };
