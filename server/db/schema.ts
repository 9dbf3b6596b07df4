// The database schema. drizzle-kit turns changes here into SQL files in drizzle/;
// a migration is never edited after it has been applied anywhere.
import { sql } from "drizzle-orm";
import {
  bigserial,
  index,
  json,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uuid,
  varchar,
} from "drizzle-orm/pg-core";
import { roleNames } from "../auth/roles";

export const role = pgEnum("role", roleNames);

export const people = pgTable("people", {
  id: uuid("id").primaryKey().defaultRandom(),
  /** Stored lower-cased, so that sign-in and uniqueness ignore case. */
  email: text("email").notNull().unique(),
  displayName: text("display_name").notNull(),
  /** An argon2id hash in PHC string form. */
  passwordHash: text("password_hash").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const personRoles = pgTable(
  "person_roles",
  {
    personId: uuid("person_id")
      .notNull()
      .references(() => people.id, { onDelete: "cascade" }),
    role: role("role").notNull(),
  },
  (table) => [primaryKey({ columns: [table.personId, table.role] })],
);

/** The table connect-pg-simple reads and writes; its shape is that package's. */
export const sessions = pgTable(
  "session",
  {
    sid: varchar("sid").primaryKey(),
    sess: json("sess").notNull(),
    expire: timestamp("expire", { precision: 6 }).notNull(),
  },
  (table) => [index("session_expire_idx").on(table.expire)],
);

/** Every state change: who did it, what changed, and the record before and after. */
export const auditLog = pgTable(
  "audit_log",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    at: timestamp("at", { withTimezone: true }).notNull().default(sql`now()`),
    actorId: uuid("actor_id").references(() => people.id),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id").notNull(),
    before: jsonb("before"),
    after: jsonb("after"),
  },
  (table) => [index("audit_log_entity_idx").on(table.entity, table.entityId)],
);
