/** The run sheets' query keys. */
export const runSheetKeys = {
  all: () => ['run-sheets'] as const,
  one: (moveId: string) => ['run-sheets', 'one', moveId] as const,
};
