import { meSchema, type FirstManagerRequest, type Me } from '@crumbproof/shared';
import { useMutation } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';

export async function setFirstManager(request: FirstManagerRequest): Promise<Me> {
  return meSchema.parse(await apiClient.post<unknown>('/auth/first-manager', request));
}

/** Uses the one-time link printed at a kitchen's first start to set its first manager. */
export function useSetFirstManager() {
  return useMutation({ mutationFn: setFirstManager });
}
