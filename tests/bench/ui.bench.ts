/**
 * Client benchmark (npm run bench:ui): not a test. Builds the client and a bare one-button Vue + naive-ui page
 * (tests/bench/bare/) with the same Vite, loads them in Chromium and prints:
 *
 * - transferred JS+CSS for the landing route and the Bench route, as gzip bytes of every script and style sheet
 *   the page requested until the network fell quiet, and their ratio to the bare page's;
 * - key press → frame time on a 40-set plan: a line key is pressed on a set between frames, and the time is taken
 *   for the work up to a painted frame: the click's handler, store, engine, Vue patch, style and layout, plus the next
 *   frame's paint and commit, without the idle wait for the display's refresh (printed beside it). Fitted in view,
 *   40 sets are drawn at names only (no keys), so the drawing is first zoomed in with its own Zoom in button
 *   until the sets draw their keys, as a user would to operate them.
 *
 * Targets: landing ≤ 1.3× the bare page, Bench ≤ 3×, key press p95 ≤ 16.7 ms (one frame at 60 Hz).
 */
import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createServer as createHttpServer, type Server } from 'node:http';
import { loadavg, tmpdir } from 'node:os';
import { extname, join, normalize } from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { build } from 'vite';
import vue from '@vitejs/plugin-vue';
import { buildClient, freePort, startServer, stopServer } from '../browser/global-setup';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, openBrowser } from '../support/browser';
import { largePlan } from './bench-plans';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const PRESSES = Number(process.env.UI_BENCH_PRESSES ?? 300);
const TARGETS = { landing: 1.3, bench: 3, pressP95: 16.7 } as const;

interface Transfer {
  files: { url: string; gzip: number }[];
  gzip: number;
}

async function buildBare(outDir: string): Promise<void> {
  await build({
    root: join(process.cwd(), 'tests', 'bench', 'bare'),
    configFile: false,
    logLevel: 'warn',
    plugins: [vue()],
    build: { outDir, emptyOutDir: true },
  });
}

const TYPES: Record<string, string> = {
  '.html': 'text/html',
  '.js': 'text/javascript',
  '.css': 'text/css',
  '.svg': 'image/svg+xml',
};

/** A plain static server for the bare page (no compression: the bench gzips each file itself). */
function serveStatic(dir: string, port: number): Promise<Server> {
  const server = createHttpServer((req, res) => {
    const path = normalize(decodeURIComponent((req.url ?? '/').split('?')[0]!)).replace(/^(\.\.[/\\])+/, '');
    let file = join(dir, path);
    if (!existsSync(file) || statSync(file).isDirectory()) file = join(dir, 'index.html');
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' });
    res.end(readFileSync(file));
  });
  return new Promise((resolve) => server.listen(port, '127.0.0.1', () => resolve(server)));
}

/** Loads `url` and sums the gzip size of every script and style sheet it requested until the network was idle. */
async function transferOf(page: Page, url: string, ready: () => Promise<unknown>): Promise<Transfer> {
  const pending: Promise<{ url: string; gzip: number } | null>[] = [];
  const onResponse = (response: import('playwright-core').Response) => {
    const type = response.request().resourceType();
    const path = new URL(response.url()).pathname;
    if (type !== 'script' && type !== 'stylesheet' && !/\.(m?js|css)$/.test(path)) return;
    pending.push(
      response
        .body()
        .then((body) => ({ url: path, gzip: gzipSync(body, { level: 9 }).length }))
        .catch(() => null),
    );
  };
  page.on('response', onResponse);
  await page.goto(url, { waitUntil: 'load' });
  await ready();
  await page.waitForLoadState('networkidle');
  page.off('response', onResponse);
  const seen = new Map<string, number>();
  for (const file of await Promise.all(pending)) if (file) seen.set(file.url, file.gzip);
  const files = [...seen].map(([u, gzip]) => ({ url: u, gzip })).sort((a, b) => b.gzip - a.gzip);
  return { files, gzip: files.reduce((sum, f) => sum + f.gzip, 0) };
}

/**
 * Presses line keys on the sets in turn, in the page, and times each press. A click is dispatched as a task of its
 * own (not inside a frame's rendering steps), so each press starts from an idle page between frames:
 * - ready: the click's handler, the store and engine, Vue's patch, then style and layout forced at once;
 * - work: ready plus the next frame's own rendering (from its animation-frame callback to the first task after it:
 *   paint, layers and commit), without the idle wait for the display's refresh in between;
 * - painted: from the click to the end of that frame, the wait included.
 * The in-page code is a string: the TypeScript runner would otherwise add helpers the page does not have.
 */
