// The roles of PRODUCT.md. A person may hold several; docs/roles.md says what each may do.
export const roleNames = ["admin", "analyst", "editor", "translator", "press"] as const;
export type Role = (typeof roleNames)[number];

/** Who may read a version before its release: the press, and the editors who scheduled it. */
export const embargoReaders: Role[] = ["press", "editor"];

/**
 * Whether this reader may see embargoed versions. A public page read by such a reader depends on
 * who reads it (its history names the embargoed version), so it is never shared-cacheable.
 */
export const mayReadEmbargoed = (roles: readonly Role[]) => roles.some((role) => embargoReaders.includes(role));
