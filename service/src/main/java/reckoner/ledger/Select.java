package reckoner.ledger;

import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.UUID;

/**
 * The SELECT for one {@link InvocationQuery}: every filter a sargable term, so that an index whose
 * last column is the id (the primary key, or {@code (run, id)}, {@code (tool, id)},
 * {@code (outcome, id)}, {@code (key_id, id)}) serves both the filter and the order, and a page
 * reads only as many index entries as it returns (plus the ones a second filter skips).
 */
record Select(String sql, List<Object> parameters) {

  /** The query's SELECT, in id order, with at most {@code limit} rows ({@code -1}: no limit). */
  static Select of(InvocationQuery q, int limit) {
    List<String> terms = new ArrayList<>();
    List<Object> params = new ArrayList<>();
    if (!q.scope().isAll()) {
      terms.add("key_id = ?");
      params.add(q.scope().keyId());
    }
    if (q.run() != null) {
      terms.add("run = ?");
      params.add(q.run());
    }
    if (q.tool() != null) {
      terms.add("tool = ?");
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
        terms.add("id >= ?");
        params.add(first.get());
      } else {
        terms.add("1 = 0"); // no id can be that late
      }
    }
    if (q.until() != null) {
      IdBounds.firstIdAtOrAfter(q.until()).ifPresent(first -> {
        terms.add("id < ?");
        params.add(first);
      });
    }
    if (q.after() != null) {
      terms.add("id > ?");
      params.add(UUID.fromString(q.after()));
    }
    StringBuilder sql = new StringBuilder("SELECT ").append(JdbcLedgerStore.COLUMNS).append(" FROM invocations");
    if (!terms.isEmpty()) {
      sql.append(" WHERE ").append(String.join(" AND ", terms));
    }
    sql.append(" ORDER BY id");
    if (limit >= 0) {
      sql.append(" LIMIT ").append(limit);
    }
    return new Select(sql.toString(), List.copyOf(params));
  }

  void bind(JdbcLedgerStore store, PreparedStatement ps) throws SQLException {
    for (int i = 0; i < parameters.size(); i++) {
      Object p = parameters.get(i);
      if (p instanceof UUID id) {
        store.bindId(ps, i + 1, id);
      } else if (p instanceof Integer n) {
        ps.setInt(i + 1, n);
      } else {
        ps.setString(i + 1, (String) p);
      }
    }
  }
}
