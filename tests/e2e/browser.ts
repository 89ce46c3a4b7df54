import { spawn, spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { chromium, type Browser, type Page } from 'playwright-core';
import { serveFolder } from './staticServer';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
export const artifactsDir = fileURLToPath(new URL('./artifacts/', import.meta.url));

/** Debian's Chromium with the flags this machine needs (stack-notes.md). */
const chromiumFlags = ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/**
 * Build the renderer (the same command as `npm run build:renderer`) into a
 * folder of this test file's own. Two test files run in parallel workers: when
 * both built into dist/renderer, one build emptied the folder while the other
 * file's page was loading, and that page waited out its 30 s for the Cases table.
 */
export function buildRenderer(): string {
  const outDir = mkdtempSync(join(tmpdir(), 'chelation-ledger-renderer-'));
  const built = spawnSync('npx', ['vite', 'build', '--config', 'renderer/vite.config.ts', '--outDir', outDir, '--emptyOutDir'], { cwd: repoRoot, encoding: 'utf8' });
  if (built.status !== 0) throw new Error(`the renderer build failed:\n${built.stdout}\n${built.stderr}`);
  return outDir;
}

/** Build the renderer, serve it, start Chromium. */
export async function startWorkspace(): Promise<{ readonly url: string; readonly browser: Browser; readonly rendererFolder: string; readonly stop: () => Promise<void> }> {
  const rendererFolder = buildRenderer();
  mkdirSync(artifactsDir, { recursive: true });
  const server = await serveFolder(rendererFolder);
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: chromiumFlags });
  return {
    url: server.url,
    browser,
    rendererFolder,
    stop: async () => {
      await browser.close();
      await server.close();
    },
  };
}

/**
 * The preview server over a fresh copy of the demo workspace, in a process of its own, as the
 * host runs apart from the page in the desktop app (Electron's main process). A host in the
 * test's own process would share its one thread with Playwright's client: while the host did an
 * import's synchronous steps, the test could neither see the page's progress nor press Cancel.
 * The entry (previewProcess.ts) is bundled with esbuild, its packages left to node_modules.
 *
 * @param rendererFolder - the built renderer (buildRenderer)
 * @returns the page's address, the workspace folder, and a stop that ends the process
 */
export async function startPreviewProcess(rendererFolder: string): Promise<{ readonly url: string; readonly workspaceFolder: string; readonly stop: () => Promise<void> }> {
  const scratch = mkdtempSync(join(tmpdir(), 'chelation-ledger-preview-process-'));
  const workspaceFolder = join(scratch, 'workspace');
  mkdirSync(workspaceFolder);
  for (const name of ['th-0417.json', 'th-0093.json']) copyFileSync(join(repoRoot, 'assets', 'demo', name), join(workspaceFolder, name));
  const pkg = JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8')) as { dependencies?: Record<string, string> };
  const bundle = join(scratch, 'preview.cjs');
  await build({ entryPoints: [join(repoRoot, 'tests', 'e2e', 'previewProcess.ts')], outfile: bundle, bundle: true, platform: 'node', target: 'node20', format: 'cjs', external: Object.keys(pkg.dependencies ?? {}), logLevel: 'warning' });
  const child = spawn(process.execPath, [bundle, rendererFolder, workspaceFolder, join(scratch, 'config')], { cwd: repoRoot, env: { ...process.env, NODE_PATH: join(repoRoot, 'node_modules') }, stdio: ['ignore', 'pipe', 'pipe'] });
  const url = await new Promise<string>((resolvePromise, reject) => {
    let out = '';
    let err = '';
    child.stdout.on('data', (chunk: Buffer) => {
      out += chunk.toString('utf8');
      if (out.includes('\n')) resolvePromise(out.split('\n')[0]!);
    });
    child.stderr.on('data', (chunk: Buffer) => (err += chunk.toString('utf8')));
    child.on('exit', (code) => reject(new Error(`the preview process ended (${code}) before it printed its address: ${err}`)));
  });
  return {
    url,
    workspaceFolder,
    stop: () =>
      new Promise<void>((resolvePromise) => {
        if (child.exitCode !== null) return resolvePromise();
        child.once('exit', () => resolvePromise());
        child.kill();
      }),
  };
}

/**
 * A user's actions, counted: a click, a key chord, a paste, or typing a value
 * into a field counts as one (issue 15's rule for the 25-action review).
 */
export class CountedUser {
  count = 0;
  constructor(private readonly page: Page) {}

  async click(selector: string): Promise<void> {
    this.count += 1;
    await this.page.locator(selector).first().click();
  }

  /** Typing one value into a field (focus by click is counted separately when needed). */
  async type(selector: string, value: string): Promise<void> {
    this.count += 1;
    await this.page.locator(selector).first().fill(value);
  }

  async select(selector: string, value: string): Promise<void> {
    this.count += 1;
    await this.page.locator(selector).first().selectOption(value);
  }

  async press(chord: string): Promise<void> {
    this.count += 1;
    await this.page.keyboard.press(chord);
  }

  /** A paste of spreadsheet cells into the focused field (the clipboard as a spreadsheet fills it: tab-separated, CR LF). */
  async paste(text: string): Promise<void> {
    this.count += 1;
    await this.page.evaluate((pasted) => {
      const target = document.activeElement;
      if (!target) throw new Error('nothing has the focus to paste into');
      const data = new DataTransfer();
      data.setData('text/plain', pasted);
      target.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
    }, text);
  }
}
