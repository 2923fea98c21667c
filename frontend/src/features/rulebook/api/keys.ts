/** The rulebook's query keys: the list, coverage, and each jurisdiction's current record and versions. */
export const rulebookKeys = {
  all: () => ['rulebook'] as const,
  list: () => ['rulebook', 'list'] as const,
  coverage: () => ['rulebook', 'coverage'] as const,
  current: (code: string) => ['rulebook', code, 'current'] as const,
  versions: (code: string) => ['rulebook', code, 'versions'] as const,
};
