/**
 * The little the records' code asks of a database, so one body of record rules runs on SQLite
 * (sqlite.ts) and on PostgreSQL (postgres.ts). Statements are written once, in the SQL both
 * understand, with `?` for each parameter (PostgreSQL's `$1, $2…` are put in by its adapter; a
 * statement never holds a literal question mark). Integers come back as numbers, BLOB/BYTEA as
 * Buffers, TEXT as strings on both.
 */
export type Param = string | number | null | Buffer;

/** Statements run one at a time, outside or inside a transaction. */
export interface Q {
  get<T>(sql: string, ...params: Param[]): Promise<T | undefined>;
  all<T>(sql: string, ...params: Param[]): Promise<T[]>;
  /** `changes`: rows inserted, updated or deleted. */
  run(sql: string, ...params: Param[]): Promise<{ changes: number }>;
}

export type Dialect = "sqlite" | "postgres";

export interface Sql extends Q {
  readonly dialect: Dialect;
  /**
   * A write transaction, serialized with every other writer of the database, in this process or
   * another, before its first statement: what `fn` reads is what it writes against (SQLite:
   * BEGIN IMMEDIATE; PostgreSQL: a transaction-level advisory lock). Commits when `fn` resolves,
   * rolls back when it throws. `fn` runs its statements through the `q` it is given, never
   * through this Sql.
   */
  write<T>(fn: (q: Q) => Promise<T>): Promise<T>;
  /** A read-only transaction: every statement in `fn` sees one snapshot, whatever others commit meanwhile. */
  read<T>(fn: (q: Q) => Promise<T>): Promise<T>;
  close(): Promise<void>;
}
