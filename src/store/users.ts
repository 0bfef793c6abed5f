import { z } from "zod";
import type { Q } from "./sql.ts";
import { isoNow, type StoreContext } from "./context.ts";
import { attemptSucceeded, clearAccount, countAttempt, subjectsFor } from "./attempts.ts";
import {
  InvalidRecordError,
  NotAllowedError,
  NotSignedInError,
  RecordConflictError,
  RecordNotFoundError,
  WrongPassphraseError,
} from "./errors.ts";
import { offeredPassphraseField, parseFields, passphraseField, personNameField } from "./fields.ts";
import { displayName, nameKey } from "./names.ts";
import { DEFAULT_SCRYPT_COST, hashPassphrase, passphraseMatches, type PassphraseHash, type ScryptCost } from "./passphrase.ts";
import { logPeopleEvent } from "./peopleLog.ts";
import { weakPassphrase } from "./strength.ts";

/**
 * The people of the records. An `admin` manages people and trusted keys; an `engineer` saves,
 * revises and signs (an admin may sign too). A person is known by an id; the name is what
 * sheets print, and it is unique up to look-alikes (names.ts), so one person cannot appear as
 * two. Passphrases are kept only as scrypt hashes.
 */
export const USER_ROLES = ["admin", "engineer"] as const;
export type UserRole = (typeof USER_ROLES)[number];

export interface UserRecord {
  id: number;
  name: string;
  role: UserRole;
  disabled: boolean;
  createdAt: string;
}

/** The person a request acts for, as the web and CLI faces hand it to the store. */
export interface Actor {
  id: number;
  name: string;
  role: UserRole;
}

export interface NewUser {
  name: string;
  role: UserRole;
  passphrase: string;
}

const userRoleField = z.enum(USER_ROLES, { error: `must be "admin" or "engineer"` });
const newUserFields = z.strictObject({ name: personNameField, role: userRoleField, passphrase: passphraseField });

/**
 * Who adds a person: a signed-in admin; `null` for the first person (who must be an admin) on the
 * first-run page; or "database-owner", the command line run by whoever can write the database
 * file, who could change it anyway.
 */
export type Adder = Actor | null | "database-owner";

/** Anyone may add the first user, who must be an admin; after that only an admin adds people. */
export async function addUser(ctx: StoreContext, args: NewUser, adder: Adder, source = "cli"): Promise<UserRecord> {
  const fields = parseFields(newUserFields, args);
  const name = displayName(fields.name);
  const owner = adder === "database-owner";
  const by = owner ? null : adder;
  if (owner && (await countUsers(ctx.sql)) === 0 && fields.role !== "admin") {
    throw new InvalidRecordError([{ path: "role", message: 'the first person must be an admin ("admin"), who then adds the others' }]);
  }
  if (!owner && by === null && (await countUsers(ctx.sql)) > 0) {
    throw new NotSignedInError([{ path: "(session)", message: "sign in as an admin to add people" }]);
  }
  if (by !== null) await requireAdmin(ctx.sql, by, "add people");
  if (!owner && by === null && fields.role !== "admin") {
    throw new InvalidRecordError([{ path: "role", message: 'the first person must be an admin ("admin"), who then adds the others' }]);
  }
  await assertNameFree(ctx.sql, name);
  const weak = weakPassphrase(fields.passphrase, [name]);
  if (weak) throw new InvalidRecordError([{ path: "passphrase", message: weak }]);
  const stored = await hashPassphrase(fields.passphrase, ctx.passphraseCost);
  const createdAt = isoNow(ctx);
  const id = await ctx.sql.write(async (q) => {
    // Judged again inside the write transaction: two registrations racing for one name.
    await assertNameFree(q, name);
    if (!owner && by === null && (await countUsers(q)) > 0) {
      throw new NotSignedInError([{ path: "(session)", message: "sign in as an admin to add people" }]);
    }
    const r = await q.get<{ id: number }>(
      `INSERT INTO users (name, name_key, role, salt, hash, scrypt_n, scrypt_r, scrypt_p, created_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?) RETURNING id`,
      name,
      nameKey(name),
      fields.role,
      stored.salt,
      stored.hash,
      stored.n,
      stored.r,
      stored.p,
      createdAt,
    );
    const newId = Number(r?.id);
    await logPeopleEvent(q, {
      at: createdAt,
      kind: "user-added",
      userId: newId,
      actorId: by?.id ?? null,
      source,
      detail: { role: fields.role },
    });
    return newId;
  });
  return { id, name, role: fields.role, disabled: false, createdAt };
}

