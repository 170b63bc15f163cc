// Loads one treegate HTML report in Debian's chromium (through playwright-core) from file://
// and checks it as a reader would use it. Prints one line per check; exits 1 on any failure.
//
//   node check_report.mjs --report R.html --results R.jsonl --summary S.json --out DIR --name N
//                         [--expect-text TEXT]... [--chromium /usr/bin/chromium]
//
// Checks: no console errors or page errors; no request other than the report file itself;
// one case row per case of the summary JSON ("cases"); expanding cases shows their SVG trees,
// each with as many words as the results file says the sentence has; sorting a table by
// clicking its heading orders the rows; the word filter shows the cases whose words contain
// the query; hostile text (--expect-text) appears as text and adds no element. Screenshots
// of the page and of an expanded case go to DIR.
import { chromium } from 'playwright-core';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

function parseArgs(argv) {
  const args = { expectText: [], chromium: '/usr/bin/chromium' };
  for (let i = 0; i < argv.length; i += 2) {
    const key = argv[i].replace(/^--/, '');
    const value = argv[i + 1];
    if (key === 'expect-text') args.expectText.push(value);
    else args[key] = value;
  }
  for (const k of ['report', 'results', 'summary', 'out', 'name']) {
    if (!args[k]) throw new Error(`missing --${k}`);
  }
  return args;
}

const args = parseArgs(process.argv.slice(2));
let failures = 0;
let passes = 0;
function check(ok, what) {
  if (ok) passes++;
  else failures++;
  console.log(`${ok ? 'ok  ' : 'FAIL'} ${args.name}: ${what}`);
}

// The results file: line 1 is the header, then one case per line.
const caseWords = new Map();
const lines = fs.readFileSync(args.results, 'utf8').split('\n').filter((l) => l.trim());
for (const line of lines.slice(1)) {
  const c = JSON.parse(line);
  caseWords.set(JSON.stringify([c.suite, c.id]), c.words);
}
const summary = JSON.parse(fs.readFileSync(args.summary, 'utf8'));

