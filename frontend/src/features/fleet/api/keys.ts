/** The fleet's query keys: tractors and trailers, lists and one each. */
export const fleetKeys = {
  all: () => ['fleet'] as const,
  tractors: () => ['fleet', 'tractors'] as const,
  tractor: (id: string) => ['fleet', 'tractors', id] as const,
  trailers: () => ['fleet', 'trailers'] as const,
  trailer: (id: string) => ['fleet', 'trailers', id] as const,
};