export async function countUsers(q: Q): Promise<number> {
  return (await q.get<{ n: number }>("SELECT count(*) AS n FROM users"))?.n ?? 0;
}

const USER_SELECT = `SELECT id, name, role, disabled, created_at AS "createdAt" FROM users`;
type UserRow = Omit<UserRecord, "disabled"> & { disabled: number };
const userOf = (r: UserRow): UserRecord => ({ ...r, disabled: r.disabled === 1 });

export async function listUsers(q: Q): Promise<UserRecord[]> {
  return (await q.all<UserRow>(`${USER_SELECT} ORDER BY name_key`)).map(userOf);
}

export async function getUser(q: Q, id: number): Promise<UserRecord> {
  // A user id is a 32-bit integer in both databases; anything beyond names no one.
  const row = Number.isSafeInteger(id) && Math.abs(id) < 2 ** 31 ? await q.get<UserRow>(`${USER_SELECT} WHERE id = ?`, id) : undefined;
  if (!row) throw new RecordNotFoundError([{ path: "id", message: `no one has the user id ${id}` }]);
  return userOf(row);
}

/** Refuse unless `by` is an admin who is still enabled. */
export async function requireAdmin(q: Q, by: Actor, doing: string): Promise<void> {
  const row = await q.get<{ role: string; disabled: number }>("SELECT role, disabled FROM users WHERE id = ?", by.id);
  if (!row || row.disabled === 1) throw new NotSignedInError([{ path: "(session)", message: "this account is disabled; sign in again" }]);
  if (row.role !== "admin") throw new NotAllowedError([{ path: "(session)", message: `only an admin may ${doing}` }]);
}

/** Disable or enable a person. Disabling ends their sessions; their past sign-offs stay valid. */
export async function setDisabled(ctx: StoreContext, id: number, disabled: boolean, by: Actor): Promise<UserRecord> {
  await requireAdmin(ctx.sql, by, disabled ? "disable people" : "enable people");
  const at = isoNow(ctx);
  return ctx.sql.write(async (q) => {
    const target = await getUser(q, id);
    if (disabled && id === by.id) {
      throw new InvalidRecordError([{ path: "id", message: "an admin cannot disable their own account; ask another admin" }]);
    }
    if (disabled) {
      const admins = await q.get<{ n: number }>("SELECT count(*) AS n FROM users WHERE role = 'admin' AND disabled = 0 AND id != ?", id);
      if (target.role === "admin" && (admins?.n ?? 0) === 0)
        throw new InvalidRecordError([{ path: "id", message: "the last enabled admin cannot be disabled" }]);
    }
    await q.run("UPDATE users SET disabled = ? WHERE id = ?", disabled ? 1 : 0, id);
    if (disabled) await q.run("DELETE FROM sessions WHERE user_id = ?", id);
    await logPeopleEvent(q, {
      at,
      kind: disabled ? "user-disabled" : "user-enabled",
      userId: id,
      actorId: by.id,
      source: null,
      detail: null,
    });
    return getUser(q, id);
  });
}

const resetFields = z.strictObject({ passphrase: passphraseField });
const changeFields = z.strictObject({ current: offeredPassphraseField, passphrase: passphraseField });

/**
 * A new passphrase: an admin may set anyone's (a reset, for a forgotten one); anyone else only
 * their own, and must give the current one, which counts as a guess. Other sessions end.
 */
export async function setPassphrase(ctx: StoreContext, id: number, body: unknown, by: Actor, source: string): Promise<void> {
  const own = id === by.id;
  const target = await getUser(ctx.sql, id);
  let fields: { passphrase: string; current?: string };
  if (own && by.role !== "admin") fields = parseFields(changeFields, body);
  else if (own) fields = parseFields(resetFields.extend({ current: offeredPassphraseField.optional() }), body);
  else {
    await requireAdmin(ctx.sql, by, "reset another person's passphrase");
    fields = parseFields(resetFields, body);
  }
  const weak = weakPassphrase(fields.passphrase, [target.name]);
  if (weak) throw new InvalidRecordError([{ path: "passphrase", message: weak }]);
  if (own && by.role !== "admin") await provePassphrase(ctx, by, fields.current ?? "", source, "current");
  const stored = await hashPassphrase(fields.passphrase, ctx.passphraseCost);
  const at = isoNow(ctx);
  await ctx.sql.write(async (q) => {
    await q.run(
      "UPDATE users SET salt = ?, hash = ?, scrypt_n = ?, scrypt_r = ?, scrypt_p = ? WHERE id = ?",
      stored.salt,
      stored.hash,
      stored.n,
      stored.r,
      stored.p,
      id,
    );
    if (!own) await q.run("DELETE FROM sessions WHERE user_id = ?", id);
    await logPeopleEvent(q, {
      at,
      kind: own ? "passphrase-changed" : "passphrase-reset",
      userId: id,
      actorId: by.id,
      source,
      detail: null,
    });
  });
}

