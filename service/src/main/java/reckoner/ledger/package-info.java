/**
 * The invocation ledger: every call, ok, error or served from the cache, recorded once, durably,
 * and read back by filters and a cursor.
 *
 * <p>{@link reckoner.ledger.Invocation} is the record, {@link reckoner.ledger.InvocationQuery} a
 * read, {@link reckoner.ledger.LedgerStore} the storage (SQLite in the data dir by default,
 * PostgreSQL for replicas that share one ledger), {@link reckoner.ledger.LedgerWriter} the group
 * commit in front of it, and {@link reckoner.ledger.Retention} the background pruning.
 *
 * <p>Wiring, in outline:
 * <pre>{@code
 * LedgerStore store = LedgerStore.sqlite(dataDir);          // or LedgerStore.postgres(url, user, password, 8)
 * LedgerWriter writer = LedgerWriter.start(store, LedgerWriter.Settings.defaults(),
 *     (records, nanos) -> { batchSizes.record(records); commitTimer.record(nanos, NANOSECONDS); });
 * Retention retention = Retention.start(store, new Retention.Policy(Duration.ofDays(30), 0), clock, Duration.ofMinutes(1));
 *
 * Invocation record = Invocation.of(request, outcome, keyId, cached);
 * writer.commit(record, Duration.ofSeconds(10));   // commit mode; LedgerUnavailableException -> 503
 * if (!writer.offer(record)) { ... }               // async mode; false -> 503, Retry-After writer.retryAfter()
 * boolean ready = writer.isHealthy();
 *
 * InvocationQuery query = InvocationQuery.fromParameters(scope, ctx.queryParamMap()); // ToolException -> 400
 * String body = store.query(query).toJson();       // GET /v1/invocations
 * store.exportNdjson(query, responseWriter);       // GET /v1/invocations/export
 *
 * retention.close(); writer.close(); store.close(); // at shutdown, in this order: close() drains the queue
 * }</pre>
 *
 * <p>Design notes: depends on {@code reckoner.tool}, {@code reckoner.call}, JDBC drivers and the
 * connection pool only. It never sees HTTP, Jackson or Micrometer: JSON lines are written here by
 * hand (the format is small and fixed), and the numbers an operator watches are plain getters in
 * {@link reckoner.ledger.LedgerStats} that the wiring binds to metrics. Store failures surface as
 * {@link reckoner.ledger.LedgerUnavailableException}, which the edge maps to {@code 503 unavailable}.
 */
package reckoner.ledger;
