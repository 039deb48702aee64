import { describe, expect, it } from 'vitest';
import { byDueDate, dueCell, dueText, minutesText, statusText } from '../../src/components/training/training-format';

describe('training wording', () => {
  const due = '2026-03-10T17:00:00.000Z';
  const before = Date.parse('2026-03-09T12:00:00.000Z');
  const after = Date.parse('2026-03-11T12:00:00.000Z');

  it('says an assignment with no due date has none', () => {
    expect(dueText(null)).toBe('No due date');
    expect(dueText(null, 'working', after)).toBe('No due date');
  });

  it('says when work is due, and overdue only while the trainee still owes it', () => {
    expect(dueText(due, 'not-started', before)).toMatch(/^Due /);
    expect(dueText(due, 'not-started', after)).toMatch(/^Overdue: was due /);
    expect(dueText(due, 'working', after)).toMatch(/^Overdue: was due /);
    // passed, out of attempts, or no trainee status (the instructor's desk): never overdue
    expect(dueText(due, 'passed', after)).toMatch(/^Due /);
    expect(dueText(due, 'failed', after)).toMatch(/^Due /);
    expect(dueText(due, undefined, after)).toMatch(/^Due /);
  });

  it('writes a due date in a "Due" column without repeating the heading, marked while owed past it', () => {
    expect(dueCell(null)).toBe('—');
    expect(dueCell(due, 'not-started', before)).not.toMatch(/Due|overdue/);
    expect(dueCell(due, 'working', after)).toMatch(/ \(overdue\)$/);
    expect(dueCell(due, 'passed', after)).not.toMatch(/overdue/);
  });

  it('names every status in words and rounds time up to whole minutes', () => {
    expect(statusText('not-started')).toBe('Not started');
    expect(statusText('failed')).toBe('No attempts left');
    expect(minutesText(null)).toBe('—');
    expect(minutesText(1)).toBe('1 min');
    expect(minutesText(61_000)).toBe('2 min');
  });

  it('lists assignments soonest due first, undated ones last, ties in the order set', () => {
    const items = [
      { id: 'a', dueAt: '2026-12-18T17:00:00.000Z' },
      { id: 'b', dueAt: null },
      { id: 'c', dueAt: '2026-12-11T17:00:00.000Z' },
      { id: 'd', dueAt: '2026-12-18T17:00:00.000Z' },
      { id: 'e', dueAt: null },
    ];
    expect(byDueDate(items).map((x) => x.id)).toEqual(['c', 'a', 'd', 'b', 'e']);
    expect(items[0].id).toBe('a'); // the list it was given is left as it was
  });
});
