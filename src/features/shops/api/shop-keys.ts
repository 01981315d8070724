export const shopKeys = {
  all: ['shops'] as const,
  page: (slug: string) => ['shops', 'page', slug] as const,
  links: () => ['shops', 'links'] as const,
  pinned: (code: string) => ['shops', 'pinned', code] as const,
};
