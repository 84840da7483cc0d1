/**
 * The sweep's worker threads and child processes run compiled JavaScript from dist/
 * (`npm test` builds first). When run alone, rebuild the few entry points this suite needs
 * if a compiled twin is missing or older than its source.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const projectRoot = fileURLToPath(new URL('../../', import.meta.url));
const ENTRIES = ['src/studies/syntheticSweepMain.ts', 'src/studies/sweepWorker.ts', 'src/studies/syntheticCaseRunner.ts'];

function stale(): boolean {
  for (const dir of ['src/studies', 'src/probability']) {
    for (const name of readdirSync(join(projectRoot, dir))) {
      if (!name.endsWith('.ts')) continue;
      const twin = join(projectRoot, 'dist', dir, name.replace(/\.ts$/, '.js'));
      if (!existsSync(twin) || statSync(twin).mtimeMs < statSync(join(projectRoot, dir, name)).mtimeMs) return true;
    }
  }
  return false;
}

export function ensureBuilt(): void {
  if (!stale()) return;
  const tsc = join(projectRoot, 'node_modules/typescript/bin/tsc');
  const options = ['--outDir', 'dist', '--rootDir', '.', '--module', 'NodeNext', '--moduleResolution', 'NodeNext', '--target', 'ES2022'];
  options.push('--lib', 'ES2022', '--types', 'node', '--strict', '--skipLibCheck', '--esModuleInterop');
  try {
    execFileSync(process.execPath, [tsc, ...options, ...ENTRIES], { cwd: projectRoot, stdio: 'pipe' });
  } catch {
    // type errors elsewhere still emit; the checks below tell whether what we need exists
  }
  for (const entry of ENTRIES) {
    const twin = join(projectRoot, 'dist', entry.replace(/\.ts$/, '.js'));
    if (!existsSync(twin)) throw new Error(`could not build ${twin}`);
  }
}
