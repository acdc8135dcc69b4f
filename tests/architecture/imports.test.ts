import { readdirSync, readFileSync, statSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

// The import rules of the code base (DEVELOPERS.md, "Layout"), read from the import specifiers as
// the TypeScript compiler finds them (ts.preProcessFile: static imports, `export ... from`,
// `import type` and dynamic import()).

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const sides = ['shared', 'server', 'src'] as const;

/**
 * The layers of shared/, lowest first: a folder (or a file right under shared/) imports only
 * from its own layer and the layers below it. api/ holds the route contract and stands on all of
 * shared/.
 */
const sharedLayers: readonly (readonly string[])[] = [
  ['result.ts', 'text'],
  ['tuning'],
  ['temperament'],
  ['midi', 'tuner'],
  ['preset'],
  ['import', 'export'],
  ['library'],
  ['api'],
];

/** Packages of a framework or a platform: shared/ is plain TypeScript for app and server. */
const notForShared = (specifier: string): boolean =>
  specifier.startsWith('node:') ||
  builtinModules.includes(specifier.split('/')[0]) ||
  /^(@angular\/|rxjs|express|drizzle-orm|pg$|piscina|passport)/.test(specifier);

interface SourceFile {
  /** Path from the repository root, with forward slashes. */
  path: string;
  /** Files of the repository it imports, paths as above. */
  imports: string[];
  /** Specifiers that name a package. */
  packages: string[];
}

function tsFiles(folder: string): string[] {
  return readdirSync(join(root, folder)).flatMap((name) => {
    const path = `${folder}/${name}`;
    if (statSync(join(root, path)).isDirectory()) return tsFiles(path);
    return path.endsWith('.ts') ? [path] : [];
  });
}

function existing(candidates: string[]): string | null {
  for (const candidate of candidates) {
    try {
      if (statSync(join(root, candidate)).isFile()) return candidate;
    } catch {
      // not this one
    }
  }
  return null;
}

/** The file a specifier names, or null for a package; throws on an import that leads nowhere. */
function resolveSpecifier(from: string, specifier: string): string | null {
  let target: string;
  if (specifier.startsWith('@shared/')) target = `shared/${specifier.slice('@shared/'.length)}`;
  else if (specifier.startsWith('.')) {
    target = relative(root, resolve(root, dirname(from), specifier))
      .split(sep)
      .join('/');
  } else return null;
  const base = target.replace(/\.js$/, '');
  const found = existing([base, `${base}.ts`, `${base}/index.ts`]);
  if (!found) throw new Error(`${from} imports '${specifier}', which is no file of the repository`);
  return found;
}

function readSourceFile(path: string): SourceFile {
  const text = readFileSync(join(root, path), 'utf8');
  const { importedFiles } = ts.preProcessFile(text, true, true);
  const imports: string[] = [];
  const packages: string[] = [];
  for (const { fileName } of importedFiles) {
    const file = resolveSpecifier(path, fileName);
    if (file === null) packages.push(fileName);
    else if (file.endsWith('.ts')) imports.push(file);
  }
  return { path, imports, packages };
}

/** The layer of a file under shared/: its index in `sharedLayers`. */
function layerOf(path: string): number {
  const top = path.split('/')[1];
  const layer = sharedLayers.findIndex((names) => names.includes(top));
  if (layer < 0) throw new Error(`${path}: shared/${top} has no place in this test's layer order`);
  return layer;
}

/** One cycle through each strongly connected group of files (Tarjan), as a -> b -> ... -> a. */
function cycles(graph: Map<string, string[]>): string[] {
  let counter = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const groups: string[][] = [];
  const visit = (node: string): void => {
    index.set(node, counter);
    low.set(node, counter);
    counter++;
    stack.push(node);
    onStack.add(node);
    for (const next of graph.get(node) ?? []) {
      if (!index.has(next)) {
        visit(next);
        low.set(node, Math.min(low.get(node)!, low.get(next)!));
      } else if (onStack.has(next)) low.set(node, Math.min(low.get(node)!, index.get(next)!));
    }
    if (low.get(node) === index.get(node)) {
      const group: string[] = [];
      let member: string;
      do {
        member = stack.pop()!;
        onStack.delete(member);
        group.push(member);
      } while (member !== node);
      if (group.length > 1 || (graph.get(node) ?? []).includes(node)) groups.push(group);
    }
  };
  for (const node of graph.keys()) if (!index.has(node)) visit(node);
  return groups.map((group) => {
    const members = new Set(group);
    const start = [...group].sort()[0];
    // Breadth first from the start back to itself, inside the group: the shortest cycle through it.
    const previous = new Map<string, string>();
    const queue = [start];
    while (queue.length > 0) {
      const node = queue.shift()!;
      for (const next of graph.get(node) ?? []) {
        if (!members.has(next) || previous.has(next)) continue;
        previous.set(next, node);
        if (next === start) queue.length = 0;
        else queue.push(next);
      }
    }
    const path: string[] = [];
    for (let node = previous.get(start)!; node !== start; node = previous.get(node)!) {
      path.unshift(node);
    }
    return [start, ...path, start].join(' -> ');
  });
}

const files = sides.flatMap(tsFiles).map(readSourceFile);
const sideOf = (path: string): string => path.split('/')[0];
const isTest = (path: string): boolean => /\.(test|spec)\.ts$/.test(path);

describe('imports', () => {
  it('reads the files it checks', () => {
    // A reading that found nothing would pass every rule below.
    for (const side of sides) {
      expect(files.filter((file) => sideOf(file.path) === side).length).toBeGreaterThan(10);
    }
    const retune = files.find((file) => file.path === 'shared/midi/song-retune.ts');
    expect(retune?.imports).toContain('shared/midi/smf-writer.ts');
    const design = files.find((file) => file.path === 'src/app/design/design-state.ts');
    expect(design?.imports).toContain('shared/preset/preset-document.ts');
  });

  it('form no cycle', () => {
    const graph = new Map(files.map((file) => [file.path, file.imports]));
    expect(cycles(graph)).toEqual([]);
  });

  it('keep shared/ under server/ and src/, and those two apart', () => {
    const allowed: Record<string, string[]> = {
      shared: ['shared'],
      server: ['server', 'shared'],
      src: ['src', 'shared'],
    };
    // Server tests also use the test support (tests/support/: a test server, a scratch database).
    const mayImport = (from: string, to: string): boolean =>
      allowed[sideOf(from)].includes(sideOf(to)) ||
      (isTest(from) && to.startsWith('tests/support/'));
    const crossings = files.flatMap((file) =>
      file.imports
        .filter((target) => !mayImport(file.path, target))
        .map((target) => `${file.path} -> ${target}`),
    );
    expect(crossings).toEqual([]);
  });

  it('keep frameworks and the platform out of shared/', () => {
    const found = files
      .filter((file) => sideOf(file.path) === 'shared')
      .flatMap((file) =>
        file.packages.filter(notForShared).map((name) => `${file.path} -> ${name}`),
      );
    expect(found).toEqual([]);
  });

  it('keep each folder of shared/ on the layers below it', () => {
    // Tests stand outside the layers: nothing imports them, and a test of a lower layer may build
    // its input with a higher one (a preview test reads a preset document).
    const upward = files
      .filter((file) => sideOf(file.path) === 'shared' && !isTest(file.path))
      .flatMap((file) =>
        file.imports
          .filter((target) => sideOf(target) === 'shared' && layerOf(target) > layerOf(file.path))
          .map((target) => `${file.path} -> ${target}`),
      );
    expect(upward).toEqual([]);
  });
});
