// The roles of PRODUCT.md. A person may hold several; docs/roles.md says what each may do.
export const roleNames = ["admin", "analyst", "editor", "translator", "press"] as const;
export type Role = (typeof roleNames)[number];

/** Staff who work on drafts in the desk; the public and the press read only what is released. */
export const deskRoles: Role[] = ["analyst", "editor", "translator", "admin"];
