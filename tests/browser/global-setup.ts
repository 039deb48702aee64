/**
 * Starts the real server (the same entry point as `npm start`) on a free port with a fresh database, for the
 * browser journeys. When Chromium is missing the journeys are skipped with a message saying how to install it.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    chromiumPath: string;
  }
}

export const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export async function waitForHealth(url: string, child: ChildProcess, output: () => string): Promise<void> {
  const deadline = Date.now() + 90_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`The server exited early (${child.exitCode}):\n${output()}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The server did not answer /api/health within 90 s:\n${output()}`);
}

/** Builds the client into `outDir` with the project's Vite config. */
export function buildClient(outDir: string): void {
  const build = spawnSync(
    'npx',
    ['vite', 'build', '--logLevel', 'warn', '--outDir', outDir, '--emptyOutDir'],
    {
      stdio: 'inherit',
    },
  );
  if (build.status !== 0) throw new Error('Building the client failed');
}

/** The real server (the entry point of `npm start`) on a free port, with a fresh database, serving `clientDir`. */
export async function startServer(
  clientDir: string,
  databaseFile: string,
  env: Record<string, string> = {},
): Promise<{ baseUrl: string; child: ChildProcess }> {
  const port = await freePort();
  const baseUrl = `http://localhost:${port}`;
  let log = '';
  const child = spawn('npx', ['tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      PORT: String(port),
      DATABASE_FILE: databaseFile,
      CLIENT_DIR: clientDir,
      LOG_LEVEL: 'warn',
      RATE_LIMIT_MAX: '1000',
      NODE_ENV: 'test',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  child.stdout?.on('data', (d) => (log += d));
  child.stderr?.on('data', (d) => (log += d));
  await waitForHealth(baseUrl, child, () => log);
  return { baseUrl, child };
}

export async function stopServer(child: ChildProcess): Promise<void> {
  if (!child.pid || child.exitCode !== null) return;
  try {
    process.kill(-child.pid, 'SIGTERM');
  } catch {
    // already gone
  }
  await new Promise((r) => setTimeout(r, 500));
}

export default async function setup(project: TestProject) {
  if (!existsSync(chromiumPath)) {
    console.warn(
      `\n[browser] SKIPPED: Chromium not found at ${chromiumPath}. Install it with ` +
        '`apt-get update && apt-get install -y chromium`, or set CHROMIUM_PATH.\n',
    );
    project.provide('baseUrl', '');
    project.provide('chromiumPath', '');
    return;
  }

  // A private build, so nothing that rebuilds dist/ meanwhile can pull the page's chunks away mid-run.
  const dir = mkdtempSync(join(tmpdir(), 'leadbench-browser-'));
  const clientDir = join(dir, 'client');
  buildClient(clientDir);

  const { baseUrl, child } = await startServer(clientDir, join(dir, 'browser.sqlite'));

  project.provide('baseUrl', baseUrl);
  project.provide('chromiumPath', chromiumPath);

  return async () => {
    await stopServer(child);
    rmSync(dir, { recursive: true, force: true });
  };
}
