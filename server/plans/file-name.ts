/** A download's file name made of the plan's name: letters, digits and dashes only, so every file system takes it. */
export function fileNameOf(planName: string, suffix: string): string {
  const stem =
    planName
      .normalize('NFKD')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 60) || 'plan';
  return `${stem}${suffix}`;
}
