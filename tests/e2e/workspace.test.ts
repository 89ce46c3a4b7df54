// End-to-end: the built renderer in Chromium, served on loopback with the
// in-page host (app/preview is not on main yet; the page then keeps its cases
// in localStorage, which is what "reload and reopen" exercises).
import { readFileSync } from 'node:fs';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memoryHostStorageKey } from '../../renderer/fakeHost/memoryHost';
import { artifactsDir, CountedUser, repoRoot, startPreviewProcess, startWorkspace } from './browser';

const demo = JSON.parse(readFileSync(`${repoRoot}assets/demo/th-0417.json`, 'utf8')) as {
  transfusions: { date: string }[];
  results: { date: string }[];
  proposedRegimens: unknown[];
} & Record<string, unknown>;

/**
 * Scenario 1 (scenarios.md §1) as it stood before this quarter's review:
 * the invented TH-0417 without the three latest transfusions, the November
 * ferritin, liver iron and cardiac T2*, and without the proposed regimens.
 */
function lastQuarterCase() {
  const latestTransfusions = demo.transfusions.map((it) => it.date).sort().slice(-3);
  return {
    ...demo,
    transfusions: demo.transfusions.filter((it) => !latestTransfusions.includes(it.date)),
    results: demo.results.filter((it) => it.date < '2026-11-01'),
    proposedRegimens: [],
  };
}

const seedStorage = (cases: Record<string, unknown>) =>
  JSON.stringify({ cases: Object.fromEntries(Object.entries(cases).map(([id, document]) => [id, { document, revision: 1, archived: false }])), settings: { version: 1, units: 'si', paper: 'a4', localFormulary: null, assumptionDefaults: {}, thresholdDefaults: {} }, exports: [] });

let workspace: Awaited<ReturnType<typeof startWorkspace>>;
let browser: Browser;

beforeAll(async () => {
  workspace = await startWorkspace();
  browser = workspace.browser;
}, 120_000);

afterAll(async () => {
  await workspace?.stop();
});

/** A page on the preview server run as a process of its own (startPreviewProcess), with the page's errors; both closed after `use`. */
async function onPreviewProcess(use: (page: Page, preview: Awaited<ReturnType<typeof startPreviewProcess>>, errors: string[]) => Promise<void>): Promise<void> {
  const preview = await startPreviewProcess(workspace.rendererFolder);
  const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  try {
    await use(page, preview, errors);
  } finally {
    await context.close();
    await preview.stop();
  }
}

async function openPage(seed?: Record<string, unknown>, options: { bypassCSP?: boolean } = {}): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1400, height: 900 }, bypassCSP: options.bypassCSP ?? false });
  if (seed) {
    await context.addInitScript(([key, value]) => {
      if (!sessionStorage.getItem('seeded')) {
        localStorage.setItem(key, value);
        sessionStorage.setItem('seeded', '1');
      }
    }, [memoryHostStorageKey, seedStorage(seed)] as const);
  }
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(message.text());
  });
  await page.goto(workspace.url);
  await page.locator('table.cases').waitFor();
  await expect.poll(() => page.locator('main p').first().textContent()).toMatch(/case/);
  return { context, page, errors };
}

const savedState = (page: Page) => page.locator('.save-state');

