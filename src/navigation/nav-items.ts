/** The top bar's areas per role. Kept as data so the menu and its tests read the same table. */
import type { Role } from '@shared/schemas';
import { DRILL_ROLES, PEOPLE_ROLES } from '@/router/routes';

export type NavArea = 'plans' | 'bench' | 'drills' | 'people' | 'account';

export interface NavItem {
  area: NavArea;
  label: string;
  to: string;
}

export function navItemsFor(role: Role | null, lastPlanId: string | null = null): NavItem[] {
  if (!role) return [];
  const items: NavItem[] = [{ area: 'plans', label: 'Plans', to: '/plans' }];
  if (lastPlanId)
    items.push({ area: 'bench', label: 'Bench', to: `/plans/${encodeURIComponent(lastPlanId)}` });
  if (DRILL_ROLES.includes(role)) items.push({ area: 'drills', label: 'Drills', to: '/drills' });
  if (PEOPLE_ROLES.includes(role)) items.push({ area: 'people', label: 'People', to: '/people' });
  items.push({ area: 'account', label: 'Account', to: '/account' });
  return items;
}
