/** Reading the templates' trade designations (templates/README.md): line leads start with L and the line number. */

/** The line a line lead belongs to, from its designation ("L3 A1" → 3), or null for other leads ("CT", "MU"). */
export function lineOfDesignation(designation: string): number | null {
  const match = /^L(\d+)\b/.exec(designation);
  return match ? Number(match[1]) : null;
}
