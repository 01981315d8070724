import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** the parts of the OpenAPI document the endpoint list shows */
export type OpenApiOperation = {
  tags?: string[];
  summary?: string;
  description?: string;
  parameters?: { name: string; in: string; required?: boolean; schema?: { type?: string } }[];
  responses: Record<string, { description: string; content?: Record<string, unknown> }>;
};
export type OpenApiDocument = {
  openapi: string;
  info: { title: string; version: string; description?: string };
  paths: Record<string, Record<string, OpenApiOperation>>;
};

export const openApiQueryOptions = () =>
  queryOptions({
    queryKey: ['open-data', 'openapi'] as const,
    queryFn: () => api<OpenApiDocument>('/api/openapi.json'),
    staleTime: Infinity,
  });

export const useOpenApi = () => useQuery(openApiQueryOptions());
