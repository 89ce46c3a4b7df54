/**
 * Renderer figures: the gzip size of the built bundle (dist/renderer, built by
 * `npm run build:renderer`) and the time from asking for the demo's iron
 * course to its summary being on screen and answering input, in Debian's
 * Chromium through the real preview server (app/preview) and host services.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { gzipSync } from 'node:zlib';
import { chromium, type Browser } from 'playwright-core';
import { runPreview } from '../app/preview/runPreview';

export const chromiumArgs = ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** Sum of the gzip sizes (default level) of every file the page loads from the built folder, bytes. */
export function bundleGzipBytes(folder: string): { readonly gzipBytes: number; readonly rawBytes: number; readonly files: number } {
  let gzipBytes = 0;
  let rawBytes = 0;
  let files = 0;
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) walk(path);
      else if (/\.(js|css|html)$/.test(name)) {
        const content = readFileSync(path);
        rawBytes += content.length;
        gzipBytes += gzipSync(content).length;
        files += 1;
      }
    }
  };
  walk(folder);
  return { gzipBytes, rawBytes, files };
}

/**
 * Run `use` with the real preview server (on `workspace`, or the demo workspace) and Debian's
 * Chromium, both closed afterwards with the scratch settings folder.
 */
async function withPreviewBrowser<T>(projectFolder: string, workspace: string | undefined, use: (url: string, browser: Browser) => Promise<T>): Promise<T> {
  const configFolder = mkdtempSync(join(tmpdir(), 'chelation-bench-'));
  const preview = await runPreview({ appName: 'chelation-ledger', appVersion: 'bench', appFolder: projectFolder, configFolder, ...(workspace === undefined ? {} : { workspace }) });
  if (!preview.ok) throw new Error(preview.issues.map((it) => it.message).join('; '));
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumArgs });
  try {
    return await use(preview.value.url, browser);
  } finally {
    await browser.close();
    await preview.value.close();
    rmSync(configFolder, { recursive: true, force: true });
  }
}

/** Milliseconds from clicking the screen's button to the iron course summary being visible, for each of `runs` fresh page loads. */
export function ironCourseNavigationMs(projectFolder: string, runs: number): Promise<{ readonly loadMs: number[]; readonly navigationMs: number[] }> {
  return withPreviewBrowser(projectFolder, undefined, async (url, browser) => {
    const loadMs: number[] = [];
    const navigationMs: number[] = [];
    for (let run = 0; run < runs; run += 1) {
      const page = await browser.newPage();
      const loadStarted = performance.now();
      await page.goto(url);
      const open = page.getByRole('button', { name: 'Open TH-0417' });
      await open.waitFor({ state: 'visible' });
      loadMs.push(performance.now() - loadStarted);
      await open.click();
      const ironButton = page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Iron course' });
      await ironButton.waitFor({ state: 'visible' });
      const started = performance.now();
      await ironButton.click();
      await page.locator('#summary-title').waitFor({ state: 'visible' });
      // Interactive: the page answers a round trip after the screen has painted.
      await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => resolve(null))));
      navigationMs.push(performance.now() - started);
      await page.close();
    }
    return { loadMs, navigationMs };
  });
}

/**
 * Milliseconds from loading the page to the Cases screen listing every case of a workspace folder
 * (each case read from the host and its summary line computed in the page), for each of `runs` fresh
 * pages, through the real preview server started on that folder.
 */
export function casesListedMs(projectFolder: string, workspace: string, lastLabel: string, runs: number): Promise<number[]> {
  return withPreviewBrowser(projectFolder, workspace, async (url, browser) => {
    const listedMs: number[] = [];
    for (let run = 0; run < runs; run += 1) {
      const page = await browser.newPage();
      const started = performance.now();
      await page.goto(url);
      // The list is shown once every case is read and summarised: its last line's open button.
      await page.getByRole('button', { name: `Open ${lastLabel}` }).waitFor({ state: 'visible', timeout: 300_000 });
      listedMs.push(performance.now() - started);
      await page.close();
    }
    return listedMs;
  });
}
