// End-to-end: the fixture report opens in a real browser (Debian chromium) without errors,
// shows its charts, prints, and is saved as a screenshot for people to look at.
// common practice: headless browser check of a self-contained HTML file.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { writeOutputs } from '../../src/report/writeOutputs.js';
import { SECTION_TITLES, sectionOrder } from '../../src/report/reportDocument.js';
import { overlappingLabels, type TextBox } from '../support/svgTextBoxes.js';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import { demoReportInput, demoResultJson } from './fixture.js';

const CHROMIUM = '/usr/bin/chromium';
// CI (CI=true) installs chromium and must run this test; a developer machine without it skips it, loudly.
const NO_BROWSER_HERE = !process.env.CI && !existsSync('/usr/bin/chromium');
if (NO_BROWSER_HERE) console.warn('browser test skipped: /usr/bin/chromium is missing (apt-get install -y --no-install-recommends chromium)');
const SKIP = process.env.STANCHION_SKIP_BROWSER === '1' || NO_BROWSER_HERE;
const HERE = dirname(fileURLToPath(import.meta.url));
const SCREENSHOT = resolve(HERE, '../../reports/screenshots/report-fixture.png');
// evaluated in the page (the project's TypeScript has no DOM types)
const TOC_DISPLAY = "getComputedStyle(document.querySelector('nav.toc')).display";
// the boxes the browser drew for every visible text of every chart
const CHART_TEXT_BOXES = `[...document.querySelectorAll('figure.chart')].map((f) => ({
  name: f.dataset.chart,
  boxes: [...f.querySelectorAll('svg text')]
    .filter((t) => t.textContent.trim() !== '' && t.getAttribute('opacity') !== '0')
    .map((t) => { const r = t.getBoundingClientRect(); return { text: t.textContent, x0: r.left, y0: r.top, x1: r.right, y1: r.bottom }; }),
}))`;
const FIRST_SECTION = "(() => { const s = document.querySelector('main section'); return { id: s.id, heading: s.querySelector('h2').textContent, box: s.querySelector('.result-box .headline')?.textContent ?? null }; })()";
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

describe.skipIf(SKIP)('report.html in Chromium', () => {
  // a sweep report: it holds every section and every chart the fixture has data for
  const input = { ...demoReportInput(), subject: 'sweep' as const };
  const problems: string[] = [];
  let root = '';
  let browser: Browser | undefined;
  let page: Page;

  beforeAll(async () => {
    if (!existsSync(CHROMIUM)) {
      throw new Error(
        `Chromium not found at ${CHROMIUM}. Install it with 'apt-get install -y --no-install-recommends chromium', or set STANCHION_SKIP_BROWSER=1 to skip the browser test.`,
      );
    }
    root = mkdtempSync(join(tmpdir(), 'stanchion-report-browser-'));
    await writeOutputs(join(root, 'report'), input, demoResultJson(input), { png: false });
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS });
    page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`console ${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
    page.on('request', (r) => {
      if (!r.url().startsWith('file:') && !r.url().startsWith('data:')) problems.push(`external request: ${r.url()}`);
    });
    await page.goto(pathToFileURL(join(root, 'report', 'report.html')).href, { waitUntil: 'load' });
  });

  afterAll(async () => {
    await browser?.close();
    if (root) rmSync(root, { recursive: true, force: true });
  });

  it('loads without console errors or network requests', () => {
    expect(problems).toEqual([]);
  });

  it('shows every section and every chart with its title', async () => {
    const headings = await page.locator('h2').allTextContents();
    expect(headings).toEqual(sectionOrder('sweep').map((id) => SECTION_TITLES[id]));
    const charts = buildCharts(input, 'si');
    expect(await page.locator('figure.chart svg').count()).toBe(charts.length);
    for (const c of charts) {
      const fig = page.locator(`figure[data-chart="${c.name}"]`);
      expect(await fig.locator('svg text', { hasText: c.title }).count()).toBeGreaterThan(0);
      const box = await fig.locator('svg').boundingBox();
      expect(box && box.width > 200 && box.height > 100).toBe(true);
    }
    expect(await page.locator('figure.sketch svg').count()).toBe(1);
  });

  it('opens with the result box as its first section', async () => {
    const first = await page.evaluate<{ id: string; heading: string; box: string | null }>(FIRST_SECTION);
    expect(first.id).toBe('result');
    expect(first.heading).toBe(SECTION_TITLES.result);
    expect(first.box).toMatch(/^\d+ of \d+ cases meet the target/); // a sweep report leads with its count
  });

  it('draws no two text labels of any chart on top of each other', async () => {
    const charts = await page.evaluate<{ name: string; boxes: TextBox[] }[]>(CHART_TEXT_BOXES);
    expect(charts.length).toBe(buildCharts(input, 'si').length);
    for (const c of charts) {
      expect(c.boxes.length).toBeGreaterThan(3);
      const clashes = overlappingLabels(c.boxes, 1.5).map(([a, b]) => `${c.name}: "${a.text}" / "${b.text}"`);
      expect(clashes).toEqual([]);
    }
  });

  it('prints: the print stylesheet applies and A4 and Letter PDFs are produced', async () => {
    await page.emulateMedia({ media: 'print' });
    expect(await page.evaluate<string>(TOC_DISPLAY)).toBe('none');
    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await page.pdf({ format, printBackground: true });
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page\b/g) ?? []).length;
      expect(pages).toBeGreaterThan(3);
    }
    await page.emulateMedia({ media: 'screen' });
    expect(await page.evaluate<string>(TOC_DISPLAY)).not.toBe('none');
  });

  it('saves a screenshot', async () => {
    mkdirSync(dirname(SCREENSHOT), { recursive: true });
    const png = await page.screenshot({ path: SCREENSHOT, fullPage: true });
    expect(png.length).toBeGreaterThan(50_000);
    expect(existsSync(SCREENSHOT)).toBe(true);
  });
});
