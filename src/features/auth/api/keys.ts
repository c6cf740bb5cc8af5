// Query keys of the auth area. The signed-in user's key is meKeys in src/lib/use-me.ts.
export const authKeys = {
  invitation: (token: string) => ['invitations', 'by-token', token] as const,
};