describe('the scenario-1 quarterly review', { retry: 2 }, () => {
  it('opens TH-0417, adds three transfusions, the new liver iron and ferritin, compares two regimens, reads the findings and exports the sheet in at most 25 actions', async () => {
    const { context, page, errors } = await openPage({ 'th-0417.json': lastQuarterCase() });
    const user = new CountedUser(page);

    await user.click('button[aria-label="Open TH-0417"]');
    await expect.poll(() => page.locator('h1').textContent()).toBe('Record');

    // Three transfusions pasted from the unit's spreadsheet (date, kind, volume, unit haematocrit, units).
    await user.click('button:has-text("Add a row to transfusions")');
    await user.paste('2026-09-22\tsimple\t575\t0.61\t2\r\n2026-10-13\tsimple\t540\t0.57\t2\r\n2026-11-03\tsimple\t540\t0.62\t2\r\n');
    // The new liver iron and ferritin, pasted the same way (date, result, method, value, unit, field strength, calibration).
    await user.click('button:has-text("Add a row to results")');
    await user.paste('2026-11-17\tliver iron\tmri\t11.4\tmg/g dry weight\t1.5\thernando-1.5t\r\n2026-11-10\tferritin\t\t2900\tµg/L\r\n');
    await expect.poll(() => savedState(page).textContent()).toBe('All changes saved');

    await user.click('nav button:has-text("Iron course")');
    await expect(page.locator('.summary').textContent()).resolves.toContain('11.4 mg/g dry weight on 2026-11-17');

    // Two what-ifs: deferasirox 28 mg/kg/day; the same with deferoxamine 40 mg/kg on 5 nights.
    await user.click('nav button:has-text("Regimens")');
    await user.type('input[aria-label="Dose per administration, what-if drug 1"]', '28');
    await user.click('button:has-text("Add this what-if")');
    await user.click('button:has-text("Add the second drug")');
    await user.type('input[aria-label="Dose per administration, what-if drug 2"]', '40');
    await user.type('input[aria-label="Days a week, what-if drug 2"]', '5');
    await user.click('button:has-text("Add this what-if")');
    await expect.poll(() => page.locator('.side-by-side thead th').count()).toBe(4);
    await expect.poll(() => savedState(page).textContent()).toBe('All changes saved');
    const header = await page.locator('.side-by-side thead').textContent();
    expect(header).toContain('What-if: deferasirox 28 mg/kg');
    expect(header).toContain('deferasirox 28 mg/kg with deferoxamine 40 mg/kg on 5 days a week');
    // Each column shows the projected LIC at 6, 12 and 24 months with its band, and the crossings of 7.
    expect(await page.locator('.side-by-side tbody tr').nth(3).locator('td').count()).toBe(3);
    expect(await page.locator('.side-by-side').textContent()).toMatch(/falls below 7 at month \d+/);

    await user.click('nav button:has-text("Findings")');
    expect(await page.locator('article.finding').count()).toBeGreaterThan(0);

    await user.click('nav button:has-text("Sheet")');
    await user.click('button:has-text("Export the sheet as PDF")');
    await expect.poll(() => page.locator('.toolbar [role="status"]').textContent()).toMatch(/Review sheet written to in-page\/th-0417-2026-11-20\.pdf/);

    expect(user.count).toBeLessThanOrEqual(25);
    console.log(`scenario-1 quarterly review: ${user.count} user actions`);
    expect(errors).toEqual([]);
    await context.close();
  }, 120_000);
});

