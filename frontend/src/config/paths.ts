/** Every route of the app, in one place. Builders for routes with parameters. */
export const paths = {
  signIn: '/sign-in',
  home: '/',
  moves: '/moves',
  moveNew: '/moves/new',
  move: '/moves/:id',
  moveEdit: '/moves/:id/edit',
  fleet: '/fleet',
  rulebook: '/rulebook',
  rulebookState: '/rulebook/:code',
  permits: '/permits',
  payments: '/payments',
  vendors: '/vendors',
  escortResponse: '/escort-response/:token',
  runSheets: '/run-sheets',
  runSheet: '/run-sheets/:moveId',
  users: '/admin/users',
} as const;

export const to = {
  move: (id: string) => `/moves/${id}`,
  moveEdit: (id: string) => `/moves/${id}/edit`,
  rulebookState: (code: string) => `/rulebook/${code}`,
  runSheet: (moveId: string) => `/run-sheets/${moveId}`,
};
