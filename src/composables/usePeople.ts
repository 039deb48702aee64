/** One page of accounts for the People table: query state, loading, error and role changes. */
import { reactive, ref, shallowRef } from 'vue';
import type { Role, User, UserListQuery } from '@shared/schemas';
import { usersApi } from '@/api/users';

export type PeopleSort = UserListQuery['sort'];

export function usePeople() {
  const query = reactive({
    search: '',
    role: null as Role | null,
    sort: 'createdAt' as PeopleSort,
    order: 'asc' as 'asc' | 'desc',
    page: 1,
    pageSize: 20,
  });
  const rows = shallowRef<User[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const error = shallowRef<unknown>(null);
  let latest = 0;

  async function load(): Promise<void> {
    const ticket = ++latest;
    loading.value = true;
    error.value = null;
    try {
      const answer = await usersApi.list({
        search: query.search.trim() || undefined,
        role: query.role ?? undefined,
        sort: query.sort,
        order: query.order,
        page: query.page,
        pageSize: query.pageSize,
      });
      // A slower, older answer must not overwrite a newer one.
      if (ticket !== latest) return;
      rows.value = answer.items;
      total.value = answer.total;
    } catch (caught) {
      if (ticket === latest) error.value = caught;
    } finally {
      if (ticket === latest) loading.value = false;
    }
  }

  async function changeRole(id: string, role: Role): Promise<User> {
    const user = await usersApi.changeRole(id, role);
    rows.value = rows.value.map((row) => (row.id === id ? user : row));
    return user;
  }

  return { query, rows, total, loading, error, load, changeRole };
}
