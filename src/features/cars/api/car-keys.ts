export const carKeys = {
  all: ['cars'] as const,
  mine: () => ['cars', 'mine'] as const,
  chassisOptions: () => ['cars', 'chassis-options'] as const,
};
