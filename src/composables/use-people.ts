/** One page of accounts for the People table, and every admin action on them (each refreshes list and audit log). */
import { computed, reactive } from 'vue';
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import { refDebounced } from '@vueuse/core';
import type { Invite, Role, UserListQuery } from '@shared/schemas';
import { usersApi } from '@/api/users';

export type PeopleSort = UserListQuery['sort'];

export const ADMIN_KEY = ['admin'] as const;

export function usePeople() {
  const query = reactive({
    search: '',
    role: null as Role | null,
    sort: 'createdAt' as PeopleSort,
    order: 'asc' as 'asc' | 'desc',
    page: 1,
    pageSize: 20,
  });
  const search = refDebounced(
    computed(() => query.search.trim()),
    300,
  );
  const params = computed(() => ({
    search: search.value || undefined,
    role: query.role ?? undefined,
    sort: query.sort,
    order: query.order,
    page: query.page,
    pageSize: query.pageSize,
  }));
  const list = useQuery({
    queryKey: [...ADMIN_KEY, 'users', params] as const,
    queryFn: () => usersApi.list(params.value),
    placeholderData: keepPreviousData,
  });

  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ queryKey: ADMIN_KEY });
  const changeRole = useMutation({
    mutationFn: ({ id, role }: { id: string; role: Role }) => usersApi.changeRole(id, role),
    onSuccess: refresh,
  });
  const setDisabled = useMutation({
    mutationFn: ({ id, disabled }: { id: string; disabled: boolean }) => usersApi.setDisabled(id, disabled),
    onSuccess: refresh,
  });
  const remove = useMutation({ mutationFn: usersApi.remove, onSuccess: refresh });
  const sendReset = useMutation({ mutationFn: usersApi.sendReset, onSuccess: refresh });
  const invite = useMutation({ mutationFn: (input: Invite) => usersApi.invite(input), onSuccess: refresh });

  return {
    query,
    rows: computed(() => list.data.value?.items ?? []),
    total: computed(() => list.data.value?.total ?? 0),
    loading: list.isFetching,
    error: list.error,
    load: () => list.refetch(),
    changeRole: changeRole.mutateAsync,
    setDisabled: setDisabled.mutateAsync,
    remove: remove.mutateAsync,
    sendReset: sendReset.mutateAsync,
    invite: invite.mutateAsync,
    inviting: invite.isPending,
  };
}

export function useAuditLog() {
  return useQuery({ queryKey: [...ADMIN_KEY, 'audit'], queryFn: usersApi.audit });
}
