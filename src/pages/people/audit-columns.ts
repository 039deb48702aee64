/** The audit log's columns and the words for its actions: the one place the table's shape is written. */
import type { DataTableColumns } from 'naive-ui';
import type { AuditEntry } from '@shared/schemas';

export const AUDIT_ACTION_LABELS: Record<AuditEntry['action'], string> = {
  'role-changed': 'Role changed',
  'account-disabled': 'Account disabled',
  'account-enabled': 'Account enabled',
  'account-deleted': 'Account deleted',
  'password-reset-sent': 'Reset link sent',
  'user-invited': 'Invited',
};

const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export const AUDIT_COLUMNS: DataTableColumns<AuditEntry> = [
  { title: 'When', key: 'at', width: 190, render: (row) => when.format(new Date(row.at)) },
  { title: 'Who', key: 'actorEmail', ellipsis: { tooltip: true } },
  { title: 'What', key: 'action', width: 170, render: (row) => AUDIT_ACTION_LABELS[row.action] },
  {
    title: 'Account',
    key: 'targetEmail',
    ellipsis: { tooltip: true },
    render: (row) => row.targetEmail ?? '—',
  },
  { title: 'Detail', key: 'detail' },
];
