/**
 * `npm run -s puzzles -- --check`: verifies every shipped puzzle and prints
 * `{ "count": N, "levels": { "1": n, ... }, "failures": [{ slug, problems }] }`; exit 0 only when all pass.
 */
import { SHIPPED_PUZZLES, checkPuzzle } from '../../shared/training/index';

const args = process.argv.slice(2);
if (!args.includes('--check')) {
  console.error('Usage: npm run -s puzzles -- --check');
  process.exit(2);
}

const levels: Record<string, number> = {};
const failures: { slug: string; problems: string[] }[] = [];
for (const puzzle of SHIPPED_PUZZLES) {
  levels[puzzle.level] = (levels[puzzle.level] ?? 0) + 1;
  const result = checkPuzzle(puzzle);
  if (!result.ok) failures.push({ slug: puzzle.slug, problems: result.problems });
}
console.log(JSON.stringify({ count: SHIPPED_PUZZLES.length, levels, failures }, null, 2));
process.exit(failures.length ? 1 : 0);
