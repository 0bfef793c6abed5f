import { ENGINE_VERSION } from "../engine/version.ts";
import { validateCheckDocument } from "./checkValidator.ts";
import type { StoreContext, Validator } from "./context.ts";
import { isoNow } from "./context.ts";
import { defaultDbPath, openDatabase, type Db } from "./db.ts";
import { addRevision, createCheck, type CreatedCheck, type NewCheck, type NewRevision, type SavedRevision } from "./checks.ts";
import { exportCheck, importCheck, type ExchangeDocument, type ImportedCheck } from "./exchange.ts";
import { probeWrite } from "./health.ts";
import { getCheck, getSheetRevision, listChecks, type CheckRecord, type CheckSummary, type SheetRevision } from "./history.ts";
import { openSigningKeys } from "./keys.ts";
import type { ScryptCost } from "./passphrase.ts";
import { listPeopleEvents, type PeopleEvent } from "./peopleLog.ts";
import { signIn, signOut, userForToken, type Session } from "./sessions.ts";
import { signOff, type SignedRevision, type SignOffRequest } from "./signoffs.ts";
import { listTrustedKeys, trustKey, type TrustedKey } from "./trust.ts";
import {
  addUser,
  clearDelay,
  countUsers,
  listUsers,
  setDisabled,
  setPassphrase,
  type Actor,
  type Adder,
  type NewUser,
  type UserRecord,
} from "./users.ts";

export interface StoreOptions {
  /** The database file; defaults to `HOOPWISE_DB` or data/hoopwise.db in the repository. */
  path?: string;
  /** Checks and normalizes a check input; parseCheck's document by default. Tests inject a stand-in. */
  validate?: Validator;
  now?: () => Date;
  /** The engine version new revisions are fingerprinted with; the running engine's by default. */
  engineVersion?: string;
  /**
   * The scrypt cost for new passphrases (default N = 2^15, r = 8, p = 1).
   * Each hash stores its own cost, so a cheaper one, as the tests use, stays verifiable.
   */
  passphraseCost?: ScryptCost;
}

/** The public half of the records' signing key, as GET /api/v1/keys serves it. */
export interface PublicKeyInfo {
  algorithm: "Ed25519";
  fingerprint: string;
  publicKeyPem: string;
}

/**
 * The records, as every face (web, CLI) uses them: a facade with no SQL in sight, so a second
 * backend (PostgreSQL) implements the same interface. `by` is the signed-in user a change is
 * made for; `source` the client's address, which guessing delays are kept against. Every
 * refusal is a RecordError naming its field.
 */
export interface Store {
  /** `by`: the signed-in user who saves; absent for the demo seed and tests of the records alone. */
  createCheck(args: NewCheck, by?: Actor | null): CreatedCheck;
  addRevision(checkId: string, args: NewRevision, by?: Actor | null): SavedRevision;
  listChecks(): CheckSummary[];
  getCheck(checkId: string): CheckRecord;
  getSheetRevision(checkId: string, revision: number): SheetRevision;
  signOff(checkId: string, request: SignOffRequest, by: Actor, source: string): Promise<SignedRevision>;
  exportCheck(checkId: string): ExchangeDocument;
  importCheck(document: unknown, by: Actor): ImportedCheck;

  /** `by` null only while no one is registered: the first user, an admin. */
  addUser(args: NewUser, by: Adder, source?: string): Promise<UserRecord>;
  countUsers(): number;
  listUsers(): UserRecord[];
  setDisabled(userId: number, disabled: boolean, by: Actor): UserRecord;
  setPassphrase(userId: number, body: unknown, by: Actor, source: string): Promise<void>;
  clearDelay(userId: number, by: Actor): boolean;
  listPeopleEvents(): PeopleEvent[];
  signIn(body: unknown, source: string): Promise<Session>;
  userForToken(token: string): Actor | undefined;
  signOut(token: string): void;

  publicKey(): PublicKeyInfo;
  trustKey(body: unknown, by: Actor): TrustedKey;
  listTrustedKeys(): TrustedKey[];

  /** Throws when the records cannot be written now. */
  probeWrite(): void;
  close(): void;
}

