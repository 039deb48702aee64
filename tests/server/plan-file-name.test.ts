import { describe, expect, it } from 'vitest';
import { fileNameOf } from '../../server/plans/file-name';

describe('fileNameOf', () => {
  it('keeps letters and digits of the plan name, dashes for the rest, then the suffix', () => {
    // Expected names worked out by hand from the rule in server/plans/file-name.ts.
    expect(fileNameOf('Tailor, upstairs', '.json')).toBe('tailor-upstairs.json');
    expect(fileNameOf('Café #2', '-work-sheet.pdf')).toBe('cafe-2-work-sheet.pdf');
    expect(fileNameOf('***', '.json')).toBe('plan.json');
    expect(fileNameOf('a'.repeat(80), '.json')).toBe(`${'a'.repeat(60)}.json`);
  });
});
