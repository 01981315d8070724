export const carKeys = {
  all: ['cars'] as const,
  mine: () => ['cars', 'mine'] as const,
  chassisOptions: () => ['cars', 'chassis-options'] as const,
  chassisSwaps: (slug: string) => ['cars', 'chassis-swaps', slug] as const,
};
