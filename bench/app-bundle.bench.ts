// The initial JavaScript of the Keyloom app against bare Angular Material shells built the same way
// (same angular.json, theme, fonts and production options) with no features: one with the
// Material pieces Keyloom's own toolbar uses (toolbar, buttons, icons and the account menu), the
// router and HttpClient; and a smaller one without the menu. Target: the app at most 1.5 times the
// shell with Keyloom's pieces, so the features must load lazily with their routes. The figure
// against the smaller shell is printed too: the overlay the menu needs is shared with lazy dialogs
// and menus, and esbuild keeps in the first load whatever any route uses of a module the first
// load needs. Run: npx tsx bench/app-bundle.bench.ts
import { execFileSync } from 'node:child_process';
import {
  cpSync,
  mkdirSync,
  mkdtempSync,
  readFileSync,
  rmSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

const repo = join(import.meta.dirname, '..');
const target = 1.5;

/** A shell's main.ts: a toolbar with a link, an icon button and, when asked, a menu. */
function shellMain(withMenu: boolean): string {
  const menuImport = withMenu ? "import { MatMenuModule } from '@angular/material/menu';" : '';
  const menu = withMenu
    ? '<button mat-button [matMenuTriggerFor]="account">Account</button>' +
      '<mat-menu #account="matMenu"><button mat-menu-item>Sign out</button></mat-menu>'
    : '';
  return `import { Component } from '@angular/core';
import { provideHttpClient, withFetch } from '@angular/common/http';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
${menuImport}
import { bootstrapApplication } from '@angular/platform-browser';
import { RouterLink, RouterOutlet, provideRouter } from '@angular/router';

@Component({
  selector: 'app-root',
  imports: [MatToolbarModule, MatButtonModule, MatIconModule, RouterLink, RouterOutlet${withMenu ? ', MatMenuModule' : ''}],
  template: \`
    <mat-toolbar>
      <span>Shell</span>
      <a mat-button routerLink="/">Home</a>
      <button mat-icon-button aria-label="Settings"><mat-icon>settings</mat-icon></button>
      ${menu}
    </mat-toolbar>
    <main><router-outlet /></main>
  \`,
})
class Shell {}

bootstrapApplication(Shell, { providers: [provideRouter([]), provideHttpClient(withFetch())] }).catch(console.error);
`;
}

const shellTsconfig = {
  extends: '../tsconfig.json',
  compilerOptions: { outDir: '../out-tsc/app', types: [] },
  include: ['./**/*.ts'],
};

/** A copy of the workspace's build setup with a minimal shell in place of the app. */
function bareShellWorkspace(withMenu: boolean): string {
  const workspace = mkdtempSync(join(tmpdir(), 'keyloom-bare-shell-'));
  for (const file of ['angular.json', 'tsconfig.json', 'package.json'])
    cpSync(join(repo, file), join(workspace, file));
  for (const file of ['index.html', 'styles.scss', '_theme-colors.scss']) {
    mkdirSync(join(workspace, 'src'), { recursive: true });
    cpSync(join(repo, 'src', file), join(workspace, 'src', file));
  }
  cpSync(join(repo, 'src/public'), join(workspace, 'src/public'), { recursive: true });
  writeFileSync(join(workspace, 'src/main.ts'), shellMain(withMenu));
  writeFileSync(join(workspace, 'src/tsconfig.app.json'), JSON.stringify(shellTsconfig, null, 2));
  symlinkSync(join(repo, 'node_modules'), join(workspace, 'node_modules'), 'dir');
  return workspace;
}

function build(workspace: string, outputPath: string): void {
  execFileSync(
    'npx',
    ['ng', 'build', '--configuration', 'production', '--output-path', outputPath],
    {
      cwd: workspace,
      stdio: ['ignore', 'ignore', 'inherit'],
      env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
    },
  );
}

interface InitialScripts {
  files: string[];
  rawBytes: number;
  gzipBytes: number;
}

/** The JavaScript a first visit loads before any route: the entry script and what it preloads. */
function initialScripts(outputPath: string): InitialScripts {
  const browser = join(outputPath, 'browser');
  const html = readFileSync(join(browser, 'index.html'), 'utf8');
  const files = [
    ...html.matchAll(
      /<(?:script[^>]*\ssrc|link[^>]*rel="modulepreload"[^>]*\shref)="([^"]+\.js)"/g,
    ),
  ].map((match) => match[1]);
  let rawBytes = 0;
  let gzipBytes = 0;
  for (const file of files) {
    const content = readFileSync(join(browser, file));
    rawBytes += content.length;
    gzipBytes += gzipSync(content, { level: 9 }).length;
  }
  return { files, rawBytes, gzipBytes };
}

function kilobytes(bytes: number): string {
  return `${(bytes / 1000).toFixed(1)} kB`;
}

function describe(label: string, scripts: InitialScripts): void {
  const figures = `${kilobytes(scripts.rawBytes)} raw, ${kilobytes(scripts.gzipBytes)} gzip`;
  console.log(`${label.padEnd(38)} ${figures} (${scripts.files.length} files)`);
}

const scratch = mkdtempSync(join(tmpdir(), 'keyloom-bundle-'));
const shells = [bareShellWorkspace(true), bareShellWorkspace(false)];
try {
  build(repo, join(scratch, 'app'));
  build(shells[0], join(scratch, 'shell'));
  build(shells[1], join(scratch, 'small-shell'));
  const app = initialScripts(join(scratch, 'app'));
  const shell = initialScripts(join(scratch, 'shell'));
  const smallShell = initialScripts(join(scratch, 'small-shell'));
  describe('Keyloom app', app);
  describe("shell with Keyloom's Material pieces", shell);
  describe('shell without the menu', smallShell);
  const ratio = app.rawBytes / shell.rawBytes;
  const gzipRatio = app.gzipBytes / shell.gzipBytes;
  console.log(
    `ratio ${ratio.toFixed(2)} raw, ${gzipRatio.toFixed(2)} gzip (target at most ${target}: ` +
      `${ratio <= target ? 'met' : 'NOT MET'})`,
  );
  console.log(
    `ratio to the shell without the menu ${(app.rawBytes / smallShell.rawBytes).toFixed(2)} raw`,
  );
  if (ratio > target) process.exitCode = 1;
} finally {
  rmSync(scratch, { recursive: true, force: true });
  for (const workspace of shells) rmSync(workspace, { recursive: true, force: true });
}
