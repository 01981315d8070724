export const graphKeys = {
  all: ['graph'] as const,
  part: (id: number) => ['graph', 'part', id] as const,
  chassis: (slug: string) => ['graph', 'chassis', slug] as const,
  whereElse: (number: string) => ['graph', 'where-else', number] as const,
};