/** An admin lifts the guessing delay on an account; logged. */
export async function clearDelay(ctx: StoreContext, id: number, by: Actor): Promise<boolean> {
  await requireAdmin(ctx.sql, by, "clear a guessing delay");
  const user = await getUser(ctx.sql, id);
  return ctx.sql.write(async (q) => {
    const had = await clearAccount(q, nameKey(user.name));
    await logPeopleEvent(q, {
      at: isoNow(ctx),
      kind: "delay-cleared",
      userId: id,
      actorId: by.id,
      source: null,
      detail: { hadDelay: had },
    });
    return had;
  });
}

interface StoredUser extends PassphraseHash, Actor {
  disabled: number;
}

const STORED_SELECT = "SELECT id, name, role, disabled, salt, hash, scrypt_n AS n, scrypt_r AS r, scrypt_p AS p FROM users";

let decoy: Promise<PassphraseHash> | undefined;
let decoyCost: ScryptCost | undefined;

/** A hash no passphrase is known for, checked when a name is unknown, so that costs the same time. */
function decoyHash(cost: ScryptCost): Promise<PassphraseHash> {
  if (!decoy || decoyCost !== cost) {
    decoyCost = cost;
    decoy = hashPassphrase(`no one ${Math.random()}`, cost);
  }
  return decoy;
}

/**
 * Who a name and passphrase belong to. The attempt is counted first (attempts.ts); an unknown
 * name, a disabled account and a wrong passphrase all take one scrypt check and get one answer.
 */
export async function authenticate(ctx: StoreContext, name: string, passphrase: string, source: string): Promise<Actor> {
  const key = nameKey(name);
  const subjects = subjectsFor(key, source);
  await countAttempt(ctx.sql, subjects, ctx.now().getTime());
  const row = await ctx.sql.get<StoredUser>(`${STORED_SELECT} WHERE name_key = ?`, key);
  const against = row ?? (await decoyHash(ctx.passphraseCost ?? DEFAULT_SCRYPT_COST));
  const matches = await passphraseMatches(passphrase, against);
  if (!row || !matches || row.disabled === 1) {
    await logPeopleEvent(ctx.sql, { at: isoNow(ctx), kind: "sign-in-refused", userId: null, actorId: null, source, detail: null });
    throw new NotSignedInError([{ path: "passphrase", message: "that name and passphrase do not match an enabled account" }]);
  }
  await attemptSucceeded(ctx.sql, subjects);
  return { id: row.id, name: row.name, role: row.role };
}

/** The signed-in user gives their passphrase again (to sign, or to change it). A wrong one counts as a guess. */
export async function provePassphrase(
  ctx: StoreContext,
  by: Actor,
  passphrase: string,
  source: string,
  path = "passphrase",
): Promise<void> {
  const row = await ctx.sql.get<StoredUser>(`${STORED_SELECT} WHERE id = ?`, by.id);
  if (!row || row.disabled === 1) throw new NotSignedInError([{ path: "(session)", message: "this account is disabled; sign in again" }]);
  const subjects = subjectsFor(nameKey(row.name), source);
  await countAttempt(ctx.sql, subjects, ctx.now().getTime());
  if (!(await passphraseMatches(passphrase, row))) {
    throw new WrongPassphraseError([{ path, message: `is not ${row.name}'s passphrase` }]);
  }
  await attemptSucceeded(ctx.sql, subjects);
}

/** A RecordConflictError when someone is already registered under this name or one that looks the same. */
export async function assertNameFree(q: Q, name: string): Promise<void> {
  const taken = await q.get<{ name: string }>("SELECT name FROM users WHERE name_key = ?", nameKey(name));
  if (taken) {
    const same =
      taken.name === name
        ? ""
        : ` as "${taken.name}", which looks the same (names are compared after removing invisible characters and folding look-alike letters)`;
    throw new RecordConflictError([{ path: "name", message: `someone is already registered${same || ` as "${name}"`}` }]);
  }
}
