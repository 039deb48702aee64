/** Problems with an input document, each with the exact path of the offending value, e.g. "cables[0].to.port". */
import type { z } from 'zod';

export interface Issue {
  path: string;
  message: string;
}

/** A path as written in messages: names joined by dots, array indexes in brackets ("sets[1].template"). */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const seg of path) {
    if (typeof seg === 'number') out += `[${seg}]`;
    else out += out ? `.${String(seg)}` : String(seg);
  }
  return out;
}

/** A zod error as issues; prefix is the path of the value that was parsed. */
export function zodIssues(error: z.ZodError, prefix: readonly PropertyKey[] = []): Issue[] {
  return error.issues.map((i) => ({ path: formatPath([...prefix, ...i.path]), message: i.message }));
}
