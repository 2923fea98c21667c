import type { VendorsQuery } from '@amberline/common';

/** The escorts' query keys: a move's bookings, the vendors, and a vendor's view of one request. */
export const escortKeys = {
  all: () => ['escorts'] as const,
  move: (moveId: string) => ['escorts', 'move', moveId] as const,
  vendors: () => ['vendors'] as const,
  vendorList: (f: VendorsQuery) => ['vendors', 'list', f] as const,
  response: (token: string) => ['escort-response', token] as const,
};
