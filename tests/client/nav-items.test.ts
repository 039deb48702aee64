import { describe, expect, it } from 'vitest';
import { navItemsFor } from '@/navigation/nav-items';

const labels = (...args: Parameters<typeof navItemsFor>) => navItemsFor(...args).map((item) => item.label);

// The areas per role are our own product decision (common practice, no published source):
// everyone has Plans and Account, trainees and instructors add Drills, administrators add People.
describe('navItemsFor', () => {
  it('shows nothing to an anonymous visitor', () => {
    expect(navItemsFor(null)).toEqual([]);
  });

  it('gives a restorer Plans and Account', () => {
    expect(labels('restorer')).toEqual(['Plans', 'Account']);
  });

  it('adds Drills for instructors and trainees', () => {
    expect(labels('instructor')).toEqual(['Plans', 'Drills', 'Account']);
    expect(labels('trainee')).toEqual(['Plans', 'Drills', 'Account']);
  });

  it('adds People for administrators', () => {
    expect(labels('admin')).toEqual(['Plans', 'Drills', 'People', 'Account']);
  });

  it('offers the Bench once a plan has been opened', () => {
    const items = navItemsFor('restorer', 'harbour-1');
    expect(items.map((i) => i.label)).toEqual(['Plans', 'Bench', 'Account']);
    expect(items.find((i) => i.area === 'bench')?.to).toBe('/plans/harbour-1');
  });
});