async function pressTimes(page: Page, presses: number): Promise<PressTimes> {
  const script = `(async (count) => {
    const keys = [...document.querySelectorAll('button[data-testid^="key-"][aria-pressed]')];
    if (keys.length === 0) throw new Error('No line keys on the Bench');
    const task = () => new Promise((resolve) => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => resolve();
      channel.port2.postMessage(0);
    });
    const frame = () => new Promise((resolve) => requestAnimationFrame(() => resolve()));
    const ready = [];
    const work = [];
    const painted = [];
    for (let i = 0; i < count; i++) {
      // Spread the presses over many sets and keys; every press changes the simulation state.
      const key = keys[(i * 7) % keys.length];
      await frame();
      await frame();
      await task(); // out of the rendering steps: between frames, as a user's click arrives
      const start = performance.now();
      key.click();
      await task(); // the store's and Vue's queued work has run
      document.documentElement.getBoundingClientRect(); // style and layout of the new frame
      void document.body.offsetHeight;
      const readyAt = performance.now();
      const rendering = await new Promise((resolve) =>
        requestAnimationFrame(() => {
          const from = performance.now();
          task().then(() => resolve([from, performance.now()]));
        }),
      );
      ready.push(readyAt - start);
      work.push(readyAt - start + (rendering[1] - rendering[0]));
      painted.push(rendering[1] - start);
    }
    return { ready, work, painted };
  })(${presses})`;
  return page.evaluate(script) as Promise<PressTimes>;
}

interface PressTimes {
  ready: number[];
  work: number[];
  painted: number[];
}

/**
 * With UI_BENCH_TRACE=<file>: a Chromium performance trace of twenty more presses, written to the file, and a summary
 * of its main-thread rendering events (count, total and largest time; for layout, how many objects it laid out).
 */
async function tracePresses(page: Page, file: string): Promise<void> {
  const cdp = await page.context().newCDPSession(page);
  const events: TraceEvent[] = [];
  cdp.on('Tracing.dataCollected', ({ value }) => events.push(...(value as unknown as TraceEvent[])));
  const done = new Promise<void>((resolve) => cdp.once('Tracing.tracingComplete', () => resolve()));
  await cdp.send('Tracing.start', { categories: 'devtools.timeline,blink', transferMode: 'ReportEvents' });
  await pressTimes(page, 20);
  await cdp.send('Tracing.end');
  await done;
  writeFileSync(file, JSON.stringify({ traceEvents: events }));
  const byName = new Map<string, { count: number; total: number; max: number; objects: number }>();
  for (const e of events) {
    if (e.ph !== 'X' || !e.dur) continue;
    const row = byName.get(e.name) ?? { count: 0, total: 0, max: 0, objects: 0 };
    row.count++;
    row.total += e.dur / 1000;
    row.max = Math.max(row.max, e.dur / 1000);
    row.objects = Math.max(
      row.objects,
      Number(e.args?.endData?.layoutObjects ?? e.args?.beginData?.dirtyObjects ?? 0),
    );
    byName.set(e.name, row);
  }
  console.log(`\nTrace of 20 presses written to ${file}; main-thread events by total time:`);
  for (const [name, r] of [...byName].sort((a, b) => b[1].total - a[1].total).slice(0, 15))
    console.log(
      `  ${name.padEnd(28)} ${String(r.count).padStart(5)}× ${r.total.toFixed(1).padStart(8)} ms, largest ` +
        `${r.max.toFixed(1)} ms${r.objects ? `, up to ${r.objects} objects` : ''}`,
    );
}

interface TraceEvent {
  name: string;
  ph: string;
  dur?: number;
  args?: { beginData?: { dirtyObjects?: number }; endData?: { layoutObjects?: number } };
}

/** Zooms the drawing in, one press of its Zoom in button at a time, until the sets draw their line keys. */
async function zoomUntilKeysDrawn(page: Page): Promise<number> {
  const lineKeys = page.locator('button[data-testid^="key-"][aria-pressed]');
  const zoomIn = page.getByRole('button', { name: 'Zoom in' });
  for (let presses = 0; presses <= 20; presses++) {
    if ((await lineKeys.count()) > 0) return presses;
    await zoomIn.click();
    await page.waitForTimeout(200);
  }
  throw new Error('The sets drew no line keys after 20 presses of Zoom in');
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;
const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(s.length * p))]!;
};

