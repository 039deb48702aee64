/** The work record of a plan (leads as found, tick-offs, notes) and the address of its PDF work sheet. */
import { WorkEntrySchema, WorkRecordSchema, type WorkEntryUpdate } from '@shared/schemas/work-record.schema';
import { request } from './client';

const base = (planId: string) => `/api/plans/${encodeURIComponent(planId)}`;

export const workRecordApi = {
  get: (planId: string) => request('GET', `${base(planId)}/work-record`, WorkRecordSchema),
  keepAsFound: (planId: string) => request('POST', `${base(planId)}/work-record/as-found`, WorkRecordSchema),
  saveEntry: (planId: string, key: string, entry: WorkEntryUpdate) =>
    request('PUT', `${base(planId)}/work-record/entries/${encodeURIComponent(key)}`, WorkEntrySchema, entry),
  /** Opened by the browser itself (a download), so it is an address, not a request. */
  pdfUrl: (planId: string) => `${base(planId)}/work-sheet.pdf`,
};