describe('a new case from the keyboard', { retry: 2 }, () => {
  it('is created, takes transfusions typed and pasted, a liver iron result and a regimen, updates the iron course and the findings, takes a what-if, exports, and reopens after a reload', async () => {
    const { context, page, errors } = await openPage({});
    await page.fill('label:has-text("Label") input', 'ZZ-0001');
    await page.fill('label:has-text("Birth date") input', '2012-03-01');
    await page.fill('label:has-text("Weight, kg") input', '41');
    await page.fill('label:has-text("Weighed on") input', '2025-01-10');
    await page.click('button:has-text("Create the case")');
    await expect.poll(() => page.locator('.case-label').textContent()).toBe('ZZ-0001');

    // Keyboard entry: Tab along the row, Enter for the next row in the same column.
    await page.click('button:has-text("Add a row to transfusions")');
    await page.keyboard.type('2025-01-14');
    await page.keyboard.press('Tab'); // kind: simple (a select; left as it is)
    await page.keyboard.press('Tab');
    await page.keyboard.type('560');
    await page.keyboard.press('Tab');
    await page.keyboard.type('0.6');
    await page.keyboard.press('Tab');
    await page.keyboard.type('2');
    await expect.poll(() => page.locator('input[aria-label="Units, row 1"]').inputValue()).toBe('2');
    // A paste below it.
    await page.click('button:has-text("Add a row to transfusions")');
    await page.evaluate(() => {
      const data = new DataTransfer();
      data.setData('text/plain', '2025-02-04\tsimple\t550\t0.6\t2\n2025-02-25\tsimple\t560\t0.6\t2\n');
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
    });
    await expect.poll(() => page.locator('.record-table').first().locator('tbody tr').count()).toBe(3);
    // A bad value is kept as typed and explained beside the field; Ctrl+Z takes it back.
    await page.fill('input[aria-label="Unit haematocrit, row 2"]', '60');
    await expect.poll(() => page.locator('.field-message.error').first().textContent()).toContain('enter it as a fraction (0.60)');
    expect(await page.locator('input[aria-label="Unit haematocrit, row 2"]').inputValue()).toBe('60');
    await expect.poll(() => savedState(page).textContent()).toContain('Not saved');
    await page.locator('body').click({ position: { x: 5, y: 300 } });
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('input[aria-label="Unit haematocrit, row 2"]').inputValue()).toBe('0.6');

    // Liver iron and a chelation period.
    await page.click('button:has-text("Add a row to results")');
    await page.evaluate(() => {
      const data = new DataTransfer();
      data.setData('text/plain', '2025-01-10\tliver iron\tbiopsy\t8.2\tmg/g dry weight\n2025-12-16\tliver iron\tbiopsy\t7.1\tmg/g dry weight\n');
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
    });
    await page.click('button:has-text("Add a row to chelation periods")');
    await page.selectOption('select[aria-label="Drug, row 1"]', 'deferasirox');
    await page.selectOption('select[aria-label="Formulation, row 1"]', 'film-coated-tablet');
    await page.fill('input[aria-label="Dose per administration, row 1"]', '21');
    await page.fill('input[aria-label="Start, row 1"]', '2025-01-10');
    await expect.poll(() => savedState(page).textContent()).toBe('All changes saved');

    await page.click('nav button:has-text("Iron course")');
    const summary = await page.locator('.summary').textContent();
    expect(summary).toContain('7.1 mg/g dry weight on 2025-12-16');
    expect(summary).toContain('Expected removal, deferasirox');
    expect(await page.locator('.chart-image').count()).toBe(2);
    // Focusing a number shows its derivation from core.
    await page.locator('.summary button.explained').first().focus();
    await expect.poll(() => page.locator('.explain-panel .derivation').count()).toBeGreaterThan(0);

    await page.click('nav button:has-text("Findings")');
    await page.click('nav button:has-text("Regimens")');
    await page.fill('input[aria-label="Dose per administration, what-if drug 1"]', '28');
    await page.click('button:has-text("Add this what-if")');
    await expect.poll(() => page.locator('.side-by-side thead th').count()).toBe(3);
    await expect.poll(() => savedState(page).textContent()).toBe('All changes saved');
    await page.click('nav button:has-text("Sheet")');
    await page.click('button:has-text("Export the monitoring calendar")');
    await expect.poll(() => page.locator('.toolbar [role="status"]').textContent()).toContain('Monitoring calendar written to');

    await page.reload();
    await page.locator('button[aria-label="Open ZZ-0001"]').click();
    expect(await page.locator('.record-table').first().locator('tbody tr').count()).toBe(3);
    await page.click('nav button:has-text("Regimens")');
    expect(await page.locator('.side-by-side thead th').count()).toBe(3);
    expect(errors).toEqual([]);
    await context.close();
  }, 120_000);
});

