// A shop's catalog: the devices it builds pockets for and the charger pads it builds recesses for.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { Charger, ChargerInput, Device, DeviceInput } from '../../shared/schemas/catalog';
import { api } from './client';

export const catalogKeys = {
  all: ['catalog'] as const,
  shop: (shopId: string) => [...catalogKeys.all, shopId] as const,
  devices: (shopId: string) => [...catalogKeys.shop(shopId), 'devices'] as const,
  chargers: (shopId: string) => [...catalogKeys.shop(shopId), 'chargers'] as const,
};

export function useDevices(shopId: string | null | undefined) {
  return useQuery({
    queryKey: catalogKeys.devices(shopId ?? '-'),
    enabled: !!shopId,
    queryFn: ({ signal }) => api<{ items: Device[] }>(`/shops/${shopId}/devices`, { signal }).then((r) => r.items),
  });
}

export function useChargers(shopId: string | null | undefined) {
  return useQuery({
    queryKey: catalogKeys.chargers(shopId ?? '-'),
    enabled: !!shopId,
    queryFn: ({ signal }) => api<{ items: Charger[] }>(`/shops/${shopId}/chargers`, { signal }).then((r) => r.items),
  });
}

export function useCreateDevice(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof DeviceInput>) => api<Device>(`/shops/${shopId}/devices`, { method: 'POST', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.devices(shopId) }),
  });
}

export function useDeleteDevice(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (deviceId: string) => api<null>(`/shops/${shopId}/devices/${deviceId}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.devices(shopId) }),
  });
}

export function useCreateCharger(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof ChargerInput>) => api<Charger>(`/shops/${shopId}/chargers`, { method: 'POST', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.chargers(shopId) }),
  });
}

export function useDeleteCharger(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (chargerId: string) => api<null>(`/shops/${shopId}/chargers/${chargerId}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.chargers(shopId) }),
  });
}
