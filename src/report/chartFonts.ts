/**
 * The font files handed to the PNG renderer. resvg draws no text at all when it has no
 * font, so the report ships DejaVu (npm package dejavu-fonts-ttf) and passes it explicitly.
 */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { existsSync } from 'node:fs';

const require = createRequire(import.meta.url);

/** Absolute paths of DejaVu Sans regular and bold; throws if the package is missing. */
export function chartFontFiles(): string[] {
  const root = dirname(require.resolve('dejavu-fonts-ttf/package.json'));
  const files = ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf'].map((f) => join(root, 'ttf', f));
  for (const f of files) {
    if (!existsSync(f)) throw new Error(`font file missing: ${f} (package dejavu-fonts-ttf)`);
  }
  return files;
}
