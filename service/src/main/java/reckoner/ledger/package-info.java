/**
 * The invocation ledger: every call, ok, error or served from the cache, recorded once, durably,
 * and read back by filters and a cursor.
 *
 * <p>{@link reckoner.ledger.Invocation} is the record, {@link reckoner.ledger.InvocationQuery} a
 * read, {@link reckoner.ledger.LedgerStore} the storage (SQLite in the data dir by default,
 * PostgreSQL for replicas that share one ledger), {@link reckoner.ledger.LedgerWriter} the group
 * commit in front of it, and {@link reckoner.ledger.Retention} the background pruning.
 *
 * <p>Design notes: depends on {@code reckoner.tool}, {@code reckoner.call}, JDBC drivers and the
 * connection pool only. It never sees HTTP, Jackson or Micrometer: JSON lines are written here by
 * hand (the format is small and fixed), and the numbers an operator watches are plain getters in
 * {@link reckoner.ledger.LedgerStats} that the wiring binds to metrics. Store failures surface as
 * {@link reckoner.ledger.LedgerUnavailableException}, which the edge maps to {@code 503 unavailable}.
 */
package reckoner.ledger;
