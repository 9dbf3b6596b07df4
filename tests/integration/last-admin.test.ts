// The site never loses its last administrator (round 3 of the hostile probe, F3 and F4), on a database
// of its own so that no other test's people count and each test sets up exactly the administrators it
// needs: the only one is refused, an invitation never accepted does not count, and two administrators
// demoting each other at the same moment leave one of them.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { connectDatabase, type DatabaseConnection } from "#db/client";
import { migrateDatabase } from "#db/migrate";
import { insertPerson, type Person } from "#db/people";
import { changePerson, type AccountContext } from "#workflows/accounts";
import { hashPassword } from "#core/access/passwords";
import { ownDatabase, startTestApp } from "../support/app";
import { ApiClient } from "../support/client";

let database: Awaited<ReturnType<typeof ownDatabase>>;
let connection: DatabaseConnection;
let ctx: AccountContext;

beforeAll(async () => {
  database = await ownDatabase("last_admin_test");
  connection = connectDatabase(database.url);
  await migrateDatabase(connection);
  ctx = { db: connection.db } as AccountContext;
});
afterAll(async () => {
  await connection.close();
  await database.drop();
});

let counter = 0;
const person = async (passwordHash: string | null): Promise<Person> =>
  (await insertPerson(connection.db, { email: `admin${++counter}@x.example`, displayName: `Admin ${counter}`, passwordHash, roles: ["admin"], translationLocales: [], locale: "en" }, null))!;
/** Every administrator loses the role: a clean start for each test. */
const noAdmins = () => connection.pool.query("delete from person_roles where role = 'admin'");
const adminsLeft = async () => Number((await connection.pool.query("select count(*) from person_roles r join people p on p.id = r.person_id where r.role = 'admin' and p.password_hash is not null and p.deactivated_at is null")).rows[0].count);

describe("the last administrator", () => {
  it("cannot demote themselves while the only other administrator is an invitation never accepted (F4)", async () => {
    await noAdmins();
    const real = await person("hash");
    await person(null);
    expect(await adminsLeft()).toBe(1);
    expect(await changePerson(ctx, real.id, { roles: ["editor"] }, real)).toEqual({ ok: false, reason: "last-admin" });
    expect(await adminsLeft()).toBe(1);
  });

  it("survives two administrators demoting each other at the same moment, five times over (F3)", async () => {
    for (let attempt = 0; attempt < 5; attempt++) {
      await noAdmins();
      const [a, b] = [await person("hash"), await person("hash")];
      const outcomes = await Promise.all([changePerson(ctx, b.id, { roles: ["editor"] }, a), changePerson(ctx, a.id, { roles: ["editor"] }, b)]);
      expect(await adminsLeft(), `attempt ${attempt + 1}`).toBe(1);
      expect(outcomes.map((o) => o.ok).sort()).toEqual([false, true]);
    }
  });

  it("through the API: the only administrator, demoting themselves, is refused with 409 and the reason's key", async () => {
    await noAdmins();
    const only = await person(await hashPassword("a long enough password"));
    expect(await adminsLeft()).toBe(1);
    const app = await startTestApp(database.url);
    try {
      const client = new ApiClient(app.url);
      expect((await client.signIn(only.email, "a long enough password")).status).toBe(200);
      const answer = await client.request("PATCH", `/api/people/${only.id}`, { json: { roles: ["editor"] } });
      expect(answer.status).toBe(409);
      expect(answer.body.error?.key).toBe("errors.people.lastAdmin");
      expect(await adminsLeft()).toBe(1);
    } finally {
      await app.close();
    }
  });
});