/** The SQLite backend, which also hands out its database for tests and the CLI. */
export interface SqliteStore extends Store {
  readonly db: Db;
  /** Where the private signing key is kept; absent for an in-memory database. */
  readonly keyPath?: string;
}

export function openStore(options: StoreOptions = {}): SqliteStore {
  const path = options.path ?? defaultDbPath();
  const db = openDatabase(path);
  let ctx: StoreContext;
  try {
    ctx = {
      db,
      validate: options.validate ?? validateCheckDocument,
      now: options.now ?? (() => new Date()),
      engineVersion: options.engineVersion ?? ENGINE_VERSION,
      passphraseCost: options.passphraseCost,
      keys: openSigningKeys(path),
    };
  } catch (err) {
    db.close();
    throw err;
  }
  return {
    db,
    keyPath: ctx.keys.path,
    createCheck: (args, by) => createCheck(ctx, args, by),
    addRevision: (checkId, args, by) => addRevision(ctx, checkId, args, by),
    listChecks: () => listChecks(ctx),
    getCheck: (checkId) => getCheck(ctx, checkId),
    getSheetRevision: (checkId, revision) => getSheetRevision(ctx, checkId, revision),
    signOff: (checkId, request, by, source) => signOff(ctx, checkId, request, by, source),
    exportCheck: (checkId) => exportCheck(ctx, checkId),
    importCheck: (document, by) => importCheck(ctx, document, by),
    addUser: (args, by, source) => addUser(ctx, args, by, source),
    countUsers: () => countUsers(db),
    listUsers: () => listUsers(db),
    setDisabled: (id, disabled, by) => setDisabled(ctx, id, disabled, by),
    setPassphrase: (id, body, by, source) => setPassphrase(ctx, id, body, by, source),
    clearDelay: (id, by) => clearDelay(ctx, id, by),
    listPeopleEvents: () => listPeopleEvents(db),
    signIn: (body, source) => signIn(ctx, body, source),
    userForToken: (token) => userForToken(ctx, token),
    signOut: (token) => signOut(ctx, token),
    publicKey: () => ({ algorithm: "Ed25519", fingerprint: ctx.keys.fingerprint, publicKeyPem: ctx.keys.publicKeyPem }),
    trustKey: (body, by) => trustKey(ctx, body, by),
    listTrustedKeys: () => listTrustedKeys(ctx),
    probeWrite: () => probeWrite(db, isoNow(ctx)),
    close: () => db.close(),
  };
}

export type { Validator } from "./context.ts";
export type { Db } from "./db.ts";
export type { CreatedCheck, NewCheck, NewRevision, SavedRevision } from "./checks.ts";
export type { ExchangeDocument, ImportedCheck } from "./exchange.ts";
export type { CheckRecord, CheckSummary, RevisionRecord, SheetRevision } from "./history.ts";
export type { EventKind, EventRecord } from "./events.ts";
export type { SignedRevision, SignOffRecord, SignOffRequest } from "./signoffs.ts";
export type { RevisionState, Role } from "./state.ts";
export type { ScryptCost } from "./passphrase.ts";
export type { Actor, Adder, NewUser, UserRecord, UserRole } from "./users.ts";
export type { Session } from "./sessions.ts";
export type { TrustedKey } from "./trust.ts";
export type { PeopleEvent } from "./peopleLog.ts";
export { USER_ROLES } from "./users.ts";
export { ROLES } from "./state.ts";
export { MIN_PASSPHRASE_LENGTH } from "./fields.ts";
export { SCHEMA_VERSION } from "./migrations.ts";
export { defaultDbPath, openDatabase } from "./db.ts";
export { keyPathFor } from "./keys.ts";
export { EXCHANGE_FORMAT, MAX_IMPORT_BYTES, MAX_IMPORT_EVENTS, MAX_IMPORT_REVISIONS } from "./exchange.ts";
export { isStorageFault, storageFaultWords } from "./health.ts";
export { SESSION_HOURS } from "./sessions.ts";
export {
  InvalidRecordError,
  NotAllowedError,
  NotSignedInError,
  RecordConflictError,
  RecordError,
  RecordNotFoundError,
  RecordsUnavailableError,
  SignOffRefusedError,
  SlowDownError,
  WrongPassphraseError,
} from "./errors.ts";
