/**
 * `correlation: [[pathA, pathB, rho], ...]` → checked pairs. Positive definiteness of the
 * whole matrix is Nataf's job (probability/nataf.ts); here: names, |rho| < 1, no pair twice.
 */
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
  return raw.map(([a, b, rho], i) => {
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
}