describe('accessibility of every screen', { retry: 2 }, () => {
  const screens = ['Cases', 'Record', 'Iron course', 'Regimens', 'Findings', 'Sheet', 'Assumptions'] as const;

  it('has no serious or critical axe-core violations (WCAG 2.0–2.2 A and AA rules, contrast included), and a screenshot of each screen is saved', async () => {
    // axe is injected into the page, which the page's Content-Security-Policy would refuse.
    const { context, page } = await openPage({ 'th-0417.json': demo }, { bypassCSP: true });
    const problems: string[] = [];
    for (const screen of screens) {
      if (screen !== 'Cases') {
        if (screen === 'Record') await page.click('button[aria-label="Open TH-0417"]');
        else await page.click(`nav button:has-text("${screen}")`);
      }
      await expect.poll(() => page.locator('h1').textContent()).toBe(screen);
      await page.screenshot({ path: `${artifactsDir}${screen.toLowerCase().replace(/ /g, '-')}.png`, fullPage: false });
      const results = await new AxeBuilder({ page }).options({ resultTypes: ['violations'] }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
      for (const violation of results.violations.filter((it) => it.impact === 'serious' || it.impact === 'critical')) {
        problems.push(`${screen}: ${violation.id} (${violation.impact}) — ${violation.nodes.slice(0, 3).map((node) => node.target.join(' ')).join('; ')}`);
      }
    }
    await page.click('button:has-text("About")');
    await page.screenshot({ path: `${artifactsDir}about.png` });
    const about = await new AxeBuilder({ page }).options({ resultTypes: ['violations'] }).withTags(['wcag2a', 'wcag2aa', 'wcag21aa']).analyze();
    problems.push(...about.violations.filter((it) => it.impact === 'serious' || it.impact === 'critical').map((it) => `About: ${it.id}`));
    expect(problems).toEqual([]);
    await context.close();
  }, 180_000);

  it('can be used from the keyboard alone, with a visible focus and the caution line on every screen', async () => {
    const { context, page } = await openPage({ 'th-0417.json': demo });
    // Tab from the top of the page reaches the case's Open button.
    let reached = false;
    for (let step = 0; step < 30 && !reached; step += 1) {
      await page.keyboard.press('Tab');
      reached = (await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))) === 'Open TH-0417';
      const outline = await page.evaluate(() => {
        const focused = document.activeElement as HTMLElement | null;
        return focused && focused !== document.body ? getComputedStyle(focused).outlineStyle : 'n/a';
      });
      expect(outline === 'n/a' || outline !== 'none').toBe(true);
    }
    expect(reached).toBe(true);
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator('h1').textContent()).toBe('Record');
    // Every screen from the navigation, by keyboard: focus a screen's button, Enter.
    for (const screen of ['Iron course', 'Regimens', 'Findings', 'Sheet', 'Assumptions', 'Cases']) {
      await page.locator(`nav button:has-text("${screen}")`).focus();
      await page.keyboard.press('Enter');
      await expect.poll(() => page.locator('h1').textContent()).toBe(screen);
      expect(await page.locator('.caution').first().textContent()).toContain('for review by the prescriber');
    }
    await context.close();
  }, 120_000);
});

/** The preview server (app/preview) over a fresh copy of the demo workspace, and a page in Chromium on it. */
async function openPreviewPage(options: { bypassCSP?: boolean } = {}): Promise<{ page: Page; errors: string[]; close: () => Promise<void> }> {
  const { mkdtempSync } = await import('node:fs');
  const { tmpdir } = await import('node:os');
  const { join } = await import('node:path');
  const { runPreview } = await import('../../app/preview/runPreview');
  const configFolder = mkdtempSync(join(tmpdir(), 'chelation-ledger-e2e-'));
  const started = await runPreview({ appName: 'chelation-ledger', appVersion: '0.0.0-test', appFolder: repoRoot, configFolder, rendererFolder: workspace.rendererFolder });
  if (!started.ok) throw new Error(started.issues.map((it) => it.message).join('; '));
  const preview = started.value;
  const context = await browser.newContext({ viewport: { width: 1400, height: 900 }, bypassCSP: options.bypassCSP ?? false });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  await page.goto(preview.url);
  return {
    page,
    errors,
    close: async () => {
      await context.close();
      await preview.close();
    },
  };
}

