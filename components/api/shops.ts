// Shops, their members and invites.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ChangeRole, CreateInvite, CreateShop, InvitePreview, Member, PendingInvite, RenameShop, ShopSummary } from '../../shared/schemas/auth';
import { authKeys } from './auth';
import { api } from './client';

export const shopKeys = {
  all: ['shops'] as const,
  list: () => [...shopKeys.all, 'list'] as const,
  detail: (shopId: string) => [...shopKeys.all, shopId] as const,
  members: (shopId: string) => [...shopKeys.detail(shopId), 'members'] as const,
  invites: (shopId: string) => [...shopKeys.detail(shopId), 'invites'] as const,
  invite: (token: string) => ['invite', token] as const,
};

export function useMyShopList() {
  return useQuery({ queryKey: shopKeys.list(), queryFn: ({ signal }) => api<{ shops: ShopSummary[] }>('/shops', { signal }).then((r) => r.shops) });
}

/** Shop names and roles also live in "me": refresh both after a change. */
function useRefreshShops() {
  const qc = useQueryClient();
  return () => Promise.all([qc.invalidateQueries({ queryKey: shopKeys.all }), qc.invalidateQueries({ queryKey: authKeys.me() })]);
}

export function useCreateShop() {
  const refresh = useRefreshShops();
  return useMutation({
    mutationFn: (body: CreateShop) => api<{ shop: ShopSummary }>('/shops', { method: 'POST', json: body }).then((r) => r.shop),
    onSuccess: refresh,
  });
}

export function useRenameShop(shopId: string) {
  const refresh = useRefreshShops();
  return useMutation({
    mutationFn: (body: RenameShop) => api<{ shop: ShopSummary }>(`/shops/${shopId}`, { method: 'PATCH', json: body }).then((r) => r.shop),
    onSuccess: refresh,
  });
}

export function useMembers(shopId: string) {
  return useQuery({
    queryKey: shopKeys.members(shopId),
    queryFn: ({ signal }) => api<{ members: Member[] }>(`/shops/${shopId}/members`, { signal }).then((r) => r.members),
  });
}

/** Role changes and removals answer with the new member list. */
function useMemberChange<V>(shopId: string, send: (v: V) => Promise<{ members: Member[] }>) {
  const qc = useQueryClient();
  const refresh = useRefreshShops();
  return useMutation({
    mutationFn: send,
    onSuccess: (r) => {
      qc.setQueryData(shopKeys.members(shopId), r.members);
      return refresh(); // the caller may have changed their own role
    },
  });
}

export function useChangeRole(shopId: string) {
  return useMemberChange(shopId, ({ userId, role }: { userId: string } & ChangeRole) =>
    api<{ members: Member[] }>(`/shops/${shopId}/members/${userId}`, { method: 'PATCH', json: { role } }),
  );
}

export function useRemoveMember(shopId: string) {
  return useMemberChange(shopId, (userId: string) => api<{ members: Member[] }>(`/shops/${shopId}/members/${userId}`, { method: 'DELETE' }));
}

export function usePendingInvites(shopId: string, enabled: boolean) {
  return useQuery({
    queryKey: shopKeys.invites(shopId),
    queryFn: ({ signal }) => api<{ invites: PendingInvite[] }>(`/shops/${shopId}/invites`, { signal }).then((r) => r.invites),
    enabled,
  });
}

export function useSendInvite(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvite) => api<{ invite: PendingInvite }>(`/shops/${shopId}/invites`, { method: 'POST', json: body }).then((r) => r.invite),
    onSuccess: () => qc.invalidateQueries({ queryKey: shopKeys.invites(shopId) }),
  });
}

export function useWithdrawInvite(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (inviteId: string) => api<{ invites: PendingInvite[] }>(`/shops/${shopId}/invites/${inviteId}`, { method: 'DELETE' }).then((r) => r.invites),
    onSuccess: (invites) => qc.setQueryData(shopKeys.invites(shopId), invites),
  });
}

/** What an invite link is for; readable without signing in. */
export function useInvitePreview(token: string) {
  return useQuery({
    queryKey: shopKeys.invite(token),
    queryFn: ({ signal }) => api<{ invite: InvitePreview }>(`/invites/${encodeURIComponent(token)}`, { signal }).then((r) => r.invite),
    retry: false,
  });
}

export function useAcceptInvite(token: string) {
  const refresh = useRefreshShops();
  return useMutation({
    mutationFn: () => api<{ shop: ShopSummary }>(`/invites/${encodeURIComponent(token)}/accept`, { method: 'POST' }).then((r) => r.shop),
    onSuccess: refresh,
  });
}
