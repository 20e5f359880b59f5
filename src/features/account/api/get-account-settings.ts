import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AccountSettings } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export const accountSettingsKey = ['account', 'settings'] as const;

export function getAccountSettings(options: { signal?: AbortSignal } = {}): Promise<{ settings: AccountSettings }> {
  return api.get<{ settings: AccountSettings }>('/api/account/settings', options);
}

export function getAccountSettingsQueryOptions() {
  return queryOptions({ queryKey: accountSettingsKey, queryFn: ({ signal }) => getAccountSettings({ signal }) });
}

export function useAccountSettings() {
  return useQuery(getAccountSettingsQueryOptions());
}
