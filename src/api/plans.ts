import type { Plan } from '@shared/engine/documents';
import { PlanListSchema, PlanRecordSchema } from '@shared/schemas';
import { request } from './client';

const planPath = (id: string) => `/api/plans/${encodeURIComponent(id)}`;

export const plansApi = {
  list: () => request('GET', '/api/plans', PlanListSchema).then((r) => r.items),
  get: (id: string) => request('GET', planPath(id), PlanRecordSchema),
  create: (document: Plan) => request('POST', '/api/plans', PlanRecordSchema, { document }),
  /** `baseUpdatedAt` is the updatedAt this tab last saw; a newer copy on the server answers 409 CONFLICT. */
  update: (id: string, document: Plan, baseUpdatedAt?: string) =>
    request('PUT', planPath(id), PlanRecordSchema, { document, baseUpdatedAt }),
  remove: (id: string) => request('DELETE', planPath(id), null),
};
