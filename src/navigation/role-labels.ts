import type { Role } from '@shared/schemas';

export const ROLE_LABELS: Record<Role, string> = {
  restorer: 'Restorer',
  instructor: 'Instructor',
  trainee: 'Trainee',
  admin: 'Administrator',
};

export const ROLE_SUMMARIES: Record<Role, string> = {
  restorer: 'Draws and saves plans, operates them on the Bench.',
  instructor: 'Everything a restorer can do, plus Drills for a class.',
  trainee: 'Works through Drills and practises on own plans.',
  admin: 'Manages people and their roles.',
};
