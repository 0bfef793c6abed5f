import { ENGINE_VERSION } from "../engine/version.ts";
import { validateCheckDocument } from "./checkValidator.ts";
import type { StoreContext, Validator } from "./context.ts";
import { defaultDbPath, openDatabase, type Db } from "./db.ts";
import { addRevision, createCheck, type CreatedCheck, type NewCheck, type NewRevision, type SavedRevision } from "./checks.ts";
import { exportCheck, importCheck, type ExchangeDocument, type ImportedCheck } from "./exchange.ts";
import { getCheck, getSheetRevision, listChecks, type CheckRecord, type CheckSummary, type SheetRevision } from "./history.ts";
import { addSigner, listSigners, type NewSigner, type SignerRecord } from "./signers.ts";
import type { ScryptCost } from "./passphrase.ts";
import { signOff, type SignedRevision, type SignOffRequest } from "./signoffs.ts";

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

/** The saved-check records behind one open database. */
export interface Store {
  readonly db: Db;
  createCheck(args: NewCheck): CreatedCheck;
  addRevision(checkId: string, args: NewRevision): SavedRevision;
  listChecks(): CheckSummary[];
  getCheck(checkId: string): CheckRecord;
  getSheetRevision(checkId: string, revision: number): SheetRevision;
  addSigner(args: NewSigner): Promise<SignerRecord>;
  listSigners(): SignerRecord[];
  signOff(checkId: string, request: SignOffRequest): Promise<SignedRevision>;
  exportCheck(checkId: string): ExchangeDocument;
  importCheck(document: unknown): ImportedCheck;
  close(): void;
}

export function openStore(options: StoreOptions = {}): Store {
  const db = openDatabase(options.path ?? defaultDbPath());
  const ctx: StoreContext = {
    db,
    validate: options.validate ?? validateCheckDocument,
    now: options.now ?? (() => new Date()),
    engineVersion: options.engineVersion ?? ENGINE_VERSION,
    passphraseCost: options.passphraseCost,
  };
  return {
    db,
    createCheck: (args) => createCheck(ctx, args),
    addRevision: (checkId, args) => addRevision(ctx, checkId, args),
    listChecks: () => listChecks(db),
    getCheck: (checkId) => getCheck(db, checkId),
    getSheetRevision: (checkId, revision) => getSheetRevision(db, checkId, revision),
    addSigner: (args) => addSigner(ctx, args),
    listSigners: () => listSigners(db),
    signOff: (checkId, request) => signOff(ctx, checkId, request),
    exportCheck: (checkId) => exportCheck(ctx, checkId),
    importCheck: (document) => importCheck(ctx, document),
    close: () => db.close(),
  };
}

export type { Validator } from "./context.ts";
export type { Db } from "./db.ts";
export type { CreatedCheck, NewCheck, NewRevision, SavedRevision } from "./checks.ts";
export type { ExchangeDocument, ImportedCheck } from "./exchange.ts";
export type { CheckRecord, CheckSummary, RevisionRecord, SheetRevision } from "./history.ts";
export type { EventKind, EventRecord } from "./events.ts";
export type { NewSigner, SignerRecord } from "./signers.ts";
export type { SignedRevision, SignOffRecord, SignOffRequest } from "./signoffs.ts";
export type { RevisionState, Role } from "./state.ts";
export type { ScryptCost } from "./passphrase.ts";
export { ROLES } from "./state.ts";
export { MIN_PASSPHRASE_LENGTH } from "./fields.ts";
export { SCHEMA_VERSION } from "./migrations.ts";
export { defaultDbPath, openDatabase } from "./db.ts";
export { EXCHANGE_FORMAT } from "./exchange.ts";
export {
  InvalidRecordError,
  RecordConflictError,
  RecordError,
  RecordNotFoundError,
  SignOffRefusedError,
  WrongPassphraseError,
} from "./errors.ts";
