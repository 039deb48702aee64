/**
 * Builds the client with Vite when dist/index.html is missing or older than any client source, so
 * `npm start` works on a fresh clone. Prints what it decided.
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const builtIndex = join(root, 'dist', 'index.html');
const SOURCES = ['src', 'shared', 'index.html', 'vite.config.ts', 'package.json'];

/** Newest modification time under a file or folder, in ms. */
function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

function staleReason(): string | null {
  if (!existsSync(builtIndex)) return 'dist/index.html is missing';
  const builtAt = statSync(builtIndex).mtimeMs;
  for (const source of SOURCES) {
    if (newestMtime(join(root, source)) > builtAt) return `${source} changed since the last build`;
  }
  return null;
}

const reason = staleReason();
if (reason === null) {
  console.log('Client build is up to date (dist/).');
} else {
  console.log(`Building the client: ${reason}…`);
  const { build } = await import('vite');
  try {
    await build({ root, configFile: join(root, 'vite.config.ts'), logLevel: 'warn' });
    console.log('Client built into dist/.');
  } catch (err) {
    const first = err instanceof Error ? err.message.split('\n').slice(0, 12).join('\n') : String(err);
    console.error(`\nThe client build failed, so the server was not started:\n${first}`);
    process.exit(1);
  }
}
