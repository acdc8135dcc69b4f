// Builds the Angular app when the build is missing or older than its sources.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { repoRoot } from './postgres';

const inputs = ['src', 'shared', 'angular.json', 'tsconfig.json', 'package-lock.json'];
const outputDir = join(repoRoot, 'dist/keyloom');
const stampFile = join(outputDir, '.sources-sha256');

function* files(path: string): Generator<string> {
  if (statSync(path).isDirectory()) {
    for (const entry of readdirSync(path).sort()) yield* files(join(path, entry));
  } else if (!/\.(spec|test)\.ts$/.test(path)) {
    yield path;
  }
}

export function sourcesHash(): string {
  const hash = createHash('sha256');
  for (const input of inputs) {
    for (const file of files(join(repoRoot, input))) {
      hash.update(relative(repoRoot, file)).update('\0').update(readFileSync(file)).update('\0');
    }
  }
  return hash.digest('hex');
}

export function ensureBuild(log: (line: string) => void): void {
  const want = sourcesHash();
  if (
    existsSync(join(outputDir, 'browser/index.html')) &&
    existsSync(stampFile) &&
    readFileSync(stampFile, 'utf8') === want
  ) {
    return;
  }
  log('building the app (ng build)');
  const result = spawnSync(join(repoRoot, 'node_modules/.bin/ng'), ['build'], {
    cwd: repoRoot,
    stdio: 'inherit',
  });
  if (result.status !== 0) throw new Error('ng build failed; its messages are above.');
  writeFileSync(stampFile, want);
}
