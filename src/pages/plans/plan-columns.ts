/** Columns of the plans table; sorting happens on the server, so each sortable column only reports its order. */
import { momentText } from '@/formats/dates';
import { h } from 'vue';
import { RouterLink } from 'vue-router';
import { NButton, NDropdown, NIcon, NTag, type DataTableColumns, type DropdownOption } from 'naive-ui';
import { DotsVertical } from '@vicons/tabler';
import type { PlanListQuery, PlanSummary } from '@shared/schemas';
import { plansApi } from '@/api/plans';
import { relativeTime } from '@/plans/relative-time';

export type PlanScope = PlanListQuery['scope'];
export type PlanAction = 'rename' | 'duplicate' | 'revisions' | 'share' | 'sheet' | 'remove' | 'restore';

type SortKey = PlanListQuery['sort'];
type Order = 'ascend' | 'descend' | false;

function actionsFor(plan: PlanSummary, scope: PlanScope): DropdownOption[] {
  const exportLink: DropdownOption = {
    key: 'export',
    label: () =>
      h('a', { href: plansApi.exportUrl(plan.id), download: '', class: 'plans__export' }, 'Export file'),
  };
  if (scope === 'shared') {
    return [
      { key: 'duplicate', label: 'Copy to my plans' },
      { key: 'sheet', label: 'Work sheet' },
      exportLink,
    ];
  }
  return [
    { key: 'rename', label: 'Rename…' },
    { key: 'duplicate', label: 'Duplicate' },
    { key: 'revisions', label: 'Revisions…' },
    { key: 'share', label: 'Share…' },
    { key: 'sheet', label: 'Work sheet' },
    exportLink,
    { type: 'divider', key: 'd' },
    { key: 'remove', label: 'Delete' },
  ];
}

/** The name column never narrows below this; on a phone the table scrolls sideways instead of wrapping names letter by letter. */
const NAME_MIN_WIDTH = 180;
/** Name at its narrowest plus the fixed columns: the width below which the table scrolls. */
export const PLANS_TABLE_WIDTH = NAME_MIN_WIDTH + 80 + 120 + 160 + 180 + 120;

export function planColumns(
  scope: PlanScope,
  sort: { key: SortKey; order: 'asc' | 'desc' },
  onAction: (action: PlanAction, plan: PlanSummary) => void,
): DataTableColumns<PlanSummary> {
  const orderOf = (key: SortKey): Order =>
    sort.key === key ? (sort.order === 'asc' ? 'ascend' : 'descend') : false;
  const sortable = (key: SortKey) => ({ key, sorter: true as const, sortOrder: orderOf(key) });
  const deleted = scope === 'deleted';
  return [
    {
      title: 'Name',
      ...sortable('name'),
      minWidth: NAME_MIN_WIDTH,
      render: (plan) =>
        deleted
          ? plan.name
          : h(RouterLink, { to: `/plans/${plan.id}`, class: 'plans__name' }, () => plan.name),
    },
    { title: 'Sets', ...sortable('setCount'), align: 'right', width: 80 },
    {
      title: 'Open faults',
      ...sortable('faultCount'),
      align: 'right',
      width: 120,
      render: (plan) =>
        plan.faultCount === 0 ? 'None' : h(NTag, { size: 'small', type: 'warning' }, () => plan.faultCount),
    },
    {
      title: deleted ? 'Deleted' : 'Last change',
      ...sortable('updatedAt'),
      width: 160,
      render: (plan) => {
        const at = deleted && plan.deletedAt ? plan.deletedAt : plan.updatedAt;
        return h('span', { title: momentText(at) }, relativeTime(at));
      },
    },
    scope === 'shared'
      ? { title: 'Owner', key: 'ownerName', width: 180 }
      : {
          title: 'Shared',
          ...sortable('shared'),
          width: 100,
          render: (plan) => (plan.shared ? h(NTag, { size: 'small', type: 'info' }, () => 'Shared') : '—'),
        },
    {
      title: 'Actions',
      key: 'actions',
      width: deleted ? 120 : 90,
      align: 'right',
      render: (plan) =>
        deleted
          ? h(NButton, { size: 'small', onClick: () => onAction('restore', plan) }, () => 'Restore')
          : h(
              NDropdown,
              {
                trigger: 'click',
                placement: 'bottom-end',
                options: actionsFor(plan, scope),
                onSelect: (key: string) => key !== 'export' && onAction(key as PlanAction, plan),
              },
              () =>
                h(
                  NButton,
                  { quaternary: true, circle: true, size: 'small', 'aria-label': `Actions for ${plan.name}` },
                  { icon: () => h(NIcon, { 'aria-hidden': 'true', component: DotsVertical }) },
                ),
            ),
    },
  ];
}
