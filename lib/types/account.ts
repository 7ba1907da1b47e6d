/** The signed-in member's own account, as the settings page shows it. */
export type AccountView = { id: number; name: string; email: string; handle: string; emailVerified: boolean; pendingEmail: string | null };
