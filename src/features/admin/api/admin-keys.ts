export const adminKeys = {
  all: ['admin'] as const,
  users: () => ['admin', 'users'] as const,
  userList: (q: string) => ['admin', 'users', 'list', q] as const,
  changes: (userId: number) => ['admin', 'users', 'changes', userId] as const,
  shops: () => ['admin', 'shops'] as const,
  catalogue: () => ['admin', 'catalogue'] as const,
  catalogueChassis: (q: string) => ['admin', 'catalogue', 'chassis', q] as const,
  catalogueParts: (q: string) => ['admin', 'catalogue', 'parts', q] as const,
  catalogueChanges: () => ['admin', 'catalogue', 'changes'] as const,
};
