package reckoner.ledger;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.UUID;

/**
 * The SELECT for one {@link InvocationQuery}: every filter a sargable term, so that an index
 * ordered by the id within each value (the table itself, or the indexes on run, tool, outcome and
 * key) serves both the filter and the order, and a page reads only as many index entries as it
 * returns (plus the ones a second filter skips).
 */
record Select(String sql, List<Object> parameters) {
  /** The terms of a {@code ref_prefix} alone, for counting its matches. */
  static Select refRange(String prefix, int limit) {
    List<Object> params = new ArrayList<>();
    params.add(prefix);
    String sql = "SELECT count(*) FROM (SELECT 1 FROM invocations WHERE ref >= ?";
    Optional<String> end = IdBounds.prefixEnd(prefix);
    if (end.isPresent()) {
      sql += " AND ref < ?";
      params.add(end.get());
    }
    params.add(limit);
    return new Select(sql + " LIMIT ?) AS m", List.copyOf(params));
  }

  /** The query's SELECT for {@code store}, in id order, with at most {@code limit} rows ({@code -1}: no limit). */
  static Select of(JdbcLedgerStore store, InvocationQuery q, int limit) {
    return of(store, q, limit, false);
  }

  /**
   * As {@link #of(JdbcLedgerStore, InvocationQuery, int)}; with {@code matchesFirst}, the matching
   * rows are collected before they are ordered ({@code WITH ... AS MATERIALIZED}), so the planner
   * cannot walk the id order instead and filter: for a filter known to match few rows.
   */
  static Select of(JdbcLedgerStore store, InvocationQuery q, int limit, boolean matchesFirst) {
    List<String> terms = new ArrayList<>();
    List<Object> params = new ArrayList<>();
    if (!q.scope().isAll()) {
      terms.add(store.nameTerm(JdbcLedgerStore.Name.KEY));
      params.add(q.scope().keyId());
    }
    if (q.run() != null) {
      terms.add(store.nameTerm(JdbcLedgerStore.Name.RUN));
      params.add(q.run());
      store.runSpanTerms(q.run(), terms, params);
    }
    if (q.tool() != null) {
      terms.add(store.nameTerm(JdbcLedgerStore.Name.TOOL));
      params.add(q.tool());
    }
    if (q.version() != null) {
      terms.add("version = ?");
      params.add(q.version());
    }
    if (q.outcome() != null) {
      if (q.outcome().equals(Invocation.OK)) {
        terms.add("outcome = 'ok'");
      } else if (q.outcome().equals(InvocationQuery.ANY_ERROR)) {
        terms.add("outcome <> 'ok'");
      } else {
        // The second term is the partial index's own condition, so the planner may use it.
        terms.add("outcome = ? AND outcome <> 'ok'");
        params.add(q.outcome());
      }
    }
    if (q.refPrefix() != null) {
      terms.add("ref >= ?");
      params.add(q.refPrefix());
      Optional<String> end = IdBounds.prefixEnd(q.refPrefix());
      if (end.isPresent()) {
        terms.add("ref < ?");
        params.add(end.get());
      }
    }
    if (q.since() != null) {
      Optional<UUID> first = IdBounds.firstIdAtOrAfter(q.since());
      if (first.isPresent()) {
        store.idTerm(JdbcLedgerStore.IdOp.AT_LEAST, first.get(), terms, params);
      } else {
        terms.add("1 = 0"); // no id can be that late
      }
    }
    if (q.until() != null) {
      IdBounds.firstIdAtOrAfter(q.until()).ifPresent(first -> store.idTerm(JdbcLedgerStore.IdOp.BELOW, first, terms, params));
    }
    if (q.after() != null) {
      store.idTerm(JdbcLedgerStore.IdOp.ABOVE, UUID.fromString(q.after()), terms, params);
    }
    StringBuilder sql = new StringBuilder("SELECT ").append(store.selectIdColumns()).append(", ")
        .append(store.selectNameColumns()).append(", ").append(JdbcLedgerStore.FIELDS).append(" FROM invocations");
    if (!terms.isEmpty()) {
      sql.append(" WHERE ").append(String.join(" AND ", terms));
    }
    if (matchesFirst) {
      sql.insert(0, "WITH matches AS MATERIALIZED (").append(") SELECT * FROM matches");
    }
    sql.append(" ORDER BY ").append(store.idOrder());
    if (limit >= 0) {
      sql.append(" LIMIT ").append(limit);
    }
    return new Select(sql.toString(), List.copyOf(params));
  }
}
