import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EquipmentKind, EquipmentListResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { equipmentKeys } from '@/lib/query-keys';

export const getEquipment = (kind: EquipmentKind, signal?: AbortSignal) =>
  api.get<EquipmentListResponse>('/equipment', { signal, params: { kind } }).then((body) => body.items);

export const getEquipmentQueryOptions = (kind: EquipmentKind) =>
  queryOptions({ queryKey: equipmentKeys.list(kind), queryFn: ({ signal }) => getEquipment(kind, signal), staleTime: 5 * 60_000 });

export const useEquipment = (kind: EquipmentKind, enabled = true) => useQuery({ ...getEquipmentQueryOptions(kind), enabled });
