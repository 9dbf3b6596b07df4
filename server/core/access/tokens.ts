// One-time tokens for account links (invitations, password resets): 32 random bytes sent in the link,
// and only their SHA-256 stored, so a copy of the database opens no account. A hash without salt is
// enough here: the token has 256 bits of entropy, so there is no dictionary to try (OWASP Forgot
// Password Cheat Sheet: random, long, single use, expiring, stored securely).
import { createHash, randomBytes } from "node:crypto";

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

/** How long each link stays valid (common practice: a week to accept an invitation, an hour to reset a password). */
export const tokenLifetimeMs = { invitation: 7 * 24 * 3600 * 1000, "password-reset": 3600 * 1000 } as const;
export type TokenPurpose = keyof typeof tokenLifetimeMs;

/** A token as it appears in a link: 43 characters of base64url. Anything else is refused before a lookup. */
export const wellFormedToken = (value: unknown): value is string => typeof value === "string" && /^[A-Za-z0-9_-]{43}$/.test(value);
