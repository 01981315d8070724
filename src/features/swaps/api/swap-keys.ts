export const swapKeys = {
  all: ['swaps'] as const,
  recent: (limit: number) => ['swaps', 'recent', limit] as const,
  detail: (slug: string) => ['swaps', 'detail', slug] as const,
  revision: (slug: string, n: number) => ['swaps', 'detail', slug, 'r', n] as const,
  chassisList: () => ['chassis', 'list'] as const,
  chassis: (slug: string) => ['chassis', 'detail', slug] as const,
  part: (id: number) => ['parts', 'detail', id] as const,
};