describe('through the preview server (app/preview) and the host client (renderer/host)', { retry: 2 }, () => {
  it('lists the demo workspace, opens a case and shows its iron course, with the chart from core', async () => {
    const { page, errors, close } = await openPreviewPage();
    try {
      await page.locator('button[aria-label="Open TH-0417"]').click();
      await page.click('nav button:has-text("Iron course")');
      expect(await page.locator('.summary').textContent()).toContain('11.4 mg/g dry weight on 2026-11-17');
      expect(await page.locator('.chart-image').count()).toBe(2);
      await page.click('button:has-text("About")');
      expect(await page.locator('dialog').textContent()).toContain('desktop app or preview server');
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  }, 120_000);
});

describe('importing records through the preview server (app/preview) into the demo case', { retry: 2 }, () => {
  // Invented exports of our own (scenarios.md §1, TH-0417). Transfusions: line 3 holds a haematocrit of 61,
  // a percentage in a fraction column, which the import refuses. Results: 04/12/2026 could be 4 December or
  // 12 April (both parts 12 or less), so it is refused until the day-first choice is made.
  const transfusionsCsv = 'Date given,Volume (mL),Hct,Units\n2026-11-24,560,0.6,2\n2026-11-25,550,61,2\n2026-11-27,540,0.58,2\n';
  const resultsCsv = 'Collected,Test,Result,Unit\n04/12/2026,ferritin,2650,ug/L\n2026-11-26,ALT,41,U/L\n';

  it('previews a CSV of transfusions and one of results, lists the refused rows, commits each and shows the record updated; axe finds nothing serious on the Import screen', async () => {
    // axe is injected into the page, which the page's Content-Security-Policy would refuse.
    const { page, errors, close } = await openPreviewPage({ bypassCSP: true });
    try {
      await page.locator('button[aria-label="Open TH-0417"]').click();
      await page.click('button:has-text("Import records from a file")');
      await expect.poll(() => page.locator('h1').textContent()).toBe('Import');
      expect(await page.locator('.caution').first().textContent()).toContain('for review by the prescriber');
      await page.setInputFiles('input[type="file"]', { name: 'unit-export.csv', mimeType: 'text/csv', buffer: Buffer.from(transfusionsCsv) });
      await expect.poll(() => page.locator('.import-adds').textContent()).toBe('Would add 2 transfusions.');
      expect(await page.locator('.import-refused tbody tr').count()).toBe(1);
      expect(await page.locator('.import-refused tbody tr').first().textContent()).toMatch(/^line 3.*haematocrit 61 looks like a percentage/);
      expect(await page.locator('select[aria-label=\'Column "Hct" is read as\']').inputValue()).toBe('haematocrit');
      await page.screenshot({ path: `${artifactsDir}import.png`, fullPage: true });
      const results = await new AxeBuilder({ page }).options({ resultTypes: ['violations'] }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
      expect(results.violations.filter((it) => it.impact === 'serious' || it.impact === 'critical').map((it) => `${it.id}: ${it.nodes.map((node) => node.target.join(' ')).join('; ')}`)).toEqual([]);
      await page.click('button:has-text("Add to TH-0417")');
      await expect.poll(() => page.locator('h1').textContent()).toBe('Record');
      expect(await page.locator('.message').textContent()).toContain('Added 2 transfusions from unit-export.csv to TH-0417.');
      const transfusionDates = await page.locator('.record-table').first().locator('input[aria-label^="Date, row"]').evaluateAll((inputs) => inputs.map((it) => (it as HTMLInputElement).value));
      expect(transfusionDates).toEqual(expect.arrayContaining(['2026-11-24', '2026-11-27']));
      expect(transfusionDates).not.toContain('2026-11-25');

      // The results file, by keyboard where a user would: the kind and the date order are radio choices.
      await page.click('button:has-text("Import records from a file")');
      await page.locator('input[name="import-kind"][value="csv-results"]').focus();
      await page.keyboard.press('Space');
      await page.setInputFiles('input[type="file"]', { name: 'lab-export.csv', mimeType: 'text/csv', buffer: Buffer.from(resultsCsv) });
      await expect.poll(() => page.locator('.import-refused tbody tr').first().textContent()).toMatch(/^line 2.*could be day-first or month-first/);
      await expect.poll(() => page.locator('.import-adds').textContent()).toBe('Would add 1 result.');
      await page.locator('label:has-text("day first") input').focus();
      await page.keyboard.press('Space');
      await expect.poll(() => page.locator('.import-adds').textContent()).toBe('Would add 2 results.');
      expect(await page.locator('.import-rows').textContent()).toContain('2026-12-04 ferritin 2650 ug/L');
      await page.locator('button:has-text("Add to TH-0417")').focus();
      await page.keyboard.press('Enter');
      await expect.poll(() => page.locator('h1').textContent()).toBe('Record');
      expect(await page.locator('.message').textContent()).toContain('Added 2 results from lab-export.csv to TH-0417.');
      const resultDates = await page.locator('.record-table').nth(1).locator('input[aria-label^="Date, row"]').evaluateAll((inputs) => inputs.map((it) => (it as HTMLInputElement).value));
      expect(resultDates).toEqual(expect.arrayContaining(['2026-12-04', '2026-11-26']));
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  }, 180_000);
});

describe('a long import through the preview server, run as a process of its own: the host\'s steps on screen, and Cancel', { retry: 2 }, () => {
  // An invented export of our own: 120,000 simple transfusions of 300 mL (haematocrit 0.6, one unit) on
  // the first 28 days of January to October 2026, every value within the case model's plausible ranges,
  // so every row reaches the case model's check. About 2.5 MB: half the contract's 5 MB limit.
  const longCsv = `Date given,Volume (mL),Hct,Units\n${Array.from({ length: 120_000 }, (_, index) => `2026-${String(1 + (index % 10)).padStart(2, '0')}-${String(1 + (index % 28)).padStart(2, '0')},300,0.6,1`).join('\n')}\n`;

  it('shows the host\'s step with a progress bar while the file is read and checked, and Cancel stops the commit before anything is saved', async () => {
    await onPreviewProcess(async (page, preview, errors) => {
      const { readdirSync } = await import('node:fs');
      const { join } = await import('node:path');
      const disk = () => ({ file: readFileSync(join(preview.workspaceFolder, 'th-0417.json'), 'utf8'), names: readdirSync(preview.workspaceFolder).sort() });
      await page.goto(preview.url);
      await page.locator('button[aria-label="Open TH-0417"]').click();
      await page.click('button:has-text("Import records from a file")');
      await expect.poll(() => page.locator('h1').textContent()).toBe('Import');
      // Every text the step line shows, recorded in the page as it changes.
      await page.evaluate(() => {
        const shown: string[] = [];
        (window as unknown as { shownSteps: string[] }).shownSteps = shown;
        new MutationObserver(() => {
          const text = document.querySelector('.import-step')?.textContent;
          if (text && shown[shown.length - 1] !== text) shown.push(text);
        }).observe(document.body, { subtree: true, childList: true, characterData: true });
      });
      const before = disk();
      await page.setInputFiles('input[type="file"]', { name: 'long-export.csv', mimeType: 'text/csv', buffer: Buffer.from(longCsv) });
      // The host's own words while it checks the long file: it counted the rows once it had read the file.
      const checking = page.locator('.import-progress', { hasText: 'Checking 120,000 rows against the case (step 3 of 3)' });
      await checking.waitFor({ timeout: 60_000 });
      expect(await checking.locator('progress[aria-label="Progress of reading the file"]').getAttribute('value')).toBe('2');
      await page.screenshot({ path: `${artifactsDir}import-progress.png` });
      await expect.poll(() => page.locator('.import-adds').textContent(), { timeout: 60_000 }).toBe('Would add 120,000 transfusions.');
      // The page's own label until the host reported a step.
      expect((await page.evaluate(() => (window as unknown as { shownSteps: string[] }).shownSteps))[0]).toBe('Reading long-export.csv…');

      await page.click('button:has-text("Add to TH-0417")');
      // A step the host reported for the commit before its save (four steps foreseen: opening, reading, checking, saving).
      await page.locator('.import-progress', { hasText: /^(Opening|Reading|Checking) .*\(step [1-3] of 4\)/ }).waitFor({ timeout: 60_000 });
      expect(await page.locator('progress[aria-label="Progress of adding the import"]').count()).toBe(1);
      await page.click('.import-progress button:has-text("Cancel")');
      await expect.poll(() => page.locator('.import-notice').textContent(), { timeout: 60_000 }).toBe('Import stopped: nothing from long-export.csv was added to TH-0417; the case is as it was.');
      await page.screenshot({ path: `${artifactsDir}import-stopped.png`, fullPage: true });
      // Read from disk, not through the host: the case file and the folder (no journal, no temporary file) as before.
      expect(disk()).toEqual(before);
      expect(await page.locator('.caution').first().textContent()).toContain('for review by the prescriber');
      expect(errors).toEqual([]);
    });
  }, 180_000);
});

describe('an export through the preview server, run as a process of its own: the host\'s steps on screen, and Cancel', { retry: 2 }, () => {
  it('shows the sheet\'s steps with a bar, and after Cancel says what became of the file, as the exports folder shows', async () => {
    await onPreviewProcess(async (page, preview, errors) => {
      const { existsSync, readdirSync } = await import('node:fs');
      const { join } = await import('node:path');
      const exported = () => (existsSync(join(preview.workspaceFolder, 'exports')) ? readdirSync(join(preview.workspaceFolder, 'exports')) : []);
      await page.goto(preview.url);
      await page.locator('button[aria-label="Open TH-0417"]').click();
      await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Sheet' }).click();
      // Every text the busy line shows, recorded in the page as it changes (a step may show for a moment only).
      await page.evaluate(() => {
        const shown: string[] = [];
        (window as unknown as { shownBusy: string[] }).shownBusy = shown;
        new MutationObserver(() => {
          const text = document.querySelector('.busy')?.textContent?.trim();
          if (text && shown[shown.length - 1] !== text) shown.push(text);
        }).observe(document.body, { subtree: true, childList: true, characterData: true });
      });
      const status = page.locator('.toolbar [role="status"]');
      await page.click('button:has-text("Export the sheet as PDF")');
      await expect.poll(() => status.textContent(), { timeout: 60_000 }).toMatch(/^Review sheet written to .*th-0417-sheet-2026-11-20\.pdf$/);
      const shown = await page.evaluate(() => (window as unknown as { shownBusy: string[] }).shownBusy);
      // The page's own label first, then a step the host reported (four foreseen: opening, reviewing, laying out, writing).
      expect(shown[0]).toBe('Writing the review sheet… Cancel');
      expect(shown.some((text) => /^Writing the review sheet: .+ \(step [1-4] of 4\) Cancel$/.test(text)), shown.join(' | ')).toBe(true);
      expect(exported()).toEqual(['th-0417-sheet-2026-11-20.pdf']);

      // Again, and Cancel as soon as the busy line shows: the host is asked to stop before it writes the file.
      await page.click('button:has-text("Export the sheet as PDF")');
      await page.locator('.busy progress[aria-label="Writing the review sheet"]').waitFor();
      await page.screenshot({ path: `${artifactsDir}export-progress.png` });
      await page.locator('.busy button:has-text("Cancel")').click();
      const outcome = page.locator('.toolbar [role="status"]', { hasText: /Export stopped|Too late to stop/ });
      await outcome.waitFor({ timeout: 60_000 });
      // The screen's words and the folder agree: stopped before the writing, no new file; too late, the second file is there.
      const text = (await outcome.textContent()) ?? '';
      expect(exported().sort()).toEqual(text.startsWith('Export stopped') ? ['th-0417-sheet-2026-11-20.pdf'] : ['th-0417-sheet-2026-11-20-2.pdf', 'th-0417-sheet-2026-11-20.pdf']);
      await page.screenshot({ path: `${artifactsDir}export-stopped.png` });
      expect(errors).toEqual([]);
    });
  }, 180_000);
});

describe('kept drafts', { retry: 2 }, () => {
  it('keeps a new case being typed and a record entry core refuses across a reload, says so, and discards on request', async () => {
    const { context, page, errors } = await openPage({ 'th-0417.json': demo });
    await page.fill('label:has-text("Label") input', 'ZZ-0002');
    await page.fill('label:has-text("Weight, kg") input', '38');
    await page.reload();
    await page.locator('table.cases').waitFor();
    await expect.poll(() => page.locator('.new-case .restored-notice').textContent()).toContain('Unsaved entry restored');
    expect(await page.locator('label:has-text("Label") input').inputValue()).toBe('ZZ-0002');
    expect(await page.locator('label:has-text("Weight, kg") input').inputValue()).toBe('38');
    await page.screenshot({ path: `${artifactsDir}kept-new-case.png` });
    await page.click('.new-case button:has-text("Discard it")');
    expect(await page.locator('label:has-text("Label") input').inputValue()).toBe('');
    expect(await page.locator('.new-case .restored-notice').count()).toBe(0);

    // A haematocrit typed as a percentage: core refuses it, so it is not saved; the reload keeps it.
    await page.click('button[aria-label="Open TH-0417"]');
    // The latest transfusion (the table shows the latest rows).
    const cell = `input[aria-label="${await page.locator('.record-table').first().locator('input[aria-label^="Unit haematocrit, row"]').last().getAttribute('aria-label')}"]`;
    const stored = await page.locator(cell).inputValue();
    await page.fill(cell, '62');
    await expect.poll(() => savedState(page).textContent()).toContain('Not saved');
    await page.reload();
    await page.locator('button[aria-label="Open TH-0417"]').click();
    await expect.poll(() => page.locator('.restored-notice').textContent()).toContain('Unsaved entry restored');
    expect(await page.locator(cell).inputValue()).toBe('62');
    await page.screenshot({ path: `${artifactsDir}kept-record.png` });
    await page.click('.restored-notice button:has-text("Discard it")');
    await expect.poll(() => page.locator(cell).inputValue()).toBe(stored);
    await expect.poll(() => savedState(page).textContent()).toBe('All changes saved');
    await page.reload();
    await page.locator('button[aria-label="Open TH-0417"]').click();
    expect(await page.locator('.restored-notice').count()).toBe(0);
    expect(errors).toEqual([]);
    await context.close();
  }, 120_000);
});
