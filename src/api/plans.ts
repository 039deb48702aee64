/** Saved plans and everything around them: list pages, revisions, files, shares and photos. */
import type { Plan } from '@shared/engine/documents';
import {
  LinkOpenedSchema,
  PlanCompareSchema,
  PlanListSchema,
  PlanPhotoListSchema,
  PlanPhotoSchema,
  PlanRecordSchema,
  PlanRevisionListSchema,
  PlanRevisionSchema,
  PlanShareListSchema,
  ShareCreatedSchema,
  type PlanCreate,
  type PlanDuplicate,
  type PlanListParams,
  type PlanRename,
  type PlanUpdate,
  type ShareCreate,
} from '@shared/schemas';
import { request, toQuery } from './client';

const planPath = (id: string) => `/api/plans/${encodeURIComponent(id)}`;

function fileForm(file: Blob, fields: Record<string, string> = {}): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) form.set(key, value);
  form.set('file', file);
  return form;
}

export const plansApi = {
  /** One page of plans; `scope` picks mine, shared with me, or recently deleted. */
  list: (params: PlanListParams = {}) =>
    request(
      'GET',
      `/api/plans${toQuery(params as Record<string, string | number | undefined>)}`,
      PlanListSchema,
    ),
  get: (id: string) => request('GET', planPath(id), PlanRecordSchema),
  // Bodies are typed with the request schemas the server parses them with (shared/schemas/plans.schema.ts).
  create: (document: Plan) =>
    request('POST', '/api/plans', PlanRecordSchema, { document } satisfies PlanCreate),
  /** `baseUpdatedAt` is the updatedAt this tab last saw; a newer copy on the server answers 409 CONFLICT. */
  update: (id: string, document: Plan, baseUpdatedAt: string) =>
    request('PUT', planPath(id), PlanRecordSchema, { document, baseUpdatedAt } satisfies PlanUpdate),
  /** Saves over whatever the server holds now: the user chose to keep this copy after a conflict. */
  overwrite: async (id: string, document: Plan) => {
    const latest = await plansApi.get(id);
    return plansApi.update(id, document, latest.updatedAt);
  },
  rename: (id: string, name: string, baseUpdatedAt: string) =>
    request('PATCH', planPath(id), PlanRecordSchema, { name, baseUpdatedAt } satisfies PlanRename),
  duplicate: (id: string, name?: string) =>
    request(
      'POST',
      `${planPath(id)}/duplicate`,
      PlanRecordSchema,
      (name ? { name } : {}) satisfies PlanDuplicate,
    ),
  remove: (id: string) => request('DELETE', planPath(id), null),
  undelete: (id: string) => request('POST', `${planPath(id)}/undelete`, PlanRecordSchema),
  /** Address of the plan file download (the browser keeps the session cookie). */
  exportUrl: (id: string) => `${planPath(id)}/export`,
  importFile: (file: Blob) => request('POST', '/api/plans/import', PlanRecordSchema, fileForm(file)),

  revisions: (id: string) => request('GET', `${planPath(id)}/revisions`, PlanRevisionListSchema),
  revision: (id: string, rev: number) =>
    request('GET', `${planPath(id)}/revisions/${rev}`, PlanRevisionSchema),
  compare: (id: string, from: number, to: number) =>
    request('GET', `${planPath(id)}/revisions/compare${toQuery({ from, to })}`, PlanCompareSchema),
  restoreRevision: (id: string, rev: number, baseUpdatedAt: string) =>
    request('POST', `${planPath(id)}/revisions/${rev}/restore`, PlanRecordSchema, { baseUpdatedAt }),

  shares: (id: string) => request('GET', `${planPath(id)}/shares`, PlanShareListSchema),
  share: (id: string, share: ShareCreate) =>
    request('POST', `${planPath(id)}/shares`, ShareCreatedSchema, share),
  revokeShare: (id: string, shareId: string) =>
    request('DELETE', `${planPath(id)}/shares/${encodeURIComponent(shareId)}`, null),
  openLink: (token: string) =>
    request('POST', `/api/links/${encodeURIComponent(token)}/open`, LinkOpenedSchema),

  photos: (id: string, partId?: string) =>
    request('GET', `${planPath(id)}/photos${toQuery({ part: partId })}`, PlanPhotoListSchema),
  uploadPhoto: (id: string, partId: string, file: Blob, caption = '') =>
    request('POST', `${planPath(id)}/photos`, PlanPhotoSchema, fileForm(file, { partId, caption })),
  updatePhoto: (id: string, photoId: string, caption: string) =>
    request('PATCH', `${planPath(id)}/photos/${encodeURIComponent(photoId)}`, PlanPhotoSchema, { caption }),
  removePhoto: (id: string, photoId: string) =>
    request('DELETE', `${planPath(id)}/photos/${encodeURIComponent(photoId)}`, null),
};