const reportUrl = pathToFileURL(path.resolve(args.report)).href;
const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'treegate-chromium-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: args.chromium,
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking',
    '--disable-component-update', '--disable-sync'],
  viewport: { width: 1280, height: 900 },
});
try {
  const page = context.pages()[0] || await context.newPage();
  const consoleErrors = [];
  const requests = [];
  page.on('console', (m) => { if (m.type() === 'error') consoleErrors.push(m.text()); });
  page.on('pageerror', (e) => consoleErrors.push(String(e)));
  page.on('request', (r) => requests.push(r.url()));
  await page.goto(reportUrl, { waitUntil: 'load' });

  fs.mkdirSync(args.out, { recursive: true });
  await page.screenshot({ path: path.join(args.out, `${args.name}-page.png`), fullPage: false });
  const rows = await page.locator('#case-list > details.case').count();
  check(rows === summary.cases, `case rows ${rows} = summary JSON cases ${summary.cases}`);
  const shownText = await page.locator('#shown-count').textContent();
  check(shownText === `${rows} of ${rows} cases shown`, `counter says "${shownText}"`);

  // Every row names a case of the results file.
  const ids = await page.$$eval('#case-list > details.case',
    (els) => els.map((e) => [e.dataset.suite, e.dataset.id]));
  const unknown = ids.filter((k) => !caseWords.has(JSON.stringify(k)));
  check(unknown.length === 0, `every row is a case of the results file (${unknown.length} unknown)`);

  // Expand the first cases and the longest sentence; count the words in each drawn tree.
  const order = ids.map((k, i) => [i, (caseWords.get(JSON.stringify(k)) || []).length]);
  const longest = order.reduce((a, b) => (b[1] > a[1] ? b : a), [0, -1])[0];
  const pick = [...new Set([...order.slice(0, 6).map((x) => x[0]), longest])];
  let treesChecked = 0;
  for (const i of pick) {
    const row = page.locator('#case-list > details.case').nth(i);
    await row.locator('summary').click();
    const open = await row.evaluate((e) => e.open);
    const words = caseWords.get(JSON.stringify(ids[i])) || [];
    const trees = row.locator('svg.tree:not([aria-hidden])');
    const n = await trees.count();
    const expected = await row.locator('figure.panel').count();
    const leafCounts = await trees.evaluateAll((svgs) => svgs.map((s) => s.querySelectorAll('text.leaf').length));
    const visible = n > 0 && await trees.first().isVisible();
    const label = `${ids[i][0]}/${ids[i][1]}`;
    check(open && n >= 2 && n === expected && visible,
      `${label}: opening shows ${n} SVG trees (panels: ${expected})`);
    check(leafCounts.every((c) => c === words.length),
      `${label}: words per tree ${JSON.stringify(leafCounts)} = sentence length ${words.length}`);
    treesChecked += n;
  }
  check(treesChecked > 0, `${treesChecked} trees checked`);

  // Screenshots: the longest case, and the first opened case that is not a pass.
  const shoot = async (i, file) => {
    const row = page.locator('#case-list > details.case').nth(i);
    await row.scrollIntoViewIfNeeded();
    await row.screenshot({ path: path.join(args.out, `${args.name}-${file}.png`) });
  };
  await shoot(longest, 'longest-case');
  const statuses = await page.$$eval('#case-list > details.case', (els) => els.map((e) => e.dataset.status));
  const failing = pick.find((i) => statuses[i] !== 'pass');
  if (failing !== undefined) await shoot(failing, 'failing-case');

  // Sorting: click the first heading of the suite table twice; names go up, then down.
  const table = page.locator('#table-suites');
  if (await table.count()) {
    const names = () => table.locator('tbody tr td:first-child').allTextContents();
    await table.locator('thead th').first().locator('button').click();
    const up = await names();
    await table.locator('thead th').first().locator('button').click();
    const down = await names();
    const sorted = [...up].sort((a, b) => a.localeCompare(b));
    check(JSON.stringify(up) === JSON.stringify(sorted) &&
      JSON.stringify(down) === JSON.stringify([...sorted].reverse()), 'suite table sorts both ways');
  }

  // The word filter: a word of the first case; the rows shown are those whose words contain it.
  const firstWords = caseWords.get(JSON.stringify(ids[0])) || [];
  const query = firstWords.find((w) => /^[A-Za-z]{4,}$/.test(w)) || firstWords[0];
  if (query) {
    await page.fill('#filter-text', query);
    const shown = await page.locator('#case-list > details.case:not([hidden])').count();
    const q = query.toLowerCase();
    const expected = ids.filter((k) => (caseWords.get(JSON.stringify(k)) || []).join(' ')
      .toLowerCase().includes(q) || k[1].toLowerCase().includes(q)).length;
    check(shown === expected, `filter "${query}" shows ${shown} rows, expected ${expected}`);
    await page.fill('#filter-text', '');
  }

  // Hostile text shows as text; the page has exactly its own one script element.
  const bodyText = await page.evaluate(() => document.body.innerText);
  for (const t of args.expectText) check(bodyText.includes(t), `text ${JSON.stringify(t)} shown as text`);
  const scripts = await page.locator('script').count();
  check(scripts === 1, `one script element (found ${scripts})`);
  const injected = await page.locator('main img, main iframe, main object, main embed').count();
  check(injected === 0, `no injected elements (found ${injected})`);

  check(consoleErrors.length === 0, `no console errors ${JSON.stringify(consoleErrors.slice(0, 3))}`);
  const foreign = requests.filter((u) => u !== reportUrl && !u.startsWith('data:'));
  check(foreign.length === 0, `no requests besides the file (${JSON.stringify(foreign.slice(0, 3))})`);
} finally {
  await context.close();
  fs.rmSync(profile, { recursive: true, force: true });
}
console.log(`${args.name}: ${passes} passed, ${failures} failed`);
process.exit(failures ? 1 : 0);
