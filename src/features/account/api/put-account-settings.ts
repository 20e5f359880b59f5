import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AccountSettings } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';
import { accountSettingsKey } from './get-account-settings';

export function putAccountSettings(settings: AccountSettings): Promise<{ settings: AccountSettings }> {
  return api.put<{ settings: AccountSettings }>('/api/account/settings', settings);
}

export function usePutAccountSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: putAccountSettings,
    onSuccess: (data) => queryClient.setQueryData(accountSettingsKey, data),
  });
}
