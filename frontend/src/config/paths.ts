/** Every route of the app, in one place. */
export const paths = {
  signIn: '/sign-in',
  home: '/',
  users: '/admin/users',
} as const;
