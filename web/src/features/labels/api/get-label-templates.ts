import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';
import type { TemplateOption } from '../utils/run-plan';

/**
 * The templates the API prints (from label-templates/, checked when the API starts): what the
 * form offers and what the preview lays out. Only the type is read from the renderer's entry.
 */
export async function getLabelTemplates({ signal }: { signal?: AbortSignal } = {}): Promise<TemplateOption[]> {
  return apiClient.get<TemplateOption[]>('/labels/templates', { signal });
}

export function getLabelTemplatesQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.labels.templates(),
    queryFn: ({ signal }) => getLabelTemplates({ signal }),
    staleTime: 60 * 60_000,
  });
}

export function useLabelTemplates() {
  return useQuery(getLabelTemplatesQueryOptions());
}
