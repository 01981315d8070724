export const submissionKeys = {
  all: ['submissions'] as const,
  detail: (id: number) => ['submissions', 'detail', id] as const,
  mine: () => ['submissions', 'mine'] as const,
  storage: () => ['submissions', 'storage'] as const,
};