async function main() {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium not found at ${CHROMIUM}; set CHROMIUM_PATH`);
  const dir = mkdtempSync(join(tmpdir(), 'leadbench-ui-bench-'));
  const clientDir = join(dir, 'client');
  const bareDir = join(dir, 'bare');
  let app: ChildProcess | undefined;
  let bareServer: Server | undefined;
  const browser = { close: async () => {} };
  try {
    console.log('Building the client and the bare page …');
    buildClient(clientDir);
    await buildBare(bareDir);
    const started = await startServer(clientDir, join(dir, 'ui-bench.sqlite'));
    app = started.child;
    const { baseUrl } = started;
    const barePort = await freePort();
    bareServer = await serveStatic(bareDir, barePort);

    const session = await openBrowser(CHROMIUM, { width: 1440, height: 900 });
    browser.close = session.close;
    const { page, context } = session;

    const bare = await transferOf(page, `http://127.0.0.1:${barePort}/`, () =>
      page.getByRole('button', { name: 'Press' }).waitFor(),
    );
    const landing = await transferOf(page, `${baseUrl}/`, () =>
      page.getByRole('heading', { level: 1 }).waitFor(),
    );

    // A signed-in restorer with the 40-set plan; the Bench route is then loaded afresh.
    const signIn = await context.request.post(`${baseUrl}/api/auth/sign-in`, {
      data: { email: DEMO_ACCOUNTS.restorer, password: DEMO_PASSWORD },
    });
    if (!signIn.ok()) throw new Error(`Sign-in failed: ${signIn.status()} ${await signIn.text()}`);
    const plan = largePlan(10);
    const created = await context.request.post(`${baseUrl}/api/plans`, { data: { document: plan } });
    if (!created.ok()) throw new Error(`Saving the plan failed: ${created.status()} ${await created.text()}`);
    const { id } = (await created.json()) as { id: string };
    await page.goto('about:blank');
    await page.evaluate(() => localStorage.clear()).catch(() => undefined);
    const lineKeys = page.locator('button[data-testid^="key-"][aria-pressed]');
    const bench = await transferOf(page, `${baseUrl}/plans/${id}`, async () => {
      await page.locator('[data-testid^="node-"]').first().waitFor({ timeout: 60_000 });
    });
    const zooms = await zoomUntilKeysDrawn(page);
    const keyCount = await lineKeys.count();
    // Warm up (first evaluations compile the engine's paths), then measure.
    await pressTimes(page, 20);
    const times = await pressTimes(page, PRESSES);
    if (process.env.UI_BENCH_TRACE) await tracePresses(page, process.env.UI_BENCH_TRACE);

    const ratio = { landing: landing.gzip / bare.gzip, bench: bench.gzip / bare.gzip };
    const press = {
      p50: pct(times.work, 0.5),
      p95: pct(times.work, 0.95),
      readyP50: pct(times.ready, 0.5),
      readyP95: pct(times.ready, 0.95),
      paintP50: pct(times.painted, 0.5),
      paintP95: pct(times.painted, 0.95),
    };

    console.log(`\nTransferred JS+CSS (gzip, level 9), load average ${loadavg()[0]!.toFixed(2)}`);
    const row = (name: string, t: Transfer, r?: number, target?: number) =>
      console.log(
        `  ${name.padEnd(16)} ${kB(t.gzip).padStart(9)}  ${String(t.files.length).padStart(3)} files` +
          (r === undefined
            ? ''
            : `  ${r.toFixed(2)}× bare (target ≤ ${target}×) ${r <= target! ? 'PASS' : 'MISS'}`),
      );
    row('bare page', bare);
    row('landing route', landing, ratio.landing, TARGETS.landing);
    row('Bench route', bench, ratio.bench, TARGETS.bench);
    for (const [name, t] of [
      ['landing', landing],
      ['Bench', bench],
    ] as const) {
      console.log(
        `  largest on ${name}: ${t.files
          .slice(0, Number(process.env.UI_BENCH_LIST ?? 5))
          .map((f) => `${f.url.replace('/assets/', '')} ${kB(f.gzip)}`)
          .join(', ')}`,
      );
    }
    console.log(
      `\nKey press → frame (click to ready, plus the next frame's paint and commit), ${plan.sets.length}-set plan, ${keyCount} line keys (after ${zooms} presses of Zoom in), ${times.ready.length} presses`,
    );
    console.log(
      `  p50 ${press.p50.toFixed(1)} ms, p95 ${press.p95.toFixed(1)} ms (target p95 ≤ ${TARGETS.pressP95} ms) ${press.p95 <= TARGETS.pressP95 ? 'PASS' : 'MISS'}`,
    );
    console.log(
      `  of which to the frame ready to paint (handler, Vue, style, layout): p50 ${press.readyP50.toFixed(1)} ms, p95 ${press.readyP95.toFixed(1)} ms`,
    );
    console.log(
      `  to the next painted frame (includes the wait for the display refresh): p50 ${press.paintP50.toFixed(1)} ms, p95 ${press.paintP95.toFixed(1)} ms`,
    );

    const misses: string[] = [];
    if (ratio.landing > TARGETS.landing)
      misses.push(`landing ${ratio.landing.toFixed(2)}× > ${TARGETS.landing}×`);
    if (ratio.bench > TARGETS.bench) misses.push(`Bench ${ratio.bench.toFixed(2)}× > ${TARGETS.bench}×`);
    if (press.p95 > TARGETS.pressP95)
      misses.push(`key press p95 ${press.p95.toFixed(1)} ms > ${TARGETS.pressP95} ms`);
    console.log(misses.length ? `\nShort of target: ${misses.join('; ')}` : '\nAll targets met');
  } finally {
    await browser.close();
    bareServer?.close();
    if (app) await stopServer(app);
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
