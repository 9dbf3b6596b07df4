// Sign-in with an e-mail and a password (passport-local); the session holds the person's id only,
// so a change of roles takes effect on the next request.
import { Passport } from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import type { Database } from "#db/client";
import { findCredentials, findPersonById, type Person } from "#db/people";
import { verifyPassword } from "#core/access/passwords";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends Person {}
  }
}

// A hash of a random password, so that an unknown e-mail costs as much time as a wrong password.
const timingPadHash =
  "$argon2id$v=19$m=65536,t=3,p=4$DEcHMweAPXI4dxMCX0W5Ow$Fa0Zit7XZSKtu7j5sx0lXdIp/jVkRcAelLeH3viE+2w";

export function createPassport(db: Database) {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: "email", passwordField: "password" }, async (email, password, done) => {
      try {
        const found = await findCredentials(db, email);
        const ok = await verifyPassword(found?.passwordHash ?? timingPadHash, password);
        done(null, found && ok ? found.person : false);
      } catch (error) {
        done(error);
      }
    }),
  );
  passport.serializeUser((person, done) => done(null, person.id));
  passport.deserializeUser(async (id: string, done) => {
    try {
      done(null, (await findPersonById(db, id)) ?? false);
    } catch (error) {
      done(error);
    }
  });
  return passport;
}
export type AppPassport = ReturnType<typeof createPassport>;
