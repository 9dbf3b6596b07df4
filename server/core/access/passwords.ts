// Passwords are stored as argon2id hashes (RFC 9106), the memory-hard function the RFC recommends.
import { hash, verify } from "@node-rs/argon2";

// RFC 9106 §4, second recommended option: 64 MiB of memory, 3 passes, 4 lanes.
// The algorithm is left at the package default, Argon2id.
const options = { memoryCost: 65536, timeCost: 3, parallelism: 4 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  return verify(passwordHash, password).catch(() => false);
}
