/**
 * `correlation: [[pathA, pathB, rho], ...]` → checked pairs: names, |rho| < 1, no pair twice.
 * Then the Nataf transform is built once (probability/nataf.ts), so that a matrix that is not
 * positive definite, or a rho these marginals cannot reach, is an input error here, with its line.
 */
import { DistributionError } from '../probability/distribution.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { natafTransform } from '../probability/nataf.js';
import { didYouMean } from './nearestName.js';
import type { PathSegment } from './rawTree.js';
import { fail, type ReadContext } from './readScalar.js';
import type { Correlation } from './types.js';
import type { NamedScalar } from './variables.js';

export function readCorrelation(raw: readonly (readonly [string, string, number])[] | undefined, scalars: readonly NamedScalar[], ctx: ReadContext): Correlation[] {
  if (raw === undefined) return [];
  const randomPaths = scalars.filter((s) => s.scalar.kind === 'random').map((s) => s.path);
  const allPaths = scalars.map((s) => s.path);
  const seen = new Map<string, number>();
  const pairs = raw.map(([a, b, rho], i) => {
    const path: PathSegment[] = ['correlation', i];
    for (const name of [a, b]) {
      if (!randomPaths.includes(name)) {
        if (allPaths.includes(name)) fail(ctx, path, `'${name}' is a fixed value, not a random variable: only random variables can be correlated`);
        const listed = randomPaths.length > 0 ? `the random variables are ${randomPaths.join(', ')}` : 'this scenario has no random variables';
        fail(ctx, path, `'${name}' is not a random variable of this scenario${didYouMean(name, randomPaths)}; ${listed}`);
      }
    }
    if (a === b) fail(ctx, path, `correlates '${a}' with itself`);
    if (!(Math.abs(rho) < 1)) fail(ctx, path, `rho must lie strictly between -1 and 1, got ${rho}`);
    const key = [a, b].sort().join('\u0000');
    const earlier = seen.get(key);
    if (earlier !== undefined) fail(ctx, path, `the pair ${a}, ${b} is already given in correlation[${earlier}]`);
    seen.set(key, i);
    return { a, b, rho };
  });
  if (pairs.length > 0) checkReachable(pairs, scalars, ctx);
  return pairs;
}

function checkReachable(pairs: readonly Correlation[], scalars: readonly NamedScalar[], ctx: ReadContext): void {
  const random = scalars.filter((s) => s.scalar.kind === 'random');
  const names = random.map((s) => s.path);
  const dists = random.map((s) => makeDistribution((s.scalar as Extract<NamedScalar['scalar'], { kind: 'random' }>).spec));
  const R: number[][] = names.map((_, i) => names.map((__, j) => (i === j ? 1 : 0)));
  for (const { a, b, rho } of pairs) {
    const i = names.indexOf(a);
    const j = names.indexOf(b);
    R[i]![j] = rho;
    R[j]![i] = rho;
  }
  try {
    natafTransform(dists, R, names);
  } catch (e) {
    if (e instanceof DistributionError) fail(ctx, ['correlation'], e.message);
    throw e;
  }
}
